/**
 * One performance report: runs every benchmark as a child process, one after the other (solver,
 * search, trace, sheet, UI, the API on PGlite and on PostgreSQL, the soak on both engines), reads
 * the headline figures each leaves in tests/artifacts/bench-<name>.json (soak-<engine>.json for the
 * soak), and writes one Markdown table to tests/artifacts/bench.md: each figure beside its target
 * (from the issues that set them) and, where a floor is measured in the same run, the ratio to it.
 * Each child's output goes to the console and to tests/artifacts/bench-<name>.log.
 *
 * PostgreSQL: BENCH_DATABASE_URL or TEST_DATABASE_URL (a superuser's URL) when set, else a
 * throwaway cluster (scripts/pg-throwaway.ts, fsync on) started here and removed at the end; with
 * no PostgreSQL installed its rows say so. The soak runs SOAK_SECONDS (default here 30, after its
 * warm-up) per engine. BENCH_SKIP=soak,ui (any step names) keeps the figures a step last wrote
 * instead of running it, with their date in the table; BENCH_ONLY=… runs only those steps.
 *
 * `npm run bench`.
 */
import { spawn } from 'node:child_process';
import { createWriteStream, existsSync, mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { startCluster, type Cluster } from '../scripts/pg-throwaway';
import { artifactsDir } from './figures';

const rootDir = fileURLToPath(new URL('..', import.meta.url));

type Step = { name: string; file: string; env?: Record<string, string>; needsPostgres?: boolean; outputs: string[] };

const steps: Step[] = [
  { name: 'solver', file: 'bench/solver.bench.ts', outputs: ['bench-solver'] },
  { name: 'search', file: 'bench/search.bench.ts', outputs: ['bench-search'] },
  { name: 'trace', file: 'bench/trace.bench.ts', outputs: ['bench-trace'] },
  { name: 'sheet', file: 'bench/sheet.bench.ts', outputs: ['bench-sheet'] },
  { name: 'ui', file: 'bench/ui.bench.ts', outputs: ['bench-ui'] },
  { name: 'api-embedded', file: 'bench/api.bench.ts', outputs: ['bench-api-embedded'] },
  { name: 'api-server', file: 'bench/api.bench.ts', needsPostgres: true, outputs: ['bench-api-server'] },
  { name: 'soak', file: 'bench/soak.bench.ts', env: { SOAK_SECONDS: process.env.SOAK_SECONDS ?? '30' }, outputs: ['soak-embedded', 'soak-server'] },
];

const list = (value: string | undefined) => new Set((value ?? '').split(',').filter(Boolean));
const skip = list(process.env.BENCH_SKIP);
const only = list(process.env.BENCH_ONLY);
const runs = (step: Step) => !skip.has(step.name) && (only.size === 0 || only.has(step.name));

/** Runs one benchmark with its output on the console and in its log; resolves to its exit code. */
function runStep(step: Step, env: Record<string, string>): Promise<{ code: number | null; seconds: number }> {
  const started = performance.now();
  const log = createWriteStream(path.join(artifactsDir, `bench-${step.name}.log`));
  return new Promise((resolve) => {
    const child = spawn(process.execPath, ['--import', 'tsx', step.file], {
      cwd: rootDir,
      env: { ...process.env, ...env, ...step.env },
      stdio: ['ignore', 'pipe', 'pipe'],
    });
    for (const stream of [child.stdout, child.stderr]) {
      stream.on('data', (chunk: Buffer) => {
        process.stdout.write(chunk);
        log.write(chunk);
      });
    }
    child.once('exit', (code) => {
      log.end();
      resolve({ code, seconds: (performance.now() - started) / 1000 });
    });
  });
}

type Json = Record<string, unknown> & { at?: string; notRun?: string };
function read(name: string): Json | null {
  const file = path.join(artifactsDir, `${name}.json`);
  return existsSync(file) ? (JSON.parse(readFileSync(file, 'utf8')) as Json) : null;
}

// ——— run ———

const status = new Map<string, string>();
let cluster: Cluster | undefined;
let postgresUrl = process.env.BENCH_DATABASE_URL ?? process.env.TEST_DATABASE_URL;
let postgresMissing: string | null = null;
const startedAt = new Date();
mkdirSync(artifactsDir, { recursive: true });
try {
  for (const step of steps) {
    if (!runs(step)) {
      status.set(step.name, 'kept from an earlier run');
      continue;
    }
    const env: Record<string, string> = {};
    if (step.needsPostgres || step.name === 'soak') {
      if (!postgresUrl && !postgresMissing) {
        try {
          console.log('Starting a throwaway PostgreSQL cluster (fsync on) for the API and the soak …');
          cluster = await startCluster();
          postgresUrl = cluster.url;
        } catch (error) {
          postgresMissing = (error as Error).message.split('\n')[0]!;
        }
      }
      if (postgresUrl) {
        if (step.needsPostgres) env.BENCH_DATABASE_URL = postgresUrl;
        else env.TEST_DATABASE_URL = postgresUrl;
      } else if (step.needsPostgres) {
        status.set(step.name, `not run: ${postgresMissing}`);
        continue;
      } else {
        env.SOAK_ENGINES = 'embedded';
      }
    }
    console.log(`\n━━ ${step.name} (${step.file}) ━━`);
    const { code, seconds } = await runStep(step, env);
    status.set(step.name, code === 0 ? `ran in ${seconds.toFixed(0)} s` : `failed (exit ${code}) after ${seconds.toFixed(0)} s: see bench-${step.name}.log`);
  }
} finally {
  cluster?.remove();
}

// ——— the table ———

type Row = { area: string; figure: string; embedded: string; server?: string; target: string; floor: string; ratio: string; verdict: string };
const rows: Row[] = [];
const fmt = (n: unknown, digits = 1) => (typeof n === 'number' && Number.isFinite(n) ? n.toFixed(digits) : '–');
const int = (n: unknown) => (typeof n === 'number' && Number.isFinite(n) ? Math.round(n).toLocaleString('en-GB') : '–');
const verdict = (...checks: (boolean | null)[]) => {
  const known = checks.filter((c): c is boolean => c !== null);
  if (!known.length) return '';
  return known.every(Boolean) ? 'met' : '**missed**';
};
const le = (value: unknown, target: number) => (typeof value === 'number' && Number.isFinite(value) ? value <= target : null);
const ge = (value: unknown, target: number) => (typeof value === 'number' && Number.isFinite(value) ? value >= target : null);
const absent = (name: string, area: string) => {
  const why = status.get(name) ?? 'no figures';
  rows.push({ area, figure: '(no figures)', embedded: why.startsWith('not run') || why.startsWith('failed') ? why : 'no figures file', target: '', floor: '', ratio: '', verdict: '' });
};

const solver = read('bench-solver');
if (solver) {
  rows.push({ area: 'solver', figure: 'evaluateDesign, 1,000 λ (median)', embedded: `${fmt(solver.fullUs)} µs`, target: '≤ 1,000 µs; ≤ 3× floor', floor: `${fmt(solver.floorUs)} µs bare loop`, ratio: `${fmt(solver.ratio, 2)}×`, verdict: verdict(le(solver.fullUs, 1000), le(solver.ratio, 3)) });
  rows.push({ area: 'solver', figure: 'largest capped /api/solve request', embedded: `${fmt(solver.worstMs)} ms`, target: '', floor: '', ratio: '', verdict: '' });
} else absent('solver', 'solver');

const search = read('bench-search');
if (search) {
  rows.push({ area: 'search', figure: `${int(search.candidates)} candidates × 50 λ (median)`, embedded: `${fmt(search.fullMs)} ms`, target: '≤ 250 ms; ≤ 3× floor', floor: `${fmt(search.bareMs)} ms bare loop`, ratio: `${fmt(search.ratio, 2)}×`, verdict: verdict(le(search.fullMs, 250), le(search.ratio, 3)) });
  rows.push({ area: 'search', figure: 'candidates per second', embedded: int(search.candidatesPerSecond), target: '', floor: '', ratio: '', verdict: '' });
} else absent('search', 'search');

const trace = read('bench-trace');
if (trace) {
  rows.push({ area: 'trace', figure: `${int(trace.rays)} rays, Czerny–Turner (median)`, embedded: `${fmt(trace.traceMs, 2)} ms`, target: '≤ 15 ms; ≤ 2× floor', floor: `${fmt(trace.bareMs, 2)} ms bare loop`, ratio: `${fmt(trace.ratio, 2)}×`, verdict: verdict(le(trace.traceMs, 15), le(trace.ratio, 2)) });
  rows.push({ area: 'trace', figure: 'whole default traceDesign (median)', embedded: `${fmt(trace.traceDesignMs)} ms`, target: '', floor: '', ratio: '', verdict: '' });
} else absent('trace', 'trace');

const sheet = read('bench-sheet');
if (sheet) {
  for (const r of sheet.rows as { name: string; medianMs: number; medianCpuMs: number; kb: number; pages: number }[]) {
    const one = r.name.startsWith('version');
    rows.push({ area: 'sheet', figure: `${r.name}: median, size`, embedded: `${fmt(r.medianMs, 0)} ms (CPU ${fmt(r.medianCpuMs, 0)}), ${fmt(r.kb, 0)} KB, ${r.pages} p.`, target: one ? '≤ 300 ms, ≤ 400 KB' : '', floor: '', ratio: '', verdict: one ? verdict(le(r.medianMs, 300), le(r.kb, 400)) : '' });
  }
} else absent('sheet', 'sheet');

const ui = read('bench-ui');
const noExpoFloor = 'not measured¹';
if (ui) {
  rows.push({ area: 'UI', figure: 'workbench edit → sketch + 4 plots (median of 50)', embedded: `${fmt(ui.editMedianMs, 2)} ms (p90 ${fmt(ui.editP90Ms, 1)})`, target: '≤ 16 ms', floor: '', ratio: '', verdict: verdict(le(ui.editMedianMs, 16)) });
  rows.push({ area: 'UI', figure: 'web JS on a first visit, raw / gzip', embedded: `${fmt(ui.initialRawKb, 0)} / ${fmt(ui.initialGzipKb, 0)} KB`, target: '≤ 2,048 / ≤ 500 KB', floor: noExpoFloor, ratio: '', verdict: verdict(le(ui.initialRawKb, 2048), le(ui.initialGzipKb, 500)) });
  rows.push({ area: 'UI', figure: `all ${int(ui.chunks)} JS chunks, raw / gzip`, embedded: `${fmt(ui.allRawKb, 0)} / ${fmt(ui.allGzipKb, 0)} KB`, target: '', floor: noExpoFloor, ratio: '', verdict: '' });
  rows.push({ area: 'UI', figure: 'navigation → interactive workbench (median of 5)', embedded: `${fmt(ui.loadMedianMs, 0)} ms`, target: '≤ 1,500 ms', floor: '', ratio: '', verdict: verdict(le(ui.loadMedianMs, 1500)) });
} else absent('ui', 'UI');

type ApiRow = { name: string; reqPerSec: number; p50: number; p99: number; failed: number; statuses: string };
const apiEmbedded = read('bench-api-embedded');
const apiServer = read('bench-api-server');
if (apiEmbedded || apiServer) {
  const byName = (json: Json | null) => new Map(((json?.rows as ApiRow[] | undefined) ?? []).map((r) => [r.name, r]));
  const e = byName(apiEmbedded);
  const s = byName(apiServer);
  const floorE = e.get('GET bare Express (floor)');
  const floorS = s.get('GET bare Express (floor)');
  const cell = (r: ApiRow | undefined) => (r ? `${int(r.reqPerSec)} req/s, p50 ${r.p50} / p99 ${r.p99} ms${r.failed ? `, ${r.failed} non-2xx${r.statuses ? ` (${r.statuses})` : ''}` : ''}` : '–');
  // The cost of a route in multiples of the floor: its req/s against the bare route's.
  const ratio = (r: ApiRow | undefined, f: ApiRow | undefined) => (r && f && r.reqPerSec ? `${fmt(f.reqPerSec / r.reqPerSec, 1)}×` : '–');
  const names = [...new Set([...e.keys(), ...s.keys()])];
  for (const name of names) {
    const isFloor = name.includes('(floor)');
    const read = name.startsWith('GET') && !isFloor;
    const save = name.startsWith('POST save');
    const target = read ? '≥ 2,000 req/s, p99 ≤ 20 ms' : save ? 'p99 ≤ 50 ms' : '';
    const ok = (r: ApiRow | undefined) => (!r ? null : read ? (ge(r.reqPerSec, 2000) ?? false) && (le(r.p99, 20) ?? false) : save ? le(r.p99, 50) : null);
    rows.push({
      area: 'API, 32 connections',
      figure: name,
      embedded: cell(e.get(name)),
      server: apiServer ? cell(s.get(name)) : (status.get('api-server') ?? '–'),
      target,
      floor: isFloor ? '' : 'bare Express route',
      ratio: isFloor ? '' : `${ratio(e.get(name), floorE)} / ${apiServer ? ratio(s.get(name), floorS) : '–'}`,
      verdict: target ? verdict(ok(e.get(name)), apiServer ? ok(s.get(name)) : null) : '',
    });
  }
} else absent('api-embedded', 'API, 32 connections');

type SoakRoute = { name: string; count: number; p50Ms: number; p99Ms: number; errors: number; expected409: number; expected429: number };
const soakE = read('soak-embedded');
const soakS = read('soak-server');
if (soakE || soakS) {
  const has = (j: Json | null) => j && !j.notRun;
  const both = (pick: (j: Json) => string, j1 = soakE, j2 = soakS) => ({
    embedded: has(j1) ? pick(j1!) : (j1?.notRun ? `not run: ${j1.notRun}` : '–'),
    server: has(j2) ? pick(j2!) : (j2?.notRun ? `not run: ${j2.notRun}` : '–'),
  });
  const seconds = (j: Json) => `${fmt(j.seconds, 0)} s`;
  rows.push({ area: 'soak, 32 connections', figure: 'measured time, requests, throughput', ...both((j) => `${seconds(j)}, ${int(j.requests)} req, ${int(j.throughputPerSecond)} req/s`), target: '', floor: '', ratio: '', verdict: '' });
  rows.push({
    area: 'soak, 32 connections',
    figure: 'unexpected errors (expected 409 / 429)',
    ...both((j) => `${int(j.errors)} (${int(j.expected409)} / ${int(j.expected429)})`),
    target: '0',
    floor: '',
    ratio: '',
    verdict: verdict(...[soakE, soakS].filter(has).map((j) => j!.errors === 0)),
  });
  rows.push({
    area: 'soak, 32 connections',
    figure: 'server RSS at start (idle) → after warm-up → end; end / start',
    ...both((j) => `${fmt(j.rssStartMb, 0)} → ${fmt(j.rssWarmMb, 0)} → ${fmt(j.rssEndMb, 0)} MB; ${fmt(j.rssEndOverStart, 2)} (end / warm ${fmt(j.rssEndOverWarm, 2)})`),
    target: '≤ 1.20 (flat within 20 %)',
    floor: '',
    ratio: '',
    verdict: verdict(...[soakE, soakS].filter(has).map((j) => le(j!.rssEndOverStart, 1.2))),
  });
  // A single sample rides the garbage collector's sawtooth, and an idle process first grows to its
  // working set: the medians of the measured time's first and last fifths show whether it keeps growing.
  rows.push({
    area: 'soak, 32 connections',
    figure: 'server RSS under load: median of the last fifth / first fifth',
    ...both((j) => `${fmt(j.rssLateMedianMb, 0)} / ${fmt(j.rssEarlyMedianMb, 0)} MB = ${fmt(j.rssLateOverEarly, 2)}`),
    target: '≤ 1.20 (flat within 20 %)',
    floor: '',
    ratio: '',
    verdict: verdict(...[soakE, soakS].filter(has).map((j) => le(j!.rssLateOverEarly, 1.2))),
  });
  // What is still reachable after a full collection, under the same load at both ends: what grows
  // when something leaks, where the RSS also holds what the allocator keeps.
  rows.push({
    area: 'soak, 32 connections',
    figure: 'server live heap after a full collection: idle, start → end of the measured time',
    ...both((j) =>
      j.heapEndMb === undefined
        ? '–'
        : `${fmt(j.heapIdleMb, 0)}; ${fmt(j.heapWarmMb, 0)} → ${fmt(j.heapEndMb, 0)} MB = ${fmt(j.heapEndOverWarm, 2)}`,
    ),
    target: '≤ 1.20 (flat within 20 %)',
    floor: '',
    ratio: '',
    verdict: verdict(...[soakE, soakS].filter(has).map((j) => le(j!.heapEndOverWarm, 1.2))),
  });
  const routeNames = [...new Set([soakE, soakS].flatMap((j) => ((j?.routes as SoakRoute[] | undefined) ?? []).map((r) => r.name)))];
  for (const name of routeNames) {
    const route = (j: Json) => (j.routes as SoakRoute[]).find((r) => r.name === name);
    const cell = (j: Json) => {
      const r = route(j);
      return r && r.count ? `p50 ${fmt(r.p50Ms, 0)} / p99 ${fmt(r.p99Ms, 0)} ms (${int(r.count)})` : '–';
    };
    const read = name.startsWith('GET one version') || name.startsWith('GET design list');
    const save = name === 'POST save';
    rows.push({
      area: 'soak, 32 connections',
      figure: name,
      ...both(cell),
      target: read ? 'p99 ≤ 20 ms²' : save ? 'p99 ≤ 50 ms²' : '',
      floor: '',
      ratio: '',
      verdict: read || save ? verdict(...[soakE, soakS].filter(has).map((j) => { const r = route(j!); return r && r.count ? le(r.p99Ms, read ? 20 : 50) : null; })) : '',
    });
  }
} else absent('soak', 'soak, 32 connections');

const escape = (s: string) => s.replaceAll('|', '\\|');
const figureDates = [
  ...['bench-solver', 'bench-search', 'bench-trace', 'bench-sheet', 'bench-ui', 'bench-api-embedded', 'bench-api-server', 'soak-embedded', 'soak-server'].map((n) => [n, read(n)?.at] as const),
].filter(([, at]) => at);
const lines = [
  `# Blazebook performance report`,
  '',
  `Written by \`npm run bench\` on ${startedAt.toISOString()} (Node ${process.version}; a shared 2-core machine: compare ratios to floors between runs rather than absolute times).`,
  '',
  '| area | figure | measured (PGlite where it applies) | PostgreSQL | target | floor | ratio to floor | target met? |',
  '| --- | --- | --- | --- | --- | --- | --- | --- |',
  ...rows.map((r) => `| ${[r.area, r.figure, r.embedded, r.server ?? '', r.target, r.floor, r.ratio, r.verdict].map(escape).join(' | ')} |`),
  '',
  'Ratio to floor: the figure\'s time divided by the floor\'s in the same run (solver, search, trace); for the API, the bare route\'s req/s divided by the route\'s (PGlite / PostgreSQL), each against the floor measured in its own run.',
  '',
  '¹ The empty-Expo-export floor for the web bundle is not measured: it needs a second Expo project (its own app folder, package and Metro config) and a full `expo export` of it, minutes of both cores on this shared machine each run, for a figure that does not change between our runs. The bundle is compared with its absolute targets instead.',
  '',
  '² Targets set for the API bench\'s single-route runs (issue 6); the soak mixes every route, saves and PDFs included, on one server process, so they are shown for comparison.',
  '',
  'Steps: ' + steps.map((s) => `${s.name} — ${status.get(s.name) ?? 'not run'}`).join('; ') + '.',
  '',
  'Figures written at: ' + figureDates.map(([n, at]) => `${n} ${at}`).join(', ') + '.',
  '',
];
writeFileSync(path.join(artifactsDir, 'bench.md'), lines.join('\n'));
console.log(`\n${lines.join('\n')}`);
console.log(`Written to ${path.relative(rootDir, path.join(artifactsDir, 'bench.md'))}`);
if ([...status.values()].some((s) => s.startsWith('failed'))) process.exitCode = 1;
