import { PGlite } from '@electric-sql/pglite';
import { sql } from 'drizzle-orm';
import type { PgDatabase, PgQueryResultHKT } from 'drizzle-orm/pg-core';
import { drizzle as drizzleServer } from 'drizzle-orm/node-postgres';
import { migrate as migrateServer } from 'drizzle-orm/node-postgres/migrator';
import { drizzle } from 'drizzle-orm/pglite';
import { migrate } from 'drizzle-orm/pglite/migrator';
import { existsSync, readdirSync, rmSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import pg from 'pg';
import { lockDataDir, lockFileName } from './data-dir-lock';
import * as schema from './schema';

/**
 * Repositories depend on this driver-neutral type: PGlite (embedded) and node-postgres (a
 * PostgreSQL server) both stand behind it, and only this file knows which.
 */
export type Database = PgDatabase<PgQueryResultHKT, typeof schema>;

/**
 * `embedded`: PGlite in this process, which owns the database alone (one process, one writer).
 * `server`: a PostgreSQL server that several API processes may share.
 */
export type Engine = 'embedded' | 'server';

export type DatabaseHandle = {
  db: Database;
  engine: Engine;
  /** Round-trips a trivial query; false when the database does not answer. */
  ping(): Promise<boolean>;
  /** Flushes and closes; after this nothing may use `db`. */
  close(): Promise<void>;
};

export type OpenOptions =
  /** Persisted to a directory (default `./data`). */
  | { dataDir: string }
  /** Lives in memory only: tests. `loadDataDir` starts from a dump of an already-migrated database. */
  | { memory: true; loadDataDir?: Blob | File }
  /** A PostgreSQL server (`DATABASE_URL`), e.g. `postgres://blazebook@127.0.0.1:5432/blazebook`. */
  | { url: string; poolSize?: number };

export const migrationsFolder = fileURLToPath(new URL('./migrations', import.meta.url));

/** Opens the database and brings its schema up to date with the committed migrations. */
export async function openDatabase(options: OpenOptions): Promise<DatabaseHandle> {
  if ('url' in options) return openServerDatabase(options.url, options.poolSize);
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
    engine: 'embedded',
    ping: () => pinged(db as unknown as Database),
    async close() {
      if (!client.closed) await client.close();
      lock?.release();
    },
  };
}

async function pinged(db: Database): Promise<boolean> {
  try {
    await db.execute(sql`select 1`);
    return true;
  } catch {
    return false;
  }
}

/** Any number will do as long as nothing else on the server uses it: "BLAZ" in ASCII. */
const migrationLockKey = 0x424c415a;

/**
 * A pool on a PostgreSQL server, with the same schema and migrations as the embedded database.
 * Several API processes may start at once: each migrates under one advisory lock, so the first
 * applies the migrations and the others find them applied.
 */
async function openServerDatabase(url: string, poolSize = 10): Promise<DatabaseHandle> {
  const pool = new pg.Pool({ connectionString: url, max: poolSize, application_name: 'blazebook' });
  // An idle connection the server dropped (a restart) is an error on the pool, not a crash: the
  // pool opens a new one for the next query.
  pool.on('error', (error) => console.error(`PostgreSQL dropped an idle connection: ${error.message}`));
  try {
    const client = await pool.connect();
    try {
      await client.query('select pg_advisory_lock($1)', [migrationLockKey]);
      try {
        await migrateServer(drizzleServer({ client, casing: 'snake_case' }), { migrationsFolder });
      } finally {
        await client.query('select pg_advisory_unlock($1)', [migrationLockKey]);
      }
    } finally {
      client.release();
    }
  } catch (error) {
    await pool.end();
    throw new Error(`Could not open the PostgreSQL database at ${redacted(url)}: ${(error as Error).message}`, { cause: error });
  }
  const db = drizzleServer({ client: pool, schema, casing: 'snake_case' }) as unknown as Database;
  let closed = false;
  return {
    db,
    engine: 'server',
    ping: () => pinged(db),
    async close() {
      if (closed) return;
      closed = true;
      await pool.end();
    },
  };
}

/** The URL without its password, for messages and logs. */
export function redacted(url: string): string {
  try {
    const parsed = new URL(url);
    if (parsed.password) parsed.password = '***';
    return parsed.toString();
  } catch {
    return '(a DATABASE_URL that is not a URL)';
  }
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
