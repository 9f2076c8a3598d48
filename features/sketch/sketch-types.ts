// The shapes of the to-scale sketch, in millimetres (see geometry.ts for the frame).

import type { LayoutKind } from '../../shared/design';

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
