import { FOOTER_PX } from './scene-canvas';
import { textWidthPx } from './scene-text';
import type { SketchShape } from './scene-types';

type TextShape = Extract<SketchShape, { type: 'text' }>;

/** A text's box in pixels (top-left, bottom-right), from its anchor, size and estimated width. */
export interface TextBox {
  left: number;
  top: number;
  right: number;
  bottom: number;
}

/** Clear space kept between two labels, px. */
const GAP_PX = 2;
/** How far one try moves a label, px; tries go out to the drawing's edges. */
const STEP_PX = 3;

export function textBox(text: TextShape): TextBox {
  const width = textWidthPx(text.text, text.fontSize, text.weight);
  const left = text.anchor === 'start' ? text.x : text.anchor === 'end' ? text.x - width : text.x - width / 2;
  return { left, top: text.y - text.fontSize * 0.85, right: left + width, bottom: text.y + text.fontSize * 0.25 };
}

export function boxesOverlap(a: TextBox, b: TextBox, gap = 0): boolean {
  return a.left < b.right + gap && b.left < a.right + gap && a.top < b.bottom + gap && b.top < a.bottom + gap;
}

function union(boxes: readonly TextBox[]): TextBox {
  return {
    left: Math.min(...boxes.map((b) => b.left)),
    top: Math.min(...boxes.map((b) => b.top)),
    right: Math.max(...boxes.map((b) => b.right)),
    bottom: Math.max(...boxes.map((b) => b.bottom)),
  };
}

function shifted(box: TextBox, dx: number, dy: number): TextBox {
  return { left: box.left + dx, top: box.top + dy, right: box.right + dx, bottom: box.bottom + dy };
}

/** One label's lines move together: "collimator-0", "collimator-1" → "collimator". */
function blockKey(key: string): string {
  return key.replace(/-\d+$/, '');
}

const DIRECTIONS: readonly [number, number][] = [
  [0, 1],
  [0, -1],
  [1, 0],
  [-1, 0],
  [Math.SQRT1_2, Math.SQRT1_2],
  [-Math.SQRT1_2, Math.SQRT1_2],
  [Math.SQRT1_2, -Math.SQRT1_2],
  [-Math.SQRT1_2, -Math.SQRT1_2],
];

/** A move toward the drawing's middle (into the optics and rays) counts this many times its length. */
const INWARD_COST = 3;

/**
 * Moves labels that would land on an earlier one (collimator and camera at a small deviation,
 * an angle value on a part's name) to the cheapest free spot inside the drawing: the shortest move
 * that clears every label already placed, where a move toward the drawing's middle (onto the
 * optics and rays) costs three times its length. Labels keep their order of importance: earlier
 * blocks stay put. `fixed` texts (the footer) never move.
 */
export function declutterTexts(
  texts: readonly SketchShape[],
  fixed: readonly SketchShape[],
  size: { widthPx: number; heightPx: number },
): SketchShape[] {
  const placed: TextBox[] = fixed.filter((t): t is TextShape => t.type === 'text').map(textBox);
  const blocks = new Map<string, TextShape[]>();
  for (const text of texts) {
    if (text.type !== 'text') continue;
    const key = blockKey(text.key);
    blocks.set(key, [...(blocks.get(key) ?? []), text]);
  }
  const bottomLimit = size.heightPx - FOOTER_PX;
  const inside = (box: TextBox) =>
    box.left >= 1 && box.right <= size.widthPx - 1 && box.top >= 1 && box.bottom <= bottomLimit;
  const out: SketchShape[] = [];
  for (const lines of blocks.values()) {
    const box = union(lines.map(textBox));
    const free = (b: TextBox) => !placed.some((p) => boxesOverlap(b, p, GAP_PX));
    let move: [number, number] = [0, 0];
    if (!free(box)) {
      const ox = (box.left + box.right) / 2 - size.widthPx / 2;
      const oy = (box.top + box.bottom) / 2 - bottomLimit / 2;
      // Within a tenth of the drawing of the middle line, either way along that axis is outward.
      const weight = (move: number, offset: number, span: number) =>
        Math.abs(offset) < span / 10 || Math.sign(move) === Math.sign(offset) ? 1 : INWARD_COST;
      const cost = ([dx, dy]: [number, number]) =>
        Math.abs(dx) * weight(dx, ox, size.widthPx) + Math.abs(dy) * weight(dy, oy, bottomLimit);
      const tries: [number, number][] = [];
      const reach = Math.max(size.widthPx, size.heightPx);
      for (let d = STEP_PX; d <= reach; d += STEP_PX) {
        for (const [ux, uy] of DIRECTIONS) tries.push([round(ux * d), round(uy * d)]);
      }
      tries.sort((a, b) => cost(a) - cost(b));
      const found = tries.find(([dx, dy]) => {
        const candidate = shifted(box, dx, dy);
        return inside(candidate) && free(candidate);
      });
      if (found) move = found;
    }
    const [dx, dy] = move;
    placed.push(shifted(box, dx, dy));
    for (const line of lines) {
      out.push(dx === 0 && dy === 0 ? line : { ...line, x: round(line.x + dx), y: round(line.y + dy) });
    }
  }
  return out;
}

function round(value: number): number {
  return Math.round(value * 10) / 10;
}
