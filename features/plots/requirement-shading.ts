/**
 * Where a design breaks its own requirements, per plot, from the plot's own sweep: the shaded
 * wavelength intervals and a sentence for the plot's accessible summary. Pure: no React.
 */

import type { Design } from '../../shared/design';
import { formatNumber, formatPercent } from '../../shared/format';
import type { RequirementId, Requirements } from '../../shared/requirements';
import { requirementFailsAt } from '../requirements';
import type { WavelengthPoint } from '../solver';
import { flaggedIntervals, type Interval } from './plot-paths';

export type ShadedPlot = 'dispersion' | 'bandpass' | 'efficiency';

/** The requirements each plot shows failing: the ones it draws the figure of. */
export const PLOT_REQUIREMENTS: Readonly<Record<ShadedPlot, readonly RequirementId[]>> = {
  dispersion: ['maxReciprocalDispersionNmPerMm'],
  bandpass: ['maxBandpassNm', 'minResolvingPower'],
  efficiency: ['minBlazeEfficiency', 'orderOverlap'],
};

export interface RequirementShade {
  intervals: Interval[];
  /** "bandpass over 0.5 nm between 820 and 900 nm; …"; empty when nothing fails. */
  summary: string;
}

function failureWords(id: RequirementId, r: Requirements): string {
  switch (id) {
    case 'maxBandpassNm':
      return `bandpass over ${formatNumber(r.maxBandpassNm ?? 0)} nm`;
    case 'minResolvingPower':
      return `resolving power under ${formatNumber(r.minResolvingPower ?? 0)}`;
    case 'minBlazeEfficiency':
      return `efficiency under ${formatPercent(r.minBlazeEfficiency ?? 0)}`;
    case 'minRelativeThroughput':
      return `throughput under ${formatPercent(r.minRelativeThroughput ?? 0)}`;
    case 'orderOverlap':
      return 'other orders overlapping, which the requirements forbid';
    case 'maxReciprocalDispersionNmPerMm':
      return `reciprocal dispersion over ${formatNumber(r.maxReciprocalDispersionNmPerMm ?? 0)} nm/mm`;
    default:
      return id;
  }
}

/** Runs of failing samples as "820 and 900 nm" / "at 900 nm", joined. */
function spanWords(xs: readonly number[], fails: readonly boolean[]): string {
  const spans: string[] = [];
  let start = -1;
  for (let i = 0; i <= xs.length; i++) {
    const on = i < xs.length && fails[i] === true;
    if (on && start < 0) start = i;
    if (!on && start >= 0) {
      const from = xs[start] as number;
      const to = xs[i - 1] as number;
      spans.push(from === to ? `at ${formatNumber(from)} nm` : `between ${formatNumber(from)} and ${formatNumber(to)} nm`);
      start = -1;
    }
  }
  return spans.length > 3 ? `${spans.slice(0, 3).join(', ')} and ${spans.length - 3} more places` : spans.join(', ');
}

/**
 * Each plot's failing intervals: a sample is shaded where `requirementFailsAt` names one of the
 * plot's requirements there, so the shading is exactly the sweep's own verdict. `points` must
 * ascend by wavelength (the plots' own order).
 */
export function requirementShading(
  points: readonly WavelengthPoint[],
  design: Design | null | undefined,
): Record<ShadedPlot, RequirementShade> | null {
  const requirements = design?.requirements;
  if (!design || !requirements) return null;
  const failing = points.map((p) => new Set(requirementFailsAt(requirements, p, design)));
  const xs = points.map((p) => p.wavelengthNm);
  const shade = (ids: readonly RequirementId[]): RequirementShade => {
    const anyFails = failing.map((set) => ids.some((id) => set.has(id)));
    const summary = ids
      .map((id) => {
        const fails = failing.map((set) => set.has(id));
        return fails.some(Boolean) ? `${failureWords(id, requirements)} ${spanWords(xs, fails)}` : '';
      })
      .filter(Boolean)
      .join('; ');
    return { intervals: flaggedIntervals(xs, (i) => anyFails[i] === true), summary };
  };
  return {
    dispersion: shade(PLOT_REQUIREMENTS.dispersion),
    bandpass: shade(PLOT_REQUIREMENTS.bandpass),
    efficiency: shade(PLOT_REQUIREMENTS.efficiency),
  };
}
