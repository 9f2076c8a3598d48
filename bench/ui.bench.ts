/**
 * Workbench responsiveness in headless Chromium, on the real exported app and server:
 * - one edit (a field change) until the sketch and the four 200-point plots are committed, median
 *   of 50 edits, read from the app's own performance marks;
 * - the exported web JS, raw and gzip;
 * - navigation → an interactive workbench, over loopback, median of 5 cold loads.
 * Prints figures only; run with `npm run bench:ui`.
 */
import { readdirSync, readFileSync, statSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { gzipSync } from 'node:zlib';
import { ensureWebBuild } from '../scripts/web-build';
import { ensureTemplate } from '../tests/support/db-template';
import { launchBrowser, startServer, viewports } from '../tests/support/live-server';
import { writeFigures } from './figures';

const rootDir = fileURLToPath(new URL('..', import.meta.url));
const EDITS = 50;
const LOADS = 5;

function median(values: number[]): number {
  const sorted = [...values].sort((a, b) => a - b);
  const mid = sorted.length >> 1;
  return sorted.length % 2 ? sorted[mid]! : (sorted[mid - 1]! + sorted[mid]!) / 2;
}

function jsFiles(dir: string): string[] {
  return readdirSync(dir).flatMap((entry) => {
    const full = path.join(dir, entry);
    if (statSync(full).isDirectory()) return jsFiles(full);
    return entry.endsWith('.js') ? [full] : [];
  });
}

ensureWebBuild(rootDir);
const files = jsFiles(path.join(rootDir, 'dist'));
const indexHtml = readFileSync(path.join(rootDir, 'dist', 'index.html'), 'utf8');
// What a first visit downloads (the scripts index.html names) and everything, lazy chunks included.
const initial = files.filter((file) => indexHtml.includes(path.basename(file)));
const rawSize = (list: string[]) => list.reduce((sum, file) => sum + statSync(file).size, 0);
const gzipSize = (list: string[]) =>
  list.reduce((sum, file) => sum + gzipSync(readFileSync(file), { level: 9 }).length, 0);

const server = await startServer((await ensureTemplate()).dataDirTemplate);
const browser = await launchBrowser();
try {
  const loads: number[] = [];
  for (let i = 0; i < LOADS; i++) {
    const context = await browser.newContext({ viewport: viewports.wide });
    const page = await context.newPage();
    await page.goto(`${server.url}/workbench`);
    await page.getByTestId('readout-bandpass').waitFor();
    await page.getByTestId('ray-sketch').waitFor();
    loads.push(await page.evaluate(() => performance.now()));
    await context.close();
  }

  const context = await browser.newContext({ viewport: viewports.wide });
  const page = await context.newPage();
  await page.goto(`${server.url}/workbench`);
  const field = page.getByTestId('field-grating.grooveDensityPerMm');
  await field.waitFor();
  const edits: number[] = [];
  // Never the value already there (1200): an edit that changes nothing renders nothing.
  const densities = ['1800', '2400', '600', '1200'];
  for (let i = 0; i < EDITS + 5; i++) {
    await page.evaluate(() => performance.clearMeasures('blazebook:edit'));
    await field.fill(densities[i % densities.length]!);
    // Plain arrows only: tsx would wrap named functions in a helper the page does not have.
    await page.waitForFunction(() => performance.getEntriesByName('blazebook:edit', 'measure').length > 0);
    const ms = await page.evaluate(
      () => performance.getEntriesByName('blazebook:edit', 'measure')[0]!.duration,
    );
    if (i >= 5) edits.push(ms); // the first few edits warm up the JIT
  }
  await context.close();

  const kb = (bytes: number) => `${(bytes / 1024).toFixed(0)} KB`;
  console.log(
    `workbench edit → sketch + 4 plots committed: median ${median(edits).toFixed(2)} ms over ${EDITS} edits (p90 ${[...edits].sort((a, b) => a - b)[Math.floor(EDITS * 0.9)]!.toFixed(2)} ms; target ≤ 16 ms)`,
  );
  console.log(
    `exported web JS loaded on a first visit: ${kb(rawSize(initial))} raw, ${kb(gzipSize(initial))} gzip; ` +
      `all ${files.length} chunks: ${kb(rawSize(files))} raw, ${kb(gzipSize(files))} gzip (target ≤ 2048 KB raw / ≤ 500 KB gzip)`,
  );
  console.log(
    `navigation → interactive workbench: median ${median(loads).toFixed(0)} ms over ${LOADS} cold loads (target ≤ 1500 ms)`,
  );
  writeFigures('ui', {
    editMedianMs: median(edits),
    editP90Ms: [...edits].sort((a, b) => a - b)[Math.floor(EDITS * 0.9)]!,
    initialRawKb: rawSize(initial) / 1024,
    initialGzipKb: gzipSize(initial) / 1024,
    allRawKb: rawSize(files) / 1024,
    allGzipKb: gzipSize(files) / 1024,
    chunks: files.length,
    loadMedianMs: median(loads),
  });
} finally {
  await browser.close();
  await server.stop();
}
