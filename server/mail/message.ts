/** An e-mail Blazebook sends: always a plain-text part, and an HTML part for mail clients that show it. */
export type MailMessage = { to: string; subject: string; text: string; html: string };
