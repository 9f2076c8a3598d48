/** Figures read off the prism's points for the screen. Pure: no React. */

import type { PrismPoint } from '@/shared/selectors';

/**
 * The bandpass at the two ends of the range and their ratio: the number that shows a prism's
 * non-linear dispersion (a grating's ratio stays near 1). Null without a bandpass at both ends.
 */
export function bandpassSpread(points: readonly PrismPoint[]): { startNm: number; endNm: number; ratio: number } | null {
  const first = points[0]?.bandpassNm ?? null;
  const last = points[points.length - 1]?.bandpassNm ?? null;
  if (first === null || last === null || !(first > 0)) return null;
  return { startNm: first, endNm: last, ratio: last / first };
}
