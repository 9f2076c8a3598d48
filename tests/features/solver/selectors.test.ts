import { describe, expect, it } from 'vitest';
import { runSelector } from '@/features/solver';
import { selectorInputSchema, type SelectorAnswer, type SelectorInput } from '@/shared/selectors';

/** Every number in an answer, with its path, so a NaN or Infinity anywhere fails by name. */
function numbersIn(value: unknown, path = ''): { path: string; value: number }[] {
  if (typeof value === 'number') return [{ path, value }];
  if (Array.isArray(value)) return value.flatMap((v, i) => numbersIn(v, `${path}[${i}]`));
  if (value && typeof value === 'object') return Object.entries(value).flatMap(([k, v]) => numbersIn(v, `${path}.${k}`));
  return [];
}

function expectAllFinite(answer: SelectorAnswer): void {
  const bad = numbersIn(answer).filter((n) => !Number.isFinite(n.value));
  expect(bad, 'non-finite numbers').toEqual([]);
  // Survives JSON unchanged (Infinity and NaN would turn into null).
  expect(JSON.parse(JSON.stringify(answer))).toEqual(answer);
}

const run = (input: unknown) => runSelector(selectorInputSchema.parse(input) as SelectorInput);

const interference = {
  kind: 'interference-filter',
  targetNm: 500,
  order: 3,
  spacerIndex: 1.5,
  mirrorReflectance: 0.9,
  tiltsDeg: [0, 15, 30],
  rangeNm: { startNm: 300, endNm: 1100 },
};
const stack = {
  kind: 'absorption-stack',
  filters: [
    { shape: 'long-pass', edgeNm: 400, edgeWidthNm: 20, peakInternalTransmission: 0.9, referenceThicknessMm: 2, thicknessMm: 3, refractiveIndex: 1.5 },
  ],
  wavelengthsNm: [300, 400, 500],
};
const prism = {
  kind: 'prism',
  material: 'calcium-fluoride',
  apexDeg: 60,
  baseMm: 50,
  wavelengthsNm: [250, 500, 1000],
  collimatorFocalMm: 500,
  cameraFocalMm: 500,
  entranceWidthUm: 50,
  exitWidthUm: 50,
};

describe('runSelector', () => {
  it.each([
    { input: interference, kind: 'interference-filter' },
    { input: stack, kind: 'absorption-stack' },
    { input: prism, kind: 'prism' },
  ])('dispatches $kind to its calculator, every number finite', ({ input, kind }) => {
    const answer = run(input);
    expect(answer.kind).toBe(kind);
    expectAllFinite(answer);
  });

  it('gives each kind its own answer shape', () => {
    const filter = run(interference);
    if (filter.kind !== 'interference-filter') throw new Error('wrong kind');
    expect(filter.spacerThicknessNm).toBeCloseTo(500, 9); // 3·500/(2·1.5), Hecht §9.6
    const glass = run(stack);
    if (glass.kind !== 'absorption-stack') throw new Error('wrong kind');
    expect(glass.points).toHaveLength(3);
    const answer = run(prism);
    if (answer.kind !== 'prism') throw new Error('wrong kind');
    expect(answer.material.source).toContain('Malitson');
    expect(answer.points.every((p) => p.bandpassNm !== null)).toBe(true);
  });
});

describe('edge inputs never throw or give NaN', () => {
  it.each([
    { name: 'order 1000 over the widest range', input: { ...interference, order: 1000, rangeNm: { startNm: 0.001, endNm: 1e7 } } },
    { name: 'R = 0.999999', input: { ...interference, mirrorReflectance: 0.999999 } },
    { name: 'a target of 1e7 nm in order 1000', input: { ...interference, targetNm: 1e7, order: 1000, rangeNm: { startNm: 0.001, endNm: 1e7 } } },
    { name: 'tilts to 89°, index 5', input: { ...interference, spacerIndex: 5, effectiveIndex: 1, tiltsDeg: [0, 45, 89] } },
    { name: 'a stack at 0.001 and 1e7 nm', input: { ...stack, wavelengthsNm: [0.001, 1e7] } },
    { name: 'a prism of 179°', input: { ...prism, apexDeg: 179 } },
    { name: 'a prism at 0.001 and 1e7 nm', input: { ...prism, material: 'fused-silica', wavelengthsNm: [0.001, 1e7] } },
    { name: 'a 0.001° prism with huge optics', input: { ...prism, apexDeg: 0.001, cameraFocalMm: 1e7, collimatorFocalMm: 1e-3 } },
    {
      name: 'a custom Sellmeier with C equal to the wavelength',
      input: { ...prism, material: { sellmeier: { B: [1, 0.5], C: [0.5, 0] } }, wavelengthsNm: [499.999, 500, 500.001] },
    },
    { name: 'a custom Sellmeier of zero terms’ worth (B = 0)', input: { ...prism, material: { sellmeier: { B: [0], C: [0] } } } },
  ])('$name', ({ input }) => {
    const answer = run(input);
    expectAllFinite(answer);
  });

  it('a 179° prism passes no light at any wavelength and says so', () => {
    // n ≥ 1 and sin(89.5°) = 0.99996: n sin(A/2) ≥ 1 for every real glass (Hecht, §5.5).
    const answer = run({ ...prism, apexDeg: 179 });
    if (answer.kind !== 'prism') throw new Error('wrong kind');
    expect(answer.points.every((p) => p.minDeviationDeg === null && p.reason !== null)).toBe(true);
    expect(answer.warnings.map((w) => w.code)).toContain('no-path');
  });

  it('a zero-dispersion custom glass gives no bandpass, with a reason', () => {
    // B = 0: n = 1 everywhere, dn/dλ = 0, so the prism does not disperse and RLD is unbounded.
    const answer = run({ ...prism, material: { sellmeier: { B: [0], C: [0] } } });
    if (answer.kind !== 'prism') throw new Error('wrong kind');
    expect(answer.points[0]!.bandpassNm).toBeNull();
    expect(answer.points[0]!.reason).toMatch(/does not disperse/);
  });
});
