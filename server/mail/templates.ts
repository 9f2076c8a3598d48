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

/** Why a review e-mail came, and where to turn that kind off; the inbox keeps the item either way. */
function reviewFooter(reason: string): string {
  return `You get this e-mail because ${reason}. You can turn this kind of e-mail off in your account’s review e-mail settings; your Blazebook inbox keeps the item either way.`;
}

/** The design as e-mails name it: “Teaching monochromator” v2. */
function designName(title: string, version: number): string {
  return `“${title}” v${version}`;
}

export type RemarkMailKind = 'mentioned' | 'thread-on-my-design' | 'remark-on-my-thread';

/**
 * A remark that concerns the reader: a new thread or a reply on their version, a reply in their
 * thread, or a remark that mentions them. `pin` is what the thread is pinned to ("Exit slit
 * width"), null when it is about the whole version; `quote` is the remark as plain text.
 */
export function remarkMessage(
  to: string,
  input: {
    kind: RemarkMailKind;
    name: string;
    actor: string;
    title: string;
    version: number;
    /** True for the first remark of a thread, false for a reply or an edit. */
    startsThread: boolean;
    pin: string | null;
    quote: string;
    link: string;
  },
): MailMessage {
  const design = designName(input.title, input.version);
  // The pin is a label ("Exit slit width"): quoted, it reads as a name mid-sentence.
  const pin = input.pin ? `“${input.pin}”` : null;
  const where = pin ? ` pinned to ${pin}` : '';
  const subject =
    input.kind === 'mentioned'
      ? `${input.actor} mentioned you in a remark on ${design}`
      : input.kind === 'remark-on-my-thread'
        ? `${input.actor} replied to your thread on ${design}`
        : input.startsThread
          ? pin
            ? `${input.actor} pinned a remark to ${pin} on ${design}`
            : `${input.actor} started a thread on ${design}`
          : `${input.actor} replied in a thread on ${design}`;
  const lead =
    input.kind === 'mentioned'
      ? `${input.actor} mentioned you in a remark${where} on version ${input.version} of “${input.title}”:`
      : input.kind === 'remark-on-my-thread'
        ? `${input.actor} replied in the thread you started${where} on version ${input.version} of “${input.title}”:`
        : input.startsThread
          ? `${input.actor} started a thread${where} on your version ${input.version} of “${input.title}”:`
          : `${input.actor} replied in a thread${where} on your version ${input.version} of “${input.title}”:`;
  const reason =
    input.kind === 'mentioned'
      ? 'someone mentioned you in a remark'
      : input.kind === 'remark-on-my-thread'
        ? 'you started this thread'
        : 'you are the author of this version';
  return message(to, subject, {
    greeting: `Hello ${input.name},`,
    body: [lead, `“${input.quote}”`],
    action: 'Open the thread',
    link: input.link,
    footer: reviewFooter(reason),
  });
}

/** An owner asks the reader to review one version. `dueDate` is a calendar date (YYYY-MM-DD) or null. */
export function reviewRequestMessage(
  to: string,
  input: { name: string; actor: string; title: string; version: number; dueDate: string | null; note: string; link: string },
): MailMessage {
  const body = [`${input.actor} asks you to review version ${input.version} of “${input.title}”.`];
  if (input.dueDate) body.push(`Due ${input.dueDate}.`);
  if (input.note) body.push(`Their note: “${input.note}”`);
  body.push('Read the design, pin remarks where something needs a change, and record your decision: sign off, sign off with remarks, or revise.');
  return message(to, `${input.actor} asks you to review ${designName(input.title, input.version)}`, {
    greeting: `Hello ${input.name},`,
    body,
    action: 'Open the review',
    link: input.link,
    footer: reviewFooter('someone asked you for a review'),
  });
}

/** A reviewer recorded a decision on the reader's version. `outcomeLabel` is the shared label ("Signed off with remarks"). */
export function decisionMessage(
  to: string,
  input: {
    name: string;
    actor: string;
    title: string;
    version: number;
    outcome: 'signed-off' | 'signed-off-with-remarks' | 'revise';
    outcomeLabel: string;
    summary: string;
    link: string;
  },
): MailMessage {
  const design = designName(input.title, input.version);
  const subject =
    input.outcome === 'signed-off'
      ? `${input.actor} signed off ${design}`
      : input.outcome === 'signed-off-with-remarks'
        ? `${input.actor} signed off ${design} with remarks`
        : `${input.actor} asks for a revision of ${design}`;
  return message(to, subject, {
    greeting: `Hello ${input.name},`,
    body: [`${input.actor} recorded a decision on your version ${input.version} of “${input.title}”: ${input.outcomeLabel}.`, `“${input.summary}”`],
    action: 'Open the review',
    link: input.link,
    footer: reviewFooter('you are the author of this version'),
  });
}
