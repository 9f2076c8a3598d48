import type { MailMessage } from './message';

/** Escapes text for the HTML part; every value we put in a message passes through it. */
function esc(value: string): string {
  return value.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!);
}

function message(to: string, subject: string, lines: { greeting: string; body: string[]; action: string; link: string; footer: string }): MailMessage {
  const text = [lines.greeting, '', ...lines.body, '', `${lines.action}: ${lines.link}`, '', lines.footer, '', '— Blazebook'].join('\n');
  const html = `<!doctype html><html><body style="font-family:sans-serif;color:#1D2733;line-height:1.5">
<p>${esc(lines.greeting)}</p>
${lines.body.map((line) => `<p>${esc(line)}</p>`).join('\n')}
<p><a href="${esc(lines.link)}" style="background:#1F4E5F;color:#fff;padding:10px 16px;border-radius:8px;text-decoration:none">${esc(lines.action)}</a></p>
<p style="color:#566170;font-size:14px">${esc(lines.footer)}</p>
<p style="color:#566170;font-size:14px">— Blazebook</p>
</body></html>`;
  return { to, subject, text, html };
}

export function verifyEmailMessage(to: string, name: string, link: string): MailMessage {
  return message(to, 'Confirm your e-mail address for Blazebook', {
    greeting: `Hello ${name},`,
    body: ['You created a Blazebook account with this address. Confirm it so your team knows the notebooks are really yours.'],
    action: 'Confirm my address',
    link,
    footer: 'The link works once and for 48 hours. If you did not sign up, ignore this message.',
  });
}

export function passwordResetMessage(to: string, name: string, link: string): MailMessage {
  return message(to, 'Choose a new Blazebook password', {
    greeting: `Hello ${name},`,
    body: ['Someone asked to reset the password of the Blazebook account for this address.'],
    action: 'Choose a new password',
    link,
    footer: 'The link works once and for 30 minutes. If you did not ask, ignore this message: your password stays as it is.',
  });
}

export function invitationMessage(to: string, inviter: string, teamName: string, roleLabel: string, link: string): MailMessage {
  return message(to, `${inviter} invited you to ${teamName} on Blazebook`, {
    greeting: 'Hello,',
    body: [
      `${inviter} invited you to join the team “${teamName}” on Blazebook as ${roleLabel.toLowerCase()}.`,
      'Blazebook keeps the team’s monochromator and spectrograph designs as versioned notebooks. If you have no account yet, the link lets you create one.',
    ],
    action: 'Open the invitation',
    link,
    footer: 'The invitation is valid for 7 days. If you did not expect it, ignore this message.',
  });
}
