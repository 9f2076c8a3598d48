import {
  closeSync,
  existsSync,
  fsyncSync,
  mkdirSync,
  openSync,
  renameSync,
  rmSync,
  statSync,
  writeSync,
} from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { parseArgs } from 'node:util';
import { dumpDataDir } from '../db/client';
import { DataDirInUseError } from '../db/data-dir-lock';
import { loadConfig } from '../server/config';
import { runCommand } from './run-command';
import { serverModeMessage } from './server-mode';

const usage = `Usage: npm run backup [-- <file.tar.gz | folder>]

Writes a consistent copy of the database in DATA_DIR (default ./data) to the file, or to a
timestamped file in the folder (default ./backups). Stop the server first: the embedded database
can be opened by one process at a time. Restore with \`npm run restore -- <file>\`.`;

const rootDir = fileURLToPath(new URL('..', import.meta.url));

/** Where the backup goes: a named file, or a new timestamped name inside a folder. */
function targetFor(argument: string | undefined, now: Date): string {
  const folderGiven =
    argument !== undefined &&
    (argument.endsWith(path.sep) || (existsSync(argument) && statSync(argument).isDirectory()));
  if (argument !== undefined && !folderGiven) return path.resolve(argument);
  const folder = path.resolve(argument ?? path.join(rootDir, 'backups'));
  // Colons are not allowed in Windows file names; sorts by time either way.
  const stamp = now
    .toISOString()
    .replace(/\.\d+Z$/, 'Z')
    .replaceAll(':', '-');
  return path.join(folder, `blazebook-${stamp}.tar.gz`);
}

/**
 * Writes `bytes` to `file` so that after a crash there is either the old file or the whole new
 * one: a temporary name beside it, fsync, rename, then fsync of the folder that holds the name.
 */
function writeDurably(file: string, bytes: Uint8Array) {
  mkdirSync(path.dirname(file), { recursive: true });
  const partial = `${file}.partial-${process.pid}`;
  try {
    const fd = openSync(partial, 'wx');
    try {
      let written = 0;
      while (written < bytes.length) written += writeSync(fd, bytes, written);
      fsyncSync(fd);
    } finally {
      closeSync(fd);
    }
    renameSync(partial, file);
  } catch (error) {
    rmSync(partial, { force: true });
    throw error;
  }
  const folder = openSync(path.dirname(file), 'r');
  try {
    fsyncSync(folder);
  } finally {
    closeSync(folder);
  }
}

function describeSize(bytes: number): string {
  return `${(bytes / 1_048_576).toFixed(1)} MiB, ${bytes.toLocaleString('en')} bytes`;
}


async function main(): Promise<number> {
  const { positionals, values } = parseArgs({
    allowPositionals: true,
    options: { help: { type: 'boolean', short: 'h' } },
  });
  if (values.help || positionals.length > 1) {
    console.error(usage);
    return values.help ? 0 : 2;
  }
  const config = loadConfig();
  if (config.DATABASE_URL) {
    console.error(serverModeMessage);
    return 2;
  }
  const dataDir = path.resolve(config.DATA_DIR);
  const target = targetFor(positionals[0], new Date());
  const startedAt = performance.now();
  let dump: Blob;
  try {
    dump = await dumpDataDir(dataDir);
  } catch (error) {
    if (error instanceof DataDirInUseError) {
      console.error(
        `${error.message}\nBack up with the server stopped (a backup takes seconds): stop it, run npm run backup, start it again.`,
      );
      return 1;
    }
    throw error;
  }
  const bytes = new Uint8Array(await dump.arrayBuffer());
  writeDurably(target, bytes);
  const seconds = ((performance.now() - startedAt) / 1000).toFixed(1);
  console.log(`Backed up ${dataDir} to ${target} (${describeSize(bytes.length)}) in ${seconds} s.`);
  return 0;
}

runCommand(main);
