/**
 * Soak: SOAK_SECONDS (default 300) of a team's mixed traffic at 32 connections against the real
 * server (`startServer` from tests/support/live-server.ts, production mode, its sources through tsx
 * as `npm start` runs them) on each engine: PGlite, then PostgreSQL (TEST_DATABASE_URL when set,
 * else a throwaway cluster from scripts/pg-throwaway.ts, fsync on, removed afterwards; skipped with
 * the reason when PostgreSQL is not installed).
 *
 * Each connection loops without pause. The routes the server limits per address are sent on a
 * schedule at a busy team's rate, under their limits (`paced` below: sheets 12, searches 6, curve
 * uploads 6, traces 4 a minute), and every other request is drawn by weight: one version 45, the
 * design list 25, a save 15, a remark 10 (a new thread every 20th), as a team mostly reads. The
 * real server has no setting to raise its limits (they are AppDeps, for tests only), so the bench
 * keeps under them: a 429 is counted apart as an expected refusal, as is a 409 (a save on a version
 * that is no longer the latest). Each connection saves to a design of its own.
 *
 * Before the measured SOAK_SECONDS the same traffic runs SOAK_WARMUP_SECONDS (default 20) uncounted.
 * Prints per route: count, p50, p99, max, unexpected errors; the total throughput; the server
 * process's RSS (VmRSS, from /proc) at start, after warm-up and at the end, with end / start and
 * end / warm (target: flat within 20 %), and the medians of the first and last fifths of the
 * samples taken every 5 s; and the live heap after a full collection (bench/live-heap.ts, through
 * the inspector the server opens on loopback) idle, as the measured time starts and as it ends,
 * both under the same load (target: end / start within 20 %). Writes the same to
 * tests/artifacts/soak-<engine>.json.
 *
 * `npm run bench:soak`; SOAK_SECONDS=60 for a short one; SOAK_ENGINES=embedded (or server) for one engine.
 */
import { randomBytes } from 'node:crypto';
import { cpSync, mkdirSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import http from 'node:http';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { brotliDecompressSync, gunzipSync, inflateSync } from 'node:zlib';
import { startCluster, type Cluster } from '../scripts/pg-throwaway';
import { demoPassword, demoTeamName, demoUsers } from '../server/seed/demo';
import { exampleDesign } from '../shared/design';
import { ensureTemplate } from '../tests/support/db-template';
import { startServer, type RunningServer } from '../tests/support/live-server';
import { createServerDatabase, seedBenchData, withSlits } from './bench-data';
import { artifactsDir } from './figures';
import { inspectorUrl, liveHeap, type LiveHeap } from './live-heap';
import { range, searchInput } from './search-input';

const SECONDS = Number(process.env.SOAK_SECONDS ?? 300);
const CONNECTIONS = 32;
const EXTRA_DESIGNS = 40;
const RSS_SAMPLE_MS = 5_000;
/**
 * Traffic before the measured SOAK_SECONDS, not counted: a fresh server's first requests wait
 * seconds on cold code (PGlite's WebAssembly, the sheet's fonts) on this shared machine. The RSS
 * after it is the baseline the end is compared with (the JIT, caches and buffers have filled).
 */
const WARM_S = Number(process.env.SOAK_WARMUP_SECONDS ?? 20);
const REMARKS_PER_THREAD = 20;
const TARGET_RSS_RATIO = 1.2;

type Engine = 'embedded' | 'server';
type Route = 'version' | 'list' | 'save' | 'thread' | 'remark' | 'sheet' | 'search' | 'trace' | 'curve';
const routeNames: Record<Route, string> = {
  version: 'GET one version',
  list: 'GET design list (page of 20)',
  save: 'POST save',
  thread: 'POST thread (first remark)',
  remark: 'POST remark (reply)',
  sheet: 'GET design sheet (PDF)',
  search: 'POST search (2,500 candidates)',
  trace: 'POST trace (default rays)',
  curve: 'POST curve upload (200 rows)',
};
const weighted: [Route, number][] = [
  ['version', 45],
  ['list', 25],
  ['save', 15],
  ['remark', 10],
];
/**
 * Per minute: a busy team's rate, well under the server's limit per address (in brackets,
 * server/auth/rate-limit.ts). At the limits themselves a sheet arrives every second, and on a
 * shared 2-core machine a sheet can take a second of the thread: the reads then wait behind sheets.
 */
const paced: [Route, number, number][] = [
  ['sheet', 12, 60],
  ['search', 6, 20],
  ['curve', 6, 20],
  ['trace', 4, 10],
];

type Answer = { status: number; body: Buffer; headers: http.IncomingHttpHeaders };

function percentile(sorted: Float64Array, p: number): number {
  if (!sorted.length) return NaN;
  return sorted[Math.min(sorted.length - 1, Math.ceil((p / 100) * sorted.length) - 1)]!;
}

function rssKb(pid: number): number {
  const match = /VmRSS:\s+(\d+) kB/.exec(readFileSync(`/proc/${pid}/status`, 'utf8'));
  if (!match) throw new Error(`no VmRSS for ${pid}`);
  return Number(match[1]);
}

/** One origin's keep-alive client: at most CONNECTIONS sockets, as 32 browsers' tabs would hold. */
function client(baseUrl: string) {
  const agent = new http.Agent({ keepAlive: true, maxSockets: CONNECTIONS });
  const origin = new URL(baseUrl).origin;
  let cookie = '';
  const send = (method: string, path: string, body?: Buffer | string, contentType = 'application/json'): Promise<Answer> =>
    new Promise((resolve, reject) => {
      const headers: http.OutgoingHttpHeaders = { origin, 'accept-encoding': 'gzip, deflate, br' };
      if (cookie) headers.cookie = cookie;
      if (body !== undefined) {
        headers['content-type'] = contentType;
        headers['content-length'] = Buffer.byteLength(body);
      }
      const req = http.request(`${baseUrl}${path}`, { method, agent, headers }, (res) => {
        const chunks: Buffer[] = [];
        res.on('data', (chunk: Buffer) => chunks.push(chunk));
        res.on('end', () => resolve({ status: res.statusCode ?? 0, body: Buffer.concat(chunks), headers: res.headers }));
        res.on('error', reject);
      });
      req.on('error', reject);
      req.end(body);
    });
  return {
    send,
    setCookie(setCookie: string[] | undefined) {
      cookie = (setCookie ?? []).map((c) => c.split(';')[0]).join('; ');
    },
    close: () => agent.destroy(),
  };
}

/** Bodies that gzip: only JSON answers are read back, and the server gzips the large ones itself. */
function json<T>(answer: Answer): T {
  const encoding = answer.headers['content-encoding'];
  const raw =
    encoding === 'gzip' ? gunzipSync(answer.body) : encoding === 'br' ? brotliDecompressSync(answer.body) : encoding === 'deflate' ? inflateSync(answer.body) : answer.body;
  return JSON.parse(raw.toString('utf8')) as T;
}

function multipart(fields: Record<string, string>, file: { name: string; content: string }): { body: Buffer; type: string } {
  const boundary = `----blazebook-soak-${randomBytes(8).toString('hex')}`;
  const parts = Object.entries(fields).map(
    ([name, value]) => `--${boundary}\r\nContent-Disposition: form-data; name="${name}"\r\n\r\n${value}\r\n`,
  );
  parts.push(
    `--${boundary}\r\nContent-Disposition: form-data; name="file"; filename="${file.name}"\r\nContent-Type: text/csv\r\n\r\n${file.content}\r\n--${boundary}--\r\n`,
  );
  return { body: Buffer.from(parts.join(''), 'utf8'), type: `multipart/form-data; boundary=${boundary}` };
}

// 2,500 candidates: the search input of `npm run bench:search` at 5 focal lengths.
const searchBody = JSON.stringify(searchInput(range(200, 150, 5)));
const traceBody = JSON.stringify({ design: exampleDesign });

type RouteStats = { latencies: number[]; statuses: Map<number, number>; networkErrors: number };
type EngineResult = Record<string, unknown>;

async function soak(engine: Engine, server: RunningServer): Promise<EngineResult> {
  const http1 = client(server.url);
  const rss: { t: number; kb: number }[] = [{ t: 0, kb: rssKb(server.pid) }];
  const inspector = inspectorUrl(server.output());
  const heapIdle = await liveHeap(inspector);
  try {
    const signIn = await http1.send('POST', '/api/auth/sign-in', JSON.stringify({ email: demoUsers[0].email, password: demoPassword }));
    if (signIn.status !== 200) throw new Error(`sign-in failed: ${signIn.status} ${signIn.body.toString()}`);
    http1.setCookie(signIn.headers['set-cookie']);
    const teams = json<{ teams: { id: string; name: string }[] }>(await http1.send('GET', '/api/teams'));
    const teamId = teams.teams.find((t) => t.name === demoTeamName)!.id;
    const list = json<{ designs: { id: string; title: string; latestVersion: number }[]; total: number }>(
      await http1.send('GET', `/api/teams/${teamId}/designs?sort=updated&pageSize=100`),
    );
    const demo = list.designs.find((d) => d.title === 'Teaching-lab visible scanner')!;
    const own = list.designs.filter((d) => d.title.startsWith('Bench design ')).slice(0, CONNECTIONS);
    if (own.length < CONNECTIONS) throw new Error(`only ${own.length} bench designs for ${CONNECTIONS} connections`);

    const stats = new Map<Route, RouteStats>(
      (Object.keys(routeNames) as Route[]).map((r) => [r, { latencies: [], statuses: new Map(), networkErrors: 0 }]),
    );
    const startedAt = performance.now();
    const measureFrom = startedAt + WARM_S * 1000;
    const endAt = measureFrom + SECONDS * 1000;
    const warmUp = { requests: 0, maxMs: 0 };
    const pacers = paced.map(([route, perMinute], i) => ({ route, intervalMs: 60_000 / perMinute, next: startedAt + i * 1000 }));
    const totalWeight = weighted.reduce((sum, [, w]) => sum + w, 0);
    const pick = (): Route => {
      const now = performance.now();
      for (const pacer of pacers) {
        if (now >= pacer.next) {
          pacer.next += pacer.intervalMs;
          return pacer.route;
        }
      }
      let r = Math.random() * totalWeight;
      for (const [route, w] of weighted) if ((r -= w) < 0) return route;
      return 'version';
    };

    let curveCount = 0;
    const worker = async (w: number) => {
      const design = own[w]!;
      let latest = design.latestVersion;
      let thread: { id: string; remarks: number } | null = null;
      while (performance.now() < endAt) {
        const route = pick();
        let method = 'GET';
        let url: string;
        let body: Buffer | string | undefined;
        let type: string | undefined;
        let chosen = route;
        switch (route) {
          case 'version':
            url = `/api/designs/${demo.id}/versions/${1 + (w % demo.latestVersion)}`;
            break;
          case 'list':
            url = `/api/teams/${teamId}/designs?sort=updated&pageSize=20`;
            break;
          case 'save':
            method = 'POST';
            url = `/api/designs/${design.id}/versions`;
            body = JSON.stringify({ baseVersion: latest, params: withSlits(10 + (latest % 90)), notes: 'Soak save.', message: `Soak save on v${latest}` });
            break;
          case 'remark':
          case 'thread':
            method = 'POST';
            if (!thread || thread.remarks >= REMARKS_PER_THREAD) {
              chosen = 'thread';
              url = `/api/designs/${design.id}/versions/${latest}/threads`;
              body = JSON.stringify({ pin: { kind: 'version' }, body: `Soak thread from connection ${w}: is the exit slit right here?`, mentions: [] });
            } else {
              url = `/api/threads/${thread.id}/remarks`;
              body = JSON.stringify({ body: `Soak remark ${thread.remarks} from connection ${w}.`, mentions: [] });
            }
            break;
          case 'sheet':
            url = `/api/designs/${design.id}/versions/${latest}/sheet.pdf`;
            break;
          case 'search':
            method = 'POST';
            url = '/api/search';
            body = searchBody;
            break;
          case 'trace':
            method = 'POST';
            url = '/api/trace';
            body = traceBody;
            break;
          case 'curve': {
            method = 'POST';
            url = `/api/teams/${teamId}/curves`;
            const n = curveCount++;
            const rows = range(400, 1.5, 200).map((nm, i) => `${nm},${(0.4 + 0.3 * Math.sin((i + n) / 30)).toFixed(4)}`);
            const form = multipart({ kind: 'grating-efficiency', name: `Soak curve ${n}` }, { name: `soak-${n}.csv`, content: `Wavelength (nm),Efficiency\n${rows.join('\n')}\n` });
            body = form.body;
            type = form.type;
            break;
          }
        }
        const t0 = performance.now();
        const s = t0 >= measureFrom ? stats.get(chosen)! : null;
        let answer: Answer;
        try {
          answer = await http1.send(method, url, body, type);
        } catch {
          if (s) s.networkErrors++;
          continue;
        }
        if (s) {
          s.latencies.push(performance.now() - t0);
          s.statuses.set(answer.status, (s.statuses.get(answer.status) ?? 0) + 1);
        } else {
          warmUp.requests++;
          warmUp.maxMs = Math.max(warmUp.maxMs, performance.now() - t0);
        }
        if (chosen === 'save') {
          if (answer.status === 201) latest = json<{ version: { number: number } }>(answer).version.number;
          else if (answer.status === 409) latest = json<{ error: { latest: { number: number } } }>(answer).error.latest.number;
        } else if (chosen === 'thread' && answer.status === 201) {
          thread = { id: json<{ thread: { id: string } }>(answer).thread.id, remarks: 1 };
        } else if (chosen === 'remark' && answer.status === 201 && thread) {
          thread.remarks++;
        }
      }
    };

    // The live heap under the same load at both ends of the measured time: 1.5 s before it starts
    // (the collection's pause falls on uncounted warm-up requests) and 1.5 s before it ends.
    const heapAt = (at: number) =>
      new Promise<LiveHeap>((resolve, reject) => setTimeout(() => liveHeap(inspector).then(resolve, reject), Math.max(0, at - performance.now())));
    const heapWarmP = heapAt(measureFrom - 1500);
    const heapEndP = heapAt(endAt - 1500);
    // Read after the traffic; a failure then is the soak's failure, not an unhandled rejection now.
    for (const pending of [heapWarmP, heapEndP]) pending.catch(() => undefined);
    let warmKb: number | null = null;
    const sampler = setInterval(() => {
      const t = (performance.now() - startedAt) / 1000;
      const kb = rssKb(server.pid);
      rss.push({ t: Math.round(t), kb });
      if (warmKb === null && t >= WARM_S) warmKb = kb;
    }, RSS_SAMPLE_MS);
    await Promise.all(Array.from({ length: CONNECTIONS }, (_, w) => worker(w)));
    clearInterval(sampler);
    const [heapWarm, heapEnd] = await Promise.all([heapWarmP, heapEndP]);
    const elapsedS = (performance.now() - measureFrom) / 1000;
    const endKb = rssKb(server.pid);
    rss.push({ t: Math.round(elapsedS), kb: endKb });
    const startKb = rss[0]!.kb;
    warmKb ??= startKb;
    // A point sample rides the garbage collector's sawtooth: the medians of the measured time's first
    // and last fifths show the trend.
    const measured = rss.filter((r) => r.t >= WARM_S);
    const fifth = Math.max(1, Math.floor(measured.length / 5));
    const medianKb = (samples: { kb: number }[]) => {
      const sorted = samples.map((r) => r.kb).sort((x, y) => x - y);
      return sorted[sorted.length >> 1] ?? NaN;
    };
    const earlyKb = medianKb(measured.slice(0, fifth));
    const lateKb = medianKb(measured.slice(-fifth));

    const routes = [...stats.entries()].map(([route, s]) => {
      const sorted = Float64Array.from(s.latencies).sort();
      let expected409 = 0;
      let expected429 = 0;
      let unexpected = s.networkErrors;
      for (const [status, count] of s.statuses) {
        if (status === 409) expected409 += count;
        else if (status === 429) expected429 += count;
        else if (status < 200 || status >= 300) unexpected += count;
      }
      return {
        route,
        name: routeNames[route],
        count: sorted.length + s.networkErrors,
        perSecond: sorted.length / elapsedS,
        p50Ms: percentile(sorted, 50),
        p99Ms: percentile(sorted, 99),
        maxMs: sorted.length ? sorted[sorted.length - 1]! : NaN,
        errors: unexpected,
        expected409,
        expected429,
        statuses: Object.fromEntries(s.statuses),
        networkErrors: s.networkErrors,
      };
    });
    const total = routes.reduce((sum, r) => sum + r.count, 0);
    return {
      engine,
      seconds: Number(elapsedS.toFixed(1)),
      connections: CONNECTIONS,
      requests: total,
      throughputPerSecond: Number((total / elapsedS).toFixed(1)),
      errors: routes.reduce((sum, r) => sum + r.errors, 0),
      expected409: routes.reduce((sum, r) => sum + r.expected409, 0),
      expected429: routes.reduce((sum, r) => sum + r.expected429, 0),
      rssStartMb: startKb / 1024,
      rssWarmMb: warmKb / 1024,
      rssEndMb: endKb / 1024,
      rssMaxMb: Math.max(...rss.map((r) => r.kb)) / 1024,
      rssEndOverStart: endKb / startKb,
      rssEndOverWarm: endKb / warmKb,
      rssEarlyMedianMb: earlyKb / 1024,
      rssLateMedianMb: lateKb / 1024,
      rssLateOverEarly: lateKb / earlyKb,
      rssTargetRatio: TARGET_RSS_RATIO,
      heapIdleMb: heapIdle.heapUsedMb,
      heapWarmMb: heapWarm.heapUsedMb,
      heapEndMb: heapEnd.heapUsedMb,
      heapEndOverWarm: heapEnd.heapUsedMb / heapWarm.heapUsedMb,
      externalIdleMb: heapIdle.externalMb,
      externalWarmMb: heapWarm.externalMb,
      externalEndMb: heapEnd.externalMb,
      warmUpSeconds: WARM_S,
      warmUpRequests: warmUp.requests,
      warmUpMaxMs: Math.round(warmUp.maxMs),
      routes,
      rssSamples: rss,
    };
  } finally {
    http1.close();
  }
}

function print(result: EngineResult) {
  const routes = result.routes as { name: string; count: number; perSecond: number; p50Ms: number; p99Ms: number; maxMs: number; errors: number; expected409: number; expected429: number }[];
  const pad = (s: string, n: number) => s.padEnd(n);
  const f = (n: number, d = 1) => (Number.isFinite(n) ? n.toFixed(d) : '–');
  console.log(`\n${result.engine === 'embedded' ? 'PGlite (embedded)' : 'PostgreSQL (server)'}: ${result.seconds} s at ${CONNECTIONS} connections`);
  console.log(`${pad('route', 32)}${pad('count', 9)}${pad('req/s', 9)}${pad('p50 ms', 9)}${pad('p99 ms', 9)}${pad('max ms', 9)}${pad('errors', 8)}409 / 429 (expected)`);
  for (const r of routes) {
    if (!r.count) continue;
    console.log(`${pad(r.name, 32)}${pad(String(r.count), 9)}${pad(f(r.perSecond), 9)}${pad(f(r.p50Ms), 9)}${pad(f(r.p99Ms), 9)}${pad(f(r.maxMs, 0), 9)}${pad(String(r.errors), 8)}${r.expected409} / ${r.expected429}`);
  }
  const n = (key: string) => result[key] as number;
  console.log(`(not counted: ${n('warmUpRequests')} requests in ${result.warmUpSeconds} s of warm-up, the slowest ${n('warmUpMaxMs')} ms)`);
  console.log(`throughput ${f(n('throughputPerSecond'), 0)} req/s over ${n('requests')} requests; unexpected errors ${n('errors')}; expected refusals: ${n('expected409')}×409, ${n('expected429')}×429`);
  console.log(
    `server RSS: ${f(n('rssStartMb'))} MB at start, ${f(n('rssWarmMb'))} MB after ${result.warmUpSeconds} s of warm-up, ${f(n('rssEndMb'))} MB at the end (max ${f(n('rssMaxMb'))}); end / start ${f(n('rssEndOverStart'), 2)}, end / warm ${f(n('rssEndOverWarm'), 2)} (target ≤ ${TARGET_RSS_RATIO})`,
  );
  console.log(
    `server RSS medians (samples every ${RSS_SAMPLE_MS / 1000} s): first fifth ${f(n('rssEarlyMedianMb'))} MB, last fifth ${f(n('rssLateMedianMb'))} MB; last / first ${f(n('rssLateOverEarly'), 2)}`,
  );
  console.log(
    `server live heap after a full collection: ${f(n('heapIdleMb'))} MB idle, ${f(n('heapWarmMb'))} MB as the measured time starts, ${f(n('heapEndMb'))} MB as it ends; end / start ${f(n('heapEndOverWarm'), 2)} (target ≤ ${TARGET_RSS_RATIO}); outside the heap (buffers, WebAssembly) ${f(n('externalIdleMb'))} → ${f(n('externalWarmMb'))} → ${f(n('externalEndMb'))} MB`,
  );
}

async function runEngine(engine: Engine, template: string): Promise<EngineResult> {
  let cluster: Cluster | undefined;
  let database: { url: string; drop(): Promise<void> } | undefined;
  let seeded: string | undefined;
  let server: RunningServer | undefined;
  try {
    const env: Record<string, string> = { NODE_ENV: 'production' };
    if (engine === 'embedded') {
      seeded = mkdtempSync(path.join(tmpdir(), 'blazebook-soak-'));
      cpSync(template, seeded, { recursive: true });
      await seedBenchData({ dataDir: seeded }, EXTRA_DESIGNS, CONNECTIONS);
    } else {
      let adminUrl = process.env.TEST_DATABASE_URL;
      if (!adminUrl) {
        console.log('Starting a throwaway PostgreSQL cluster (fsync on) …');
        cluster = await startCluster();
        adminUrl = cluster.url;
      }
      database = await createServerDatabase(adminUrl, 'blazebook_soak');
      await seedBenchData({ url: database.url, poolSize: 2 }, EXTRA_DESIGNS, CONNECTIONS);
      env.DATABASE_URL = database.url;
    }
    // The inspector on loopback, for the live heap (live-heap.ts); the port is the system's choice.
    server = await startServer(seeded ?? template, env, { from: 'sources', nodeArgs: ['--inspect=127.0.0.1:0'] });
    console.log(`${engine}: server ${server.pid} at ${server.url}; ${SECONDS} s of mixed traffic …`);
    const result = await soak(engine, server);
    print(result);
    return result;
  } finally {
    await server?.stop();
    if (seeded) rmSync(seeded, { recursive: true, force: true });
    await database?.drop().catch((error: unknown) => console.error(`could not drop the soak database: ${String(error)}`));
    cluster?.remove();
  }
}

const engines = (process.env.SOAK_ENGINES ?? 'embedded,server').split(',') as Engine[];
const { dataDirTemplate } = await ensureTemplate();
mkdirSync(artifactsDir, { recursive: true });
let failed = false;
for (const engine of engines) {
  let result: EngineResult;
  try {
    result = await runEngine(engine, dataDirTemplate);
  } catch (error) {
    failed = true;
    console.error(`${engine}: soak not run: ${(error as Error).message}`);
    result = { engine, notRun: (error as Error).message.split('\n')[0] };
  }
  writeFileSync(path.join(artifactsDir, `soak-${engine}.json`), `${JSON.stringify({ at: new Date().toISOString(), ...result }, null, 2)}\n`);
}
if (failed) process.exitCode = 1;
