import { z } from 'zod';
import { designSchema } from '../design';
import { reviewStateSchema } from '../reviews';
import { roleSchema } from '../teams';
import { designTitleSchema, notesSchema, personSchema, tagsSchema, versionMessageSchema } from './fields';
import { versionSchema } from './versions';

/** Where a clone came from: shown as "from <title> v<version>". The title is kept as it was then. */
export const provenanceSchema = z.object({
  /** Null when the source design was deleted, or is in a team the caller cannot see. */
  designId: z.string().nullable(),
  title: z.string(),
  version: z.number().int().positive(),
});
export type Provenance = z.infer<typeof provenanceSchema>;

export const notebookSchema = z.object({
  id: z.string(),
  teamId: z.string(),
  title: z.string(),
  tags: z.array(z.string()),
  archived: z.boolean(),
  createdBy: personSchema.nullable(),
  createdAt: z.iso.datetime(),
  updatedAt: z.iso.datetime(),
  latestVersion: z.number().int().positive(),
  /** The version an owner marked as the team's starting point; null when none. */
  baselineVersion: z.number().int().positive().nullable(),
  clonedFrom: provenanceSchema.nullable(),
  /**
   * When the design was made by importing a notebook file (shown as "Imported from a file on
   * <date>"); null for one made here or cloned. Not written into exported files.
   */
  importedAt: z.iso.datetime().nullable(),
  /** The review state of the latest version (a decision never moves to a new version). */
  latestReviewState: reviewStateSchema,
  /** The caller's role in the design's team (the client hides buttons with `can`). */
  role: roleSchema,
});
export type Notebook = z.infer<typeof notebookSchema>;

export const createDesignRequestSchema = z.object({
  title: designTitleSchema,
  tags: tagsSchema.default([]),
  params: designSchema,
  notes: notesSchema.default(''),
  message: versionMessageSchema.default('First version'),
});
export type CreateDesignRequest = z.input<typeof createDesignRequestSchema>;

/** A design with one of its versions: what create, save, clone and import answer. */
export const notebookWithVersionResponseSchema = z.object({ design: notebookSchema, version: versionSchema });
export type NotebookWithVersionResponse = z.infer<typeof notebookWithVersionResponseSchema>;

/** `GET /api/designs/:id`: the design and its latest version. */
export const notebookResponseSchema = notebookWithVersionResponseSchema;

export const updateDesignRequestSchema = z
  .object({
    title: designTitleSchema.optional(),
    tags: tagsSchema.optional(),
    archived: z.boolean({ error: 'must be true or false' }).optional(),
  })
  .refine((body) => body.title !== undefined || body.tags !== undefined || body.archived !== undefined, {
    error: 'must change title, tags or archived',
  });
export type UpdateDesignRequest = z.input<typeof updateDesignRequestSchema>;
export const designResponseSchema = z.object({ design: notebookSchema });
