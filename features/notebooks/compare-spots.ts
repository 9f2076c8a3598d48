/**
 * Two versions' centre-wavelength spot diagrams, side by side on the compare screen and the
 * compare sheet: which spot each shows, the aperture drawn with it, one scale for both, and the
 * change in words. Pure (no React), relative imports only, so the server's sheet uses it too.
 */

import { formatQuantity } from '../../shared/format';
import { formatRelativeChange } from '../../shared/notebooks/figure-labels';
import type { Spot, TraceReport, TracedWavelength } from '../trace/index';
import { spotWindow, type SpotWindow } from '../trace/spot-figure';

/** The exit slit (centred at x = 0), or one detector pixel for a spectrograph, to draw to scale. */
export interface SpotAperture {
  centreXMm: number;
  widthMm: number;
  label: string;
}

export type ComparedSpot =
  | { ok: true; wavelength: TracedWavelength; spot: Spot; aperture: SpotAperture }
  | { ok: false; reason: string };

/** The aperture a report's spots are drawn against. */
export function spotAperture(report: Pick<TraceReport, 'mode' | 'pixel' | 'exitSlit'>): SpotAperture {
  return report.mode === 'spectrograph' && report.pixel
    ? { centreXMm: 0, widthMm: report.pixel.widthMm, label: 'one detector pixel' }
    : { centreXMm: 0, widthMm: report.exitSlit.widthMm, label: 'the exit slit' };
}

/** The spot from the middle of the entrance slit at the range's centre, or why there is none. */
export function centreWavelengthSpot(report: TraceReport): ComparedSpot {
  const centre = report.wavelengths.find((w) => w.role === 'centre');
  if (!centre) return { ok: false, reason: 'the trace has no centre wavelength' };
  if (!centre.reachable) return { ok: false, reason: `the mount cannot reach ${formatQuantity(centre.wavelengthNm, 'nm', 5)}` };
  const spot = centre.spots.find((s) => s.role === 'centre');
  if (!spot || spot.x.length === 0) return { ok: false, reason: 'no ray from the slit’s middle reaches the image plane' };
  return { ok: true, wavelength: centre, spot, aperture: spotAperture(report) };
}

/**
 * Windows for both spots at one scale (equal mm per point): each centred on its own spot, as wide
 * as the wider of the two needs, so a sharper spot reads smaller, not the same size magnified.
 */
export function sharedSpotWindows(spots: readonly { spot: Spot; aperture: SpotAperture }[], sizePx: number): SpotWindow[] {
  const own = spots.map(({ spot, aperture }) => spotWindow(spot.x, spot.y, spot.centroidMm, aperture, sizePx));
  const halfMm = Math.max(...own.map((w) => w.halfMm));
  return own.map((w) => ({ ...w, halfMm }));
}

const change = (before: number, after: number) => (before > 0 ? formatRelativeChange(after / before - 1) : '—');

/**
 * "RMS width 51.2 µm → 38.4 µm (−25 %); traced FWHM 0.412 nm → 0.301 nm (−27 %)": the centre
 * spot's width and the traced bandpass, before and after, at the image-quality card's precision.
 */
export function spotChangeWords(before: TracedWavelength, after: TracedWavelength): string {
  const um = (mm: number) => formatQuantity(mm * 1000, 'µm', 3);
  const nm = (value: number | null) => (value === null ? 'none' : formatQuantity(value, 'nm', 3));
  const width = `RMS width ${um(before.rmsWidthMm)} → ${um(after.rmsWidthMm)} (${change(before.rmsWidthMm, after.rmsWidthMm)})`;
  const fwhm =
    before.tracedFwhmNm !== null && after.tracedFwhmNm !== null
      ? `traced FWHM ${nm(before.tracedFwhmNm)} → ${nm(after.tracedFwhmNm)} (${change(before.tracedFwhmNm, after.tracedFwhmNm)})`
      : `traced FWHM ${nm(before.tracedFwhmNm)} → ${nm(after.tracedFwhmNm)}`;
  return `${width}; ${fwhm}`;
}
