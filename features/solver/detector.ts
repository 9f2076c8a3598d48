/**
 * A flat detector in the exit plane, normal to the central diffracted ray, with the centre of the
 * design range on its centre pixel. With the grating fixed, a point `x` mm from the centre sees
 * the diffraction angle `β(x) = β_c + sgn(m)·atan(x / f_cam)`; the wavelength there follows from
 * the grating equation exactly, `λ(x) = d(sin α + sin β(x)) / m`, rather than from the linear
 * dispersion (which drifts across a wide detector). `x` grows toward longer wavelengths.
 */

import { entranceImageWidthMm } from './bandpass';
import { reciprocalDispersionNmPerMm } from './dispersion';
import { HALF_PI, GRAZING_MARGIN_RAD, UM_PER_MM } from './math';
import { anamorphicMagnification } from './mount';
import { diffractionLimitNm } from './resolving-power';

export interface DetectorGeometry {
  order: number;
  spacingNm: number;
  /** Fixed incidence at the grating, rad. */
  incidenceRad: number;
  /** Diffraction angle of the ray reaching the detector's centre, rad. */
  centreDiffractionRad: number;
  cameraFocalMm: number;
}

/** Wavelength reaching the point `xMm` from the detector's centre, or null past grazing. */
export function wavelengthAtDetectorNm(geometry: DetectorGeometry, xMm: number): number | null {
  const { order, spacingNm, incidenceRad, centreDiffractionRad, cameraFocalMm } = geometry;
  const beta = centreDiffractionRad + Math.sign(order) * Math.atan(xMm / cameraFocalMm);
  if (Math.abs(beta) >= HALF_PI - GRAZING_MARGIN_RAD) return null;
  const wavelengthNm = (spacingNm * (Math.sin(incidenceRad) + Math.sin(beta))) / order;
  return wavelengthNm > 0 ? wavelengthNm : null;
}

/** What sets the width of one resolution element on the detector, besides the geometry. */
export interface DetectorOptics {
  collimatorFocalMm: number;
  entranceWidthMm: number;
  /** N, grooves under the beam. */
  grooves: number;
}

export type SamplePosition = 'start' | 'centre' | 'end';

/** How one wavelength's resolution element falls on the pixels. */
export interface DetectorSample {
  /** Range start, centre or end (an end off the detector is sampled at the detector's edge). */
  position: SamplePosition;
  wavelengthNm: number;
  /** Width of the entrance-slit image on the detector, µm. */
  entranceImageUm: number;
  /** Width of the diffraction-limited line, `λ/(|m|N)` over the local reciprocal dispersion, µm. */
  diffractionSpotUm: number;
  /** The wider of the two over the pixel pitch; under 2 undersamples (Nyquist, common practice). */
  pixelsPerResolutionElement: number;
}

/**
 * The resolution element at `wavelengthNm` on a spectrograph's detector. There is no exit slit
 * in the beam, so the detector sees the entrance-slit image, `w_ent (cos α / cos β)(f_cam/f_col)`
 * (Palmer & Loewen, ch. 2), or the diffraction-limited line, `λ/(|m|N)` divided by the reciprocal
 * dispersion (Born & Wolf), whichever is wider. With the grating fixed at the centre wavelength's
 * angle, β follows from the grating equation at fixed α; off the centre the flat detector meets
 * the ray obliquely and widths grow by `1/cos²(β − β_c)` (from `x = f tan(β − β_c)`). Null when
 * the wavelength does not reach the camera.
 */
export function detectorSampleAt(
  geometry: DetectorGeometry,
  optics: DetectorOptics,
  pixelPitchUm: number,
  wavelengthNm: number,
  position: SamplePosition,
): DetectorSample | null {
  const { order, spacingNm, incidenceRad, centreDiffractionRad, cameraFocalMm } = geometry;
  const sinBeta = (order * wavelengthNm) / spacingNm - Math.sin(incidenceRad);
  if (!(Math.abs(sinBeta) < 1)) return null;
  const beta = Math.asin(sinBeta);
  if (Math.abs(beta) >= HALF_PI - GRAZING_MARGIN_RAD) return null;
  const cosBeta = Math.cos(beta);
  const offAxis = Math.cos(beta - centreDiffractionRad);
  const obliquity = 1 / (offAxis * offAxis);
  const magnification = anamorphicMagnification(
    Math.cos(incidenceRad),
    cosBeta,
    optics.collimatorFocalMm,
    cameraFocalMm,
  );
  const imageMm = entranceImageWidthMm(optics.entranceWidthMm, magnification) * obliquity;
  const spotMm =
    (diffractionLimitNm(wavelengthNm, order, optics.grooves) /
      reciprocalDispersionNmPerMm(order, spacingNm, cosBeta, cameraFocalMm)) *
    obliquity;
  return {
    position,
    wavelengthNm,
    entranceImageUm: imageMm * UM_PER_MM,
    diffractionSpotUm: spotMm * UM_PER_MM,
    pixelsPerResolutionElement: (Math.max(imageMm, spotMm) * UM_PER_MM) / pixelPitchUm,
  };
}

/** Detector coverage as the design summary reports it. */
export interface DetectorCoverage {
  widthMm: number;
  /** Wavelength at the short-wavelength edge, nm (null when that edge sees no light). */
  startNm: number | null;
  endNm: number | null;
  /** `endNm − startNm`, nm. */
  coverageNm: number | null;
  /** Whether the whole design range falls on the detector. */
  coversRange: boolean;
  /** Reciprocal dispersion × pitch at the centre pixel, nm. */
  nmPerPixel: number;
  /**
   * Slit-limited bandpass at the centre wavelength (entrance image and exit slit) in pixels: a
   * monochromator's figure, kept for scripts that read it. A spectrograph has no exit slit in the
   * beam; judge its sampling by `pixelsPerResolutionElement`.
   */
  pixelsPerBandpass: number;
  /**
   * Fewest pixels across one resolution element (entrance-slit image or diffraction-limited line,
   * whichever is wider) among `samples`; under 2 is undersampled (Nyquist, common practice).
   */
  pixelsPerResolutionElement: number;
  /** The range start, centre and end as they fall on the detector (unreachable ones left out). */
  samples: DetectorSample[];
}

export function detectorCoverage(
  geometry: DetectorGeometry,
  detector: { pixelPitchUm: number; pixelCount: number },
  range: { startNm: number; endNm: number },
  centreReciprocalDispersionNmPerMm: number,
  centreBandpassNm: number,
  optics: DetectorOptics,
): DetectorCoverage {
  const pitchMm = detector.pixelPitchUm / UM_PER_MM;
  const widthMm = pitchMm * detector.pixelCount;
  const startNm = wavelengthAtDetectorNm(geometry, -widthMm / 2);
  const endNm = wavelengthAtDetectorNm(geometry, widthMm / 2);
  const nmPerPixel = centreReciprocalDispersionNmPerMm * pitchMm;
  const centreNm = (range.startNm + range.endNm) / 2;
  // A range end that misses the detector is sampled where the detector stops seeing the range.
  const wanted: [SamplePosition, number][] = [
    ['start', startNm !== null && startNm > range.startNm ? startNm : range.startNm],
    ['centre', centreNm],
    ['end', endNm !== null && endNm < range.endNm ? endNm : range.endNm],
  ];
  const samples = wanted
    .map(([position, nm]) => detectorSampleAt(geometry, optics, detector.pixelPitchUm, nm, position))
    .filter((sample): sample is DetectorSample => sample !== null);
  return {
    widthMm,
    startNm,
    endNm,
    coverageNm: startNm !== null && endNm !== null ? endNm - startNm : null,
    coversRange:
      startNm !== null && endNm !== null && startNm <= range.startNm && endNm >= range.endNm,
    nmPerPixel,
    pixelsPerBandpass: centreBandpassNm / nmPerPixel,
    pixelsPerResolutionElement: Math.min(...samples.map((s) => s.pixelsPerResolutionElement)),
    samples,
  };
}
