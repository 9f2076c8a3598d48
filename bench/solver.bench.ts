/**
 * Solver benchmark: full `evaluateDesign` over 1,000 wavelengths, a floor to compare it with, and
 * the largest request the solve API accepts.
 * Prints figures only; run with `npm run bench:solver`.
 */

import { evaluateDesign } from '../features/solver/evaluate';
import { exampleDesign, MAX_SOLVE_WAVELENGTHS, solveRequestSchema, type Design } from '../shared/design';
import { writeFigures } from './figures';

const POINTS = 1000;
const WARMUP_RUNS = 300;
const TIMED_RUNS = 2000;

function median(values: number[]): number {
  const sorted = [...values].sort((a, b) => a - b);
  const mid = sorted.length >> 1;
  return sorted.length % 2 ? sorted[mid]! : (sorted[mid - 1]! + sorted[mid]!) / 2;
}

/**
 * The floor, not a second solver: roughly the trigonometry one wavelength needs, with no calls,
 * result objects or warnings, summed so nothing is optimised away. Nothing checks it against the
 * solver. It is here because this machine's speed drifts from run to run, so `full / floor` is
 * the figure to compare between runs.
 */
function bareLoop(wavelengthsNm: Float64Array): number {
  const d = 1e6 / exampleDesign.grating.grooveDensityPerMm;
  const m = exampleDesign.grating.order;
  const absM = Math.abs(m);
  const K = ((exampleDesign.layout.deviationAngleDeg * Math.PI) / 180) / 2;
  const twoDCosK = 2 * d * Math.cos(K);
  const fCol = exampleDesign.layout.collimatorFocalMm;
  const fCam = exampleDesign.layout.cameraFocalMm;
  const wEnt = exampleDesign.slits.entranceWidthUm / 1000;
  const wExit = exampleDesign.slits.exitWidthUm / 1000;
  const N = exampleDesign.grating.grooveDensityPerMm * exampleDesign.grating.ruledWidthMm;
  const blazeK = (exampleDesign.grating.blazeWavelengthNm ?? 500) * Math.cos(K);
  const arcsec = Math.PI / 648000;
  let sum = 0;
  for (let i = 0; i < wavelengthsNm.length; i++) {
    const lambda = wavelengthsNm[i]!;
    const phi = Math.asin((m * lambda) / twoDCosK);
    const cosA = Math.cos(phi + K);
    const cosB = Math.cos(phi - K);
    const ang = absM / (d * cosB);
    const rld = (d * cosB) / (absM * fCam);
    const mag = (cosA / cosB) * (fCam / fCol);
    const img = wEnt * mag;
    const bp = rld * Math.max(img, wExit);
    const base = rld * (img + wExit);
    const top = rld * Math.abs(img - wExit);
    const lim = lambda / (absM * N);
    const x = Math.PI * (absM - blazeK / lambda);
    const s = Math.sin(x) / x;
    const scan = ((twoDCosK * Math.cos(phi)) / absM) * arcsec;
    sum += phi + ang + fCam * ang + rld + bp + base + top + lambda / Math.max(bp, lim) + s * s + scan + lambda / absM;
  }
  return sum;
}

function time(run: () => unknown, runs: number): number[] {
  const samples: number[] = [];
  for (let i = 0; i < runs; i++) {
    const t0 = process.hrtime.bigint();
    run();
    samples.push(Number(process.hrtime.bigint() - t0) / 1000);
  }
  return samples;
}

const { startNm, endNm } = exampleDesign.range;
const grid = Float64Array.from({ length: POINTS }, (_, i) => startNm + ((endNm - startNm) * i) / (POINTS - 1));
let sink = 0;
const full = () => {
  sink += evaluateDesign(exampleDesign, { points: POINTS }).points.length;
};
const floor = () => {
  sink += bareLoop(grid);
};

time(full, WARMUP_RUNS);
time(floor, WARMUP_RUNS);
const fullUs = median(time(full, TIMED_RUNS));
const floorUs = median(time(floor, TIMED_RUNS));

// The largest request POST /api/solve accepts: order −1000 (the minus signs make the longest
// JSON), as many wavelengths as allowed, all reachable, and a source from 0.001 nm to 10 mm, so
// every wavelength has about a million overlapping orders and lists 20. Timed as the server runs
// it on its thread: schema check, evaluation, JSON text (gzip runs off the thread).
const worstDesign: Design = {
  ...exampleDesign,
  grating: { ...exampleDesign.grating, order: -1000 },
  layout: { ...exampleDesign.layout, deviationAngleDeg: 120 },
  source: { minNm: 0.001, maxNm: 10_000_000 },
};
const worstBody = {
  design: worstDesign,
  // 1200 g/mm in order 1000 with 2K = 120° reaches 2d cos²K / 1000 ≈ 0.42 nm.
  at: Array.from(
    { length: MAX_SOLVE_WAVELENGTHS },
    (_, i) => 0.001 + ((0.41 - 0.001) * (i + 0.1)) / MAX_SOLVE_WAVELENGTHS,
  ),
};
const WORST_RUNS = 50;
let worstBytes = 0;
const worst = () => {
  const { design, at } = solveRequestSchema.parse(worstBody);
  worstBytes = Buffer.byteLength(JSON.stringify(evaluateDesign(design, { wavelengthsNm: at })));
};
time(worst, 5);
const worstUs = median(time(worst, WORST_RUNS));

console.log(`solver: evaluateDesign over ${POINTS} wavelengths (example design, ${TIMED_RUNS} runs after ${WARMUP_RUNS} warm-up)`);
console.log(`  median full evaluation : ${fullUs.toFixed(1)} µs`);
console.log(`  median floor           : ${floorUs.toFixed(1)} µs (bare trigonometry, not the solver)`);
console.log(`  ratio full / floor     : ${(fullUs / floorUs).toFixed(2)}`);
console.log(
  `  worst capped request   : ${(worstUs / 1000).toFixed(1)} ms median of ${WORST_RUNS} (parse + evaluate + JSON, ${MAX_SOLVE_WAVELENGTHS} wavelengths × 20 listed orders, ${(worstBytes / 1e6).toFixed(2)} MB)`,
);
writeFigures('solver', { points: POINTS, fullUs, floorUs, ratio: fullUs / floorUs, worstMs: worstUs / 1000, worstBytes });
if (sink === 0) console.log('(unreachable: keeps the work observable)');
