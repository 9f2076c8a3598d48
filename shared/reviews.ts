import { z } from 'zod';
import { describedFieldByPath, fieldLabel } from './design-fields';
import { idText, versionParamsSchema } from './notebooks/params';
import { personSchema } from './notebooks/fields';
import { versionNumberSchema } from './notebooks/version-number';

/**
 * Design review, in engineering design-review words of our own:
 * - a **remark** is one message; remarks form a **thread** pinned to what it is about (a design
 *   field, a result at a wavelength, a spot on the sketch or a plot, or the version as a whole);
 *   a thread stays open until someone resolves it, and follows the design to its next versions;
 * - an owner sends a **review request** for a version to named reviewers;
 * - a reviewer records a **decision** on that version: signed off, signed off with remarks, or
 *   revise. The author of a version never decides on it.
 * Owners and reviewers write, resolve and decide (`designs.comment`, `designs.review`); viewers
 * read; share-link visitors see nothing of it.
 */

// ——— pins ———

/** Results a remark can be pinned to, at one wavelength (the read-out's figures). */
export const pinnedResults = [
  'bandpass',
  'reciprocal-dispersion',
  'resolving-power',
  'efficiency',
  'grating-rotation',
  'free-spectral-range',
  'overlaps',
] as const;
export const pinnedResultSchema = z.enum(pinnedResults, {
  error: `must be one of ${pinnedResults.join(', ')}`,
});
export type PinnedResult = z.infer<typeof pinnedResultSchema>;
export const pinnedResultLabels: Record<PinnedResult, string> = {
  bandpass: 'Bandpass',
  'reciprocal-dispersion': 'Reciprocal linear dispersion',
  'resolving-power': 'Resolving power',
  efficiency: 'Blaze efficiency',
  'grating-rotation': 'Grating rotation',
  'free-spectral-range': 'Free spectral range',
  overlaps: 'Overlapping orders',
};

/** Figures whose regions a remark can be pinned to; `x`, `y` are fractions of the figure's box. */
export const pinnedFigures = ['sketch', 'dispersion', 'bandpass', 'efficiency', 'rotation'] as const;
export const pinnedFigureSchema = z.enum(pinnedFigures, { error: `must be one of ${pinnedFigures.join(', ')}` });
export type PinnedFigure = z.infer<typeof pinnedFigureSchema>;
export const pinnedFigureLabels: Record<PinnedFigure, string> = {
  sketch: 'Sketch',
  dispersion: 'Dispersion plot',
  bandpass: 'Bandpass plot',
  efficiency: 'Efficiency plot',
  rotation: 'Rotation plot',
};

const fraction = z
  .number({ error: 'must be a number from 0 to 1' })
  .min(0, { error: 'must be at least 0' })
  .max(1, { error: 'must be at most 1' });

export const pinSchema = z.discriminatedUnion(
  'kind',
  [
    z.strictObject({ kind: z.literal('version') }),
    z.strictObject({
      kind: z.literal('field'),
      /** A design field's dotted path, e.g. `slits.exitWidthUm` (see shared/design-fields.ts). */
      path: z.string().refine((path) => describedFieldByPath.has(path), { error: 'must name a design field such as slits.exitWidthUm' }),
    }),
    z.strictObject({
      kind: z.literal('result'),
      result: pinnedResultSchema,
      wavelengthNm: z
        .number({ error: 'must be a number of nanometres' })
        .gt(0, { error: 'must be more than 0 nm' })
        .max(100_000, { error: 'must be at most 100000 nm' }),
    }),
    z.strictObject({ kind: z.literal('region'), figure: pinnedFigureSchema, x: fraction, y: fraction }),
  ],
  { error: 'must be a pin of kind version, field, result or region' },
);
export type Pin = z.infer<typeof pinSchema>;

/** "Exit slit width", "Bandpass at 500 nm", "Sketch", "The whole version". */
export function pinLabel(pin: Pin): string {
  switch (pin.kind) {
    case 'version':
      return 'The whole version';
    case 'field':
      return fieldLabel(pin.path);
    case 'result':
      return `${pinnedResultLabels[pin.result]} at ${pin.wavelengthNm} nm`;
    case 'region':
      return pinnedFigureLabels[pin.figure];
  }
}

// ——— remarks and threads ———

export const remarkBodyMaxLength = 10_000;
export const remarkBodySchema = z
  .string({ error: 'is required' })
  .trim()
  .min(1, { error: 'is required' })
  .max(remarkBodyMaxLength, { error: `must be at most ${remarkBodyMaxLength.toLocaleString('en-GB')} characters` });

export const maxMentions = 20;
/** Team members named with `@` in the body; each must be a member of the design's team. */
export const mentionsSchema = z
  .array(idText, { error: 'must be a list of member ids' })
  .max(maxMentions, { error: `must name at most ${maxMentions} people` })
  .default([]);

export const startThreadRequestSchema = z.strictObject({
  pin: pinSchema,
  body: remarkBodySchema,
  mentions: mentionsSchema,
});
export type StartThreadRequest = z.input<typeof startThreadRequestSchema>;

export const replyRequestSchema = z.strictObject({ body: remarkBodySchema, mentions: mentionsSchema });
export type ReplyRequest = z.input<typeof replyRequestSchema>;

/** Editing keeps the earlier text (shown as "edited"). */
export const editRemarkRequestSchema = z.strictObject({ body: remarkBodySchema, mentions: mentionsSchema });
export type EditRemarkRequest = z.input<typeof editRemarkRequestSchema>;

export const threadStatuses = ['open', 'resolved'] as const;
export const threadStatusSchema = z.enum(threadStatuses, { error: 'must be open or resolved' });
export type ThreadStatus = z.infer<typeof threadStatusSchema>;
export const setThreadStatusRequestSchema = z.strictObject({ status: threadStatusSchema });

export const remarkSchema = z.object({
  id: z.string(),
  /** Null when the account was deleted; `authorName` then still says who (or an imported name). */
  author: personSchema.nullable(),
  authorName: z.string(),
  /** Null once removed: the thread shows that a remark was removed. */
  body: z.string().nullable(),
  mentions: z.array(personSchema),
  createdAt: z.iso.datetime(),
  editedAt: z.iso.datetime().nullable(),
  /** Earlier texts of an edited remark, oldest first. */
  earlierBodies: z.array(z.object({ body: z.string(), replacedAt: z.iso.datetime() })),
  removedAt: z.iso.datetime().nullable(),
});
export type Remark = z.infer<typeof remarkSchema>;

/**
 * How a thread of an earlier version reads on the version being looked at:
 * - `here`: it was started on this version;
 * - `still-applies`: its field is unchanged (or, for other pins, no design field changed);
 * - `field-changed`: its field changed since the thread's version (`was` → `now`);
 * - `design-changed`: a result, region or version-wide thread whose design changed in `paths`.
 */
export const carrySchema = z.discriminatedUnion('state', [
  z.object({ state: z.literal('here') }),
  z.object({ state: z.literal('still-applies'), since: versionNumberSchema }),
  z.object({ state: z.literal('field-changed'), since: versionNumberSchema, was: z.unknown(), now: z.unknown() }),
  z.object({ state: z.literal('design-changed'), since: versionNumberSchema, paths: z.array(z.string()) }),
]);
export type Carry = z.infer<typeof carrySchema>;

export const threadSchema = z.object({
  id: z.string(),
  designId: z.string(),
  /** The version the thread was started on. */
  version: versionNumberSchema,
  pin: pinSchema,
  /** The pinned field's value on the thread's version (field pins only). */
  pinnedValue: z.unknown().optional(),
  status: threadStatusSchema,
  /** Who resolved it and when; null while open (a reopen clears them and keeps the event below). */
  resolvedBy: personSchema.nullable(),
  resolvedAt: z.iso.datetime().nullable(),
  /** Every resolve and reopen, oldest first. */
  statusEvents: z.array(z.object({ status: threadStatusSchema, by: personSchema.nullable(), at: z.iso.datetime() })),
  remarks: z.array(remarkSchema),
  carry: carrySchema,
});
export type Thread = z.infer<typeof threadSchema>;

// ——— requests and decisions ———

export const decisionOutcomes = ['signed-off', 'signed-off-with-remarks', 'revise'] as const;
export const decisionOutcomeSchema = z.enum(decisionOutcomes, {
  error: 'must be signed-off, signed-off-with-remarks or revise',
});
export type DecisionOutcome = z.infer<typeof decisionOutcomeSchema>;
export const decisionOutcomeLabels: Record<DecisionOutcome, string> = {
  'signed-off': 'Signed off',
  'signed-off-with-remarks': 'Signed off with remarks',
  revise: 'Revise',
};

export const decisionSummaryMaxLength = 4000;
export const recordDecisionRequestSchema = z.strictObject({
  outcome: decisionOutcomeSchema,
  summary: z
    .string({ error: 'is required' })
    .trim()
    .min(1, { error: 'is required' })
    .max(decisionSummaryMaxLength, { error: `must be at most ${decisionSummaryMaxLength} characters` }),
});
export type RecordDecisionRequest = z.input<typeof recordDecisionRequestSchema>;

export const decisionSchema = z.object({
  id: z.string(),
  version: versionNumberSchema,
  reviewer: personSchema.nullable(),
  reviewerName: z.string(),
  outcome: decisionOutcomeSchema,
  summary: z.string(),
  createdAt: z.iso.datetime(),
});
export type Decision = z.infer<typeof decisionSchema>;

export const maxReviewers = 10;
const isoDate = z.iso.date({ error: 'must be a date such as 2026-12-24' });
export const requestReviewSchema = z.strictObject({
  reviewerIds: z
    .array(idText, { error: 'must be a list of member ids' })
    .min(1, { error: 'must name at least one reviewer' })
    .max(maxReviewers, { error: `must name at most ${maxReviewers} reviewers` }),
  /** Optional; a calendar date in the team's sense, not a time. */
  dueDate: isoDate.nullable().default(null),
  note: z.string().trim().max(2000, { error: 'must be at most 2000 characters' }).default(''),
});
export type RequestReview = z.input<typeof requestReviewSchema>;

export const reviewRequestSchema = z.object({
  id: z.string(),
  version: versionNumberSchema,
  requestedBy: personSchema.nullable(),
  reviewer: personSchema,
  dueDate: z.string().nullable(),
  note: z.string(),
  createdAt: z.iso.datetime(),
  /** Set once this reviewer recorded a decision on the version. */
  answeredAt: z.iso.datetime().nullable(),
});
export type ReviewRequestItem = z.infer<typeof reviewRequestSchema>;

/**
 * A version's review state, shown in the history and the design list: its latest decision, else
 * `requested` while a request waits, else `unreviewed`.
 */
export const reviewStates = ['unreviewed', 'requested', 'signed-off', 'signed-off-with-remarks', 'revise'] as const;
export const reviewStateSchema = z.enum(reviewStates, {
  error: `must be one of ${reviewStates.join(', ')}`,
});
export type ReviewState = z.infer<typeof reviewStateSchema>;
export const reviewStateLabels: Record<ReviewState, string> = {
  unreviewed: 'Not reviewed',
  requested: 'Review requested',
  ...decisionOutcomeLabels,
};

export const versionReviewStateSchema = z.object({
  version: versionNumberSchema,
  state: reviewStateSchema,
  /** The latest decision's reviewer and time, when there is one. */
  decidedBy: personSchema.nullable(),
  decidedAt: z.iso.datetime().nullable(),
  openThreads: z.number().int().nonnegative(),
});
export type VersionReviewState = z.infer<typeof versionReviewStateSchema>;

// ——— answers ———

/**
 * Everything the review panel of one version shows: its own threads and the open threads of
 * earlier versions (each with its `carry`), its requests and decisions, and its state. The
 * latest earlier sign-off is named so a new version can say what changed since.
 */
export const versionReviewResponseSchema = z.object({
  version: versionNumberSchema,
  /** The version's author: they cannot decide on it. Null when the account was deleted. */
  authorId: z.string().nullable(),
  state: reviewStateSchema,
  threads: z.array(threadSchema),
  requests: z.array(reviewRequestSchema),
  decisions: z.array(decisionSchema),
  earlierSignOff: z
    .object({ decision: decisionSchema, changedPaths: z.array(z.string()) })
    .nullable(),
});
export type VersionReview = z.infer<typeof versionReviewResponseSchema>;

export const threadResponseSchema = z.object({ thread: threadSchema });
export const decisionResponseSchema = z.object({ decision: decisionSchema });
export const reviewRequestListResponseSchema = z.object({ requests: z.array(reviewRequestSchema) });
export const reviewStatesResponseSchema = z.object({ versions: z.array(versionReviewStateSchema) });

export const reviewParamsSchema = versionParamsSchema;
export const threadParamsSchema = z.object({ threadId: idText });
export const remarkParamsSchema = z.object({ remarkId: idText });

// ——— what waits for me ———

export const inboxKinds = ['review-requested', 'mentioned', 'thread-on-my-design', 'remark-on-my-thread', 'decision-on-my-version'] as const;
export const inboxKindSchema = z.enum(inboxKinds);
export type InboxKind = z.infer<typeof inboxKindSchema>;
export const inboxKindLabels: Record<InboxKind, string> = {
  'review-requested': 'Review requested from you',
  mentioned: 'You were mentioned',
  'thread-on-my-design': 'New thread on your design',
  'remark-on-my-thread': 'New remark in your thread',
  'decision-on-my-version': 'Decision on your version',
};

export const inboxItemSchema = z.object({
  id: z.string(),
  kind: inboxKindSchema,
  designId: z.string(),
  designTitle: z.string(),
  version: versionNumberSchema,
  threadId: z.string().nullable(),
  actor: personSchema.nullable(),
  /** One line: the remark's first words, the decision, or the request's due date. */
  excerpt: z.string(),
  createdAt: z.iso.datetime(),
  readAt: z.iso.datetime().nullable(),
});
export type InboxItem = z.infer<typeof inboxItemSchema>;

export const inboxQuerySchema = z.object({
  unread: z.enum(['only', 'all'], { error: 'must be only or all' }).default('all'),
  limit: z.coerce
    .number({ error: 'must be a number' })
    .int({ error: 'must be a whole number' })
    .min(1, { error: 'must be at least 1' })
    .max(100, { error: 'must be at most 100' })
    .default(50),
});
export const inboxResponseSchema = z.object({ items: z.array(inboxItemSchema), unread: z.number().int().nonnegative() });
export const unreadCountResponseSchema = z.object({ unread: z.number().int().nonnegative() });
export const markReadRequestSchema = z.union(
  [
    z.strictObject({ ids: z.array(idText).min(1, { error: 'must name at least one item' }).max(200, { error: 'must name at most 200 items' }) }),
    z.strictObject({ all: z.literal(true) }),
  ],
  { error: 'must be { "ids": [...] } or { "all": true }' },
);
export type MarkReadRequest = z.input<typeof markReadRequestSchema>;

/** Which review e-mails a person gets; all on by default. The inbox keeps every event regardless. */
export const mailSettingsSchema = z.strictObject({
  reviewRequests: z.boolean({ error: 'must be true or false' }),
  mentions: z.boolean({ error: 'must be true or false' }),
  threadsOnMyDesigns: z.boolean({ error: 'must be true or false' }),
  decisionsOnMyVersions: z.boolean({ error: 'must be true or false' }),
});
export type MailSettings = z.infer<typeof mailSettingsSchema>;
export const defaultMailSettings: MailSettings = {
  reviewRequests: true,
  mentions: true,
  threadsOnMyDesigns: true,
  decisionsOnMyVersions: true,
};
export const mailSettingsLabels: Record<keyof MailSettings, string> = {
  reviewRequests: 'When someone asks me to review a version',
  mentions: 'When someone mentions me in a remark',
  threadsOnMyDesigns: 'When someone starts a thread or replies on my versions',
  decisionsOnMyVersions: 'When a reviewer records a decision on my version',
};
export const mailSettingsResponseSchema = z.object({ settings: mailSettingsSchema });
