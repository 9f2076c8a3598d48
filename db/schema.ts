import { sql } from 'drizzle-orm';
import {
  boolean,
  index,
  integer,
  jsonb,
  pgEnum,
  pgTable,
  primaryKey,
  text,
  timestamp,
  uniqueIndex,
  type AnyPgColumn,
} from 'drizzle-orm/pg-core';

/**
 * Table definitions only: importable by tooling and tests without loading a database driver.
 * Column names are camelCase here and snake_case in SQL (`casing: 'snake_case'`).
 */

/** Facts about this installation, such as when demo data was seeded. One row per key. */
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
 * Review comments on one version of a design, listed oldest first. `decision` is null for a plain
 * comment; a decision belongs to the version it was made on, so a new version starts unreviewed.
 */
export const versionReviews = pgTable(
  'version_reviews',
  {
    id: text().primaryKey(),
    /** Insertion order: comments written in the same millisecond still list in the order sent. */
    seq: integer().notNull().generatedAlwaysAsIdentity(),
    designId: text()
      .notNull()
      .references(() => designs.id, { onDelete: 'cascade' }),
    versionNumber: integer().notNull(),
    authorId: text().references(() => users.id, { onDelete: 'set null' }),
    body: text().notNull(),
    decision: text({ enum: ['approved', 'changes-requested'] }),
    createdAt: timestamp({ withTimezone: true, mode: 'date' }).notNull(),
  },
  (t) => [index('version_reviews_design_version_idx').on(t.designId, t.versionNumber, t.seq)],
);
