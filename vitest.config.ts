import { readdirSync, readFileSync } from 'node:fs';
import { availableParallelism } from 'node:os';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { defineConfig } from 'vitest/config';

const root = fileURLToPath(new URL('.', import.meta.url));
const alias = { '@': root };

/**
 * Vitest keeps one core for itself (cores − 1 workers), which on a 2-core machine runs the unit and
 * API files one at a time. Its own process is mostly idle during a run and the files wait on
 * PGlite, child processes and sockets, so two workers on two cores pay: the API project took
 * 13 min 41 s with one and 7 min 44 s with two under a similar outside load (3 min 56 s and
 * 4 min 3 s of CPU).
 */
const workers = Math.max(2, availableParallelism() - 1);

// Names this run's template database on the PostgreSQL server (tests/support/server-databases.ts):
// set here, in Vitest's own process, so its global setup and every worker read the same one.
process.env.BLAZEBOOK_TEST_RUN ??= String(process.pid);

/** Unit files that are not browser or API files: everything else under tests/. */
const unitExclude = ['tests/server/**', 'tests/server-postgres/**', 'tests/browser/**'];

/**
 * Unit files that replace a module (`vi.mock`, `vi.doMock`). A replaced module must not reach the
 * next file in the same worker, so these run with fresh modules per file; found by reading the
 * files, so a new one is placed without a list to keep.
 */
const replacesModules = readdirSync(path.join(root, 'tests'), { recursive: true, encoding: 'utf8' })
  .filter((file) => file.endsWith('.test.ts') && !/^(server|server-postgres|browser)\//.test(file))
  .map((file) => `tests/${file}`)
  .filter((file) => /\bvi\.(do)?[mM]ock\(/.test(readFileSync(path.join(root, file), 'utf8')));

/**
 * The unit tests, in two projects. Most share their workers' loaded modules from one file to the
 * next (`isolate: false`): a fresh module graph per file cost more than the tests themselves (the
 * whole unit set took 70 s and 134 s of CPU with it, 38 s and 73 s without). They may stub globals
 * or spy on methods only when they undo it after each test (`vi.unstubAllGlobals`,
 * `vi.restoreAllMocks`). The few that replace a module get fresh modules per file.
 */
function unitProject(modules: 'shared-modules' | 'fresh-modules') {
  const shared = modules === 'shared-modules';
  return {
    resolve: { alias },
    test: {
      name: shared ? 'unit' : 'unit-fresh-modules',
      environment: 'node',
      include: shared ? ['tests/**/*.test.ts'] : replacesModules,
      exclude: shared ? [...unitExclude, ...replacesModules] : unitExclude,
      // The backup tests start from the migrated template's data directory.
      globalSetup: ['tests/support/db-template.ts'],
      maxWorkers: workers,
      isolate: !shared,
    },
  };
}

/**
 * The API tests, on the embedded database (always) or on the PostgreSQL server in
 * TEST_DATABASE_URL (`api-postgres`): the same files, each opening its databases through
 * tests/support/test-db.ts and its server processes through tests/support/live-server.ts.
 */
function apiProject(engine: 'embedded' | 'server') {
  return {
    resolve: { alias },
    test: {
      name: engine === 'embedded' ? 'api' : 'api-postgres',
      environment: 'node',
      // tests/server-postgres/ holds what needs a server the embedded database cannot be: several
      // API processes on one database, and PostgreSQL itself stopped mid-load.
      include: ['tests/server/**/*.test.ts', ...(engine === 'server' ? ['tests/server-postgres/**/*.test.ts'] : [])],
      // Two files open PGlite themselves whatever the engine (the data directory's lock and a
      // second opener; a migration replayed step by step): on the server engine they would only
      // run again as they are. Its processes are killed and restarted in durability.test.ts.
      exclude: engine === 'server' ? ['tests/server/shutdown.test.ts', 'tests/server/reviews/migration.test.ts'] : [],
      globalSetup: ['tests/support/db-template.ts', ...(engine === 'server' ? ['tests/support/server-template.ts'] : [])],
      env: { BLAZEBOOK_TEST_ENGINE: engine },
      maxWorkers: workers,
      // A worker keeps the modules it loaded (Express, Drizzle, PGlite, zod) for its next file
      // instead of loading them again: nine API files back to back, 34.7 s isolated, 20.8 s not.
      // Safe because no API test mocks a module or stubs a global, and each closes what it opens.
      isolate: false,
      testTimeout: 20_000,
      hookTimeout: 30_000,
    },
  };
}

/**
 * Three kinds of test, one command. Unit and API files run first, two at a time; then the browser
 * files, two at a time, on the one exported web build (each file with its own server and Chromium).
 */
export default defineConfig({
  resolve: { alias },
  test: {
    // CI reads the JSON report to print a plain "N passed, N failed" line.
    reporters: process.env.CI ? ['default', ['json', { outputFile: 'tests/artifacts/results.json' }]] : ['default'],
    projects: [
      unitProject('shared-modules'),
      unitProject('fresh-modules'),
      apiProject('embedded'),
      // The same API tests on a PostgreSQL server, when one is given (CI starts a throwaway cluster).
      ...(process.env.TEST_DATABASE_URL ? [apiProject('server')] : []),
      {
        resolve: { alias },
        test: {
          name: 'browser',
          environment: 'node',
          include: ['tests/browser/**/*.test.ts'],
          globalSetup: ['tests/support/web-build.ts', 'tests/support/db-template.ts'],
          // Two files at a time, each with its own server and Chromium: one file leaves a core idle
          // while it waits on the other processes (70 % busy on two cores). The whole browser set
          // took 678 s and 945 s of CPU one at a time, 572 s and 1,078 s two at a time.
          maxWorkers: workers,
          // A fresh fork per file cost 6–7 s before its first test (a new Node process importing
          // Vitest, Playwright and the features it reads): 164 s of a 786 s run. Each worker keeps
          // them; no browser test mocks a module or stubs a global, and each file closes its own
          // server and Chromium in afterAll.
          isolate: false,
          // After the unit and API files: those load both cores already, and the first browser
          // file would otherwise hold a worker while the web export it needs is still running.
          sequence: { groupOrder: 1 },
          testTimeout: 60_000,
          hookTimeout: 240_000,
        },
      },
    ],
  },
});
