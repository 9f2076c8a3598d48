import type { SketchScene, SketchShape, TextWeight } from '../../features/sketch/sketch-scene';
import type { SheetFont, SheetWriter } from './writer';

/**
 * Draws the sketch's scene — the same primitives the app's SVG draws (features/sketch) — as PDF
 * vector graphics: SVG path data goes to pdfkit as is, texts in the shipped fonts. No second
 * geometry: what the scene places is what the sheet prints.
 */

const fontOf: Record<TextWeight, SheetFont> = { regular: 'regular', semibold: 'semibold', mono: 'mono' };

export type Box = { x: number; y: number; width: number; height: number };

/** The scale that fits the scene in `box`, and where its corner lands (centred across the box). */
export function fitScene(scene: Pick<SketchScene, 'widthPx' | 'heightPx'>, box: Box): { scale: number; x: number; y: number } {
  const scale = Math.min(box.width / scene.widthPx, box.height / scene.heightPx);
  return { scale, x: box.x + (box.width - scene.widthPx * scale) / 2, y: box.y };
}

/**
 * Draws `shapes` scaled by `scale` with their origin at (x, y). `opacity` fades the whole drawing
 * (the compare sheet draws the earlier version faded under the later).
 */
export function drawShapes(
  writer: SheetWriter,
  shapes: readonly SketchShape[],
  at: { scale: number; x: number; y: number },
  options: { opacity?: number; only?: 'paths' | 'texts' } = {},
): void {
  const { doc } = writer;
  // pdfkit's text() moves its cursor to the last label, in the scene's scaled units: keep the
  // writer's cursor where it was.
  const cursor = { x: doc.x, y: doc.y };
  doc.save();
  doc.translate(at.x, at.y).scale(at.scale);
  const fade = options.opacity ?? 1;
  for (const shape of shapes) {
    if (shape.type === 'path' && options.only !== 'texts') drawPath(writer, shape, fade);
    if (shape.type === 'text' && options.only !== 'paths') drawText(writer, shape, fade);
  }
  doc.restore();
  doc.x = cursor.x;
  doc.y = cursor.y;
}

/** The whole scene fitted into `box`. */
export function drawScene(writer: SheetWriter, scene: SketchScene, box: Box): { scale: number; x: number; y: number } {
  const at = fitScene(scene, box);
  drawShapes(writer, scene.shapes, at);
  return at;
}

function drawPath(writer: SheetWriter, shape: Extract<SketchShape, { type: 'path' }>, fade: number): void {
  const { doc } = writer;
  doc.save();
  doc.path(shape.d);
  doc.lineWidth(shape.strokeWidth).lineJoin('round').lineCap(shape.linecap ?? 'butt');
  if (shape.dash) {
    const pattern = shape.dash.split(/[\s,]+/).map(Number).filter((n) => Number.isFinite(n) && n > 0);
    // pdfkit takes the whole pattern as an array (its types say one number).
    if (pattern.length > 0) doc.dash(pattern as unknown as number, {});
  }
  doc.strokeOpacity((shape.opacity ?? 1) * fade);
  if (shape.fill && shape.fill !== 'none') {
    doc.fillOpacity(fade).fillAndStroke(shape.fill, shape.stroke);
  } else {
    doc.stroke(shape.stroke);
  }
  doc.undash();
  doc.restore();
}

function drawText(writer: SheetWriter, shape: Extract<SketchShape, { type: 'text' }>, fade: number): void {
  const { doc } = writer;
  writer.use(fontOf[shape.weight], shape.fontSize);
  const width = doc.widthOfString(shape.text);
  const x = shape.anchor === 'middle' ? shape.x - width / 2 : shape.anchor === 'end' ? shape.x - width : shape.x;
  doc.save();
  doc.fillOpacity(fade).fillColor(shape.fill);
  // The scene's y is the text's baseline, as in SVG.
  doc.text(shape.text, x, shape.y, { lineBreak: false, baseline: 'alphabetic' });
  doc.restore();
}
