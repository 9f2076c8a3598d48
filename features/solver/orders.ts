/**
 * Order overlap. Light of wavelength `mλ/n` in order n leaves the grating at exactly the angle of
 * λ in order m (same `nλ'`), so anything the source emits there lands on the exit slit too.
 * Source: Palmer & Loewen, Diffraction Grating Handbook, ch. 2 (overlapping orders, free spectral range).
 */

export interface Overlap {
  /** The other order, same sign as the working order. */
  order: number;
  /** Its wavelength that leaves at the same angle, `mλ / n`, nm. */
  wavelengthNm: number;
}

/**
 * A cap on how many overlapping orders are listed at one wavelength: more than this only happens
 * for a source reaching far into the X-ray side of the working wavelength.
 */
export const MAX_LISTED_OVERLAPS = 64;

/** The shared empty list (frozen), so most wavelengths allocate nothing for overlaps. */
export const NO_OVERLAPS: readonly Overlap[] = Object.freeze([]);

/**
 * Every order `n ≠ m` (same sign) whose wavelength `mλ/n` lies within `[sourceMinNm, sourceMaxNm]`,
 * in order of increasing |n|. `|n|` runs over `ceil(|m|λ/max) … floor(|m|λ/min)`.
 */
export function overlappingOrders(
  order: number,
  wavelengthNm: number,
  sourceMinNm: number,
  sourceMaxNm: number,
): readonly Overlap[] {
  const absOrder = Math.abs(order);
  const product = absOrder * wavelengthNm;
  const lo = Math.max(1, Math.ceil(product / sourceMaxNm));
  const hi = Math.min(Math.floor(product / sourceMinNm), lo + MAX_LISTED_OVERLAPS);
  if (hi < lo || (hi === lo && lo === absOrder)) return NO_OVERLAPS;
  const sign = order < 0 ? -1 : 1;
  const list: Overlap[] = [];
  for (let n = lo; n <= hi && list.length < MAX_LISTED_OVERLAPS; n++) {
    if (n === absOrder) continue;
    list.push({ order: sign * n, wavelengthNm: product / n });
  }
  return list.length === 0 ? NO_OVERLAPS : list;
}
