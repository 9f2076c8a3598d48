import { formatFixed, formatNumber, withUnit } from '../../shared/format';

// The sketch's number labels, by the app's one formatting rule (true minus, grouping, a
// no-break space before the unit).

/** A length in millimetres, in the sketch's figures. */
export function formatMm(lengthMm: number): string {
  return withUnit(formatSketchNumber(lengthMm), 'mm');
}

/**
 * Four significant figures, but never coarser than 0.1 from 1000 up, so the three rays of a
 * narrow near-infrared range keep three different labels.
 */
export function formatSketchNumber(value: number): string {
  const significant = Math.floor(Math.log10(Math.abs(value))) + 2;
  return formatNumber(value, Math.min(21, Math.max(4, significant)));
}

export function formatNm(wavelengthNm: number): string {
  return withUnit(formatSketchNumber(wavelengthNm), 'nm');
}

/** Angles read against the drawing: two decimals, one from 100° up. */
export function formatDeg(angleDeg: number): string {
  return withUnit(formatFixed(angleDeg, Math.abs(angleDeg) >= 100 ? 1 : 2), '°');
}
