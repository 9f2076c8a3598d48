import { formatInteger, formatNumber, formatPercent, formatQuantity } from '../../shared/format';
import type { DetectorTilt, Spot, TraceReport, TracedWavelength } from './types';

/**
 * The image-quality card's sentences, pure so they can be tested without a screen. Signs follow
 * types.ts: x toward longer wavelengths, shifts along the chief ray positive away from the camera.
 */

const ROLE_WORDS: Record<TracedWavelength['role'], string> = {
  start: 'range start',
  centre: 'range centre',
  end: 'range end',
  asked: 'read-out',
};

const HEIGHT_WORDS: Record<Spot['role'], string> = { top: 'slit top', centre: 'slit centre', bottom: 'slit bottom' };

/** A length in µm for figures that are microns across (spot widths, sagittae): 0.0123 mm → "12.3 µm". */
export function micrometres(mm: number, significant = 3): string {
  return formatQuantity(mm * 1000, 'µm', significant);
}

/** "500 nm (read-out)". */
export function wavelengthLabel(w: Pick<TracedWavelength, 'wavelengthNm' | 'role'>): string {
  return `${formatQuantity(w.wavelengthNm, 'nm', 5)} (${ROLE_WORDS[w.role]})`;
}

export function heightLabel(role: Spot['role']): string {
  return HEIGHT_WORDS[role];
}

/** Below this a focus shift reads as "at the image plane", mm (well inside any depth of focus). */
const IN_PLANE_MM = 0.0005;

/** Where a focus lies along the chief ray: "0.12 mm beyond the image plane" (away from the camera). */
export function focusWords(shiftMm: number): string {
  if (!Number.isFinite(shiftMm)) return 'not found';
  if (Math.abs(shiftMm) < IN_PLANE_MM) return 'at the image plane';
  return `${formatQuantity(Math.abs(shiftMm), 'mm', 2)} ${shiftMm > 0 ? 'beyond' : 'before'} the image plane`;
}

/**
 * Skewness bands for naming coma in words, "from memory": a symmetric spot has skew 0; a clear
 * comatic flare reads about 1 or more; below 0.2 the asymmetry is lost in the ray sampling.
 */
const SLIGHT_SKEW = 0.2;
const STRONG_SKEW = 0.7;

/** The spot's asymmetry along the dispersion in words, with the side its tail (flare) points to. */
export function comaWords(spot: Pick<Spot, 'comaSkew' | 'comaMm'>): string {
  const skew = spot.comaSkew;
  if (!Number.isFinite(skew) || Math.abs(skew) < SLIGHT_SKEW) return 'No coma to speak of: the spot is symmetric along the dispersion.';
  const side = skew > 0 ? 'longer' : 'shorter';
  const strength = Math.abs(skew) < STRONG_SKEW ? 'Slight coma' : 'Strong coma';
  return `${strength}: the spot flares toward ${side} wavelengths (skew ${formatNumber(skew, 2)}, third-moment width ${micrometres(Math.abs(spot.comaMm), 2)}).`;
}

/** Traced FWHM against the slit-limited one, in words. */
export function bandpassWords(w: Pick<TracedWavelength, 'tracedFwhmNm' | 'slitLimitedFwhmNm'>): string {
  const slit = formatQuantity(w.slitLimitedFwhmNm, 'nm', 3);
  if (w.tracedFwhmNm === null) return `The traced line has no clear half-maximum width; slit-limited FWHM ${slit}.`;
  const traced = formatQuantity(w.tracedFwhmNm, 'nm', 3);
  if (!(w.slitLimitedFwhmNm > 0)) return `Traced FWHM ${traced}.`;
  const ratio = w.tracedFwhmNm / w.slitLimitedFwhmNm - 1;
  const change =
    Math.abs(ratio) < 0.005 ? 'the same' : `${formatPercent(Math.abs(ratio))} ${ratio > 0 ? 'wider' : 'narrower'}`;
  return `Traced FWHM ${traced} against the slit-limited ${slit}: ${change}.`;
}

/** The bow of a straight slit's image at this wavelength, and (the trace's choice) a curved slit. */
export function curvatureWords(report: Pick<TraceReport, 'curvedEntrance' | 'straighteningRadiusMm'>, w: Pick<TracedWavelength, 'curvatureSagittaMm'>): string {
  const sag = w.curvatureSagittaMm;
  const bow =
    Math.abs(sag) < 1e-5
      ? 'is straight to within 0.01 µm'
      : `bows by ${micrometres(Math.abs(sag))} at its ends, toward ${sag > 0 ? 'longer' : 'shorter'} wavelengths`;
  if (report.curvedEntrance) {
    const radius = report.straighteningRadiusMm === null ? '' : ` (radius ${formatQuantity(report.straighteningRadiusMm, 'mm', 3)})`;
    return `With the curved entrance slit${radius} the image ${bow}.`;
  }
  return `The image of the straight entrance slit ${bow} (sagitta).`;
}

/** The entrance-slit radius that straightens the image, in words. */
export function straighteningWords(report: Pick<TraceReport, 'straighteningRadiusMm'>): string {
  return report.straighteningRadiusMm === null
    ? 'The slit image is straight enough that a curved entrance slit would not help.'
    : `An entrance slit bent to a radius of ${formatQuantity(report.straighteningRadiusMm, 'mm', 3)} straightens the centre wavelength’s image.`;
}

/** Tangential and sagittal foci and their gap. */
export function astigmatismWords(
  w: Pick<TracedWavelength, 'tangentialFocusShiftMm' | 'sagittalFocusShiftMm' | 'astigmatismMm' | 'bestFocusShiftMm'>,
): string[] {
  return [
    `Tangential focus (sets the bandpass): ${focusWords(w.tangentialFocusShiftMm)}.`,
    `Sagittal focus (sets the image height): ${focusWords(w.sagittalFocusShiftMm)}.`,
    `Astigmatism, the gap between them: ${formatQuantity(Math.abs(w.astigmatismMm), 'mm', 3)}.`,
    `Best focus: ${focusWords(w.bestFocusShiftMm)}.`,
  ];
}

/** A spectrograph's best detector tilt and what it buys. */
export function tiltWords(tilt: DetectorTilt): string {
  const turn =
    Math.abs(tilt.bestTiltDeg) < 0.05
      ? 'The untilted detector already follows the foci'
      : `Tilting the detector by ${formatQuantity(Math.abs(tilt.bestTiltDeg), '°', 2)} (its long-wavelength end ${tilt.bestTiltDeg > 0 ? 'away from' : 'toward'} the camera)`;
  return `${turn}: mean RMS width ${micrometres(tilt.rmsWidthFlatMm)} flat, ${micrometres(tilt.rmsWidthTiltedMm)} tilted (${formatPercent(tilt.gain)} less blur).`;
}

/** One spot in words, for its diagram's accessible name. */
export function spotWords(w: Pick<TracedWavelength, 'wavelengthNm' | 'role'>, spot: Spot): string {
  const lost = spot.raysVignetted > 0 ? `, ${formatInteger(spot.raysVignetted)} of ${formatInteger(spot.raysLaunched)} rays vignetted` : '';
  return `Spot at ${wavelengthLabel(w)}, ${heightLabel(spot.role)}: RMS width ${micrometres(spot.rmsWidthMm)}, RMS height ${micrometres(spot.rmsHeightMm)}${lost}.`;
}

/** The card's live status line. */
export function traceStatusWords(state: { tracing: boolean; failure: string | null; elapsedMs: number | null; rays: number | null }): string {
  if (state.tracing) return 'Tracing…';
  if (state.failure) return `The trace could not run: ${state.failure}.`;
  if (state.rays === null) return 'Not traced yet.';
  const took = state.elapsedMs === null ? '' : ` in ${formatInteger(state.elapsedMs)} ms`;
  return `Traced ${formatInteger(state.rays)} rays per wavelength${took}.`;
}
