import { memo, useMemo } from 'react';
import { StyleSheet, View } from 'react-native';
import Svg, { Path, Text as SvgText } from 'react-native-svg';
import type { Evaluation } from '@/features/solver';
import { Text, colors, fonts, space } from '@/features/ui';
import type { Design } from '@/shared/design';
import { describeSketch, formatNm, sketchGeometry, type SketchGeometry } from '../geometry';
import { buildSketchScene, type SketchScene, type SketchShape, type TextWeight } from '../sketch-scene';

export type RaySketchProps = {
  design: Design;
  /** Not needed for the drawing (it works from the design); accepted so callers can pass the
   * solver's result alongside, as the plots take it. */
  evaluation?: Evaluation;
  /** Width of the space to fill, px. The height follows the mount's shape. */
  width: number;
  /** Cap on the drawing's height, px (default 1.1 × width, at most 560). */
  maxHeight?: number;
  /** Turn the grating to this wavelength, nm (default: the centre of the range). */
  settingNm?: number | null;
  testID?: string;
};

const FAMILY: Record<TextWeight, string> = {
  regular: fonts.regular,
  semibold: fonts.semibold,
  mono: fonts.mono,
};

/**
 * The to-scale top view of the mount, with chief and edge rays for the range start, centre and
 * end. Redraws when any field of the design changes (compared by value, so a form that mutates
 * its values object in place still triggers it).
 */
export function RaySketch({ design, width, maxHeight, settingNm, testID = 'ray-sketch' }: RaySketchProps) {
  const designKey = JSON.stringify(design);
  const setting = settingNm ?? undefined;
  // eslint-disable-next-line react-hooks/exhaustive-deps -- keyed by value (designKey), not identity
  const geometry = useMemo(() => sketchGeometry(design, { settingNm: setting }), [designKey, setting]);
  return (
    <SketchView geometry={geometry} design={design} width={width} maxHeight={maxHeight} testID={testID} />
  );
}

type ViewProps = {
  geometry: SketchGeometry;
  design: Design;
  width: number;
  maxHeight?: number;
  testID: string;
};

const SketchView = memo(function SketchView({ geometry, design, width, maxHeight, testID }: ViewProps) {
  const scene = useMemo(
    () => buildSketchScene(geometry, { widthPx: width, maxHeightPx: maxHeight }),
    [geometry, width, maxHeight],
  );
  const label = useMemo(() => describeSketch(geometry, design), [geometry, design]);
  const notes = [
    ...geometry.unreachable.map((u) => `${formatNm(u.wavelengthNm)} not drawn: ${u.reason}.`),
    ...geometry.notes,
  ];
  return (
    <View style={styles.root}>
      <SceneSvg scene={scene} label={label} testID={testID} />
      {notes.length > 0 ? (
        <View style={styles.notes} testID={`${testID}-notes`}>
          {notes.map((note) => (
            <Text key={note} variant="caption" tone={note.includes('not drawn') ? 'warning' : 'muted'}>
              {note}
            </Text>
          ))}
        </View>
      ) : null}
    </View>
  );
});

/** A laid-out scene as an SVG image with a spoken description. */
export function SceneSvg({ scene, label, testID }: { scene: SketchScene; label: string; testID: string }) {
  return (
    <View
      role="img"
      aria-label={label}
      testID={testID}
      style={{ width: scene.widthPx, height: scene.heightPx }}
    >
      <Svg width={scene.widthPx} height={scene.heightPx} viewBox={`0 0 ${scene.widthPx} ${scene.heightPx}`}>
        {scene.shapes.map(renderShape)}
      </Svg>
    </View>
  );
}

function renderShape(shape: SketchShape) {
  if (shape.type === 'text') {
    return (
      <SvgText
        key={shape.key}
        x={shape.x}
        y={shape.y}
        fontSize={shape.fontSize}
        fontFamily={FAMILY[shape.weight]}
        textAnchor={shape.anchor}
        fill={shape.fill}
      >
        {shape.text}
      </SvgText>
    );
  }
  const data: Record<string, string> = {};
  for (const [name, value] of Object.entries(shape.data ?? {})) data[`data-${name}`] = value;
  return (
    <Path
      key={shape.key}
      d={shape.d}
      stroke={shape.stroke}
      strokeWidth={shape.strokeWidth}
      strokeDasharray={shape.dash ?? undefined}
      strokeOpacity={shape.opacity}
      strokeLinecap={shape.linecap}
      strokeLinejoin="round"
      fill={shape.fill ?? 'none'}
      testID={shape.testID}
      {...data}
    />
  );
}

const styles = StyleSheet.create({
  root: { gap: space.xs, backgroundColor: colors.paper, borderRadius: 6 },
  notes: { gap: space.xxs, paddingHorizontal: space.sm, paddingBottom: space.sm },
});
