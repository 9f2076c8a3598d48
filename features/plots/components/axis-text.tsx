import { Text as SvgText } from 'react-native-svg';
import { colors, fonts } from '@/features/ui';
import { TICK_GAP_PX, TICK_PX, TITLE_BAND_PX } from '../axes';

export type AxisTextProps = {
  /** The plot box's edges and the whole drawing's height, px. */
  left: number;
  right: number;
  top: number;
  bottom: number;
  height: number;
  /** Tick values along x, where each sits, and its label. */
  xTicks: readonly number[];
  x: (value: number) => number;
  xLabel: (value: number) => string;
  /** Tick values up the value axis, where each sits, and their labels (same order). */
  yTicks: readonly number[];
  y: (value: number) => number;
  yLabels: readonly string[];
  xTitle: string;
  yTitle: string;
};

/**
 * The tick labels and the two axis titles of an x–y plot, in the performance plots' type and
 * colours: the calculators' plots and the trade study's draw their axes with it.
 */
export function AxisText({ left, right, top, bottom, height, xTicks, x, xLabel, yTicks, y, yLabels, xTitle, yTitle }: AxisTextProps) {
  const midY = (top + bottom) / 2;
  const titleX = TITLE_BAND_PX / 2;
  return (
    <>
      {xTicks.map((t) => (
        <SvgText
          key={`x${t}`}
          x={x(t)}
          y={bottom + 15}
          fontSize={TICK_PX}
          fontFamily={fonts.mono}
          fill={colors.inkMuted}
          textAnchor={x(t) > right - 18 ? 'end' : 'middle'}
        >
          {xLabel(t)}
        </SvgText>
      ))}
      {yTicks.map((t, i) => (
        <SvgText
          key={`y${t}`}
          x={left - TICK_GAP_PX}
          y={y(t) + 4}
          fontSize={TICK_PX}
          fontFamily={fonts.mono}
          fill={colors.inkMuted}
          textAnchor="end"
        >
          {yLabels[i]}
        </SvgText>
      ))}
      <SvgText x={(left + right) / 2} y={height - 4} fontSize={TICK_PX} fontFamily={fonts.regular} fill={colors.ink} textAnchor="middle">
        {xTitle}
      </SvgText>
      <SvgText
        x={titleX}
        y={midY}
        fontSize={TICK_PX}
        fontFamily={fonts.regular}
        fill={colors.ink}
        textAnchor="middle"
        transform={`rotate(-90 ${titleX} ${midY})`}
      >
        {yTitle}
      </SvgText>
    </>
  );
}
