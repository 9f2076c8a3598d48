/**
 * Design sheet benchmark: the median time to build the sample version's sheet and the sample
 * compare sheet in memory (solver run, sections drawn, fonts subset, file written), and their
 * sizes, against issue 14's targets for one version: ≤ 300 ms and ≤ 400 KB. The first build is
 * shown apart: it reads the font files and warms the code up. The process's CPU time per build
 * (all its threads, the garbage collector's included, so it can exceed the wall clock) is shown
 * beside the wall-clock time: on a machine shared with other work the wall clock also waits for a
 * core, the CPU time does not. Prints figures only; run with
 * `npm run bench:sheet`.
 */

import { buildCompareSheet, buildSheet } from '../server/sheets/build';
import { sampleCompareSheet, sampleSheet } from '../tests/server/sheets/sample';
import { writeFigures } from './figures';

const RUNS = 15;
const WARM_UP = 3;
const TARGET_MS = 300;
const TARGET_KB = 400;

type Case = { name: string; build: () => Promise<Buffer> };

/**
 * Each run starts from plain values, as the route starts from the database's rows: the solver's
 * sweep and table rows (`sheetContext`, inside the sample builders) are timed with the drawing.
 */
const cases: Case[] = [
  { name: 'version sheet (sample, A4)', build: () => buildSheet(sampleSheet()) },
  { name: 'version sheet (sample, Letter)', build: () => buildSheet(sampleSheet({ paper: 'letter' })) },
  { name: 'compare sheet (sample, A4)', build: () => buildCompareSheet(sampleCompareSheet()) },
];

const median = (values: number[]) => {
  const sorted = [...values].sort((a, b) => a - b);
  const mid = sorted.length >> 1;
  return sorted.length % 2 ? sorted[mid]! : (sorted[mid - 1]! + sorted[mid]!) / 2;
};
const mark = (ok: boolean) => (ok ? 'ok' : 'OVER');

const cpuMs = (since: NodeJS.CpuUsage) => {
  const used = process.cpuUsage(since);
  return (used.user + used.system) / 1000;
};

console.log(['sheet', 'first ms', `median ms (${RUNS})`, 'min–max ms', 'median CPU ms', 'KB', 'pages', `≤ ${TARGET_MS} ms`, `≤ ${TARGET_KB} KB`].join('\t'));
const rows: { name: string; firstMs: number; medianMs: number; medianCpuMs: number; kb: number; pages: number }[] = [];
for (const { name, build } of cases) {
  let start = performance.now();
  const first = await build();
  const firstMs = performance.now() - start;
  for (let i = 1; i < WARM_UP; i++) await build();
  const times: number[] = [];
  const cpu: number[] = [];
  let bytes = first;
  for (let i = 0; i < RUNS; i++) {
    const cpuStart = process.cpuUsage();
    start = performance.now();
    bytes = await build();
    times.push(performance.now() - start);
    cpu.push(cpuMs(cpuStart));
  }
  const ms = median(times);
  const kb = bytes.length / 1024;
  // pdfkit writes one "/Type /Page" object per page (and "/Type /Pages" once for the tree).
  const pages = (bytes.toString('latin1').match(/\/Type \/Page\b(?!s)/g) ?? []).length;
  rows.push({ name, firstMs, medianMs: ms, medianCpuMs: median(cpu), kb, pages });
  console.log(
    [name, firstMs.toFixed(0), ms.toFixed(0), `${Math.min(...times).toFixed(0)}–${Math.max(...times).toFixed(0)}`, median(cpu).toFixed(0), kb.toFixed(0), pages, mark(ms <= TARGET_MS), mark(kb <= TARGET_KB)].join('\t'),
  );
}
writeFigures('sheet', { runs: RUNS, targetMs: TARGET_MS, targetKb: TARGET_KB, rows });
