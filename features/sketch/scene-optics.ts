import { colors } from '../ui/theme';
import { formatDeg } from './sketch-format';
import type { PointMm, SketchGeometry, SketchOptic } from './sketch-types';
import type { SceneCanvas } from './scene-canvas';
import { mmLabel, partLabel } from './scene-text';
import type { SceneLayer, SketchShape, TextWeight } from './scene-types';

/** Mirrors or the lens, each with its name and focal length. */
export function opticsLayer(geometry: SketchGeometry, canvas: SceneCanvas): SceneLayer {
  const shapes: SketchShape[] = [];
  const texts: SketchShape[] = [];
  for (const [key, optic, name] of namedOptics(geometry)) {
    const lines: [string, TextWeight][] = [
      [name, 'semibold'],
      [`f ${mmLabel(optic.focalMm)}`, 'mono'],
    ];
    const outline = [optic.a, optic.b, ...optic.controls];
    shapes.push(opticShape(key, optic, canvas.pt));
    texts.push(...partLabel(canvas, key, optic.centre, optic.labelDirection, lines, outline));
  }
  return { shapes, texts };
}

/** Grating: substrate block, ruled face, and its rotation as data for tests. */
export function gratingLayer(geometry: SketchGeometry, canvas: SceneCanvas): SceneLayer {
  const { polyline } = canvas;
  const g = geometry.grating;
  const shapes: SketchShape[] = [
    {
      type: 'path',
      key: 'grating',
      d: `${polyline([g.face.a, g.face.b, g.back[0], g.back[1]])}Z`,
      stroke: colors.ink,
      strokeWidth: 1,
      fill: colors.surfaceSunken,
      testID: 'sketch-grating',
      data: { 'rotation-deg': geometry.rotationDeg.toFixed(4), 'setting-nm': String(geometry.settingNm) },
    },
    {
      type: 'path',
      key: 'grating-face',
      d: polyline([g.face.a, g.face.b]),
      stroke: colors.primary,
      strokeWidth: 2.5,
      linecap: 'butt',
    },
  ];
  const lines: [string, TextWeight][] = [
    ['Grating', 'semibold'],
    [geometry.settingReachable ? `φ ${formatDeg(geometry.rotationDeg)}` : 'no setting', 'mono'],
  ];
  const outline = [g.face.a, g.face.b, ...g.back];
  const texts = partLabel(canvas, 'grating', { x: 0, y: 0 }, g.labelDirection, lines, outline);
  return { shapes, texts };
}

/** Ebert–Fastie: the one mirror; Littrow: the one lens; otherwise collimator and camera. */
function namedOptics(geometry: SketchGeometry): [string, SketchOptic, string][] {
  if (geometry.sharedMirror) return [['mirror', geometry.sharedMirror, 'Mirror, used twice']];
  if (geometry.collimator === geometry.camera) return [['lens', geometry.collimator, 'Lens']];
  return [
    ['collimator', geometry.collimator, 'Collimator'],
    ['camera', geometry.camera, 'Camera'],
  ];
}

function opticShape(key: string, optic: SketchOptic, pt: (p: PointMm) => string): SketchShape {
  const [c0, c1] = optic.controls as [PointMm, PointMm | undefined];
  if (optic.kind === 'lens' && c1) {
    return {
      type: 'path',
      key,
      d: `M${pt(optic.a)}Q${pt(c0)} ${pt(optic.b)}Q${pt(c1)} ${pt(optic.a)}Z`,
      stroke: colors.primary,
      strokeWidth: 1.4,
      fill: '#DCE7EA',
      testID: `sketch-${key}`,
    };
  }
  return {
    type: 'path',
    key,
    d: `M${pt(optic.a)}Q${pt(c0)} ${pt(optic.b)}`,
    stroke: colors.ink,
    strokeWidth: 3.5,
    linecap: 'round',
    testID: `sketch-${key}`,
  };
}
