import { PGlite } from '@electric-sql/pglite';
import { sql } from 'drizzle-orm';
import type { PgDatabase, PgQueryResultHKT } from 'drizzle-orm/pg-core';
import { drizzle } from 'drizzle-orm/pglite';
import { migrate } from 'drizzle-orm/pglite/migrator';
import { existsSync, readdirSync, rmSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { lockDataDir, lockFileName } from './data-dir-lock';
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
  // Another process on the same directory would write the same files (see data-dir-lock.ts).
  const lock = 'dataDir' in options ? lockDataDir(options.dataDir) : null;
  const client = await (
    'dataDir' in options
      ? PGlite.create({ dataDir: options.dataDir })
      : PGlite.create(options.loadDataDir ? { loadDataDir: options.loadDataDir } : {})
  ).catch((error: unknown) => {
    lock?.release();
    throw error;
  });
  const db = drizzle({ client, schema, casing: 'snake_case' });
  try {
    await migrate(db, { migrationsFolder });
  } catch (error) {
    await client.close();
    lock?.release();
    throw error;
  }
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
      lock?.release();
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

/**
 * A consistent copy of the on-disk database in `dataDir`, as the gzipped tarball that
 * `restoreDataDir` (or PGlite's `loadDataDir`) reads. Opens the directory alone — it refuses while
 * another process has it open — and changes nothing in it beyond what opening does (crash recovery,
 * a checkpoint); migrations are not applied, so the copy is the database as it was.
 */
export async function dumpDataDir(dataDir: string): Promise<Blob> {
  if (!existsSync(path.join(dataDir, 'PG_VERSION'))) {
    throw new Error(`There is no database in ${dataDir}: nothing to back up.`);
  }
  const lock = lockDataDir(dataDir);
  try {
    const client = await PGlite.create({ dataDir });
    try {
      // Writes every changed page to the data files, so the copy needs no WAL replay on restore.
      await client.exec('CHECKPOINT');
      return await client.dumpDataDir('gzip');
    } finally {
      await client.close();
    }
  } finally {
    lock.release();
  }
}

/**
 * Writes the database in `dump` (from `dumpDataDir`) into `dataDir`, which must be missing or
 * empty, and checks that it is one of ours. On failure the directory is emptied again. The server
 * applies any newer migrations when it next starts.
 */
export async function restoreDataDir(dataDir: string, dump: Blob): Promise<void> {
  if (existsSync(dataDir) && readdirSync(dataDir).length > 0) {
    throw new Error(
      `${dataDir} is not empty: a restore never writes over a database. Restore into a new or empty directory (move this one aside first to replace it).`,
    );
  }
  const lock = lockDataDir(dataDir);
  let restored = false;
  try {
    let client: PGlite;
    try {
      client = await PGlite.create({ dataDir, loadDataDir: dump });
    } catch (error) {
      throw new Error(`This file is not a database backup PGlite can read (${(error as Error).message}).`);
    }
    try {
      await client.query('select count(*) from drizzle.__drizzle_migrations');
    } catch {
      throw new Error('This file holds a database, but not a Blazebook one (it has no migration history).');
    } finally {
      await client.close();
    }
    restored = true;
  } finally {
    if (!restored) {
      for (const entry of readdirSync(dataDir)) {
        if (entry !== lockFileName) rmSync(path.join(dataDir, entry), { recursive: true, force: true });
      }
    }
    lock.release();
  }
}
