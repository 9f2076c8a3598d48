/** Scan drive budget: how far the wavelength moves per unit of grating rotation. */

import { RAD_PER_ARCSEC } from './math';

/**
 * `|dλ/dφ| = 2d cos K cos φ / |m|` per arc-second, in nm. Differentiating `mλ = 2d cos K sin φ`.
 * Source: Palmer & Loewen, Diffraction Grating Handbook, ch. 2 (constant-deviation form).
 */
export function scanSensitivityNmPerArcsec(
  order: number,
  spacingNm: number,
  halfDeviationRad: number,
  rotationRad: number,
): number {
  return (
    ((2 * spacingNm * Math.cos(halfDeviationRad) * Math.cos(rotationRad)) / Math.abs(order)) *
    RAD_PER_ARCSEC
  );
}
