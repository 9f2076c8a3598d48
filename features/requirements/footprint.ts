/**
 * The mount's outline for the footprint requirement: the box around every optic and slit exactly
 * as the sketch places them, so the number a user checks is the drawing they see. Rays, the
 * entrance beam, the grating normal, the bisector, angle arcs and labels are drawing aids and are
 * left out: they are not hardware.
 */

import type { Design } from '../../shared/design';
// The pure geometry module, not the sketch's index (which also exports its React components).
import { sketchGeometry, type PointMm, type SketchOptic, type SketchSlit } from '../sketch/geometry';

export interface DesignFootprint {
  /** Across the instrument, normal to the bisector: the sketch's x extent, mm. */
  widthMm: number;
  /** Along the bisector (grating toward the mirrors): the sketch's y extent, mm. */
  depthMm: number;
}

/**
 * The bisector drawn pointing up (+y) for every kind: the sketch lays a Littrow mount on its side
 * by default, and width and depth must mean the same axes whatever the layout.
 */
const BISECTOR_UP_DEG = 90;

interface Box {
  minX: number;
  minY: number;
  maxX: number;
  maxY: number;
}

function take(box: Box, p: PointMm): void {
  if (p.x < box.minX) box.minX = p.x;
  if (p.y < box.minY) box.minY = p.y;
  if (p.x > box.maxX) box.maxX = p.x;
  if (p.y > box.maxY) box.maxY = p.y;
}

/**
 * Extremes of the quadratic curve p0 → (control c) → p2 along one axis: the end points and, where
 * the derivative `2(1−t)(c−p0) + 2t(p2−c)` vanishes inside (0, 1), the turning point. The control
 * point itself lies off the curve, so taking it would overstate a mirror's sag by a factor of two.
 */
function quadraticExtremes(p0: number, c: number, p2: number): number[] {
  const denominator = p0 - 2 * c + p2;
  if (denominator === 0) return [];
  const t = (p0 - c) / denominator;
  if (!(t > 0 && t < 1)) return [];
  return [(1 - t) * (1 - t) * p0 + 2 * (1 - t) * t * c + t * t * p2];
}

function takeCurve(box: Box, from: PointMm, control: PointMm, to: PointMm): void {
  take(box, from);
  take(box, to);
  for (const x of quadraticExtremes(from.x, control.x, to.x)) take(box, { x, y: from.y });
  for (const y of quadraticExtremes(from.y, control.y, to.y)) take(box, { x: from.x, y });
}

/** A mirror is one curve a → b; a lens is a → b on one face and b → a on the other. */
function takeOptic(box: Box, optic: SketchOptic): void {
  const [first, second] = optic.controls;
  if (first === undefined) {
    take(box, optic.a);
    take(box, optic.b);
    return;
  }
  takeCurve(box, optic.a, first, optic.b);
  if (second !== undefined) takeCurve(box, optic.b, second, optic.a);
}

function takeSlit(box: Box, slit: SketchSlit): void {
  const half = slit.widthMm / 2;
  take(box, { x: slit.centre.x - slit.along.x * half, y: slit.centre.y - slit.along.y * half });
  take(box, { x: slit.centre.x + slit.along.x * half, y: slit.centre.y + slit.along.y * half });
}

/**
 * Width across and depth along the bisector of the box around the grating (face and substrate),
 * the collimator, the camera (or the shared mirror, or the lens), both slits and the detector, as
 * `sketchGeometry` places them with the grating turned to the range centre. Mirror apertures are
 * the sketch's: sized to the beams it draws, with a small margin.
 */
export function designFootprintMm(design: Design): DesignFootprint {
  const g = sketchGeometry(design, { bisectorAngleDeg: BISECTOR_UP_DEG });
  const box: Box = { minX: Infinity, minY: Infinity, maxX: -Infinity, maxY: -Infinity };
  take(box, g.grating.face.a);
  take(box, g.grating.face.b);
  g.grating.back.forEach((p) => take(box, p));
  for (const optic of [g.collimator, g.camera, g.sharedMirror]) {
    if (optic) takeOptic(box, optic);
  }
  takeSlit(box, g.entranceSlit);
  takeSlit(box, g.exitSlit);
  if (g.detector) {
    take(box, g.detector.a);
    take(box, g.detector.b);
  }
  return { widthMm: box.maxX - box.minX, depthMm: box.maxY - box.minY };
}
