/**
 * The grating equation in the form a constant-deviation mount uses.
 *
 * Conventions (shared by the whole solver, the sketch and the exported JSON):
 * - Angles are measured from the grating normal, positive on the same side, so
 *   `mλ = d(sin α + sin β)` with α the incidence and β the diffraction angle.
 * - `K` is half the deviation angle (the full angle between incident and diffracted chief rays),
 *   `φ` the grating rotation: `α = φ + K`, `β = φ − K`, hence `mλ = 2d cos K sin φ`
 *   (Littrow, K = 0: `mλ = 2d sin φ`). Source: Palmer & Loewen, Diffraction Grating Handbook, ch. 2.
 * - `d` is the groove spacing in nm, `1e6 / grooveDensityPerMm`.
 * - A negative order turns the grating the other way: φ, α and β change sign together. Magnitudes
 *   that do not depend on which way the spectrum runs (dispersion, bandpass, resolving power,
 *   scan sensitivity) are reported as positive numbers; angles keep their sign.
 */

import { formatNumber } from '../../shared/format';
import { GRAZING_MARGIN_RAD, HALF_PI, NM_PER_MM, radToDeg } from './math';
import { diffractionRad, incidenceRad } from './mount';

/** Groove spacing `d = 1 / grooveDensity`, in nm. */
export function grooveSpacingNm(grooveDensityPerMm: number): number {
  return NM_PER_MM / grooveDensityPerMm;
}

/**
 * `sin φ = mλ / (2d cos K)`: the sine of the grating rotation that sends `wavelengthNm` through a
 * mount of half-deviation `halfDeviationRad`. Beyond ±1 no rotation delivers it.
 * Source: Palmer & Loewen, Diffraction Grating Handbook, ch. 2 (constant-deviation form).
 */
export function rotationSine(
  order: number,
  wavelengthNm: number,
  spacingNm: number,
  halfDeviationRad: number,
): number {
  return (order * wavelengthNm) / (2 * spacingNm * Math.cos(halfDeviationRad));
}

/**
 * True when the rotation `φ` keeps both `α = φ + K` and `β = φ − K` short of grazing.
 * `max(|α|, |β|) = |φ| + K` because K ≥ 0.
 */
export function anglesClearOfGrazing(rotationRad: number, halfDeviationRad: number): boolean {
  return Math.abs(rotationRad) + halfDeviationRad < HALF_PI - GRAZING_MARGIN_RAD;
}

/**
 * Longest wavelength the mount delivers in `order`: `|mλ| < 2d cos²K = d(1 + cos 2K)`, reached
 * when the incidence angle touches 90°. Longer wavelengths up to `2d cos K / |m|` still solve the
 * equation for sin φ but need |α| ≥ 90°.
 */
export function reachableMaxNm(order: number, spacingNm: number, halfDeviationRad: number): number {
  const cosK = Math.cos(halfDeviationRad);
  return (2 * spacingNm * cosK * cosK) / Math.abs(order);
}

/** Chief-ray angles at the grating for one wavelength, in radians. */
export interface GratingAnglesRad {
  rotationRad: number;
  incidenceRad: number;
  diffractionRad: number;
}

export type GratingSolution =
  | ({ reachable: true } & GratingAnglesRad)
  | { reachable: false; reason: string };

/**
 * Solves the constant-deviation grating equation for one wavelength, or says in plain words why
 * no grating angle can deliver it.
 */
export function solveGrating(
  order: number,
  wavelengthNm: number,
  spacingNm: number,
  halfDeviationRad: number,
): GratingSolution {
  const sinPhi = rotationSine(order, wavelengthNm, spacingNm, halfDeviationRad);
  const reason = unreachableReason(order, wavelengthNm, spacingNm, halfDeviationRad, sinPhi);
  if (reason !== null) return { reachable: false, reason };
  const rotationRad = Math.asin(sinPhi);
  return {
    reachable: true,
    rotationRad,
    incidenceRad: incidenceRad(rotationRad, halfDeviationRad),
    diffractionRad: diffractionRad(rotationRad, halfDeviationRad),
  };
}

/**
 * Why `wavelengthNm` cannot pass the mount, or `null` when it can. `sinPhi` may be passed when the
 * caller already has it.
 */
export function unreachableReason(
  order: number,
  wavelengthNm: number,
  spacingNm: number,
  halfDeviationRad: number,
  sinPhi = rotationSine(order, wavelengthNm, spacingNm, halfDeviationRad),
): string | null {
  if (!(wavelengthNm > 0) || !Number.isFinite(wavelengthNm)) {
    return 'not a positive wavelength';
  }
  const limitNm = reachableMaxNm(order, spacingNm, halfDeviationRad);
  if (!(Math.abs(sinPhi) <= 1)) {
    const equationLimitNm = (2 * spacingNm * Math.cos(halfDeviationRad)) / Math.abs(order);
    return (
      `beyond the grating equation in order ${order}: |mλ| would exceed 2d·cos K ` +
      `(${formatNumber(equationLimitNm)} nm in this order); this mount reaches at most ` +
      `${formatNumber(limitNm)} nm`
    );
  }
  const rotationRad = Math.asin(sinPhi);
  if (!anglesClearOfGrazing(rotationRad, halfDeviationRad)) {
    const steepestDeg = radToDeg(Math.abs(rotationRad) + halfDeviationRad);
    return (
      `needs the light to meet the grating ${formatNumber(steepestDeg)}° from its normal ` +
      `(90° is grazing); this mount reaches at most ${formatNumber(limitNm)} nm in order ${order}`
    );
  }
  return null;
}
