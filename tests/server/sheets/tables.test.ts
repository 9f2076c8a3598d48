import { getDocument } from 'pdfjs-dist/legacy/build/pdf.mjs';
import type { TextItem } from 'pdfjs-dist/types/src/display/api';
import { describe, expect, it } from 'vitest';
import { exampleDesign, type Design } from '../../../shared/design';
import { describedFields, layoutKindOptions } from '../../../shared/design-fields';
import { formatNumber, formatQuantity } from '../../../shared/format';
import type { Paper } from '../../../shared/sheets';
import { buildSheet } from '../../../server/sheets/build';
import type { SheetContext } from '../../../server/sheets/context';
import { margins, paperPt } from '../../../server/sheets/writer';
import type { SheetSection } from '../../../server/sheets/section';
import { parametersSection } from '../../../server/sheets/sections/parameters';
import { performanceSection } from '../../../server/sheets/sections/performance';
import { titleSection } from '../../../server/sheets/sections/title';
import { warningsSection } from '../../../server/sheets/sections/warnings';
import { overlapsText } from '../../../server/sheets/sheet-text';
import { pdfText } from './pdf-text';
import { sampleReview, sampleSheet, sampleVersion } from './sample';

/**
 * The sheet's title block, parameter table, performance table and warnings, read back from the
 * PDF through pdfjs-dist (not the pdfkit that wrote it). Expected words come from the editor's
 * field descriptions and the design, and expected figures from the grating equation worked here,
 * never from the sections' own output.
 */

/** Every kind of space (no-break, narrow no-break) read as one plain space. */
const plain = (text: string) => text.replace(/\s+/g, ' ').trim();
/** Text with no spaces at all: a sentence the page wrapped (or hyphen-broke) reads the same. */
const squeezed = (text: string) => text.replace(/\s+/g, '');

async function linesOf(sheet: SheetContext, sections: readonly SheetSection[]): Promise<string[]> {
  const { pages } = await pdfText(await buildSheet(sheet, sections));
  return pages.flatMap((page) => page.split('\n')).map(plain);
}

function lineWith(lines: readonly string[], ...parts: string[]): string | undefined {
  return lines.find((line) => parts.every((part) => line.includes(plain(part))));
}

/** The design with the optional source, detector and blaze wavelength left out. */
function bareDesign(): Design {
  const { source: _source, detector: _detector, ...rest } = structuredClone(exampleDesign);
  const { blazeWavelengthNm: _blaze, ...grating } = rest.grating;
  return { ...rest, grating };
}

function sheetOf(params: Design, overrides: Partial<Parameters<typeof sampleSheet>[0]> = {}): SheetContext {
  return sampleSheet({ params, version: sampleVersion(params), ...overrides });
}

/** The value the editor shows for a stored field, worked from the field's description. */
function expectedValue(path: string, design: Design): string {
  const field = describedFields.find((f) => f.path === path)!;
  const value = (design[field.section] as Record<string, unknown> | undefined)?.[field.key];
  if (value === undefined) return 'Not set';
  if (field.kind === 'choice') return layoutKindOptions.find((option) => option.value === value)!.label;
  return field.kind === 'quantity' ? formatQuantity(value as number, field.unitLabel, 12) : formatNumber(value as number, 12);
}

describe('parameters section', () => {
  it.each([
    { name: 'the sample design', design: exampleDesign },
    { name: 'a design without source, detector or blaze', design: bareDesign() },
  ])('prints every field of $name with its editor label and value on one line', async ({ design }) => {
    const lines = await linesOf(sheetOf(design), [parametersSection]);
    for (const field of describedFields) {
      const sectionSet = design[field.section] !== undefined;
      if (!sectionSet) continue;
      expect(lineWith(lines, `${field.label} ${expectedValue(field.path, design)}`), field.path).toBeDefined();
    }
  });

  it('says "Not set" for the optional parts a design leaves out', async () => {
    const lines = await linesOf(sheetOf(bareDesign()), [parametersSection]);
    expect(lineWith(lines, 'Light source Not set')).toBeDefined();
    expect(lineWith(lines, 'Detector Not set')).toBeDefined();
    expect(lineWith(lines, 'Blaze wavelength (first-order Littrow) Not set')).toBeDefined();
    // No pixel pitch row without a detector.
    expect(lineWith(lines, 'Pixel pitch')).toBeUndefined();
  });

  it('writes a changed slit as the editor shows it (µm, unbroken) and a negative order with a true minus', async () => {
    const design = structuredClone(exampleDesign);
    design.slits.exitWidthUm = 62.5;
    design.grating.order = -1;
    const lines = await linesOf(sheetOf(design), [parametersSection]);
    expect(lineWith(lines, 'Exit slit width 62.5 µm')).toBeDefined();
    expect(lineWith(lines, 'Diffraction order \u22121')).toBeDefined();
  });
});

describe('title section', () => {
  it('names the design, version, author, saved time (UTC) and team', async () => {
    const lines = await linesOf(sampleSheet(), [titleSection]);
    expect(lines).toContain('Design sheet');
    expect(lines).toContain('Teaching bench monochromator');
    expect(lineWith(lines, 'Version 3')).toBeDefined();
    expect(lineWith(lines, 'Version message Narrower exit slit for the sodium doublet')).toBeDefined();
    expect(lineWith(lines, 'Author Mira Okafor')).toBeDefined();
    // createdAt 2026-11-28T09:30:00Z, read in UTC whatever the machine's zone.
    expect(lineWith(lines, 'Saved 28 Nov 2026, 09:30 UTC')).toBeDefined();
    expect(lineWith(lines, 'Team Harbourview teaching lab')).toBeDefined();
    expect(lineWith(lines, 'Czerny–Turner mount', '1200 grooves/mm', '300–900 nm')).toBeDefined();
  });

  it.each([
    {
      name: 'a clone',
      design: { clonedFrom: { designId: 'nb_base', title: 'Lab baseline', version: 2 }, importedAt: null },
      origin: 'Origin Cloned from “Lab baseline” v2',
    },
    {
      name: 'an import',
      // Late on 14 March in UTC: the sheet names the UTC day.
      design: { clonedFrom: null, importedAt: '2026-03-14T23:30:00.000Z' },
      origin: 'Origin Imported from a file on 14 Mar 2026',
    },
    { name: 'a design made here', design: { clonedFrom: null, importedAt: null }, origin: 'Origin Made here' },
  ])('says where $name came from', async ({ design, origin }) => {
    const base = sampleSheet();
    const lines = await linesOf({ ...base, design: { ...base.design, ...design } }, [titleSection]);
    expect(lineWith(lines, origin)).toBeDefined();
  });

  it('tells a share link holder neither the team nor the origin nor the baseline', async () => {
    const base = sampleSheet();
    const sheet: SheetContext = {
      ...base,
      audience: 'link',
      design: { ...base.design, teamName: null, clonedFrom: null, importedAt: null, isBaseline: null },
    };
    const lines = await linesOf(sheet, [titleSection]);
    expect(lineWith(lines, 'Team Shared read-only link')).toBeDefined();
    expect(lineWith(lines, 'Origin Not shown through a share link')).toBeDefined();
    expect(lineWith(lines, 'Baseline Not shown through a share link')).toBeDefined();
    expect(lineWith(lines, 'Made here')).toBeUndefined();
    expect(lineWith(lines, 'Harbourview')).toBeUndefined();
  });

  it.each([
    { isBaseline: true, words: 'Baseline This version is the design’s baseline' },
    { isBaseline: false, words: 'Baseline This version is not the design’s baseline' },
  ])('flags the baseline ($isBaseline)', async ({ isBaseline, words }) => {
    const base = sampleSheet();
    const lines = await linesOf({ ...base, design: { ...base.design, isBaseline } }, [titleSection]);
    expect(lineWith(lines, words)).toBeDefined();
  });

  it('gives the review state, who was asked, each decision with its day, and the open threads', async () => {
    const lines = await linesOf(sampleSheet(), [titleSection]);
    expect(lineWith(lines, 'Review Signed off with remarks')).toBeDefined();
    // The sample's request: due 2026-12-04, answered 2026-11-30T10:00Z.
    expect(lineWith(lines, 'Reviewers asked Tomas Lindqvist, due 4 Dec 2026 — answered 30 Nov 2026')).toBeDefined();
    expect(lineWith(lines, 'Decisions Signed off with remarks by Tomas Lindqvist on 30 Nov 2026')).toBeDefined();
    // Two open threads: one on v3 itself, one carried over from v2.
    expect(lineWith(lines, 'Open review threads 2 (1 carried over from earlier versions)')).toBeDefined();
  });

  it('reads a waiting request, no decision and resolved threads as such', async () => {
    const review = sampleReview();
    review.state = 'requested';
    review.decisions = [];
    review.requests = review.requests.map((request) => ({ ...request, answeredAt: null }));
    review.threads = review.threads.map((thread) => ({ ...thread, status: 'resolved' as const }));
    const lines = await linesOf(sampleSheet({ review }), [titleSection]);
    expect(lineWith(lines, 'Review Review requested')).toBeDefined();
    expect(lineWith(lines, 'Tomas Lindqvist, due 4 Dec 2026 — waiting')).toBeDefined();
    expect(lineWith(lines, 'Decisions None yet')).toBeDefined();
    expect(lineWith(lines, 'Open review threads None')).toBeDefined();
  });

  it('says "Not reviewed" when the version has no review at all', async () => {
    const lines = await linesOf(sampleSheet({ review: null }), [titleSection]);
    expect(lineWith(lines, 'Review Not reviewed')).toBeDefined();
  });
});

describe('performance section', () => {
  /**
   * The sample design at its centre, 600 nm, worked by hand from the constant-deviation grating
   * equation mλ = 2d cos K sin φ (Palmer & Loewen, Diffraction Grating Handbook, ch. 2; from
   * memory): d = 1e6/1200 nm, K = 15°, α = φ + K, β = φ − K, RLD = d cos β / (|m| f_cam). With
   * equal 100 µm slits the entrance image (magnification cos α / cos β < 1) is narrower than the
   * exit slit, so the trapezoid's FWHM is the exit slit's width times RLD (common practice); R
   * adds the diffraction limit λ/(|m|N) in quadrature (the solver's stated model).
   */
  function centreByHand() {
    const d = 1e6 / 1200;
    const K = (15 * Math.PI) / 180;
    const lambda = 600;
    const phi = Math.asin(lambda / (2 * d * Math.cos(K)));
    const beta = phi - K;
    const rld = (d * Math.cos(beta)) / 300;
    const bandpass = rld * 0.1;
    const limit = lambda / (1 * 1200 * 50);
    return {
      rotationDeg: (phi * 180) / Math.PI,
      rld,
      bandpass,
      resolvingPower: lambda / Math.hypot(bandpass, limit),
      // 25 µm pixels.
      pixelsPerBandpass: bandpass / (rld * 0.025),
    };
  }

  /** A printed figure back to a number (U+2212 minus, U+202F groups). */
  const read = (cell: string) => Number(cell.replace('\u2212', '-').replace(/\s/g, ''));
  /** `value` rounded to as many significant figures as `printed` shows. */
  const atPrecision = (value: number, printed: string) => {
    const digits = printed.replace(/^[^1-9]*/, '').replace(/[^0-9]/g, '').replace(/0+$/, '').length;
    return Number(value.toPrecision(Math.max(digits, 1)));
  };

  it('prints the centre row as the grating equation gives it', async () => {
    const lines = await linesOf(sampleSheet(), [performanceSection]);
    const centre = lineWith(lines, 'Centre 600 ');
    expect(centre).toBeDefined();
    // Point, λ, rotation, RLD, bandpass, R, efficiency, then the other orders.
    const cells = centre!.replace(/^Centre /, '').split(' ');
    const [, rotation, rld, bandpass, resolvingPower] = cells as [string, string, string, string, string];
    const hand = centreByHand();
    expect(read(rotation)).toBe(atPrecision(hand.rotationDeg, rotation));
    expect(read(rld)).toBe(atPrecision(hand.rld, rld));
    expect(read(bandpass)).toBe(atPrecision(hand.bandpass, bandpass));
    expect(read(resolvingPower)).toBe(atPrecision(hand.resolvingPower, resolvingPower));
    // At least four figures for the bandpass and three for R, so the check above means something.
    expect(bandpass.replace(/^0\.?0*/, '').length).toBeGreaterThanOrEqual(4);
    expect(resolvingPower.replace(/\D/g, '').length).toBeGreaterThanOrEqual(3);
    // Source 200–1100 nm: orders 2 and 3 put 300 nm and 200 nm on 600 nm (mλ/n).
    expect(centre).toContain('m=2: 300 nm, m=3: 200 nm');
    expect(read(centre!.split(' ').at(-1)!)).toBe(atPrecision(hand.pixelsPerBandpass, centre!.split(' ').at(-1)!));
  });

  it('lists start, centre, end and each picked wavelength in that order', async () => {
    const lines = await linesOf(sampleSheet({ picked: [450, 589] }), [performanceSection]);
    const order = ['Range start 300', 'Centre 600', 'Range end 900', 'Picked 450', 'Picked 589'].map((row) =>
      lines.findIndex((line) => line.startsWith(row)),
    );
    expect(order.every((at) => at >= 0)).toBe(true);
    expect([...order].sort((a, b) => a - b)).toEqual(order);
  });

  it('gives an unreachable wavelength its reason across the row instead of numbers', async () => {
    // mλ ≤ 2d cos K = 2 × 833.3 × cos 15° ≈ 1610 nm in this mount (grating equation, as above).
    const sheet = sampleSheet({ picked: [2000] });
    const lines = await linesOf(sheet, [performanceSection]);
    expect(lineWith(lines, 'Picked 2000 Cannot be reached:')).toBeDefined();
    const text = squeezed(lines.join(' '));
    expect(text).toContain(squeezed(`Cannot be reached: ${sheet.performance.at(-1)!.point.reason!}`));
    expect(text).toContain('(1610nm');
  });

  it('leaves pixels per bandpass out without a detector and says why; no blaze reads as a dash with a note', async () => {
    const lines = await linesOf(sheetOf(bareDesign()), [performanceSection]);
    expect(lineWith(lines, 'Pixels per')).toBeUndefined();
    expect(squeezed(lines.join(' '))).toContain(squeezed('No detector is set (a scanning monochromator), so pixels per bandpass does not apply.'));
    expect(squeezed(lines.join(' '))).toContain(squeezed('No blaze wavelength is set, so there is no efficiency estimate.'));
    expect(lineWith(lines, 'Centre 600', '—')).toBeDefined();
  });
});

describe('overlapping orders in a cell', () => {
  it('names the orders nearest the working one (the hardest to filter out) and counts the rest', () => {
    // Order 4 at 600 nm: order n puts 4 × 600 / n nm on the same angle (mλ = nλ').
    const overlaps = [1, 2, 3, 5, 6, 7, 8].map((n) => ({ order: n, wavelengthNm: 2400 / n, blocked: false }));
    const text = plain(overlapsText({ overlaps, overlapCount: 9 }, 4));
    expect(text).toBe('m=2: 1200 nm, m=3: 800 nm, m=5: 480 nm, m=6: 400 nm, +5 more');
    expect(overlapsText({ overlaps: [], overlapCount: 0 }, 1)).toBe('none');
  });
});

describe('warnings section', () => {
  it('lists every warning of the sweep in the solver’s words', async () => {
    const sheet = sampleSheet();
    expect(sheet.evaluation.warnings.length).toBeGreaterThan(0);
    const text = squeezed((await linesOf(sheet, [warningsSection])).join(' '));
    for (const warning of sheet.evaluation.warnings) expect(text).toContain(squeezed(warning.message));
    expect(text).not.toContain(squeezed('None: the solver'));
  });

  it('says None when the solver found nothing', async () => {
    // A coarse grating (λ/d < 0.2 across the range), blazed inside it, no source beyond the range's
    // octave and no detector: nothing for the solver to flag.
    const design: Design = {
      ...bareDesign(),
      grating: { grooveDensityPerMm: 150, order: 1, blazeWavelengthNm: 700, ruledWidthMm: 50, ruledHeightMm: 50 },
      range: { startNm: 500, endNm: 900 },
    };
    const sheet = sheetOf(design);
    expect(sheet.evaluation.warnings).toEqual([]);
    const lines = await linesOf(sheet, [warningsSection]);
    expect(lines).toContain('Warnings');
    expect(lineWith(lines, 'None: the solver found nothing to warn about across the range.')).toBeDefined();
  });
});

/** Every run of text on every page, with its left and right ends in points. */
async function textExtents(bytes: Uint8Array) {
  const task = getDocument({ data: new Uint8Array(bytes), useSystemFonts: false, isEvalSupported: false, verbosity: 0 });
  const doc = await task.promise;
  try {
    const runs: { page: number; str: string; left: number; right: number; width: number; height: number }[] = [];
    for (let n = 1; n <= doc.numPages; n += 1) {
      const page = await doc.getPage(n);
      const { width, height } = page.getViewport({ scale: 1 });
      const content = await page.getTextContent();
      for (const item of content.items) {
        if (!('str' in item) || (item as TextItem).str.trim() === '') continue;
        const run = item as TextItem;
        runs.push({ page: n, str: run.str, left: run.transform[4] as number, right: (run.transform[4] as number) + run.width, width, height });
      }
    }
    return runs;
  } finally {
    await task.destroy();
  }
}

describe('both papers', () => {
  it.each(['a4', 'letter'] satisfies Paper[])('keeps all four sections inside the side margins on %s', async (paper) => {
    const sheet = { ...sampleSheet({ picked: [589, 2000] }), paper };
    const bytes = await buildSheet(sheet, [titleSection, parametersSection, performanceSection, warningsSection]);
    const runs = await textExtents(bytes);
    expect(runs.length).toBeGreaterThan(100);
    const size = paperPt[paper];
    for (const run of runs) {
      expect(run.width).toBeCloseTo(size.width, 1);
      expect(run.left, run.str).toBeGreaterThanOrEqual(margins.left - 0.5);
      expect(run.right, run.str).toBeLessThanOrEqual(size.width - margins.right + 0.5);
    }
    const { text } = await pdfText(bytes);
    const lines = text.split('\n').map(plain);
    expect(lineWith(lines, 'Centre 600')).toBeDefined();
    expect(lineWith(lines, 'Picked 2000 Cannot be reached:')).toBeDefined();
    expect(lineWith(lines, 'Exit slit width 100 µm')).toBeDefined();
  });
});
