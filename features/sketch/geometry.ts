/**
 * Top view of a mount, to scale, in millimetres: where the slits, mirrors (or lens) and grating
 * sit and how the chief and edge rays of three wavelengths run through them. Pure: no React, no
 * platform code, relative imports only (the server's PDF sheet reuses it).
 *
 * Frame and conventions (the solver's):
 * - the grating's centre is the origin; x to the right, y up (the drawing flips y);
 * - angles from the grating normal, positive on the same side: `mλ = d(sin α + sin β)`,
 *   `α = φ + K`, `β = φ − K`, `K` half the deviation, `φ` the grating rotation. The bisector of
 *   the incident and diffracted chief rays points along `bisectorAngleDeg` (up by default) and
 *   the normal sits `φ` from it; the collimator lies at `bisector + K`, the camera at
 *   `bisector − K`, whatever the rotation (a constant-deviation mount);
 * - the grating is drawn turned to one wavelength (`settingNm`, by default the range centre).
 *   The other wavelengths leave that fixed grating at `sin β = mλ/d − sin α` and spread over the
 *   exit plane, as they do over an exit slit or a detector;
 * - each mirror sits its focal length from the grating along the chief ray, each slit its focal
 *   length from its mirror (the paraxial focus; the tangential focus `f cos θ` of an off-axis
 *   mirror would move it in by a few per cent, which this drawing leaves out);
 * - the exit plane is normal to the camera's output axis: an image of a wavelength that leaves
 *   the grating `δ` from the set wavelength lands `f_cam tan δ` from the centre (as the solver's
 *   detector model has it).
 *
 * Off-axis angles θ (half the angle a mirror folds the chief ray through):
 * - Czerny–Turner: the design's `collimatorOffAxisDeg` / `cameraOffAxisDeg` when given, else K
 *   (at least 5°), which puts each slit level with the grating: an unfolded layout, the slits
 *   outside the mirror pair;
 * - Ebert–Fastie: K/2 on both sides, always: that is the angle at which both zones lie on one
 *   sphere (centre of curvature `f` behind the grating on the bisector, radius `2f cos(K/2)`),
 *   with each slit straight under its zone. A design's own off-axis angles are noted, not drawn;
 * - Littrow: one lens both collimates and focuses; the entrance and exit slits coincide in this
 *   view (in the instrument one sits above the other, out of the plane), so they are drawn side
 *   by side, a small gap apart, with the rays' last legs bent to them.
 */

import type { Design } from '../../shared/design';
import { radToDeg } from '../solver';
import { angleArcs } from './angle-arcs';
import { gratingFrame } from './grating-frame';
import { shapeOptics } from './optic-shapes';
import { gratingBody, offAxisAngles, placeDetector, placeOptics, placeSlits } from './place-optics';
import { sketchBounds } from './sketch-bounds';
import { sketchNotes } from './sketch-notes';
import type { SketchGeometry, SketchOptions } from './sketch-types';
import { traceEntrance, traceRays } from './trace-rays';
import { scale } from './vector';

export type {
  AngleArc,
  PointMm,
  RayRole,
  SegmentMm,
  SketchGeometry,
  SketchOptic,
  SketchOptions,
  SketchRay,
  SketchSlit,
  UnreachableRay,
} from './sketch-types';
export { describeSketch } from './describe-sketch';
export { scaleBarLengthMm } from './scale-bar';
export { formatDeg, formatNm } from './sketch-format';

/**
 * The to-scale top view of `design`. Never throws on a schema-valid design; wavelengths the
 * drawn grating cannot send through the instrument are listed in `unreachable` with a reason.
 * Steps: turn the grating, place the optics and slits, trace the rays, size the optics to them.
 */
export function sketchGeometry(design: Design, options: SketchOptions = {}): SketchGeometry {
  const { grating, layout, range, slits, detector } = design;
  const frame = gratingFrame(design, options);
  const offAxis = offAxisAngles(layout, frame.halfDeviationRad);
  const placement = placeOptics(frame, offAxis, grating.ruledWidthMm);
  const entrance = traceEntrance(frame, placement);
  const { rays, unreachable, cameraHits } = traceRays(range, frame, placement, entrance);
  const { collimatorHits } = entrance;
  const optics = shapeOptics(frame, placement, offAxis, collimatorHits, cameraHits, grating.ruledWidthMm);
  const parts = {
    kind: frame.kind,
    settingNm: frame.settingNm,
    settingReachable: frame.setting.reachable,
    rotationDeg: radToDeg(frame.rotationRad),
    halfDeviationDeg: radToDeg(frame.halfDeviationRad),
    grating: gratingBody(frame, grating.ruledWidthMm),
    bisector: { a: { x: 0, y: 0 }, b: scale(frame.bisector, 0.3 * frame.shorterFocalMm) },
    entrance: { chief: entrance.chief, edges: entrance.edges },
    ...optics,
    ...placeSlits(frame, placement, slits),
    detector: placeDetector(placement, detector),
    exitPlane: { centre: placement.exitCentre, along: placement.exitAlong },
    rays,
    unreachable,
    arcs: angleArcs(frame),
    notes: sketchNotes(layout, frame.halfDeviationRad),
  };
  return { ...parts, bounds: sketchBounds(parts) };
}
