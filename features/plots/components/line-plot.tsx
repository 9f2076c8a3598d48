import { scaleLinear, type ScaleLinear } from 'd3-scale';
import { memo, useCallback, useMemo, useRef, useState } from 'react';
import { StyleSheet, View, type PointerEvent } from 'react-native';
import Svg, { G, Line, Path, Rect, Text as SvgText } from 'react-native-svg';
import { formatNumber, formatQuantity, keepTogether, withUnit } from '@/shared/format';
import { Text, colors, fonts, space } from '@/features/ui';
import {
  axisMarginPx,
  axisTitleOf,
  MIN_SIDE_PX,
  sharesAxis,
  TICK_GAP_PX,
  TICK_PX,
  TITLE_BAND_PX,
  valueScale,
  valueTicks,
  type AxisSeries,
} from '../axes';
import {
  countRuns,
  hatchPath,
  linePath,
  nearestIndex,
  valueExtent,
  type Interval,
  type Values,
} from '../plot-paths';
import type { PlotMark } from '../filter-marks';

export interface PlotSeries extends AxisSeries {
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
  /**
   * A second line: against the same axis when it measures the same thing (same unit and axis
   * title, or `axis: 'shared'`), else against a right-hand axis of its own.
   */
  secondSeries?: PlotSeries;
  /** Small print under the plot: what the figure assumes. */
  caption?: string;
  /** Where the figure stops holding, shown above the caption in the warning colour. */
  caution?: string | null;
  shaded?: readonly Interval[];
  /** What the shading means, shown under the title when anything is shaded. */
  shadedLabel?: string;
  /** Where the shading is, in words, read out with the plot (it may also say that nothing is shaded). */
  shadedSummary?: string;
  /** Labelled vertical lines at settings where something changes (filters going in), dashed and named, never colour alone. */
  marks?: readonly PlotMark[];
  /** The marks in words, read out with the plot. */
  marksSummary?: string;
  /** Where the design fails a requirement this plot draws: hatched and outlined, so print and grey show it. */
  failing?: readonly Interval[];
  /** The key's words for the hatching. */
  failingLabel?: string;
  /** Where and what fails, read out with the plot ("bandpass over 0.5 nm between 820 and 900 nm"). */
  failingSummary?: string;
  /** Shown in the plot area when the series has no values at all. */
  emptyMessage?: string;
  selectedNm?: number | null;
  /** Called with the nearest sample's wavelength on tap or drag (and on hover with `followHover`). */
  onSelectWavelength?: (wavelengthNm: number) => void;
  followHover?: boolean;
};

export const PLOT_HEIGHT = 200;
const MARGIN = { top: 10, bottom: 36 };

type Ticks = { values: number[]; labels: string[] };

type Frame = {
  x: ScaleLinear<number, number>;
  y: ScaleLinear<number, number>;
  yTicks: Ticks;
  /** The second series' own axis; null without a second series or when it shares `y`. */
  y2: ScaleLinear<number, number> | null;
  y2Ticks: Ticks | null;
  left: number;
  right: number;
  top: number;
  bottom: number;
};

/**
 * Scales first, then margins: the value ticks depend only on the data and the plot's height, so
 * their formatted labels set how much room each value axis takes before x is laid out.
 */
function layoutFrame(
  width: number,
  height: number,
  wavelengthsNm: readonly number[],
  series: PlotSeries,
  secondSeries: PlotSeries | undefined,
): Frame {
  const top = MARGIN.top;
  const bottom = height - MARGIN.bottom;
  const shared = secondSeries !== undefined && sharesAxis(series, secondSeries);
  const y = valueScale(shared ? [series, secondSeries] : [series], top, bottom);
  const yTicks = valueTicks(y, series.tickFormat);
  const y2 = secondSeries && !shared ? valueScale([secondSeries], top, bottom) : null;
  const y2Ticks = y2 ? valueTicks(y2, secondSeries?.tickFormat) : null;
  const left = axisMarginPx(yTicks.labels);
  const right = width - (y2Ticks ? axisMarginPx(y2Ticks.labels) : MIN_SIDE_PX);
  const first = wavelengthsNm[0] ?? 0;
  const last = wavelengthsNm[wavelengthsNm.length - 1] ?? first + 1;
  return {
    x: scaleLinear()
      .domain([first, last > first ? last : first + 1])
      .range([left, right]),
    y,
    yTicks,
    y2,
    y2Ticks,
    left,
    right,
    top,
    bottom,
  };
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
  const frame: Frame = useMemo(
    () => layoutFrame(width, height, wavelengthsNm, series, secondSeries),
    [width, height, wavelengthsNm, series, secondSeries],
  );

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
  // Two lines on one axis are two of the same figure: name both, not only the second.
  const nameFirst = secondSeries !== undefined && frame.y2 === null;
  const readout =
    readoutNm === undefined
      ? null
      : [
          formatQuantity(readoutNm, 'nm'),
          nameFirst ? `${series.label} ${readValue(series, readoutIndex)}` : readValue(series, readoutIndex),
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
      {props.failing && props.failing.length > 0 ? (
        <View style={styles.keyRow} testID={`${testID}-failing-key`}>
          <View style={styles.failSwatch} />
          <Text variant="caption" tone="muted">
            {props.failingLabel ?? 'Fails a requirement here'}
          </Text>
        </View>
      ) : null}
      <View
        style={{ width, height }}
        role="img"
        aria-label={
          describePlot(title, wavelengthsNm, series, secondSeries) +
          (props.shadedSummary ? `; ${props.shadedSummary}` : '') +
          (props.marksSummary ? `; ${props.marksSummary}` : '') +
          (props.failingSummary ? `; fails its requirements: ${props.failingSummary}` : '')
        }
      >
        <Svg width={width} height={height}>
          <PlotBody
            testID={testID}
            wavelengthsNm={wavelengthsNm}
            series={series}
            secondSeries={secondSeries}
            shaded={props.shaded}
            failing={props.failing}
            marks={props.marks}
            emptyMessage={props.emptyMessage}
            frame={frame}
            width={width}
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
        />
      </View>
      {props.caution ? (
        <Text variant="caption" tone="warning" weight="semibold" style={styles.caption} testID={`${testID}-caution`}>
          {props.caution}
        </Text>
      ) : null}
      {props.caption ? (
        <Text variant="caption" tone="muted" style={styles.caption} testID={`${testID}-caption`}>
          {props.caption}
        </Text>
      ) : null}
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
  return series.unit && !series.format ? withUnit(text, series.unit) : keepTogether(text);
}

type BodyProps = Pick<
  LinePlotProps,
  'testID' | 'wavelengthsNm' | 'series' | 'secondSeries' | 'shaded' | 'failing' | 'marks' | 'emptyMessage'
> & {
  frame: Frame;
  width: number;
  height: number;
};

/** Everything that depends on the data and size only, so hovering re-renders none of it. */
const PlotBody = memo(function PlotBody({
  testID,
  wavelengthsNm,
  series,
  secondSeries,
  shaded,
  failing,
  marks,
  emptyMessage,
  frame,
  width,
  height,
}: BodyProps) {
  const { x, y, y2, yTicks, y2Ticks, left, right, top, bottom } = frame;
  const parts = useMemo(() => {
    const xTicks = x.ticks(Math.max(2, Math.floor((right - left) / 70)));
    const xFormat = x.tickFormat(xTicks.length);
    const grid = yTicks.values.map((t) => `M${left},${r(y(t))}H${right}`).join('');
    let tickMarks =
      xTicks.map((t) => `M${r(x(t))},${bottom}v4`).join('') +
      yTicks.values.map((t) => `M${left},${r(y(t))}h-4`).join('');
    if (y2 && y2Ticks) tickMarks += y2Ticks.values.map((t) => `M${right},${r(y2(t))}h4`).join('');
    const d = linePath(wavelengthsNm, series.values, x, y);
    const d2 = secondSeries ? linePath(wavelengthsNm, secondSeries.values, x, y2 ?? y) : '';
    const shade = (shaded ?? [])
      .map((iv) => {
        const a = Math.max(left, x(iv.startNm));
        const b = Math.min(right, x(iv.endNm));
        return b > a ? `M${r(a)},${top}H${r(b)}V${bottom}H${r(a)}Z` : '';
      })
      .join('');
    let fail = '';
    let failOutline = '';
    for (const iv of failing ?? []) {
      const a = Math.max(left, x(iv.startNm));
      const b = Math.min(right, x(iv.endNm));
      if (!(b > a)) continue;
      fail += hatchPath(a, b, top, bottom);
      failOutline += `M${r(a)},${top}H${r(b)}V${bottom}H${r(a)}Z`;
    }
    return { xTicks, xFormat, grid, tickMarks, d, d2, shade, fail, failOutline };
  }, [x, y, y2, yTicks, y2Ticks, left, right, top, bottom, wavelengthsNm, series, secondSeries, shaded, failing]);

  const yTitle = axisTitleOf(series);
  const y2Title = secondSeries ? axisTitleOf(secondSeries) : '';
  // One axis for two lines: its title belongs to both, so it takes neither line's colour.
  const yTitleColor = secondSeries && !y2 ? colors.ink : series.color;
  const midY = (top + bottom) / 2;
  const titleX = TITLE_BAND_PX / 2;
  const rightTitleX = width - TITLE_BAND_PX / 2;
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
      {parts.failOutline ? (
        <G testID={`${testID}-failing`} data-intervals={String(failing?.length ?? 0)}>
          <Path d={parts.failOutline} fill={colors.dangerSoft} />
          <Path d={parts.fail} stroke={colors.danger} strokeOpacity={0.45} strokeWidth={1} fill="none" />
          <Path d={parts.failOutline} stroke={colors.danger} strokeWidth={1} strokeDasharray="4 3" fill="none" />
        </G>
      ) : null}
      <Path d={parts.grid} stroke={colors.line} strokeWidth={1} />
      <Path
        d={`M${left},${top}V${bottom}H${right}${y2 ? `V${top}` : ''}`}
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
          textAnchor={!y2 && x(t) > right - 18 ? 'end' : 'middle'}
        >
          {parts.xFormat(t)}
        </SvgText>
      ))}
      {yTicks.values.map((t, i) => (
        <SvgText
          key={`y${t}`}
          x={left - TICK_GAP_PX}
          y={y(t) + 4}
          fontSize={TICK_PX}
          fontFamily={fonts.mono}
          fill={colors.inkMuted}
          textAnchor="end"
        >
          {yTicks.labels[i]}
        </SvgText>
      ))}
      {y2 && y2Ticks
        ? y2Ticks.values.map((t, i) => (
            <SvgText
              key={`r${t}`}
              x={right + TICK_GAP_PX}
              y={y2(t) + 4}
              fontSize={TICK_PX}
              fontFamily={fonts.mono}
              fill={secondSeries?.color ?? colors.inkMuted}
              textAnchor="start"
            >
              {y2Ticks.labels[i]}
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
        x={titleX}
        y={midY}
        fontSize={TICK_PX}
        fontFamily={fonts.regular}
        fill={yTitleColor}
        textAnchor="middle"
        transform={`rotate(-90 ${titleX} ${midY})`}
        testID={`${testID}-axis-title`}
      >
        {yTitle}
      </SvgText>
      {secondSeries && y2 ? (
        <SvgText
          x={rightTitleX}
          y={midY}
          fontSize={TICK_PX}
          fontFamily={fonts.regular}
          fill={secondSeries.color}
          textAnchor="middle"
          transform={`rotate(90 ${rightTitleX} ${midY})`}
          testID={`${testID}-axis-title-2`}
        >
          {y2Title}
        </SvgText>
      ) : null}
      {marks && marks.length > 0 ? (
        <G testID={`${testID}-marks`} data-marks={String(marks.length)}>
          {marks.map((mark, i) => {
            const at = x(mark.nm);
            if (!(at >= left && at <= right)) return null;
            // Near the right edge a label ends at its line; neighbours alternate rows so they do not collide.
            const flip = at > right - 70;
            return (
              <G key={`${mark.nm}-${i}`}>
                <Line
                  x1={at}
                  x2={at}
                  y1={top}
                  y2={bottom}
                  stroke={colors.ink}
                  strokeWidth={1}
                  strokeDasharray="2 2"
                  testID={`${testID}-mark`}
                  data-nm={String(mark.nm)}
                />
                <SvgText
                  x={flip ? at - 3 : at + 3}
                  y={top + 10 + (i % 2) * 12}
                  fontSize={TICK_PX}
                  fontFamily={fonts.regular}
                  fill={colors.ink}
                  textAnchor={flip ? 'end' : 'start'}
                >
                  {mark.label}
                </SvgText>
              </G>
            );
          })}
        </G>
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
  failSwatch: {
    width: 14,
    height: 10,
    backgroundColor: colors.dangerSoft,
    borderWidth: 1,
    borderStyle: 'dashed',
    borderColor: colors.danger,
  },
  overlay: { position: 'absolute', cursor: 'pointer' },
  caption: { paddingHorizontal: space.xs },
});
