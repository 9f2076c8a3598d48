/** An e-mail Blazebook sends: always a plain-text part, and an HTML part for mail clients that show it. */
export type MailMessage = { to: string; subject: string; text: string; html: string };

export interface Mailer {
  send(message: MailMessage): Promise<void>;
}

/** Keeps messages in memory: the default in tests, where a test reads `sent` instead of an inbox. */
export function createMemoryMailer(): Mailer & { sent: MailMessage[] } {
  const sent: MailMessage[] = [];
  return {
    sent,
    async send(message) {
      sent.push(message);
    },
  };
}
