import { z } from 'zod';

export const outboxMessageSchema = z.object({
  id: z.number().int(),
  to: z.string(),
  subject: z.string(),
  text: z.string(),
  html: z.string(),
  createdAt: z.iso.datetime(),
});
export type OutboxMessage = z.infer<typeof outboxMessageSchema>;

/** `GET /api/dev/outbox`: newest first. Only in development and tests. */
export const outboxResponseSchema = z.object({ messages: z.array(outboxMessageSchema) });
