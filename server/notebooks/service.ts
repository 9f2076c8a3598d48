import type { User } from '../../shared/auth';
import { storedDesignSchema } from '../../shared/design';
import {
  notebookFileKind,
  notebookFormatVersion,
  versionConflictCode,
  type CompareResponse,
  type CreateShareLinkResponse,
  type DesignListResponse,
  type Notebook,
  type NotebookFile,
  type NotebookFileReview,
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
import type { Capability } from '../../shared/teams';
import type { z } from 'zod';
import { createToken, hashToken } from '../auth/index';
import type { Clock } from '../clock';
import { HttpError, badRequest, conflict, notFound } from '../http/errors';
import { allow, createTeamAccess, type RoleDirectory } from '../teams/index';
import { changedParameters, figureChanges } from './compare';
import type { ListFilter } from './repository';
import type { NewDesign, NewVersion, NotebooksStore } from './store';

/** Outsiders and made-up ids get the same words, here and on a version's reviews. */
export const designNotFound = () => notFound('No such design.');
export const versionNotFound = (n: number) => notFound(`This design has no version ${n}.`);
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

export type NotebooksServiceDeps = { store: NotebooksStore; roles: RoleDirectory; clock: Clock };

/** Who may do what to a design and its versions; the data and its memory are the store's. */
export function createNotebooksService({ store, roles, clock }: NotebooksServiceDeps) {
  const teamAccess = createTeamAccess(roles);

  /** The design as the caller sees it, once they may do `capability` to it. */
  async function designFor(user: User, designId: string, capability: Capability): Promise<Notebook> {
    const found = await store.design(designId, user.id);
    const role = allow(found?.role, capability, designNotFound);
    return { ...found!.design, role };
  }

  async function withVersion(user: User, designId: string, n: number): Promise<NotebookWithVersionResponse> {
    const design = await designFor(user, designId, 'designs.read');
    const version = await store.version(designId, n);
    if (!version) throw versionNotFound(n);
    return { design, version };
  }

  async function openShare(token: string) {
    const found = await store.shareLinkByTokenHash(await hashToken(token));
    const now = clock.now();
    if (!found || found.link.revokedAt || (found.link.expiresAt && found.link.expiresAt <= now)) throw shareGone();
    const version = await store.version(found.link.designId, found.link.version ?? found.latestVersion);
    if (!version) throw shareGone();
    return {
      designId: found.link.designId,
      title: found.title,
      pinned: found.link.version !== null,
      expiresAt: found.link.expiresAt?.toISOString() ?? null,
      version,
    };
  }

  /** A new design with its versions, all by `user` (and an imported file's review), in one transaction. */
  async function insertNotebook(
    user: User,
    design: Omit<NewDesign, 'createdBy' | 'createdAt'>,
    versions: (Omit<NewVersion, 'authorId' | 'createdAt'> & { createdAt?: Date })[],
    review?: NotebookFileReview,
  ): Promise<NotebookWithVersionResponse> {
    const now = clock.now();
    const id = await store.writes.insertDesign(
      { ...design, createdBy: user.id, createdAt: now },
      versions.map((v) => ({ ...v, authorId: user.id, createdAt: v.createdAt ?? now })),
      review,
    );
    return withVersion(user, id, versions.length);
  }

  async function listShareLinks(user: User, designId: string): Promise<ShareLink[]> {
    await designFor(user, designId, 'share.manage');
    return store.shareLinks(designId, clock.now());
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
        review: query.review,
        sort: query.sort,
        dir: query.dir ?? (query.sort === 'updated' ? 'desc' : 'asc'),
        archived: query.archived,
        limit: query.pageSize,
        offset: (query.page - 1) * query.pageSize,
      };
      return store.listPage(filter, role, query.page);
    },

    async create(
      user: User,
      teamId: string,
      input: z.output<typeof createDesignRequestSchema>,
    ): Promise<NotebookWithVersionResponse> {
      await teamAccess.require(teamId, user.id, 'designs.edit');
      const { title, tags } = input;
      return insertNotebook(user, { teamId, title, tags }, [{ ...input, parentNumber: null }]);
    },

    async get(user: User, designId: string): Promise<NotebookWithVersionResponse> {
      const design = await designFor(user, designId, 'designs.read');
      return withVersion(user, designId, design.latestVersion);
    },

    async update(
      user: User,
      designId: string,
      patch: z.output<typeof updateDesignRequestSchema>,
    ): Promise<Notebook> {
      await designFor(user, designId, 'designs.edit');
      await store.writes.updateDesign(designId, { ...patch, updatedAt: clock.now() });
      return designFor(user, designId, 'designs.read');
    },

    async versions(user: User, designId: string): Promise<VersionHeader[]> {
      await designFor(user, designId, 'designs.read');
      return store.versionHeaders(designId);
    },

    async version(user: User, designId: string, n: number): Promise<VersionResponse> {
      const found = await store.versionForUser(designId, n, user.id);
      if (!found) {
        // Tell "no such version" from "no such design" only to members.
        await designFor(user, designId, 'designs.read');
        throw versionNotFound(n);
      }
      allow(found.role, 'designs.read', designNotFound);
      return found.answer;
    },

    /**
     * Saves version latest+1 on top of `baseVersion`. The store moves the design's latest number
     * only if it still is the base, in the statement that inserts the version, and (design,
     * number) is unique, so two saves on one base cannot both win; the loser gets a 409 with the
     * version that beat it.
     */
    async save(
      user: User,
      designId: string,
      input: z.output<typeof saveVersionRequestSchema>,
    ): Promise<NotebookWithVersionResponse> {
      const role = allow(await store.roleOn(designId, user.id), 'designs.edit', designNotFound);
      const { baseVersion, ...content } = input;
      const at = clock.now();
      const saved = await store.writes.saveVersion(designId, baseVersion, { ...content, createdAt: at }, user);
      if (saved) return { design: { ...saved.design, role }, version: saved.version };
      // Refused: say why, from the design as it is now.
      const design = await designFor(user, designId, 'designs.edit');
      if (design.archived) throw conflict('This design is archived. Restore it before saving a new version.');
      if (input.baseVersion > design.latestVersion)
        throw badRequest('The base version does not exist.', { baseVersion: `must be at most ${design.latestVersion}` });
      const latest = await store.version(designId, design.latestVersion);
      if (!latest) throw designNotFound();
      throw versionConflict(latest);
    },

    async compare(
      user: User,
      designId: string,
      a: number | undefined,
      b: number | undefined,
    ): Promise<CompareResponse> {
      const design = await designFor(user, designId, 'designs.read');
      const bNumber = b ?? design.latestVersion;
      const after = await store.version(designId, bNumber);
      if (!after) throw versionNotFound(bNumber);
      const aNumber = a ?? after.parentNumber ?? after.number;
      const before = await store.version(designId, aNumber);
      if (!before) throw versionNotFound(aNumber);
      return {
        a: before,
        b: after,
        // jsonb keeps keys in its own order; re-parsing puts them back in the schema's order.
        changes: changedParameters(storedDesignSchema.parse(before.params), storedDesignSchema.parse(after.params)),
        figures: figureChanges(before.summary, after.summary),
      };
    },

    /** Any member may clone out; the target must be a team where the caller is owner. */
    async clone(
      user: User,
      designId: string,
      input: z.output<typeof cloneRequestSchema>,
    ): Promise<NotebookWithVersionResponse> {
      const design = await designFor(user, designId, 'designs.clone');
      const n = input.version ?? design.latestVersion;
      const source = await store.version(designId, n);
      if (!source) throw versionNotFound(n);
      const targetTeamId = input.teamId ?? (await store.personalTeamOf(user.id));
      if (!targetTeamId) throw notFound('You have no personal workspace to clone into.');
      await teamAccess.require(targetTeamId, user.id, 'designs.edit');
      const clonedFrom = { designId, title: design.title, version: n };
      const message = `Cloned from “${design.title}” v${n}`;
      return insertNotebook(
        user,
        { teamId: targetTeamId, title: input.title ?? design.title, tags: design.tags, clonedFrom },
        [{ params: source.params, notes: source.notes, message, parentNumber: null }],
      );
    },

    async setBaseline(user: User, designId: string, version: number | null): Promise<Notebook> {
      const design = await designFor(user, designId, 'designs.edit');
      if (version !== null && version > design.latestVersion) throw versionNotFound(version);
      await store.writes.updateDesign(designId, { baselineVersion: version });
      return designFor(user, designId, 'designs.read');
    },

    shareLinks: listShareLinks,

    async createShareLink(
      user: User,
      designId: string,
      input: z.output<typeof createShareLinkRequestSchema>,
    ): Promise<CreateShareLinkResponse> {
      const design = await designFor(user, designId, 'share.manage');
      if (input.version !== null && input.version > design.latestVersion)
        throw versionNotFound(input.version);
      const now = clock.now();
      const expiresAt = input.expiresAt === null ? null : new Date(input.expiresAt);
      if (expiresAt && expiresAt <= now)
        throw badRequest('The link would already have expired.', { expiresAt: 'must be in the future' });
      const { token, hash } = await createToken();
      const id = await store.writes.insertShareLink({
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
      if (!(await store.writes.revokeShareLink(designId, linkId, clock.now())))
        throw notFound('No such share link.');
    },

    /** Signed out: the token is the credential, and it opens exactly one version. */
    async shared(token: string): Promise<SharedVersionResponse> {
      const { title, pinned, expiresAt, version } = await openShare(token);
      const { number, message, createdAt, params, notes, summary } = version;
      return { title, pinned, expiresAt, version: { number, message, createdAt, params, notes, summary } };
    },

    /** A design with one of its versions, for a member who may read it (the design sheet's door). */
    versionWithDesign: withVersion,

    /** What a live share link opens, with the design's id (for the design sheet); 404 `share_gone` otherwise. */
    openShare,

    async exportFile(user: User, designId: string): Promise<NotebookFile> {
      const design = await designFor(user, designId, 'designs.read');
      return {
        kind: notebookFileKind,
        formatVersion: notebookFormatVersion,
        exportedAt: clock.now().toISOString(),
        title: design.title,
        tags: design.tags,
        baselineVersion: design.baselineVersion,
        clonedFrom: design.clonedFrom && { title: design.clonedFrom.title, version: design.clonedFrom.version },
        versions: await store.fileVersions(designId),
        review: await store.fileReview(designId),
      };
    },

    /**
     * The file was validated whole by the router; every version, thread and decision goes in one
     * transaction or none does. Review rows keep the file's names and no person ids.
     */
    async importFile(user: User, teamId: string, file: NotebookFile): Promise<NotebookWithVersionResponse> {
      await teamAccess.require(teamId, user.id, 'designs.edit');
      return insertNotebook(
        user,
        {
          teamId,
          title: file.title,
          tags: file.tags,
          baselineVersion: file.baselineVersion,
          clonedFrom: file.clonedFrom ? { designId: null, ...file.clonedFrom } : null,
          // The file keeps its title: the list and the header tell the copy apart by this mark.
          imported: true,
        },
        file.versions.map((v) => ({
          ...v,
          params: storedDesignSchema.parse(v.params),
          createdAt: new Date(v.createdAt),
        })),
        file.review,
      );
    },
  };
}

export type NotebooksService = ReturnType<typeof createNotebooksService>;
