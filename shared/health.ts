import { z } from 'zod';

export const healthSchema = z.object({
  status: z.enum(['ok', 'degraded']),
  version: z.string(),
  database: z.object({ ok: z.boolean(), latencyMs: z.number().nonnegative() }),
  time: z.iso.datetime(),
});
export type Health = z.infer<typeof healthSchema>;
