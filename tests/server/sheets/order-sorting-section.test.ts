import { describe, expect, it } from 'vitest';
import { exampleDesign, type Design } from '../../../shared/design';
import type { OrderSortingFilter } from '../../../shared/filters';
import { buildSheet } from '../../../server/sheets/build';
import type { SheetContext } from '../../../server/sheets/context';
import { sheetSections } from '../../../server/sheets/registry';
import { orderSortingSection } from '../../../server/sheets/sections/order-sorting';
import { textSize } from '../../../server/sheets/writer';
import { expectInsideMarginsInGlyphs } from './inside-margins';
import { pdfText } from './pdf-text';
import { sampleSheet, sampleVersion } from './sample';

/**
 * The design sheet's Order sorting section read back through pdfjs-dist. The example design has a
 * 200–1100 nm source and a 300–900 nm range in first order: from a 400 nm setting on, the second
 * order brings in source light λ/2 ≥ 200 nm (mλ = nλ′, the grating equation; Palmer & Loewen,
 * Diffraction Grating Handbook, ch. 2), so the section applies; a range ending at 390 nm lies
 * within one octave of the source (λ/2 ≤ 195 nm) and it does not.
 */

const plain = (text: string) => text.replace(/\s+/g, ' ').trim();

/**
 * Two long-pass filters worked by hand (the ramp model of shared/filters.ts: zero at
 * cut-on − edge/2, full at cut-on + edge/2):
 * - 1: cut-on 400 nm, 10 nm edge, in from 400 nm: at 400 nm it passes (400 − 395) / 10 = 50 % of
 *   the working wavelength — it cuts into the signal. It blocks λ/2 ≤ 395 nm, i.e. up to 790 nm.
 * - 2: cut-on 770 nm, 20 nm edge, from 780 nm: foot 760 nm, full at 780 nm, so 100 % passed; it
 *   blocks λ/2 ≤ 760 nm, beyond the whole source at 900 nm (λ/2 = 450 nm).
 */
const filters: OrderSortingFilter[] = [
  { kind: 'long-pass', cutOnNm: 400, inFromNm: 400, inToNm: 780, edgeWidthNm: 10 },
  { kind: 'long-pass', cutOnNm: 770, inFromNm: 780, inToNm: 900, edgeWidthNm: 20 },
];
const withFilters: Design = { ...structuredClone(exampleDesign), filters };

function sheetOf(params: Design): SheetContext {
  return sampleSheet({ params, version: sampleVersion(params) });
}

async function sectionLines(params: Design): Promise<string[]> {
  const { pages } = await pdfText(await buildSheet(sheetOf(params), [orderSortingSection]));
  return pages.flatMap((page) => page.split('\n')).map(plain);
}

describe('the design sheet’s Order sorting section', () => {
  it('is listed after the plots', () => {
    const ids = sheetSections.map((section) => section.id);
    expect(ids.indexOf('order-sorting')).toBe(ids.indexOf('plots') + 1);
  });

  it('applies to a design whose source reaches another order in its range, or that carries filters, and to no other', () => {
    const octave: Design = { ...structuredClone(exampleDesign), range: { startNm: 300, endNm: 390 } };
    expect(orderSortingSection.appliesTo(sheetOf(exampleDesign))).toBe(true);
    expect(orderSortingSection.appliesTo(sheetOf(octave))).toBe(false);
    expect(orderSortingSection.appliesTo(sheetOf({ ...octave, filters }))).toBe(true);
  });

  it('prints each filter’s stored values in full, where it is in the beam and how much of the signal it passes', async () => {
    const lines = await sectionLines(withFilters);
    expect(lines).toContain('1 long-pass 400 nm 400–780 nm 10 nm 50 % at 400 nm');
    expect(lines).toContain('2 long-pass 770 nm 780–900 nm 20 nm 100 % at 780 nm');
    expect(lines.some((line) => line.startsWith('Unblocked overlaps: none left'))).toBe(true);
    // The design's filters leave nothing: no plan to propose.
    expect(lines.some((line) => line.startsWith('Proposed plan'))).toBe(false);
  });

  it('counts the unblocked overlaps and proposes a plan that leaves none when the design has no filters', async () => {
    const lines = await sectionLines(exampleDesign);
    const count = lines.find((line) => /unblocked overlaps \(/.test(line));
    expect(count).toMatch(/^\d+ unblocked overlaps \(wavelength × order pairs over the \d+ swept wavelengths\)/);
    expect(lines).toContain('Filters: none in the design.');
    expect(lines.find((line) => line.startsWith('Proposed plan'))).toMatch(/^Proposed plan: \d+ long-pass filters?, none left$/);
    // The plan's first filter goes in where the overlap starts, at 400 nm, and passes all of it there.
    expect(lines.find((line) => line.startsWith('1 long-pass'))).toMatch(/ 400–\d+ nm .* 100 % at 400 nm$/);
  });

  it('prints its heading at the heading size between the plots and the next section', async () => {
    const { pieces } = await pdfText(await buildSheet(sheetOf(withFilters)));
    const headings = pieces
      .flatMap((page, n) => page.map((piece) => ({ ...piece, n })))
      .filter((piece) => Math.abs(piece.size - textSize.heading) < 0.05)
      .sort((a, b) => a.n - b.n || b.baseline - a.baseline)
      .map((piece) => piece.str.trim());
    expect(headings.indexOf('Order sorting')).toBe(headings.indexOf('Plots') + 1);
  });

  it.each(['a4', 'letter'] as const)('keeps every piece of its text inside the margins on %s, in glyphs its fonts have', async (paper) => {
    for (const params of [withFilters, exampleDesign]) {
      const sheet = { ...sheetOf(params), paper };
      const { pieces } = await pdfText(await buildSheet(sheet, [orderSortingSection]));
      expectInsideMarginsInGlyphs(pieces.flat(), paper, 10);
    }
  });
});
