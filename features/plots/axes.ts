/**
 * Value axes of a plot: which series share one, its scale and ticks, and how much room the tick
 * labels need. Pure (d3-scale only), so the sizes can be tested without rendering.
 */

import { scaleLinear, type ScaleLinear } from 'd3-scale';
import { valueExtent, type Values } from './plot-paths';

/** Tick label size, px. */
export const TICK_PX = 11;
/**
 * Advance width of one character of the tick font (IBM Plex Mono: 600 units of a 1000-unit em,
 * the same for every glyph), as a fraction of the font size.
 */
export const MONO_ADVANCE_EM = 0.6;
/** Band along the outer edge that holds the rotated axis title (one line of TICK_PX text). */
export const TITLE_BAND_PX = 18;
/** Tick mark length plus the gap between a tick and its label. */
export const TICK_GAP_PX = 6;
/** Room left of the first and right of the last x tick label when there is no value axis there. */
export const MIN_SIDE_PX = 16;

export interface AxisSeries {
  unit: string;
  label: string;
  axisTitle?: string;
  values: Values;
  tickFormat?: string;
  domain?: [number, number];
  /**
   * For a second series: 'shared' draws it against the first series' axis (one value scale);
   * 'own' gives it a right-hand axis. By default it shares when it measures the same thing
   * (same unit and axis title), as two versions of one figure do.
   */
  axis?: 'shared' | 'own';
}

/** The axis title of a series: its own, else its unit, else its label. */
export function axisTitleOf(series: AxisSeries): string {
  return series.axisTitle ?? (series.unit || series.label);
}

/** Whether `second` is drawn against the first series' axis rather than one of its own. */
export function sharesAxis(first: AxisSeries, second: AxisSeries): boolean {
  if (second.axis) return second.axis === 'shared';
  return first.unit === second.unit && axisTitleOf(first) === axisTitleOf(second);
}

/**
 * A nice linear scale from `bottom` (low values) to `top` over every given series: a fixed
 * `domain` when the first has one, else the union of their extents.
 */
export function valueScale(
  series: readonly AxisSeries[],
  top: number,
  bottom: number,
): ScaleLinear<number, number> {
  const fixed = series[0]?.domain;
  if (fixed) return scaleLinear().domain(fixed).range([bottom, top]);
  const extents = series.map((s) => valueExtent(s.values)).filter((e): e is [number, number] => e !== null);
  const domain: [number, number] =
    extents.length === 0
      ? [0, 1]
      : [Math.min(...extents.map((e) => e[0])), Math.max(...extents.map((e) => e[1]))];
  return scaleLinear().domain(domain).range([bottom, top]).nice(5);
}

/** The ticks of a value axis and their labels as drawn. */
export function valueTicks(scale: ScaleLinear<number, number>, tickFormat?: string): { values: number[]; labels: string[] } {
  const values = scale.ticks(5);
  const format = scale.tickFormat(5, tickFormat);
  return { values, labels: values.map(format) };
}

/** Width of the widest label in the tick font, px (characters, not UTF-16 units, so "−" is one). */
export function labelWidthPx(labels: readonly string[], fontPx = TICK_PX): number {
  const longest = labels.reduce((n, label) => Math.max(n, Array.from(label).length), 0);
  return Math.ceil(longest * MONO_ADVANCE_EM * fontPx);
}

/** Room a value axis takes beside the plot area: title band, widest tick label, tick gap. */
export function axisMarginPx(labels: readonly string[]): number {
  return TITLE_BAND_PX + labelWidthPx(labels) + TICK_GAP_PX + 2;
}
