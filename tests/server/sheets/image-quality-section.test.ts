import { describe, expect, it } from 'vitest';
import { exampleDesign } from '../../../shared/design';
import { traceDesign, traceWarnings, type TracedWavelength } from '../../../features/trace/index';
import { buildSheet } from '../../../server/sheets/build';
import { sheetSections } from '../../../server/sheets/registry';
import { imageQualitySection } from '../../../server/sheets/sections/image-quality';
import { expectInsideMarginsInGlyphs } from './inside-margins';
import { pdfText, printedNumber } from './pdf-text';
import { sampleSheet } from './sample';

/**
 * The design sheet's Image quality section read back through pdfjs-dist (not the pdfkit that
 * wrote it): a row per traced wavelength whose printed figures are the engine's own (traceDesign
 * called here as the section calls it) to the precision printed, a spot diagram's scale under each
 * reachable wavelength, and the trace's warnings in words.
 */

const plain = (text: string) => text.replace(/\s+/g, ' ').trim();

const ROLE_WORDS: Record<TracedWavelength['role'], string> = { start: 'start', centre: 'centre', end: 'end', asked: 'picked' };

async function sectionText(picked: number[], paper: 'a4' | 'letter' = 'a4') {
  const pdf = await pdfText(await buildSheet(sampleSheet({ picked, paper }), [imageQualitySection]));
  const lines = pdf.pages.flatMap((page) => page.split('\n')).map(plain);
  return { pdf, lines };
}

/** The printed figure agrees with `expected` to half a unit in its last printed digit. */
function expectPrinted(token: string | undefined, expected: number, what: string): void {
  const read = printedNumber(token ?? '');
  expect(read, `${what}: a number, got "${token}"`).not.toBeNull();
  expect(Math.abs(read!.value - expected), `${what}: ${read!.printed} against ${expected}`).toBeLessThanOrEqual(read!.halfUnit * (1 + 1e-9));
}

describe('the design sheet’s Image quality section', () => {
  it('is registered after the calibration lines, before the notes', () => {
    const ids = sheetSections.map((section) => section.id);
    expect(ids.indexOf('image-quality')).toBe(ids.indexOf('calibration-lines') + 1);
    expect(ids.indexOf('notes')).toBe(ids.indexOf('image-quality') + 1);
  });

  it('prints each traced wavelength’s figures as the trace gives them, at the printed precision', async () => {
    const { lines } = await sectionText([404.7]);
    expect(lines).toContain('Image quality');
    const report = traceDesign(exampleDesign, { atNm: [404.7] });
    // The range's start, centre and end (300, 600, 900 nm) and the picked 404.7 nm.
    expect(report.wavelengths.map((w) => w.wavelengthNm).sort((a, b) => a - b)).toEqual([300, 404.7, 600, 900]);
    for (const w of report.wavelengths) {
      expect(w.reachable, `${w.wavelengthNm} nm reachable`).toBe(true);
      const label = `${w.wavelengthNm} nm, ${ROLE_WORDS[w.role]}`;
      const row = lines.find((line) => line.startsWith(`${label} `) && /\d$/.test(line));
      expect(row, `a table row for ${label}`).toBeDefined();
      const cells = row!.slice(label.length).trim().split(' ');
      expect(cells, label).toHaveLength(5);
      expectPrinted(cells[0], w.rmsWidthMm * 1000, `${label} RMS width (µm)`);
      expectPrinted(cells[1], w.tracedFwhmNm!, `${label} traced FWHM (nm)`);
      expectPrinted(cells[2], w.slitLimitedFwhmNm, `${label} slit-limited FWHM (nm)`);
      expectPrinted(cells[3], w.curvatureSagittaMm * 1000, `${label} sagitta (µm)`);
      expectPrinted(cells[4], Math.abs(w.astigmatismMm), `${label} astigmatism (mm)`);
      // Three significant figures, as the workbench's card shows spot widths.
      expect(printedNumber(cells[0]!)!.printed.replace(/[^\d]/g, '').replace(/^0+/, '').length, `${label} RMS width digits`).toBeLessThanOrEqual(3);
    }
  });

  it('labels each diagram with its wavelength and draws a round scale under it', async () => {
    const { lines, pdf } = await sectionText([]);
    for (const label of ['300 nm, start', '600 nm, centre', '900 nm, end']) {
      expect(lines.some((line) => line.includes(label)), label).toBe(true);
    }
    // A scale bar of 1, 2 or 5 × 10ⁿ µm (or mm) under every diagram.
    const scales = pdf.pieces.flat().filter((piece) => /^[125]0*[\s\u00A0](µm|mm)$/.test(piece.str));
    expect(scales.length).toBe(3);
  });

  it('prints the trace’s warnings in its words, and says what the diagrams show', async () => {
    const { lines } = await sectionText([]);
    const text = lines.join(' ');
    const report = traceDesign(exampleDesign);
    const warnings = traceWarnings(report);
    // The example (f = 300 mm, 8° and 10° off axis, 100 µm slits) widens its line by well over
    // 10 %: the blur of a spherical mirror off axis is tens of µm here (Schroeder, Astronomical
    // Optics, ch. 5; from memory), so the warnings are there to print.
    expect(warnings.length).toBeGreaterThan(0);
    for (const warning of warnings) expect(text).toContain(plain(warning.message));
    expect(text).toContain(`${report.raysPerWavelength} rays per wavelength`);
    expect(text).toMatch(/exit slit \(100 µm wide\) shaded to the same scale/);
  });

  it('says a picked wavelength the mount cannot reach is out of reach instead of drawing it', async () => {
    const { lines } = await sectionText([5000]);
    expect(lines.some((line) => /^5000 nm, picked out of reach/.test(line))).toBe(true);
  });

  it.each(['a4', 'letter'] as const)('keeps every piece of its text inside the margins on %s, in glyphs its fonts have', async (paper) => {
    const { pdf } = await sectionText([250, 404.7, 435.8, 546.1, 577, 589, 2500, 5000], paper);
    expectInsideMarginsInGlyphs(pdf.pieces.flat(), paper, 40);
  });
});
