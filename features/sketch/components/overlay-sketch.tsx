import { useMemo } from 'react';
import type { Design } from '@/shared/design';
import { describeSketch, sketchGeometry } from '../geometry';
import { overlaySketchScenes } from '../overlay';
import { SceneSvg } from './ray-sketch';

type Props = { before: Design; after: Design; width: number; maxHeight?: number; testID?: string };

/** Two versions of a mount on one to-scale drawing: the earlier dashed grey beneath the later. */
export function OverlaySketch({ before, after, width, maxHeight, testID = 'overlay-sketch' }: Props) {
  const beforeKey = JSON.stringify(before);
  const afterKey = JSON.stringify(after);
  const scene = useMemo(
    () =>
      overlaySketchScenes(sketchGeometry(before), sketchGeometry(after), {
        widthPx: width,
        maxHeightPx: maxHeight,
      }),
    // eslint-disable-next-line react-hooks/exhaustive-deps -- keyed by value, not identity
    [beforeKey, afterKey, width, maxHeight],
  );
  const label = useMemo(
    () =>
      `Earlier version, dashed grey: ${describeSketch(sketchGeometry(before), before)} Later version: ${describeSketch(sketchGeometry(after), after)}`,
    // eslint-disable-next-line react-hooks/exhaustive-deps -- keyed by value, not identity
    [beforeKey, afterKey],
  );
  return <SceneSvg scene={scene} label={label} testID={testID} />;
}
