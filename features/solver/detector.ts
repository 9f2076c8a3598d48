/**
 * A flat detector in the exit plane, normal to the central diffracted ray, with the centre of the
 * design range on its centre pixel. With the grating fixed, a point `x` mm from the centre sees
 * the diffraction angle `β(x) = β_c + sgn(m)·atan(x / f_cam)`; the wavelength there follows from
 * the grating equation exactly, `λ(x) = d(sin α + sin β(x)) / m`, rather than from the linear
 * dispersion (which drifts across a wide detector). `x` grows toward longer wavelengths.
 */

import { HALF_PI, GRAZING_MARGIN_RAD, UM_PER_MM } from './math';

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
  /** Bandpass at the centre wavelength in pixels; under 2 is undersampled (common practice). */
  pixelsPerBandpass: number;
}

export function detectorCoverage(
  geometry: DetectorGeometry,
  detector: { pixelPitchUm: number; pixelCount: number },
  range: { startNm: number; endNm: number },
  centreReciprocalDispersionNmPerMm: number,
  centreBandpassNm: number,
): DetectorCoverage {
  const pitchMm = detector.pixelPitchUm / UM_PER_MM;
  const widthMm = pitchMm * detector.pixelCount;
  const startNm = wavelengthAtDetectorNm(geometry, -widthMm / 2);
  const endNm = wavelengthAtDetectorNm(geometry, widthMm / 2);
  const nmPerPixel = centreReciprocalDispersionNmPerMm * pitchMm;
  return {
    widthMm,
    startNm,
    endNm,
    coverageNm: startNm !== null && endNm !== null ? endNm - startNm : null,
    coversRange:
      startNm !== null && endNm !== null && startNm <= range.startNm && endNm >= range.endNm,
    nmPerPixel,
    pixelsPerBandpass: centreBandpassNm / nmPerPixel,
  };
}
