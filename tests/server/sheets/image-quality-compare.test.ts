import { describe, expect, it } from 'vitest';
import { exampleDesign, type Design } from '../../../shared/design';
import { traceDesign } from '../../../features/trace/index';
import { buildCompareSheet } from '../../../server/sheets/build';
import { compareSheetSections } from '../../../server/sheets/registry';
import { compareSpotsSection } from '../../../server/sheets/sections/image-quality-compare';
import { expectInsideMarginsInGlyphs } from './inside-margins';
import { pdfText, printedNumber } from './pdf-text';
import { sampleCompareSheet } from './sample';

/**
 * The compare sheet's spot diagrams read back through pdfjs-dist: each version's centre spot
 * figures are the engine's (traceDesign called here) at the printed precision, and the change
 * between them is printed in words.
 */

const plain = (text: string) => text.replace(/\s+/g, ' ').trim();

/** The example with its camera mirror nearer its axis (10° → 4°): less off-axis blur, so the spot should narrow. */
const nearerAxis: Design = { ...structuredClone(exampleDesign), layout: { ...exampleDesign.layout, cameraOffAxisDeg: 4 } };

async function sectionPdf(paper: 'a4' | 'letter' = 'a4') {
  return pdfText(await buildCompareSheet({ ...sampleCompareSheet(exampleDesign, nearerAxis), paper }, [compareSpotsSection]));
}

function expectAgrees(printed: string | undefined, expected: number, what: string): void {
  const read = printedNumber(printed ?? '');
  expect(read, `${what}: "${printed}"`).not.toBeNull();
  expect(Math.abs(read!.value - expected), `${what}: ${read!.printed} against ${expected}`).toBeLessThanOrEqual(read!.halfUnit * (1 + 1e-9));
}

describe('the compare sheet’s spot diagrams', () => {
  it('follows the sketches at one scale', () => {
    const ids = compareSheetSections.map((section) => section.id);
    expect(ids.indexOf('compare-spots')).toBe(ids.indexOf('compare-sketch') + 1);
  });

  it('prints each version’s centre spot figures as the trace gives them, and the change', async () => {
    const { text } = await sectionPdf();
    const flat = plain(text);
    expect(flat).toContain('Spot diagrams at the centre wavelength');
    expect(flat).toContain('v2 (before), 600 nm');
    expect(flat).toContain('v3 (after), 600 nm');
    const [before, after] = [exampleDesign, nearerAxis].map((design) => traceDesign(design).wavelengths.find((w) => w.role === 'centre')!);
    const figures = [...flat.matchAll(/RMS width (\S+) µm · traced FWHM (\S+) nm \(slit-limited (\S+) nm\)/g)];
    expect(figures).toHaveLength(2);
    for (const [i, w] of [before!, after!].entries()) {
      expectAgrees(figures[i]![1], w.rmsWidthMm * 1000, `v${i + 2} RMS width`);
      expectAgrees(figures[i]![2], w.tracedFwhmNm!, `v${i + 2} traced FWHM`);
      expectAgrees(figures[i]![3], w.slitLimitedFwhmNm, `v${i + 2} slit-limited FWHM`);
    }
    expect(flat).toMatch(/From v2 to v3: RMS width \S+ µm → \S+ µm \([−+±]\d+ %\); traced FWHM \S+ nm → \S+ nm \([−+±]\d+ %\)\./);
    // Four degrees off axis instead of ten: the camera's coma and astigmatism shrink with the angle
    // (Schroeder, Astronomical Optics, ch. 5; from memory), so the traced spot should not widen.
    expect(after!.rmsWidthMm).toBeLessThanOrEqual(before!.rmsWidthMm * 1.001);
  });

  it.each(['a4', 'letter'] as const)('keeps its text inside the margins on %s', async (paper) => {
    const pdf = await sectionPdf(paper);
    expectInsideMarginsInGlyphs(pdf.pieces.flat(), paper, 8);
  });
});
