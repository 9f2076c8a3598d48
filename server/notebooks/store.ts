import { randomUUID } from 'node:crypto';
import type { User } from '../../shared/auth';
import type { Design } from '../../shared/design';
import type {
  DesignListResponse,
  Notebook,
  NotebookFile,
  NotebookFileReview,
  ShareLink,
  Version,
  VersionHeader,
  VersionResponse,
} from '../../shared/notebooks';
import type { ReviewState } from '../../shared/reviews';
import type { Role } from '../../shared/teams';
import { deepFreeze } from '../http/json';
import { createReadCache, type Writers } from '../read-cache';
import type { RoleDirectory } from '../teams/index';
import { createWriteBatcher } from '../write-batcher';
import type {
  DesignInsert,
  DesignRow,
  FullVersionView,
  ListFilter,
  NotebooksRepository,
  SaveIfLatest,
  ShareLinkInsert,
  VersionInsert,
  VersionView,
} from './repository';
import { summarizeVersion } from './summary';

/** A design as the API shows it, before the caller's role is added. */
export type DesignFields = Omit<Notebook, 'role'>;

function toDesign(row: DesignRow & { creatorName: string | null; latestReviewState: ReviewState }): DesignFields {
  return {
    id: row.id,
    teamId: row.teamId,
    title: row.title,
    tags: row.tags,
    archived: row.archived,
    createdBy: row.createdBy ? { id: row.createdBy, displayName: row.creatorName ?? '' } : null,
    createdAt: row.createdAt.toISOString(),
    updatedAt: row.updatedAt.toISOString(),
    latestVersion: row.latestVersion,
    baselineVersion: row.baselineVersion,
    clonedFrom:
      row.clonedFromTitle !== null && row.clonedFromVersion !== null
        ? { designId: row.clonedFromDesignId, title: row.clonedFromTitle, version: row.clonedFromVersion }
        : null,
    importedAt: row.importedAt?.toISOString() ?? null,
    latestReviewState: row.latestReviewState,
  };
}

function toHeader(row: VersionView): VersionHeader {
  return {
    number: row.number,
    message: row.message,
    author: row.authorId ? { id: row.authorId, displayName: row.authorName ?? '' } : null,
    createdAt: row.createdAt.toISOString(),
    parentNumber: row.parentNumber,
    summary: row.summary,
  };
}

function toVersion(row: FullVersionView): Version {
  return { ...toHeader(row), params: row.params as Design, notes: row.notes };
}

/** A version as its author wrote it; the store numbers it and works out its summary. */
export type NewVersion = {
  params: Design;
  notes: string;
  message: string;
  authorId: string;
  parentNumber: number | null;
  createdAt: Date;
};

/** A design as its creator made it; the store gives it its id and counts its versions. */
export type NewDesign = {
  teamId: string;
  title: string;
  tags: string[];
  createdBy: string;
  createdAt: Date;
  baselineVersion?: number | null;
  clonedFrom?: { designId: string | null; title: string; version: number } | null;
  /** Made from an imported notebook file: its `importedAt` is its `createdAt`. */
  imported?: boolean;
};

/** The summary is worked out once, here, so that no read runs the solver. */
function versionRow(designId: string, number: number, version: NewVersion): VersionInsert {
  return {
    id: randomUUID(),
    designId,
    number,
    params: version.params,
    notes: version.notes,
    message: version.message,
    authorId: version.authorId,
    parentNumber: version.parentNumber,
    summary: summarizeVersion(version.params),
    createdAt: version.createdAt,
  };
}

function designRow(id: string, design: NewDesign, latestVersion: number): DesignInsert {
  return {
    id,
    teamId: design.teamId,
    title: design.title,
    tags: design.tags,
    createdBy: design.createdBy,
    latestVersion,
    baselineVersion: design.baselineVersion ?? null,
    clonedFromDesignId: design.clonedFrom?.designId ?? null,
    clonedFromVersion: design.clonedFrom?.version ?? null,
    clonedFromTitle: design.clonedFrom?.title ?? null,
    importedAt: design.imported ? design.createdAt : null,
    createdAt: design.createdAt,
    updatedAt: design.createdAt,
  };
}

/**
 * What a write changed, as plain data. Each kind names the remembered answers it makes stale;
 * versions and a design's team never change, so no write names them.
 */
export type Change = {
  /** A design of this team was added or changed: the team's list pages (and the tags they carry). */
  teamDesigns: string;
};

/**
 * One write of the store: `run` writes, then `changed` says, from the same arguments and the
 * answer, what that made stale. A write cannot be declared without it; one that changes nothing
 * remembered says so with an empty list.
 */
type Write<A extends unknown[], R> = {
  run: (...args: A) => Promise<R>;
  changed: (result: R, ...args: A) => Change[] | Promise<Change[]>;
};

export type NotebooksStoreDeps = {
  repository: NotebooksRepository;
  roles: Pick<RoleDirectory, 'roleOf'>;
  /** `shared` (several API processes on one PostgreSQL server): list pages are not kept. */
  writers?: Writers;
};

/**
 * The notebooks' data with its speed machinery: the repository's reads, answered from memory
 * where that pays (see `bench/api.bench.ts`), frozen so the HTTP layer serialises each answer
 * once (`sendJson`), and saves written together (group commit). Every write is declared in
 * `writes` with what it changes, and forgets that once it has committed, so a read after a write
 * is always fresh. Rules (who may do what, what a save must be based on) live in the service.
 */
export function createNotebooksStore({ repository, roles, writers = 'alone' }: NotebooksStoreDeps) {
  // Per app, in process. A version never changes and a design never changes team, so those two
  // caches are never stale; a team's list pages (with its tags) are forgotten by every write that
  // names the team. Each pays, by `npm run bench:api` on the shared 2-core machine, with → without:
  // versions, one version read 2,366–2,833 → 309–361 req/s; list pages, a page of 20 designs
  // 1,361–2,331 → 165–208 req/s; design → team, saves at 8 at once p99 33–37 → 137–317 ms. A team's
  // tags had a cache of their own: it spared a list-page miss ~1 ms of ~4 ms and moved no target.
  const versions = createReadCache<{ teamId: string; answer: VersionResponse }>({ max: 2000, ttlMs: Infinity });
  const designTeams = createReadCache<string>({ max: 20_000, ttlMs: Infinity });
  // List pages change with every save anywhere: with other writers, none is kept (read-cache.ts).
  const listPages = createReadCache<DesignListResponse>({ max: 1000, writers });
  // Saves that arrive together are written together (see write-batcher.ts).
  const saves = createWriteBatcher({
    run: (items: SaveIfLatest[]) => repository.saveManyIfLatest(items),
    keyOf: (item) => item.version.designId,
    maxBatch: 64,
  });

  function remember(designId: string, teamId: string, version: Version): VersionResponse {
    const answer = deepFreeze({ version });
    versions.set(`${designId}:${version.number}`, { teamId, answer });
    return answer;
  }
  const teamOf = (designId: string) => designTeams.load(designId, () => repository.teamOfDesign(designId));

  /**
   * Every write's changes end here, after its commit. This process's memory is all there is to
   * forget while one server owns the database; with several server processes, this is the one
   * place that would also tell the others (and where theirs would arrive).
   */
  function forget(changes: Change[]) {
    for (const { teamDesigns: teamId } of changes) listPages.forgetWhere((key) => key.startsWith(`${teamId} `));
  }

  function write<A extends unknown[], R>({ run, changed }: Write<A, R>) {
    const declared = async (...args: A): Promise<R> => {
      const result = await run(...args);
      forget(await changed(result, ...args));
      return result;
    };
    // `changed` stays readable so the table can be checked whole (tests/server/notebooks/store.test.ts).
    return Object.assign(declared, { changed });
  }

  const writes = {
    /** A new design with its versions numbered from 1, in one transaction; answers its id. */
    insertDesign: write({
      run: async (design: NewDesign, versions: NewVersion[], review?: NotebookFileReview) => {
        const id = randomUUID();
        const rows = versions.map((version, index) => versionRow(id, index + 1, version));
        await repository.inTransaction(async (repo) => {
          await repo.insertDesign(designRow(id, design, rows.length), rows);
          // An imported file's threads and decisions go in with its versions, or nothing does.
          if (review) await repo.insertFileReview(id, review, versions.map((v) => v.params));
        });
        return id;
      },
      changed: (_id, design) => [{ teamDesigns: design.teamId }],
    }),

    /**
     * `version` as number `baseVersion + 1`, only while `baseVersion` is the unarchived design's
     * latest (see `saveManyIfLatest`); saves that arrive together share one statement. Answers the
     * design after the save and the new version, which is remembered, or null when refused.
     */
    saveVersion: write({
      run: async (
        designId: string,
        baseVersion: number,
        content: Omit<NewVersion, 'authorId' | 'parentNumber'>,
        author: Pick<User, 'id' | 'displayName'>,
      ) => {
        const written = { ...content, authorId: author.id, parentNumber: baseVersion };
        const row = versionRow(designId, baseVersion + 1, written);
        const saved = await saves.submit({ version: row, baseVersion });
        if (!saved) return null;
        // Answered from what was just written rather than read back.
        const version: Version = {
          number: row.number,
          message: row.message,
          author: { id: author.id, displayName: author.displayName },
          createdAt: content.createdAt.toISOString(),
          parentNumber: baseVersion,
          summary: row.summary,
          params: content.params,
          notes: content.notes,
        };
        remember(designId, saved.teamId, version);
        return { design: toDesign(saved), version };
      },
      changed: (saved) => (saved ? [{ teamDesigns: saved.design.teamId }] : []),
    }),

    updateDesign: write({
      run: (designId: string, patch: Parameters<NotebooksRepository['updateDesign']>[1]) =>
        repository.updateDesign(designId, patch),
      changed: async (_done, designId) => {
        const teamId = await teamOf(designId);
        return teamId ? [{ teamDesigns: teamId }] : [];
      },
    }),

    // Share links are read from the database every time, so their writes change nothing remembered.
    insertShareLink: write({
      run: async (link: Omit<ShareLinkInsert, 'id'>) => {
        const id = randomUUID();
        await repository.insertShareLink({ id, ...link });
        return id;
      },
      changed: () => [],
    }),
    revokeShareLink: write({
      run: (designId: string, linkId: string, at: Date) => repository.revokeShareLink(designId, linkId, at),
      changed: () => [],
    }),
  };

  return {
    writes,

    /**
     * For writes made outside the notebooks that change what list pages show (a review decision
     * or request changes a design's review state): forgets the team's pages, as a write would.
     */
    forgetTeamLists(teamId: string) {
      forget([{ teamDesigns: teamId }]);
    },

    /** The design and the caller's role in its team (null: not a member); null for a made-up id. */
    async design(
      designId: string,
      userId: string,
    ): Promise<{ design: DesignFields; role: Role | null } | null> {
      const row = await repository.designForUser(designId, userId);
      return row ? { design: toDesign(row), role: row.role } : null;
    },

    /** The caller's role in the design's team, from memory when it can (null: outsider or made-up id). */
    async roleOn(designId: string, userId: string): Promise<Role | null> {
      const teamId = await teamOf(designId);
      return teamId ? roles.roleOf(teamId, userId) : null;
    },

    /** The hot read: the frozen answer and the caller's role, from memory or in one query. */
    async versionForUser(
      designId: string,
      n: number,
      userId: string,
    ): Promise<{ answer: VersionResponse; role: Role | null } | null> {
      const cached = versions.get(`${designId}:${n}`);
      if (cached) return { answer: cached.answer, role: await roles.roleOf(cached.teamId, userId) };
      const row = await repository.versionForUser(designId, n, userId);
      if (!row) return null;
      return { answer: remember(designId, row.teamId, toVersion(row)), role: row.role };
    },

    async version(designId: string, n: number): Promise<Version | null> {
      const cached = versions.get(`${designId}:${n}`);
      if (cached) return cached.answer.version;
      const row = await repository.version(designId, n);
      return row ? toVersion(row) : null;
    },

    /** A page of the team's designs as a caller with `role` sees it; pages differ only by role. */
    async listPage(filter: ListFilter, role: Role, page: number): Promise<DesignListResponse> {
      const answer = await listPages.load(`${filter.teamId} ${role} ${JSON.stringify(filter)}`, async () => {
        const rows = await repository.listDesigns(filter);
        return deepFreeze({
          designs: rows.map((row) => ({ ...toDesign(row), role })),
          total: rows[0]?.total ?? 0,
          page,
          pageSize: filter.limit,
          tags: await repository.teamTags(filter.teamId),
        });
      });
      return answer!;
    },

    async versionHeaders(designId: string): Promise<VersionHeader[]> {
      return (await repository.versionHeaders(designId)).map(toHeader);
    },

    /** Every version, oldest first, as a notebook file holds them. */
    async fileVersions(designId: string): Promise<NotebookFile['versions']> {
      return (await repository.allVersions(designId)).map((v) => ({
        number: v.number,
        message: v.message,
        notes: v.notes,
        params: v.params as Design,
        parentNumber: v.parentNumber,
        createdAt: v.createdAt.toISOString(),
        authorName: v.authorName,
      }));
    },

    /** The design's threads and decisions as a notebook file holds them (read fresh: exports are rare). */
    fileReview: (designId: string): Promise<NotebookFileReview> => repository.fileReview(designId),

    /** The design's share links, newest first; `active` as of `now`. */
    async shareLinks(designId: string, now: Date): Promise<ShareLink[]> {
      return (await repository.shareLinks(designId)).map(({ link, creatorName }) => ({
        id: link.id,
        version: link.version,
        createdBy: link.createdBy ? { id: link.createdBy, displayName: creatorName ?? '' } : null,
        createdAt: link.createdAt.toISOString(),
        expiresAt: link.expiresAt?.toISOString() ?? null,
        revokedAt: link.revokedAt?.toISOString() ?? null,
        active: link.revokedAt === null && (link.expiresAt === null || link.expiresAt > now),
      }));
    },

    personalTeamOf: (userId: string) => repository.personalTeamOf(userId),
    shareLinkByTokenHash: (tokenHash: string) => repository.shareLinkByTokenHash(tokenHash),
  };
}

export type NotebooksStore = ReturnType<typeof createNotebooksStore>;
