import { describe, expect, it } from 'vitest';
import type { DesignCurve } from '../../../shared/curves';
import { exampleDesign, type Design } from '../../../shared/design';
import { cautionClosingLine } from '../../../features/safety/cautions';
import { buildSheet } from '../../../server/sheets/build';
import type { SheetContext } from '../../../server/sheets/context';
import { sheetSections } from '../../../server/sheets/registry';
import { calibrationLinesSection } from '../../../server/sheets/sections/calibration-lines';
import { textSize } from '../../../server/sheets/writer';
import { expectInsideMarginsInGlyphs } from './inside-margins';
import { pdfText, printedNumber } from './pdf-text';
import { sampleSheet, sampleVersion } from './sample';

/**
 * The design sheet's Calibration lines section read back through pdfjs-dist. Line wavelengths are
 * NIST ASD air values (Na I D2 588.9950 nm and D1 589.5924 nm, Hg I 253.652 nm); where a line
 * lands in another order comes from the grating equation, mλ = m′λ′ (Palmer & Loewen,
 * Diffraction Grating Handbook, ch. 2).
 */

const plain = (text: string) => text.replace(/\s+/g, ' ').trim();

const ranged = (startNm: number, endNm: number, changes: Partial<Design> = {}): Design => ({
  ...structuredClone(exampleDesign),
  range: { startNm, endNm },
  ...changes,
});

/** 580–600 nm: the sodium D pair, 0.5974 nm apart, and no mercury line (Hg 579.0663 lies just below). */
const sodium = ranged(580, 600);
/** 500–520 nm with the source from 250 nm: Hg 253.652 nm comes through the 2nd order at 2 × 253.652 = 507.304 nm. */
const ghostly = ranged(500, 520, { source: { minNm: 250, maxNm: 1100 } });

function sheetOf(params: Design): SheetContext {
  return sampleSheet({ params, version: sampleVersion(params) });
}

async function sectionLines(params: Design): Promise<string[]> {
  const { pages } = await pdfText(await buildSheet(sheetOf(params), [calibrationLinesSection]));
  return pages.flatMap((page) => page.split('\n')).map(plain);
}

describe('the design sheet’s Calibration lines section', () => {
  it('is listed after the light budget', () => {
    const ids = sheetSections.map((section) => section.id);
    expect(ids.indexOf('calibration-lines')).toBe(ids.indexOf('light-budget') + 1);
  });

  it('applies to a range with a lamp line, or one a lamp line reaches through another order, and to no other', () => {
    expect(calibrationLinesSection.appliesTo(sheetOf(sodium))).toBe(true);
    expect(calibrationLinesSection.appliesTo(sheetOf(ghostly))).toBe(true);
    // The built-in lines stop near 1000 nm, and a source of 1500–1600 nm sends none through another order.
    const infrared = ranged(1500, 1600, { source: { minNm: 1500, maxNm: 1600 } });
    expect(calibrationLinesSection.appliesTo(sheetOf(infrared))).toBe(false);
  });

  it('lists the sodium D lines in a 580–600 nm design with their detector pixel, and resolves them at a 0.28 nm bandpass', async () => {
    const lines = await sectionLines(sodium);
    const d2 = lines.find((line) => line.startsWith('Na 588.995 nm '));
    const d1 = lines.find((line) => line.startsWith('Na 589.5924 nm '));
    expect(d2).toMatch(/^Na 588\.995 nm [\d.]+ nm [\d.]+ strong$/);
    expect(d1).toMatch(/^Na 589\.5924 nm [\d.]+ nm [\d.]+ strong$/);
    // D1 lies on the longer side, so at a larger pixel.
    const pixel = (line: string) => Number(line.split(' ').at(-2));
    expect(pixel(d1!)).toBeGreaterThan(pixel(d2!));
    // 100 µm slits: bandpass ≈ 2.7 nm/mm × 0.1 mm ≈ 0.27 nm < 0.5974 nm, so the pair is resolved.
    expect(lines.some((line) => line.startsWith('Na 588.995 nm Na 589.5924 nm'))).toBe(false);
    const pairs = lines.find((line) => / neighbouring pairs are resolved\.$/.test(line));
    const [resolved, total] = pairs!.match(/\d+/g)!.map(Number);
    expect(resolved).toBe(total);
    // No mercury line here: no mercury caution.
    expect(lines).not.toContain('Mercury lamp');
  });

  it('names the sodium pair unresolved once the slits pass more than its 0.5974 nm separation', async () => {
    // 300 µm slits: ≈ 2.7 nm/mm × 0.3 mm ≈ 0.8 nm bandpass.
    const wide = { ...sodium, slits: { entranceWidthUm: 300, exitWidthUm: 300, heightMm: 10 } };
    const lines = await sectionLines(wide);
    const row = lines.find((line) => line.startsWith('Na 588.995 nm Na 589.5924 nm'));
    expect(row).toBeDefined();
    expect(printedNumber(row!.split(' ')[6]!)?.value).toBeCloseTo(589.5924 - 588.995, 4);
  });

  it('shows the Hg 253.652 nm line as a ghost at 507.304 nm, unblocked without filters and blocked by a 400 nm long-pass', async () => {
    const lines = await sectionLines(ghostly);
    expect(lines).toContain('Hg 253.652 nm 2 507.304 nm not blocked');
    // A long-pass filter's ramp foot at 395 nm blocks 253.652 nm (shared/filters.ts ramp model).
    const filtered = { ...ghostly, filters: [{ kind: 'long-pass' as const, cutOnNm: 400, inFromNm: 500, inToNm: 520, edgeWidthNm: 10 }] };
    expect(await sectionLines(filtered)).toContain('Hg 253.652 nm 2 507.304 nm blocked by filter 1');
  });

  it('converts a vacuum line list to air and names it', async () => {
    // Vacuum 510 nm: standard air's n − 1 ≈ 2.78×10⁻⁴ there (Peck & Reeder 1972, from memory), so ≈ 509.858 nm in air.
    const list: DesignCurve = {
      kind: 'line-list',
      name: 'Lab neon lamp',
      checksum: 'b'.repeat(64),
      medium: 'vacuum',
      wavelengthsNm: [510, 2000],
      values: [1, 1],
    };
    const lines = await sectionLines(ranged(505, 515, { curves: [list] }));
    const row = lines.find((line) => line.startsWith('Lab neon lamp '));
    expect(row).toMatch(/ 510 nm in vacuum$/);
    const air = printedNumber(row!.replace('Lab neon lamp ', '').split(' ')[0]!);
    expect(Math.abs(air!.value - 509.858)).toBeLessThan(0.002);
    expect(lines.some((line) => line.includes('“Lab neon lamp” (converted from vacuum)'))).toBe(true);
  });

  it('keeps its tables bounded, saying how many more there are, and gives the coverage and the cubic’s residual', async () => {
    const lines = await sectionLines(exampleDesign);
    const inRange = lines.find((line) => /^In the range: \d+ lines$/.test(line));
    const total = Number(inRange!.match(/\d+/)![0]);
    expect(total).toBeGreaterThan(30);
    expect(lines).toContain(`… and ${total - 30} more lines (the app lists them all).`);
    const text = lines.join(' ');
    expect(text).toMatch(/\d+ lines land on the detector, from pixel [\d.]+ to [\d.]+: a span of /);
    expect(text).toContain('A cubic wavelength(pixel) fitted to the design’s own dispersion across the detector is off by at most');
  });

  it('gives the mercury lamp’s cautions (UV-C, high voltage, breakage) from the cautions module when Hg lines are listed', async () => {
    const text = (await sectionLines(ranged(540, 560))).join(' ');
    expect(text).toContain('Mercury lamp');
    expect(text).toContain('Ultraviolet below 300 nm');
    expect(text).toContain('High-voltage lamp supplies');
    expect(text).toContain('Mercury lamp breakage');
    expect(text).toContain(cautionClosingLine);
  });

  it('prints its heading at the heading size in the whole sheet, after the light budget', async () => {
    const { pieces } = await pdfText(await buildSheet(sheetOf(sodium)));
    const headings = pieces
      .flatMap((page, n) => page.map((piece) => ({ ...piece, n })))
      .filter((piece) => Math.abs(piece.size - textSize.heading) < 0.05)
      .sort((a, b) => a.n - b.n || b.baseline - a.baseline)
      .map((piece) => piece.str.trim());
    expect(headings.indexOf('Calibration lines')).toBe(headings.indexOf('Light budget') + 1);
  });

  it.each(['a4', 'letter'] as const)('keeps every piece of its text inside the margins on %s, in glyphs its fonts have', async (paper) => {
    for (const params of [exampleDesign, ghostly, ranged(540, 560)]) {
      const sheet = { ...sheetOf(params), paper };
      const { pieces } = await pdfText(await buildSheet(sheet, [calibrationLinesSection]));
      expectInsideMarginsInGlyphs(pieces.flat(), paper, 20);
    }
  });
});
