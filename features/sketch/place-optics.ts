import type { Design } from '../../shared/design';
import { UM_PER_MM, degToRad } from '../solver';
import type { GratingFrame } from './grating-frame';
import type { PointMm, SegmentMm, SketchGeometry, SketchSlit } from './sketch-types';
import { add, perpendicular, rotate, scale, segmentAround, sub, unit } from './vector';

const DEFAULT_MIN_OFF_AXIS_RAD = degToRad(5);

/** θ, half the angle each mirror folds the chief ray through, radians (0 for a lens). */
export interface OffAxisAngles {
  collimatorRad: number;
  cameraRad: number;
}

/** Where the optics' centres and the slits sit, and which way each optic faces. */
export interface OpticPlacement {
  collimatorCentre: PointMm;
  cameraCentre: PointMm;
  /** Unit vectors from each optic toward its slit. */
  toEntrance: PointMm;
  toExit: PointMm;
  /** Each optic's surface normal, on its working side. */
  collimatorNormal: PointMm;
  cameraNormal: PointMm;
  entranceCentre: PointMm;
  exitCentre: PointMm;
  exitAlong: PointMm;
  /** Littrow: how far each slit is set aside so the two do not coincide in this view. */
  entranceShift: PointMm;
  exitShift: PointMm;
  /** 90° clockwise of the bisector: the camera's half of the drawing. */
  cameraSide: PointMm;
}

/** A Czerny–Turner's off-axis angle when the design gives none: K, at least 5°, which puts the slits level with the grating. */
export function defaultOffAxisRad(halfDeviationRad: number): number {
  return Math.max(halfDeviationRad, DEFAULT_MIN_OFF_AXIS_RAD);
}

/** Czerny–Turner: the design's angles or the default; Ebert–Fastie: K/2 on both sides (one sphere); Littrow: none. */
export function offAxisAngles(layout: Design['layout'], halfDeviationRad: number): OffAxisAngles {
  if (layout.kind === 'czerny-turner') {
    const fallback = defaultOffAxisRad(halfDeviationRad);
    return {
      collimatorRad:
        layout.collimatorOffAxisDeg === undefined ? fallback : degToRad(layout.collimatorOffAxisDeg),
      cameraRad: layout.cameraOffAxisDeg === undefined ? fallback : degToRad(layout.cameraOffAxisDeg),
    };
  }
  if (layout.kind === 'ebert-fastie') {
    return { collimatorRad: halfDeviationRad / 2, cameraRad: halfDeviationRad / 2 };
  }
  return { collimatorRad: 0, cameraRad: 0 };
}

/**
 * Each mirror its focal length from the grating along the chief ray, each slit its focal length
 * from its mirror, folded by twice the off-axis angle.
 */
export function placeOptics(
  frame: GratingFrame,
  offAxis: OffAxisAngles,
  ruledWidthMm: number,
): OpticPlacement {
  const { isLens, towardCollimator, towardCamera, collimatorFocalMm: f1, cameraFocalMm: f2 } = frame;
  const collimatorCentre = scale(towardCollimator, f1);
  const cameraCentre = isLens ? collimatorCentre : scale(towardCamera, f2);
  const toEntrance = isLens
    ? towardCollimator
    : rotate(scale(towardCollimator, -1), -2 * offAxis.collimatorRad);
  const toExit = isLens ? towardCollimator : rotate(scale(towardCamera, -1), 2 * offAxis.cameraRad);

  // Littrow: the two slits share a point in this view; set them side by side.
  const littrowGapMm = isLens ? Math.max(0.05 * f1, 0.3 * ruledWidthMm) : 0;
  const entranceShift = scale(perpendicular(towardCollimator), littrowGapMm / 2);
  const exitShift = scale(entranceShift, -1);
  const entranceCentre = add(collimatorCentre, scale(toEntrance, f1));
  const exitCentre = add(cameraCentre, scale(toExit, f2));
  return {
    collimatorCentre,
    cameraCentre,
    toEntrance,
    toExit,
    collimatorNormal: isLens ? towardCollimator : unit(sub(toEntrance, towardCollimator)),
    cameraNormal: isLens ? towardCollimator : unit(sub(toExit, towardCamera)),
    entranceCentre: isLens ? add(entranceCentre, entranceShift) : entranceCentre,
    exitCentre: isLens ? add(exitCentre, exitShift) : exitCentre,
    exitAlong: perpendicular(toExit),
    entranceShift,
    exitShift,
    cameraSide: perpendicular(scale(frame.bisector, -1)),
  };
}

/** Both slits, their widths to scale, labelled below and outward (Littrow: away from each other). */
export function placeSlits(
  frame: GratingFrame,
  placement: OpticPlacement,
  slits: Design['slits'],
): { entranceSlit: SketchSlit; exitSlit: SketchSlit } {
  const { bisector, isLens } = frame;
  const { cameraSide } = placement;
  // Below the slit and outward, so the slit labels stay clear of the grating's between them.
  const slitLabel = (side: number) => unit(add(scale(bisector, -1), scale(cameraSide, 0.9 * side)));
  return {
    entranceSlit: {
      centre: placement.entranceCentre,
      along: perpendicular(placement.toEntrance),
      widthMm: slits.entranceWidthUm / UM_PER_MM,
      labelDirection: isLens ? unit(placement.entranceShift) : slitLabel(-1),
    },
    exitSlit: {
      centre: placement.exitCentre,
      along: placement.exitAlong,
      widthMm: slits.exitWidthUm / UM_PER_MM,
      labelDirection: isLens ? unit(placement.exitShift) : slitLabel(1),
    },
  };
}

/** `pixelCount × pixelPitch` along the exit plane, centred on it; null without a detector. */
export function placeDetector(placement: OpticPlacement, detector: Design['detector']): SegmentMm | null {
  if (!detector) return null;
  const lengthMm = (detector.pixelCount * detector.pixelPitchUm) / UM_PER_MM;
  return segmentAround(placement.exitCentre, placement.exitAlong, lengthMm);
}

/** The grating block at the origin: ruled face, substrate behind it, and its normal. */
export function gratingBody(frame: GratingFrame, ruledWidthMm: number): SketchGeometry['grating'] {
  const { normal, bisector, isLens, shorterFocalMm } = frame;
  const backDepth = Math.max(ruledWidthMm * 0.18, 1);
  const [faceA, faceB] = frame.edgePoints;
  return {
    centre: { x: 0, y: 0 },
    face: { a: faceA, b: faceB },
    back: [add(faceB, scale(normal, -backDepth)), add(faceA, scale(normal, -backDepth))],
    normal: { a: { x: 0, y: 0 }, b: scale(normal, 0.5 * shorterFocalMm) },
    ruledWidthMm,
    // Behind the grating; in Littrow (lying down) below it, where the drawing has room.
    labelDirection: isLens ? perpendicular(scale(bisector, -1)) : scale(normal, -1),
  };
}
