import type { Design } from '../../shared/design';
import { GRAZING_MARGIN_RAD, HALF_PI, radToDeg } from '../solver';
import type { GratingFrame } from './grating-frame';
import type { OpticPlacement } from './place-optics';
import { formatInteger } from '../../shared/format';
import { formatDeg, formatNm } from './sketch-format';
import type { PointMm, RayRole, SketchRay, UnreachableRay } from './sketch-types';
import { add, dot, fromAngle, hitLine, reflect, scale, sub } from './vector';

/** Light further than this from an optic's axis after it is not drawn as imaged (cos 60°). */
const MIN_AXIS_COSINE = 0.5;

/** The light arriving, shared by every wavelength, and where it meets the collimator. */
export interface EntranceTrace {
  chief: PointMm[];
  edges: [PointMm[], PointMm[]];
  collimatorHits: PointMm[];
}

export interface RayTrace {
  rays: SketchRay[];
  unreachable: UnreachableRay[];
  /** Where the drawn beams meet the camera, so it can be sized to catch them. */
  cameraHits: PointMm[];
}

/**
 * The collimated beam meets the grating along −towardCollimator; its chief and edge rays are
 * traced back to the collimator's surface, then to the slit.
 */
export function traceEntrance(frame: GratingFrame, placement: OpticPlacement): EntranceTrace {
  const { towardCollimator, collimatorFocalMm: f1 } = frame;
  const { entranceCentre, collimatorCentre, collimatorNormal } = placement;
  const collimatorHits: PointMm[] = [collimatorCentre];
  const edges = frame.edgePoints.map((g) => {
    const hit = hitLine(g, towardCollimator, collimatorCentre, collimatorNormal);
    const p = hit ?? add(g, scale(towardCollimator, f1));
    collimatorHits.push(p);
    return [entranceCentre, p, g];
  }) as [PointMm[], PointMm[]];
  return { chief: [entranceCentre, collimatorCentre, { x: 0, y: 0 }], edges, collimatorHits };
}

/** The start, centre and end of the range through the grating as drawn, or why each is not drawn. */
export function traceRays(
  range: Design['range'],
  frame: GratingFrame,
  placement: OpticPlacement,
  entrance: EntranceTrace,
): RayTrace {
  const roles: [RayRole, number][] = [
    ['start', range.startNm],
    ['centre', frame.centreNm],
    ['end', range.endNm],
  ];
  const trace: RayTrace = { rays: [], unreachable: [], cameraHits: [placement.cameraCentre] };
  for (const [role, wavelengthNm] of roles) {
    const result = traceWavelength(role, wavelengthNm, frame, placement, entrance);
    if ('reason' in result) {
      trace.unreachable.push(result);
    } else {
      trace.rays.push(result.ray);
      trace.cameraHits.push(...result.cameraHits);
    }
  }
  return trace;
}

/** β of `wavelengthNm` leaving the grating as set (`sin β = mλ/d − sin α`), or why it has none. */
function diffractionAngle(role: RayRole, wavelengthNm: number, frame: GratingFrame): number | UnreachableRay {
  const { setting, settingNm, order, spacingNm } = frame;
  if (!setting.reachable) {
    return {
      role,
      wavelengthNm,
      reason: `the grating cannot be set for ${formatNm(settingNm)}: ${setting.reason}`,
    };
  }
  if (wavelengthNm === settingNm) return frame.rotationRad - frame.halfDeviationRad;
  const sinBeta = (order * wavelengthNm) / spacingNm - Math.sin(frame.incidenceRad);
  if (!(Math.abs(sinBeta) < 1) || Math.abs(Math.asin(sinBeta)) >= HALF_PI - GRAZING_MARGIN_RAD) {
    return {
      role,
      wavelengthNm,
      reason: `with the grating set for ${formatNm(settingNm)}, ${formatNm(wavelengthNm)} has no diffracted order ${formatInteger(order)}`,
    };
  }
  return Math.asin(sinBeta);
}

/** One wavelength from the slit through the camera to its image in the exit plane. */
function traceWavelength(
  role: RayRole,
  wavelengthNm: number,
  frame: GratingFrame,
  placement: OpticPlacement,
  entrance: EntranceTrace,
): { ray: SketchRay; cameraHits: PointMm[] } | UnreachableRay {
  const beta = diffractionAngle(role, wavelengthNm, frame);
  if (typeof beta !== 'number') return beta;
  const { isLens, settingNm, cameraFocalMm: f2 } = frame;
  const { cameraCentre, cameraNormal, toExit, exitCentre, exitAlong } = placement;
  const leaving = fromAngle(frame.normalRad + beta);
  const afterCamera = isLens ? leaving : reflect(leaving, cameraNormal);
  const axisCosine = dot(afterCamera, toExit);
  const chiefHit = hitLine({ x: 0, y: 0 }, leaving, cameraCentre, cameraNormal);
  const edgeHits = frame.edgePoints.map((g) => hitLine(g, leaving, cameraCentre, cameraNormal));
  // A camera mirror (or the camera zone of an Ebert–Fastie mirror) cannot reach across the
  // bisector without cutting into the collimator's beam: light that would need it is not imaged.
  const crossesIntoCollimator =
    !isLens && [chiefHit, ...edgeHits].some((h) => h !== null && dot(h, placement.cameraSide) <= 0);
  // An Ebert–Fastie has no camera of its own: its one mirror's second half does that work.
  const oneMirror = frame.kind === 'ebert-fastie';
  if (crossesIntoCollimator) {
    const where = oneMirror
      ? "toward the mirror's entrance half, out of reach of its exit half"
      : "toward the collimator's side, out of the camera's reach";
    return {
      role,
      wavelengthNm,
      reason: `with the grating set for ${formatNm(settingNm)} it leaves at β = ${formatDeg(radToDeg(beta))}, ${where}`,
    };
  }
  if (axisCosine < MIN_AXIS_COSINE || chiefHit === null || edgeHits.some((h) => h === null)) {
    return {
      role,
      wavelengthNm,
      reason: `leaves the grating at β = ${formatDeg(radToDeg(beta))}, too far off the ${oneMirror ? "axis of the mirror's exit half" : "camera's axis"} to be imaged with the grating set for ${formatNm(settingNm)}`,
    };
  }
  // The image: where the ray through the camera's centre, turned by it, meets the exit plane.
  let image = add(cameraCentre, scale(afterCamera, f2 / axisCosine));
  if (isLens) image = add(image, placement.exitShift);
  const [hitA, hitB] = edgeHits as [PointMm, PointMm];
  const ray: SketchRay = {
    role,
    wavelengthNm,
    chief: [...entrance.chief, chiefHit, image],
    edges: [
      [...entrance.edges[0], hitA, image],
      [...entrance.edges[1], hitB, image],
    ],
    incidenceDeg: radToDeg(frame.incidenceRad),
    diffractionDeg: radToDeg(beta),
    exitOffsetMm: dot(sub(image, exitCentre), exitAlong),
  };
  return { ray, cameraHits: [chiefHit, hitA, hitB] };
}
