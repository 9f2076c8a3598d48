/** The filter plan's words and figures for the card (and the design sheet). Pure: no React. */

import { longPassTransmission, type Evaluation } from '../solver/index';
import type { Design } from '../../shared/design';
import { filterFieldWords } from '../../shared/design-fields';
import type { OrderSortingFilter } from '../../shared/filters';
import { formatInteger, formatNumber, formatPercent, formatQuantity } from '../../shared/format';

/** Below this share of the working wavelength passed, a filter is said to cut into it (1 % off shows). */
export const CUTS_IN_BELOW = 0.995;

/** "1 unblocked overlap", "412 unblocked overlaps", "none left". */
export function unblockedWords(count: number): string {
  if (count === 0) return 'none left';
  return `${formatInteger(count)} unblocked overlap${count === 1 ? '' : 's'}`;
}

/** Whether the source can put another order on any wavelength of the range at all. */
export function overlapPossible(evaluation: Evaluation): boolean {
  return evaluation.points.some((p) => p.overlapCount > 0) || evaluation.orderSorting.proposedFilters.length > 0;
}

/** Where overlaps are left unblocked: the first and last evaluated wavelength with one; null when none. */
export function unblockedSpanNm(evaluation: Evaluation): { fromNm: number; toNm: number } | null {
  let fromNm = Infinity;
  let toNm = -Infinity;
  for (const p of evaluation.points) {
    if (p.unblockedOverlapCount <= 0) continue;
    fromNm = Math.min(fromNm, p.wavelengthNm);
    toNm = Math.max(toNm, p.wavelengthNm);
  }
  return fromNm === Infinity ? null : { fromNm, toNm };
}

export type FilterFacts = {
  /** The settings inside the range where the filter is in the beam; null when never inside it. */
  inBeamNm: { fromNm: number; toNm: number } | null;
  /** Least share of the working wavelength it passes while in the beam (at the span's short end). */
  leastPassed: number;
  /** Where that least share is, nm; null when never in the beam. */
  leastAtNm: number | null;
};

/**
 * What one filter does across the design's range. A long-pass edge passes more the longer the
 * wavelength (shared/filters.ts), so while it is in the beam it passes least of the working
 * wavelength at the short end of its span.
 */
export function filterFacts(filter: OrderSortingFilter, range: Design['range']): FilterFacts {
  const fromNm = Math.max(filter.inFromNm, range.startNm);
  const toNm = Math.min(filter.inToNm, range.endNm);
  if (!(toNm >= fromNm)) return { inBeamNm: null, leastPassed: 1, leastAtNm: null };
  return { inBeamNm: { fromNm, toNm }, leastPassed: longPassTransmission(filter, fromNm), leastAtNm: fromNm };
}

/** "In the beam from 400 to 580 nm" (within the range), or why it never is. */
export function inBeamText(facts: FilterFacts, range: Design['range']): string {
  if (!facts.inBeamNm) {
    return `Never in the beam inside the range (${formatNumber(range.startNm)}–${formatQuantity(range.endNm, 'nm')})`;
  }
  return `In the beam from ${formatNumber(facts.inBeamNm.fromNm, 6)} to ${formatQuantity(facts.inBeamNm.toNm, 'nm', 6)}`;
}

/** "Cuts into the working wavelength: passes 62 % at 400 nm"; null when it passes (nearly) all of it. */
export function cutsInText(facts: FilterFacts): string | null {
  if (facts.leastAtNm === null || facts.leastPassed >= CUTS_IN_BELOW) return null;
  return `Cuts into the working wavelength: passes ${formatPercent(facts.leastPassed)} at ${formatQuantity(facts.leastAtNm, 'nm', 6)}`;
}

/** One filter in a line: "long-pass, cut-on 390 nm, edge 10 nm, in the beam 400–580 nm". */
export function filterLine(filter: OrderSortingFilter): string {
  return (
    `${filter.kind}, ${filterFieldWords.cutOnNm.short} ${formatQuantity(filter.cutOnNm, 'nm', 6)}, ` +
    `edge ${formatQuantity(filter.edgeWidthNm, 'nm', 4)}, in the beam ${formatNumber(filter.inFromNm, 6)}–${formatQuantity(filter.inToNm, 'nm', 6)}`
  );
}

/** Whether two filter lists are the same filters, value for value. */
export function sameFilters(a: readonly OrderSortingFilter[] | undefined, b: readonly OrderSortingFilter[] | undefined): boolean {
  const x = a ?? [];
  const y = b ?? [];
  return (
    x.length === y.length &&
    x.every(
      (f, i) =>
        f.kind === y[i]?.kind &&
        f.cutOnNm === y[i]?.cutOnNm &&
        f.inFromNm === y[i]?.inFromNm &&
        f.inToNm === y[i]?.inToNm &&
        f.edgeWidthNm === y[i]?.edgeWidthNm,
    )
  );
}

/** "No filter needed: the source (200–380 nm) reaches no other order inside the range (300–380 nm)." */
export function noFilterNeededText(design: Design): string {
  const { startNm, endNm } = design.range;
  const source = design.source ? `the source (${formatNumber(design.source.minNm)}–${formatQuantity(design.source.maxNm, 'nm')})` : 'light inside the range';
  return `No filter needed: ${source} puts no other order on the range (${formatNumber(startNm)}–${formatQuantity(endNm, 'nm')}), which lies within one octave of it.`;
}
