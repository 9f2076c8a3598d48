/**
 * How the trade study's curves are drawn: a decade (log₁₀) value axis, because the four selectors
 * span three or four decades of bandpass and resolving power, and one look per selector —
 * a dash pattern and a marker shape besides the colour, so the lines part in grey and print.
 * Pure (no React): the plot component and its tests read it.
 */

import type { TradeSelectorId } from '../solver/trade-study';
import type { Values } from '../plots/plot-paths';
import { formatNumber } from '../../shared/format';

export type MarkerShape = 'circle' | 'square' | 'triangle' | 'diamond';

export interface SelectorLook {
  /** SVG stroke-dasharray; undefined is a solid line. */
  dash: string | undefined;
  marker: MarkerShape;
  /** Words for the key and the summary: "solid line, circles". */
  words: string;
}

export const SELECTOR_LOOKS: Readonly<Record<TradeSelectorId, SelectorLook>> = {
  grating: { dash: undefined, marker: 'circle', words: 'solid line, circles' },
  prism: { dash: '7 4', marker: 'square', words: 'long dashes, squares' },
  'interference-filter': { dash: '2 3', marker: 'triangle', words: 'dotted line, triangles' },
  'coloured-glass': { dash: '9 3 2 3', marker: 'diamond', words: 'dash-dot line, diamonds' },
};

/** log₁₀ of each positive finite value; null elsewhere (a gap in the line). */
export function log10Values(values: Values): (number | null)[] {
  return values.map((v) => (v !== null && Number.isFinite(v) && v > 0 ? Math.log10(v) : null));
}

/**
 * Whole decades around every series' log values, `[floor(min), ceil(max)]`, at least one decade
 * tall; `[0, 1]` when there is nothing to show.
 */
export function decadeDomain(logSeries: readonly (readonly (number | null)[])[]): [number, number] {
  let lo = Number.POSITIVE_INFINITY;
  let hi = Number.NEGATIVE_INFINITY;
  for (const series of logSeries) {
    for (const v of series) {
      if (v === null) continue;
      if (v < lo) lo = v;
      if (v > hi) hi = v;
    }
  }
  if (!(lo <= hi)) return [0, 1];
  const from = Math.floor(lo);
  const to = Math.max(Math.ceil(hi), from + 1);
  return [from, to];
}

/** One tick per decade (every second one past six decades), labelled as plain numbers: 0.1, 1, 10, 1000. */
export function decadeTicks([from, to]: readonly [number, number]): { values: number[]; labels: string[] } {
  const step = to - from > 6 ? 2 : 1;
  const values: number[] = [];
  for (let k = from; k <= to; k += step) values.push(k);
  return { values, labels: values.map((k) => formatNumber(10 ** k, 1)) };
}

/** Indices for markers: about `count` of them evenly spread, each on a sample with a value. */
export function markerIndices(values: readonly (number | null)[], count: number, offset = 0): number[] {
  const n = values.length;
  if (n === 0 || count <= 0) return [];
  const stride = Math.max(1, Math.floor(n / count));
  const out: number[] = [];
  for (let i = Math.min(n - 1, Math.floor(offset * stride)); i < n; i += stride) {
    if (values[i] !== null && values[i] !== undefined) out.push(i);
  }
  return out;
}

/** SVG path of a marker of `size` px centred on (x, y). */
export function markerPath(shape: MarkerShape, x: number, y: number, size = 7): string {
  const h = size / 2;
  const r = (v: number) => Math.round(v * 10) / 10;
  switch (shape) {
    case 'circle':
      return `M${r(x - h)},${r(y)}a${h},${h} 0 1,0 ${size},0a${h},${h} 0 1,0 ${-size},0Z`;
    case 'square':
      return `M${r(x - h)},${r(y - h)}h${size}v${size}h${-size}Z`;
    case 'triangle':
      return `M${r(x)},${r(y - h - 1)}L${r(x + h + 0.5)},${r(y + h)}L${r(x - h - 0.5)},${r(y + h)}Z`;
    case 'diamond':
      return `M${r(x)},${r(y - h - 1)}L${r(x + h + 1)},${r(y)}L${r(x)},${r(y + h + 1)}L${r(x - h - 1)},${r(y)}Z`;
  }
}
