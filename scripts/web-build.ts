import { spawn, spawnSync } from 'node:child_process';
import { existsSync, readdirSync, statSync } from 'node:fs';
import path from 'node:path';

/** Everything the exported web bundle is made from. */
const sourceEntries = [
  'app',
  'features',
  'shared',
  'assets',
  'app.json',
  'package.json',
  'package-lock.json',
  'tsconfig.json',
  'metro.config.js',
  'index.js',
];
const skip = new Set(['node_modules', '.git', 'dist', 'data']);

function newestMtimeMs(target: string): number {
  if (!existsSync(target)) return 0;
  const stat = statSync(target);
  if (!stat.isDirectory()) return stat.mtimeMs;
  let newest = stat.mtimeMs;
  for (const entry of readdirSync(target)) {
    if (skip.has(entry)) continue;
    newest = Math.max(newest, newestMtimeMs(path.join(target, entry)));
  }
  return newest;
}

/**
 * Where the web export goes: `dist/`, or `BLAZEBOOK_WEB_ROOT` so that two checkouts' test runs on
 * one machine do not rebuild the same folder under each other. The server reads it as `WEB_ROOT`.
 */
export function webRoot(rootDir: string): string {
  return process.env.BLAZEBOOK_WEB_ROOT ?? path.join(rootDir, 'dist');
}

/** Why the export must be rebuilt, or null when it is newer than every source. */
export function staleReason(rootDir: string): string | null {
  const index = path.join(webRoot(rootDir), 'index.html');
  if (!existsSync(index)) return 'no web build yet';
  const builtAt = statSync(index).mtimeMs;
  const sourcesAt = Math.max(...sourceEntries.map((entry) => newestMtimeMs(path.join(rootDir, entry))));
  return sourcesAt > builtAt ? 'sources changed since the last web build' : null;
}

/** Tree shaking is opt-in in Expo 56; with it the export drops unused mathjs, d3 and zod code. */
export const webExportEnv = {
  CI: '1',
  EXPO_NO_TELEMETRY: '1',
  EXPO_UNSTABLE_TREE_SHAKING: '1',
  EXPO_UNSTABLE_METRO_OPTIMIZE_GRAPH: '1',
};

const exportArgs = (rootDir: string) => ['export', '-p', 'web', '--output-dir', webRoot(rootDir)];
const expoBin = (rootDir: string) => path.join(rootDir, 'node_modules', '.bin', 'expo');

/**
 * The same export without waiting for it: resolves with its output when it has finished, and
 * rejects with that output when it fails. Null when the export is already up to date.
 */
export function startWebBuild(rootDir: string): { done: Promise<string>; stop: () => void } | null {
  const reason = staleReason(rootDir);
  if (!reason) return null;
  const started = Date.now();
  const child = spawn(expoBin(rootDir), exportArgs(rootDir), {
    cwd: rootDir,
    stdio: ['ignore', 'pipe', 'pipe'],
    env: { ...process.env, ...webExportEnv },
  });
  let output = `Exporting the web app (${reason})…\n`;
  child.stdout.on('data', (chunk: Buffer) => (output += chunk.toString()));
  child.stderr.on('data', (chunk: Buffer) => (output += chunk.toString()));
  const done = new Promise<string>((resolve, reject) => {
    child.once('error', (error) => reject(new Error(`${output}\n${error.message}`)));
    child.once('exit', (code, signal) => {
      if (code === 0) resolve(`${output}Web app exported in ${((Date.now() - started) / 1000).toFixed(1)} s.`);
      else reject(new Error(`${output}\nexpo export failed with ${signal ?? `exit code ${code}`}`));
    });
  });
  return { done, stop: () => child.kill('SIGTERM') };
}

/** Exports the web app with Expo when it is missing or older than its sources. */
export function ensureWebBuild(rootDir: string, log: (line: string) => void = console.log): void {
  const reason = staleReason(rootDir);
  if (!reason) return;
  log(`Exporting the web app (${reason})…`);
  const started = Date.now();
  const result = spawnSync(expoBin(rootDir), exportArgs(rootDir), {
    cwd: rootDir,
    stdio: ['ignore', 'inherit', 'inherit'],
    env: { ...process.env, ...webExportEnv },
  });
  if (result.status !== 0) throw new Error(`expo export failed with exit code ${result.status}`);
  log(`Web app exported in ${((Date.now() - started) / 1000).toFixed(1)} s.`);
}
