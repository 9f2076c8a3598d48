import { execFile } from 'node:child_process';
import { cpSync, existsSync, mkdtempSync, readdirSync, rmSync, statSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { asc } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import { openDatabase, type DatabaseHandle } from '../../db/client';
import { users } from '../../db/schema';

const rootDir = fileURLToPath(new URL('../..', import.meta.url));
const scratch = mkdtempSync(path.join(tmpdir(), 'blazebook-backup-'));
const sourceDir = path.join(scratch, 'data');
const backupsDir = path.join(scratch, 'backups');

type Run = { code: number | null; stdout: string; stderr: string };

/** Runs `npm run backup` / `npm run restore` as their scripts, with DATA_DIR set. */
function run(script: 'backup' | 'restore', args: string[], dataDir: string, env: Record<string, string> = {}): Promise<Run> {
  return new Promise((resolve) => {
    execFile(
      process.execPath,
      ['--import', 'tsx', `scripts/${script}.ts`, ...args],
      { cwd: rootDir, env: { ...process.env, DATA_DIR: dataDir, ...env }, timeout: 180_000 },
      (error, stdout, stderr) =>
        resolve({ code: error ? (typeof error.code === 'number' ? error.code : null) : 0, stdout, stderr }),
    );
  });
}

const rows = [
  {
    id: 'u-backup-1',
    email: 'first@example.com',
    displayName: 'First Keeper',
    passwordHash: 'not-a-real-hash-1',
  },
  {
    id: 'u-backup-2',
    email: 'second@example.com',
    displayName: 'Second Keeper',
    passwordHash: 'not-a-real-hash-2',
  },
];

async function readUsers(dataDir: string) {
  const database = await openDatabase({ dataDir });
  try {
    return await database.db
      .select({
        id: users.id,
        email: users.email,
        displayName: users.displayName,
        passwordHash: users.passwordHash,
      })
      .from(users)
      .orderBy(asc(users.id));
  } finally {
    await database.close();
  }
}

describe('npm run backup and npm run restore', { timeout: 240_000 }, () => {
  let source: DatabaseHandle | undefined;

  beforeAll(async () => {
    // The migrated template's data directory, as a first start would leave it, without the initdb.
    cpSync(inject('dataDirTemplate'), sourceDir, { recursive: true });
    source = await openDatabase({ dataDir: sourceDir });
    await source.db.insert(users).values(rows);
  }, 240_000);

  afterAll(async () => {
    await source?.close();
    rmSync(scratch, { recursive: true, force: true });
  });

  it('refuses to back up a data directory another process has open, and says to stop the server', async () => {
    const result = await run('backup', [backupsDir + path.sep], sourceDir);
    expect(result.code).toBe(1);
    expect(result.stderr).toContain(`The data directory ${sourceDir} is in use by process ${process.pid}`);
    expect(result.stderr).toContain('stop it, run npm run backup, start it again');
    expect(existsSync(backupsDir)).toBe(false);
  });

  it('backs up to a timestamped file, restores it into a new directory, and the rows read back', async () => {
    await source?.close();
    source = undefined;

    const backup = await run('backup', [backupsDir + path.sep], sourceDir);
    expect(backup.stderr).toBe('');
    expect(backup.code).toBe(0);
    const files = readdirSync(backupsDir);
    // Only the finished file: the temporary one was renamed into place.
    expect(files).toEqual([expect.stringMatching(/^blazebook-\d{4}-\d\d-\d\dT\d\d-\d\d-\d\dZ\.tar\.gz$/)]);
    const file = path.join(backupsDir, files[0]!);
    const { size } = statSync(file);
    expect(backup.stdout).toContain(`Backed up ${sourceDir} to ${file} (`);
    expect(backup.stdout).toContain(`${size.toLocaleString('en')} bytes`);

    const target = path.join(scratch, 'restored', 'data');
    const restore = await run('restore', [file], target);
    expect(restore.stderr).toBe('');
    expect(restore.code).toBe(0);
    expect(restore.stdout).toContain(`Restored ${file} into ${target}`);
    expect(await readUsers(target)).toEqual(rows);
  });

  it('writes a backup to the file named, replacing an older one there', async () => {
    const file = path.join(scratch, 'named', 'latest.tar.gz');
    const first = await run('backup', [file], sourceDir);
    expect(first.code).toBe(0);
    const second = await run('backup', [file], sourceDir);
    expect(second.code).toBe(0);
    expect(readdirSync(path.dirname(file))).toEqual(['latest.tar.gz']);
  });

  it('refuses to restore into a data directory that is not empty, and leaves it as it was', async () => {
    const file = path.join(backupsDir, readdirSync(backupsDir)[0]!);
    const before = readdirSync(sourceDir);
    const result = await run('restore', [file], sourceDir);
    expect(result.code).toBe(1);
    expect(result.stderr).toContain(`${sourceDir} is not empty: a restore never writes over a database`);
    expect(readdirSync(sourceDir)).toEqual(before);
    expect(await readUsers(sourceDir)).toEqual(rows);
  });

  it('refuses a file that is not a backup and leaves the data directory empty', async () => {
    const file = path.join(scratch, 'notes.tar.gz');
    writeFileSync(file, 'these are notes, not a database');
    const target = path.join(scratch, 'from-garbage');
    const result = await run('restore', [file], target);
    expect(result.code).toBe(1);
    expect(result.stderr).toContain('This file is not a database backup PGlite can read');
    expect(readdirSync(target)).toEqual([]);
  });

  it('refuses to back up a directory that holds no database, without creating one there', async () => {
    const empty = mkdtempSync(path.join(scratch, 'empty-'));
    const result = await run('backup', [path.join(scratch, 'never.tar.gz')], empty);
    expect(result.code).toBe(1);
    expect(result.stderr).toContain(`There is no database in ${empty}: nothing to back up.`);
    expect(readdirSync(empty)).toEqual([]);
    expect(existsSync(path.join(scratch, 'never.tar.gz'))).toBe(false);
  });

  it('explains itself when restore is run without a file or with one that does not exist', async () => {
    const bare = await run('restore', [], path.join(scratch, 'unused'));
    expect(bare.code).toBe(2);
    expect(bare.stderr).toContain('Usage: npm run restore -- <backup.tar.gz>');
    const missing = await run('restore', [path.join(scratch, 'nope.tar.gz')], path.join(scratch, 'unused'));
    expect(missing.code).toBe(1);
    expect(missing.stderr).toContain(`There is no file ${path.join(scratch, 'nope.tar.gz')}.`);
  });

  it('leaves a PostgreSQL server to its own tools: with DATABASE_URL set, backup and restore refuse and name them', async () => {
    const env = { DATABASE_URL: 'postgres://blazebook@127.0.0.1:1/blazebook' };
    const dataDir = path.join(scratch, 'server-mode');
    const backup = await run('backup', [], dataDir, env);
    expect(backup.code).toBe(2);
    expect(backup.stderr).toContain('pg_dump');
    const restore = await run('restore', [path.join(scratch, 'any.tar.gz')], dataDir, env);
    expect(restore.code).toBe(2);
    expect(restore.stderr).toContain('pg_restore');
    // Nothing was written where the embedded database would have been.
    expect(existsSync(dataDir)).toBe(false);
  });
});
