/**
 * Two sketches on one drawing, for comparing versions: both laid out on the union of their
 * extents so a millimetre is the same length in each, the earlier one drawn beneath in a quiet
 * dashed grey without labels, the later one on top as usual. Pure: no React, relative imports.
 */

import { colors } from '../ui/theme';
import type { SketchGeometry } from './geometry';
import { buildSketchScene, type SceneOptions, type SketchScene, type SketchShape } from './sketch-scene';

function unionBounds(a: SketchGeometry['bounds'], b: SketchGeometry['bounds']): SketchGeometry['bounds'] {
  return {
    minX: Math.min(a.minX, b.minX),
    minY: Math.min(a.minY, b.minY),
    maxX: Math.max(a.maxX, b.maxX),
    maxY: Math.max(a.maxY, b.maxY),
  };
}

/** The earlier version's path, recoloured so it reads as "before" under the later one. */
function asBefore(shape: SketchShape): SketchShape | null {
  if (shape.type === 'text') return null;
  return {
    ...shape,
    key: `before-${shape.key}`,
    stroke: colors.inkFaint,
    dash: shape.dash ?? '5 4',
    fill: 'none',
    opacity: 0.8,
    testID: shape.testID ? `before-${shape.testID}` : undefined,
  };
}

/** One scene holding `before` (beneath, unlabelled) and `after` at a common scale. */
export function overlaySketchScenes(
  before: SketchGeometry,
  after: SketchGeometry,
  options: SceneOptions,
): SketchScene {
  const bounds = unionBounds(before.bounds, after.bounds);
  const earlier = buildSketchScene({ ...before, bounds }, options);
  const later = buildSketchScene({ ...after, bounds }, options);
  const beneath = earlier.shapes.map(asBefore).filter((shape): shape is SketchShape => shape !== null);
  return { ...later, shapes: [...beneath, ...later.shapes] };
}
