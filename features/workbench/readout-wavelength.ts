import type { Evaluation, WavelengthPoint } from '@/features/solver';
import type { Design } from '@/shared/design';
import { formatNumber, formatQuantity } from '@/shared/format';

type Range = Design['range'];

/** The wavelength nearest `wantedNm` that the range holds: itself, or the nearer end. */
export function clampToRange(wantedNm: number, range: Range): number {
  return Math.min(range.endNm, Math.max(range.startNm, wantedNm));
}

/** "250–800 nm", for messages about the range. */
export function rangeText(range: Range): string {
  return `${formatNumber(range.startNm)}–${formatQuantity(range.endNm, 'nm')}`;
}

/** Why a typed read-out wavelength is refused when the range does not hold it; null when it does. */
export function outsideRangeMessage(wavelengthNm: number, range: Range): string | null {
  if (wavelengthNm >= range.startNm && wavelengthNm <= range.endNm) return null;
  return `must be within the wavelength range, ${rangeText(range)}`;
}

/**
 * Where the read-out goes after the range changed: the wavelength last chosen when the new range
 * holds it, else the nearer end of the range. `note` tells the user when it moved (null when it
 * stays where it is shown now).
 */
export function followRange(
  wantedNm: number,
  shownNm: number | null,
  range: Range,
): { nm: number; note: string | null } {
  const nm = clampToRange(wantedNm, range);
  if (shownNm !== null && Math.abs(nm - shownNm) < 1e-9) return { nm, note: null };
  if (nm === wantedNm) return { nm, note: `Read-out back at ${formatQuantity(nm, 'nm')}, inside the range again.` };
  const end = nm === range.startNm ? 'starts' : 'ends';
  return {
    nm,
    note: `Read-out moved from ${formatQuantity(wantedNm, 'nm')} to ${formatQuantity(nm, 'nm')}: the range now ${end} there.`,
  };
}

/**
 * The sweep with the read-out's own point in it, in wavelength order, so the plots' read-out
 * (which names the nearest sample) and their marker say the same wavelength as the read-out card.
 */
export function withReadoutPoint(evaluation: Evaluation, point: WavelengthPoint | null): Evaluation {
  if (!point) return evaluation;
  const { points } = evaluation;
  const at = points.findIndex((p) => p.wavelengthNm >= point.wavelengthNm);
  if (at >= 0 && Math.abs((points[at] as WavelengthPoint).wavelengthNm - point.wavelengthNm) < 1e-9) return evaluation;
  const index = at < 0 ? points.length : at;
  return { ...evaluation, points: [...points.slice(0, index), point, ...points.slice(index)] };
}
