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
 * Resolving power the instrument delivers, `λ / bandpass`. When the slits are narrower than the
 * diffraction limit the grating sets the resolution, so the diffraction limit replaces the
 * bandpass: the figure never exceeds `|m| N`.
 */
export function resolvingPower(wavelengthNm: number, bandpassNm: number, limitNm: number): number {
  return wavelengthNm / Math.max(bandpassNm, limitNm);
}

/** Free spectral range `λ / |m|`, in nm. Source: Palmer & Loewen, Diffraction Grating Handbook, ch. 2. */
export function freeSpectralRangeNm(wavelengthNm: number, order: number): number {
  return wavelengthNm / Math.abs(order);
}
