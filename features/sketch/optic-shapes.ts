import { radToDeg } from '../solver';
import type { GratingFrame } from './grating-frame';
import type { OffAxisAngles, OpticPlacement } from './place-optics';
import type { PointMm, SketchOptic } from './sketch-types';
import { add, dot, fromAngle, perpendicular, scale, sub, unit } from './vector';

export interface SketchOptics {
  collimator: SketchOptic;
  camera: SketchOptic;
  /** Ebert–Fastie: the one mirror both zones belong to; null otherwise. */
  sharedMirror: SketchOptic | null;
}

/** The optics, sized to catch every drawn beam with a small margin. */
export function shapeOptics(
  frame: GratingFrame,
  placement: OpticPlacement,
  offAxis: OffAxisAngles,
  collimatorHits: readonly PointMm[],
  cameraHits: readonly PointMm[],
  ruledWidthMm: number,
): SketchOptics {
  const { collimatorFocalMm: f1, cameraFocalMm: f2 } = frame;
  const { collimatorCentre, cameraCentre, collimatorNormal, cameraNormal } = placement;
  if (frame.isLens) {
    const lens = lensOptic(collimatorCentre, frame.towardCollimator, [...collimatorHits, ...cameraHits], f1);
    return { collimator: lens, camera: lens, sharedMirror: null };
  }
  // Without drawn rays a camera still needs a visible size: about the beam's width.
  const minAperture = 0.4 * ruledWidthMm;
  if (frame.kind === 'ebert-fastie') {
    // One sphere: centre of curvature f behind the grating on the bisector, radius 2f cos(K/2).
    const curvatureCentre = scale(frame.bisector, -f1);
    const radius = 2 * f1 * Math.cos(frame.halfDeviationRad / 2);
    const zone = (centre: PointMm, hits: readonly PointMm[], focalMm: number, offAxisRad: number) =>
      mirrorOnSphere(centre, curvatureCentre, radius, hits, focalMm, offAxisRad, minAperture);
    return {
      collimator: zone(collimatorCentre, collimatorHits, f1, offAxis.collimatorRad),
      camera: zone(cameraCentre, cameraHits, f2, offAxis.cameraRad),
      sharedMirror: zone(scale(frame.bisector, radius - f1), [...collimatorHits, ...cameraHits], f1, 0),
    };
  }
  return {
    collimator: mirrorOnSphere(
      collimatorCentre,
      add(collimatorCentre, scale(collimatorNormal, 2 * f1)),
      2 * f1,
      collimatorHits,
      f1,
      offAxis.collimatorRad,
      minAperture,
    ),
    camera: mirrorOnSphere(
      cameraCentre,
      add(cameraCentre, scale(cameraNormal, 2 * f2)),
      2 * f2,
      cameraHits,
      f2,
      offAxis.cameraRad,
      minAperture,
    ),
    sharedMirror: null,
  };
}

/**
 * A concave mirror on the circle of `radius` about `curvatureCentre`, spanning the angular
 * extent of `hits` (seen from that centre) plus a margin; drawn as one quadratic curve.
 */
function mirrorOnSphere(
  centre: PointMm,
  curvatureCentre: PointMm,
  radius: number,
  hits: readonly PointMm[],
  focalMm: number,
  offAxisRad: number,
  minHalfApertureMm: number,
): SketchOptic {
  const reference = Math.atan2(centre.y - curvatureCentre.y, centre.x - curvatureCentre.x);
  let lo = 0;
  let hi = 0;
  for (const p of hits) {
    let a = Math.atan2(p.y - curvatureCentre.y, p.x - curvatureCentre.x) - reference;
    a = Math.atan2(Math.sin(a), Math.cos(a));
    if (a < lo) lo = a;
    if (a > hi) hi = a;
  }
  const margin = (hi - lo) * 0.08;
  lo = Math.min(lo - margin, -minHalfApertureMm / radius);
  hi = Math.max(hi + margin, minHalfApertureMm / radius);
  const at = (a: number) => add(curvatureCentre, scale(fromAngle(reference + a), radius));
  const a = at(lo);
  const b = at(hi);
  const middle = at((lo + hi) / 2);
  const chordMiddle = scale(add(a, b), 0.5);
  return {
    kind: 'mirror',
    centre,
    a,
    b,
    controls: [add(middle, sub(middle, chordMiddle))],
    focalMm,
    offAxisDeg: radToDeg(offAxisRad),
    labelDirection: unit(sub(centre, curvatureCentre)),
  };
}

/** A thin lens square to `axis` through `centre`, wide enough for `hits`, with a drawn thickness. */
function lensOptic(centre: PointMm, axis: PointMm, hits: readonly PointMm[], focalMm: number): SketchOptic {
  const along = perpendicular(axis);
  let lo = 0;
  let hi = 0;
  for (const p of hits) {
    const s = dot(sub(p, centre), along);
    if (s < lo) lo = s;
    if (s > hi) hi = s;
  }
  const margin = Math.max((hi - lo) * 0.08, 1);
  lo -= margin;
  hi += margin;
  const a = add(centre, scale(along, lo));
  const b = add(centre, scale(along, hi));
  const middle = add(centre, scale(along, (lo + hi) / 2));
  const bulge = Math.max((hi - lo) * 0.12, 1);
  return {
    kind: 'lens',
    centre,
    a,
    b,
    controls: [add(middle, scale(axis, bulge)), add(middle, scale(axis, -bulge))],
    focalMm,
    offAxisDeg: 0,
    labelDirection: along,
  };
}
