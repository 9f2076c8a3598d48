import { z } from 'zod';
import { errorBodySchema } from './api-error';
import { designSchema } from './design';
import { roleSchema } from './teams';

/**
 * Design notebooks: a design's life as numbered, immutable versions with notes. Requests,
 * responses and the export file format, shared by the server (which parses requests with them)
 * and the client (which parses responses with them). Later changes are additive only.
 */

// ── building blocks ─────────────────────────────────────────────────────────────────────────

export const designTitleSchema = z
  .string({ error: 'is required' })
  .trim()
  .min(1, { error: 'is required' })
  .max(120, { error: 'must be at most 120 characters' });

/** Tags are short labels, stored trimmed and lower-cased so "UV" and "uv" are one tag. */
export const tagSchema = z
  .string({ error: 'must be text' })
  .trim()
  .toLowerCase()
  .min(1, { error: 'must not be empty' })
  .max(32, { error: 'must be at most 32 characters' });

export const maxTags = 12;
export const tagsSchema = z
  .array(tagSchema, { error: 'must be a list of tags' })
  .max(maxTags, { error: `must have at most ${maxTags} tags` })
  .transform((tags) => [...new Set(tags)]);

/** The one-line change message of a version, like a commit subject. */
export const versionMessageSchema = z
  .string({ error: 'is required' })
  .trim()
  .min(1, { error: 'is required' })
  .max(200, { error: 'must be at most 200 characters' })
  .refine((message) => !/[\r\n]/.test(message), { error: 'must be one line' });

export const maxNotesLength = 50_000;
/** The designer's reasoning, in Markdown. The client renders it safely (no raw HTML). */
export const notesSchema = z
  .string({ error: 'must be text' })
  .max(maxNotesLength, { error: `must be at most ${maxNotesLength} characters` });

/** Version numbers live in PostgreSQL `integer` columns: larger ones are refused, not overflowed. */
export const maxVersionNumber = 2_147_483_647;
// zod's int check also refuses numbers past 2^53, so its message states the range too.
const wholeVersionNumber = `must be a whole number from 1 to ${maxVersionNumber}`;

export const versionNumberSchema = z
  .number({ error: 'must be a version number' })
  .int({ error: wholeVersionNumber })
  .min(1, { error: 'must be at least 1' })
  .max(maxVersionNumber, { error: `must be at most ${maxVersionNumber}` });

/** Version numbers in paths and query strings arrive as text. */
const versionNumberText = z.coerce
  .number({ error: 'must be a version number' })
  .int({ error: wholeVersionNumber })
  .min(1, { error: 'must be at least 1' })
  .max(maxVersionNumber, { error: `must be at most ${maxVersionNumber}` });

export const personSchema = z.object({ id: z.string(), displayName: z.string() });
export type Person = z.infer<typeof personSchema>;

/**
 * Key figures of a version, computed on the server with the solver when the version is saved
 * (so lists and history never run the solver per request). Figures at the centre wavelength
 * `(range.startNm + range.endNm) / 2`; null where the centre is unreachable.
 */
export const versionSummarySchema = z.object({
  rangeStartNm: z.number(),
  rangeEndNm: z.number(),
  centreWavelengthNm: z.number(),
  centreReachable: z.boolean(),
  bandpassAtCentreNm: z.number().nullable(),
  resolvingPowerAtCentre: z.number().nullable(),
  reciprocalDispersionAtCentreNmPerMm: z.number().nullable(),
  /** Collimator focal / (ruled width × cos α) at the centre. */
  fNumber: z.number().nullable(),
  /** Warnings over the default 101-point sweep of the range, as the workbench shows them. */
  warningCount: z.number().int().nonnegative(),
});
export type VersionSummary = z.infer<typeof versionSummarySchema>;

/** A version without its parameters and notes: one row of the history table. */
export const versionHeaderSchema = z.object({
  number: z.number().int().positive(),
  message: z.string(),
  author: personSchema.nullable(),
  createdAt: z.iso.datetime(),
  /** The version this one was saved on top of; null for version 1. */
  parentNumber: z.number().int().positive().nullable(),
  summary: versionSummarySchema,
});
export type VersionHeader = z.infer<typeof versionHeaderSchema>;

export const versionSchema = versionHeaderSchema.extend({
  params: designSchema,
  notes: z.string(),
});
export type Version = z.infer<typeof versionSchema>;

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
  /** The caller's role in the design's team (the client hides buttons with `can`). */
  role: roleSchema,
});
export type Notebook = z.infer<typeof notebookSchema>;

// ── params ──────────────────────────────────────────────────────────────────────────────────

const idText = z.string().min(1).max(64);
export const teamDesignsParamsSchema = z.object({ teamId: idText });
export const designParamsSchema = z.object({ id: idText });
export const versionParamsSchema = designParamsSchema.extend({ n: versionNumberText });
export const shareLinkParamsSchema = designParamsSchema.extend({ linkId: idText });
export const shareTokenParamsSchema = z.object({ token: z.string().min(16).max(128) });

// ── the team's design list ──────────────────────────────────────────────────────────────────

export const designSorts = ['title', 'updated', 'owner'] as const;
export const designSortSchema = z.enum(designSorts, { error: 'must be title, updated or owner' });
export type DesignSort = z.infer<typeof designSortSchema>;

export const maxPageSize = 100;
export const maxPage = 1_000_000;

/**
 * `GET /api/teams/:teamId/designs?q=&tag=&sort=&dir=&page=&pageSize=&archived=`. Designs with a
 * baseline always come first; `sort` orders within each group. `dir` defaults to ascending for
 * title and owner, descending (newest first) for updated.
 */
export const listDesignsQuerySchema = z.object({
  /** Matches anywhere in the title, case-insensitive. */
  q: z.string().trim().max(120, { error: 'must be at most 120 characters' }).optional(),
  tag: tagSchema.optional(),
  sort: designSortSchema.default('updated'),
  dir: z.enum(['asc', 'desc'], { error: 'must be asc or desc' }).optional(),
  page: z.coerce
    .number({ error: 'must be a number' })
    .int({ error: `must be a whole number from 1 to ${maxPage}` })
    .min(1, { error: 'must be at least 1' })
    // Far past any real list, well inside the database's OFFSET range.
    .max(maxPage, { error: `must be at most ${maxPage}` })
    .default(1),
  pageSize: z.coerce
    .number({ error: 'must be a number' })
    .int({ error: 'must be a whole number' })
    .min(1, { error: 'must be at least 1' })
    .max(maxPageSize, { error: `must be at most ${maxPageSize}` })
    .default(20),
  /** `only`: the archived ones; `include`: both; default: the live ones. */
  archived: z
    .enum(['exclude', 'include', 'only'], { error: 'must be exclude, include or only' })
    .default('exclude'),
});
export type ListDesignsQuery = z.input<typeof listDesignsQuerySchema>;

export const designListResponseSchema = z.object({
  designs: z.array(notebookSchema),
  total: z.number().int().nonnegative(),
  page: z.number().int().positive(),
  pageSize: z.number().int().positive(),
  /** Every tag used in the team (for the filter), sorted. */
  tags: z.array(z.string()),
});
export type DesignListResponse = z.infer<typeof designListResponseSchema>;

// ── create, read, rename / tag / archive ────────────────────────────────────────────────────

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

// ── versions ────────────────────────────────────────────────────────────────────────────────

export const versionListResponseSchema = z.object({
  /** Newest first. */
  versions: z.array(versionHeaderSchema),
});
export const versionResponseSchema = z.object({ version: versionSchema });
export type VersionResponse = z.infer<typeof versionResponseSchema>;

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

// ── compare ─────────────────────────────────────────────────────────────────────────────────

/**
 * `GET /api/designs/:id/compare?a=1&b=3`: `a` is "before", `b` is "after". Without `b`, the latest;
 * without `a`, the parent of `b` (itself for version 1).
 */
export const compareQuerySchema = z.object({
  a: versionNumberText.optional(),
  b: versionNumberText.optional(),
});

export const parameterChangeSchema = z.object({
  /** Dotted path into the design, e.g. `slits.exitWidthUm`; a section present in only one side is one entry. */
  path: z.string(),
  /** Undefined values (an optional field absent on one side) are sent as null. */
  before: z.unknown(),
  after: z.unknown(),
});
export type ParameterChange = z.infer<typeof parameterChangeSchema>;

export const figureKeys = [
  'bandpassAtCentreNm',
  'resolvingPowerAtCentre',
  'reciprocalDispersionAtCentreNmPerMm',
  'fNumber',
  'warningCount',
] as const;
export type FigureKey = (typeof figureKeys)[number];

export const figureChangeSchema = z.object({
  key: z.enum(figureKeys),
  before: z.number().nullable(),
  after: z.number().nullable(),
  /** `(after − before) / |before|`: −0.12 reads "−12 %". Null when either is null or before is 0. */
  relativeChange: z.number().nullable(),
});
export type FigureChange = z.infer<typeof figureChangeSchema>;

export const compareResponseSchema = z.object({
  a: versionSchema,
  b: versionSchema,
  changes: z.array(parameterChangeSchema),
  figures: z.array(figureChangeSchema),
});
export type CompareResponse = z.infer<typeof compareResponseSchema>;

// ── clone and baseline ──────────────────────────────────────────────────────────────────────

/** `POST /api/designs/:id/clone`: any member may clone, into a team where they are owner. */
export const cloneRequestSchema = z.object({
  /** Default: the latest version. */
  version: versionNumberSchema.optional(),
  /** Default: the caller's personal workspace. */
  teamId: idText.optional(),
  /** Default: the source's title. */
  title: designTitleSchema.optional(),
});
export type CloneRequest = z.input<typeof cloneRequestSchema>;

/** `PUT /api/designs/:id/baseline`: marks one version as the team's baseline, or clears it with null. */
export const baselineRequestSchema = z.object({ version: versionNumberSchema.nullable() });
export type BaselineRequest = z.input<typeof baselineRequestSchema>;

// ── share links ─────────────────────────────────────────────────────────────────────────────

export const shareLinkSchema = z.object({
  id: z.string(),
  /** Null: the link always shows the latest version. */
  version: z.number().int().positive().nullable(),
  createdBy: personSchema.nullable(),
  createdAt: z.iso.datetime(),
  expiresAt: z.iso.datetime().nullable(),
  revokedAt: z.iso.datetime().nullable(),
  /** Not revoked and not expired, by the server's clock. */
  active: z.boolean(),
});
export type ShareLink = z.infer<typeof shareLinkSchema>;

export const createShareLinkRequestSchema = z.object({
  version: versionNumberSchema.nullable().default(null),
  expiresAt: z.iso
    .datetime({ error: 'must be a date and time such as 2026-06-30T12:00:00Z' })
    .nullable()
    .default(null),
});
export type CreateShareLinkRequest = z.input<typeof createShareLinkRequestSchema>;

/** The token is shown once, at creation: only its hash is stored. */
export const createShareLinkResponseSchema = z.object({
  link: shareLinkSchema,
  token: z.string(),
  /** The web path that opens it, e.g. `/share/<token>`. */
  path: z.string(),
});
export type CreateShareLinkResponse = z.infer<typeof createShareLinkResponseSchema>;
export const shareLinkListResponseSchema = z.object({ links: z.array(shareLinkSchema) });

/** `GET /api/share/:token`, signed out: one version, read-only. No members, no other designs. */
export const sharedVersionResponseSchema = z.object({
  title: z.string(),
  /** True when the link is pinned to this version; false when it follows the latest. */
  pinned: z.boolean(),
  expiresAt: z.iso.datetime().nullable(),
  version: z.object({
    number: z.number().int().positive(),
    message: z.string(),
    createdAt: z.iso.datetime(),
    params: designSchema,
    notes: z.string(),
    summary: versionSummarySchema,
  }),
});
export type SharedVersionResponse = z.infer<typeof sharedVersionResponseSchema>;

// ── the notebook file (export and import) ───────────────────────────────────────────────────

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
    params: designSchema,
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

// ── route paths, for the client's typed API and the access matrix ───────────────────────────

export const notebookPaths = {
  teamDesigns: (teamId: string) => `/api/teams/${encodeURIComponent(teamId)}/designs`,
  importInto: (teamId: string) => `/api/teams/${encodeURIComponent(teamId)}/designs/import`,
  design: (id: string) => `/api/designs/${encodeURIComponent(id)}`,
  versions: (id: string) => `/api/designs/${encodeURIComponent(id)}/versions`,
  version: (id: string, n: number) => `/api/designs/${encodeURIComponent(id)}/versions/${n}`,
  compare: (id: string, a: number, b: number) =>
    `/api/designs/${encodeURIComponent(id)}/compare?a=${a}&b=${b}`,
  clone: (id: string) => `/api/designs/${encodeURIComponent(id)}/clone`,
  baseline: (id: string) => `/api/designs/${encodeURIComponent(id)}/baseline`,
  shareLinks: (id: string) => `/api/designs/${encodeURIComponent(id)}/share-links`,
  shareLink: (id: string, linkId: string) =>
    `/api/designs/${encodeURIComponent(id)}/share-links/${encodeURIComponent(linkId)}`,
  exportFile: (id: string) => `/api/designs/${encodeURIComponent(id)}/export`,
  shared: (token: string) => `/api/share/${encodeURIComponent(token)}`,
} as const;
