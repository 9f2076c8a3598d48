/** Plot series taken from the solver's points. Pure: no React. */

import type { WavelengthPoint } from '../solver';
import { flaggedIntervals, type Interval, type Values } from './plot-paths';

export interface PerformanceSeries {
  wavelengthsNm: number[];
  reciprocalDispersionNmPerMm: Values;
  bandpassNm: Values;
  resolvingPower: Values;
  blazeEfficiency: Values;
  gratingRotationDeg: Values;
  /**
   * Where another order of the source lands on the same angle and no order-sorting filter in the
   * beam blocks it (the solver's `unblockedOverlapCount`): accepting a filter plan shrinks it.
   */
  overlapIntervals: Interval[];
  /** Whether any other order lands on the range at all, blocked or not. */
  anyOverlap: boolean;
}

/** One pass over the points, ordered by wavelength (the plots' x must ascend). */
export function performanceSeries(points: readonly WavelengthPoint[]): PerformanceSeries {
  const sorted = isAscending(points) ? points : [...points].sort((a, b) => a.wavelengthNm - b.wavelengthNm);
  const n = sorted.length;
  const wavelengthsNm = new Array<number>(n);
  const rld = new Array<number | null>(n);
  const bandpass = new Array<number | null>(n);
  const power = new Array<number | null>(n);
  const efficiency = new Array<number | null>(n);
  const rotation = new Array<number | null>(n);
  let anyOverlap = false;
  for (let i = 0; i < n; i++) {
    const p = sorted[i] as WavelengthPoint;
    wavelengthsNm[i] = p.wavelengthNm;
    rld[i] = p.reciprocalDispersionNmPerMm;
    bandpass[i] = p.bandpassNm;
    power[i] = p.resolvingPower;
    efficiency[i] = p.blazeEfficiency;
    rotation[i] = p.gratingRotationDeg;
    if (p.overlapCount > 0) anyOverlap = true;
  }
  return {
    wavelengthsNm,
    reciprocalDispersionNmPerMm: rld,
    bandpassNm: bandpass,
    resolvingPower: power,
    blazeEfficiency: efficiency,
    gratingRotationDeg: rotation,
    overlapIntervals: flaggedIntervals(
      wavelengthsNm,
      (i) => (sorted[i] as WavelengthPoint).unblockedOverlapCount > 0,
    ),
    anyOverlap,
  };
}

function isAscending(points: readonly WavelengthPoint[]): boolean {
  for (let i = 1; i < points.length; i++) {
    if ((points[i] as WavelengthPoint).wavelengthNm < (points[i - 1] as WavelengthPoint).wavelengthNm)
      return false;
  }
  return true;
}
