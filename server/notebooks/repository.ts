import { and, asc, desc, eq, ilike, isNotNull, isNull, sql, type SQL } from 'drizzle-orm';
import { alias } from 'drizzle-orm/pg-core';
import type { Database } from '../../db/client';
import { designs, designVersions, memberships, shareLinks, teams, users } from '../../db/schema';
import type { DesignSort, VersionSummary } from '../../shared/notebooks';
import type { ReviewState } from '../../shared/reviews';
import type { Role } from '../../shared/teams';
import { reviewStateSql } from '../reviews/repository';
import { reviewTransfer, type ReviewTransfer } from './review-transfer';

export type DesignRow = typeof designs.$inferSelect;
export type DesignInsert = typeof designs.$inferInsert;
export type VersionInsert = typeof designVersions.$inferInsert & { summary: VersionSummary };
export type ShareLinkRow = typeof shareLinks.$inferSelect;
export type ShareLinkInsert = typeof shareLinks.$inferInsert;

const creator = alias(users, 'creator');
const author = alias(users, 'author');
const linkCreator = alias(users, 'link_creator');

/** A design as the API shows it: the row, its creator's name and the caller's role (null: not a member). */
export type DesignView = DesignRow & { creatorName: string | null; latestReviewState: ReviewState; role: Role | null };

export type VersionView = {
  number: number;
  message: string;
  authorId: string | null;
  authorName: string | null;
  createdAt: Date;
  parentNumber: number | null;
  summary: VersionSummary;
};
export type FullVersionView = VersionView & { params: unknown; notes: string };

const designColumns = {
  id: designs.id,
  teamId: designs.teamId,
  title: designs.title,
  tags: designs.tags,
  createdBy: designs.createdBy,
  archived: designs.archived,
  latestVersion: designs.latestVersion,
  baselineVersion: designs.baselineVersion,
  clonedFromDesignId: designs.clonedFromDesignId,
  clonedFromVersion: designs.clonedFromVersion,
  clonedFromTitle: designs.clonedFromTitle,
  importedAt: designs.importedAt,
  createdAt: designs.createdAt,
  updatedAt: designs.updatedAt,
  creatorName: creator.displayName,
  latestReviewState: reviewStateSql(designs.id, designs.latestVersion),
};

const versionHeaderColumns = {
  number: designVersions.number,
  message: designVersions.message,
  authorId: designVersions.authorId,
  authorName: author.displayName,
  createdAt: designVersions.createdAt,
  parentNumber: designVersions.parentNumber,
  summary: sql<VersionSummary>`${designVersions.summary}`,
};

const fullVersionColumns = {
  ...versionHeaderColumns,
  params: designVersions.params,
  notes: designVersions.notes,
};

export type SaveIfLatest = { version: VersionInsert; baseVersion: number };
export type SavedDesign = DesignRow & { creatorName: string | null; latestReviewState: ReviewState };

/** A `designs` row as raw SQL returns it: snake_case, timestamps as text. */
type SavedDesignRow = {
  id: string;
  team_id: string;
  title: string;
  tags: string[];
  created_by: string | null;
  archived: boolean;
  latest_version: number;
  baseline_version: number | null;
  cloned_from_design_id: string | null;
  cloned_from_version: number | null;
  cloned_from_title: string | null;
  imported_at: string | null;
  created_at: string;
  updated_at: string;
  creator_name: string | null;
  latest_review_state: ReviewState;
};

function fromSavedRow(row: SavedDesignRow): SavedDesign {
  return {
    id: row.id,
    teamId: row.team_id,
    title: row.title,
    tags: row.tags,
    createdBy: row.created_by,
    archived: row.archived,
    latestVersion: row.latest_version,
    baselineVersion: row.baseline_version,
    clonedFromDesignId: row.cloned_from_design_id,
    clonedFromVersion: row.cloned_from_version,
    clonedFromTitle: row.cloned_from_title,
    importedAt: row.imported_at === null ? null : new Date(row.imported_at),
    createdAt: new Date(row.created_at),
    updatedAt: new Date(row.updated_at),
    creatorName: row.creator_name,
    latestReviewState: row.latest_review_state,
  };
}

/** `%` and `_` typed in the search box are letters, not wildcards. */
function likePattern(text: string): string {
  return `%${text.replace(/[\\%_]/g, (c) => `\\${c}`)}%`;
}

export type ListFilter = {
  teamId: string;
  q?: string;
  tag?: string;
  sort: DesignSort;
  /** Only designs whose latest version is in this review state. */
  review?: ReviewState;
  dir: 'asc' | 'desc';
  archived: 'exclude' | 'include' | 'only';
  limit: number;
  offset: number;
};

/**
 * The hot reads, prepared once per database: building a Drizzle query costs more than PGlite takes
 * to run a primary-key lookup (see the team's STACK notes).
 */
function prepareHotReads(db: Database) {
  const designForUser = db
    .select({ ...designColumns, role: memberships.role })
    .from(designs)
    .leftJoin(creator, eq(creator.id, designs.createdBy))
    .leftJoin(
      memberships,
      and(eq(memberships.teamId, designs.teamId), eq(memberships.userId, sql.placeholder('userId'))),
    )
    .where(eq(designs.id, sql.placeholder('designId')))
    .prepare('notebook_design_for_user');

  const versionForUser = db
    .select({ ...fullVersionColumns, teamId: designs.teamId, role: memberships.role })
    .from(designs)
    .innerJoin(
      designVersions,
      and(eq(designVersions.designId, designs.id), eq(designVersions.number, sql.placeholder('n'))),
    )
    .leftJoin(author, eq(author.id, designVersions.authorId))
    .leftJoin(
      memberships,
      and(eq(memberships.teamId, designs.teamId), eq(memberships.userId, sql.placeholder('userId'))),
    )
    .where(eq(designs.id, sql.placeholder('designId')))
    .prepare('notebook_version_for_user');

  const versionByNumber = db
    .select(fullVersionColumns)
    .from(designVersions)
    .leftJoin(author, eq(author.id, designVersions.authorId))
    .where(
      and(
        eq(designVersions.designId, sql.placeholder('designId')),
        eq(designVersions.number, sql.placeholder('n')),
      ),
    )
    .prepare('notebook_version_by_number');

  const teamOfDesign = db
    .select({ teamId: designs.teamId })
    .from(designs)
    .where(eq(designs.id, sql.placeholder('designId')))
    .prepare('notebook_team_of_design');

  return { designForUser, versionForUser, versionByNumber, teamOfDesign };
}

function queries(db: Database) {
  // Built on first use: a transaction gets its own `queries` and rarely needs any of them.
  let preparedReads: ReturnType<typeof prepareHotReads> | undefined;
  const hot = () => (preparedReads ??= prepareHotReads(db));

  return {
    async designForUser(designId: string, userId: string): Promise<DesignView | null> {
      const [row] = await hot().designForUser.execute({ designId, userId });
      return row ?? null;
    },

    /** One version, with the caller's role in its design's team, in one round trip. */
    async versionForUser(designId: string, n: number, userId: string) {
      const [row] = await hot().versionForUser.execute({ designId, n, userId });
      return row ?? null;
    },

    async version(designId: string, n: number): Promise<FullVersionView | null> {
      const [row] = await hot().versionByNumber.execute({ designId, n });
      return row ?? null;
    },

    /** Newest first. */
    async versionHeaders(designId: string): Promise<VersionView[]> {
      return db
        .select(versionHeaderColumns)
        .from(designVersions)
        .leftJoin(author, eq(author.id, designVersions.authorId))
        .where(eq(designVersions.designId, designId))
        .orderBy(desc(designVersions.number));
    },

    async allVersions(designId: string): Promise<FullVersionView[]> {
      return db
        .select(fullVersionColumns)
        .from(designVersions)
        .leftJoin(author, eq(author.id, designVersions.authorId))
        .where(eq(designVersions.designId, designId))
        .orderBy(asc(designVersions.number));
    },

    /** Designs never move between teams. */
    async teamOfDesign(designId: string): Promise<string | null> {
      const [row] = await hot().teamOfDesign.execute({ designId });
      return row?.teamId ?? null;
    },

    async personalTeamOf(userId: string): Promise<string | null> {
      const [row] = await db
        .select({ id: teams.id })
        .from(memberships)
        .innerJoin(teams, eq(teams.id, memberships.teamId))
        .where(and(eq(memberships.userId, userId), eq(teams.personal, true)))
        .orderBy(asc(teams.createdAt))
        .limit(1);
      return row?.id ?? null;
    },

    /** A page of the team's designs, baselines first, with the total before paging. */
    async listDesigns(filter: ListFilter) {
      const conditions: SQL[] = [eq(designs.teamId, filter.teamId)];
      if (filter.archived === 'exclude') conditions.push(eq(designs.archived, false));
      if (filter.archived === 'only') conditions.push(eq(designs.archived, true));
      if (filter.q) conditions.push(ilike(designs.title, likePattern(filter.q)));
      if (filter.tag) conditions.push(sql`${designs.tags} @> array[${filter.tag}]::text[]`);
      if (filter.review) conditions.push(sql`${reviewStateSql(designs.id, designs.latestVersion)} = ${filter.review}`);
      const order = filter.dir === 'asc' ? asc : desc;
      const sortKey =
        filter.sort === 'title'
          ? [order(sql`lower(${designs.title})`)]
          : filter.sort === 'owner'
            ? [
                filter.dir === 'asc'
                  ? sql`lower(${creator.displayName}) asc nulls last`
                  : sql`lower(${creator.displayName}) desc nulls last`,
              ]
            : [order(designs.updatedAt)];
      return db
        .select({ ...designColumns, total: sql<number>`count(*) over ()`.mapWith(Number) })
        .from(designs)
        .leftJoin(creator, eq(creator.id, designs.createdBy))
        .where(and(...conditions))
        .orderBy(asc(isNull(designs.baselineVersion)), ...sortKey, asc(designs.id))
        .limit(filter.limit)
        .offset(filter.offset);
    },

    async teamTags(teamId: string): Promise<string[]> {
      const rows = await db
        .selectDistinct({ tag: sql<string>`unnest(${designs.tags})`.as('tag') })
        .from(designs)
        .where(eq(designs.teamId, teamId))
        .orderBy(sql`tag`);
      return rows.map((row) => row.tag);
    },

    /** A design's threads and decisions as a notebook file carries them (export). */
    fileReview: (designId: string) => reviewTransfer(db).read(designId),

    /** An imported file's threads and decisions, written inside the import's transaction. */
    insertFileReview: (...args: Parameters<ReviewTransfer['insert']>) => reviewTransfer(db).insert(...args),

    async insertDesign(design: DesignInsert, versions: VersionInsert[]) {
      await db.insert(designs).values(design);
      await db.insert(designVersions).values(versions);
    },

    /**
     * Saves each version as number `baseVersion + 1` of its design, but only while `baseVersion`
     * is the unarchived design's latest, and answers each design as it is after its save, or null
     * where the design is missing, archived or already past that base. One statement, so it is
     * atomic: a version is inserted only from a row the conditional update moved. At most one
     * save per design (a second would see the first's base).
     */
    async saveManyIfLatest(saves: SaveIfLatest[]): Promise<(SavedDesign | null)[]> {
      const rows = saves.map(({ version: v, baseVersion }) => {
        const at = (v.createdAt ?? new Date()).toISOString();
        return sql`(${v.id}::text, ${v.designId}::text, ${baseVersion}::integer, ${JSON.stringify(v.params)}::jsonb,
          ${v.notes ?? ''}::text, ${v.message}::text, ${v.authorId ?? null}::text, ${v.parentNumber ?? null}::integer,
          ${JSON.stringify(v.summary)}::jsonb, ${at}::timestamptz)`;
      });
      // Both PGlite and node-postgres answer raw SQL as `{ rows }`.
      const result = (await db.execute(sql`
        with input (version_id, design_id, base, params, notes, message, author_id, parent_number, summary, at) as (
          values ${sql.join(rows, sql`, `)}
        ), moved as (
          update ${designs} d set latest_version = i.base + 1, updated_at = i.at
          from input i
          where d.id = i.design_id and d.latest_version = i.base and d.archived = false
          returning d.*
        ), added as (
          insert into ${designVersions}
            (id, design_id, number, params, notes, message, author_id, parent_number, summary, created_at)
          select i.version_id, m.id, m.latest_version, i.params, i.notes, i.message, i.author_id, i.parent_number, i.summary, i.at
          from moved m join input i on i.design_id = m.id
        )
        select m.*, (select u.display_name from ${users} u where u.id = m.created_by) as creator_name,
          ${reviewStateSql(sql`m.id`, sql`m.latest_version`)} as latest_review_state
        from moved m`)) as unknown as { rows: SavedDesignRow[] };
      const byId = new Map(result.rows.map((row) => [row.id, fromSavedRow(row)]));
      return saves.map(({ version }) => byId.get(version.designId) ?? null);
    },

    async updateDesign(
      designId: string,
      patch: Partial<Pick<DesignRow, 'title' | 'tags' | 'archived' | 'baselineVersion' | 'updatedAt'>>,
    ) {
      await db.update(designs).set(patch).where(eq(designs.id, designId));
    },

    async insertShareLink(link: ShareLinkInsert) {
      await db.insert(shareLinks).values(link);
    },

    async shareLinks(designId: string) {
      return db
        .select({ link: shareLinks, creatorName: linkCreator.displayName })
        .from(shareLinks)
        .leftJoin(linkCreator, eq(linkCreator.id, shareLinks.createdBy))
        .where(eq(shareLinks.designId, designId))
        .orderBy(desc(shareLinks.createdAt), asc(shareLinks.id));
    },

    async revokeShareLink(designId: string, linkId: string, at: Date): Promise<boolean> {
      const rows = await db
        .update(shareLinks)
        .set({ revokedAt: at })
        .where(
          and(eq(shareLinks.designId, designId), eq(shareLinks.id, linkId), isNull(shareLinks.revokedAt)),
        )
        .returning({ id: shareLinks.id });
      if (rows.length > 0) return true;
      const [existing] = await db
        .select({ id: shareLinks.id })
        .from(shareLinks)
        .where(
          and(eq(shareLinks.designId, designId), eq(shareLinks.id, linkId), isNotNull(shareLinks.revokedAt)),
        );
      return existing !== undefined;
    },

    async shareLinkByTokenHash(tokenHash: string) {
      const [row] = await db
        .select({ link: shareLinks, title: designs.title, latestVersion: designs.latestVersion })
        .from(shareLinks)
        .innerJoin(designs, eq(designs.id, shareLinks.designId))
        .where(eq(shareLinks.tokenHash, tokenHash));
      return row ?? null;
    },
  };
}

export type NotebookQueries = ReturnType<typeof queries>;

export function createNotebooksRepository(db: Database) {
  const base = queries(db);
  return {
    ...base,
    /**
     * Runs `work` in one transaction (a design with its versions goes in whole or not at all).
     * PGlite has one connection and Drizzle's transaction takes its lock.
     */
    inTransaction<T>(work: (repo: NotebookQueries) => Promise<T>): Promise<T> {
      return db.transaction((tx) => work(queries(tx as unknown as Database)));
    },
  };
}

export type NotebooksRepository = ReturnType<typeof createNotebooksRepository>;
