/**
 * The sketch as a flat list of drawing primitives in pixels: one list that both the on-screen
 * component (react-native-svg) and the saved SVG file draw, so they cannot drift apart. Pure: no
 * React, relative imports only.
 */

import { angleArcLayer } from './scene-arcs';
import { diffractedRays, entranceBeam, referenceLines } from './scene-beams';
import { sceneCanvas } from './scene-canvas';
import { declutterTexts } from './scene-declutter';
import { footerLayer } from './scene-footer';
import { gratingLayer, opticsLayer } from './scene-optics';
import { exitPlaneShape, slitsLayer } from './scene-slits';
import type { SceneLayer, SceneOptions, SketchScene } from './scene-types';
import type { SketchGeometry } from './sketch-types';

export type { SceneOptions, SketchScene, SketchShape, TextWeight } from './scene-types';
export { textWidthPx } from './scene-text';

/** Lays the geometry out in `widthPx` and lists what to draw, back to front, every text above every path. */
export function buildSketchScene(geometry: SketchGeometry, options: SceneOptions): SketchScene {
  const canvas = sceneCanvas(geometry, options);
  const exitPlane = exitPlaneShape(geometry, canvas);
  const footer = footerLayer(geometry, canvas);
  const beams = [
    ...referenceLines(geometry, canvas),
    ...entranceBeam(geometry, canvas),
    ...diffractedRays(geometry, canvas),
  ];
  const arcs = angleArcLayer(geometry, canvas);
  const optics = opticsLayer(geometry, canvas);
  const grating = gratingLayer(geometry, canvas);
  const slits = slitsLayer(geometry, canvas);
  const layers: SceneLayer[] = [
    { shapes: beams, texts: [] },
    arcs,
    optics,
    grating,
    { shapes: exitPlane ? [exitPlane] : [], texts: [] },
    slits,
    footer,
  ];
  // No label lands on another: the parts' names keep their places first, then the angle values
  // move out of their way; the footer stays where it is.
  const texts = declutterTexts([...optics.texts, ...grating.texts, ...slits.texts, ...arcs.texts], footer.texts, canvas);
  return {
    widthPx: canvas.widthPx,
    heightPx: canvas.heightPx,
    pxPerMm: canvas.pxPerMm,
    scaleBarMm: footer.scaleBarMm,
    shapes: [...layers.flatMap((layer) => layer.shapes), ...texts, ...footer.texts],
  };
}
