/**
 * Notebook API throughput against the real server (`tsx server/index.ts`) on a seeded on-disk
 * database in a temporary directory, over loopback, with autocannon at 32 connections:
 * - reads of one version (`GET /api/designs/:id/versions/:n`),
 * - reads of the team's design list (`GET /api/teams/:teamId/designs`, one page of 20 of 60),
 * - version saves (`POST /api/designs/:id/versions`), one design per connection so every save is
 *   on top of the latest, as a designer's would be.
 * Each is warmed up first. Prints req/s, p50 and p99; run with `npm run bench:api`.
 * Targets (issue 6): reads ≥ 2,000 req/s with p99 ≤ 20 ms; saves p99 ≤ 50 ms.
 */
import autocannon from 'autocannon';
import { spawn, type ChildProcess } from 'node:child_process';
import { randomUUID } from 'node:crypto';
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { openDatabase } from '../db/client';
import { systemClock } from '../server/clock';
import { createNotebooksRepository } from '../server/notebooks/repository';
import { summarizeVersion } from '../server/notebooks/summary';
import { demoPassword, demoTeamName, demoUsers, seedDemoData } from '../server/seed/demo';
import { exampleDesign, type Design } from '../shared/design';

const rootDir = fileURLToPath(new URL('..', import.meta.url));
const CONNECTIONS = 32;
const WARMUP_S = 3;
const MEASURE_S = 10;
const EXTRA_DESIGNS = 60;

const withSlits = (widthUm: number): Design => ({
  ...exampleDesign,
  slits: { ...exampleDesign.slits, entranceWidthUm: widthUm, exitWidthUm: widthUm },
});

/** The demo data plus enough designs for a list with paging, and one design per save connection. */
async function seed(dataDir: string): Promise<{ saveDesignIds: string[] }> {
  const database = await openDatabase({ dataDir });
  try {
    await seedDemoData({ database, clock: systemClock });
    const [team] = await database.db.query.teams.findMany({ where: (t, { eq }) => eq(t.name, demoTeamName) });
    const owner = await database.db.query.users.findFirst({
      where: (u, { eq }) => eq(u.email, demoUsers[0].email),
    });
    if (!team || !owner) throw new Error('demo data missing after seeding');
    const repository = createNotebooksRepository(database.db);
    const now = Date.now();
    const saveDesignIds: string[] = [];
    for (let i = 0; i < EXTRA_DESIGNS; i++) {
      const id = randomUUID();
      const params = withSlits(20 + i * 5);
      const at = new Date(now - i * 60_000);
      await repository.inTransaction((repo) =>
        repo.insertDesign(
          {
            id,
            teamId: team.id,
            title: `Bench design ${String(i).padStart(2, '0')}`,
            tags: i % 3 ? ['bench'] : ['bench', 'uv'],
            createdBy: owner.id,
            latestVersion: 1,
            createdAt: at,
            updatedAt: at,
          },
          [
            {
              id: randomUUID(),
              designId: id,
              number: 1,
              params,
              notes: 'Bench.',
              message: 'Start',
              authorId: owner.id,
              parentNumber: null,
              summary: summarizeVersion(params),
              createdAt: at,
            },
          ],
        ),
      );
      if (saveDesignIds.length < CONNECTIONS) saveDesignIds.push(id);
    }
    return { saveDesignIds };
  } finally {
    await database.close();
  }
}

async function startServer(dataDir: string): Promise<{ url: string; stop(): Promise<void> }> {
  let log = '';
  const child: ChildProcess = spawn(path.join(rootDir, 'node_modules', '.bin', 'tsx'), ['server/index.ts'], {
    cwd: rootDir,
    // production: no dev routes, no seeding on start, no per-request dev logging.
    env: { ...process.env, PORT: '0', HOST: '127.0.0.1', DATA_DIR: dataDir, NODE_ENV: 'production' },
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  const url = await new Promise<string>((resolve, reject) => {
    const timer = setTimeout(() => reject(new Error(`Server did not start within 60 s:\n${log}`)), 60_000);
    child.stdout?.on('data', (chunk: Buffer) => {
      log += chunk.toString();
      const match = /ready at (http:\/\/\S+)/.exec(log);
      if (match?.[1]) {
        clearTimeout(timer);
        resolve(match[1].replace('localhost', '127.0.0.1'));
      }
    });
    child.stderr?.on('data', (chunk: Buffer) => (log += chunk.toString()));
    child.once('exit', (code) => {
      clearTimeout(timer);
      reject(new Error(`Server exited with code ${code}:\n${log}`));
    });
  });
  return {
    url,
    async stop() {
      if (child.exitCode !== null) return;
      const exited = new Promise((resolve) => child.once('exit', resolve));
      child.kill('SIGTERM');
      await exited;
    },
  };
}

type Row = { name: string; reqPerSec: number; p50: number; p99: number; ok: number; failed: number };

async function run(name: string, options: autocannon.Options, seconds: number): Promise<Row> {
  const result = await autocannon({ connections: CONNECTIONS, duration: seconds, ...options });
  return {
    name,
    reqPerSec: result.requests.average,
    p50: result.latency.p50,
    p99: result.latency.p99,
    ok: result['2xx'],
    failed: result.non2xx + result.errors + result.timeouts,
  };
}

const dataDir = mkdtempSync(path.join(tmpdir(), 'blazebook-bench-api-'));
let server: Awaited<ReturnType<typeof startServer>> | undefined;
try {
  console.log(`Seeding an on-disk database in ${dataDir} …`);
  const { saveDesignIds } = await seed(dataDir);
  server = await startServer(dataDir);
  const origin = new URL(server.url).origin;

  const signIn = await fetch(`${server.url}/api/auth/sign-in`, {
    method: 'POST',
    headers: { 'content-type': 'application/json', origin },
    body: JSON.stringify({ email: demoUsers[0].email, password: demoPassword }),
  });
  if (signIn.status !== 200) throw new Error(`sign-in failed: ${signIn.status}`);
  const cookie = signIn.headers
    .getSetCookie()
    .map((c) => c.split(';')[0])
    .join('; ');
  const headers = { cookie, origin, 'content-type': 'application/json' };
  const teams = (await (await fetch(`${server.url}/api/teams`, { headers })).json()) as {
    teams: { id: string; name: string }[];
  };
  const teamId = teams.teams.find((t) => t.name === demoTeamName)!.id;
  const list = (await (await fetch(`${server.url}/api/teams/${teamId}/designs`, { headers })).json()) as {
    designs: { id: string; title: string; latestVersion: number }[];
    total: number;
  };
  const demo = list.designs.find((d) => d.title === 'Teaching-lab visible scanner')!;

  const versionRead: autocannon.Options = { url: `${server.url}/api/designs/${demo.id}/versions/2`, headers };
  const listRead: autocannon.Options = {
    url: `${server.url}/api/teams/${teamId}/designs?sort=updated&pageSize=20`,
    headers,
  };
  // Each connection takes a design of its own and saves on top of the version it saved last.
  const latest = new Map(saveDesignIds.map((id) => [id, 1]));
  let nextDesign = 0;
  const saves = (): autocannon.Options => ({
    url: server!.url,
    headers,
    requests: [
      {
        method: 'POST',
        setupRequest: (req, ctx) => {
          const context = ctx as Record<string, unknown>;
          context.designId ??= saveDesignIds[nextDesign++ % saveDesignIds.length];
          const id = context.designId as string;
          const base = latest.get(id)!;
          return {
            ...req,
            path: `/api/designs/${id}/versions`,
            body: JSON.stringify({
              baseVersion: base,
              params: withSlits(10 + (base % 90)),
              notes: 'Bench save.',
              message: `Bench save on v${base}`,
            }),
          };
        },
        onResponse: (status, body, ctx) => {
          const context = ctx as Record<string, unknown>;
          // A save still in flight when a run ended leaves a stale base: the 409 names the latest.
          if (status === 409)
            latest.set(
              context.designId as string,
              (JSON.parse(body) as { error: { latest: { number: number } } }).error.latest.number,
            );
          if (status === 201)
            latest.set(
              context.designId as string,
              (JSON.parse(body) as { version: { number: number } }).version.number,
            );
        },
      },
    ],
  });

  console.log(
    `Server at ${server.url}; ${list.total} designs in the lab team; ${CONNECTIONS} connections, ${MEASURE_S} s each after ${WARMUP_S} s of warm-up.\n`,
  );
  const rows: Row[] = [];
  await run('warm-up', versionRead, WARMUP_S);
  rows.push(await run('GET one version', versionRead, MEASURE_S));
  await run('warm-up', listRead, WARMUP_S);
  rows.push(await run(`GET design list (20 of ${list.total})`, listRead, MEASURE_S));
  await run('warm-up', saves(), WARMUP_S);
  nextDesign = 0;
  rows.push(await run('POST save a version', saves(), MEASURE_S));

  const pad = (s: string, n: number) => s.padEnd(n);
  console.log(
    `${pad('what', 28)}${pad('req/s', 10)}${pad('p50 ms', 9)}${pad('p99 ms', 9)}${pad('2xx', 9)}other`,
  );
  for (const row of rows) {
    console.log(
      `${pad(row.name, 28)}${pad(row.reqPerSec.toFixed(0), 10)}${pad(String(row.p50), 9)}${pad(String(row.p99), 9)}${pad(String(row.ok), 9)}${row.failed}`,
    );
  }
  console.log('\nTargets: reads ≥ 2000 req/s with p99 ≤ 20 ms; saves p99 ≤ 50 ms.');
} finally {
  await server?.stop();
  rmSync(dataDir, { recursive: true, force: true });
}
