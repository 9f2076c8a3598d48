/** What the server benchmarks share: a seeded database on either engine. */
import { randomBytes, randomUUID } from 'node:crypto';
import pg from 'pg';
import { openDatabase, type OpenOptions } from '../db/client';
import { systemClock } from '../server/clock';
import { createNotebooksRepository } from '../server/notebooks/repository';
import { summarizeVersion } from '../server/notebooks/summary';
import { demoTeamName, demoUsers, seedDemoData } from '../server/seed/demo';
import { exampleDesign, type Design } from '../shared/design';

export const withSlits = (widthUm: number): Design => ({
  ...exampleDesign,
  slits: { ...exampleDesign.slits, entranceWidthUm: widthUm, exitWidthUm: widthUm },
});

/**
 * The demo data plus `extraDesigns` designs in the demo team (a list with paging), each at
 * version 1; the first `leased` of them are returned for saves, one per connection.
 */
export async function seedBenchData(options: OpenOptions, extraDesigns: number, leased: number): Promise<{ saveDesignIds: string[] }> {
  const database = await openDatabase(options);
  try {
    await seedDemoData({ database, clock: systemClock });
    const [team] = await database.db.query.teams.findMany({ where: (t, { eq }) => eq(t.name, demoTeamName) });
    const owner = await database.db.query.users.findFirst({
      where: (u, { eq }) => eq(u.email, demoUsers[0].email),
    });
    if (!team || !owner) throw new Error('demo data missing after seeding');
    const repository = createNotebooksRepository(database.db);
    const now = Date.now();
    const saveDesignIds: string[] = [];
    for (let i = 0; i < extraDesigns; i++) {
      const id = randomUUID();
      const params = withSlits(20 + i * 5);
      const at = new Date(now - i * 60_000);
      await repository.inTransaction((repo) =>
        repo.insertDesign(
          {
            id,
            teamId: team.id,
            title: `Bench design ${String(i).padStart(2, '0')}`,
            tags: i % 3 ? ['bench'] : ['bench', 'uv'],
            createdBy: owner.id,
            latestVersion: 1,
            createdAt: at,
            updatedAt: at,
          },
          [
            {
              id: randomUUID(),
              designId: id,
              number: 1,
              params,
              notes: 'Bench.',
              message: 'Start',
              authorId: owner.id,
              parentNumber: null,
              summary: summarizeVersion(params),
              createdAt: at,
            },
          ],
        ),
      );
      if (saveDesignIds.length < leased) saveDesignIds.push(id);
    }
    return { saveDesignIds };
  } finally {
    await database.close();
  }
}

/**
 * A new, empty database on the PostgreSQL server `adminUrl` points at (a superuser's URL, as the
 * throwaway cluster's), and `drop` for when every connection to it is closed.
 */
export async function createServerDatabase(adminUrl: string, prefix: string): Promise<{ url: string; drop(): Promise<void> }> {
  const name = `${prefix}_${randomBytes(5).toString('hex')}`;
  const admin = async (sql: string) => {
    const client = new pg.Client({ connectionString: adminUrl });
    await client.connect();
    try {
      await client.query(sql);
    } finally {
      await client.end();
    }
  };
  await admin(`create database ${name}`);
  const url = new URL(adminUrl);
  url.pathname = `/${name}`;
  return { url: url.toString(), drop: () => admin(`drop database if exists ${name} with (force)`) };
}
