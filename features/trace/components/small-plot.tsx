import { scaleLinear } from 'd3-scale';
import { useMemo } from 'react';
import { View } from 'react-native';
import Svg, { G, Line, Path, Text as SvgText } from 'react-native-svg';
import { linePath, valueExtent, valueTicks } from '@/features/plots';
import { Text, colors, fonts, space } from '@/features/ui';

export type SmallSeries = { label: string; values: readonly number[]; color: string; dash?: string };

type Props = {
  testID: string;
  /** The plot in words for screen readers: what it shows and its key figures. */
  summary: string;
  width: number;
  height?: number;
  xs: readonly number[];
  xTitle: string;
  yTitle: string;
  series: readonly SmallSeries[];
  /** Fixed y domain (a line shape's 0…1); else the data's nice extent from zero. */
  yDomain?: [number, number];
};

const MARGIN = { top: 18, right: 10, bottom: 30, left: 40 };
const TICK_FONT = 10;

/** A small two-axis line plot with a key: the line shape and through-focus figures of the card. */
export function SmallPlot({ testID, summary, width, height = 150, xs, xTitle, yTitle, series, yDomain }: Props) {
  const drawn = useMemo(() => {
    const innerW = Math.max(40, width - MARGIN.left - MARGIN.right);
    const innerH = Math.max(40, height - MARGIN.top - MARGIN.bottom);
    const xExtent = valueExtent(xs) ?? [0, 1];
    const x = scaleLinear().domain(xExtent).range([MARGIN.left, MARGIN.left + innerW]).nice(4);
    const ys = series.flatMap((s) => s.values);
    const yExtent = valueExtent(ys) ?? [0, 1];
    const y = scaleLinear()
      .domain(yDomain ?? [Math.min(0, yExtent[0]), yExtent[1] > 0 ? yExtent[1] : 1])
      .range([MARGIN.top + innerH, MARGIN.top])
      .nice(4);
    return {
      x,
      y,
      xTicks: valueTicks(x),
      yTicks: valueTicks(y),
      paths: series.map((s) => linePath(xs, s.values, x, y)),
      bottom: MARGIN.top + innerH,
    };
  }, [width, height, xs, series, yDomain]);
  const { x, y, xTicks, yTicks, paths, bottom } = drawn;
  return (
    <View style={{ gap: space.xs }}>
      <View role="img" aria-label={summary} testID={testID}>
        <Svg width={width} height={height}>
          <G>
            <Line x1={MARGIN.left} x2={width - MARGIN.right} y1={bottom} y2={bottom} stroke={colors.line} />
            <Line x1={MARGIN.left} x2={MARGIN.left} y1={MARGIN.top} y2={bottom} stroke={colors.line} />
            {xTicks.values.map((v, i) => (
              <SvgText key={`x${v}`} x={x(v)} y={bottom + 12} fontSize={TICK_FONT} fontFamily={fonts.mono} fill={colors.inkMuted} textAnchor="middle">
                {xTicks.labels[i]}
              </SvgText>
            ))}
            {yTicks.values.map((v, i) => (
              <SvgText key={`y${v}`} x={MARGIN.left - 4} y={y(v) + 3} fontSize={TICK_FONT} fontFamily={fonts.mono} fill={colors.inkMuted} textAnchor="end">
                {yTicks.labels[i]}
              </SvgText>
            ))}
            <SvgText x={MARGIN.left + (width - MARGIN.left - MARGIN.right) / 2} y={height - 4} fontSize={TICK_FONT + 1} fontFamily={fonts.regular} fill={colors.inkMuted} textAnchor="middle">
              {xTitle}
            </SvgText>
            <SvgText x={MARGIN.left} y={10} fontSize={TICK_FONT + 1} fontFamily={fonts.regular} fill={colors.inkMuted} textAnchor="start">
              {yTitle}
            </SvgText>
            {paths.map((d, i) => {
              const s = series[i] as SmallSeries;
              return <Path key={s.label} d={d} fill="none" stroke={s.color} strokeWidth={2} strokeDasharray={s.dash} testID={`${testID}-line-${i}`} />;
            })}
          </G>
        </Svg>
      </View>
      {series.length > 1 ? (
        <View style={{ flexDirection: 'row', flexWrap: 'wrap', gap: space.md }} aria-hidden>
          {series.map((s) => (
            <View key={s.label} style={{ flexDirection: 'row', alignItems: 'center', gap: space.xs }}>
              <Svg width={22} height={8}>
                <Line x1={0} x2={22} y1={4} y2={4} stroke={s.color} strokeWidth={2} strokeDasharray={s.dash} />
              </Svg>
              <Text variant="caption" tone="muted">
                {s.label}
              </Text>
            </View>
          ))}
        </View>
      ) : null}
    </View>
  );
}
