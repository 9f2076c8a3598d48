import { randomUUID } from 'node:crypto';
import { reviewThreads } from '../../../db/schema';
import type { Pin } from '../../../shared/reviews';
import { createInbox } from '../../../server/inbox/index';
import { createMemoryMailer, type Mailer } from '../../../server/mail/mailer';
import type { MailMessage } from '../../../server/mail/message';
import { testOrigin } from '../../support/test-app';
import { createNotebook, createNotebookFixture, type Person } from '../notebooks/fixture';

/**
 * A lab team (owner, reviewer, viewer, outsider) with one design, and a second inbox on the same
 * database whose notifier the tests call directly: the inbox's routes in the app read what it
 * writes. `send` can be replaced to make the mailer fail.
 */
export async function createInboxFixture() {
  const fx = await createNotebookFixture();
  const { design } = await createNotebook(fx, 'Teaching monochromator');
  const memory = createMemoryMailer();
  const mailer: Mailer & { fail: boolean } = {
    fail: false,
    async send(message) {
      if (this.fail) throw new Error('SMTP server refused the message');
      await memory.send(message);
    },
  };
  const logged: unknown[] = [];
  const inbox = createInbox({ db: fx.ctx.database.db, mailer, clock: fx.ctx.clock, publicUrl: () => `${testOrigin}/`, log: (e) => logged.push(e) });

  /** A thread row as the review service would write it; the inbox only needs it to exist (and its pin). */
  async function thread(starter: Person, pin: Pin = { kind: 'field', path: 'slits.exitWidthUm' }, version = 1) {
    const id = randomUUID();
    await fx.ctx.database.db.insert(reviewThreads).values({
      id,
      designId: design.id,
      versionNumber: version,
      pin,
      createdBy: starter.user.id,
      createdByName: starter.user.displayName,
      createdAt: fx.ctx.clock.now(),
    });
    return id;
  }

  /** The person's inbox through the API, as the client reads it. */
  async function inboxOf(person: Person, query = '') {
    const res = await person.agent.get(`/api/inbox${query}`).expect(200);
    return res.body as { items: { id: string; kind: string; excerpt: string; threadId: string | null; designTitle: string; actor: { id: string } | null; readAt: string | null }[]; unread: number };
  }

  const mailTo = (person: Person): MailMessage[] => memory.sent.filter((m) => m.to === person.user.email.toLowerCase());
  const actor = (person: Person) => ({ id: person.user.id, displayName: person.user.displayName });

  return { ...fx, design, inbox, mailer, sent: memory.sent, logged, thread, inboxOf, mailTo, actor };
}

export type InboxFixture = Awaited<ReturnType<typeof createInboxFixture>>;
