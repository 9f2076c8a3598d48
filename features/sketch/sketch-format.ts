import { formatFixed, formatNumber } from '../../shared/format';

// The sketch's number labels, by the app's one formatting rule (true minus, grouping).

/**
 * Four significant figures, but never coarser than 0.1 from 1000 up, so the three rays of a
 * narrow near-infrared range keep three different labels.
 */
export function formatSketchNumber(value: number): string {
  const significant = Math.floor(Math.log10(Math.abs(value))) + 2;
  return formatNumber(value, Math.min(21, Math.max(4, significant)));
}

export function formatNm(wavelengthNm: number): string {
  return `${formatSketchNumber(wavelengthNm)} nm`;
}

/** Angles read against the drawing: two decimals, one from 100° up. */
export function formatDeg(angleDeg: number): string {
  return `${formatFixed(angleDeg, Math.abs(angleDeg) >= 100 ? 1 : 2)}°`;
}
