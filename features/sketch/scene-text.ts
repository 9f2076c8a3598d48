// The ui index would pull React components into the server; the theme file is plain constants.
import { formatInteger, formatNumber, withUnit } from '../../shared/format';
import { colors } from '../ui/theme';
import type { PointMm } from './sketch-types';
import { FOOTER_PX, r, type SceneCanvas } from './scene-canvas';
import type { SketchShape, TextWeight } from './scene-types';

export const LABEL_PX = 11;
export const SMALL_PX = 10;
const LABEL_GAP_PX = 8;

/** Rough advance width of a label, px: enough to keep labels inside the drawing. */
export function textWidthPx(text: string, fontSize: number, weight: TextWeight): number {
  return text.length * fontSize * (weight === 'mono' ? 0.6 : weight === 'semibold' ? 0.58 : 0.55);
}

/** A length for a label: whole millimetres from 100 mm up, else three significant figures. */
export function mmLabel(valueMm: number): string {
  return withUnit(valueMm >= 100 ? formatInteger(valueMm) : formatNumber(valueMm, 3), 'mm');
}

/**
 * Lines of text beside `outline` (which `anchorMm` is the middle of), clear of it along
 * `directionMm`, kept inside the drawing.
 */
export function partLabel(
  canvas: SceneCanvas,
  key: string,
  anchorMm: PointMm,
  directionMm: PointMm,
  lines: [string, TextWeight][],
  outline: readonly PointMm[] = [],
): SketchShape[] {
  const { widthPx, heightPx } = canvas;
  let reach = 0;
  for (const p of outline)
    reach = Math.max(reach, (p.x - anchorMm.x) * directionMm.x + (p.y - anchorMm.y) * directionMm.y);
  const [ax, ay] = canvas.px({
    x: anchorMm.x + directionMm.x * reach,
    y: anchorMm.y + directionMm.y * reach,
  });
  const dx = directionMm.x;
  const dy = -directionMm.y; // screen y runs down
  const anchor: 'start' | 'middle' | 'end' = dx > 0.45 ? 'start' : dx < -0.45 ? 'end' : 'middle';
  const lineHeight = LABEL_PX + 2;
  const blockHeight = lineHeight * lines.length;
  let tx = ax + dx * LABEL_GAP_PX;
  // Place the block's near edge LABEL_GAP_PX from the anchor, whichever way it points.
  let top =
    dy > 0.45 ? ay + LABEL_GAP_PX : dy < -0.45 ? ay - LABEL_GAP_PX - blockHeight : ay - blockHeight / 2;
  top = Math.min(Math.max(top, 2), heightPx - FOOTER_PX - blockHeight);
  const widest = Math.max(...lines.map(([text, weight]) => textWidthPx(text, LABEL_PX, weight)));
  const leftEdge = anchor === 'start' ? tx : anchor === 'end' ? tx - widest : tx - widest / 2;
  const shift = Math.max(0, 3 - leftEdge) - Math.max(0, leftEdge + widest - (widthPx - 3));
  tx += shift;
  return lines.map(([text, weight], i) => ({
    type: 'text',
    key: `${key}-${i}`,
    x: r(tx),
    y: r(top + lineHeight * i + LABEL_PX * 0.85),
    text,
    fontSize: weight === 'mono' ? SMALL_PX : LABEL_PX,
    anchor,
    fill: weight === 'mono' ? colors.inkMuted : colors.ink,
    weight,
  }));
}
