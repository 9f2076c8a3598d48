import { expect } from 'vitest';
import { SheetWriter, margins, paperPt } from '../../../server/sheets/writer';
import type { Paper } from '../../../shared/sheets';
import type { TextPiece } from './pdf-text';

/**
 * Every piece of text inside the paper's margins, and every character in a glyph both text fonts
 * have (≤, ≥, ×, – and the no-break spaces must be set, not printed as empty boxes).
 */
export function expectInsideMarginsInGlyphs(pieces: readonly TextPiece[], paper: Paper, atLeast: number): void {
  const { width, height } = paperPt[paper];
  expect(pieces.length).toBeGreaterThan(atLeast);
  for (const piece of pieces) {
    expect(piece.x, piece.str).toBeGreaterThanOrEqual(margins.left - 0.5);
    expect(piece.right, piece.str).toBeLessThanOrEqual(width - margins.right + 0.5);
    expect(piece.baseline, piece.str).toBeLessThanOrEqual(height - margins.top + 0.5);
  }
  const writer = new SheetWriter(paper, { title: 't', subject: 's', createdAt: new Date(0) });
  const chars = new Set(pieces.map((piece) => piece.str).join('').replace(/\s/g, ''));
  for (const char of chars) {
    expect(writer.hasGlyph('regular', char) && writer.hasGlyph('semibold', char), `glyph for "${char}"`).toBe(true);
  }
}
