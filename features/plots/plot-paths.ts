/**
 * The pure parts of a plot: the line's SVG path with gaps where a value is missing, the shaded
 * wavelength intervals, value domains and the nearest sample to a pointer. No React.
 */

import { bisectCenter, extent } from 'd3-array';
import type { ScaleLinear } from 'd3-scale';
import { line } from 'd3-shape';

export type Values = readonly (number | null)[];

export interface Interval {
  startNm: number;
  endNm: number;
}

/**
 * SVG path through `(xs[i], ys[i])`, broken (a new `M`) wherever `ys[i]` is null or not finite,
 * so an unreachable wavelength shows as a gap rather than a line drawn across it.
 */
export function linePath(
  xs: readonly number[],
  ys: Values,
  x: ScaleLinear<number, number>,
  y: ScaleLinear<number, number>,
): string {
  const indices = xs.map((_, i) => i);
  const path = line<number>()
    .defined((i) => {
      const v = ys[i];
      return v !== null && v !== undefined && Number.isFinite(v);
    })
    .x((i) => round(x(xs[i] as number)))
    .y((i) => round(y(ys[i] as number)));
  return path(indices) ?? '';
}

/** Number of separate runs in a path: its `M` commands. */
export function countRuns(d: string): number {
  return d.match(/M/g)?.length ?? 0;
}

/**
 * Runs of consecutive samples where `flagged(i)` holds, as wavelength intervals reaching half-way
 * to the neighbouring samples (so a single flagged sample still shades a visible band).
 */
export function flaggedIntervals(xs: readonly number[], flagged: (i: number) => boolean): Interval[] {
  const out: Interval[] = [];
  const n = xs.length;
  const edgeBefore = (i: number) =>
    i === 0 ? (xs[0] as number) : ((xs[i - 1] as number) + (xs[i] as number)) / 2;
  const edgeAfter = (i: number) =>
    i === n - 1 ? (xs[n - 1] as number) : ((xs[i] as number) + (xs[i + 1] as number)) / 2;
  let start = -1;
  for (let i = 0; i <= n; i++) {
    const on = i < n && flagged(i);
    if (on && start < 0) start = i;
    if (!on && start >= 0) {
      out.push({ startNm: edgeBefore(start), endNm: edgeAfter(i - 1) });
      start = -1;
    }
  }
  return out;
}

/** `[min, max]` of the finite values, widened when flat; null when there are none. */
export function valueExtent(values: Values): [number, number] | null {
  // d3's extent skips null and NaN but not ±Infinity, which a plot cannot scale to.
  const [lo, hi] = extent(values, (v) => (v !== null && Number.isFinite(v) ? v : undefined));
  if (lo === undefined || hi === undefined) return null;
  if (hi - lo < Math.abs(hi) * 1e-9 || hi === lo) {
    const pad = Math.abs(hi) > 0 ? Math.abs(hi) * 0.05 : 1;
    return [lo - pad, hi + pad];
  }
  return [lo, hi];
}

/** Index of the sample nearest `x` in the ascending `xs` (binary search); -1 when there are none. */
export function nearestIndex(xs: readonly number[], x: number): number {
  return xs.length === 0 ? -1 : bisectCenter(xs, x);
}

function round(value: number): number {
  return Math.round(value * 10) / 10;
}

/**
 * Diagonal hatching (45°, `spacingPx` apart) filling the band from x `a` to `b` between `top` and
 * `bottom`: a pattern that still reads in print and grey, where a tint alone would not.
 */
export function hatchPath(a: number, b: number, top: number, bottom: number, spacingPx = 7): string {
  const height = bottom - top;
  if (!(b > a) || !(height > 0)) return '';
  let d = '';
  // Each line rises one pixel per pixel to the right; its foot is at x0 on the bottom edge.
  for (let x0 = Math.floor((a - height) / spacingPx) * spacingPx; x0 <= b; x0 += spacingPx) {
    const t0 = Math.max(0, a - x0);
    const t1 = Math.min(height, b - x0);
    if (t1 <= t0) continue;
    d += `M${round(x0 + t0)},${round(bottom - t0)}L${round(x0 + t1)},${round(bottom - t1)}`;
  }
  return d;
}
