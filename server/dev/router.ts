import { Router } from 'express';
import type { OutboxMessage } from '../../shared/outbox';
import type { OutboxRepository } from '../mail/outbox-repository';

/**
 * `GET /api/dev/outbox`: what the local fake mailer kept, so sign-up, reset and invitation links
 * can be followed without a mail server. Never mounted when NODE_ENV=production.
 */
export function devRouter(outbox: OutboxRepository) {
  const router = Router();
  router.get('/dev/outbox', async (_req, res, next) => {
    try {
      const messages: OutboxMessage[] = (await outbox.list()).map((m) => ({ ...m, createdAt: m.createdAt.toISOString() }));
      res.set('cache-control', 'no-store').json({ messages });
    } catch (error) {
      next(error);
    }
  });
  return router;
}
