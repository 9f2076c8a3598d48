import type { Design } from '../../shared/design';
import { sketchGeometry } from '../../features/sketch/geometry';
import { overlaySketchScenes } from '../../features/sketch/overlay';
import type { SceneOptions, SketchScene } from '../../features/sketch/sketch-scene';

/** Millimetres on paper per PDF point (1 pt = 1/72 in = 25.4/72 mm). */
const MM_PER_PT = 25.4 / 72;

/**
 * Versions `a` and `b` on one drawing at one scale: the compare screen's own overlay
 * (features/sketch/overlay.ts), which lays both geometries out on the union of their extents so
 * a millimetre is the same length in each however different the two mounts are, and draws `a`
 * beneath in dashed grey without labels, `b` on top as usual.
 */
export function compareSketchScene(a: Design, b: Design, options: SceneOptions): SketchScene {
  return overlaySketchScenes(sketchGeometry(a), sketchGeometry(b), options);
}

/**
 * The printed scale's N in "1 : N" — millimetres of the instrument per millimetre of paper — for a
 * scene drawn at `ptPerPx` points per scene pixel: N = 1 / (pxPerMm × ptPerPx × 25.4/72).
 */
export function printedReduction(scene: Pick<SketchScene, 'pxPerMm'>, ptPerPx: number): number {
  return 1 / (scene.pxPerMm * ptPerPx * MM_PER_PT);
}
