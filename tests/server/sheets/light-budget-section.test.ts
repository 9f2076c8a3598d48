import { describe, expect, it } from 'vitest';
import type { DesignCurve } from '../../../shared/curves';
import { exampleDesign, type Design } from '../../../shared/design';
import { buildSheet } from '../../../server/sheets/build';
import type { SheetContext } from '../../../server/sheets/context';
import { sheetSections } from '../../../server/sheets/registry';
import { lightBudgetSection } from '../../../server/sheets/sections/light-budget';
import { textSize } from '../../../server/sheets/writer';
import { expectInsideMarginsInGlyphs } from './inside-margins';
import { pdfText, printedNumber } from './pdf-text';
import { sampleSheet, sampleVersion } from './sample';

/**
 * The design sheet's Light budget section read back through pdfjs-dist (not the pdfkit that wrote
 * it). Expected figures are worked by hand below from the geometry, not read from the solver.
 */

const plain = (text: string) => text.replace(/\s+/g, ' ').trim();

/**
 * The example design turned to deviation 0 (α = β, so sin α = mλ/2d with no sign convention to
 * get wrong; Palmer & Loewen, Diffraction Grating Handbook, ch. 2) with a 50 µm × 4 mm slit:
 * - slit area 0.05 mm × 4 mm = 0.2 mm²;
 * - at the centre, 600 nm, 1200/mm: sin α = 1 × 600 / (2 × 833.33) = 0.36, cos α = 0.932952;
 *   the grating (50 × 50 mm) is seen 46.648 mm × 50 mm at 300 mm.
 */
const straight: Design = {
  ...structuredClone(exampleDesign),
  layout: { ...exampleDesign.layout, deviationAngleDeg: 0 },
  slits: { entranceWidthUm: 50, exitWidthUm: 50, heightMm: 4 },
};
const cosAlpha = Math.sqrt(1 - 0.36 ** 2);
const seenWidthMm = 50 * cosAlpha;
/** Solid angle of a rectangle seen on its axis, exact form 4 asin(ab / √((a²+d²)(b²+d²))) (from memory; radiometry texts). */
const a = seenWidthMm / 2;
const b = 25;
const d = 300;
const omegaSr = 4 * Math.asin((a * b) / Math.sqrt((a * a + d * d) * (b * b + d * d)));

/** A fibre of NA 0.22 (common practice: f/# ≈ 1/(2 NA) ≈ f/2.3) into this ≈ f/6 instrument: over-filled. */
const fibre: Design = { ...straight, input: { kind: 'fibre', numericalAperture: 0.22, coreDiameterUm: 200 } };
/**
 * Its cone: half-angle asin 0.22, a beam 2 × 300 × tan θ across at the collimator (≈ 135 mm), so
 * the whole 46.6 × 50 mm grating sits inside the circle (half-diagonal 34.2 mm < 67.7 mm) and the
 * share on it is the grating's area over the beam's.
 */
const beamRadiusMm = 300 * Math.tan(Math.asin(0.22));
const shareOnGrating = (seenWidthMm * 50) / (Math.PI * beamRadiusMm ** 2);
/**
 * The 200 µm core on the 50 µm slit: the part of a circle of radius r inside |x| ≤ h is
 * 2[h √(r² − h²) + r² asin(h/r)] (from memory, a circular segment); h/r = 0.25 here.
 */
const r = 0.1;
const h = 0.025;
const coreThroughSlit = (2 * (h * Math.sqrt(r * r - h * h) + r * r * Math.asin(h / r))) / (Math.PI * r * r);

const curve = (kind: DesignCurve['kind'], name: string, wavelengthsNm: number[], values: number[], extra: Partial<DesignCurve> = {}): DesignCurve => ({
  kind,
  name,
  checksum: name.length.toString(16).padStart(64, '0'),
  medium: 'air',
  wavelengthsNm,
  values,
  ...extra,
});

/**
 * Measured curves whose product is worked by hand (straight lines between points):
 * grating 50 % at 300 nm falling to 20 % at 900 nm → 35 % at 600 nm; both mirrors 90 % flat.
 * Product: 0.5 × 0.81 = 40.5 %, 0.35 × 0.81 = 28.35 %, 0.2 × 0.81 = 16.2 %; the lowest at 900 nm.
 */
const measured: Design = {
  ...structuredClone(straight),
  curves: [
    curve('grating-efficiency', 'Test grating', [300, 900], [0.5, 0.2]),
    curve('mirror-reflectance', 'Aluminium mirrors', [250, 1000], [0.9, 0.9]),
  ],
};

function sheetOf(params: Design): SheetContext {
  return sampleSheet({ params, version: sampleVersion(params) });
}

async function sectionLines(params: Design): Promise<string[]> {
  const { pages } = await pdfText(await buildSheet(sheetOf(params), [lightBudgetSection]));
  return pages.flatMap((page) => page.split('\n')).map(plain);
}

const lineStarting = (lines: string[], start: string) => {
  const found = lines.find((line) => line.startsWith(start));
  expect(found, start).toBeDefined();
  return found!;
};

function expectPrinted(text: string, value: number) {
  const printed = printedNumber(text);
  expect(printed, text).not.toBeNull();
  expect(Math.abs(printed!.value - value), `${text} against ${value}`).toBeLessThanOrEqual(printed!.halfUnit);
}

describe('the design sheet’s Light budget section', () => {
  it('is printed for every design, after the warnings', () => {
    const ids = sheetSections.map((section) => section.id);
    expect(ids.indexOf('light-budget')).toBe(ids.indexOf('warnings') + 1);
    expect(lightBudgetSection.appliesTo).toBeUndefined();
  });

  it('prints the slit area, the acceptance and the étendue as worked by hand, and a missing input as taken as matched', async () => {
    const lines = await sectionLines(straight);
    expect(lines).toContain('Light input Not given: taken as matched to the instrument (input coupling not counted)');
    expect(lines).toContain('Entrance slit area 50 µm × 4 mm = 0.2 mm²');
    const acceptance = lineStarting(lines, 'Acceptance of the grating ');
    expectPrinted(acceptance.replace('Acceptance of the grating ', ''), omegaSr);
    const etendue = lineStarting(lines, 'Étendue G = A · Ω ');
    expectPrinted(etendue.replace('Étendue G = A · Ω ', ''), 0.2 * omegaSr);
    expect(lines.some((line) => line.startsWith('Taken as matched: no input cone is given'))).toBe(true);
    // The whole grating lit: 1200/mm × 50 mm = 60 000 grooves, R = |m| N = 60 000 (Palmer & Loewen, ch. 2).
    expect(lines).toContain('Grooves lit 60 000');
    expect(lines).toContain('Resolving power they allow (|m| N) 60 000');
    expect(lines.some((line) => line.startsWith('Fibre core'))).toBe(false);
    // The scalar blaze estimate is always there, labelled as such.
    expect(lineStarting(lines, 'Grating efficiency ')).toMatch(/^Grating efficiency scalar blaze estimate /);
    expect(lines).toContain('Collimator reflectance not counted: attach a curve — — —');
  });

  it('says a fibre of NA 0.22 over-fills the instrument, with the shares worked by hand', async () => {
    const lines = await sectionLines(fibre);
    expect(lines).toContain('Light input Fibre: numerical aperture 0.22, core diameter 200 µm');
    expect(lines.some((line) => line.startsWith('Over-filled: less than 95 % of the input cone lands on the grating'))).toBe(true);
    expectPrinted(lineStarting(lines, 'Share of the cone on the grating ').replace('Share of the cone on the grating ', ''), shareOnGrating * 100);
    expectPrinted(lineStarting(lines, 'Fibre core through the slit ').replace('Fibre core through the slit ', ''), coreThroughSlit * 100);
    expect(lines).toContain('Share of the grating width lit 100 %');
    expect(lineStarting(lines, 'Input coupling ')).toMatch(/^Input coupling computed from the input and the grating /);
  });

  it('tabulates measured factors at the start, centre and end with their curve names, and the product and its lowest', async () => {
    const lines = await sectionLines(measured);
    expect(lines).toContain('Factor Basis Start, 300 nm Centre, 600 nm End, 900 nm');
    expect(lines).toContain('Grating efficiency measured (Test grating) 50 % 35 % 20 %');
    expect(lines).toContain('Collimator reflectance measured (Aluminium mirrors) 90 % 90 % 90 %');
    expect(lines).toContain('Camera reflectance measured (Aluminium mirrors) 90 % 90 % 90 %');
    expect(lines).toContain('Product counted factors only 40.5 % 28.4 % 16.2 %');
    expect(lines).toContain('Lowest: 16.2 % at 900 nm, over the 101 swept wavelengths.');
    expect(lines).toContain('Relative throughput');
  });

  it('names a curve that leaves part of the range without data, and leaves the product unknown there', async () => {
    // Data from 400 nm only: on the 6 nm sweep (300, 306, …) the first point with data is 402 nm.
    const gappy: Design = { ...measured, curves: [...measured.curves!, curve('detector-response', 'Test CCD', [400, 1000], [0.6, 0.6])] };
    const text = (await sectionLines(gappy)).join(' ');
    expect(text).toContain('detector response (quantum efficiency) (“Test CCD”) has no data at 300–396 nm');
    // At 300 nm the product is unknown; at 600 nm it is 0.35 × 0.81 × 0.6 = 17.01 %.
    expect(text).toContain('Product counted factors only — 17 % 9.7 %');
  });

  it('prints its heading at the heading size in the whole sheet', async () => {
    const { pieces } = await pdfText(await buildSheet(sheetOf(measured)));
    const headings = pieces
      .flatMap((page, n) => page.map((piece) => ({ ...piece, n })))
      .filter((piece) => Math.abs(piece.size - textSize.heading) < 0.05)
      .sort((x, y) => x.n - y.n || y.baseline - x.baseline)
      .map((piece) => piece.str.trim());
    expect(headings.indexOf('Light budget')).toBe(headings.indexOf('Warnings') + 1);
  });

  it.each(['a4', 'letter'] as const)('keeps every piece of its text inside the margins on %s, in glyphs its fonts have', async (paper) => {
    for (const params of [straight, fibre, measured]) {
      const sheet = { ...sheetOf(params), paper };
      const { pieces } = await pdfText(await buildSheet(sheet, [lightBudgetSection]));
      expectInsideMarginsInGlyphs(pieces.flat(), paper, 20);
    }
  });
});
