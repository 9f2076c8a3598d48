import { availableParallelism } from 'node:os';
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
 * Three kinds of test, one command. Unit and API tests are fast and run in parallel workers;
 * browser tests share one exported web build and one Chromium, so they run in a single fork.
 */
export default defineConfig({
  resolve: { alias },
  test: {
    // CI reads the JSON report to print a plain "N passed, N failed" line.
    reporters: process.env.CI ? ['default', ['json', { outputFile: 'tests/artifacts/results.json' }]] : ['default'],
    projects: [
      {
        resolve: { alias },
        test: {
          name: 'unit',
          environment: 'node',
          include: ['tests/**/*.test.ts'],
          exclude: ['tests/server/**', 'tests/server-postgres/**', 'tests/browser/**'],
          // The backup tests start from the migrated template's data directory.
          globalSetup: ['tests/support/db-template.ts'],
          maxWorkers: workers,
        },
      },
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
          fileParallelism: false,
          // Each file in a fresh fork cost 6–7 s before its first test (a new Node process importing
          // Vitest, Playwright and the features it reads): 164 s of a 786 s run. One fork keeps them;
          // no browser test mocks a module or stubs a global, and each file closes its own server
          // and Chromium in afterAll.
          isolate: false,
          // After the unit and API files, as before: a project that shares its fork needs a group
          // of its own (its one worker against their two), and the browser files alone load both
          // cores already.
          sequence: { groupOrder: 1 },
          testTimeout: 60_000,
          hookTimeout: 240_000,
        },
      },
    ],
  },
});
