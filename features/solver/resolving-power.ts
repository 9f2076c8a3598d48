/** Resolving power: what the slits deliver and what the grating could. */

/** Grooves under the beam, `N = grooveDensity × ruled width`. */
export function grooveCount(grooveDensityPerMm: number, ruledWidthMm: number): number {
  return grooveDensityPerMm * ruledWidthMm;
}

/** `R = |m| N`. Source: Born & Wolf, Principles of Optics (resolving power of a grating). */
export function theoreticalResolvingPower(order: number, grooves: number): number {
  return Math.abs(order) * grooves;
}

/** Smallest resolvable interval, `λ / (|m| N)`, in nm. Source: Born & Wolf, Principles of Optics. */
export function diffractionLimitNm(wavelengthNm: number, order: number, grooves: number): number {
  return wavelengthNm / theoreticalResolvingPower(order, grooves);
}

/**
 * Width of the instrument's resolution element, nm: the slit-limited bandpass and the diffraction
 * limit added in quadrature, `√(bandpass² + (λ/|m|N)²)`. The instrument function is the slit
 * function convolved with the grating's diffraction pattern, and the FWHMs of convolved
 * near-Gaussian profiles add in quadrature (common practice). Taking the larger of the two instead
 * would claim up to √2 too much where they are equal.
 */
export function resolutionElementNm(bandpassNm: number, limitNm: number): number {
  return Math.hypot(bandpassNm, limitNm);
}

/**
 * Resolving power the instrument delivers, `λ / √(bandpass² + (λ/|m|N)²)` (see
 * `resolutionElementNm`). It stays below `|m| N` and approaches it as the slits close.
 */
export function resolvingPower(wavelengthNm: number, bandpassNm: number, limitNm: number): number {
  return wavelengthNm / resolutionElementNm(bandpassNm, limitNm);
}

/** Free spectral range `λ / |m|`, in nm. Source: Palmer & Loewen, Diffraction Grating Handbook, ch. 2. */
export function freeSpectralRangeNm(wavelengthNm: number, order: number): number {
  return wavelengthNm / Math.abs(order);
}
