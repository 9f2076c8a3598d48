/** What a calculator's plot says to someone who cannot see it. Pure: no React. */

// The pure file, not the feature's index: the index also exports the React plots.
import { valueExtent, type Values } from '@/features/plots/plot-paths';
import { formatNumber, withUnit } from '@/shared/format';

/** One line of a calculator plot: the workbench plot series' fields that a calculator uses. */
export interface XySeries {
  label: string;
  /** Empty when dimensionless. */
  unit: string;
  values: Values;
  color: string;
  dash?: string;
  /** How a value reads in the summary, when the unit alone does not say it ("87 %"). */
  format?: (value: number | null) => string;
}

/**
 * "Transmission against wavelength, 350 to 800 nm; Stack from 0 to 87 %; …; peaks at 366.7 and
 * 550 nm": the x span, each line's span (its own format when it has one) and any extra words.
 */
export function describeXyPlot(
  title: string,
  xName: string,
  xUnit: string,
  xs: readonly number[],
  series: readonly XySeries[],
  extra?: string | null,
): string {
  const x0 = xs[0];
  const x1 = xs[xs.length - 1];
  const show = (s: XySeries, v: number) => (s.format ? s.format(v) : withUnit(formatNumber(v, 3), s.unit || null));
  const spans = series.map((s) => {
    const extent = valueExtent(s.values);
    return extent ? `${s.label} from ${show(s, extent[0])} to ${show(s, extent[1])}` : `no ${s.label} values`;
  });
  const xSpan =
    x0 === undefined || x1 === undefined ? 'no points' : `${formatNumber(x0)} to ${withUnit(formatNumber(x1), xUnit)}`;
  return [`${title} against ${xName}, ${xSpan}`, ...spans, extra ?? null].filter(Boolean).join('; ');
}
