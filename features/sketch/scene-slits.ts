import { colors } from '../ui/theme';
import type { SketchGeometry, SketchSlit } from './sketch-types';
import { r, type SceneCanvas } from './scene-canvas';
import { partLabel } from './scene-text';
import type { SceneLayer, SketchShape } from './scene-types';

const JAW_PX = 9;

/** The exit plane, faint, through the exit slit and every image on it; null when the images coincide. */
export function exitPlaneShape(geometry: SketchGeometry, { polyline }: SceneCanvas): SketchShape | null {
  const plane = geometry.exitPlane;
  let lo = 0;
  let hi = 0;
  for (const ray of geometry.rays) {
    lo = Math.min(lo, ray.exitOffsetMm);
    hi = Math.max(hi, ray.exitOffsetMm);
  }
  if (!(hi - lo > 0)) return null;
  const reach = (s: number) => ({
    x: plane.centre.x + plane.along.x * s,
    y: plane.centre.y + plane.along.y * s,
  });
  const extra = (hi - lo) * 0.05;
  return {
    type: 'path',
    key: 'exit-plane',
    d: polyline([reach(lo - extra), reach(hi + extra)]),
    stroke: colors.inkFaint,
    strokeWidth: 1,
    dash: '4 3',
    testID: 'sketch-exit-plane',
  };
}

/** The entrance slit, then the exit slit or the detector, each labelled. */
export function slitsLayer(geometry: SketchGeometry, canvas: SceneCanvas): SceneLayer {
  const { entranceSlit, exitSlit, detector } = geometry;
  const named = (key: string, slit: SketchSlit, name: string) =>
    partLabel(canvas, key, slit.centre, slit.labelDirection, [[name, 'semibold']]);
  const shapes: SketchShape[] = [slitShape('entrance-slit', entranceSlit, canvas)];
  const texts = named('entrance-slit', entranceSlit, 'Entrance slit');
  if (detector) {
    shapes.push({
      type: 'path',
      key: 'detector',
      d: canvas.polyline([detector.a, detector.b]),
      stroke: colors.primary,
      strokeWidth: 5,
      linecap: 'butt',
      testID: 'sketch-detector',
    });
    texts.push(...named('detector', exitSlit, 'Detector'));
  } else {
    shapes.push(slitShape('exit-slit', exitSlit, canvas));
    texts.push(...named('exit-slit', exitSlit, 'Exit slit'));
  }
  return { shapes, texts };
}

/** Two jaws a visible gap apart: the slit's width to scale, never narrower than 3 px. */
function slitShape(key: string, slit: SketchSlit, { px, pxPerMm }: SceneCanvas): SketchShape {
  const [cx, cy] = px(slit.centre);
  const ux = slit.along.x;
  const uy = -slit.along.y;
  const half = Math.max(slit.widthMm * pxPerMm, 3) / 2;
  const jaw = (from: number, to: number) =>
    `M${r(cx + ux * from)},${r(cy + uy * from)}L${r(cx + ux * to)},${r(cy + uy * to)}`;
  return {
    type: 'path',
    key,
    d: `${jaw(half, half + JAW_PX)}${jaw(-half, -half - JAW_PX)}`,
    stroke: colors.ink,
    strokeWidth: 2.5,
    linecap: 'butt',
    testID: `sketch-${key}`,
  };
}
