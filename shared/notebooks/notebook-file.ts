import { z } from 'zod';
import { storedDesignSchema } from '../design';
import { notebookWithVersionResponseSchema } from './designs';
import { designTitleSchema, notesSchema, tagsSchema, versionMessageSchema } from './fields';
import { versionNumberSchema } from './version-number';

export const notebookFileKind = 'blazebook-notebook';
export const notebookFormatVersion = 1;
export const maxFileVersions = 1000;

/** Unknown keys in a file are named, so a typo surfaces instead of being dropped. */
const unknownFields = {
  error: (issue: { code?: string; keys?: string[]; input?: unknown }) =>
    issue.code === 'unrecognized_keys'
      ? `has an unknown field ${(issue.keys ?? []).map((key) => `'${key}'`).join(', ')} (check the spelling)`
      : issue.input === undefined
        ? 'is required'
        : 'must be an object',
};

export const notebookFileVersionSchema = z.strictObject(
  {
    number: versionNumberSchema,
    message: versionMessageSchema,
    notes: notesSchema.default(''),
    params: storedDesignSchema,
    /** Null for version 1; otherwise an earlier version of this file. */
    parentNumber: versionNumberSchema.nullable().default(null),
    createdAt: z.iso.datetime({ error: 'must be a date and time such as 2026-03-14T09:00:00Z' }),
    /** The author's display name when exported; informative only (import records the importer). */
    authorName: z.string().max(200).nullable().default(null),
  },
  unknownFields,
);
export type NotebookFileVersion = z.infer<typeof notebookFileVersionSchema>;

/**
 * Our own JSON file for one notebook, documented in DEVELOPERS.md. Summaries are not part of it:
 * the importing server recomputes them with its solver. Version numbers must run 1, 2, … n in
 * order, every parent must be an earlier version, and the baseline must be one of them.
 */
export const notebookFileSchema = z
  .strictObject(
    {
      kind: z.literal(notebookFileKind, { error: `must be "${notebookFileKind}"` }),
      formatVersion: z.literal(notebookFormatVersion, {
        error: `must be ${notebookFormatVersion} (the only format this version reads)`,
      }),
      exportedAt: z.iso.datetime().optional(),
      title: designTitleSchema,
      tags: tagsSchema.default([]),
      baselineVersion: versionNumberSchema.nullable().default(null),
      clonedFrom: z
        .strictObject({ title: z.string().max(200), version: versionNumberSchema }, unknownFields)
        .nullable()
        .default(null),
      versions: z
        .array(notebookFileVersionSchema, { error: 'must be a list of versions' })
        .min(1, { error: 'must hold at least one version' })
        .max(maxFileVersions, { error: `must hold at most ${maxFileVersions} versions` }),
    },
    unknownFields,
  )
  // Runs even when other fields failed, so one upload reports every problem at once; it reads
  // the raw values defensively because they may be the very ones that failed.
  .superRefine(
    (file, ctx) => {
      const versions: unknown[] = Array.isArray(file.versions) ? file.versions : [];
      versions.forEach((raw, index) => {
        if (typeof raw !== 'object' || raw === null) return;
        const { number, parentNumber } = raw as { number?: unknown; parentNumber?: unknown };
        if (number !== index + 1) {
          ctx.addIssue({
            code: 'custom',
            path: ['versions', index, 'number'],
            message: `must be ${index + 1} (versions run 1, 2, … in order)`,
          });
        }
        if (typeof parentNumber === 'number' && parentNumber >= index + 1) {
          ctx.addIssue({
            code: 'custom',
            path: ['versions', index, 'parentNumber'],
            message: 'must be an earlier version',
          });
        }
        if (index > 0 && (parentNumber === null || parentNumber === undefined)) {
          ctx.addIssue({
            code: 'custom',
            path: ['versions', index, 'parentNumber'],
            message: 'is required after version 1',
          });
        }
      });
      if (typeof file.baselineVersion === 'number' && file.baselineVersion > versions.length) {
        ctx.addIssue({
          code: 'custom',
          path: ['baselineVersion'],
          message: 'must be one of the versions in the file',
        });
      }
    },
    { when: (payload) => typeof payload.value === 'object' && payload.value !== null },
  );
export type NotebookFile = z.infer<typeof notebookFileSchema>;
export type NotebookFileInput = z.input<typeof notebookFileSchema>;

/** `POST /api/teams/:teamId/designs/import` takes a notebook file as its body. */
export const importRequestSchema = notebookFileSchema;
export const importResponseSchema = notebookWithVersionResponseSchema;
