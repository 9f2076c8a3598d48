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

import type { Design, LayoutKind } from '../../shared/design';
import {
  GRAZING_MARGIN_RAD,
  HALF_PI,
  UM_PER_MM,
  degToRad,
  grooveSpacingNm,
  halfDeviationRad,
  radToDeg,
  solveGrating,
} from '../solver';

export interface PointMm {
  x: number;
  y: number;
}

export interface SegmentMm {
  a: PointMm;
  b: PointMm;
}

/** A mirror (one control point: a concave arc drawn as a quadratic curve) or a lens (two). */
export interface SketchOptic {
  kind: 'mirror' | 'lens';
  /** Where the chief ray of the set wavelength meets it. */
  centre: PointMm;
  /** Aperture ends along the surface. */
  a: PointMm;
  b: PointMm;
  /** Quadratic-curve control points from a to b (and for a lens, back from b to a). */
  controls: PointMm[];
  focalMm: number;
  /** Half the fold angle of the chief ray at this optic, degrees (0 for a lens). */
  offAxisDeg: number;
  /** Unit vector pointing away from the optic's working side, for its label. */
  labelDirection: PointMm;
}

export interface SketchSlit {
  centre: PointMm;
  /** Unit vector along the slit's width (in the plane of the drawing). */
  along: PointMm;
  widthMm: number;
  labelDirection: PointMm;
}

export type RayRole = 'start' | 'centre' | 'end';

export interface SketchRay {
  role: RayRole;
  wavelengthNm: number;
  /** Chief ray: slit → collimator → grating centre → camera → image in the exit plane. */
  chief: PointMm[];
  /** The two beam edges, through the ends of the ruled width. */
  edges: [PointMm[], PointMm[]];
  incidenceDeg: number;
  diffractionDeg: number;
  /** Signed distance of the image from the exit plane's centre, along `exitPlane.along`, mm. */
  exitOffsetMm: number;
}

export interface UnreachableRay {
  role: RayRole;
  wavelengthNm: number;
  reason: string;
}

export interface AngleArc {
  /** `α = β` in Littrow, where the two arcs would coincide. */
  label: 'α' | 'β' | 'K' | 'α = β';
  valueDeg: number;
  centre: PointMm;
  radiusMm: number;
  /** Arc from this direction to that one (world angles, radians, counter-clockwise positive). */
  fromRad: number;
  toRad: number;
}

export interface SketchGeometry {
  kind: LayoutKind;
  /** The wavelength the grating is turned to, nm. */
  settingNm: number;
  /** False when no rotation delivers `settingNm`: the grating is drawn square to the bisector. */
  settingReachable: boolean;
  rotationDeg: number;
  halfDeviationDeg: number;
  grating: {
    centre: PointMm;
    /** The ruled face, `ruledWidthMm` long. */
    face: SegmentMm;
    /** The substrate's back corners (b side first), for a solid block behind the face. */
    back: [PointMm, PointMm];
    /** Dotted normal from the centre, on the light's side. */
    normal: SegmentMm;
    ruledWidthMm: number;
    labelDirection: PointMm;
  };
  /** The light arriving, shared by every wavelength: slit → collimator → grating (chief, edges). */
  entrance: { chief: PointMm[]; edges: [PointMm[], PointMm[]] };
  /** Faint line along the bisector of the incident and diffracted chief rays (K is measured from it). */
  bisector: SegmentMm;
  collimator: SketchOptic;
  camera: SketchOptic;
  /** Ebert–Fastie: the one mirror both zones belong to; null otherwise. */
  sharedMirror: SketchOptic | null;
  entranceSlit: SketchSlit;
  /** The exit slit; with a detector, the detector's centre (and `detector` holds its extent). */
  exitSlit: SketchSlit;
  /** `pixelCount × pixelPitch` along the exit plane, or null without a detector. */
  detector: SegmentMm | null;
  exitPlane: { centre: PointMm; along: PointMm };
  rays: SketchRay[];
  unreachable: UnreachableRay[];
  arcs: AngleArc[];
  /** Plain-words remarks about choices the drawing made (defaults, ignored fields). */
  notes: string[];
  bounds: { minX: number; minY: number; maxX: number; maxY: number };
}

export interface SketchOptions {
  /** The wavelength to turn the grating to, nm (default: the centre of the design range). */
  settingNm?: number;
  /** Direction of the bisector in the drawing, degrees counter-clockwise from +x (default: up,
   * or to the right for Littrow, whose long thin shape fits a screen better lying down). */
  bisectorAngleDeg?: number;
}

/** Light further than this from an optic's axis after it is not drawn as imaged (cos 60°). */
const MIN_AXIS_COSINE = 0.5;
const DEFAULT_MIN_OFF_AXIS_RAD = degToRad(5);

/**
 * The to-scale top view of `design`. Never throws on a schema-valid design; wavelengths the
 * drawn grating cannot send through the instrument are listed in `unreachable` with a reason.
 */
export function sketchGeometry(design: Design, options: SketchOptions = {}): SketchGeometry {
  const { grating, layout, range, slits, detector } = design;
  const kind = layout.kind;
  const order = grating.order;
  const spacingNm = grooveSpacingNm(grating.grooveDensityPerMm);
  const K = halfDeviationRad(layout);
  const centreNm = (range.startNm + range.endNm) / 2;
  const settingNm = options.settingNm ?? centreNm;
  const setting = solveGrating(order, settingNm, spacingNm, K);
  const phi = setting.reachable ? setting.rotationRad : 0;
  const alpha = phi + K;
  const notes: string[] = [];

  const bisectorRad = degToRad(options.bisectorAngleDeg ?? (kind === 'littrow' ? 0 : 90));
  const bisector = fromAngle(bisectorRad);
  const normalRad = bisectorRad - phi;
  const normal = fromAngle(normalRad);
  const towardCollimator = fromAngle(normalRad + alpha); // = bisector + K
  const towardCamera = fromAngle(bisectorRad - K);
  const faceDir = fromAngle(normalRad - HALF_PI);
  const halfWidth = grating.ruledWidthMm / 2;
  const edgePoints: [PointMm, PointMm] = [scale(faceDir, -halfWidth), scale(faceDir, halfWidth)];
  const f1 = layout.collimatorFocalMm;
  const f2 = layout.cameraFocalMm;
  const fMin = Math.min(f1, f2);

  // Off-axis angles and the direction from each optic to its slit.
  let theta1 = 0;
  let theta2 = 0;
  if (kind === 'czerny-turner') {
    const fallback = Math.max(K, DEFAULT_MIN_OFF_AXIS_RAD);
    theta1 = layout.collimatorOffAxisDeg === undefined ? fallback : degToRad(layout.collimatorOffAxisDeg);
    theta2 = layout.cameraOffAxisDeg === undefined ? fallback : degToRad(layout.cameraOffAxisDeg);
    if (layout.collimatorOffAxisDeg === undefined || layout.cameraOffAxisDeg === undefined) {
      notes.push(
        `Mirror off-axis angles not given: drawn at ${formatDeg(radToDeg(fallback))}, which puts the slits level with the grating.`,
      );
    }
  } else if (kind === 'ebert-fastie') {
    theta1 = theta2 = K / 2;
    if (layout.collimatorOffAxisDeg !== undefined || layout.cameraOffAxisDeg !== undefined) {
      notes.push(
        `One mirror fixes both off-axis angles at K/2 = ${formatDeg(radToDeg(K / 2))}; the design's own off-axis angles are not drawn.`,
      );
    }
  }

  const collimatorCentre = scale(towardCollimator, f1);
  const cameraCentre = kind === 'littrow' ? collimatorCentre : scale(towardCamera, f2);
  // Unit vectors from each optic toward its slit, and the optic's surface normal (working side).
  const toEntrance = kind === 'littrow' ? towardCollimator : rotate(scale(towardCollimator, -1), -2 * theta1);
  const toExit = kind === 'littrow' ? towardCollimator : rotate(scale(towardCamera, -1), 2 * theta2);
  const collimatorNormal = kind === 'littrow' ? towardCollimator : unit(sub(toEntrance, towardCollimator));
  const cameraNormal = kind === 'littrow' ? towardCollimator : unit(sub(toExit, towardCamera));
  const isLens = kind === 'littrow';
  const throughCamera = (v: PointMm) => (isLens ? v : reflect(v, cameraNormal));

  let entranceCentre = add(collimatorCentre, scale(toEntrance, f1));
  let exitCentre = add(cameraCentre, scale(toExit, f2));
  const exitAlong = perpendicular(toExit);
  // Littrow: the two slits share a point in this view; set them side by side.
  const littrowGapMm = isLens ? Math.max(0.05 * f1, 0.3 * grating.ruledWidthMm) : 0;
  const entranceShift = scale(perpendicular(towardCollimator), littrowGapMm / 2);
  const exitShift = scale(entranceShift, -1);
  if (isLens) {
    entranceCentre = add(entranceCentre, entranceShift);
    exitCentre = add(exitCentre, exitShift);
  }

  // Entrance side: the collimated beam meets the grating along −towardCollimator; trace its
  // chief and edge rays back to the collimator's surface, then to the slit.
  const collimatorHits: PointMm[] = [collimatorCentre];
  const entranceLegs: PointMm[][] = [[entranceCentre, collimatorCentre, { x: 0, y: 0 }]];
  for (const g of edgePoints) {
    const hit = hitLine(g, towardCollimator, collimatorCentre, collimatorNormal);
    const p = hit ?? add(g, scale(towardCollimator, f1));
    collimatorHits.push(p);
    entranceLegs.push([entranceCentre, p, g]);
  }

  const roles: [RayRole, number][] = [
    ['start', range.startNm],
    ['centre', centreNm],
    ['end', range.endNm],
  ];
  const rays: SketchRay[] = [];
  const unreachable: UnreachableRay[] = [];
  const cameraHits: PointMm[] = [cameraCentre];
  const sinAlpha = Math.sin(alpha);
  const cameraSide = perpendicular(scale(bisector, -1)); // 90° clockwise of the bisector

  for (const [role, wavelengthNm] of roles) {
    if (!setting.reachable) {
      unreachable.push({
        role,
        wavelengthNm,
        reason: `the grating cannot be set for ${formatNm(settingNm)}: ${setting.reason}`,
      });
      continue;
    }
    let beta: number;
    if (wavelengthNm === settingNm) {
      beta = phi - K;
    } else {
      const sinBeta = (order * wavelengthNm) / spacingNm - sinAlpha;
      if (!(Math.abs(sinBeta) < 1) || Math.abs(Math.asin(sinBeta)) >= HALF_PI - GRAZING_MARGIN_RAD) {
        unreachable.push({
          role,
          wavelengthNm,
          reason: `with the grating set for ${formatNm(settingNm)}, ${formatNm(wavelengthNm)} has no diffracted order ${order}`,
        });
        continue;
      }
      beta = Math.asin(sinBeta);
    }
    const leaving = fromAngle(normalRad + beta);
    const afterCamera = throughCamera(leaving);
    const axisCosine = dot(afterCamera, toExit);
    const chiefHit = hitLine({ x: 0, y: 0 }, leaving, cameraCentre, cameraNormal);
    const edgeHits = edgePoints.map((g) => hitLine(g, leaving, cameraCentre, cameraNormal));
    // A camera mirror (or the camera zone of an Ebert–Fastie mirror) cannot reach across the
    // bisector without cutting into the collimator's beam: light that would need it is not imaged.
    const crossesIntoCollimator =
      !isLens && [chiefHit, ...edgeHits].some((h) => h !== null && dot(h, cameraSide) <= 0);
    if (crossesIntoCollimator) {
      unreachable.push({
        role,
        wavelengthNm,
        reason: `with the grating set for ${formatNm(settingNm)} it leaves at β = ${formatDeg(radToDeg(beta))}, toward the collimator's side, out of the camera's reach`,
      });
      continue;
    }
    if (axisCosine < MIN_AXIS_COSINE || chiefHit === null || edgeHits.some((h) => h === null)) {
      unreachable.push({
        role,
        wavelengthNm,
        reason: `leaves the grating at β = ${formatDeg(radToDeg(beta))}, too far off the camera's axis to be imaged with the grating set for ${formatNm(settingNm)}`,
      });
      continue;
    }
    // The image: where the ray through the camera's centre, turned by it, meets the exit plane.
    let image = add(cameraCentre, scale(afterCamera, f2 / axisCosine));
    if (isLens) image = add(image, exitShift);
    const [hitA, hitB] = edgeHits as [PointMm, PointMm];
    cameraHits.push(chiefHit, hitA, hitB);
    const [legChief, legA, legB] = entranceLegs as [PointMm[], PointMm[], PointMm[]];
    rays.push({
      role,
      wavelengthNm,
      chief: [...legChief, chiefHit, image],
      edges: [
        [...legA, hitA, image],
        [...legB, hitB, image],
      ],
      incidenceDeg: radToDeg(alpha),
      diffractionDeg: radToDeg(beta),
      exitOffsetMm: dot(sub(image, exitCentre), exitAlong),
    });
  }

  // Optics, sized to catch every drawn beam with a small margin.
  let collimator: SketchOptic;
  let camera: SketchOptic;
  let sharedMirror: SketchOptic | null = null;
  // Without drawn rays a camera still needs a visible size: about the beam's width.
  const minAperture = 0.4 * grating.ruledWidthMm;
  if (isLens) {
    const lens = lensOptic(collimatorCentre, towardCollimator, [...collimatorHits, ...cameraHits], f1);
    collimator = lens;
    camera = lens;
  } else if (kind === 'ebert-fastie') {
    const curvatureCentre = scale(bisector, -f1);
    const radius = 2 * f1 * Math.cos(K / 2);
    collimator = mirrorOnSphere(
      collimatorCentre,
      curvatureCentre,
      radius,
      collimatorHits,
      f1,
      theta1,
      minAperture,
    );
    camera = mirrorOnSphere(cameraCentre, curvatureCentre, radius, cameraHits, f2, theta2, minAperture);
    sharedMirror = mirrorOnSphere(
      scale(bisector, radius - f1),
      curvatureCentre,
      radius,
      [...collimatorHits, ...cameraHits],
      f1,
      0,
      minAperture,
    );
  } else {
    collimator = mirrorOnSphere(
      collimatorCentre,
      add(collimatorCentre, scale(collimatorNormal, 2 * f1)),
      2 * f1,
      collimatorHits,
      f1,
      theta1,
      minAperture,
    );
    camera = mirrorOnSphere(
      cameraCentre,
      add(cameraCentre, scale(cameraNormal, 2 * f2)),
      2 * f2,
      cameraHits,
      f2,
      theta2,
      minAperture,
    );
  }

  const detectorSegment: SegmentMm | null = detector
    ? segmentAround(exitCentre, exitAlong, (detector.pixelCount * detector.pixelPitchUm) / UM_PER_MM)
    : null;

  const backDepth = Math.max(grating.ruledWidthMm * 0.18, 1);
  const [faceA, faceB] = edgePoints;
  const gratingGeometry = {
    centre: { x: 0, y: 0 },
    face: { a: faceA, b: faceB },
    back: [add(faceB, scale(normal, -backDepth)), add(faceA, scale(normal, -backDepth))] as [
      PointMm,
      PointMm,
    ],
    normal: { a: { x: 0, y: 0 }, b: scale(normal, 0.5 * fMin) },
    ruledWidthMm: grating.ruledWidthMm,
    // Behind the grating; in Littrow (lying down) below it, where the drawing has room.
    labelDirection: isLens ? perpendicular(scale(bisector, -1)) : scale(normal, -1),
  };
  const bisectorSegment = { a: { x: 0, y: 0 }, b: scale(bisector, 0.3 * fMin) };

  // Below the slit and outward, so the slit labels stay clear of the grating's between them.
  const slitLabel = (side: number) => unit(add(scale(bisector, -1), scale(cameraSide, 0.9 * side)));
  const entranceSlit: SketchSlit = {
    centre: entranceCentre,
    along: perpendicular(toEntrance),
    widthMm: slits.entranceWidthUm / UM_PER_MM,
    labelDirection: isLens ? unit(entranceShift) : slitLabel(-1),
  };
  const exitSlit: SketchSlit = {
    centre: exitCentre,
    along: exitAlong,
    widthMm: slits.exitWidthUm / UM_PER_MM,
    labelDirection: isLens ? unit(exitShift) : slitLabel(1),
  };

  const arcs: AngleArc[] = [];
  if (setting.reachable) {
    const beta = phi - K;
    if (K > 0) {
      arcs.push({
        label: 'α',
        valueDeg: radToDeg(alpha),
        centre: { x: 0, y: 0 },
        radiusMm: 0.3 * fMin,
        fromRad: normalRad,
        toRad: normalRad + alpha,
      });
      arcs.push({
        label: 'β',
        valueDeg: radToDeg(beta),
        centre: { x: 0, y: 0 },
        radiusMm: 0.38 * fMin,
        fromRad: normalRad,
        toRad: normalRad + beta,
      });
    } else {
      arcs.push({
        label: 'α = β',
        valueDeg: radToDeg(alpha),
        centre: { x: 0, y: 0 },
        radiusMm: 0.3 * fMin,
        fromRad: normalRad,
        toRad: normalRad + alpha,
      });
    }
    if (K > 0) {
      arcs.push({
        label: 'K',
        valueDeg: radToDeg(K),
        centre: { x: 0, y: 0 },
        radiusMm: 0.22 * fMin,
        fromRad: bisectorRad,
        toRad: bisectorRad + K,
      });
    }
  }

  const geometry: SketchGeometry = {
    kind,
    settingNm,
    settingReachable: setting.reachable,
    rotationDeg: radToDeg(phi),
    halfDeviationDeg: radToDeg(K),
    grating: gratingGeometry,
    bisector: bisectorSegment,
    entrance: {
      chief: entranceLegs[0] as PointMm[],
      edges: [entranceLegs[1] as PointMm[], entranceLegs[2] as PointMm[]],
    },
    collimator,
    camera,
    sharedMirror,
    entranceSlit,
    exitSlit,
    detector: detectorSegment,
    exitPlane: { centre: exitCentre, along: exitAlong },
    rays,
    unreachable,
    arcs,
    notes,
    bounds: { minX: 0, minY: 0, maxX: 0, maxY: 0 },
  };
  geometry.bounds = boundsOf(geometry);
  return geometry;
}

/** A round scale-bar length (1, 2 or 5 × 10ⁿ mm) close to a fifth of `spanMm`. */
export function scaleBarLengthMm(spanMm: number): number {
  const target = Math.max(spanMm, 1e-9) / 5;
  const power = 10 ** Math.floor(Math.log10(target));
  const mantissa = target / power;
  return (mantissa < 1.5 ? 1 : mantissa < 3.5 ? 2 : mantissa < 7.5 ? 5 : 10) * power;
}

/** One line naming the mount and its main figures, for screen readers and file titles. */
export function describeSketch(geometry: SketchGeometry, design: Design): string {
  const name =
    geometry.kind === 'czerny-turner'
      ? 'Czerny–Turner'
      : geometry.kind === 'littrow'
        ? 'Littrow'
        : 'Ebert–Fastie';
  const { grating, layout } = design;
  const parts = [
    `${name} layout to scale`,
    `${formatNumberShort(grating.grooveDensityPerMm)} grooves/mm grating ${formatNumberShort(grating.ruledWidthMm)} mm wide`,
    geometry.kind === 'littrow'
      ? `lens of ${formatNumberShort(layout.collimatorFocalMm)} mm focal length`
      : `collimator ${formatNumberShort(layout.collimatorFocalMm)} mm, camera ${formatNumberShort(layout.cameraFocalMm)} mm`,
    geometry.settingReachable
      ? `grating turned ${formatDeg(geometry.rotationDeg)} for ${formatNm(geometry.settingNm)}`
      : `no grating angle delivers ${formatNm(geometry.settingNm)}`,
  ];
  if (geometry.rays.length > 0) {
    parts.push(`rays drawn for ${geometry.rays.map((r) => formatNm(r.wavelengthNm)).join(', ')}`);
  }
  if (geometry.unreachable.length > 0) {
    parts.push(`not drawn: ${geometry.unreachable.map((r) => formatNm(r.wavelengthNm)).join(', ')}`);
  }
  return `${parts.join('; ')}.`;
}

export function formatNm(wavelengthNm: number): string {
  return `${formatNumberShort(wavelengthNm)} nm`;
}

export function formatDeg(angleDeg: number): string {
  return `${(Math.round(angleDeg * 100) / 100).toFixed(Math.abs(angleDeg) >= 100 ? 1 : 2)}°`;
}

function formatNumberShort(value: number): string {
  const abs = Math.abs(value);
  if (abs >= 1000 || Number.isInteger(value)) return String(Math.round(value * 10) / 10);
  return String(Number(value.toPrecision(4)));
}

// Small vector algebra, local so the drawing has no dependency beyond the solver.

function fromAngle(rad: number): PointMm {
  return { x: Math.cos(rad), y: Math.sin(rad) };
}
function add(p: PointMm, q: PointMm): PointMm {
  return { x: p.x + q.x, y: p.y + q.y };
}
function sub(p: PointMm, q: PointMm): PointMm {
  return { x: p.x - q.x, y: p.y - q.y };
}
function scale(p: PointMm, k: number): PointMm {
  return { x: p.x * k, y: p.y * k };
}
function dot(p: PointMm, q: PointMm): number {
  return p.x * q.x + p.y * q.y;
}
function unit(p: PointMm): PointMm {
  const length = Math.hypot(p.x, p.y);
  return length > 0 ? scale(p, 1 / length) : { x: 0, y: 1 };
}
function rotate(p: PointMm, rad: number): PointMm {
  const c = Math.cos(rad);
  const s = Math.sin(rad);
  return { x: c * p.x - s * p.y, y: s * p.x + c * p.y };
}
/** 90° counter-clockwise. */
function perpendicular(p: PointMm): PointMm {
  return { x: -p.y, y: p.x };
}
/** Mirror image of direction `v` in a surface of unit normal `n`. */
function reflect(v: PointMm, n: PointMm): PointMm {
  return sub(v, scale(n, 2 * dot(v, n)));
}
/** Where the ray from `origin` along `direction` meets the line through `point` with normal `n`, ahead of it. */
function hitLine(origin: PointMm, direction: PointMm, point: PointMm, n: PointMm): PointMm | null {
  const denominator = dot(direction, n);
  if (Math.abs(denominator) < 1e-12) return null;
  const t = dot(sub(point, origin), n) / denominator;
  return t > 0 ? add(origin, scale(direction, t)) : null;
}
function segmentAround(centre: PointMm, along: PointMm, lengthMm: number): SegmentMm {
  return { a: add(centre, scale(along, -lengthMm / 2)), b: add(centre, scale(along, lengthMm / 2)) };
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

function boundsOf(g: SketchGeometry): SketchGeometry['bounds'] {
  let minX = Infinity;
  let minY = Infinity;
  let maxX = -Infinity;
  let maxY = -Infinity;
  const take = (p: PointMm) => {
    if (p.x < minX) minX = p.x;
    if (p.y < minY) minY = p.y;
    if (p.x > maxX) maxX = p.x;
    if (p.y > maxY) maxY = p.y;
  };
  for (const optic of [g.collimator, g.camera, g.sharedMirror]) {
    if (!optic) continue;
    take(optic.a);
    take(optic.b);
    optic.controls.forEach(take);
  }
  take(g.grating.face.a);
  take(g.grating.face.b);
  g.grating.back.forEach(take);
  take(g.grating.normal.b);
  take(g.entranceSlit.centre);
  take(g.exitSlit.centre);
  if (g.detector) {
    take(g.detector.a);
    take(g.detector.b);
  }
  g.entrance.chief.forEach(take);
  g.entrance.edges[0].forEach(take);
  g.entrance.edges[1].forEach(take);
  for (const ray of g.rays) {
    ray.chief.forEach(take);
    ray.edges[0].forEach(take);
    ray.edges[1].forEach(take);
  }
  return { minX, minY, maxX, maxY };
}
