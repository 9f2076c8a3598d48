import { memo, useMemo } from 'react';
import { StyleSheet, View } from 'react-native';
import Svg, { Line, Path, Rect, Text as SvgText } from 'react-native-svg';
import { Text, colors, fonts, space } from '@/features/ui';
import { heightLabel, micrometres, spotWords } from '../image-quality-words';
import { scaleBar, spotDots, spotWindow, toPx, type SpotWindow } from '../spot-figure';
import type { Spot, TracedWavelength } from '../types';

type Props = {
  wavelength: Pick<TracedWavelength, 'wavelengthNm' | 'role'>;
  spot: Spot;
  /** The exit slit (at x = 0) or, on a detector, one pixel about the spot: drawn to scale. */
  aperture: { centreXMm: number; widthMm: number; label: string };
  /** One pixel's width, marked at the top about the spot (a monochromator that names a detector); null for none. */
  pixelMm?: number | null;
  sizePx: number;
  /** A window chosen elsewhere (two spots at one scale on the compare screen); by default the spot's own. */
  window?: SpotWindow;
  testID: string;
};

/** Room under the square for the scale bar's label. */
const SCALE_BAND_PX = 16;

/** One spot at the image plane: its rays, the slit or pixel to the same scale along x and y, a scale bar. */
export const SpotDiagram = memo(function SpotDiagram({ wavelength, spot, aperture, pixelMm = null, sizePx, window: given, testID }: Props) {
  const drawn = useMemo(() => {
    const window = given ?? spotWindow(spot.x, spot.y, spot.centroidMm, aperture, sizePx);
    const left = toPx(window, aperture.centreXMm - aperture.widthMm / 2, 0).px;
    const right = toPx(window, aperture.centreXMm + aperture.widthMm / 2, 0).px;
    const pixelPx = pixelMm === null ? null : pixelMm * (sizePx / (2 * window.halfMm));
    return { window, dots: spotDots(window, spot.x, spot.y), left, right, bar: scaleBar(window), pixelPx };
  }, [spot, aperture, pixelMm, sizePx, given]);
  const { dots, left, right, bar, pixelPx } = drawn;
  const clampedLeft = Math.max(0, Math.min(sizePx, left));
  const clampedRight = Math.max(0, Math.min(sizePx, right));
  const barY = sizePx + 6;
  return (
    <View style={styles.root}>
      <Text variant="caption" tone="muted">
        {heightLabel(spot.role)}
      </Text>
      <View role="img" aria-label={`${spotWords(wavelength, spot)} ${aperture.label}${pixelPx !== null ? ' and one pixel' : ''} drawn to scale; scale bar ${bar.label}.`} testID={testID}>
        <Svg width={sizePx} height={sizePx + SCALE_BAND_PX}>
          <Rect x={0} y={0} width={sizePx} height={sizePx} fill={colors.paper} />
          {clampedRight > clampedLeft ? (
            <Rect x={clampedLeft} y={0} width={clampedRight - clampedLeft} height={sizePx} fill={colors.surface} />
          ) : null}
          {left >= 0 && left <= sizePx ? <Line x1={left} x2={left} y1={0} y2={sizePx} stroke={colors.primary} strokeWidth={1} /> : null}
          {right >= 0 && right <= sizePx ? <Line x1={right} x2={right} y1={0} y2={sizePx} stroke={colors.primary} strokeWidth={1} /> : null}
          <Path d={dots.d} fill={colors.accent} testID={`${testID}-rays`} />
          <Line x1={sizePx / 2 - 4} x2={sizePx / 2 + 4} y1={sizePx / 2} y2={sizePx / 2} stroke={colors.ink} strokeWidth={1} />
          <Line x1={sizePx / 2} x2={sizePx / 2} y1={sizePx / 2 - 4} y2={sizePx / 2 + 4} stroke={colors.ink} strokeWidth={1} />
          {pixelPx !== null ? <Rect x={sizePx / 2 - Math.max(1, pixelPx) / 2} y={0} width={Math.max(1, pixelPx)} height={4} fill={colors.ink} /> : null}
          <Rect x={0} y={0} width={sizePx} height={sizePx} fill="none" stroke={colors.line} />
          <Line x1={2} x2={2 + bar.lengthPx} y1={barY} y2={barY} stroke={colors.ink} strokeWidth={2} />
          <SvgText x={6 + bar.lengthPx} y={barY + 4} fontSize={10} fontFamily={fonts.mono} fill={colors.inkMuted}>
            {bar.label}
          </SvgText>
        </Svg>
      </View>
      <Text variant="caption" style={styles.figure} testID={`${testID}-rms`}>
        {`RMS ${micrometres(spot.rmsWidthMm)}`}
      </Text>
    </View>
  );
});

const styles = StyleSheet.create({
  root: { gap: space.xxs },
  figure: { fontFamily: fonts.mono, fontVariant: ['tabular-nums'] },
});
