import { describe, expect, it } from 'vitest';
import { exampleDesign, type Design } from '../../../shared/design';
import { buildSheet } from '../../../server/sheets/build';
import type { SheetContext } from '../../../server/sheets/context';
import { sheetSections } from '../../../server/sheets/registry';
import { tradeStudySection } from '../../../server/sheets/sections/trade-study';
import { textSize } from '../../../server/sheets/writer';
import { expectInsideMarginsInGlyphs } from './inside-margins';
import { pdfText } from './pdf-text';
import { sampleSheet, sampleVersion } from './sample';

/**
 * The design sheet's "Other wavelength selectors" section read back through pdfjs-dist (not the
 * pdfkit that wrote it): printed for every design, its figures table with the four selectors,
 * its verdicts in words when requirements are set (a line saying none are set otherwise), and
 * every piece of text inside the margins in glyphs its fonts have.
 */

const plain = (text: string) => text.replace(/\s+/g, ' ').trim();

/**
 * The example design (1200/mm, first order, 300 mm mirrors, 100 µm slits, 300–900 nm) against a
 * 0.5 nm bandpass and forbidden overlaps, worked by hand:
 * - grating bandpass ≈ 0.278 nm (RLD 2.778 nm/mm × 0.1 mm; Palmer & Loewen, ch. 2 and 8): passes;
 * - prism (50 mm fused silica, same mirrors and slits) 4.108 nm at 500 nm (Born & Wolf, §4.7, worked
 *   in tests/features/solver/trade-study.test.ts): fails;
 * - other orders: its 200–1100 nm source puts order 2 on 400–900 nm (Palmer & Loewen, ch. 2): the
 *   grating fails "forbidden"; a prism has one order and passes.
 */
const withRequirements: Design = {
  ...structuredClone(exampleDesign),
  requirements: { maxBandpassNm: 0.5, orderOverlap: 'forbidden', maxFootprintMm: { widthMm: 600, depthMm: 600 } },
};

function sheetOf(params: Design): SheetContext {
  return sampleSheet({ params, version: sampleVersion(params) });
}

async function sectionLines(params: Design): Promise<string[]> {
  const { pages } = await pdfText(await buildSheet(sheetOf(params), [tradeStudySection]));
  return pages.flatMap((page) => page.split('\n')).map(plain);
}

describe('the design sheet’s trade study section', () => {
  it('is registered after the requirements and printed for every design', () => {
    const ids = sheetSections.map((section) => section.id);
    expect(ids.indexOf('trade-study')).toBe(ids.indexOf('requirements') + 1);
    expect(tradeStudySection.appliesTo).toBeUndefined();
  });

  it('prints its heading at the heading size in the whole sheet of a design without requirements', async () => {
    const { pieces } = await pdfText(await buildSheet(sheetOf(exampleDesign)));
    const headings = pieces
      .flat()
      .filter((piece) => Math.abs(piece.size - textSize.heading) < 0.05)
      .map((piece) => piece.str.trim());
    expect(headings).toContain('Other wavelength selectors');
  });

  it('lists the four selectors and their figures side by side', async () => {
    const lines = await sectionLines(exampleDesign);
    expect(lines).toContain('Figure Grating Prism Interference filter Coloured glass');
    // Interference filter: R = m × finesse = π√0.95/0.05 = 61.24 → "61.2" (Hecht, Optics, §9.6);
    // coloured glass: λ/100 nm from 3 to 9 over 300–900 nm.
    expect(lines.find((line) => line.startsWith('Resolving power'))).toMatch(/ 61\.2 3–9$/);
    // Grating: blaze peak 1 × 0.9 coating × 0.9² mirrors = 0.729 → "≈ 73 %" (aluminium at 90 %, common practice).
    expect(lines.find((line) => line.startsWith('Peak transmission'))).toMatch(/^Peak transmission \(estimate\) ≈ 73 %/);
    // 600 nm of range / 100 nm glasses = 6.
    expect(lines.some((line) => line.includes('fixed: 6 glasses'))).toBe(true);
  });

  it('says no requirements are set when there are none, and states its defaults', async () => {
    const text = (await sectionLines(exampleDesign)).join(' ');
    expect(text).toContain('No requirements are set');
    expect(text).toContain('Defaults used.');
    expect(text).toContain('Malitson');
    expect(text).toContain('common practice');
  });

  it('gives each selector a verdict in words per requirement, under its own column', async () => {
    const { pieces } = await pdfText(await buildSheet(sheetOf(withRequirements), [tradeStudySection]));
    const all = pieces.flat();
    // The verdict table's header is the second "Requirement … Coloured glass" header row on the page.
    const requirementHeader = all.find((piece) => piece.str === 'Requirement')!;
    expect(requirementHeader).toBeDefined();
    const headers = all
      .filter((piece) => ['Grating', 'Prism', 'Interference filter', 'Coloured glass'].includes(piece.str))
      .filter((piece) => Math.abs(piece.baseline - requirementHeader.baseline) < 1)
      .sort((a, b) => a.x - b.x);
    expect(headers.map((h) => h.str)).toEqual(['Grating', 'Prism', 'Interference filter', 'Coloured glass']);
    /** The column a cell's first piece sits under: the last header starting at or left of it. */
    const columnOf = (start: string) => {
      const piece = all.find((p) => p.str.startsWith(start) && p.baseline < requirementHeader.baseline);
      expect(piece, start).toBeDefined();
      return [...headers].reverse().find((h) => h.x <= piece!.x + 0.5)?.str;
    };
    expect(columnOf('Pass: bandpass')).toBe('Grating');
    expect(columnOf('Fail: bandpass 16.06')).toBe('Prism');
    // Other orders from a 200–1100 nm source: order 2 brings 200–450 nm onto 400–900 nm; the
    // sweep's first point past 400 nm is 402 nm (Palmer & Loewen, ch. 2).
    expect(columnOf('Fail: other orders land')).toBe('Grating');
    expect(columnOf('Pass: a prism has a')).toBe('Prism');
    expect(columnOf('Pass: absorption has no')).toBe('Coloured glass');
    expect(columnOf('Fail: one glass spans')).toBe('Coloured glass');
    const text = all.map((p) => p.str).join(' ');
    expect(text).toContain('on 402–900 nm');
    // The footprint is judged from the sketch's outline for the grating, so it is not "not checked".
    expect(columnOf('Pass: outline')).toBe('Grating');
  });

  it.each(['a4', 'letter'] as const)('keeps every piece of its text inside the margins on %s, in glyphs its fonts have', async (paper) => {
    const sheet = { ...sheetOf(withRequirements), paper };
    const { pieces } = await pdfText(await buildSheet(sheet, [tradeStudySection]));
    expectInsideMarginsInGlyphs(pieces.flat(), paper, 40);
  });
});
