import type { Database } from '../../db/client';
import type { Clock } from '../clock';
import type { Mailer } from '../mail/mailer';
import { createInboxRepository } from './repository';
import { inboxRouter } from './router';
import { createInboxService } from './service';

export type { InboxService } from './service';

/**
 * The inbox: `notifier` is what the review service tells after each write (who is concerned, one
 * item and at most one e-mail each); `router` serves `apiContract.inbox`. `log` receives a failed
 * notification, which never undoes the write that caused it.
 */
export function createInbox(deps: { db: Database; mailer: Mailer; clock: Clock; publicUrl: () => string; log?: (error: unknown) => void }) {
  const service = createInboxService({
    repository: createInboxRepository(deps.db),
    mailer: deps.mailer,
    clock: deps.clock,
    publicUrl: deps.publicUrl,
    log: deps.log ?? ((error) => console.error('Review notification failed:', error)),
  });
  return { notifier: service.notifier, router: inboxRouter(service), service };
}
