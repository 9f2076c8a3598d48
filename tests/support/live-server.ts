import { spawn, type ChildProcess } from 'node:child_process';
import { cpSync, existsSync, mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { chromium, type Browser } from 'playwright-core';
import { webRoot } from '../../scripts/web-build';
import { serverBundle } from './server-bundle';
import { createTestDatabase, testEngine } from './server-databases';

/**
 * The real server and Debian's Chromium, without Vitest: the browser tests use them through
 * browser.ts, and `npm run bench:ui` (plain tsx, where Vitest cannot be imported) directly.
 */

const rootDir = fileURLToPath(new URL('../..', import.meta.url));
export const chromiumPath = process.env.CHROMIUM_PATH ?? '/usr/bin/chromium';

export const viewports = {
  phone: { width: 390, height: 844 },
  tablet: { width: 820, height: 1180 },
  wide: { width: 1440, height: 900 },
} as const;
export type ViewportName = keyof typeof viewports;

export type RunningServer = {
  url: string;
  dataDir: string;
  output: () => string;
  stop(): Promise<void>;
  /** The server process's id. */
  pid: number;
  /** Sends `signal` (SIGKILL: a crash) and resolves once the process has exited. */
  kill(signal: NodeJS.Signals): Promise<void>;
};

export type StartOptions = {
  /**
   * Start on this data directory instead of a temporary copy: it is copied from the template only
   * when it does not exist yet, and stays where it is at stop, so a later start reopens it (a
   * restart after a crash). The caller removes it.
   */
  dataDir?: string;
  /**
   * What the process runs: the bundle of the server's sources (server-bundle.ts, the default), or
   * the sources through tsx as `npm start` runs them (the soak, whose memory figures should be
   * those of the process users start).
   */
  from?: 'bundle' | 'sources';
  /** Node options before the entry (the soak opens the inspector to read the live heap). */
  nodeArgs?: readonly string[];
};

/**
 * Starts the real server (`server/index.ts`) on a free port with its own temporary data directory,
 * and resolves once it prints its ready line. The directory starts as a copy of the migrated
 * template (db-template.ts), as a fresh one would be after its first start, without the initdb.
 * Runs `node` on the server's bundle (server-bundle.ts), or `node --import tsx` on its sources as
 * `npm start` does (the tsx command would add a second Node process).
 */
export async function startServer(
  dataDirTemplate: string,
  env: Record<string, string> = {},
  options: StartOptions = {},
): Promise<RunningServer> {
  const dataDir = options.dataDir ?? mkdtempSync(path.join(tmpdir(), 'blazebook-browser-'));
  if (!options.dataDir || !existsSync(options.dataDir)) cpSync(dataDirTemplate, dataDir, { recursive: true });
  // In the api-postgres project the server gets a database of its own on the PostgreSQL server.
  const serverDatabase = testEngine() === 'server' && !env.DATABASE_URL ? await createTestDatabase() : null;
  if (serverDatabase) env = { DATABASE_URL: serverDatabase.url, ...env };
  let log = '';
  const entry = options.from === 'sources' ? ['--import', 'tsx', 'server/index.ts'] : ['--enable-source-maps', await serverBundle()];
  const child: ChildProcess = spawn(process.execPath, [...(options.nodeArgs ?? []), ...entry], {
    cwd: rootDir,
    env: {
      ...process.env,
      PORT: '0',
      HOST: '127.0.0.1',
      DATA_DIR: dataDir,
      NODE_ENV: 'test',
      WEB_ROOT: webRoot(rootDir),
      ...env,
    },
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  // exitCode stays null after a signal: this says whether the process is still there.
  const exited = new Promise<void>((resolve) => child.once('exit', () => resolve()));
  let running = true;
  void exited.then(() => (running = false));
  const url = await new Promise<string>((resolve, reject) => {
    const timer = setTimeout(() => reject(new Error(`Server did not start within 60 s:\n${log}`)), 60_000);
    const onData = (chunk: Buffer) => {
      log += chunk.toString();
      const match = /ready at (http:\/\/\S+)/.exec(log);
      if (match?.[1]) {
        clearTimeout(timer);
        resolve(match[1].replace('localhost', '127.0.0.1'));
      }
    };
    child.stdout?.on('data', onData);
    child.stderr?.on('data', (chunk: Buffer) => (log += chunk.toString()));
    child.once('exit', (code) => {
      clearTimeout(timer);
      reject(new Error(`Server exited with code ${code} before it was ready:\n${log}`));
    });
  });
  return {
    url,
    dataDir,
    output: () => log,
    pid: child.pid!,
    async stop() {
      if (running) {
        child.kill('SIGTERM');
        await exited;
      }
      if (!options.dataDir) rmSync(dataDir, { recursive: true, force: true });
      await serverDatabase?.drop();
    },
    async kill(signal) {
      if (running) child.kill(signal);
      await exited;
    },
  };
}

/** Debian's Chromium through playwright-core. Missing Chromium is a failure, never a skip. */
export async function launchBrowser(): Promise<Browser> {
  if (!existsSync(chromiumPath)) {
    throw new Error(
      `Chromium was not found at ${chromiumPath}. Browser tests need it: install it with ` +
        '`sudo apt-get install -y chromium` (Debian), or set CHROMIUM_PATH to a Chromium binary.',
    );
  }
  return chromium.launch({
    executablePath: chromiumPath,
    headless: true,
    args: [
      '--no-sandbox',
      '--disable-gpu',
      '--disable-quic',
      '--no-first-run',
      '--disable-background-networking',
      '--disable-component-update',
      '--disable-sync',
    ],
  });
}

