/** Where the order-sorting filters change on a plot against wavelength. Pure: no React. */

import type { OrderSortingFilter } from '../../shared/filters';
import { formatNumber, formatQuantity } from '../../shared/format';

export interface PlotMark {
  /** The setting (the working wavelength), nm. */
  nm: number;
  /** What happens there, in words drawn beside the line: "filter 2 in". */
  label: string;
}

/**
 * One mark per setting where the set of filters in the beam changes (the solver's
 * `filterChangesNm`), labelled with what goes in ("filter 2 in") — or, where only a filter comes
 * out, with that ("filter 1 out"). Filters count from 1, as the filter card lists them.
 */
export function filterChangeMarks(changesNm: readonly number[], filters: readonly OrderSortingFilter[]): PlotMark[] {
  return changesNm.map((nm) => {
    const goingIn = filters.flatMap((f, i) => (f.inFromNm === nm ? [i + 1] : []));
    const goingOut = filters.flatMap((f, i) => (f.inToNm === nm ? [i + 1] : []));
    const label =
      goingIn.length > 0
        ? `filter ${goingIn.join(' + ')} in`
        : goingOut.length > 0
          ? `filter ${goingOut.join(' + ')} out`
          : 'filters change';
    return { nm, label };
  });
}

/** The marks read out with the plot: "filter 1 in at 400 nm, filter 2 in at 780 nm". */
export function marksSummary(marks: readonly PlotMark[]): string {
  return marks.map((m) => `${m.label} at ${formatQuantity(m.nm, 'nm', 6)}`).join(', ');
}

/**
 * What the overlap shading covers, for the efficiency plot's accessible summary: "other orders
 * reach the slit unblocked between 402 and 900 nm", or that none do.
 */
export function overlapSummary(intervals: readonly { startNm: number; endNm: number }[], anyOverlap: boolean): string {
  if (intervals.length === 0) {
    return anyOverlap ? 'no overlapping order is left unblocked: the filters block them all' : 'no other order lands on the range';
  }
  const spans = intervals.map((iv) => `${formatNumber(iv.startNm)}–${formatQuantity(iv.endNm, 'nm')}`).join(', ');
  return `shaded where other orders reach the exit slit unblocked: ${spans}`;
}
