import type { Design, LayoutKind } from '../../shared/design';
import {
  HALF_PI,
  degToRad,
  grooveSpacingNm,
  halfDeviationRad,
  solveGrating,
  type GratingSolution,
} from '../solver';
import type { PointMm, SketchOptions } from './sketch-types';
import { fromAngle, scale } from './vector';

/** The grating turned to the setting wavelength, and the directions every later step starts from. */
export interface GratingFrame {
  kind: LayoutKind;
  /** Littrow: one lens both collimates and focuses. */
  isLens: boolean;
  order: number;
  spacingNm: number;
  /** K, half the deviation, radians. */
  halfDeviationRad: number;
  centreNm: number;
  settingNm: number;
  setting: GratingSolution;
  /** φ, the grating rotation (0 when the setting is unreachable), radians. */
  rotationRad: number;
  /** α = φ + K, radians. */
  incidenceRad: number;
  bisectorRad: number;
  bisector: PointMm;
  normalRad: number;
  normal: PointMm;
  towardCollimator: PointMm;
  towardCamera: PointMm;
  /** The ends of the ruled width, −½ and +½ of it along the face. */
  edgePoints: [PointMm, PointMm];
  collimatorFocalMm: number;
  cameraFocalMm: number;
  shorterFocalMm: number;
}

/** Turns the grating to `options.settingNm` (default: the range centre) about the origin. */
export function gratingFrame(design: Design, options: SketchOptions): GratingFrame {
  const { grating, layout, range } = design;
  const kind = layout.kind;
  const order = grating.order;
  const spacingNm = grooveSpacingNm(grating.grooveDensityPerMm);
  const K = halfDeviationRad(layout);
  const centreNm = (range.startNm + range.endNm) / 2;
  const settingNm = options.settingNm ?? centreNm;
  const setting = solveGrating(order, settingNm, spacingNm, K);
  const phi = setting.reachable ? setting.rotationRad : 0;
  const alpha = phi + K;

  const bisectorRad = degToRad(options.bisectorAngleDeg ?? (kind === 'littrow' ? 0 : 90));
  const normalRad = bisectorRad - phi;
  const faceDir = fromAngle(normalRad - HALF_PI);
  const halfWidth = grating.ruledWidthMm / 2;
  return {
    kind,
    isLens: kind === 'littrow',
    order,
    spacingNm,
    halfDeviationRad: K,
    centreNm,
    settingNm,
    setting,
    rotationRad: phi,
    incidenceRad: alpha,
    bisectorRad,
    bisector: fromAngle(bisectorRad),
    normalRad,
    normal: fromAngle(normalRad),
    towardCollimator: fromAngle(normalRad + alpha), // = bisector + K
    towardCamera: fromAngle(bisectorRad - K),
    edgePoints: [scale(faceDir, -halfWidth), scale(faceDir, halfWidth)],
    collimatorFocalMm: layout.collimatorFocalMm,
    cameraFocalMm: layout.cameraFocalMm,
    shorterFocalMm: Math.min(layout.collimatorFocalMm, layout.cameraFocalMm),
  };
}
