/**
 * What the exact ray trace reports. Pure data (typed arrays for the ray positions), so it crosses
 * the Web Worker boundary by structured clone and the server serialises its summary.
 *
 * Image-plane axes (every position below): x along the dispersion, positive toward longer
 * wavelengths; y along the slit, positive toward the top of the entrance slit's image; in mm from
 * the exit slit's centre (a spectrograph: the detector's centre). Shifts along the chief ray are
 * positive away from the camera mirror.
 */

/** Where on the entrance slit a spot's rays start: its centre line at one height. */
export type SlitHeightRole = 'centre' | 'top' | 'bottom';

/** The rays from one point of the entrance slit, where they cross the image plane. */
export interface Spot {
  role: SlitHeightRole;
  /** Height of the source point on the entrance slit, mm (top positive). */
  slitHeightMm: number;
  /** Image-plane positions of the rays that arrived, mm. */
  x: Float64Array;
  y: Float64Array;
  centroidMm: { x: number; y: number };
  rmsWidthMm: number;
  rmsHeightMm: number;
  /** Third central moment of x over rms³ (dimensionless): the spot's coma-like asymmetry. */
  comaSkew: number;
  /** Third central moment of x, mm³ ∛-rooted to mm (signed), for comparing coma between designs. */
  comaMm: number;
  raysLaunched: number;
  raysVignetted: number;
}

/** The traced instrument function at one wavelength, against the closed-form trapezoid. */
export interface LineShape {
  /** Wavelength offsets from the traced wavelength, nm. */
  offsetNm: Float64Array;
  /** Share of the traced light through the exit slit at each offset, peak 1. */
  traced: Float64Array;
  /** The slit-limited trapezoid (entrance image ⊗ exit slit), peak 1. */
  closedForm: Float64Array;
}

export interface TracedWavelength {
  wavelengthNm: number;
  /** Where the wavelength came from: the range's ends and centre, or one asked for. */
  role: 'start' | 'centre' | 'end' | 'asked';
  /** False when the grating cannot send it through the mount (nothing else is filled in then). */
  reachable: boolean;
  spots: Spot[];
  /** Rays over the whole entrance slit (width × height) for the line shape, the counts and the centroid. */
  raysLaunched: number;
  raysTraced: number;
  raysVignetted: number;
  /** Centroid of the whole slit's image. */
  centroidMm: { x: number; y: number };
  /** RMS width and height of the centre spot (a point at the slit's centre): the blur the optics add. */
  rmsWidthMm: number;
  rmsHeightMm: number;
  lineShape: LineShape;
  tracedFwhmNm: number | null;
  slitLimitedFwhmNm: number;
  /** Bow of a straight slit's image: x at the slit's ends minus x at its centre, mm. */
  curvatureSagittaMm: number;
  tracedLinearDispersionMmPerNm: number;
  /** Distance traced from the camera mirror to the image plane along the chief ray, mm. */
  cameraToImageMm: number;
  /** Best focus in x (the tangential focus, which sets the bandpass) relative to the image plane. */
  bestFocusShiftMm: number;
  /** Tangential (x) and sagittal (y) foci relative to the image plane, mm; their gap is the astigmatism. */
  tangentialFocusShiftMm: number;
  sagittalFocusShiftMm: number;
  astigmatismMm: number;
  /** RMS width of the centre spot at shifts of the image plane along the chief ray. */
  throughFocus: { shiftMm: Float64Array; rmsWidthMm: Float64Array };
}

/**
 * A design's flat detector (grating at the range centre): the tilt that follows the tangential
 * foci across the detector, from five wavelengths spread over it inside the range.
 */
export interface DetectorTilt {
  /** Rotation of the detector about the slit direction, degrees; positive turns its long-wavelength end away from the camera. */
  bestTiltDeg: number;
  /** Mean RMS width across the range on the untilted and the tilted detector, mm. */
  rmsWidthFlatMm: number;
  rmsWidthTiltedMm: number;
  /** 1 − tilted/flat: the share of the blur the tilt removes. */
  gain: number;
}

export interface TraceReport {
  /** What the image plane is, in words (e.g. the camera's tangential focus f₂ cos θ₂). */
  imagePlane: string;
  /**
   * 'spectrograph' when a detector holds the whole range at one grating setting (the grating stays
   * at the range centre); otherwise 'monochromator' (the grating turns to each traced wavelength,
   * which then lands on the exit slit's centre).
   */
  mode: 'monochromator' | 'spectrograph';
  raysPerWavelength: number;
  wavelengths: TracedWavelength[];
  /** Radius of the entrance-slit arc that straightens the centre wavelength's image, mm (null: straight enough already). */
  straighteningRadiusMm: number | null;
  curvedEntrance: boolean;
  detectorTilt: DetectorTilt | null;
  /** Exit slit (or, with a detector, its width and one pixel) to scale, mm. */
  exitSlit: { widthMm: number; heightMm: number };
  pixel: { widthMm: number } | null;
}
