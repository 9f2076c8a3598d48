/**
 * Reading a measured curve at the solver's wavelengths: straight lines between its points and
 * nothing outside them (no extrapolation: a datasheet says nothing past its last point).
 */

/**
 * The curve's value at `wavelengthNm`, linear between the two neighbouring points, the point's own
 * value on a point, and null outside `[first, last]`. `wavelengthsNm` must increase strictly (the
 * curve schema guarantees it). Binary search: O(log n) per reading.
 */
export function interpolateCurve(
  wavelengthsNm: readonly number[],
  values: readonly number[],
  wavelengthNm: number,
): number | null {
  const n = wavelengthsNm.length;
  if (n === 0 || !(wavelengthNm >= (wavelengthsNm[0] as number)) || !(wavelengthNm <= (wavelengthsNm[n - 1] as number))) {
    return null;
  }
  let lo = 0;
  let hi = n - 1;
  while (hi - lo > 1) {
    const mid = (lo + hi) >> 1;
    if ((wavelengthsNm[mid] as number) <= wavelengthNm) lo = mid;
    else hi = mid;
  }
  const x0 = wavelengthsNm[lo] as number;
  const x1 = wavelengthsNm[hi] as number;
  const y0 = values[lo] as number;
  if (wavelengthNm === x0 || x1 === x0) return y0;
  const y1 = values[hi] as number;
  return y0 + ((y1 - y0) * (wavelengthNm - x0)) / (x1 - x0);
}

/** The span a curve covers, nm. */
export function curveSpanNm(wavelengthsNm: readonly number[]): { fromNm: number; toNm: number } | null {
  const n = wavelengthsNm.length;
  return n < 2 ? null : { fromNm: wavelengthsNm[0] as number, toNm: wavelengthsNm[n - 1] as number };
}
