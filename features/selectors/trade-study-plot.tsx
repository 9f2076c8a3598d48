import { scaleLinear } from 'd3-scale';
import { memo, useMemo } from 'react';
import { StyleSheet, View } from 'react-native';
import Svg, { G, Path } from 'react-native-svg';
import { AxisText, MIN_SIDE_PX, axisMarginPx, linePath, valueExtent } from '@/features/plots';
import type { SelectorStudy, TradeSelectorId } from '@/features/solver';
import { Text, colors, space } from '@/features/ui';
import { formatNumber, withUnit } from '@/shared/format';
import { SELECTOR_LOOKS, decadeDomain, decadeTicks, log10Values, markerIndices, markerPath } from './trade-study-series';

/** Each selector's ink; the dash and marker (SELECTOR_LOOKS) tell them apart without it. */
export const SELECTOR_INK: Readonly<Record<TradeSelectorId, string>> = {
  grating: colors.primary,
  prism: colors.accent,
  'interference-filter': colors.ok,
  'coloured-glass': colors.inkMuted,
};

const HEIGHT = 220;
const MARGIN = { top: 10, bottom: 36 };
const MARKERS = 6;

type Props = {
  testID: string;
  title: string;
  /** The figure's name in the summary: "resolving power", "bandpass". */
  noun: string;
  unit: string;
  axisTitle: string;
  width: number;
  wavelengthsNm: readonly number[];
  selectors: readonly SelectorStudy[];
  pick: (s: SelectorStudy) => readonly (number | null)[];
  caption?: string;
};

/** "Prism (long dashes, squares) from 61.2 to 216 nm". */
function seriesWords(s: SelectorStudy, values: readonly (number | null)[], unit: string): string {
  const extent = valueExtent(values);
  const name = `${s.label} (${SELECTOR_LOOKS[s.id].words})`;
  if (extent === null) return `${name}: no values`;
  const [lo, hi] = extent.map((v) => formatNumber(v, 3));
  const text = lo === hi ? `${lo} throughout` : `from ${lo} to ${hi}`;
  return `${name} ${unit ? withUnit(text, unit) : text}`;
}

/**
 * One line per selector against wavelength on a decade axis, with a key in words. The summary read
 * out with the drawing names every selector, its line and marker, and its span.
 */
export const TradeStudyPlot = memo(function TradeStudyPlot({
  testID,
  title,
  noun,
  unit,
  axisTitle,
  width,
  wavelengthsNm,
  selectors,
  pick,
  caption,
}: Props) {
  const drawn = useMemo(() => {
    const logs = selectors.map((s) => log10Values(pick(s)));
    const domain = decadeDomain(logs);
    const ticks = decadeTicks(domain);
    const left = axisMarginPx(ticks.labels);
    const right = width - MIN_SIDE_PX;
    const top = MARGIN.top;
    const bottom = HEIGHT - MARGIN.bottom;
    const first = wavelengthsNm[0] ?? 0;
    const last = wavelengthsNm[wavelengthsNm.length - 1] ?? first + 1;
    const x = scaleLinear().domain([first, last > first ? last : first + 1]).range([left, right]);
    const y = scaleLinear().domain(domain).range([bottom, top]);
    const lines = selectors.map((s, i) => {
      const values = logs[i]!;
      const look = SELECTOR_LOOKS[s.id];
      // Markers staggered per series so coincident lines (a flat filter curve on the prism's) still show each shape.
      const markers = markerIndices(values, MARKERS, i / selectors.length)
        .map((k) => markerPath(look.marker, x(wavelengthsNm[k]!), y(values[k]!)))
        .join('');
      return { id: s.id, d: linePath(wavelengthsNm, values, x, y), markers, look };
    });
    const xTicks = x.ticks(Math.max(2, Math.floor((right - left) / 70)));
    return { lines, ticks, left, right, top, bottom, x, y, xTicks, xFormat: x.tickFormat(xTicks.length) };
  }, [selectors, pick, width, wavelengthsNm]);
  const summary = useMemo(() => {
    const first = wavelengthsNm[0] ?? 0;
    const last = wavelengthsNm[wavelengthsNm.length - 1] ?? 0;
    return (
      `${title} against wavelength, ${formatNumber(first)} to ${withUnit(formatNumber(last), 'nm')}, on a logarithmic scale. ` +
      selectors.map((s) => seriesWords(s, pick(s), unit)).join('; ') +
      '.'
    );
  }, [title, selectors, pick, unit, wavelengthsNm]);

  const { lines, ticks, left, right, top, bottom, x, y, xTicks, xFormat } = drawn;
  return (
    <View style={[styles.root, { width }]} testID={testID}>
      <Text variant="small" weight="semibold">
        {title}
      </Text>
      <View role="list" aria-label={`Key to the ${noun} plot`} style={styles.key}>
        {selectors.map((s) => {
          const look = SELECTOR_LOOKS[s.id];
          return (
            <View key={s.id} role="listitem" style={styles.keyItem} testID={`${testID}-key-${s.id}`}>
              <Svg width={34} height={12} aria-hidden>
                <Path d="M1,6H33" stroke={SELECTOR_INK[s.id]} strokeWidth={2} strokeDasharray={look.dash} />
                <Path d={markerPath(look.marker, 17, 6, 7)} fill={colors.surface} stroke={SELECTOR_INK[s.id]} strokeWidth={1.5} />
              </Svg>
              <Text variant="caption">
                {s.label} <Text variant="caption" tone="muted">({look.words})</Text>
              </Text>
            </View>
          );
        })}
      </View>
      <View role="img" aria-label={summary} style={{ width, height: HEIGHT }} testID={`${testID}-drawing`}>
        <Svg width={width} height={HEIGHT}>
          <G>
            <Path d={`M${left},${top}H${right}V${bottom}H${left}Z`} fill={colors.surface} />
            <Path d={ticks.values.map((k) => `M${left},${Math.round(y(k) * 10) / 10}H${right}`).join('')} stroke={colors.line} strokeWidth={1} />
            <Path d={`M${left},${top}V${bottom}H${right}`} stroke={colors.inkMuted} strokeWidth={1} fill="none" />
            <Path
              d={
                xTicks.map((t) => `M${Math.round(x(t) * 10) / 10},${bottom}v4`).join('') +
                ticks.values.map((k) => `M${left},${Math.round(y(k) * 10) / 10}h-4`).join('')
              }
              stroke={colors.inkMuted}
              strokeWidth={1}
            />
            {lines.map((line) => (
              <G key={line.id}>
                <Path
                  d={line.d}
                  stroke={SELECTOR_INK[line.id]}
                  strokeWidth={2}
                  strokeDasharray={line.look.dash}
                  strokeLinejoin="round"
                  fill="none"
                  testID={`${testID}-series-${line.id}`}
                />
                <Path d={line.markers} fill={colors.surface} stroke={SELECTOR_INK[line.id]} strokeWidth={1.5} />
              </G>
            ))}
            <AxisText
              left={left}
              right={right}
              top={top}
              bottom={bottom}
              height={HEIGHT}
              xTicks={xTicks}
              x={x}
              xLabel={xFormat}
              yTicks={ticks.values}
              y={y}
              yLabels={ticks.labels}
              xTitle="Wavelength (nm)"
              yTitle={axisTitle}
            />
          </G>
        </Svg>
      </View>
      {caption ? (
        <Text variant="caption" tone="muted" testID={`${testID}-caption`}>
          {caption}
        </Text>
      ) : null}
    </View>
  );
});

const styles = StyleSheet.create({
  root: { gap: space.xs },
  key: { flexDirection: 'row', flexWrap: 'wrap', columnGap: space.md, rowGap: space.xxs },
  keyItem: { flexDirection: 'row', alignItems: 'center', gap: space.xs },
});
