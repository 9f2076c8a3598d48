/**
 * Solver hot-path benchmark: full `evaluateDesign` over 1,000 wavelengths against a bare loop of
 * the same closed forms (the floor: same trigonometry, no result objects, no warnings).
 * Prints figures only; run with `npm run bench:solver`.
 */

import { evaluateDesign } from '../features/solver/evaluate';
import { exampleDesign } from '../shared/design';

const POINTS = 1000;
const WARMUP_RUNS = 300;
const TIMED_RUNS = 2000;

function median(values: number[]): number {
  const sorted = [...values].sort((a, b) => a - b);
  const mid = sorted.length >> 1;
  return sorted.length % 2 ? sorted[mid]! : (sorted[mid - 1]! + sorted[mid]!) / 2;
}

/** The closed forms the solver evaluates per wavelength, summed so nothing is optimised away. */
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

console.log(`solver: evaluateDesign over ${POINTS} wavelengths (example design, ${TIMED_RUNS} runs after ${WARMUP_RUNS} warm-up)`);
console.log(`  median full evaluation : ${fullUs.toFixed(1)} µs`);
console.log(`  median bare loop       : ${floorUs.toFixed(1)} µs`);
console.log(`  ratio full / bare      : ${(fullUs / floorUs).toFixed(2)}`);
if (sink === 0) console.log('(unreachable: keeps the work observable)');
