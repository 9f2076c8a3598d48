/**
 * Order sorting: which overlapping orders the design's long-pass filters block, and a proposed
 * filter plan that blocks them all.
 *
 * A grating set for λ in order m also sends `mλ/n` (order n) to the exit slit (orders.ts). A
 * long-pass filter in the beam removes the shorter of those, `n > |m|`, when its edge lies above
 * them; it cannot remove the longer ones (`n < |m|`, only present for |m| ≥ 2). Common practice
 * (Palmer & Loewen, Diffraction Grating Handbook, ch. 2 and ch. 13 on order sorting): a long-pass
 * whose cut-on lies above the shortest wavelength the next order could bring in, switched in
 * before the overlap starts, the next one switched in before the first's edge is reached.
 */

import type { Design } from '../../shared/design';
import { MAX_DESIGN_FILTERS, type OrderSortingFilter } from '../../shared/filters';

/** The proposed plan's choices. Each is common practice or from memory, as marked. */
export const ORDER_SORTING_RULES = {
  /**
   * A coloured-glass long-pass edge (blocking to full transmission) is a few per cent of its
   * cut-on wide (from memory: about 10 nm at 400 nm); the plan assumes 2.5 %.
   */
  edgeFraction: 0.025,
  /** Stock cut-ons are round numbers (common practice): 5 nm steps from 100 nm, 1 nm below. */
  cutOnStepNm: (nm: number) => (nm >= 100 ? 5 : nm >= 10 ? 1 : 0.1),
  /** A plan never proposes more filters than a design may carry. */
  maxFilters: MAX_DESIGN_FILTERS,
  /** Below this a filter in the beam is said to cut into the working wavelength. */
  attenuationWarning: 0.9,
} as const;

/**
 * Transmission of one long-pass filter: a straight ramp `edgeWidthNm` wide centred on the cut-on
 * (the 50 % point): 0 at and below `cutOnNm − edgeWidthNm/2`, 1 at and above
 * `cutOnNm + edgeWidthNm/2`. With no edge width it passes only above the cut-on.
 */
export function longPassTransmission(filter: OrderSortingFilter, wavelengthNm: number): number {
  const lo = filter.cutOnNm - filter.edgeWidthNm / 2;
  if (!(wavelengthNm > lo)) return 0;
  if (filter.edgeWidthNm <= 0) return 1;
  return Math.min(1, (wavelengthNm - lo) / filter.edgeWidthNm);
}

/** The filters in the beam while the instrument is set to `settingNm` (ends included). */
export function filtersInBeam(filters: readonly OrderSortingFilter[], settingNm: number): OrderSortingFilter[] {
  return filters.filter((f) => f.inFromNm <= settingNm && settingNm <= f.inToNm);
}

/** Product of the transmissions of `filters` at `wavelengthNm` (1 for none). */
export function filtersTransmission(filters: readonly OrderSortingFilter[], wavelengthNm: number): number {
  let t = 1;
  for (const f of filters) t *= longPassTransmission(f, wavelengthNm);
  return t;
}

/**
 * The wavelength at and below which the filters block everything: the highest ramp foot among
 * them (−∞ for none). Long-pass filters in series pass a wavelength only where each passes it.
 */
export function blockedUpToNm(filters: readonly OrderSortingFilter[]): number {
  let edge = Number.NEGATIVE_INFINITY;
  for (const f of filters) edge = Math.max(edge, f.cutOnNm - f.edgeWidthNm / 2);
  return edge;
}

/**
 * The highest ramp foot among the filters in the beam at `settingNm` (−∞ for none): the same as
 * `blockedUpToNm(filtersInBeam(filters, settingNm))` without building the list, as the solver asks
 * it at every wavelength.
 */
export function blockedUpToAtSettingNm(filters: readonly OrderSortingFilter[], settingNm: number): number {
  let edge = Number.NEGATIVE_INFINITY;
  for (const f of filters) {
    if (f.inFromNm <= settingNm && settingNm <= f.inToNm) edge = Math.max(edge, f.cutOnNm - f.edgeWidthNm / 2);
  }
  return edge;
}

/** What the filters in the beam at `settingNm` pass of the working wavelength itself (1 for none). */
export function transmissionAtSetting(filters: readonly OrderSortingFilter[], settingNm: number): number {
  let t = 1;
  for (const f of filters) {
    if (f.inFromNm <= settingNm && settingNm <= f.inToNm) t *= longPassTransmission(f, settingNm);
  }
  return t;
}

/**
 * How many orders `n ≠ |m|` put a source wavelength `|m|λ/n` on λ that the filters do not block:
 * `λ' ∈ [sourceMin, sourceMax]` and `λ' > blockedUpTo`. Closed form, like `overlapCount`.
 */
export function unblockedOverlapCount(
  order: number,
  wavelengthNm: number,
  sourceMinNm: number,
  sourceMaxNm: number,
  blockedUpToNm: number,
): number {
  const absOrder = Math.abs(order);
  const product = absOrder * wavelengthNm;
  const lo = Math.max(1, Math.ceil(product / sourceMaxNm));
  let hi = Math.floor(product / sourceMinNm);
  if (blockedUpToNm >= sourceMinNm) {
    // λ' > edge ⟺ n < product / edge.
    hi = Math.min(hi, Math.ceil(product / blockedUpToNm) - 1);
  }
  if (!(hi >= lo)) return 0;
  return hi - lo + 1 - (lo <= absOrder && absOrder <= hi ? 1 : 0);
}

function floorTo(value: number, step: number): number {
  // The small nudge keeps 395 from flooring to 390 when it arrives as 394.99999999.
  return Math.floor(value / step + 1e-9) * step;
}

/** A filter's numbers on the step they were chosen on, without binary-fraction tails. */
function tidy(value: number): number {
  return Number(value.toPrecision(12));
}

/**
 * A filter plan that leaves no shorter overlapping order unblocked across the design's range
 * (see the module note). Empty when no overlap exists (a range inside one octave of the source).
 * Longer overlaps (n < |m|) are left: a long-pass cannot block them, and the solver's
 * `unblockedOverlaps` still counts them.
 */
export function proposeOrderSortingPlan(design: Design): OrderSortingFilter[] {
  const { range, grating } = design;
  const sourceMinNm = design.source?.minNm ?? range.startNm;
  const sourceMaxNm = design.source?.maxNm ?? range.endNm;
  const m = Math.abs(grating.order);
  const ratio = (m + 1) / m;
  // The first setting where order |m|+1 brings in source light: |m|λ/(|m|+1) = sourceMin.
  const firstOverlapNm = sourceMinNm * ratio;
  let fromNm = Math.max(range.startNm, firstOverlapNm);
  const plan: OrderSortingFilter[] = [];
  while (fromNm < range.endNm && plan.length < ORDER_SORTING_RULES.maxFilters) {
    // Tidied only downwards: a switch-in a hair after the range start would leave it unfiltered.
    const inFromNm = tidy(fromNm) <= fromNm ? tidy(fromNm) : fromNm;
    const edgeWidthNm = tidy(Math.max(0.01, floorTo(inFromNm * ORDER_SORTING_RULES.edgeFraction, 0.01)));
    // Full transmission from the switch-in point on: cut-on + edge/2 ≤ from.
    const step = ORDER_SORTING_RULES.cutOnStepNm(inFromNm);
    let cutOnNm = tidy(floorTo(inFromNm - edgeWidthNm / 2, step));
    // floorTo's nudge can round up by a hair; the filter must pass its own first setting in full.
    if (cutOnNm + edgeWidthNm / 2 > inFromNm) cutOnNm = tidy(cutOnNm - step);
    const blockedNm = cutOnNm - edgeWidthNm / 2;
    if (!(blockedNm > 0)) break;
    // Blocks order |m|+1 (and so every higher one) until |m|λ/(|m|+1) reaches its ramp foot; once
    // the foot is above the whole source, nothing shorter gets through at any setting.
    const reachNm = blockedNm >= sourceMaxNm ? Number.POSITIVE_INFINITY : blockedNm * ratio;
    const toNm = reachNm >= range.endNm ? range.endNm : tidy(floorTo(reachNm, reachNm > 100 ? 1 : 0.01));
    if (!(toNm > inFromNm)) break;
    plan.push({ kind: 'long-pass', cutOnNm, inFromNm, inToNm: toNm, edgeWidthNm });
    fromNm = toNm;
  }
  return plan;
}

/** Settings inside the range where the set of filters in the beam changes, ascending. */
export function filterChangesNm(filters: readonly OrderSortingFilter[], startNm: number, endNm: number): number[] {
  const changes = new Set<number>();
  for (const f of filters) {
    for (const nm of [f.inFromNm, f.inToNm]) if (nm > startNm && nm < endNm) changes.add(nm);
  }
  return [...changes].sort((a, b) => a - b);
}
