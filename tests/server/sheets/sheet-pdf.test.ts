import { beforeAll, describe, expect, it } from 'vitest';
import { describedSections, type DescribedField } from '../../../shared/design-fields';
import { evaluatePoint, prepareDesign, type WavelengthPoint } from '../../../features/solver/index';
import { buildCompareSheet, buildSheet } from '../../../server/sheets/build';
import type { SheetContext } from '../../../server/sheets/context';
import { compareSheetSections, sheetSections } from '../../../server/sheets/registry';
import { SheetWriter, textSize } from '../../../server/sheets/writer';
import { pdfText, printedNumber, type PdfText, type TextPiece } from './pdf-text';
import { sampleCompareSheet, sampleReview, sampleSheet } from './sample';

/**
 * The design sheet read back by another program (pdfjs-dist): every registered section is there,
 * the parameters are the version's and the performance figures the solver's at the precision
 * printed, and the file stays a sensible size.
 */

let sheet: SheetContext;
let bytes: Buffer;
let pdf: PdfText;

beforeAll(async () => {
  sheet = sampleSheet();
  bytes = await buildSheet(sheet);
  pdf = await pdfText(bytes);
}, 60_000);

/** A piece somewhere in the document, with its page, in reading order. */
type Placed = TextPiece & { page: number };
const inOrder = (doc: PdfText): Placed[] =>
  doc.pieces.flatMap((pieces, page) => pieces.map((piece) => ({ ...piece, page })).sort((a, b) => b.baseline - a.baseline || a.x - b.x));
/** A registered section's heading, looked up by its id so a reworded title needs no edit here. */
const titleOf = (id: string) => {
  const found = sheetSections.find((section) => section.id === id);
  if (!found) throw new Error(`no section "${id}" in the registry`);
  return found.title;
};
const near = (a: number, b: number, within = 1) => Math.abs(a - b) <= within;
const isHeading = (piece: TextPiece, title: string) => piece.str.trim() === title && near(piece.size, textSize.heading, 0.05);
const pieceText = (pieces: readonly TextPiece[]) => pieces.map((p) => `"${p.str}"@${p.x.toFixed(1)}–${p.right.toFixed(1)}`).join(' ');

/** Where a section's heading stands in the reading order (−1 when it is not printed as one). */
function headingIndex(doc: PdfText, title: string): number {
  return inOrder(doc).findIndex((piece) => isHeading(piece, title));
}

/** The pieces of a section: after its heading, up to the next registered section's heading. */
function sectionPieces(doc: PdfText, title: string): Placed[] {
  const all = inOrder(doc);
  const start = headingIndex(doc, title);
  expect(start, `heading "${title}"`).toBeGreaterThanOrEqual(0);
  const titles = new Set(sheetSections.map((s) => s.title));
  const end = all.findIndex((piece, i) => i > start && titles.has(piece.str.trim()) && near(piece.size, textSize.heading, 0.05));
  return all.slice(start + 1, end === -1 ? undefined : end);
}

/** |printed − expected| ≤ half a unit in the last printed digit. */
function expectPrinted(text: string | undefined, expected: number, what: string) {
  const printed = printedNumber(text ?? '');
  expect(printed, `${what}: no number in "${text}"`).not.toBeNull();
  expect(Math.abs(printed!.value - expected), `${what}: printed "${printed!.printed}", solver ${expected}`).toBeLessThanOrEqual(printed!.halfUnit * (1 + 1e-9));
}

/**
 * The characters a build laid out in a font that has no glyph for them (pdfkit prints those as
 * glyph 0, .notdef: an empty box on paper). pdfkit lays text out word by word and keeps each
 * word's layout per font for the document, so the writer's fonts are read as it is finished.
 */
async function missingGlyphs(build: () => Promise<Buffer>): Promise<string[]> {
  type Embedded = { name: string; font: { hasGlyphForCodePoint(cp: number): boolean }; layoutCache?: Record<string, unknown> };
  const finish = SheetWriter.prototype.finish;
  const fonts: Embedded[] = [];
  SheetWriter.prototype.finish = function (this: SheetWriter) {
    // The shipped fonts; pdfkit's own default (Helvetica, a standard font) is opened but never written with.
    const opened = Object.values((this.doc as unknown as { _fontFamilies: Record<string, Partial<Embedded>> })._fontFamilies);
    fonts.push(...opened.filter((font): font is Embedded => typeof font.font?.hasGlyphForCodePoint === 'function'));
    return finish.call(this);
  };
  try {
    await build();
  } finally {
    SheetWriter.prototype.finish = finish;
  }
  expect(fonts.length, 'fonts seen').toBeGreaterThan(0);
  expect(fonts.every((font) => font.layoutCache), 'pdfkit keeps each word\'s layout').toBe(true);
  const missing = new Set<string>();
  for (const font of fonts) {
    for (const word of Object.keys(font.layoutCache!)) {
      for (const char of word) {
        // Line breaks are measured with their words but never drawn.
        if (char === '\n' || char === '\r') continue;
        if (!font.font.hasGlyphForCodePoint(char.codePointAt(0)!)) {
          missing.add(`${font.name}: U+${char.codePointAt(0)!.toString(16).toUpperCase().padStart(4, '0')} in "${word}"`);
        }
      }
    }
  }
  return [...missing];
}

describe('printedNumber (the parser the checks below read figures with)', () => {
  it.each([
    { text: '0.2758', value: 0.2758, halfUnit: 0.00005 },
    { text: '\u221212\u202F350 nm', value: -12_350, halfUnit: 5 },
    { text: '2170', value: 2170, halfUnit: 5 },
    { text: '1.23×10⁻⁴', value: 1.23e-4, halfUnit: 0.005e-4 },
    { text: '30°', value: 30, halfUnit: 5 },
    { text: '0', value: 0, halfUnit: 0.5 },
  ])('reads "$text" as $value ± $halfUnit', ({ text, value, halfUnit }) => {
    const printed = printedNumber(text)!;
    expect(printed.value).toBeCloseTo(value, 12);
    expect(printed.halfUnit).toBeCloseTo(halfUnit, 12);
  });

  it('reads no number where there is none', () => {
    expect(printedNumber('none')).toBeNull();
    expect(printedNumber('—')).toBeNull();
  });
});

describe('design sheet PDF, read back with pdfjs-dist', () => {
  it('prints every registered section’s heading that applies to the design, in the registry’s order', () => {
    const positions = sheetSections.filter((section) => section.appliesTo?.(sheet) ?? true).map((section) => ({ title: section.title, at: headingIndex(pdf, section.title) }));
    expect(positions.filter((p) => p.at === -1).map((p) => p.title), 'sections without their heading').toEqual([]);
    const order = positions.map((p) => p.at);
    expect(order, 'headings in print order').toEqual([...order].sort((a, b) => a - b));
  });

  it('has a sane page count and size: 2–8 pages and under 400 KB for a typical version', () => {
    expect(pdf.pages.length).toBeGreaterThanOrEqual(2);
    expect(pdf.pages.length).toBeLessThanOrEqual(8);
    expect(bytes.length).toBeLessThan(400 * 1024);
    // Every page carries its number out of the total.
    pdf.pages.forEach((page, i) => expect(page).toContain(`Page ${i + 1} of ${pdf.pages.length}`));
  });

  it('lists every parameter of the version with the editor’s label, its value in full and its unit', () => {
    const pieces = sectionPieces(pdf, titleOf('parameters'));
    const valueOf = (field: DescribedField): TextPiece | undefined => {
      // A long label may wrap: its first line starts the row, and the value stands on that line.
      const label = pieces.find((p) => p.str.trim() === field.label || (field.label.startsWith(`${p.str.trim()} `) && p.str.trim().length >= 8));
      if (!label) return undefined;
      return pieces
        .filter((p) => p.page === label.page && near(p.baseline, label.baseline) && p.x > label.right)
        .sort((a, b) => a.x - b.x)[0];
    };
    const checked: string[] = [];
    for (const section of describedSections) {
      const values = sheet.params[section.id] as Record<string, unknown> | undefined;
      expect(values, `the sample sets ${section.id}`).toBeDefined();
      for (const field of section.fields) {
        const stored = values![field.key];
        if (stored === undefined) continue;
        const cell = valueOf(field);
        expect(cell, `value beside "${field.label}" in ${pieceText(pieces.slice(0, 80))}`).toBeDefined();
        const text = cell!.str.trim();
        if (field.kind === 'choice') {
          const options = field.options as Record<string, { label: string }>;
          expect(text, field.label).toBe(options[stored as string]!.label);
        } else {
          // An input is printed in full, as the editor shows it, not rounded like a result.
          expect(printedNumber(text)?.value, `${field.label}: "${text}"`).toBe(stored);
          if (field.kind === 'quantity' && field.unitLabel) {
            const unit = text.slice(printedNumber(text)!.printed.length).replace(/^[\s\u00A0\u202F]+/, '');
            expect(unit, `${field.label}'s unit`).toBe(field.unitLabel);
          }
        }
        checked.push(field.label);
      }
    }
    expect(checked.length).toBeGreaterThanOrEqual(15);
  });

  describe('performance table', () => {
    /** A row's cells by column header: a right-aligned cell ends where its header ends. */
    function performanceRow(label: string, nth = 0): Record<'λ' | 'Rotation' | 'RLD' | 'Bandpass' | 'R', string | undefined> {
      const pieces = sectionPieces(pdf, titleOf('performance'));
      const header = pieces.find((p) => p.str.trim() === 'Bandpass');
      expect(header, `a "Bandpass" column header in ${pieceText(pieces.slice(0, 40))}`).toBeDefined();
      const headerLine = pieces.filter((p) => p.page === header!.page && near(p.baseline, header!.baseline));
      const rowStart = pieces.filter((p) => p.str.trim() === label && p.page === header!.page && p.baseline < header!.baseline)[nth];
      expect(rowStart, `a row "${label}" (#${nth + 1})`).toBeDefined();
      const row = pieces.filter((p) => p.page === rowStart!.page && near(p.baseline, rowStart!.baseline));
      const cell = (name: string) => {
        const head = headerLine.find((p) => p.str.trim() === name);
        expect(head, `column "${name}" in ${pieceText(headerLine)}`).toBeDefined();
        return row.find((p) => near(p.right, head!.right, 1.5))?.str;
      };
      return { λ: cell('λ'), Rotation: cell('Rotation'), RLD: cell('RLD'), Bandpass: cell('Bandpass'), R: cell('R') };
    }

    const solverAt = (wavelengthNm: number): WavelengthPoint => evaluatePoint(prepareDesign(sheet.params), wavelengthNm);

    it('gives the solver’s bandpass and resolving power at the centre wavelength, at the printed precision', () => {
      const centreNm = (sheet.params.range.startNm + sheet.params.range.endNm) / 2;
      const point = solverAt(centreNm);
      expect(point.reachable).toBe(true);
      const row = performanceRow('Centre');
      expectPrinted(row.λ, centreNm, 'centre wavelength');
      expectPrinted(row.Bandpass, point.bandpassNm!, 'bandpass at the centre');
      expectPrinted(row.R, point.resolvingPower!, 'resolving power at the centre');
      expectPrinted(row.RLD, point.reciprocalDispersionNmPerMm!, 'reciprocal linear dispersion at the centre');
      expectPrinted(row.Rotation, point.gratingRotationDeg!, 'grating rotation at the centre');
    });

    it('prints a bandpass of RLD × slit width, as slit-limited bandpass is with equal slits at 1:1 (common practice)', () => {
      const { slits, layout } = sheet.params;
      expect(slits.entranceWidthUm).toBe(slits.exitWidthUm);
      expect(layout.collimatorFocalMm).toBe(layout.cameraFocalMm);
      const row = performanceRow('Centre');
      const rld = printedNumber(row.RLD!)!;
      const bandpass = printedNumber(row.Bandpass!)!;
      const slitMm = slits.exitWidthUm / 1000;
      expect(Math.abs(bandpass.value - rld.value * slitMm)).toBeLessThanOrEqual(bandpass.halfUnit + rld.halfUnit * slitMm);
    });

    it('lists a picked wavelength (`?at=`) with the solver’s figures there', () => {
      expect(sheet.performance.map((r) => r.label)).toContain('Picked');
      const row = performanceRow('Picked');
      const point = solverAt(589);
      expectPrinted(row.λ, 589, 'picked wavelength');
      expectPrinted(row.Bandpass, point.bandpassNm!, 'bandpass at 589 nm');
      expectPrinted(row.R, point.resolvingPower!, 'resolving power at 589 nm');
    });
  });

  it('has a glyph for every character it prints, in the font it prints it in', async () => {
    expect(await missingGlyphs(() => buildSheet(sampleSheet()))).toEqual([]);
    expect(await missingGlyphs(() => buildCompareSheet(sampleCompareSheet()))).toEqual([]);
    // …and sees one when a font lacks it: IBM Plex Mono has no narrow no-break space (U+202F).
    const mono = { id: 'mono', title: 'Mono', draw: (writer: SheetWriter) => void writer.use('mono', 9).doc.text('12\u202F300', 48, 100) };
    expect(await missingGlyphs(() => buildSheet(sampleSheet(), [mono]))).toEqual([expect.stringContaining('U+202F')]);
  });

  it('prints the link back to the version whole, on one line, in every page’s footer, for a real id and address', async () => {
    // A design id as the database makes them (a UUID) behind a deployment's address.
    const link = 'https://blazebook.example-lab.org/notebooks/3f6c2a9e-8b1d-4c7e-9a51-2d0e7b6c4f18/v/12';
    const long = await pdfText(await buildSheet(sampleSheet({ link })));
    // On one line: a link broken at one of the id's hyphens cannot be copied or followed whole.
    long.pages.forEach((page, i) => expect(page.split('\n').filter((line) => line.includes(link)), `page ${i + 1}: the link whole on one line`).not.toEqual([]));
  });

  it('prints text as it was written: an x between digits stays an x, in a link and in a note', async () => {
    // Inter's contextual alternates draw both the x of "6x8" and the × of "2×20" with one raised
    // multiplication glyph, which reads back as whichever character met it first: after a "2×20" a
    // share token holding "6x8" printed as a × and read back as a link that leads nowhere (a random
    // token did, about one run in ten).
    const link = 'http://blazebook.example.com/share/vnl2zdmaeu7y7iovzayrpdn7cjeag6x8jl3ryd7n';
    const written = 'A 2×20 mm slit, part 10x4-B, mask 2x20';
    const note = { id: 'note', title: 'Note', draw: (writer: SheetWriter) => void writer.use('regular', 9).doc.text(written, 48, 100) };
    const { text } = await pdfText(await buildSheet(sampleSheet({ link }), [note]));
    expect(text).toContain(link);
    expect(text).toContain(written);
  });

  it('through a share link, leaves out the team’s name and the review threads’ text', async () => {
    const shared = await pdfText(await buildSheet(sampleSheet({ audience: 'link', design: { ...sheet.design, teamName: null } })));
    expect(headingIndex(shared, titleOf('review'))).toBeGreaterThanOrEqual(0);
    expect(shared.text).not.toContain('Harbourview teaching lab');
    for (const thread of sampleReview().threads) {
      for (const remark of thread.remarks) expect(shared.text).not.toContain((remark.body ?? '').replace(/\*\*/g, '').slice(0, 30));
    }
    // …which the team's own sheet does print, so the check above can fail.
    expect(pdf.text).toContain('Harbourview teaching lab');
    expect(pdf.text.replace(/\s+/g, ' ')).toContain('Bandpass at 589 nm needs a second look');
  });
});

describe('compare sheet PDF, read back with pdfjs-dist', () => {
  it('prints every registered compare section’s heading, in order, and both version numbers', async () => {
    const compare = await pdfText(await buildCompareSheet(sampleCompareSheet()));
    const order = compareSheetSections.map((section) => {
      const at = inOrder(compare).findIndex((piece) => isHeading(piece, section.title));
      expect(at, `heading "${section.title}"`).toBeGreaterThanOrEqual(0);
      return at;
    });
    expect(order).toEqual([...order].sort((a, b) => a - b));
    expect(compare.text).toMatch(/v2/);
    expect(compare.text).toMatch(/v3/);
  });
});
