import type { Design } from '../../shared/design';
import { describeSketch, formatNm, type SketchGeometry } from '../../features/sketch/geometry';
import type { SceneOptions, SketchScene, SketchShape } from '../../features/sketch/sketch-scene';
import { drawScene, type Box } from './vector';
import { sheetColors, type SheetWriter } from './writer';

/**
 * The ray sketch on a sheet: the app's scene (features/sketch) laid out a little wider than the
 * content column and scaled down into it, on white inside a thin frame. The compare sheet draws
 * its overlay through the same three functions, so both sheets print a sketch the same way.
 */

/**
 * Width the scene is laid out in, px. The scene's labels are 10–11 px; laid out at 640 px and
 * fitted to a 499–516 pt column they print at about 8–9 pt, the sheet's body size.
 */
export const SKETCH_SCENE_WIDTH_PX = 640;
/** Tallest a sketch may print, pt: leaves room for the description on the same page. */
export const SKETCH_MAX_HEIGHT_PT = 360;
const FRAME_PAD_PT = 4;

/** Scene options for a sketch across `writer`'s content column, at most SKETCH_MAX_HEIGHT_PT tall. */
export function sketchSceneOptions(writer: SheetWriter): SceneOptions {
  const scale = (writer.contentWidth - 2 * FRAME_PAD_PT) / SKETCH_SCENE_WIDTH_PX;
  return {
    widthPx: SKETCH_SCENE_WIDTH_PX,
    maxHeightPx: Math.floor((SKETCH_MAX_HEIGHT_PT - 2 * FRAME_PAD_PT) / scale),
  };
}

/** Height the framed sketch takes across the content column, pt. */
export function sketchFigureHeight(
  writer: SheetWriter,
  scene: Pick<SketchScene, 'widthPx' | 'heightPx'>,
): number {
  const inner = writer.contentWidth - 2 * FRAME_PAD_PT;
  return (scene.heightPx * inner) / scene.widthPx + 2 * FRAME_PAD_PT;
}

/**
 * Reserves a framed box across the content column as tall as `scene` fitted to it (plus
 * `keepWithPt` kept on the same page, for the lines below) and draws the scene in it. Returns
 * the frame.
 */
export function drawSketchFigure(writer: SheetWriter, scene: SketchScene, keepWithPt = 0): Box {
  const height = sketchFigureHeight(writer, scene);
  writer.ensureSpace(height + keepWithPt);
  const frame = writer.box(height);
  const { doc } = writer;
  doc.save();
  doc
    .rect(frame.x, frame.y, frame.width, frame.height)
    .lineWidth(0.5)
    .fillAndStroke('#FFFFFF', sheetColors.line);
  doc.restore();
  // drawScene leaves the writer's cursor where it was.
  drawScene(writer, printableScene(writer, scene), {
    x: frame.x + FRAME_PAD_PT,
    y: frame.y + FRAME_PAD_PT,
    width: frame.width - 2 * FRAME_PAD_PT,
    height: frame.height - 2 * FRAME_PAD_PT,
  });
  return frame;
}

/**
 * The words beside a sketch, as the saved SVG file carries them: its one-line description
 * (`<title>`) and the drawing's notes and unreachable wavelengths (`<desc>`).
 */
export function sketchWords(
  geometry: SketchGeometry,
  design: Design,
): { description: string; notes: string[] } {
  return {
    description: describeSketch(geometry, design),
    notes: [
      ...geometry.notes,
      ...geometry.unreachable.map((u) => `Not drawn: ${formatNm(u.wavelengthNm)}, ${u.reason}.`),
    ],
  };
}

/**
 * The scene with every monospaced label the shipped IBM Plex Mono cannot set moved to Inter, which
 * can. Plex Mono has no Greek (the angle labels "α 36.88°", "φ 21.88°"): a browser falls back per
 * character, a PDF prints an empty box.
 */
export function printableScene(writer: SheetWriter, scene: SketchScene): SketchScene {
  const settable = (text: string) => Array.from(text).every((char) => writer.hasGlyph('mono', char));
  const shapes = scene.shapes.map((shape): SketchShape =>
    shape.type === 'text' && shape.weight === 'mono' && !settable(shape.text)
      ? { ...shape, weight: 'regular' }
      : shape,
  );
  return { ...scene, shapes };
}
