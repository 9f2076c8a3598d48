/**
 * Geometry of the three mounts. All three are constant-deviation mounts: the slits and mirrors
 * stay put and the grating turns, so the deviation `2K` is fixed by the layout.
 * - Czerny–Turner: separate collimator and camera mirrors, any focal lengths.
 * - Littrow: one element both collimates and focuses, light returns along its path: K = 0.
 * - Ebert–Fastie: one large mirror, two zones of it: collimator focal = camera focal.
 */

import type { Design } from '../../shared/design';
import { degToRad } from './math';

type Layout = Design['layout'];

/** `K`, half the deviation angle, in radians (0 for Littrow). */
export function halfDeviationRad(layout: Pick<Layout, 'deviationAngleDeg'>): number {
  return degToRad(layout.deviationAngleDeg) / 2;
}

/** `α = φ + K`. */
export function incidenceRad(rotationRad: number, halfDevRad: number): number {
  return rotationRad + halfDevRad;
}

/** `β = φ − K`. */
export function diffractionRad(rotationRad: number, halfDevRad: number): number {
  return rotationRad - halfDevRad;
}

/**
 * Width of the entrance-slit image at the exit over the slit width:
 * `(cos α / cos β) · (f_cam / f_col)`. Source: Palmer & Loewen, Diffraction Grating Handbook,
 * ch. 2 (anamorphic magnification `cos α / cos β`); the focal ratio is the imaging magnification.
 */
export function anamorphicMagnification(
  cosIncidence: number,
  cosDiffraction: number,
  collimatorFocalMm: number,
  cameraFocalMm: number,
): number {
  return (cosIncidence / cosDiffraction) * (cameraFocalMm / collimatorFocalMm);
}

/**
 * f-number of the collimated beam in the dispersion plane: collimator focal length over the ruled
 * width as the incoming beam sees it (`W cos α`). Common practice: the grating is the stop.
 */
export function fNumberProjectedWidth(
  collimatorFocalMm: number,
  ruledWidthMm: number,
  incidenceAngleRad: number,
): number {
  return collimatorFocalMm / (ruledWidthMm * Math.cos(incidenceAngleRad));
}

/** f-number along the slit: collimator focal length over the ruled height. */
export function fNumberHeight(collimatorFocalMm: number, ruledHeightMm: number): number {
  return collimatorFocalMm / ruledHeightMm;
}

/** Whether the layout has a separate collimator and camera whose comas can cancel each other. */
export function hasTwoMirrorPaths(kind: Layout['kind']): boolean {
  return kind !== 'littrow';
}
