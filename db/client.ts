import { PGlite } from '@electric-sql/pglite';
import { sql } from 'drizzle-orm';
import type { PgDatabase, PgQueryResultHKT } from 'drizzle-orm/pg-core';
import { drizzle } from 'drizzle-orm/pglite';
import { migrate } from 'drizzle-orm/pglite/migrator';
import { fileURLToPath } from 'node:url';
import * as schema from './schema';

/**
 * Repositories depend on this driver-neutral type, so a PostgreSQL server can replace PGlite by
 * changing only this file.
 */
export type Database = PgDatabase<PgQueryResultHKT, typeof schema>;

export type DatabaseHandle = {
  db: Database;
  /** Round-trips a trivial query; false when the database does not answer. */
  ping(): Promise<boolean>;
  /** Flushes and closes; after this nothing may use `db`. */
  close(): Promise<void>;
};

export type OpenOptions =
  /** Persisted to a directory (default `./data`). */
  | { dataDir: string }
  /** Lives in memory only: tests. `loadDataDir` starts from a dump of an already-migrated database. */
  | { memory: true; loadDataDir?: Blob | File };

export const migrationsFolder = fileURLToPath(new URL('./migrations', import.meta.url));

/** Opens the database and brings its schema up to date with the committed migrations. */
export async function openDatabase(options: OpenOptions): Promise<DatabaseHandle> {
  if (process.env.DATABASE_URL) {
    throw new Error(
      'DATABASE_URL is set, but this build only ships the embedded database. Unset DATABASE_URL to use DATA_DIR.',
    );
  }
  const client =
    'dataDir' in options
      ? await PGlite.create({ dataDir: options.dataDir })
      : await PGlite.create(options.loadDataDir ? { loadDataDir: options.loadDataDir } : {});
  const db = drizzle({ client, schema, casing: 'snake_case' });
  await migrate(db, { migrationsFolder });
  return {
    db: db as unknown as Database,
    async ping() {
      try {
        await db.execute(sql`select 1`);
        return true;
      } catch {
        return false;
      }
    },
    async close() {
      if (!client.closed) await client.close();
    },
  };
}

/** Dumps an in-memory database (for the test template that every API test starts from). */
export async function dumpMigratedTemplate(): Promise<Blob> {
  const client = await PGlite.create();
  await migrate(drizzle({ client, casing: 'snake_case' }), { migrationsFolder });
  const dump = await client.dumpDataDir('none');
  await client.close();
  return dump;
}
