import { z } from 'zod';
import { errorBodySchema } from '../api-error';
import { designSchema } from '../design';
import { notebookWithVersionResponseSchema } from './designs';
import { notesSchema, versionMessageSchema } from './fields';
import { versionNumberSchema } from './version-number';
import { versionSchema } from './versions';

/** `POST /api/designs/:id/versions`: saves version latest+1, only if `baseVersion` is the latest. */
export const saveVersionRequestSchema = z.object({
  baseVersion: versionNumberSchema,
  params: designSchema,
  notes: notesSchema.default(''),
  message: versionMessageSchema,
});
export type SaveVersionRequest = z.input<typeof saveVersionRequestSchema>;
export const saveVersionResponseSchema = notebookWithVersionResponseSchema;

/**
 * The 409 of a save on a stale base: still the one error shape, with the latest version in
 * `error.details` so the client can show both and offer to rebase without asking again.
 */
export const versionConflictCode = 'version_conflict';
export const versionConflictDetailsSchema = z.object({ latest: versionSchema });
export type VersionConflictDetails = z.infer<typeof versionConflictDetailsSchema>;
export const versionConflictBodySchema = z.object({
  error: errorBodySchema.shape.error.extend({
    code: z.literal(versionConflictCode),
    details: versionConflictDetailsSchema,
  }),
});
export type VersionConflictBody = z.infer<typeof versionConflictBodySchema>;
