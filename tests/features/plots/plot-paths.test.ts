import { scaleLinear } from 'd3-scale';
import { describe, expect, it } from 'vitest';
import {
  countRuns,
  flaggedIntervals,
  linePath,
  nearestIndex,
  valueExtent,
} from '../../../features/plots/plot-paths';
import { performanceSeries } from '../../../features/plots/series';
import { evaluateDesign } from '../../../features/solver';
import { exampleDesign, type Design } from '../../../shared/design';

const x = scaleLinear().domain([0, 10]).range([0, 100]);
const y = scaleLinear().domain([0, 1]).range([50, 0]);
const xs = [0, 1, 2, 3, 4, 5, 6, 7, 8, 9, 10];

describe('linePath', () => {
  it('draws one unbroken run when every value is there', () => {
    const d = linePath(
      xs,
      xs.map((v) => v / 10),
      x,
      y,
    );
    expect(countRuns(d)).toBe(1);
    expect(d.startsWith('M0,50')).toBe(true);
  });

  it('breaks the line where a value is null, one run per reachable stretch', () => {
    const ys = [0.1, 0.2, null, null, 0.5, 0.6, 0.7, null, 0.9, 1, 1];
    expect(countRuns(linePath(xs, ys, x, y))).toBe(3);
  });

  it('treats non-finite values as gaps too', () => {
    const ys = [0.1, Number.NaN, 0.3, 0.4, Number.POSITIVE_INFINITY, 0.6, 0.7, 0.8, 0.9, 1, 1];
    expect(countRuns(linePath(xs, ys, x, y))).toBe(3);
  });

  it('draws nothing when no value is there', () => {
    expect(
      linePath(
        xs,
        xs.map(() => null),
        x,
        y,
      ),
    ).toBe('');
  });
});

describe('flaggedIntervals', () => {
  it('merges consecutive flagged samples and reaches half-way to the neighbours', () => {
    const flagged = [false, false, true, true, false, false, false, true, false, false, true];
    expect(flaggedIntervals(xs, (i) => flagged[i]!)).toEqual([
      { startNm: 1.5, endNm: 3.5 },
      { startNm: 6.5, endNm: 7.5 },
      { startNm: 9.5, endNm: 10 },
    ]);
  });
});

describe('valueExtent and nearestIndex', () => {
  it('ignores missing values and widens a flat series so it can be scaled', () => {
    expect(valueExtent([null, 2, 5, null, 3])).toEqual([2, 5]);
    expect(valueExtent([null, null])).toBeNull();
    expect(valueExtent([4, 4])).toEqual([3.8, 4.2]);
  });

  it('finds the sample nearest a pointer position', () => {
    expect(nearestIndex(xs, 3.4)).toBe(3);
    expect(nearestIndex(xs, 3.6)).toBe(4);
    expect(nearestIndex(xs, -5)).toBe(0);
    expect(nearestIndex(xs, 50)).toBe(10);
  });
});

describe('performanceSeries from the solver', () => {
  it('leaves a gap in every angle-dependent series where the range runs past the mount’s reach', () => {
    // 1200 /mm with K = 15°: reach ends near 2d cos²K ≈ 1555 nm in first order (grating.ts).
    const far: Design = { ...exampleDesign, range: { startNm: 300, endNm: 1800 } };
    const data = performanceSeries(evaluateDesign(far, { points: 200 }).points);
    const x2 = scaleLinear().domain([300, 1800]).range([0, 300]);
    const y2 = scaleLinear().domain([0, 5]).range([100, 0]);
    expect(data.bandpassNm.some((v) => v === null)).toBe(true);
    expect(data.bandpassNm[0]).not.toBeNull();
    expect(data.bandpassNm[data.bandpassNm.length - 1]).toBeNull();
    expect(countRuns(linePath(data.wavelengthsNm, data.bandpassNm, x2, y2))).toBe(1);
    expect(data.gratingRotationDeg.filter((v) => v === null).length).toBe(
      data.bandpassNm.filter((v) => v === null).length,
    );
  });

  it('shades where other orders of the source land on the same angle', () => {
    // Source 200–1100 nm: second-order 300–550 nm lands on first-order 600–1100 nm (mλ = nλ').
    const data = performanceSeries(evaluateDesign(exampleDesign, { points: 200 }).points);
    expect(data.overlapIntervals.length).toBeGreaterThan(0);
    const first = data.overlapIntervals[0]!;
    expect(first.startNm).toBeGreaterThan(300);
    expect(first.startNm).toBeLessThan(420);
  });
});
