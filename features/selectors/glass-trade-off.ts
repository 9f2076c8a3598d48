/**
 * The trade-off a coloured-glass stack is chosen by, in numbers: the width of the rising edge
 * (10 % to 90 % of the curve's own peak) and the peak itself, for the stack and for its first
 * filter alone at its reference thickness. Beer–Lambert raises the curve to a power, so thicker
 * or stacked glass gives a narrower edge and a lower peak. Pure: no React.
 */

import { absorptionFilterTransmission, stackTransmission } from '@/features/solver';
import { formatPercent, formatQuantity } from '@/shared/format';
import type { AbsorptionFilter } from '@/shared/selectors';
import { evenlySpaced } from './form-check';

/** Samples for the edge measurement: a 0.5 nm step over a 1000 nm range. */
export const EDGE_SAMPLES = 2001;

export interface EdgeFigures {
  /** Highest transmission in the range and where it is. */
  peak: number;
  peakNm: number;
  /** From the first 10 %-of-peak crossing to the next 90 %-of-peak crossing, nm; null when the range holds no rising edge. */
  edgeWidthNm: number | null;
}

/** Where the samples first cross `level` going up from index `from`, interpolated; null when they never do. */
function risingCrossing(xs: readonly number[], ys: readonly number[], level: number, from: number): { nm: number; index: number } | null {
  for (let i = Math.max(1, from); i < xs.length; i++) {
    const a = ys[i - 1]!;
    const b = ys[i]!;
    if (a < level && b >= level) {
      const t = (level - a) / (b - a);
      return { nm: xs[i - 1]! + t * (xs[i]! - xs[i - 1]!), index: i };
    }
  }
  return null;
}

/** Peak and rising-edge width of `transmission` across `[startNm, endNm]`. */
export function edgeFigures(transmission: (wavelengthNm: number) => number, startNm: number, endNm: number): EdgeFigures {
  const xs = evenlySpaced(startNm, endNm, EDGE_SAMPLES);
  const ys = xs.map(transmission);
  let peakIndex = 0;
  ys.forEach((y, i) => {
    if (y > ys[peakIndex]!) peakIndex = i;
  });
  const peak = ys[peakIndex]!;
  const low = ys[0]! < 0.1 * peak ? risingCrossing(xs, ys, 0.1 * peak, 1) : null;
  const high = low ? risingCrossing(xs, ys, 0.9 * peak, low.index) : null;
  return { peak, peakNm: xs[peakIndex]!, edgeWidthNm: low && high ? high.nm - low.nm : null };
}

export interface TradeOff {
  stack: EdgeFigures;
  /** What the stack is compared with, in words ("Filter 1 alone at its reference thickness (3 mm)"). */
  baselineWords: string;
  /** The same, short enough for a figure's label ("Filter 1 alone"). */
  baselineShort: string;
  baseline: EdgeFigures;
  /** The sentence under the plot. */
  sentence: string;
}

/** A rising edge's width as the figures show it, "—" when the range holds none. */
export const edgeWidthText = (figures: EdgeFigures) =>
  figures.edgeWidthNm === null ? '—' : formatQuantity(figures.edgeWidthNm, 'nm', 3);

const edgeWords = (figures: EdgeFigures) =>
  figures.edgeWidthNm === null ? 'no rising edge in the range' : `10–90 % edge ${formatQuantity(figures.edgeWidthNm, 'nm', 3)}`;
const peakWords = (figures: EdgeFigures) => `peak ${formatPercent(figures.peak, { maximumFractionDigits: 1 })}`;

/**
 * The stack against its first filter alone at that filter's reference thickness; when the stack
 * is exactly that, against the same filter twice as thick (or two of it stacked, the same thing by
 * Beer–Lambert except for one more pair of surfaces).
 */
export function glassTradeOff(filters: readonly AbsorptionFilter[], startNm: number, endNm: number): TradeOff | null {
  const first = filters[0];
  if (!first) return null;
  const stack = edgeFigures((nm) => stackTransmission(filters, nm), startNm, endNm);
  const reference: AbsorptionFilter = { ...first, thicknessMm: first.referenceThicknessMm };
  const stackIsReference = filters.length === 1 && first.thicknessMm === first.referenceThicknessMm;
  if (stackIsReference) {
    const doubled: AbsorptionFilter = { ...first, thicknessMm: 2 * first.referenceThicknessMm };
    const twice = edgeFigures((nm) => absorptionFilterTransmission(doubled, nm), startNm, endNm);
    return {
      stack,
      baselineWords: `Twice as thick (${formatQuantity(doubled.thicknessMm, 'mm')})`,
      baselineShort: 'Twice as thick',
      baseline: twice,
      sentence:
        `This filter at its reference thickness: ${edgeWords(stack)}, ${peakWords(stack)}. ` +
        `Twice as thick (${formatQuantity(doubled.thicknessMm, 'mm')}), or two of it stacked: ${edgeWords(twice)}, ${peakWords(twice)}. ` +
        'Thicker or stacked glass sharpens the edge and lowers the peak.',
    };
  }
  const alone = edgeFigures((nm) => absorptionFilterTransmission(reference, nm), startNm, endNm);
  const baselineWords = `Filter 1 alone at its reference thickness (${formatQuantity(first.referenceThicknessMm, 'mm')})`;
  return {
    stack,
    baselineWords,
    baselineShort: 'Filter 1 alone',
    baseline: alone,
    sentence:
      `This stack: ${edgeWords(stack)}, ${peakWords(stack)}. ${baselineWords}: ${edgeWords(alone)}, ${peakWords(alone)}. ` +
      'Thicker or stacked glass sharpens the edge and lowers the peak.',
  };
}
