import { z } from 'zod';

/**
 * The one error shape every API failure has. `fields` maps a field path to why it was refused;
 * `details` carries what a particular code needs to be acted on without another request (the
 * latest version of a `version_conflict`), and that code's own schema gives it a shape.
 */
export const errorBodySchema = z.object({
  error: z.object({
    code: z.string(),
    message: z.string(),
    fields: z.record(z.string(), z.string()).optional(),
    details: z.record(z.string(), z.unknown()).optional(),
  }),
});
export type ErrorBody = z.infer<typeof errorBodySchema>;
