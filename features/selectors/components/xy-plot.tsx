import { scaleLinear } from 'd3-scale';
import { memo, useMemo } from 'react';
import { StyleSheet, View } from 'react-native';
import Svg, { G, Line, Path, Rect } from 'react-native-svg';
import {
  AxisText,
  MIN_SIDE_PX,
  PLOT_HEIGHT,
  axisMarginPx,
  linePath,
  valueScale,
  valueTicks,
} from '@/features/plots';
import { Text, colors, space } from '@/features/ui';
import { describeXyPlot, type XySeries } from '../xy-plot-summary';

export type XyPlotProps = {
  testID: string;
  title: string;
  width: number;
  height?: number;
  /** Ascending x values shared by every series. */
  xs: readonly number[];
  /** "wavelength" or "tilt": read out in the plot's accessible summary. */
  xName: string;
  /** Shown along the x axis with `xUnit`: "Wavelength (nm)". */
  xTitle: string;
  xUnit: string;
  /** Lines on one value axis; the first is drawn on top. */
  series: readonly XySeries[];
  yTitle: string;
  yTickFormat?: string;
  yDomain?: [number, number];
  /** Vertical rules at these x values (the peaks of a filter, the target). */
  markers?: readonly { x: number; color: string }[];
  /** Added to the accessible summary ("peaks at 366.7 and 550 nm"). */
  summaryExtra?: string | null;
  caption?: string | null;
};

const MARGIN = { top: 10, bottom: 36 };
const r = (value: number) => Math.round(value * 10) / 10;

/**
 * A calculator's line plot: any x axis (wavelength, tilt), several lines on one value axis with
 * a key, vertical markers, and an accessible summary of every line. Built from the workbench
 * plots' pieces (features/plots: value scale, tick labels, axis margins, gapped line paths).
 */
export const XyPlot = memo(function XyPlot(props: XyPlotProps) {
  const { testID, title, width, height = PLOT_HEIGHT, xs, series, markers = [] } = props;
  const frame = useMemo(() => {
    const top = MARGIN.top;
    const bottom = height - MARGIN.bottom;
    const axis = series.map((s, i) => ({ ...s, domain: i === 0 ? props.yDomain : undefined }));
    const y = valueScale(axis, top, bottom);
    const yTicks = valueTicks(y, props.yTickFormat);
    const left = axisMarginPx(yTicks.labels);
    const right = width - MIN_SIDE_PX;
    const first = xs[0] ?? 0;
    const last = xs[xs.length - 1] ?? first + 1;
    const x = scaleLinear()
      .domain([first, last > first ? last : first + 1])
      .range([left, right]);
    const xTicks = x.ticks(Math.max(2, Math.floor((right - left) / 70)));
    const xFormat = x.tickFormat(xTicks.length);
    const paths = series.map((s) => linePath(xs, s.values, x, y));
    const grid = yTicks.values.map((t) => `M${left},${r(y(t))}H${right}`).join('');
    const tickMarks =
      xTicks.map((t) => `M${r(x(t))},${bottom}v4`).join('') + yTicks.values.map((t) => `M${left},${r(y(t))}h-4`).join('');
    return { x, y, yTicks, xTicks, xFormat, paths, grid, tickMarks, left, right, top, bottom };
  }, [height, width, xs, series, props.yDomain, props.yTickFormat]);
  const summary = useMemo(
    () => describeXyPlot(title, props.xName, props.xUnit, xs, series, props.summaryExtra),
    [title, props.xName, props.xUnit, xs, series, props.summaryExtra],
  );
  const { x, y, left, right, top, bottom } = frame;
  return (
    <View style={[styles.root, { width }]} testID={testID}>
      <Text variant="small" weight="semibold" style={styles.header}>
        {title}
      </Text>
      {series.length > 1 ? (
        <View style={styles.key}>
          {series.map((s) => (
            <View key={s.label} style={styles.keyItem}>
              <View style={[styles.swatch, { borderTopColor: s.color, borderStyle: s.dash ? 'dashed' : 'solid' }]} />
              <Text variant="caption" tone="muted">
                {s.label}
              </Text>
            </View>
          ))}
        </View>
      ) : null}
      <View style={{ width, height }} role="img" aria-label={summary} testID={`${testID}-figure`}>
        <Svg width={width} height={height}>
          <G>
            <Rect x={left} y={top} width={right - left} height={bottom - top} fill={colors.surface} />
            <Path d={frame.grid} stroke={colors.line} strokeWidth={1} />
            <Path d={`M${left},${top}V${bottom}H${right}`} stroke={colors.inkMuted} strokeWidth={1} fill="none" />
            <Path d={frame.tickMarks} stroke={colors.inkMuted} strokeWidth={1} />
            {markers
              .filter((m) => m.x >= x.domain()[0]! && m.x <= x.domain()[1]!)
              .map((m, i) => (
                <Line
                  key={`m${i}`}
                  x1={r(x(m.x))}
                  x2={r(x(m.x))}
                  y1={top}
                  y2={bottom}
                  stroke={m.color}
                  strokeWidth={1}
                  strokeDasharray="3 3"
                />
              ))}
            {[...series.keys()].reverse().map((i) => (
              <Path
                key={series[i]!.label}
                d={frame.paths[i]!}
                stroke={series[i]!.color}
                strokeWidth={i === 0 ? 2.2 : 1.5}
                strokeDasharray={series[i]!.dash}
                strokeLinejoin="round"
                fill="none"
                testID={i === 0 ? `${testID}-line` : `${testID}-line-${i + 1}`}
                data-points={String(xs.length)}
              />
            ))}
            <AxisText
              left={left}
              right={right}
              top={top}
              bottom={bottom}
              height={height}
              xTicks={frame.xTicks}
              x={x}
              xLabel={frame.xFormat}
              yTicks={frame.yTicks.values}
              y={y}
              yLabels={frame.yTicks.labels}
              xTitle={props.xTitle}
              yTitle={props.yTitle}
            />
          </G>
        </Svg>
      </View>
      {props.caption ? (
        <Text variant="caption" tone="muted" style={styles.header} testID={`${testID}-caption`}>
          {props.caption}
        </Text>
      ) : null}
    </View>
  );
});

const styles = StyleSheet.create({
  root: { gap: space.xxs },
  header: { paddingHorizontal: space.xs },
  key: { flexDirection: 'row', flexWrap: 'wrap', gap: space.md, paddingHorizontal: space.xs },
  keyItem: { flexDirection: 'row', alignItems: 'center', gap: space.xs },
  swatch: { width: 18, height: 0, borderTopWidth: 2 },
});
