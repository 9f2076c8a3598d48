import { scaleLinear } from 'd3-scale';
import { memo, useMemo } from 'react';
import { StyleSheet, View } from 'react-native';
import Svg, { G, Path, Rect, Text as SvgText } from 'react-native-svg';
import { Text, colors, fonts, space } from '@/features/ui';
import { formatInteger, formatNumber } from '@/shared/format';
import { lineSource } from '../calibration-words';
import { offDetectorSentence, placeStripLabels, stripSummary, type DetectorStrip } from '../detector-strip';

const LABEL_PX = 11;
/** Inter at 11 px: about 0.62 em a character for element symbols and short names (measured by eye on the screenshots). */
const CHAR_PX = LABEL_PX * 0.62;
const LABEL_ROWS = 3;
/** Room between labels in a row: at 3 px two neighbours read as one word ("Ne Ne"). */
const LABEL_GAP_PX = 6;
const ROW_PX = 14;
const BAR_TOP = LABEL_ROWS * ROW_PX + 6;
const BAR_PX = 18;
const HEIGHT = BAR_TOP + BAR_PX + 20;
/** A user list's name is cut to this on the strip; the table gives it whole. */
const MAX_LABEL_CHARS = 8;

const shortLabel = (text: string) => (text.length > MAX_LABEL_CHARS ? `${text.slice(0, MAX_LABEL_CHARS - 1)}…` : text);

type Props = { strip: DetectorStrip; width: number };

/**
 * The detector's pixels as a bar, a tick where each lamp line lands and its element above it
 * (labels stacked in up to three rows; a label with no room is left to the table), the first and
 * last pixel under it, and a spoken summary of the same.
 */
export const DetectorStripFigure = memo(function DetectorStripFigure({ strip, width }: Props) {
  const drawn = useMemo(() => {
    const x = scaleLinear()
      .domain([-0.5, strip.pixelCount - 0.5])
      .range([1, width - 1]);
    const xs = strip.ticks.map((t) => x(t.pixel));
    const texts = strip.ticks.map((t) => shortLabel(lineSource(t.line)));
    const places = placeStripLabels(xs, texts.map((t) => t.length * CHAR_PX), width, LABEL_ROWS, LABEL_GAP_PX);
    return { x, xs, texts, places };
  }, [strip, width]);
  const summary = useMemo(() => stripSummary(strip), [strip]);
  const off = offDetectorSentence(strip);
  const { xs, texts, places } = drawn;
  return (
    <View style={styles.root} testID="calibration-strip">
      <View role="img" aria-label={summary} style={{ width, height: HEIGHT }} testID="calibration-strip-drawing">
        <Svg width={width} height={HEIGHT}>
          <Rect x={1} y={BAR_TOP} width={width - 2} height={BAR_PX} fill={colors.surfaceSunken} stroke={colors.inkMuted} strokeWidth={1} />
          {/* Leaders and ticks first, labels last on a surface-coloured patch, so a leader never runs through a label. */}
          {xs.map((px, i) => {
            const place = places[i]!;
            const top = place.row === null ? BAR_TOP - 2 : (place.row + 1) * ROW_PX;
            return (
              <G key={`t${i}`}>
                {place.row !== null ? <Path d={`M${px},${top}V${BAR_TOP}`} stroke={colors.line} strokeWidth={1} /> : null}
                <Path
                  d={`M${px},${BAR_TOP - 2}V${BAR_TOP + BAR_PX + 2}`}
                  stroke={colors.primary}
                  strokeWidth={1.5}
                  testID="calibration-strip-tick"
                />
              </G>
            );
          })}
          {xs.map((_, i) => {
            const place = places[i]!;
            if (place.row === null) return null;
            const w = texts[i]!.length * CHAR_PX;
            return (
              <G key={`l${i}`}>
                <Rect x={place.leftPx - 1} y={place.row * ROW_PX} width={w + 2} height={ROW_PX} fill={colors.surface} />
                <SvgText x={place.leftPx} y={(place.row + 1) * ROW_PX - 3} fontSize={LABEL_PX} fontFamily={fonts.regular} fill={colors.ink}>
                  {texts[i]}
                </SvgText>
              </G>
            );
          })}
          <SvgText x={1} y={HEIGHT - 4} fontSize={LABEL_PX} fontFamily={fonts.mono} fill={colors.inkMuted}>
            {strip.firstPixelNm === null ? 'pixel 0' : `pixel 0 · ${formatNumber(strip.firstPixelNm, 5)} nm`}
          </SvgText>
          <SvgText x={width - 1} y={HEIGHT - 4} fontSize={LABEL_PX} fontFamily={fonts.mono} fill={colors.inkMuted} textAnchor="end">
            {`pixel ${formatInteger(strip.pixelCount - 1)}${strip.lastPixelNm === null ? '' : ` · ${formatNumber(strip.lastPixelNm, 5)} nm`}`}
          </SvgText>
        </Svg>
      </View>
      {off ? (
        <Text variant="caption" tone="muted" testID="calibration-off-detector">
          {off}
        </Text>
      ) : null}
    </View>
  );
});

const styles = StyleSheet.create({
  root: { gap: space.xs },
});
