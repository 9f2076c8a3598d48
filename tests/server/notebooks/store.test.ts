import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { DatabaseHandle } from '../../../db/client';
import { memberships, teams, users } from '../../../db/schema';
import { exampleDesign } from '../../../shared/design';
import { createNotebooksRepository, type NotebooksRepository } from '../../../server/notebooks/repository';
import { createNotebooksStore, type NotebooksStore } from '../../../server/notebooks/store';
import { createTeamsRepository } from '../../../server/teams/repository';
import { createRoleDirectory } from '../../../server/teams/roles';
import { openTestDatabase } from '../../support/test-db';
import { designWith } from './fixture';

/**
 * The store remembers answers; its writes forget what they change. Each case reads through the
 * store twice (so the answer is remembered), writes through one of the store's writes, and reads
 * again: the answer must be what a store with nothing remembered gives on the same database.
 */
let database: DatabaseHandle;
let store: NotebooksStore;
/** The repository calls the store made, by method name, since the last `calls.length = 0`. */
const calls: string[] = [];

const teamId = 'team-store';
const owner = { id: 'user-owner', displayName: 'Owner' };
const at = new Date('2026-03-14T09:00:00Z');
const later = new Date('2026-03-14T10:00:00Z');
const listFilter = {
  teamId,
  sort: 'updated',
  dir: 'desc',
  archived: 'exclude',
  limit: 50,
  offset: 0,
} as const;

/** The repository's methods that change the database; the store may call these only from `writes`. */
const repositoryWrites = ['inTransaction', 'insertDesign', 'saveManyIfLatest', 'updateDesign', 'insertShareLink', 'revokeShareLink', 'insertFileReview'];
const repositoryReads = [
  'designForUser',
  'versionForUser',
  'version',
  'versionHeaders',
  'allVersions',
  'teamOfDesign',
  'personalTeamOf',
  'listDesigns',
  'teamTags',
  'shareLinks',
  'shareLinkByTokenHash',
  'fileReview',
];

function recorded(repository: NotebooksRepository): NotebooksRepository {
  return new Proxy(repository, {
    get(target, name, receiver) {
      const value = Reflect.get(target, name, receiver);
      if (typeof value !== 'function') return value;
      return (...args: unknown[]) => {
        calls.push(String(name));
        return value.apply(target, args);
      };
    },
  });
}

/** A store with nothing remembered, on the same database: what a fresh answer is. */
const freshStore = () =>
  createNotebooksStore({
    repository: createNotebooksRepository(database.db),
    roles: createRoleDirectory(createTeamsRepository(database.db)),
  });

const newDesign = (title: string, tags: string[] = []) =>
  store.writes.insertDesign({ teamId, title, tags, createdBy: owner.id, createdAt: at }, [
    { params: exampleDesign, notes: '', message: 'First', authorId: owner.id, parentNumber: null, createdAt: at },
  ]);

type Case = {
  /** Anything the write needs that must exist before the first read. */
  setup?: () => Promise<void>;
  read: (from: NotebooksStore) => Promise<unknown>;
  write: () => Promise<unknown>;
};

/** One case per write of the store; the type makes a new write fail to compile until it has one. */
function casesFor(): Record<keyof NotebooksStore['writes'], Case> {
  let designId = '';
  let linkId = '';
  const onDesign = async () => {
    designId = await newDesign('Subject');
  };
  const page = (from: NotebooksStore) => from.listPage(listFilter, 'owner', 1);
  return {
    insertDesign: { read: page, write: () => newDesign('Added', ['added']) },
    saveVersion: {
      setup: onDesign,
      read: async (from) => ({ page: await page(from), v2: await from.versionForUser(designId, 2, owner.id) }),
      write: () =>
        store.writes.saveVersion(
          designId,
          1,
          { params: designWith({ slits: { exitWidthUm: 40 } }), notes: 'Narrower.', message: 'Second', createdAt: later },
          owner,
        ),
    },
    updateDesign: {
      setup: onDesign,
      read: page,
      write: () => store.writes.updateDesign(designId, { title: 'Renamed', tags: ['renamed'], updatedAt: later }),
    },
    insertShareLink: {
      setup: onDesign,
      read: (from) => from.shareLinks(designId, at),
      write: () =>
        store.writes.insertShareLink({ tokenHash: 'hash-1', designId, version: 1, expiresAt: null, createdBy: owner.id, createdAt: at }),
    },
    revokeShareLink: {
      setup: async () => {
        await onDesign();
        linkId = await store.writes.insertShareLink({
          tokenHash: 'hash-2',
          designId,
          version: null,
          expiresAt: null,
          createdBy: owner.id,
          createdAt: at,
        });
      },
      read: (from) => from.shareLinks(designId, at),
      write: () => store.writes.revokeShareLink(designId, linkId, later),
    },
  };
}

beforeAll(async () => {
  database = await openTestDatabase();
  await database.db.insert(users).values({ ...owner, email: 'owner@example.com', passwordHash: 'not used' });
  await database.db.insert(teams).values({ id: teamId, name: 'Store lab', createdAt: at });
  await database.db.insert(memberships).values({ teamId, userId: owner.id, role: 'owner', joinedAt: at });
  store = createNotebooksStore({
    repository: recorded(createNotebooksRepository(database.db)),
    roles: createRoleDirectory(createTeamsRepository(database.db)),
  });
}, 30_000);
afterAll(() => database?.close());

describe('the notebooks store', () => {
  const cases = casesFor();

  it.each(Object.entries(cases))('answers fresh after %s', async (_write, c) => {
    await c.setup?.();
    await c.read(store);
    const before = await c.read(store);
    calls.length = 0;
    await c.write();
    expect(calls.some((name) => repositoryWrites.includes(name))).toBe(true);
    const after = await c.read(store);
    expect(after).toEqual(await c.read(freshStore()));
    // The write really changed what was read, so the case proves something.
    expect(after).not.toEqual(before);
  });

  it('declares every write in its table, each with what it makes stale', () => {
    expect(Object.keys(store.writes).sort()).toEqual(Object.keys(cases).sort());
    for (const write of Object.values(store.writes)) expect(write.changed).toBeTypeOf('function');
  });

  it('never writes from a read', async () => {
    const designId = await newDesign('Read only');
    const reads = {
      design: () => store.design(designId, owner.id),
      roleOn: () => store.roleOn(designId, owner.id),
      versionForUser: () => store.versionForUser(designId, 1, owner.id),
      version: () => store.version(designId, 1),
      listPage: () => store.listPage(listFilter, 'owner', 1),
      versionHeaders: () => store.versionHeaders(designId),
      fileVersions: () => store.fileVersions(designId),
      fileReview: () => store.fileReview(designId),
      shareLinks: () => store.shareLinks(designId, at),
      personalTeamOf: () => store.personalTeamOf(owner.id),
      shareLinkByTokenHash: () => store.shareLinkByTokenHash('no such hash'),
      // `forgetTeamLists` is no read either: it is the door for changes made outside the store (review states).
    } satisfies Record<Exclude<keyof NotebooksStore, 'writes' | 'forgetTeamLists'>, () => Promise<unknown>>;
    expect(Object.keys(store).filter((name) => name !== 'writes' && name !== 'forgetTeamLists').sort()).toEqual(Object.keys(reads).sort());
    calls.length = 0;
    for (const read of Object.values(reads)) await read();
    expect(calls.filter((name) => repositoryWrites.includes(name))).toEqual([]);
  });

  it('knows every repository method as a read or a write, so a new write is reached only through `writes`', () => {
    const methods = Object.keys(createNotebooksRepository(database.db)).sort();
    expect(methods).toEqual([...repositoryReads, ...repositoryWrites].sort());
  });
});
