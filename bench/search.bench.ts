/**
 * Candidate search benchmark: a 10,000-candidate search at 50 wavelengths each (the issue's
 * target: at most 250 ms), candidates per second, and the same 500,000 point evaluations through
 * a bare loop of the closed forms in the same run (target: the search within 3× of it), plus the
 * largest search the HTTP route accepts. Prints figures only; run with `npm run bench:search`.
 */

import { CHECKED_POINTS, planSearch, runSearch } from '../features/search/index';
import { SEARCH_LIMITS, searchRequestSchema, type SearchRequest } from '../shared/search';
import { writeFigures } from './figures';
import { range, searchInput } from './search-input';

const WARMUP_RUNS = 3;
const TIMED_RUNS = 15;

function median(values: number[]): number {
  const sorted = [...values].sort((a, b) => a - b);
  const mid = sorted.length >> 1;
  return sorted.length % 2 ? sorted[mid]! : (sorted[mid - 1]! + sorted[mid]!) / 2;
}

function timeMs(run: () => unknown, runs: number): number[] {
  const samples: number[] = [];
  for (let i = 0; i < runs; i++) {
    const t0 = process.hrtime.bigint();
    run();
    samples.push(Number(process.hrtime.bigint() - t0) / 1e6);
  }
  return samples;
}

// 10,000 candidates: 500 per focal length × 20 focal lengths.
const request: SearchRequest = searchRequestSchema.parse(searchInput(range(100, 50, 20)));
const CANDIDATES = planSearch(request).total;
const POINTS = CANDIDATES * CHECKED_POINTS;

/**
 * The floor, not a second search: per candidate and wavelength the closed forms the screen needs
 * (grating equation, reciprocal dispersion, anamorphic magnification, bandpass, resolving power,
 * blaze, overlap count, scan sensitivity) with no calls, columns or requirements, reduced so
 * nothing is optimised away. Nothing checks it against the engine.
 */
function bareLoop(): number {
  const s = request.search!;
  const wavelengths = Float64Array.from(range(400, 300 / (CHECKED_POINTS - 1), CHECKED_POINTS));
  const widthMm = 0.05;
  const arcsec = Math.PI / 648000;
  let sum = 0;
  for (const density of s.grooveDensitiesPerMm!) {
    const d = 1e6 / density;
    const N = density * 50;
    for (const blaze of s.blazeWavelengthsNm!) {
      for (const m of [1, -1]) {
        const absM = Math.abs(m);
        for (const dev of s.deviationAnglesDeg!) {
          const K = ((dev * Math.PI) / 180) / 2;
          const twoDCosK = 2 * d * Math.cos(K);
          const blazeK = blaze * Math.cos(K);
          for (const f of s.focalLengthsMm!) {
            let worstBp = 0;
            let worstR = Infinity;
            let minEff = Infinity;
            let overlapped = 0;
            let worstScan = 0;
            for (let i = 0; i < wavelengths.length; i++) {
              const lambda = wavelengths[i]!;
              const phi = Math.asin((m * lambda) / twoDCosK);
              const cosA = Math.cos(phi + K);
              const cosB = Math.cos(phi - K);
              const rld = (d * cosB) / (absM * f);
              const mag = cosA / cosB;
              const bp = rld * Math.max(widthMm * mag, widthMm);
              const lim = lambda / (absM * N);
              const r = lambda / Math.hypot(bp, lim);
              const x = Math.PI * (absM - blazeK / lambda);
              const sx = Math.abs(x) < 1e-8 ? 1 : Math.sin(x) / x;
              const product = absM * lambda;
              const hi = Math.floor(product / 380);
              const lo = Math.max(1, Math.ceil(product / 780));
              const scan = ((twoDCosK * Math.cos(phi)) / absM) * arcsec;
              if (bp > worstBp) worstBp = bp;
              if (r < worstR) worstR = r;
              if (sx * sx < minEff) minEff = sx * sx;
              if (hi - lo + 1 - (lo <= absM && absM <= hi ? 1 : 0) > 0) overlapped++;
              if (scan > worstScan) worstScan = scan;
            }
            sum += worstBp + worstR + minEff + overlapped + worstScan;
          }
        }
      }
    }
  }
  return sum;
}

let sink = 0;
const fullSearch = () => {
  sink += runSearch(request).candidates.length;
};
const screenOnly = () => {
  const run = planSearch(request);
  sink += run.step(run.total);
};
const floor = () => {
  sink += bareLoop();
};

timeMs(fullSearch, WARMUP_RUNS);
timeMs(screenOnly, WARMUP_RUNS);
timeMs(floor, WARMUP_RUNS);
// Interleaved, so drift in this machine's speed reaches all three alike.
const full: number[] = [];
const screen: number[] = [];
const bare: number[] = [];
for (let i = 0; i < TIMED_RUNS; i++) {
  full.push(...timeMs(fullSearch, 1));
  screen.push(...timeMs(screenOnly, 1));
  bare.push(...timeMs(floor, 1));
}
const fullMs = median(full);
const screenMs = median(screen);
const bareMs = median(bare);

// The largest search POST /api/search accepts: the stock lists (all densities, blazes, orders ±1…±3)
// widened to near the candidate cap, with every kind of requirement the screen judges (the
// footprint, through the sketch's geometry, is the dearest).
const largest: SearchRequest = searchRequestSchema.parse({
  range: { startNm: 300, endNm: 900 },
  source: { minNm: 200, maxNm: 1100 },
  detector: { pixelPitchUm: 14, pixelCount: 2048 },
  requirements: {
    maxBandpassNm: 1,
    minResolvingPower: 500,
    minBlazeEfficiency: 0.2,
    maxFNumber: 10,
    maxFocalLengthMm: 800,
    maxFootprintMm: { widthMm: 600, depthMm: 600 },
    minPixelsPerBandpass: 2,
    maxWavelengthErrorNm: 0.1,
    driveStepArcsec: 2,
    maxReciprocalDispersionNmPerMm: 20,
    orderOverlap: 'allowed',
  },
  search: { deviationAnglesDeg: range(10, 5, 5), focalLengthsMm: range(100, 50, 20) },
});
const largestTotal = planSearch(largest).total;
const largestMs = median(timeMs(() => (sink += runSearch(largest).considered), 5));

console.log(`search: ${CANDIDATES} candidates × ${CHECKED_POINTS} wavelengths (${POINTS} point evaluations), median of ${TIMED_RUNS} runs after ${WARMUP_RUNS} warm-up`);
console.log(`  whole search (plan, screen, rank, confirm top ${SEARCH_LIMITS.maxTop}) : ${fullMs.toFixed(1)} ms  (target ≤ 250 ms)`);
console.log(`  columnar screen alone                       : ${screenMs.toFixed(1)} ms`);
console.log(`  bare loop of the closed forms, same points  : ${bareMs.toFixed(1)} ms`);
console.log(`  candidates per second (whole search)        : ${Math.round(CANDIDATES / (fullMs / 1000))}`);
console.log(`  ratio whole search / bare loop              : ${(fullMs / bareMs).toFixed(2)}  (target ≤ 3)`);
console.log(`  ratio screen / bare loop                    : ${(screenMs / bareMs).toFixed(2)}`);
console.log(`  largest accepted search                     : ${largestTotal} candidates (cap ${SEARCH_LIMITS.maxCandidates}) in ${largestMs.toFixed(0)} ms median of 5`);
writeFigures('search', {
  candidates: CANDIDATES,
  fullMs,
  screenMs,
  bareMs,
  candidatesPerSecond: CANDIDATES / (fullMs / 1000),
  ratio: fullMs / bareMs,
  largestCandidates: largestTotal,
  largestMs,
});
if (sink === 0) console.log('(unreachable: keeps the work observable)');
