import { describe, expect, it } from 'vitest';
import { exampleDesign, type Design } from '../../../shared/design';
import { proposeOrderSortingPlan } from '../../../features/solver/order-sorting';
import { buildCompareSheet, buildSheet } from '../../../server/sheets/build';
import type { SheetContext } from '../../../server/sheets/context';
import { sheetSections } from '../../../server/sheets/registry';
import { requirementsSection } from '../../../server/sheets/sections/requirements';
import { textSize } from '../../../server/sheets/writer';
import { expectInsideMarginsInGlyphs } from './inside-margins';
import { pdfText } from './pdf-text';
import { sampleCompareSheet, sampleSheet, sampleVersion } from './sample';

/**
 * The design sheet's Requirements section read back through pdfjs-dist (not the pdfkit that
 * wrote it): one row per requirement with its result in words, the "n of m met" line, the
 * unknown one's reason, and no section at all for a design without requirements.
 */

const plain = (text: string) => text.replace(/\s+/g, ' ').trim();

/**
 * The example design (1200 grooves/mm, first order, 30° deviation, 300 mm focal lengths, 100 µm
 * slits) against limits chosen either side of its figures, each worked by hand:
 *
 * - Bandpass at 404.7 nm (Palmer & Loewen, Diffraction Grating Handbook, ch. 2 and 8):
 *   d = 10⁶/1200 = 833.33 nm; mλ = 2d sin φ cos(D/2) gives sin φ = 404.7 / (2 × 833.33 × cos 15°)
 *   = 0.25139, φ = 14.56°; β = φ − 15° = −0.44°, cos β ≈ 1.0000. RLD = d cos β / (m f) =
 *   833.33 / 300 = 2.778 nm/mm. The entrance image is 100 µm × cos α / cos β = 100 × cos 29.56° ≈
 *   87 µm, narrower than the 100 µm exit slit, so the bandpass is 0.1 mm × 2.778 nm/mm = 0.2778 nm:
 *   over a 0.25 nm limit by (0.2778 − 0.25) / 0.25 = 11 %. It fails.
 * - Focal length: 300 mm against 400 mm passes with (400 − 300) / 400 = 25 % to spare.
 * - One-shot coverage: 1024 pixels × 25 µm = 25.6 mm of detector × ≈ 2.8 nm/mm ≈ 71 nm, far short
 *   of the 600 nm range. It fails.
 * - Order overlap "filtered": the 200–1100 nm source puts order 2's λ/2 on every λ from 400 nm
 *   (Palmer & Loewen, ch. 2) and the design carries no filter, so it fails; with the proposed plan
 *   (features/solver/order-sorting.ts) it passes.
 */
const withRequirements: Design = {
  ...structuredClone(exampleDesign),
  requirements: {
    maxBandpassNm: 0.25,
    atWavelengthsNm: [404.7],
    maxFocalLengthMm: 400,
    oneShotCoverage: true,
    orderOverlap: 'filtered',
  },
};

function sheetOf(params: Design): SheetContext {
  return sampleSheet({ params, version: sampleVersion(params) });
}

async function sectionLines(params: Design): Promise<string[]> {
  const { pages } = await pdfText(await buildSheet(sheetOf(params), [requirementsSection]));
  return pages.flatMap((page) => page.split('\n')).map(plain);
}

describe('the design sheet’s Requirements section', () => {
  it('is listed after the plots and the order sorting, and before the trade study and the warnings', () => {
    const ids = sheetSections.map((section) => section.id);
    expect(ids.slice(ids.indexOf('plots'), ids.indexOf('warnings') + 1)).toEqual([
      'plots',
      'order-sorting',
      'requirements',
      'trade-study',
      'warnings',
    ]);
  });

  it('prints each requirement’s row with its result in words, limit, worst value, place and margin', async () => {
    const lines = await sectionLines(withRequirements);
    const rowOf = (name: string) => lines.find((line) => line.startsWith(`${name} `));
    expect(rowOf('Bandpass')).toBe('Bandpass Fail ≤ 0.25 nm 0.2778 nm 404.7 nm 11 % over');
    expect(rowOf('Focal length')).toBe('Focal length Pass ≤ 400 mm 300 mm design 25 % to spare');
    expect(rowOf('One-shot coverage')).toMatch(/^One-shot coverage Fail whole range at one setting Detector sees .* it misses/);
    expect(rowOf('Order overlap')).toMatch(/^Order overlap Fail other orders filtered /);
    const planned = await sectionLines({ ...withRequirements, filters: proposeOrderSortingPlan(withRequirements) });
    expect(planned.find((line) => line.startsWith('Order overlap '))).toMatch(/^Order overlap Pass other orders filtered/);
  });

  it('says how many are met and names the failing ones, in words', async () => {
    const lines = await sectionLines(withRequirements);
    expect(lines).toContain('1 of 4 met. Failing: bandpass, one-shot coverage, order overlap.');
    expect(lines).toContain('Order overlap Fail other orders filtered 3 804 nm —');
    // Pixels per bandpass needs a detector: without one it is not checked, and says why in its row.
    const noDetector = structuredClone(withRequirements);
    delete noDetector.detector;
    noDetector.requirements = { ...noDetector.requirements, minPixelsPerBandpass: 2 };
    delete noDetector.requirements.oneShotCoverage;
    const unknown = await sectionLines(noDetector);
    expect(unknown).toContain('1 of 4 met. Failing: bandpass, order overlap. 1 not checked (why, in its row).');
    expect(lines.some((line) => line.includes('checked at 404.7 nm'))).toBe(true);
  });

  it('prints its heading at the heading size in the whole sheet, before the trade study and the warnings', async () => {
    const { pieces } = await pdfText(await buildSheet(sheetOf(withRequirements)));
    const headings = pieces
      .flatMap((page, n) => page.map((piece) => ({ ...piece, n })))
      .filter((piece) => Math.abs(piece.size - textSize.heading) < 0.05)
      .sort((a, b) => a.n - b.n || b.baseline - a.baseline)
      .map((piece) => piece.str.trim());
    expect(headings.indexOf('Requirements')).toBeGreaterThan(-1);
    expect(headings.indexOf('Other wavelength selectors')).toBe(headings.indexOf('Requirements') + 1);
    expect(headings.indexOf('Warnings')).toBe(headings.indexOf('Requirements') + 2);
  });

  it.each(['a4', 'letter'] as const)('keeps every piece of its text inside the margins on %s, in glyphs its fonts have', async (paper) => {
    const sheet = { ...sheetOf(withRequirements), paper };
    const { pieces } = await pdfText(await buildSheet(sheet, [requirementsSection]));
    expectInsideMarginsInGlyphs(pieces.flat(), paper, 20);
  });

  it('is left out for a design without requirements, and for one holding only a wavelength list', async () => {
    const { text } = await pdfText(await buildSheet(sheetOf(exampleDesign)));
    expect(text).not.toMatch(/^Requirements$/m);
    expect(text).not.toContain(' met.');
    const listOnly = { ...structuredClone(exampleDesign), requirements: { atWavelengthsNm: [500] } };
    expect(await sectionLines(listOnly)).toEqual(expect.not.arrayContaining(['Requirements']));
    expect(requirementsSection.appliesTo(sheetOf(listOnly))).toBe(false);
  });
});

describe('the Requirements section’s bandpass basis', () => {
  it('prints the basis: slit-limited by default, traced when asked, beside the limit and in the scope line', async () => {
    // The scope line wraps: read the section as one run of words.
    const slitLines = await sectionLines(withRequirements);
    expect(slitLines.join(' ')).toContain('Bandpass basis: slit-limited, the closed-form FWHM of the slit images.');
    expect(slitLines).toContainEqual(expect.stringMatching(/^Bandpass Fail ≤ 0\.25 nm /));

    // A generous 10 nm limit so the section is drawn whatever the trace finds: only the words are checked here.
    const traced: Design = {
      ...structuredClone(withRequirements),
      requirements: { maxBandpassNm: 10, atWavelengthsNm: [404.7], bandpassBasis: 'traced' },
    };
    const lines = await sectionLines(traced);
    expect(lines).toContainEqual(expect.stringMatching(/^Bandpass \w+ ≤ 10 nm traced /));
    expect(lines.join(' ')).toContain("Bandpass basis: traced, the FWHM of the exact ray trace's line shape at 1500 rays per wavelength, at the listed wavelengths.");
  });
});

describe('the compare sheet with requirements', () => {
  it('lists the requirements under their own heading, the wavelength list as its items, and the met count with its change in words', async () => {
    const after: Design = {
      ...structuredClone(withRequirements),
      // 50 µm slits halve the bandpass to ≈ 0.139 nm, inside 0.25 nm: the bandpass now passes.
      slits: { entranceWidthUm: 50, exitWidthUm: 50, heightMm: 10 },
      requirements: { ...withRequirements.requirements, atWavelengthsNm: [404.7, 546.1] },
    };
    const { pages } = await pdfText(await buildCompareSheet(sampleCompareSheet(withRequirements, after)));
    const lines = pages.flatMap((page) => page.split('\n')).map(plain);
    expect(lines).toContain('Requirements met 1 of 4 met 2 of 4 met 1 more met; bandpass no longer fails');
    expect(lines).toContain('At wavelengths (nm) 404.7 404.7, 546.1 changed');
    expect(lines).toContain('Max bandpass (nm) 0.25 0.25');
    expect(lines).toContain('One-shot coverage yes yes');
    expect(lines).toContain('Order overlap filtered filtered');
  });

  it('prints neither the requirements row nor their heading when neither version states any', async () => {
    const { text } = await pdfText(await buildCompareSheet(sampleCompareSheet()));
    expect(text).not.toContain('Requirements');
  });
});
