/**
 * Dispersion at one wavelength, given the diffraction angle. Magnitudes (positive whatever the
 * sign of the order): which way the spectrum runs is a property of the sketch, not of the numbers.
 */

import { DEG_PER_RAD } from './math';

/**
 * `|dβ/dλ| = |m| / (d cos β)` in rad/nm (incidence held fixed).
 * Source: Palmer & Loewen, Diffraction Grating Handbook, ch. 2.
 */
export function angularDispersionRadPerNm(
  order: number,
  spacingNm: number,
  cosDiffraction: number,
): number {
  return Math.abs(order) / (spacingNm * cosDiffraction);
}

export function angularDispersionDegPerNm(
  order: number,
  spacingNm: number,
  cosDiffraction: number,
): number {
  return angularDispersionRadPerNm(order, spacingNm, cosDiffraction) * DEG_PER_RAD;
}

/**
 * `dx/dλ = f_cam · |m| / (d cos β)` at the exit plane, in mm/nm (d in nm, f in mm).
 * Source: Palmer & Loewen, Diffraction Grating Handbook, ch. 2. Paraxial: at the tangential focus
 * of an off-axis camera mirror the true figure is smaller by about cos θ_cam.
 */
export function linearDispersionMmPerNm(
  order: number,
  spacingNm: number,
  cosDiffraction: number,
  cameraFocalMm: number,
): number {
  return (cameraFocalMm * Math.abs(order)) / (spacingNm * cosDiffraction);
}

/**
 * Reciprocal linear dispersion `d cos β / (|m| f_cam)`, in nm/mm.
 * Source: Palmer & Loewen, Diffraction Grating Handbook, ch. 2.
 */
export function reciprocalDispersionNmPerMm(
  order: number,
  spacingNm: number,
  cosDiffraction: number,
  cameraFocalMm: number,
): number {
  return (spacingNm * cosDiffraction) / (Math.abs(order) * cameraFocalMm);
}
