import { scaleLinear, type ScaleLinear } from 'd3-scale';
import { memo, useCallback, useMemo, useRef, useState } from 'react';
import { StyleSheet, View, type PointerEvent } from 'react-native';
import Svg, { G, Line, Path, Rect, Text as SvgText } from 'react-native-svg';
import { formatNumber } from '@/shared/format';
import { Text, colors, fonts, space } from '@/features/ui';
import {
  countRuns,
  linePath,
  nearestIndex,
  valueExtent,
  type Interval,
  type Values,
} from '../plot-paths';

export interface PlotSeries {
  /** Short name for the read-out and the axis ("Bandpass", "R"). */
  label: string;
  /** Unit for the read-out ("nm", "nm/mm", "°"); empty when dimensionless. */
  unit: string;
  /** Axis title, short enough to stand along the plot's height (default: the unit, else the label). */
  axisTitle?: string;
  values: Values;
  color: string;
  dash?: string;
  /** Tick label format (d3-format specifier), e.g. ".0%" or "~s". */
  tickFormat?: string;
  /** How a value reads in the read-out. */
  format?: (value: number | null) => string;
  /** Fixed axis domain instead of the data's nice extent. */
  domain?: [number, number];
}

export type LinePlotProps = {
  /** Root testID; parts get `${id}-line`, `${id}-line-2`, `${id}-shaded`, `${id}-selected`. */
  testID: string;
  title: string;
  width: number;
  height?: number;
  /** Ascending wavelengths (x), nm. */
  wavelengthsNm: readonly number[];
  series: PlotSeries;
  /** Drawn against a right-hand axis of its own. */
  secondSeries?: PlotSeries;
  shaded?: readonly Interval[];
  /** What the shading means, shown under the title when anything is shaded. */
  shadedLabel?: string;
  /** Shown in the plot area when the series has no values at all. */
  emptyMessage?: string;
  selectedNm?: number | null;
  /** Called with the nearest sample's wavelength on tap or drag (and on hover with `followHover`). */
  onSelectWavelength?: (wavelengthNm: number) => void;
  followHover?: boolean;
};

export const PLOT_HEIGHT = 200;
const MARGIN = { top: 10, bottom: 36, left: 54, right: 16, rightWithSecond: 58 };
const TICK_PX = 11;

type Frame = {
  x: ScaleLinear<number, number>;
  y: ScaleLinear<number, number>;
  y2: ScaleLinear<number, number> | null;
  left: number;
  right: number;
  top: number;
  bottom: number;
};

function axisFor(series: PlotSeries, top: number, bottom: number): ScaleLinear<number, number> {
  const extent = series.domain ?? valueExtent(series.values) ?? [0, 1];
  const scale = scaleLinear().domain(extent).range([bottom, top]);
  return series.domain ? scale : scale.nice(5);
}

/** A wavelength plot: axes, ticks, units, gaps where a value is missing, a selected-wavelength rule and a read-out. */
export function LinePlot(props: LinePlotProps) {
  const {
    testID,
    title,
    width,
    height = PLOT_HEIGHT,
    wavelengthsNm,
    series,
    secondSeries,
    selectedNm,
    onSelectWavelength,
    followHover = false,
  } = props;
  const frame: Frame = useMemo(() => {
    const left = MARGIN.left;
    const right = width - (secondSeries ? MARGIN.rightWithSecond : MARGIN.right);
    const top = MARGIN.top;
    const bottom = height - MARGIN.bottom;
    const first = wavelengthsNm[0] ?? 0;
    const last = wavelengthsNm[wavelengthsNm.length - 1] ?? first + 1;
    return {
      x: scaleLinear()
        .domain([first, last > first ? last : first + 1])
        .range([left, right]),
      y: axisFor(series, top, bottom),
      y2: secondSeries ? axisFor(secondSeries, top, bottom) : null,
      left,
      right,
      top,
      bottom,
    };
  }, [width, height, wavelengthsNm, series, secondSeries]);

  const [hoverIndex, setHoverIndex] = useState<number | null>(null);
  const pressed = useRef(false);
  const indexAt = useCallback(
    (event: PointerEvent) =>
      nearestIndex(wavelengthsNm, frame.x.invert(frame.left + event.nativeEvent.offsetX)),
    [wavelengthsNm, frame],
  );
  const select = (index: number) => {
    const nm = wavelengthsNm[index];
    if (nm !== undefined) onSelectWavelength?.(nm);
  };
  const onPointerMove = (event: PointerEvent) => {
    const index = indexAt(event);
    setHoverIndex(index);
    if (pressed.current || followHover) select(index);
  };
  const onPointerDown = (event: PointerEvent) => {
    pressed.current = true;
    const index = indexAt(event);
    setHoverIndex(index);
    select(index);
  };
  const release = () => {
    pressed.current = false;
  };
  const leave = () => {
    pressed.current = false;
    setHoverIndex(null);
  };

  const readoutIndex = hoverIndex ?? (selectedNm != null ? nearestIndex(wavelengthsNm, selectedNm) : -1);
  const readoutNm = readoutIndex >= 0 ? wavelengthsNm[readoutIndex] : undefined;
  const readout =
    readoutNm === undefined
      ? null
      : [
          `${formatNumber(readoutNm)} nm`,
          readValue(series, readoutIndex),
          secondSeries ? `${secondSeries.label} ${readValue(secondSeries, readoutIndex)}` : null,
        ]
          .filter(Boolean)
          .join(' · ');
  const inRange = (nm: number | null | undefined): nm is number =>
    nm != null && nm >= frame.x.domain()[0]! && nm <= frame.x.domain()[1]!;
  const hoverNm = hoverIndex !== null ? wavelengthsNm[hoverIndex] : undefined;

  return (
    <View style={[styles.root, { width }]} testID={testID}>
      <View style={styles.header}>
        <Text variant="small" weight="semibold">
          {title}
        </Text>
        <Text
          variant="caption"
          tone="muted"
          testID={`${testID}-readout`}
          numberOfLines={1}
          style={styles.readout}
        >
          {readout ?? ' '}
        </Text>
      </View>
      {props.shadedLabel && props.shaded && props.shaded.length > 0 ? (
        <View style={styles.keyRow}>
          <View style={styles.shadeSwatch} />
          <Text variant="caption" tone="muted">
            {props.shadedLabel}
          </Text>
        </View>
      ) : null}
      <View
        style={{ width, height }}
        role="img"
        aria-label={describePlot(title, wavelengthsNm, series, secondSeries)}
      >
        <Svg width={width} height={height}>
          <PlotBody
            testID={testID}
            wavelengthsNm={wavelengthsNm}
            series={series}
            secondSeries={secondSeries}
            shaded={props.shaded}
            emptyMessage={props.emptyMessage}
            frame={frame}
            height={height}
          />
          {inRange(selectedNm) ? (
            <Line
              x1={frame.x(selectedNm)}
              x2={frame.x(selectedNm)}
              y1={frame.top}
              y2={frame.bottom}
              stroke={colors.accent}
              strokeWidth={1.5}
              testID={`${testID}-selected`}
              data-nm={String(selectedNm)}
            />
          ) : null}
          {hoverNm !== undefined ? (
            <Line
              x1={frame.x(hoverNm)}
              x2={frame.x(hoverNm)}
              y1={frame.top}
              y2={frame.bottom}
              stroke={colors.inkFaint}
              strokeWidth={1}
              strokeDasharray="3 3"
            />
          ) : null}
        </Svg>
        <View
          style={[
            styles.overlay,
            {
              left: frame.left,
              top: frame.top,
              width: frame.right - frame.left,
              height: frame.bottom - frame.top,
            },
          ]}
          onPointerMove={onPointerMove}
          onPointerDown={onPointerDown}
          onPointerUp={release}
          onPointerLeave={leave}
          onPointerCancel={leave}
          testID={`${testID}-hit-area`}
          aria-label={`${title}: tap or drag to choose a wavelength`}
        />
      </View>
    </View>
  );
}

function describePlot(title: string, xs: readonly number[], series: PlotSeries, second?: PlotSeries): string {
  const span = (s: PlotSeries) => {
    const extent = valueExtent(s.values);
    return extent
      ? `${s.label} from ${formatNumber(extent[0], 3)} to ${formatNumber(extent[1], 3)}${s.unit ? ` ${s.unit}` : ''}`
      : `no ${s.label} values`;
  };
  const gaps = series.values.filter((v) => v === null).length;
  return [
    `${title} against wavelength, ${formatNumber(xs[0] ?? 0)} to ${formatNumber(xs[xs.length - 1] ?? 0)} nm`,
    span(series),
    second ? span(second) : null,
    gaps > 0 ? `${gaps} of ${xs.length} wavelengths without a value` : null,
  ]
    .filter(Boolean)
    .join('; ');
}

function readValue(series: PlotSeries, index: number): string {
  const value = series.values[index] ?? null;
  if (value === null) return 'unreachable';
  const text = series.format ? series.format(value) : formatNumber(value);
  return series.unit && !series.format ? `${text} ${series.unit}` : text;
}

type BodyProps = Pick<
  LinePlotProps,
  'testID' | 'wavelengthsNm' | 'series' | 'secondSeries' | 'shaded' | 'emptyMessage'
> & {
  frame: Frame;
  height: number;
};

/** Everything that depends on the data and size only, so hovering re-renders none of it. */
const PlotBody = memo(function PlotBody({
  testID,
  wavelengthsNm,
  series,
  secondSeries,
  shaded,
  emptyMessage,
  frame,
  height,
}: BodyProps) {
  const { x, y, y2, left, right, top, bottom } = frame;
  const parts = useMemo(() => {
    const xTicks = x.ticks(Math.max(2, Math.floor((right - left) / 70)));
    const xFormat = x.tickFormat(xTicks.length);
    const yTicks = y.ticks(5);
    const yFormat = y.tickFormat(5, series.tickFormat);
    const y2Ticks = y2 ? y2.ticks(5) : [];
    const y2Format = y2 ? y2.tickFormat(5, secondSeries?.tickFormat) : null;
    const grid = yTicks.map((t) => `M${left},${r(y(t))}H${right}`).join('');
    let tickMarks =
      xTicks.map((t) => `M${r(x(t))},${bottom}v4`).join('') +
      yTicks.map((t) => `M${left},${r(y(t))}h-4`).join('');
    if (y2) tickMarks += y2Ticks.map((t) => `M${right},${r(y2(t))}h4`).join('');
    const d = linePath(wavelengthsNm, series.values, x, y);
    const d2 = secondSeries && y2 ? linePath(wavelengthsNm, secondSeries.values, x, y2) : '';
    const shade = (shaded ?? [])
      .map((iv) => {
        const a = Math.max(left, x(iv.startNm));
        const b = Math.min(right, x(iv.endNm));
        return b > a ? `M${r(a)},${top}H${r(b)}V${bottom}H${r(a)}Z` : '';
      })
      .join('');
    return { xTicks, xFormat, yTicks, yFormat, y2Ticks, y2Format, grid, tickMarks, d, d2, shade };
  }, [x, y, y2, left, right, top, bottom, wavelengthsNm, series, secondSeries, shaded]);

  const yTitle = series.axisTitle ?? (series.unit || series.label);
  const y2Title = secondSeries ? (secondSeries.axisTitle ?? (secondSeries.unit || secondSeries.label)) : '';
  const midY = (top + bottom) / 2;
  return (
    <G>
      <Rect x={left} y={top} width={right - left} height={bottom - top} fill={colors.surface} />
      {parts.shade ? (
        <Path
          d={parts.shade}
          fill={colors.warningSoft}
          testID={`${testID}-shaded`}
          data-intervals={String(shaded?.length ?? 0)}
        />
      ) : null}
      <Path d={parts.grid} stroke={colors.line} strokeWidth={1} />
      <Path
        d={`M${left},${top}V${bottom}H${right}${secondSeries ? `V${top}` : ''}`}
        stroke={colors.inkMuted}
        strokeWidth={1}
        fill="none"
      />
      <Path d={parts.tickMarks} stroke={colors.inkMuted} strokeWidth={1} />
      {parts.d2 ? (
        <Path
          d={parts.d2}
          stroke={secondSeries?.color ?? colors.inkMuted}
          strokeWidth={1.6}
          strokeDasharray={secondSeries?.dash}
          fill="none"
          testID={`${testID}-line-2`}
          data-runs={String(countRuns(parts.d2))}
        />
      ) : null}
      <Path
        d={parts.d}
        stroke={series.color}
        strokeWidth={2}
        strokeDasharray={series.dash}
        strokeLinejoin="round"
        fill="none"
        testID={`${testID}-line`}
        data-runs={String(countRuns(parts.d))}
        data-points={String(wavelengthsNm.length)}
      />
      {parts.xTicks.map((t) => (
        <SvgText
          key={`x${t}`}
          x={x(t)}
          y={bottom + 15}
          fontSize={TICK_PX}
          fontFamily={fonts.mono}
          fill={colors.inkMuted}
          // A label at the right end would spill out of the drawing: end it at its tick instead.
          textAnchor={!secondSeries && x(t) > right - 18 ? 'end' : 'middle'}
        >
          {parts.xFormat(t)}
        </SvgText>
      ))}
      {parts.yTicks.map((t) => (
        <SvgText
          key={`y${t}`}
          x={left - 6}
          y={y(t) + 4}
          fontSize={TICK_PX}
          fontFamily={fonts.mono}
          fill={colors.inkMuted}
          textAnchor="end"
        >
          {parts.yFormat(t)}
        </SvgText>
      ))}
      {y2 && parts.y2Format
        ? parts.y2Ticks.map((t) => (
            <SvgText
              key={`r${t}`}
              x={right + 6}
              y={y2(t) + 4}
              fontSize={TICK_PX}
              fontFamily={fonts.mono}
              fill={secondSeries?.color ?? colors.inkMuted}
              textAnchor="start"
            >
              {parts.y2Format!(t)}
            </SvgText>
          ))
        : null}
      <SvgText
        x={(left + right) / 2}
        y={height - 4}
        fontSize={TICK_PX}
        fontFamily={fonts.regular}
        fill={colors.ink}
        textAnchor="middle"
      >
        Wavelength (nm)
      </SvgText>
      <SvgText
        x={12}
        y={midY}
        fontSize={TICK_PX}
        fontFamily={fonts.regular}
        fill={series.color}
        textAnchor="middle"
        transform={`rotate(-90 12 ${midY})`}
      >
        {yTitle}
      </SvgText>
      {secondSeries ? (
        <SvgText
          x={right + 46}
          y={midY}
          fontSize={TICK_PX}
          fontFamily={fonts.regular}
          fill={secondSeries.color}
          textAnchor="middle"
          transform={`rotate(90 ${right + 46} ${midY})`}
        >
          {y2Title}
        </SvgText>
      ) : null}
      {!parts.d && emptyMessage ? (
        <SvgText
          x={(left + right) / 2}
          y={midY}
          fontSize={12}
          fontFamily={fonts.regular}
          fill={colors.inkMuted}
          textAnchor="middle"
        >
          {emptyMessage}
        </SvgText>
      ) : null}
    </G>
  );
});

function r(value: number): number {
  return Math.round(value * 10) / 10;
}

const styles = StyleSheet.create({
  root: { gap: space.xxs },
  header: { paddingHorizontal: space.xs },
  readout: { fontFamily: fonts.mono },
  keyRow: { flexDirection: 'row', alignItems: 'center', gap: space.xs, paddingHorizontal: space.xs },
  shadeSwatch: {
    width: 14,
    height: 10,
    backgroundColor: colors.warningSoft,
    borderWidth: 1,
    borderColor: colors.line,
  },
  overlay: { position: 'absolute', cursor: 'pointer' },
});
