import { memo, useMemo } from 'react';
import { StyleSheet, View } from 'react-native';
import type { Evaluation, WavelengthPoint } from '@/features/solver';
import type { Design } from '@/shared/design';
import type { OrderSortingFilter } from '@/shared/filters';
import { formatNumber, formatPercent } from '@/shared/format';
import { colors, space } from '@/features/ui';
import { OVERLAP_SHADE_LABEL, scalarBlazeCaution, type ScalarBlazeCaution } from '../captions';
import { filterChangeMarks, marksSummary, overlapSummary, type PlotMark } from '../filter-marks';
import { requirementShading, type RequirementShade } from '../requirement-shading';
import { performanceSeries, type PerformanceSeries } from '../series';
import { LinePlot, type PlotSeries } from './line-plot';

export type PlotProps = {
  evaluation: Evaluation;
  width: number;
  height?: number;
  selectedNm?: number | null;
  onSelectWavelength?: (wavelengthNm: number) => void;
  followHover?: boolean;
};

export type PerformancePlotsProps = PlotProps & {
  /** 1 or 2; by default two when `width` leaves each plot at least 320 px. */
  columns?: 1 | 2;
  /** The design whose requirements are shaded where they fail (the one `evaluation` is of); none when absent. */
  design?: Design | null;
  /** The design's order-sorting filters: where they change is marked on the scan curve. */
  filters?: readonly OrderSortingFilter[] | null;
};

/** The key under the efficiency plot for its shading. */

/** The key under a plot's title for its hatching. */
export const FAILING_LABEL = 'Hatched: fails a requirement here';

function failingProps(shade: RequirementShade | undefined) {
  return shade && shade.intervals.length > 0
    ? { failing: shade.intervals, failingLabel: FAILING_LABEL, failingSummary: shade.summary }
    : {};
}

/** Widest layout at which one column is kept: two plots need about 320 px each. */
export const TWO_COLUMN_MIN_WIDTH = 660;
const GAP = space.lg;

const INK = {
  dispersion: colors.primary,
  bandpass: colors.primary,
  power: colors.accent,
  efficiency: colors.ok,
  rotation: colors.primary,
};

function useSeries(evaluation: Evaluation): PerformanceSeries {
  return useMemo(() => performanceSeries(evaluation.points), [evaluation]);
}

type Ready = Omit<PlotProps, 'evaluation'> & { data: PerformanceSeries; shade?: RequirementShade };

/** What the delivered resolving power assumes, under its plot (and in the CLI help). */
export const RESOLVING_POWER_CAPTION =
  'R = λ / √(bandpass² + (λ/|m|N)²): slit bandpass and diffraction limit added in quadrature, as for near-Gaussian lines (common practice).';

/** The efficiency model by name, under its plot. */
export const EFFICIENCY_MODEL_CAPTION =
  'Scalar blaze function sinc²(π(|m| − λ_B cos K/λ)), the small-angle form of the groove-facet model (Schroeder & Hilliard 1980): an estimate for small blaze angles and λ/d below about 0.2 (Palmer & Loewen, Diffraction Grating Handbook, ch. 9).';

const Dispersion = memo(function Dispersion({ data, shade, ...rest }: Ready) {
  const series: PlotSeries = useMemo(
    () => ({
      label: 'Reciprocal dispersion',
      unit: 'nm/mm',
      values: data.reciprocalDispersionNmPerMm,
      color: INK.dispersion,
    }),
    [data],
  );
  return (
    <LinePlot
      {...rest}
      testID="plot-dispersion"
      {...failingProps(shade)}
      title="Reciprocal dispersion"
      wavelengthsNm={data.wavelengthsNm}
      series={series}
      emptyMessage="No wavelength in the range is reachable"
    />
  );
});

const Bandpass = memo(function Bandpass({ data, shade, ...rest }: Ready) {
  const [series, second] = useMemo(
    (): [PlotSeries, PlotSeries] => [
      {
        label: 'Bandpass',
        unit: 'nm',
        axisTitle: 'bandpass, nm',
        values: data.bandpassNm,
        color: INK.bandpass,
      },
      {
        label: 'R',
        unit: '',
        axisTitle: 'resolving power R',
        values: data.resolvingPower,
        color: INK.power,
        dash: '6 3',
        tickFormat: '~s',
        format: (v) => formatNumber(v === null ? null : Math.round(v), 3),
      },
    ],
    [data],
  );
  return (
    <LinePlot
      {...rest}
      testID="plot-bandpass"
      {...failingProps(shade)}
      title="Bandpass and resolving power"
      wavelengthsNm={data.wavelengthsNm}
      series={series}
      secondSeries={second}
      emptyMessage="No wavelength in the range is reachable"
      caption={RESOLVING_POWER_CAPTION}
    />
  );
});

const Efficiency = memo(function Efficiency({
  data,
  caution,
  shade,
  ...rest
}: Ready & { caution: ScalarBlazeCaution | null }) {
  const series: PlotSeries = useMemo(
    () => ({
      label: 'Efficiency',
      unit: '',
      axisTitle: 'relative to peak',
      values: data.blazeEfficiency,
      color: INK.efficiency,
      domain: [0, 1],
      tickFormat: '.0%',
      format: (v) => formatPercent(v),
    }),
    [data],
  );
  return (
    <LinePlot
      {...rest}
      testID="plot-efficiency"
      {...failingProps(shade)}
      title="Blaze efficiency"
      wavelengthsNm={data.wavelengthsNm}
      series={series}
      shaded={data.overlapIntervals}
      shadedLabel={OVERLAP_SHADE_LABEL}
      shadedSummary={overlapSummary(data.overlapIntervals, data.anyOverlap)}
      emptyMessage="Give a blaze wavelength to see the efficiency"
      caution={caution?.text ?? null}
      caption={EFFICIENCY_MODEL_CAPTION}
    />
  );
});

const Rotation = memo(function Rotation({ data, marks, ...rest }: Ready & { marks: readonly PlotMark[] }) {
  const series: PlotSeries = useMemo(
    () => ({
      label: 'Rotation',
      unit: '°',
      axisTitle: 'rotation φ, °',
      values: data.gratingRotationDeg,
      color: INK.rotation,
    }),
    [data],
  );
  return (
    <LinePlot
      {...rest}
      testID="plot-rotation"
      title="Grating rotation (scan curve)"
      wavelengthsNm={data.wavelengthsNm}
      series={series}
      {...(marks.length > 0 ? { marks, marksSummary: `order-sorting filters change: ${marksSummary(marks)}` } : {})}
      emptyMessage="No wavelength in the range is reachable"
    />
  );
});

/** The four performance plots against wavelength: one per row, or two columns when wide. */
export function PerformancePlots({ evaluation, width, columns, design = null, filters = null, ...rest }: PerformancePlotsProps) {
  const data = useSeries(evaluation);
  const shades = useMemo(() => requirementShading(ascending(evaluation.points), design), [evaluation, design]);
  const caution = useMemo(() => scalarBlazeCaution(evaluation), [evaluation]);
  const marks = useMemo(
    () => (filters && filters.length > 0 ? filterChangeMarks(evaluation.orderSorting.filterChangesNm, filters) : []),
    [evaluation, filters],
  );
  const cols = columns ?? (width >= TWO_COLUMN_MIN_WIDTH ? 2 : 1);
  const plotWidth = Math.floor(cols === 2 ? (width - GAP) / 2 : width);
  const shared = { ...rest, data, width: plotWidth };
  return (
    <View style={[styles.grid, { width }]} testID="performance-plots">
      <Dispersion {...shared} shade={shades?.dispersion} />
      <Bandpass {...shared} shade={shades?.bandpass} />
      <Efficiency {...shared} caution={caution} shade={shades?.efficiency} />
      <Rotation {...shared} marks={marks} />
    </View>
  );
}

function ascending(points: readonly WavelengthPoint[]): readonly WavelengthPoint[] {
  return [...points].sort((a, b) => a.wavelengthNm - b.wavelengthNm);
}

const styles = StyleSheet.create({
  grid: { flexDirection: 'row', flexWrap: 'wrap', columnGap: GAP, rowGap: space.xl },
});
