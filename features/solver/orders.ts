/**
 * Order overlap. Light of wavelength `mλ/n` in order n leaves the grating at exactly the angle of
 * λ in order m (same `nλ'`), so anything the source emits there lands on the exit slit too.
 * Source: Palmer & Loewen, Diffraction Grating Handbook, ch. 2 (overlapping orders, free spectral range).
 */

import { MAX_LISTED_OVERLAPS } from '../../shared/solve-limits';

export interface Overlap {
  /** The other order, same sign as the working order. */
  order: number;
  /** Its wavelength that leaves at the same angle, `mλ / n`, nm. */
  wavelengthNm: number;
  /** True when an order-sorting filter in the beam at this setting removes it (order-sorting.ts). */
  blocked: boolean;
}

/**
 * How many overlapping orders are listed at one wavelength (a shared limit: the API contract
 * states it). A wide source in a high order has far more (order 1000 at 1 nm with a 0.001 nm–10 mm
 * source: about a million); listing 20 keeps one answer bounded, and `overlapCount` still says how
 * many there are.
 */
export { MAX_LISTED_OVERLAPS };

/** The shared empty list (frozen), so most wavelengths allocate nothing for overlaps. */
export const NO_OVERLAPS: readonly Overlap[] = Object.freeze([]);

/**
 * The orders |n| whose wavelength `|m|λ/|n|` lies within `[sourceMinNm, sourceMaxNm]`:
 * `ceil(|m|λ/max) … floor(|m|λ/min)`, never below 1. The working order itself is inside exactly
 * when λ is in the source range.
 */
function orderSpan(absOrder: number, wavelengthNm: number, sourceMinNm: number, sourceMaxNm: number) {
  const product = absOrder * wavelengthNm;
  return {
    product,
    lo: Math.max(1, Math.ceil(product / sourceMaxNm)),
    hi: Math.floor(product / sourceMinNm),
  };
}

/**
 * How many orders `n ≠ m` (same sign) put a source wavelength `mλ/n` on λ — listed or not.
 * Closed form, so a source spanning decades costs no more than a narrow one.
 */
export function overlapCount(
  order: number,
  wavelengthNm: number,
  sourceMinNm: number,
  sourceMaxNm: number,
): number {
  const absOrder = Math.abs(order);
  const { lo, hi } = orderSpan(absOrder, wavelengthNm, sourceMinNm, sourceMaxNm);
  if (!(hi >= lo)) return 0;
  return hi - lo + 1 - (lo <= absOrder && absOrder <= hi ? 1 : 0);
}

/**
 * The overlapping orders `n ≠ m` (same sign) whose wavelength `mλ/n` lies within
 * `[sourceMinNm, sourceMaxNm]`, in order of increasing |n|, at most `maxListed` of them.
 *
 * When there are more, the ones listed are those nearest the working order (up to half on each
 * side, the rest from whichever side has more): their wavelengths lie closest to λ, so they are
 * the hardest for an order-sorting filter or cross-disperser to remove (Palmer & Loewen, ch. 2,
 * free spectral range). For a first-order instrument that is simply the lowest orders 2, 3, ….
 * The work is proportional to the number listed, however many orders overlap.
 */
export function overlappingOrders(
  order: number,
  wavelengthNm: number,
  sourceMinNm: number,
  sourceMaxNm: number,
  maxListed: number = MAX_LISTED_OVERLAPS,
): readonly Overlap[] {
  const absOrder = Math.abs(order);
  const { product, lo, hi } = orderSpan(absOrder, wavelengthNm, sourceMinNm, sourceMaxNm);
  if (!(hi >= lo)) return NO_OVERLAPS;
  // Orders below and above |m| inside the span: two runs of consecutive integers.
  const belowTop = Math.min(hi, absOrder - 1);
  const aboveBottom = Math.max(lo, absOrder + 1);
  const below = Math.max(0, belowTop - lo + 1);
  const above = Math.max(0, hi - aboveBottom + 1);
  const cap = Math.max(0, Math.floor(maxListed));
  const fromBelow = Math.min(below, Math.max(Math.floor(cap / 2), cap - above));
  const fromAbove = Math.min(above, cap - fromBelow);
  if (fromBelow + fromAbove === 0) return NO_OVERLAPS;

  const sign = order < 0 ? -1 : 1;
  const list: Overlap[] = [];
  for (let n = belowTop - fromBelow + 1; n <= belowTop; n++)
    list.push({ order: sign * n, wavelengthNm: product / n, blocked: false });
  for (let n = aboveBottom; n < aboveBottom + fromAbove; n++)
    list.push({ order: sign * n, wavelengthNm: product / n, blocked: false });
  return list;
}
