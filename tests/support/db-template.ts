import { createHash } from 'node:crypto';
import {
  existsSync,
  mkdirSync,
  mkdtempSync,
  readdirSync,
  readFileSync,
  renameSync,
  rmSync,
  statSync,
  writeFileSync,
} from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import type { TestProject } from 'vitest/node';
import { dumpMigratedTemplate, migrationsFolder, restoreDataDir } from '../../db/client';

declare module 'vitest' {
  export interface ProvidedContext {
    /** A dump of the migrated database, for `openDatabase({ memory: true, loadDataDir })`. */
    dbTemplatePath: string;
    /** The same database as a data directory: copy it for a server process, never open it. */
    dataDirTemplate: string;
  }
}

const rootDir = fileURLToPath(new URL('../..', import.meta.url));
const cacheDir = path.join(rootDir, 'node_modules', '.cache', 'blazebook-db-template');
const day = 24 * 60 * 60_000;

/** Changes whenever the migrated database could: the migrations, PGlite or Drizzle's migrator. */
function templateKey(): string {
  const hash = createHash('sha256');
  for (const name of readdirSync(migrationsFolder, { recursive: true }).map(String).sort()) {
    const file = path.join(migrationsFolder, name);
    if (!statSync(file).isFile()) continue;
    hash.update(`${name}\0`).update(readFileSync(file));
  }
  for (const pkg of ['@electric-sql/pglite', 'drizzle-orm']) {
    hash.update(readFileSync(path.join(rootDir, 'node_modules', pkg, 'package.json')));
  }
  return hash.digest('hex').slice(0, 16);
}

/**
 * Migrates one database and keeps it, as a dump and as a data directory, until the migrations or
 * the database packages change: each API test opens a copy of the dump, and each server process
 * (shutdown and browser tests) starts on a copy of the directory instead of running initdb.
 * Creating and migrating costs several seconds (many more on a busy machine) before any test can
 * start; a cached template costs nothing. Runs in parallel are safe: a template is built aside and
 * renamed into place whole.
 */
export async function ensureTemplate(): Promise<{ dbTemplatePath: string; dataDirTemplate: string }> {
  mkdirSync(cacheDir, { recursive: true });
  const key = templateKey();
  const dir = path.join(cacheDir, key);
  if (!existsSync(dir)) {
    const building = mkdtempSync(path.join(cacheDir, 'building-'));
    try {
      const dump = await dumpMigratedTemplate();
      writeFileSync(path.join(building, 'template.tar'), Buffer.from(await dump.arrayBuffer()));
      await restoreDataDir(path.join(building, 'data'), dump);
      renameSync(building, dir);
    } catch (error) {
      // Another run finished the same template first: use theirs.
      if (!existsSync(dir)) throw error;
    } finally {
      rmSync(building, { recursive: true, force: true });
    }
  }
  for (const entry of readdirSync(cacheDir)) {
    const old = path.join(cacheDir, entry);
    if (entry !== key && Date.now() - statSync(old).mtimeMs > day)
      rmSync(old, { recursive: true, force: true });
  }
  return { dbTemplatePath: path.join(dir, 'template.tar'), dataDirTemplate: path.join(dir, 'data') };
}

/** Vitest's global setup: the template's two forms, provided to every test of the project. */
export default async function setup(project: TestProject) {
  const { dbTemplatePath, dataDirTemplate } = await ensureTemplate();
  project.provide('dbTemplatePath', dbTemplatePath);
  project.provide('dataDirTemplate', dataDirTemplate);
}
