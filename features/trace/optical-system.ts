/**
 * The design as surfaces in 3-D, for the exact trace. The placement is the sketch's own
 * (features/sketch: `gratingFrame`, `offAxisAngles`, `placeOptics`): the top view's x and y, with
 * z added along the grooves and the slits. Nothing is placed a second time; the trace only adds
 * what a top view cannot show (heights, the slits' distance along their axis, apertures).
 *
 * Frame: the grating's centre is the origin; the dispersion plane is z = 0; the grooves and the
 * slits run along z. Units mm; directions unit vectors.
 *
 * - Czerny–Turner: each mirror a sphere of radius 2f with its vertex where the sketch puts it and
 *   its axis along the sketch's surface normal.
 * - Ebert–Fastie: the sketch's one sphere (centre of curvature f behind the grating on the
 *   bisector, radius 2f cos(K/2)) used in two zones.
 * - Littrow: a spherical mirror where the sketch draws the lens, folding the light out of the
 *   dispersion plane: the entrance slit sits just above the grating and the exit slit just below
 *   it, clear of the beam (so the light meets the grating slightly off the plane: conical
 *   diffraction, traced exactly).
 * - The entrance slit sits at the collimator's tangential focus `(R/2) cos θ₁` along the sketch's
 *   slit direction (the beam then leaves collimated in the dispersion plane, which sets the
 *   bandpass); the image plane is normal to the set wavelength's chief ray at the camera's
 *   tangential focus `(R/2) cos θ₂` from where that ray leaves the camera.
 */

import type { Design } from '../../shared/design';
import { UM_PER_MM, solveGrating } from '../solver';
import { gratingFrame, type GratingFrame } from '../sketch/grating-frame';
import { offAxisAngles, placeOptics } from '../sketch/place-optics';

export interface Vec3 {
  x: number;
  y: number;
  z: number;
}

export const v3 = (x: number, y: number, z: number): Vec3 => ({ x, y, z });
export const add3 = (a: Vec3, b: Vec3): Vec3 => v3(a.x + b.x, a.y + b.y, a.z + b.z);
export const sub3 = (a: Vec3, b: Vec3): Vec3 => v3(a.x - b.x, a.y - b.y, a.z - b.z);
export const scale3 = (a: Vec3, k: number): Vec3 => v3(a.x * k, a.y * k, a.z * k);
export const dot3 = (a: Vec3, b: Vec3): number => a.x * b.x + a.y * b.y + a.z * b.z;
export const cross3 = (a: Vec3, b: Vec3): Vec3 =>
  v3(a.y * b.z - a.z * b.y, a.z * b.x - a.x * b.z, a.x * b.y - a.y * b.x);
export const norm3 = (a: Vec3): number => Math.hypot(a.x, a.y, a.z);
export const unit3 = (a: Vec3): Vec3 => scale3(a, 1 / norm3(a));
const flat = (p: { x: number; y: number }): Vec3 => v3(p.x, p.y, 0);
const Z: Vec3 = v3(0, 0, 1);

/** A concave spherical mirror: centre of curvature, radius, vertex (the zone's centre) and a round aperture about it. */
export interface Mirror {
  centre: Vec3;
  radiusMm: number;
  vertex: Vec3;
  /** From the vertex toward the centre of curvature. */
  axis: Vec3;
  apertureRadiusMm: number;
}

/** A plane reflection grating turned to one setting: normal out of its face, tangent across the grooves. */
export interface GratingSurface {
  normal: Vec3;
  /** Across the grooves, chosen so the incoming chief ray has `d·t = −sin α`. */
  tangent: Vec3;
  halfWidthMm: number;
  halfHeightMm: number;
  order: number;
  spacingNm: number;
  settingNm: number;
  incidenceRad: number;
  diffractionRad: number;
}

/** The plane the rays are traced to: a point, its normal (away from the camera) and its x and y axes. */
export interface ImagePlane {
  point: Vec3;
  normal: Vec3;
  xAxis: Vec3;
  yAxis: Vec3;
}

/** The entrance slit and the aperture the rays are launched toward. */
export interface Launch {
  slitCentre: Vec3;
  /** Across the slit (its width) and along it (its height, +z). */
  slitAcross: Vec3;
  slitAlong: Vec3;
  slitWidthMm: number;
  slitHeightMm: number;
  /** The rays aim at a rectangle through the collimator's vertex, across the beam and along z. */
  pupilCentre: Vec3;
  pupilAcross: Vec3;
}

/** Everything but the grating's angle: fixed for the instrument whatever it is set to. */
export interface Mount {
  kind: Design['layout']['kind'];
  frame: GratingFrame;
  collimator: Mirror;
  camera: Mirror;
  launch: Launch;
  /** θ₁, θ₂: the chief ray's angle of incidence on each mirror, radians. */
  collimatorOffAxisRad: number;
  cameraOffAxisRad: number;
  ruledWidthMm: number;
  ruledHeightMm: number;
}

/** How far above (and below) the grating's centre a Littrow mount's slits sit: clear of the grating and the beam. */
export function littrowSlitOffsetMm(design: Design): number {
  return 0.5 * design.grating.ruledHeightMm + 0.5 * design.slits.heightMm + 0.02 * design.layout.collimatorFocalMm;
}

/** The instrument's mirrors and entrance slit, placed as the sketch places them. */
export function buildMount(design: Design): Mount {
  const { grating, layout, slits, range } = design;
  const centreNm = (range.startNm + range.endNm) / 2;
  const frame = gratingFrame(design, { settingNm: centreNm });
  const offAxis = offAxisAngles(layout, frame.halfDeviationRad);
  const placement = placeOptics(frame, offAxis, grating.ruledWidthMm);
  const halfDiagonal = 0.5 * Math.hypot(grating.ruledWidthMm, grating.ruledHeightMm);

  let collimator: Mirror;
  let camera: Mirror;
  let toEntrance: Vec3;
  if (frame.kind === 'littrow') {
    const f = layout.collimatorFocalMm;
    const vertex = flat(placement.collimatorCentre);
    const slitPoint = v3(0, 0, littrowSlitOffsetMm(design));
    toEntrance = unit3(sub3(slitPoint, vertex));
    const toGrating = unit3(scale3(vertex, -1));
    const axis = unit3(add3(toEntrance, toGrating));
    collimator = { centre: add3(vertex, scale3(axis, 2 * f)), radiusMm: 2 * f, vertex, axis, apertureRadiusMm: 1.6 * halfDiagonal };
    camera = collimator;
  } else if (frame.kind === 'ebert-fastie') {
    const f = layout.collimatorFocalMm;
    const centre = scale3(flat(frame.bisector), -f);
    const radiusMm = 2 * f * Math.cos(frame.halfDeviationRad / 2);
    const zone = (vertex: Vec3, apertureRadiusMm: number): Mirror => ({
      centre,
      radiusMm,
      vertex,
      axis: unit3(sub3(centre, vertex)),
      apertureRadiusMm,
    });
    collimator = zone(flat(placement.collimatorCentre), 1.1 * halfDiagonal);
    camera = zone(flat(placement.cameraCentre), cameraApertureMm(design, halfDiagonal));
    toEntrance = flat(placement.toEntrance);
  } else {
    const sphere = (vertex: Vec3, normal: Vec3, focalMm: number, apertureRadiusMm: number): Mirror => ({
      centre: add3(vertex, scale3(normal, 2 * focalMm)),
      radiusMm: 2 * focalMm,
      vertex,
      axis: normal,
      apertureRadiusMm,
    });
    collimator = sphere(flat(placement.collimatorCentre), flat(placement.collimatorNormal), layout.collimatorFocalMm, 1.1 * halfDiagonal);
    camera = sphere(flat(placement.cameraCentre), flat(placement.cameraNormal), layout.cameraFocalMm, cameraApertureMm(design, halfDiagonal));
    toEntrance = flat(placement.toEntrance);
  }

  // The chief ray leaves the slit toward the collimator's vertex: θ₁ between it and the axis.
  const collimatorOffAxisRad = Math.acos(Math.min(1, dot3(toEntrance, collimator.axis)));
  const slitDistanceMm = (collimator.radiusMm / 2) * Math.cos(collimatorOffAxisRad);
  const slitCentre = add3(collimator.vertex, scale3(toEntrance, slitDistanceMm));
  const slitAcross = unit3(cross3(Z, toEntrance));
  // The pupil: across the chief ray, in the dispersion plane where it can be.
  const pupilAcross = unit3(cross3(Z, scale3(toEntrance, -1)));
  const cameraOffAxisRad = frame.kind === 'littrow' ? collimatorOffAxisRad : offAxis.cameraRad;
  void range;
  return {
    kind: frame.kind,
    frame,
    collimator,
    camera,
    launch: {
      slitCentre,
      slitAcross,
      slitAlong: Z,
      slitWidthMm: slits.entranceWidthUm / UM_PER_MM,
      slitHeightMm: slits.heightMm,
      pupilCentre: collimator.vertex,
      pupilAcross,
    },
    collimatorOffAxisRad,
    cameraOffAxisRad,
    ruledWidthMm: grating.ruledWidthMm,
    ruledHeightMm: grating.ruledHeightMm,
  };
}

/**
 * The camera mirror as large as the beam needs across the range, a quarter to spare: the grating's
 * half-diagonal plus the spread of the range's diffraction angles over the camera's distance (the
 * sketch sizes its camera to the drawn rays the same way).
 */
function cameraApertureMm(design: Design, halfDiagonalMm: number): number {
  const { grating, layout, range } = design;
  const spacingNm = 1e6 / grating.grooveDensityPerMm;
  const K = (layout.deviationAngleDeg * Math.PI) / 360;
  const centre = solveGrating(grating.order, (range.startNm + range.endNm) / 2, spacingNm, K);
  if (!centre.reachable) return 1.25 * halfDiagonalMm;
  const sinAlpha = Math.sin(centre.incidenceRad);
  const betaAt = (nm: number) => Math.asin(Math.max(-1, Math.min(1, (grating.order * nm) / spacingNm - sinAlpha)));
  const spreadRad = Math.abs(betaAt(range.endNm) - betaAt(range.startNm));
  return 1.25 * (halfDiagonalMm + 0.5 * layout.cameraFocalMm * spreadRad);
}

/** The grating turned to `settingNm` (the sketch's frame for it), or null when that wavelength is unreachable. */
export function gratingAt(design: Design, settingNm: number): GratingSurface | null {
  const frame = gratingFrame(design, { settingNm });
  if (!frame.setting.reachable) return null;
  const normal = v3(Math.cos(frame.normalRad), Math.sin(frame.normalRad), 0);
  // towardCollimator · t = sin α (the collimator's side positive), so the incoming d·t = −sin α.
  const tangent = v3(Math.cos(frame.normalRad + Math.PI / 2), Math.sin(frame.normalRad + Math.PI / 2), 0);
  return {
    normal,
    tangent,
    halfWidthMm: design.grating.ruledWidthMm / 2,
    halfHeightMm: design.grating.ruledHeightMm / 2,
    order: frame.order,
    spacingNm: frame.spacingNm,
    settingNm,
    incidenceRad: frame.setting.incidenceRad,
    diffractionRad: frame.setting.diffractionRad,
  };
}
