import { beforeAll, describe, expect, it } from 'vitest';
import { exampleDesign, type Design } from '../../../shared/design';
import { describedFieldByPath } from '../../../shared/design-fields';
import { evaluatePoint, prepareDesign } from '../../../features/solver/index';
import { sketchGeometry } from '../../../features/sketch/geometry';
import { buildSketchScene, type SketchShape } from '../../../features/sketch/sketch-scene';
import { buildCompareSheet } from '../../../server/sheets/build';
import { compareSketchScene, printedReduction } from '../../../server/sheets/compare-scene';
import { compareSheetSections } from '../../../server/sheets/registry';
import { CHANGED } from '../../../server/sheets/sections/compare-parameters';
import { designWith } from '../notebooks/fixture';
import { pdfText } from './pdf-text';
import { sampleCompareSheet } from './sample';

/**
 * The compare sheet: both versions' values side by side with the changes marked in words, the
 * figure changes equal to the solver's at the printed precision, and both sketches at one scale.
 * Its route is checked with the other sheet routes in routes.test.ts.
 */

/** The PDF line that starts with `label` (table cells come back joined by spaces). */
function lineOf(text: string, label: string): string {
  const line = text.split('\n').find((candidate) => candidate.startsWith(label));
  if (!line) throw new Error(`No line starts with "${label}"`);
  return line;
}

/** The editor's words for a field with its unit, as the editor's box shows them. */
function editorName(path: string): string {
  const field = describedFieldByPath.get(path);
  if (!field) throw new Error(`No field ${path}`);
  return field.kind === 'quantity' ? `${field.label} (${field.unitLabel})` : field.label;
}

/** Printed numbers read back: true minus as "-", thousands grouped with a (narrow) no-break space joined up. */
const numbersIn = (text: string) =>
  [...text.replace(/\u2212/g, '-').replace(/(\d)[\u00A0\u202F](?=\d{3})/g, '$1').matchAll(/[-+]?\d+(?:\.\d+)?/g)].map((m) => Number(m[0]));

/** Significant figures a printed decimal carries ("0.2758" → 4, "2174" → 4). */
const significantFigures = (printed: string) => printed.replace(/^[-+]?0*\.?0*/, '').replace('.', '').length;

const before: Design = exampleDesign;
const after: Design = designWith({ slits: { exitWidthUm: 60 } });

describe('compare sheet PDF', () => {
  let text = '';
  beforeAll(async () => {
    text = (await pdfText(await buildCompareSheet(sampleCompareSheet(before, after)))).text;
  });

  it('prints every registered section heading', () => {
    for (const section of compareSheetSections) expect(text).toContain(section.title);
  });

  it("shows both versions' values of a changed field and marks it changed in words", () => {
    const line = lineOf(text, editorName('slits.exitWidthUm'));
    // The field's stored values: 100 µm before, 60 µm after (the inputs above).
    expect(line).toMatch(/\b100 60\b/);
    expect(line.endsWith(CHANGED)).toBe(true);
  });

  it('leaves an unchanged field unmarked', () => {
    const line = lineOf(text, editorName('slits.entranceWidthUm'));
    expect(line).toMatch(/\b100 100$/);
    expect(line).not.toContain(CHANGED);
  });

  it("prints the bandpass change as the solver's (after − before) / before at the printed precision", () => {
    const centreNm = (before.range.startNm + before.range.endNm) / 2;
    const bandpass = (design: Design) => evaluatePoint(prepareDesign(design), centreNm).bandpassNm as number;
    const was = bandpass(before);
    const now = bandpass(after);
    const line = lineOf(text, 'Bandpass at centre');
    const printed = line.match(/([\d.]+) nm ([\d.]+) nm ([−+±])(\d+(?:\.\d+)?)\s%/u);
    expect(printed, line).not.toBeNull();
    const [, wasText, nowText, sign, percentText] = printed!;
    // Each value within half a unit of its last printed digit.
    for (const [shown, value] of [
      [wasText!, was],
      [nowText!, now],
    ] as const) {
      const unit = 10 ** (Math.floor(Math.log10(Math.abs(value))) - significantFigures(shown) + 1);
      expect(Math.abs(Number(shown) - value)).toBeLessThanOrEqual(unit / 2 + 1e-12);
    }
    const percent = ((now - was) / was) * 100;
    const decimals = percentText!.split('.')[1]?.length ?? 0;
    expect(sign).toBe(percent < 0 ? '−' : '+');
    expect(Number(percentText)).toBe(Number(Math.abs(percent).toFixed(decimals)));
    // A narrower exit slit can only narrow the bandpass (or leave it): the change is a fall.
    expect(percent).toBeLessThan(0);
  });

  it('prints the resolving power at the centre as the solver has it, rounded to whole numbers', () => {
    const centreNm = (after.range.startNm + after.range.endNm) / 2;
    const power = evaluatePoint(prepareDesign(after), centreNm).resolvingPower as number;
    const [, now] = numbersIn(lineOf(text, 'R at centre'));
    expect(now).toBe(Math.round(power));
  });
});

/** The length of a two-point path ("Mx,yLx,y"), in the scene's pixels. */
function segmentLengthPx(shapes: readonly SketchShape[], key: string): number {
  const shape = shapes.find((s) => s.key === key);
  if (!shape || shape.type !== 'path') throw new Error(`No path ${key}`);
  const [x1, y1, x2, y2] = shape.d.split(/[ML,]/).filter(Boolean).map(Number);
  return Math.hypot(x2! - x1!, y2! - y1!);
}

describe('both sketches at one scale', () => {
  // Wildly different mounts: 300 mm mirrors and a 50 mm grating, then 3 m mirrors and a 100 mm grating.
  const small = exampleDesign;
  const large = designWith({ layout: { collimatorFocalMm: 3000, cameraFocalMm: 3000 }, grating: { ruledWidthMm: 100 } });

  it('draws a millimetre the same length in both versions', () => {
    const scene = compareSketchScene(small, large, { widthPx: 640, maxHeightPx: 600 });
    // The ruled face is drawn ruledWidthMm long: its pixels per millimetre is the drawing's scale.
    const beforePxPerMm = segmentLengthPx(scene.shapes, 'before-grating-face') / small.grating.ruledWidthMm;
    const afterPxPerMm = segmentLengthPx(scene.shapes, 'grating-face') / large.grating.ruledWidthMm;
    // Path coordinates are rounded to 0.1 px: allow that on a face some tens of pixels long.
    expect(beforePxPerMm).toBeCloseTo(afterPxPerMm, 1);
    expect(Math.abs(beforePxPerMm / afterPxPerMm - 1)).toBeLessThan(0.02);
    expect(Math.abs(afterPxPerMm / scene.pxPerMm - 1)).toBeLessThan(0.02);
  });

  it('would not be one scale if each version were fitted to its own extent', () => {
    // What the overlay avoids: each drawing fitted alone maps millimetres very differently.
    const own = (design: Design) => buildSketchScene(sketchGeometry(design), { widthPx: 640, maxHeightPx: 600 }).pxPerMm;
    expect(own(small) / own(large)).toBeGreaterThan(3);
  });

  it('states the printed scale from points per millimetre (1 in = 25.4 mm = 72 pt)', () => {
    // One point per millimetre of instrument: a paper millimetre (72 / 25.4 pt) holds 72 / 25.4 mm of it.
    expect(printedReduction({ pxPerMm: 2 }, 0.5)).toBeCloseTo(72 / 25.4, 10);
    // Full size on paper: 72 / 25.4 pt per millimetre gives 1 : 1.
    expect(printedReduction({ pxPerMm: 72 / 25.4 }, 1)).toBeCloseTo(1, 10);
  });
});
