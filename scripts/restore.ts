import { closeSync, existsSync, fsyncSync, openAsBlob, openSync, readdirSync } from 'node:fs';
import path from 'node:path';
import { parseArgs } from 'node:util';
import { restoreDataDir } from '../db/client';
import { loadConfig } from '../server/config';
import { runCommand } from './run-command';
import { serverModeMessage } from './server-mode';

const usage = `Usage: npm run restore -- <backup.tar.gz>

Writes the database in a file made by \`npm run backup\` into DATA_DIR (default ./data), which must
be missing or empty: a restore never writes over a database. Then start the server as usual.`;

/**
 * PGlite writes without fsync. Flushing every file and folder once here means a power cut just
 * after a restore cannot leave a half-written database behind one that looked restored.
 */
function fsyncTree(dir: string): number {
  let files = 0;
  for (const entry of readdirSync(dir, { withFileTypes: true })) {
    const full = path.join(dir, entry.name);
    if (entry.isDirectory()) {
      files += fsyncTree(full);
    } else if (entry.isFile()) {
      fsyncPath(full);
      files++;
    }
  }
  fsyncPath(dir);
  return files;
}

function fsyncPath(file: string) {
  const fd = openSync(file, 'r');
  try {
    fsyncSync(fd);
  } finally {
    closeSync(fd);
  }
}

async function main(): Promise<number> {
  const { positionals, values } = parseArgs({
    allowPositionals: true,
    options: { help: { type: 'boolean', short: 'h' } },
  });
  if (values.help || positionals.length !== 1) {
    console.error(usage);
    return values.help ? 0 : 2;
  }
  const config = loadConfig();
  if (config.DATABASE_URL) {
    console.error(serverModeMessage);
    return 2;
  }
  const file = path.resolve(positionals[0]!);
  if (!existsSync(file)) {
    console.error(`There is no file ${file}.`);
    return 1;
  }
  const dataDir = path.resolve(config.DATA_DIR);
  const startedAt = performance.now();
  await restoreDataDir(dataDir, await openAsBlob(file));
  const files = fsyncTree(dataDir);
  const seconds = ((performance.now() - startedAt) / 1000).toFixed(1);
  console.log(
    `Restored ${file} into ${dataDir} (${files} files) in ${seconds} s. Start the server with DATA_DIR=${dataDir}.`,
  );
  return 0;
}

runCommand(main);
