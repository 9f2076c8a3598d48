import { sql } from 'drizzle-orm';
import {
  boolean,
  customType,
  doublePrecision,
  index,
  integer,
  jsonb,
  pgEnum,
  pgTable,
  primaryKey,
  text,
  timestamp,
  unique,
  uniqueIndex,
  type AnyPgColumn,
} from 'drizzle-orm/pg-core';

/**
 * Table definitions only: importable by tooling and tests without loading a database driver.
 * Column names are camelCase here and snake_case in SQL (`casing: 'snake_case'`).
 */

/** Facts about this installation, such as when demo data was seeded. One row per key. */
/**
 * Request counters for the rate limits, shared by every API process on one PostgreSQL server
 * (server/auth/counter-store.ts). `key` is the limit's name and the client's key; the count starts
 * again once `resets_at` has passed. The embedded database keeps its counters in memory instead.
 */
export const rateLimitCounters = pgTable('rate_limit_counters', {
  key: text().primaryKey(),
  hits: integer().notNull(),
  resetsAt: timestamp({ withTimezone: true }).notNull(),
});

export const appMeta = pgTable('app_meta', {
  key: text().primaryKey(),
  value: text().notNull(),
  updatedAt: timestamp({ withTimezone: true, mode: 'date' }).notNull().defaultNow(),
});

/** Roles in a team, from most to least powerful; what each may do is in `shared/teams.ts`. */
export const teamRole = pgEnum('team_role', ['owner', 'reviewer', 'viewer']);

/**
 * People with an account. `email` is stored lower-cased and unique; `passwordHash` is argon2id.
 * Lucia reads this table through its Drizzle adapter (`server/auth/lucia.ts`).
 */
export const users = pgTable(
  'users',
  {
    id: text().primaryKey(),
    email: text().notNull(),
    displayName: text().notNull(),
    passwordHash: text().notNull(),
    emailVerifiedAt: timestamp({ withTimezone: true, mode: 'date' }),
    createdAt: timestamp({ withTimezone: true, mode: 'date' }).notNull().defaultNow(),
  },
  (t) => [uniqueIndex('users_email_lower_unique').on(sql`lower(${t.email})`)],
);

/** Lucia sessions: the cookie holds `id`; `expiresAt` slides forward while the session is used. */
export const sessions = pgTable(
  'sessions',
  {
    id: text().primaryKey(),
    userId: text()
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    expiresAt: timestamp({ withTimezone: true, mode: 'date' }).notNull(),
  },
  (t) => [index('sessions_user_id_idx').on(t.userId)],
);

/**
 * Single-use links sent by e-mail (verify an address, reset a password). Only the SHA-256 of the
 * token is kept, so a copy of the database cannot be used to take over accounts.
 */
export const authTokens = pgTable(
  'auth_tokens',
  {
    tokenHash: text().primaryKey(),
    userId: text()
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    purpose: text({ enum: ['verify-email', 'reset-password'] }).notNull(),
    expiresAt: timestamp({ withTimezone: true, mode: 'date' }).notNull(),
    createdAt: timestamp({ withTimezone: true, mode: 'date' }).notNull().defaultNow(),
  },
  (t) => [index('auth_tokens_user_id_idx').on(t.userId)],
);

/** A team, or a user's personal workspace (`personal`: a team of one that cannot be shared). */
export const teams = pgTable('teams', {
  id: text().primaryKey(),
  name: text().notNull(),
  personal: boolean().notNull().default(false),
  createdAt: timestamp({ withTimezone: true, mode: 'date' }).notNull().defaultNow(),
});

export const memberships = pgTable(
  'memberships',
  {
    teamId: text()
      .notNull()
      .references(() => teams.id, { onDelete: 'cascade' }),
    userId: text()
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    role: teamRole().notNull(),
    joinedAt: timestamp({ withTimezone: true, mode: 'date' }).notNull().defaultNow(),
  },
  (t) => [primaryKey({ columns: [t.teamId, t.userId] }), index('memberships_user_id_idx').on(t.userId)],
);

/** An e-mailed offer to join a team with a role; the token in the link is stored hashed. */
export const invitations = pgTable(
  'invitations',
  {
    id: text().primaryKey(),
    teamId: text()
      .notNull()
      .references(() => teams.id, { onDelete: 'cascade' }),
    email: text().notNull(),
    role: teamRole().notNull(),
    tokenHash: text().notNull().unique(),
    invitedBy: text().references(() => users.id, { onDelete: 'set null' }),
    createdAt: timestamp({ withTimezone: true, mode: 'date' }).notNull().defaultNow(),
    expiresAt: timestamp({ withTimezone: true, mode: 'date' }).notNull(),
    acceptedAt: timestamp({ withTimezone: true, mode: 'date' }),
    acceptedBy: text().references(() => users.id, { onDelete: 'set null' }),
  },
  (t) => [index('invitations_team_id_idx').on(t.teamId)],
);

/** Every e-mail the local fake mailer "sent" (no SMTP_URL): read through the dev outbox. */
export const mailOutbox = pgTable('mail_outbox', {
  id: integer().primaryKey().generatedAlwaysAsIdentity(),
  to: text().notNull(),
  subject: text().notNull(),
  text: text().notNull(),
  html: text().notNull(),
  createdAt: timestamp({ withTimezone: true, mode: 'date' }).notNull().defaultNow(),
});

/**
 * A design notebook: one design's life in a team. `latestVersion` mirrors the highest version
 * number so lists and the save check read one row; it only changes inside the save transaction.
 * A clone keeps where it came from, with the source's title as it was then; an imported notebook
 * file, when it was imported (`importedAt`, the same instant as `createdAt`).
 */
export const designs = pgTable(
  'designs',
  {
    id: text().primaryKey(),
    teamId: text()
      .notNull()
      .references(() => teams.id, { onDelete: 'cascade' }),
    title: text().notNull(),
    tags: text().array().notNull().default(sql`'{}'::text[]`),
    createdBy: text().references(() => users.id, { onDelete: 'set null' }),
    archived: boolean().notNull().default(false),
    latestVersion: integer().notNull(),
    baselineVersion: integer(),
    clonedFromDesignId: text().references((): AnyPgColumn => designs.id, { onDelete: 'set null' }),
    clonedFromVersion: integer(),
    clonedFromTitle: text(),
    /** When the design came from an imported notebook file; null for one made here (or a clone). */
    importedAt: timestamp({ withTimezone: true, mode: 'date' }),
    createdAt: timestamp({ withTimezone: true, mode: 'date' }).notNull().defaultNow(),
    updatedAt: timestamp({ withTimezone: true, mode: 'date' }).notNull().defaultNow(),
  },
  (t) => [
    index('designs_team_updated_idx').on(t.teamId, t.updatedAt),
    index('designs_team_title_idx').on(t.teamId, sql`lower(${t.title})`),
    index('designs_tags_idx').using('gin', t.tags),
  ],
);

/**
 * Immutable saved states of a design, numbered 1…n per design. `params` passed `designSchema`;
 * `summary` holds the solver's key figures, computed once at save time.
 */
export const designVersions = pgTable(
  'design_versions',
  {
    id: text().primaryKey(),
    designId: text()
      .notNull()
      .references(() => designs.id, { onDelete: 'cascade' }),
    number: integer().notNull(),
    params: jsonb().notNull(),
    notes: text().notNull().default(''),
    message: text().notNull(),
    authorId: text().references(() => users.id, { onDelete: 'set null' }),
    parentNumber: integer(),
    summary: jsonb().notNull(),
    createdAt: timestamp({ withTimezone: true, mode: 'date' }).notNull().defaultNow(),
  },
  (t) => [uniqueIndex('design_versions_design_number_unique').on(t.designId, t.number)],
);

/** Read-only links to one version (or the latest when `version` is null); only the token's SHA-256 is kept. */
export const shareLinks = pgTable(
  'share_links',
  {
    id: text().primaryKey(),
    tokenHash: text().notNull().unique(),
    designId: text()
      .notNull()
      .references(() => designs.id, { onDelete: 'cascade' }),
    version: integer(),
    expiresAt: timestamp({ withTimezone: true, mode: 'date' }),
    revokedAt: timestamp({ withTimezone: true, mode: 'date' }),
    createdBy: text().references(() => users.id, { onDelete: 'set null' }),
    createdAt: timestamp({ withTimezone: true, mode: 'date' }).notNull().defaultNow(),
  },
  (t) => [index('share_links_design_id_idx').on(t.designId)],
);

/**
 * Design review (shared/reviews.ts has the words). A thread belongs to the version it was started
 * on and is pinned to what it is about (`pin`, the shared `Pin` as JSON); for a field pin,
 * `pinnedValue` is that field's value on the thread's version, so later versions can say whether
 * it changed. Resolve and reopen events are kept in `statusEvents` (`{ status, byId, byName, at }`).
 * Names are kept beside ids so a remark still says who wrote it after an account is deleted, and
 * an imported thread can name people who are not in this installation.
 */
export const reviewThreads = pgTable(
  'review_threads',
  {
    id: text().primaryKey(),
    seq: integer().notNull().generatedAlwaysAsIdentity(),
    designId: text()
      .notNull()
      .references(() => designs.id, { onDelete: 'cascade' }),
    versionNumber: integer().notNull(),
    pin: jsonb().notNull(),
    pinnedValue: jsonb(),
    status: text({ enum: ['open', 'resolved'] }).notNull().default('open'),
    createdBy: text().references(() => users.id, { onDelete: 'set null' }),
    createdByName: text().notNull(),
    createdAt: timestamp({ withTimezone: true, mode: 'date' }).notNull(),
    resolvedBy: text().references(() => users.id, { onDelete: 'set null' }),
    resolvedAt: timestamp({ withTimezone: true, mode: 'date' }),
    statusEvents: jsonb().notNull().default(sql`'[]'::jsonb`),
  },
  (t) => [index('review_threads_design_version_idx').on(t.designId, t.versionNumber, t.seq)],
);

/** One remark in a thread. `body` is null once removed; `earlierBodies` keeps each edited-away text (`{ body, replacedAt }`). */
export const reviewRemarks = pgTable(
  'review_remarks',
  {
    id: text().primaryKey(),
    seq: integer().notNull().generatedAlwaysAsIdentity(),
    threadId: text()
      .notNull()
      .references(() => reviewThreads.id, { onDelete: 'cascade' }),
    authorId: text().references(() => users.id, { onDelete: 'set null' }),
    authorName: text().notNull(),
    body: text(),
    mentions: text().array().notNull().default(sql`'{}'::text[]`),
    earlierBodies: jsonb().notNull().default(sql`'[]'::jsonb`),
    createdAt: timestamp({ withTimezone: true, mode: 'date' }).notNull(),
    editedAt: timestamp({ withTimezone: true, mode: 'date' }),
    removedAt: timestamp({ withTimezone: true, mode: 'date' }),
  },
  (t) => [index('review_remarks_thread_idx').on(t.threadId, t.seq)],
);

/** An owner's request that a member review one version; `answeredAt` is set by that member's decision. */
export const reviewRequests = pgTable(
  'review_requests',
  {
    id: text().primaryKey(),
    designId: text()
      .notNull()
      .references(() => designs.id, { onDelete: 'cascade' }),
    versionNumber: integer().notNull(),
    requestedBy: text().references(() => users.id, { onDelete: 'set null' }),
    reviewerId: text()
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    /** A calendar date (`YYYY-MM-DD`), or null. */
    dueDate: text(),
    note: text().notNull().default(''),
    createdAt: timestamp({ withTimezone: true, mode: 'date' }).notNull(),
    answeredAt: timestamp({ withTimezone: true, mode: 'date' }),
  },
  (t) => [uniqueIndex('review_requests_version_reviewer_unique').on(t.designId, t.versionNumber, t.reviewerId)],
);

/** A reviewer's decision on one version. It never moves to another version. */
export const reviewDecisions = pgTable(
  'review_decisions',
  {
    id: text().primaryKey(),
    seq: integer().notNull().generatedAlwaysAsIdentity(),
    designId: text()
      .notNull()
      .references(() => designs.id, { onDelete: 'cascade' }),
    versionNumber: integer().notNull(),
    reviewerId: text().references(() => users.id, { onDelete: 'set null' }),
    reviewerName: text().notNull(),
    outcome: text({ enum: ['signed-off', 'signed-off-with-remarks', 'revise'] }).notNull(),
    summary: text().notNull(),
    createdAt: timestamp({ withTimezone: true, mode: 'date' }).notNull(),
  },
  (t) => [index('review_decisions_design_version_idx').on(t.designId, t.versionNumber, t.seq)],
);

/** What waits for one person: one row per event that concerns them (shared `InboxKind`). */
export const inboxItems = pgTable(
  'inbox_items',
  {
    id: text().primaryKey(),
    seq: integer().notNull().generatedAlwaysAsIdentity(),
    userId: text()
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    kind: text({
      enum: ['review-requested', 'mentioned', 'thread-on-my-design', 'remark-on-my-thread', 'decision-on-my-version'],
    }).notNull(),
    designId: text()
      .notNull()
      .references(() => designs.id, { onDelete: 'cascade' }),
    versionNumber: integer().notNull(),
    threadId: text().references(() => reviewThreads.id, { onDelete: 'cascade' }),
    actorId: text().references(() => users.id, { onDelete: 'set null' }),
    excerpt: text().notNull(),
    createdAt: timestamp({ withTimezone: true, mode: 'date' }).notNull(),
    readAt: timestamp({ withTimezone: true, mode: 'date' }),
  },
  (t) => [index('inbox_items_user_seq_idx').on(t.userId, t.seq)],
);

/** Which review e-mails a person gets; no row means all on. */
export const mailSettings = pgTable('mail_settings', {
  userId: text()
    .primaryKey()
    .references(() => users.id, { onDelete: 'cascade' }),
  reviewRequests: boolean().notNull().default(true),
  mentions: boolean().notNull().default(true),
  threadsOnMyDesigns: boolean().notNull().default(true),
  decisionsOnMyVersions: boolean().notNull().default(true),
});

/** Raw bytes; drizzle 0.45 has no built-in `bytea` column. PGlite reads it back as a Uint8Array. */
const bytea = customType<{ data: Uint8Array; driverData: Uint8Array }>({ dataType: () => 'bytea' });

/**
 * A team's library of uploaded measured curves (`shared/curves.ts`): the file as sent, its SHA-256,
 * and the points parsed from it with the units applied (`wavelengthUnit`, `valueScale` — null for
 * kinds whose values are not fractions — and `medium`, each detected or corrected). The same file
 * read the same way is one row: the unique key is the team, checksum, kind and applied units, so a
 * re-upload is recognised. Designs keep their own copy of the points, so deleting a row changes no
 * saved version.
 */
export const teamCurves = pgTable(
  'team_curves',
  {
    id: text().primaryKey(),
    teamId: text()
      .notNull()
      .references(() => teams.id, { onDelete: 'cascade' }),
    kind: text().notNull(),
    name: text().notNull(),
    fileName: text().notNull(),
    fileBytes: bytea().notNull(),
    checksum: text().notNull(),
    wavelengthUnit: text({ enum: ['nm', 'um'] }).notNull(),
    valueScale: text({ enum: ['fraction', 'percent'] }),
    medium: text({ enum: ['air', 'vacuum', 'unstated'] }).notNull(),
    /** What the uploader corrected (`CurveCorrections`), `{}` when nothing was. */
    corrections: jsonb().notNull().default(sql`'{}'::jsonb`),
    wavelengthsNm: doublePrecision().array().notNull(),
    values: doublePrecision().array().notNull(),
    /** A line list's labels, one per point; null for other kinds. */
    labels: text().array(),
    uploadedBy: text().references(() => users.id, { onDelete: 'set null' }),
    uploadedByName: text().notNull(),
    createdAt: timestamp({ withTimezone: true, mode: 'date' }).notNull(),
  },
  (t) => [
    unique('team_curves_same_file_unique').on(t.teamId, t.checksum, t.kind, t.wavelengthUnit, t.valueScale, t.medium).nullsNotDistinct(),
    index('team_curves_team_created_idx').on(t.teamId, t.createdAt),
  ],
);
