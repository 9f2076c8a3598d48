import { describe, expect, it } from 'vitest';
import { curveLine, factorRows, fillSentence, threePlaces } from '@/features/light-budget/light-budget-words';
import { evaluateDesign } from '@/features/solver';
import { exampleDesign } from '@/shared/design';

describe('the light budget in words', () => {
  it('says an absent input is taken as matched and not counted', () => {
    const light = evaluateDesign(exampleDesign, { points: 11 }).lightBudget;
    expect(fillSentence(light.fill, light.acceptanceFNumber)).toMatch(/^No input cone given: .*not counted\. The instrument accepts about f\/\d/);
  });
  it('gives an over-filling fibre its cone, the share on the grating and the slit’s share of the core', () => {
    const design = { ...exampleDesign, input: { kind: 'fibre' as const, numericalAperture: 0.22, coreDiameterUm: 200 } };
    const light = evaluateDesign(design, { points: 11 }).lightBudget;
    const words = fillSentence(light.fill, light.acceptanceFNumber);
    // f/# = 1/(2 tan(asin 0.22)) = 2.217; a 200 µm core behind a 100 µm slit passes 60.9 % (see the solver's tests).
    expect(words).toMatch(/^The input cone is f\/2\.22\./);
    expect(words).toMatch(/The slit passes 61\s%\s?of the fibre core's light\./);
  });
  it('reads the start, centre and end of a sweep, and marks what is not counted', () => {
    const evaluation = evaluateDesign(exampleDesign, { points: 11 });
    const xs = evaluation.points.map((p) => p.wavelengthNm);
    expect(threePlaces(xs).map((p) => p.nm)).toEqual([300, 600, 900]);
    const rows = factorRows(evaluation.lightBudget, xs);
    expect(rows.map((r) => r.id)).toEqual(['grating', 'collimator', 'camera', 'filter', 'detector', 'input']);
    expect(rows[0]).toMatchObject({ basis: 'scalar blaze estimate', counted: true });
    expect(rows[1]).toMatchObject({ basis: 'not counted: attach a curve', counted: false, values: ['—', '—', '—'] });
  });
  it('sums a curve up in one line', () => {
    expect(
      curveLine({
        kind: 'mirror-reflectance',
        name: 'x',
        checksum: 'a'.repeat(64),
        medium: 'vacuum',
        mirror: 'camera',
        wavelengthsNm: [250, 500, 1000],
        values: [0.8, 0.9, 0.95],
      }),
    ).toBe('Mirror reflectance, 3 points, 250–1000 nm, camera mirror, vacuum wavelengths');
  });
});
