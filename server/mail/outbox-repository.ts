import { desc } from 'drizzle-orm';
import type { Database } from '../../db/client';
import { mailOutbox } from '../../db/schema';
import type { Clock } from '../clock';
import type { MailMessage } from './message';

export type OutboxRepository = ReturnType<typeof createOutboxRepository>;

export function createOutboxRepository(db: Database, clock: Clock) {
  return {
    async insert(message: MailMessage) {
      await db.insert(mailOutbox).values({ ...message, createdAt: clock.now() });
    },
    /** Newest first; the id breaks ties when a frozen clock gives messages the same time. */
    list(limit = 100) {
      return db.select().from(mailOutbox).orderBy(desc(mailOutbox.createdAt), desc(mailOutbox.id)).limit(limit);
    },
  };
}
