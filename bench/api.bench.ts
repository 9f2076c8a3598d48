/**
 * Notebook API throughput against the real server (`node --import tsx server/index.ts`, production
 * mode) on a seeded on-disk database in a temporary directory, over loopback, with autocannon.
 * Requests carry a session cookie and `accept-encoding` as a browser's do.
 * - reads of one version (`GET /api/designs/:id/versions/:n`) at 32 connections,
 * - reads of the team's design list (`GET /api/teams/:teamId/designs`, a page of 20 of 62) at 32,
 * - version saves (`POST /api/designs/:id/versions`) with 1, 8 and 32 in flight at once, each on
 *   a design of its own and on top of its latest version, as designers' saves would be.
 * Each is warmed up first. Prints req/s, p50, p99, bytes per answer and any non-2xx by status.
 * Targets (issue 6): reads ≥ 2,000 req/s with p99 ≤ 20 ms; saves p99 ≤ 50 ms.
 *
 * `npm run bench:api`. BENCH_API_ONLY=floor,session,version,list,save picks scenarios ("floor" is a
 * bare Express route in a process of its own, bench/bare-express.ts; "session" is what every
 * signed-in request pays; neither is a target); BENCH_DATABASE_URL=<a PostgreSQL superuser's URL>
 * runs the server on a new database there (dropped afterwards) instead of PGlite;
 * BENCH_API_PROFILE=<dir> writes a CPU profile of the server; BENCH_API_ECHO=1 shows the server's
 * output. The rows are also written to tests/artifacts/bench-api-<engine>.json.
 */
import autocannon from 'autocannon';
import { spawn, type ChildProcess } from 'node:child_process';
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { demoPassword, demoTeamName, demoUsers } from '../server/seed/demo';
import { createServerDatabase, seedBenchData, withSlits } from './bench-data';
import { writeFigures } from './figures';

const rootDir = fileURLToPath(new URL('..', import.meta.url));
const CONNECTIONS = 32;
const SAVE_CONNECTIONS = [1, 8, 32];
const WARMUP_S = 3;
const MEASURE_S = 10;
const EXTRA_DESIGNS = 60;

async function startServer(dataDir: string, databaseUrl?: string, entry = 'server/index.ts'): Promise<{ url: string; stop(): Promise<void> }> {
  let log = '';
  // BENCH_API_PROFILE=<dir> writes a V8 CPU profile of the server there when it stops.
  const profileDir = process.env.BENCH_API_PROFILE;
  const nodeArgs = profileDir ? ['--cpu-prof', `--cpu-prof-dir=${path.resolve(profileDir)}`] : [];
  const child: ChildProcess = spawn(process.execPath, [...nodeArgs, '--import', 'tsx', entry], {
    cwd: rootDir,
    // production: no dev routes, no seeding on start, no per-request dev logging.
    env: {
      ...process.env,
      PORT: '0',
      HOST: '127.0.0.1',
      DATA_DIR: dataDir,
      NODE_ENV: 'production',
      ...(databaseUrl ? { DATABASE_URL: databaseUrl } : {}),
    },
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  const url = await new Promise<string>((resolve, reject) => {
    const timer = setTimeout(() => reject(new Error(`Server did not start within 60 s:\n${log}`)), 60_000);
    child.stdout?.on('data', (chunk: Buffer) => {
      log += chunk.toString();
      if (process.env.BENCH_API_ECHO) process.stdout.write(chunk);
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

type Row = { name: string; reqPerSec: number; p50: number; p99: number; ok: number; failed: number; bytesPerResponse: number; statuses: string };

async function run(name: string, options: autocannon.Options, seconds: number): Promise<Row> {
  const result = await autocannon({ connections: CONNECTIONS, duration: seconds, ...options });
  return {
    name,
    reqPerSec: result.requests.average,
    p50: result.latency.p50,
    p99: result.latency.p99,
    ok: result['2xx'],
    failed: result.non2xx + result.errors + result.timeouts,
    bytesPerResponse: result.requests.total ? result.throughput.total / result.requests.total : 0,
    statuses: Object.entries(result.statusCodeStats ?? {})
      .filter(([code]) => !code.startsWith('2'))
      .map(([code, { count }]) => `${count}×${code}`)
      .join(' '),
  };
}

const dataDir = mkdtempSync(path.join(tmpdir(), 'blazebook-bench-api-'));
// BENCH_DATABASE_URL (a PostgreSQL superuser's URL): the server runs on a new database there instead of PGlite.
const adminUrl = process.env.BENCH_DATABASE_URL;
const engine = adminUrl ? 'server' : 'embedded';
let serverDatabase: Awaited<ReturnType<typeof createServerDatabase>> | undefined;
let server: Awaited<ReturnType<typeof startServer>> | undefined;
let floorServer: Awaited<ReturnType<typeof startServer>> | undefined;
try {
  if (adminUrl) serverDatabase = await createServerDatabase(adminUrl, 'blazebook_bench_api');
  console.log(serverDatabase ? `Seeding a database on the PostgreSQL server …` : `Seeding an on-disk database in ${dataDir} …`);
  const { saveDesignIds } = await seedBenchData(serverDatabase ? { url: serverDatabase.url, poolSize: 2 } : { dataDir }, EXTRA_DESIGNS, CONNECTIONS);
  server = await startServer(dataDir, serverDatabase?.url);
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
  // What a browser sends: it always accepts compressed answers.
  const headers = { cookie, origin, 'content-type': 'application/json', 'accept-encoding': 'gzip, deflate, br' };
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
  // autocannon resets a connection's context before every request, so designs are leased: a save
  // takes a free design and gives it back with its response. With as many designs as connections
  // no two saves are ever in flight on one design, as with designers each saving their own.
  const latest = new Map(saveDesignIds.map((id) => [id, 1]));
  const resyncLatest = async () => {
    // A save still in flight when a run ends is answered after autocannon stops listening: let
    // the server finish those, then read where each design stands.
    await new Promise((resolve) => setTimeout(resolve, 1000));
    for (const id of saveDesignIds) {
      const answer = (await (await fetch(`${server!.url}/api/designs/${id}`, { headers })).json()) as {
        design: { latestVersion: number };
      };
      latest.set(id, answer.design.latestVersion);
    }
  };
  const saves = (): autocannon.Options => {
    const free = [...saveDesignIds];
    return {
      url: server!.url,
      headers,
      requests: [
        {
          method: 'POST',
          setupRequest: (req, ctx) => {
            const id = free.pop();
            if (!id) throw new Error('more saves in flight than designs to save');
            (ctx as Record<string, unknown>).designId = id;
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
            const id = (ctx as Record<string, unknown>).designId as string;
            if (status === 201) latest.set(id, (JSON.parse(body) as { version: { number: number } }).version.number);
            // Should not happen with leased designs; if it does, it is counted, and the next save rebases.
            if (status === 409)
              latest.set(id, (JSON.parse(body) as { error: { latest: { number: number } } }).error.latest.number);
            free.push(id);
          },
        },
      ],
    };
  };

  console.log(
    `Server at ${server.url}; ${list.total} designs in the lab team; reads at ${CONNECTIONS} connections, saves at ${SAVE_CONNECTIONS.join(', ')}; ${MEASURE_S} s each after ${WARMUP_S} s of warm-up.\n`,
  );
  const only = new Set((process.env.BENCH_API_ONLY ?? 'floor,session,version,list,save').split(','));
  const rows: Row[] = [];
  if (only.has('floor')) {
    // The floor of the whole stack: a bare Express app answering a small JSON, as its own process.
    floorServer = await startServer(dataDir, undefined, 'bench/bare-express.ts');
    const bare: autocannon.Options = { url: `${floorServer.url}/floor`, headers };
    await run('warm-up', bare, WARMUP_S);
    rows.push(await run('GET bare Express (floor)', bare, MEASURE_S));
    await floorServer.stop();
  }
  if (only.has('session')) {
    // Not a target: the floor every signed-in request pays (HTTP, middleware, session).
    const sessionRead: autocannon.Options = { url: `${server.url}/api/auth/session`, headers };
    await run('warm-up', sessionRead, WARMUP_S);
    rows.push(await run('GET session (floor)', sessionRead, MEASURE_S));
  }
  if (only.has('version')) {
    await run('warm-up', versionRead, WARMUP_S);
    rows.push(await run('GET one version', versionRead, MEASURE_S));
  }
  if (only.has('list')) {
    await run('warm-up', listRead, WARMUP_S);
    rows.push(await run(`GET design list (20 of ${list.total})`, listRead, MEASURE_S));
  }
  if (only.has('save')) {
    // Each in-flight save waits for the ones ahead of it: the embedded database has one writer.
    // So saves are measured at several numbers of designers saving at the same instant.
    for (const connections of SAVE_CONNECTIONS) {
      await run('warm-up', { ...saves(), connections }, WARMUP_S);
      await resyncLatest();
      rows.push(await run(`POST save, ${connections} at once`, { ...saves(), connections }, MEASURE_S));
      await resyncLatest();
    }
  }

  const pad = (s: string, n: number) => s.padEnd(n);
  console.log(
    `${pad('what', 28)}${pad('req/s', 10)}${pad('p50 ms', 9)}${pad('p99 ms', 9)}${pad('2xx', 9)}${pad('bytes', 8)}other`,
  );
  for (const row of rows) {
    console.log(
      `${pad(row.name, 28)}${pad(row.reqPerSec.toFixed(0), 10)}${pad(String(row.p50), 9)}${pad(String(row.p99), 9)}${pad(String(row.ok), 9)}${pad(row.bytesPerResponse.toFixed(0), 8)}${row.failed}${row.statuses ? ` (${row.statuses})` : ''}`,
    );
  }
  console.log('\nTargets: reads ≥ 2000 req/s with p99 ≤ 20 ms at 32 connections; saves p99 ≤ 50 ms.');
  writeFigures(`api-${engine}`, { engine, connections: CONNECTIONS, seconds: MEASURE_S, rows });
} finally {
  await floorServer?.stop();
  await server?.stop();
  await serverDatabase?.drop();
  rmSync(dataDir, { recursive: true, force: true });
}
