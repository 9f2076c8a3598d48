import { z } from 'zod';
import { storedDesignSchema } from '../design';
import {
  decisionOutcomeSchema,
  pinSchema,
  recordDecisionRequestSchema,
  remarkBodySchema,
  threadStatusSchema,
} from '../reviews';
import { notebookWithVersionResponseSchema } from './designs';
import { designTitleSchema, notesSchema, tagsSchema, versionMessageSchema } from './fields';
import { versionNumberSchema } from './version-number';

export const notebookFileKind = 'blazebook-notebook';
/**
 * The format this version writes. Format 2 added the review; format 3 lets a version's params
 * carry the light input (`input`) and measured curves (`curves`). Formats 1 and 2 still read.
 */
export const notebookFormatVersion = 3;
export const readableFormatVersions = [1, 2, 3] as const;
/** Design fields a file must be at least this format to carry (older writers never wrote them). */
const designFieldsSince: Readonly<Record<'input' | 'curves', number>> = { input: 3, curves: 3 };

/** "1, 2 or 3". */
const formatsText = `${readableFormatVersions.slice(0, -1).join(', ')} or ${readableFormatVersions.at(-1)}`;
export const maxFileVersions = 1000;
export const maxFileThreads = 2000;
export const maxFileRemarksPerThread = 500;
export const maxFileEarlierBodies = 500;
export const maxFileStatusEvents = 500;
export const maxFileDecisions = 2000;

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

const fileDateTime = z.iso.datetime({ error: 'must be a date and time such as 2026-03-14T09:00:00Z' });
/** People are named, not identified: an account here means nothing to another installation. */
const fileName = z
  .string({ error: (issue) => (issue.input === undefined ? 'is required' : 'must be a name') })
  .trim()
  .min(1, { error: 'is required' })
  .max(200, { error: 'must be at most 200 characters' });
/** A design field's value (a number or a choice), as the thread's version had it. */
const filePinnedValue = z.union([z.number(), z.string().max(200), z.boolean(), z.null()], {
  error: 'must be a number, text, true, false or null',
});

export const notebookFileRemarkSchema = z
  .strictObject(
    {
      authorName: fileName,
      /** Null once removed: the thread still shows that a remark was there. */
      body: remarkBodySchema.nullable(),
      createdAt: fileDateTime,
      editedAt: fileDateTime.nullable().default(null),
      earlierBodies: z
        .array(z.strictObject({ body: remarkBodySchema, replacedAt: fileDateTime }, unknownFields), {
          error: 'must be a list of earlier texts',
        })
        .max(maxFileEarlierBodies, { error: `must hold at most ${maxFileEarlierBodies} earlier texts` })
        .default([]),
      removedAt: fileDateTime.nullable().default(null),
    },
    unknownFields,
  )
  .superRefine((remark, ctx) => {
    if (remark.body === null && remark.removedAt === null)
      ctx.addIssue({ code: 'custom', path: ['removedAt'], message: 'is required when the body is null (a removed remark)' });
    if (remark.body !== null && remark.removedAt !== null)
      ctx.addIssue({ code: 'custom', path: ['body'], message: 'must be null for a removed remark' });
    // Removing a remark drops its earlier texts too; an edited one says when.
    const earlier = Array.isArray(remark.earlierBodies) ? remark.earlierBodies.length : 0;
    if (earlier > 0 && remark.removedAt)
      ctx.addIssue({ code: 'custom', path: ['earlierBodies'], message: 'must be empty for a removed remark' });
    if (earlier > 0 && !remark.removedAt && remark.editedAt === null)
      ctx.addIssue({ code: 'custom', path: ['editedAt'], message: 'is required when earlier texts are kept' });
  });
export type NotebookFileRemark = z.infer<typeof notebookFileRemarkSchema>;

export const notebookFileThreadSchema = z
  .strictObject(
    {
      /** The version of this file the thread was started on. */
      version: versionNumberSchema,
      pin: pinSchema,
      /** Field pins only: the field's value on that version. Informative: import reads it from the version. */
      pinnedValue: filePinnedValue.optional(),
      status: threadStatusSchema,
      createdByName: fileName,
      createdAt: fileDateTime,
      resolvedByName: fileName.nullable().default(null),
      resolvedAt: fileDateTime.nullable().default(null),
      statusEvents: z
        .array(z.strictObject({ status: threadStatusSchema, byName: fileName, at: fileDateTime }, unknownFields), {
          error: 'must be a list of resolves and reopens',
        })
        .max(maxFileStatusEvents, { error: `must hold at most ${maxFileStatusEvents} events` })
        .default([]),
      remarks: z
        .array(notebookFileRemarkSchema, { error: 'must be a list of remarks' })
        .min(1, { error: 'must hold at least one remark' })
        .max(maxFileRemarksPerThread, { error: `must hold at most ${maxFileRemarksPerThread} remarks` }),
    },
    unknownFields,
  )
  // Like the file's own check below, this may run on an entry with other failed fields.
  .superRefine((thread, ctx) => {
    if (thread.pinnedValue !== undefined && thread.pin?.kind !== 'field')
      ctx.addIssue({ code: 'custom', path: ['pinnedValue'], message: 'is only for threads pinned to a field' });
    if (thread.status === 'resolved' && thread.resolvedAt === null)
      ctx.addIssue({ code: 'custom', path: ['resolvedAt'], message: 'is required for a resolved thread' });
    if (thread.status === 'open' && thread.resolvedAt !== null)
      ctx.addIssue({ code: 'custom', path: ['resolvedAt'], message: 'must be null for an open thread' });
    if (thread.status === 'open' && thread.resolvedByName !== null)
      ctx.addIssue({ code: 'custom', path: ['resolvedByName'], message: 'must be null for an open thread' });
  });
export type NotebookFileThread = z.infer<typeof notebookFileThreadSchema>;

export const notebookFileDecisionSchema = z.strictObject(
  {
    /** The version of this file it was recorded on; a decision never moves to another version. */
    version: versionNumberSchema,
    reviewerName: fileName,
    outcome: decisionOutcomeSchema,
    summary: recordDecisionRequestSchema.shape.summary,
    createdAt: fileDateTime,
  },
  unknownFields,
);
export type NotebookFileDecision = z.infer<typeof notebookFileDecisionSchema>;

/**
 * The design review carried by a file (format 2): threads with their remarks, and decisions.
 * Review requests stay behind (they are addressed to people of one installation), and mentions
 * are not carried as ids: the `@names` stay in the text.
 */
export const notebookFileReviewSchema = z.strictObject(
  {
    threads: z
      .array(notebookFileThreadSchema, { error: 'must be a list of threads' })
      .max(maxFileThreads, { error: `must hold at most ${maxFileThreads} threads` })
      .default([]),
    decisions: z
      .array(notebookFileDecisionSchema, { error: 'must be a list of decisions' })
      .max(maxFileDecisions, { error: `must hold at most ${maxFileDecisions} decisions` })
      .default([]),
  },
  unknownFields,
);
export type NotebookFileReview = z.infer<typeof notebookFileReviewSchema>;

/**
 * Our own JSON file for one notebook, documented in DEVELOPERS.md. Summaries are not part of it:
 * the importing server recomputes them with its solver. Version numbers must run 1, 2, … n in
 * order, every parent must be an earlier version, and the baseline must be one of them, as must
 * every thread's and decision's `version`.
 */
export const notebookFileSchema = z
  .strictObject(
    {
      kind: z.literal(notebookFileKind, { error: `must be "${notebookFileKind}"` }),
      formatVersion: z.literal(readableFormatVersions, {
        error: `must be ${formatsText} (the formats this version reads)`,
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
      /** Format 2 only; a file without it carries no review data. */
      review: notebookFileReviewSchema.optional(),
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
        // A version of an older format carrying the light input or curves was not written by an
        // older Blazebook: refuse it by path, as a format 1 file with a review is.
        const params = (raw as { params?: unknown }).params;
        const format = typeof file.formatVersion === 'number' ? file.formatVersion : notebookFormatVersion;
        if (typeof params === 'object' && params !== null) {
          for (const [field, since] of Object.entries(designFieldsSince)) {
            if (field in params && format < since) {
              ctx.addIssue({
                code: 'custom',
                path: ['versions', index, 'params', field],
                message: `is not part of format ${format} (use formatVersion ${since})`,
              });
            }
          }
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
      if (file.review !== undefined && file.formatVersion === 1) {
        ctx.addIssue({ code: 'custom', path: ['review'], message: 'is not part of format 1 (use formatVersion 2)' });
      }
      const review: unknown = file.review;
      if (typeof review !== 'object' || review === null) return;
      for (const list of ['threads', 'decisions'] as const) {
        const entries: unknown[] = Array.isArray((review as Record<string, unknown>)[list])
          ? ((review as Record<string, unknown>)[list] as unknown[])
          : [];
        entries.forEach((raw, index) => {
          if (typeof raw !== 'object' || raw === null) return;
          const { version } = raw as { version?: unknown };
          if (typeof version === 'number' && Number.isInteger(version) && version > versions.length) {
            ctx.addIssue({
              code: 'custom',
              path: ['review', list, index, 'version'],
              message: 'must be one of the versions in the file',
            });
          }
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
