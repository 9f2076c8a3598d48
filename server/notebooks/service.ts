import { randomUUID } from 'node:crypto';
import type { User } from '../../shared/auth';
import { designSchema, type Design } from '../../shared/design';
import {
  notebookFileKind,
  notebookFormatVersion,
  versionConflictCode,
  type CompareResponse,
  type CreateShareLinkResponse,
  type DesignListResponse,
  type Notebook,
  type NotebookFile,
  type NotebookWithVersionResponse,
  type ShareLink,
  type SharedVersionResponse,
  type Version,
  type VersionHeader,
  type VersionConflictDetails,
  type VersionResponse,
  listDesignsQuerySchema,
  createDesignRequestSchema,
  updateDesignRequestSchema,
  saveVersionRequestSchema,
  cloneRequestSchema,
  createShareLinkRequestSchema,
} from '../../shared/notebooks';
import { can, type Capability, type Role } from '../../shared/teams';
import type { z } from 'zod';
import { createToken, hashToken } from '../auth/index';
import type { Clock } from '../clock';
import { HttpError, badRequest, conflict, forbidden, notFound } from '../http/errors';
import { deepFreeze } from '../http/json';
import { createReadCache } from '../read-cache';
import { createWriteBatcher } from '../write-batcher';
import { createTeamAccess, type RoleDirectory } from '../teams/index';
import { changedParameters, figureChanges } from './compare';
import type {
  DesignView,
  FullVersionView,
  ListFilter,
  NotebooksRepository,
  SaveIfLatest,
  VersionInsert,
  VersionView,
} from './repository';
import { summarizeVersion } from './summary';

const designNotFound = () => notFound('No such design.');
const versionNotFound = (n: number) => notFound(`This design has no version ${n}.`);
/** Expired, revoked and made-up links look alike to the visitor. */
const shareGone = () => notFound('This link is not valid any more. Ask the design’s owner for a new one.');

/**
 * A save whose base is no longer the latest. The latest version goes in `error.details`
 * (`versionConflictBodySchema`) so the client can show both without reading it back.
 */
const versionConflict = (latest: Version) =>
  new HttpError(
    409,
    versionConflictCode,
    `Version ${latest.number} was saved meanwhile. Review it and save again on top of it.`,
    undefined,
    { latest } satisfies VersionConflictDetails,
  );

function toNotebook(row: Omit<DesignView, 'role'>, role: Role): Notebook {
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
    role,
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

type Versionable = { params: Design; notes: string; message: string };

export type NotebooksServiceDeps = { repository: NotebooksRepository; roles: RoleDirectory; clock: Clock };

export function createNotebooksService({ repository, roles, clock }: NotebooksServiceDeps) {
  const teamAccess = createTeamAccess(roles);
  // Per app, in process; roles come from the app's role directory, which the teams service keeps
  // exact. A version never changes and a design never changes team, so those two caches never go
  // stale. A team's list pages and tags change only through this service, which forgets them on
  // every write to one of the team's designs.
  // Cached answers are frozen: the HTTP layer then serialises each one once (see http/json.ts).
  const versions = createReadCache<{ teamId: string; answer: VersionResponse }>({ max: 2000, ttlMs: Infinity });
  const designTeams = createReadCache<string>({ max: 20_000, ttlMs: Infinity });
  const listPages = createReadCache<DesignListResponse>({ max: 1000 });
  const tagLists = createReadCache<string[]>({ max: 1000 });
  // Saves that arrive together are written together (see write-batcher.ts).
  const saves = createWriteBatcher({
    run: (items: SaveIfLatest[]) => repository.saveManyIfLatest(items),
    keyOf: (item) => item.version.designId,
    maxBatch: 64,
  });
  const remember = (designId: string, teamId: string, version: Version) =>
    versions.set(`${designId}:${version.number}`, { teamId, answer: deepFreeze({ version }) });
  const teamTags = async (teamId: string) => (await tagLists.load(teamId, () => repository.teamTags(teamId))) ?? [];
  /** After any write to one of the team's designs. */
  const forgetTeamLists = (teamId: string) => {
    listPages.forgetWhere((key) => key.startsWith(`${teamId} `));
    tagLists.forget(teamId);
  };

  /** The design and the caller's role; outsiders and made-up ids get the same 404. */
  async function designFor(
    user: User,
    designId: string,
    capability: Capability,
  ): Promise<{ design: DesignView; role: Role }> {
    const design = await repository.designForUser(designId, user.id);
    if (!design || !design.role) throw designNotFound();
    if (!can(design.role, capability)) throw forbidden(`A ${design.role} of this team may not do that.`);
    return { design, role: design.role };
  }

  async function notebook(user: User, designId: string): Promise<Notebook> {
    const { design, role } = await designFor(user, designId, 'designs.read');
    return toNotebook(design, role);
  }

  function versionRow(
    designId: string,
    number: number,
    input: Versionable,
    authorId: string,
    parentNumber: number | null,
    createdAt: Date,
  ): VersionInsert {
    return {
      id: randomUUID(),
      designId,
      number,
      params: input.params,
      notes: input.notes,
      message: input.message,
      authorId,
      parentNumber,
      summary: summarizeVersion(input.params),
      createdAt,
    };
  }

  async function withVersion(user: User, designId: string, n: number): Promise<NotebookWithVersionResponse> {
    const design = await notebook(user, designId);
    const cached = versions.get(`${designId}:${n}`);
    if (cached) return { design, version: cached.answer.version };
    const version = await repository.version(designId, n);
    if (!version) throw versionNotFound(n);
    return { design, version: toVersion(version) };
  }

  /** Inserts a new design with its versions in one transaction. */
  async function insertNotebook(
    user: User,
    teamId: string,
    fields: {
      title: string;
      tags: string[];
      baselineVersion?: number | null;
      clonedFrom?: { designId: string | null; title: string; version: number } | null;
    },
    versions: (Versionable & { parentNumber: number | null; createdAt?: Date })[],
  ): Promise<NotebookWithVersionResponse> {
    const id = randomUUID();
    const now = clock.now();
    const rows = versions.map((v, index) =>
      versionRow(id, index + 1, v, user.id, v.parentNumber, v.createdAt ?? now),
    );
    await repository.inTransaction(async (repo) => {
      await repo.insertDesign(
        {
          id,
          teamId,
          title: fields.title,
          tags: fields.tags,
          createdBy: user.id,
          latestVersion: rows.length,
          baselineVersion: fields.baselineVersion ?? null,
          clonedFromDesignId: fields.clonedFrom?.designId ?? null,
          clonedFromVersion: fields.clonedFrom?.version ?? null,
          clonedFromTitle: fields.clonedFrom?.title ?? null,
          createdAt: now,
          updatedAt: now,
        },
        rows,
      );
    });
    forgetTeamLists(teamId);
    return withVersion(user, id, rows.length);
  }

  async function listShareLinks(user: User, designId: string): Promise<ShareLink[]> {
    await designFor(user, designId, 'share.manage');
    const now = clock.now();
    return (await repository.shareLinks(designId)).map(({ link, creatorName }) => ({
      id: link.id,
      version: link.version,
      createdBy: link.createdBy ? { id: link.createdBy, displayName: creatorName ?? '' } : null,
      createdAt: link.createdAt.toISOString(),
      expiresAt: link.expiresAt?.toISOString() ?? null,
      revokedAt: link.revokedAt?.toISOString() ?? null,
      active: link.revokedAt === null && (link.expiresAt === null || link.expiresAt > now),
    }));
  }

  return {
    async list(
      user: User,
      teamId: string,
      query: z.output<typeof listDesignsQuerySchema>,
    ): Promise<DesignListResponse> {
      const role = await teamAccess.require(teamId, user.id, 'designs.read');
      const filter: ListFilter = {
        teamId,
        q: query.q || undefined,
        tag: query.tag,
        sort: query.sort,
        dir: query.dir ?? (query.sort === 'updated' ? 'desc' : 'asc'),
        archived: query.archived,
        limit: query.pageSize,
        offset: (query.page - 1) * query.pageSize,
      };
      // The page differs between callers only by their role.
      const page = await listPages.load(`${teamId} ${role} ${JSON.stringify(filter)}`, async () => {
        const rows = await repository.listDesigns(filter);
        return deepFreeze({
          designs: rows.map((row) => toNotebook(row, role)),
          total: rows[0]?.total ?? 0,
          page: query.page,
          pageSize: query.pageSize,
          tags: await teamTags(teamId),
        });
      });
      return page!;
    },

    async create(
      user: User,
      teamId: string,
      input: z.output<typeof createDesignRequestSchema>,
    ): Promise<NotebookWithVersionResponse> {
      await teamAccess.require(teamId, user.id, 'designs.edit');
      return insertNotebook(user, teamId, { title: input.title, tags: input.tags }, [
        { ...input, parentNumber: null },
      ]);
    },

    async get(user: User, designId: string): Promise<NotebookWithVersionResponse> {
      const design = await notebook(user, designId);
      return withVersion(user, designId, design.latestVersion);
    },

    async update(
      user: User,
      designId: string,
      patch: z.output<typeof updateDesignRequestSchema>,
    ): Promise<Notebook> {
      const { design } = await designFor(user, designId, 'designs.edit');
      await repository.updateDesign(designId, { ...patch, updatedAt: clock.now() });
      forgetTeamLists(design.teamId);
      return notebook(user, designId);
    },

    async versions(user: User, designId: string): Promise<VersionHeader[]> {
      await designFor(user, designId, 'designs.read');
      return (await repository.versionHeaders(designId)).map(toHeader);
    },

    /** The hot read: from memory once its access is checked, else access and version in one query. */
    async version(user: User, designId: string, n: number): Promise<VersionResponse> {
      const cached = versions.get(`${designId}:${n}`);
      if (cached) {
        const role = await roles.roleOf(cached.teamId, user.id);
        if (!role) throw designNotFound();
        if (!can(role, 'designs.read')) throw forbidden();
        return cached.answer;
      }
      const row = await repository.versionForUser(designId, n, user.id);
      if (!row) {
        // Tell "no such version" from "no such design" only to members.
        await designFor(user, designId, 'designs.read');
        throw versionNotFound(n);
      }
      if (!row.role) throw designNotFound();
      if (!can(row.role, 'designs.read')) throw forbidden();
      const version = toVersion(row);
      remember(designId, row.teamId, version);
      return { version };
    },

    /**
     * Saves version latest+1 on top of `baseVersion`. One statement moves the design's latest
     * number only if it still is the base and inserts the version with it, and (design, number)
     * is unique, so two saves on one base cannot both win; the loser gets a 409 with the version
     * that beat it. Saves on different designs that arrive together share that statement.
     */
    async save(
      user: User,
      designId: string,
      input: z.output<typeof saveVersionRequestSchema>,
    ): Promise<NotebookWithVersionResponse> {
      const teamId = await designTeams.load(designId, () => repository.teamOfDesign(designId));
      const role = teamId ? await roles.roleOf(teamId, user.id) : null;
      if (!teamId || !role) throw designNotFound();
      if (!can(role, 'designs.edit')) throw forbidden(`A ${role} of this team may not do that.`);
      const row = versionRow(designId, input.baseVersion + 1, input, user.id, input.baseVersion, clock.now());
      const saved = await saves.submit({ version: row, baseVersion: input.baseVersion });
      if (!saved) {
        // Refused: say why, from the design as it is now.
        const { design } = await designFor(user, designId, 'designs.edit');
        if (design.archived) throw conflict('This design is archived. Restore it before saving a new version.');
        if (input.baseVersion > design.latestVersion)
          throw badRequest('The base version does not exist.', { baseVersion: `must be at most ${design.latestVersion}` });
        const latest = await repository.version(designId, design.latestVersion);
        if (!latest) throw designNotFound();
        throw versionConflict(toVersion(latest));
      }
      forgetTeamLists(teamId);
      // Answer from what was just written rather than reading it back.
      const version: Version = {
        number: row.number,
        message: row.message,
        author: { id: user.id, displayName: user.displayName },
        createdAt: row.createdAt!.toISOString(),
        parentNumber: row.parentNumber ?? null,
        summary: row.summary,
        params: input.params,
        notes: input.notes,
      };
      remember(designId, teamId, version);
      return { design: toNotebook(saved, role), version };
    },

    async compare(
      user: User,
      designId: string,
      a: number | undefined,
      b: number | undefined,
    ): Promise<CompareResponse> {
      const { design } = await designFor(user, designId, 'designs.read');
      const bNumber = b ?? design.latestVersion;
      const after = await repository.version(designId, bNumber);
      if (!after) throw versionNotFound(bNumber);
      const aNumber = a ?? after.parentNumber ?? after.number;
      const before = await repository.version(designId, aNumber);
      if (!before) throw versionNotFound(aNumber);
      return {
        a: toVersion(before),
        b: toVersion(after),
        // jsonb keeps keys in its own order; re-parsing puts them back in the schema's order.
        changes: changedParameters(designSchema.parse(before.params), designSchema.parse(after.params)),
        figures: figureChanges(before.summary, after.summary),
      };
    },

    /** Any member may clone out; the target must be a team where the caller is owner. */
    async clone(
      user: User,
      designId: string,
      input: z.output<typeof cloneRequestSchema>,
    ): Promise<NotebookWithVersionResponse> {
      const { design } = await designFor(user, designId, 'designs.clone');
      const n = input.version ?? design.latestVersion;
      const source = await repository.version(designId, n);
      if (!source) throw versionNotFound(n);
      const targetTeamId = input.teamId ?? (await repository.personalTeamOf(user.id));
      if (!targetTeamId) throw notFound('You have no personal workspace to clone into.');
      await teamAccess.require(targetTeamId, user.id, 'designs.edit');
      return insertNotebook(
        user,
        targetTeamId,
        {
          title: input.title ?? design.title,
          tags: design.tags,
          clonedFrom: { designId, title: design.title, version: n },
        },
        [
          {
            params: source.params as Design,
            notes: source.notes,
            message: `Cloned from “${design.title}” v${n}`,
            parentNumber: null,
          },
        ],
      );
    },

    async setBaseline(user: User, designId: string, version: number | null): Promise<Notebook> {
      const { design } = await designFor(user, designId, 'designs.edit');
      if (version !== null && version > design.latestVersion) throw versionNotFound(version);
      await repository.updateDesign(designId, { baselineVersion: version });
      forgetTeamLists(design.teamId);
      return notebook(user, designId);
    },

    shareLinks: listShareLinks,

    async createShareLink(
      user: User,
      designId: string,
      input: z.output<typeof createShareLinkRequestSchema>,
    ): Promise<CreateShareLinkResponse> {
      const { design } = await designFor(user, designId, 'share.manage');
      if (input.version !== null && input.version > design.latestVersion)
        throw versionNotFound(input.version);
      const now = clock.now();
      const expiresAt = input.expiresAt === null ? null : new Date(input.expiresAt);
      if (expiresAt && expiresAt <= now)
        throw badRequest('The link would already have expired.', { expiresAt: 'must be in the future' });
      const { token, hash } = await createToken();
      const id = randomUUID();
      await repository.insertShareLink({
        id,
        tokenHash: hash,
        designId,
        version: input.version,
        expiresAt,
        createdBy: user.id,
        createdAt: now,
      });
      const link = (await listShareLinks(user, designId)).find((l) => l.id === id);
      if (!link) throw new Error('share link vanished after insert');
      return { link, token, path: `/share/${token}` };
    },

    async revokeShareLink(user: User, designId: string, linkId: string): Promise<void> {
      await designFor(user, designId, 'share.manage');
      if (!(await repository.revokeShareLink(designId, linkId, clock.now())))
        throw notFound('No such share link.');
    },

    /** Signed out: the token is the credential, and it opens exactly one version. */
    async shared(token: string): Promise<SharedVersionResponse> {
      const found = await repository.shareLinkByTokenHash(await hashToken(token));
      const now = clock.now();
      if (!found || found.link.revokedAt || (found.link.expiresAt && found.link.expiresAt <= now))
        throw shareGone();
      const n = found.link.version ?? found.latestVersion;
      const version = await repository.version(found.link.designId, n);
      if (!version) throw shareGone();
      return {
        title: found.title,
        pinned: found.link.version !== null,
        expiresAt: found.link.expiresAt?.toISOString() ?? null,
        version: {
          number: version.number,
          message: version.message,
          createdAt: version.createdAt.toISOString(),
          params: version.params as Design,
          notes: version.notes,
          summary: version.summary,
        },
      };
    },

    async exportFile(user: User, designId: string): Promise<NotebookFile> {
      const { design } = await designFor(user, designId, 'designs.read');
      const versions = await repository.allVersions(designId);
      return {
        kind: notebookFileKind,
        formatVersion: notebookFormatVersion,
        exportedAt: clock.now().toISOString(),
        title: design.title,
        tags: design.tags,
        baselineVersion: design.baselineVersion,
        clonedFrom:
          design.clonedFromTitle !== null && design.clonedFromVersion !== null
            ? { title: design.clonedFromTitle, version: design.clonedFromVersion }
            : null,
        versions: versions.map((v) => ({
          number: v.number,
          message: v.message,
          notes: v.notes,
          params: v.params as Design,
          parentNumber: v.parentNumber,
          createdAt: v.createdAt.toISOString(),
          authorName: v.authorName,
        })),
      };
    },

    /** The file was validated whole by the router; every version goes in one transaction or none does. */
    async importFile(user: User, teamId: string, file: NotebookFile): Promise<NotebookWithVersionResponse> {
      await teamAccess.require(teamId, user.id, 'designs.edit');
      return insertNotebook(
        user,
        teamId,
        {
          title: file.title,
          tags: file.tags,
          baselineVersion: file.baselineVersion,
          clonedFrom: file.clonedFrom ? { designId: null, ...file.clonedFrom } : null,
        },
        file.versions.map((v) => ({
          ...v,
          params: designSchema.parse(v.params),
          createdAt: new Date(v.createdAt),
        })),
      );
    },
  };
}

export type NotebooksService = ReturnType<typeof createNotebooksService>;
