import { describe, expect, it } from 'vitest';
import {
  absorptionFilterTransmission,
  absorptionStack,
  colouredGlassInternalTransmission,
  scaleInternalTransmission,
  stackTransmission,
  surfaceReflectance,
} from '@/features/solver';
import type { AbsorptionFilter } from '@/shared/selectors';
import { expectClose } from './close-to';

const longPass = (over: Partial<AbsorptionFilter> = {}): AbsorptionFilter => ({
  shape: 'long-pass',
  edgeNm: 400,
  edgeWidthNm: 10,
  peakInternalTransmission: 0.9,
  referenceThicknessMm: 2,
  thicknessMm: 2,
  refractiveIndex: 1.5,
  ...over,
});

/** Where a rising curve crosses `level`, by bisection on [lo, hi] (a test-side helper, not the code under test). */
function crossingNm(curve: (nm: number) => number, level: number, lo: number, hi: number): number {
  for (let i = 0; i < 200; i++) {
    const mid = (lo + hi) / 2;
    if (curve(mid) < level) lo = mid;
    else hi = mid;
  }
  return (lo + hi) / 2;
}

/** 10–90 % width of a rising edge relative to its plateau (read far above the edge). */
function edgeWidthNm(curve: (nm: number) => number): number {
  const plateau = curve(2000);
  return crossingNm(curve, 0.9 * plateau, 0, 2000) - crossingNm(curve, 0.1 * plateau, 0, 2000);
}

describe('one coloured-glass filter', () => {
  it('the logistic edge is 50 % of the plateau at edgeNm and 10 %/90 % half a width either side', () => {
    // Model definition: logistic with scale w/(2 ln 9), so 10 % and 90 % lie at edge ∓ w/2.
    const f = longPass();
    expectClose(colouredGlassInternalTransmission(f, 400), 0.45, 1e-12); // 0.9 × ½
    expectClose(colouredGlassInternalTransmission(f, 395), 0.09, 1e-9); // 0.9 × 0.1
    expectClose(colouredGlassInternalTransmission(f, 405), 0.81, 1e-9); // 0.9 × 0.9
    expectClose(colouredGlassInternalTransmission(f, 1000), 0.9, 1e-12);
  });

  it('a band-pass multiplies a rising edge at edgeNm by a falling one at upperEdgeNm', () => {
    const f = longPass({ shape: 'band-pass', upperEdgeNm: 600 });
    expectClose(colouredGlassInternalTransmission(f, 500), 0.9, 1e-9); // both edges far away
    expectClose(colouredGlassInternalTransmission(f, 600), 0.45, 1e-9);
    expectClose(colouredGlassInternalTransmission(f, 605), 0.09, 1e-9);
  });

  it.each([
    // Beer–Lambert, T(t) = T_ref^(t/t_ref) (Hecht, Optics, §4.6; hand-computed):
    { reference: 0.8, thicknessMm: 4, referenceMm: 2, expected: 0.64 }, // 0.8²
    { reference: 0.8, thicknessMm: 1, referenceMm: 2, expected: 0.894427 }, // √0.8
    { reference: 0.5, thicknessMm: 6, referenceMm: 2, expected: 0.125 }, // 0.5³
    { reference: 1, thicknessMm: 100, referenceMm: 1, expected: 1 },
  ] satisfies { reference: number; thicknessMm: number; referenceMm: number; expected: number }[])(
    '$reference at $referenceMm mm becomes $expected at $thicknessMm mm',
    ({ reference, thicknessMm, referenceMm, expected }) => {
      expectClose(scaleInternalTransmission(reference, thicknessMm, referenceMm), expected, 1e-6);
    },
  );

  it.each([
    // Fresnel at normal incidence, ((n − 1)/(n + 1))² (Hecht, Optics, §4.6):
    { n: 1.5, expected: 0.04 }, // (0.5/2.5)²
    { n: 1, expected: 0 },
    { n: 4, expected: 0.36 }, // (3/5)²
  ] satisfies { n: number; expected: number }[])('one surface of n = $n reflects $expected', ({ n, expected }) => {
    expectClose(surfaceReflectance(n), expected, 1e-12, 1e-15);
  });

  it('two surfaces of n = 1.5 pass 0.96² = 0.9216 of what the glass does not absorb', () => {
    // Hecht, §4.6, multiple reflections neglected: plateau 0.9 × 0.9216 = 0.82944.
    expectClose(absorptionFilterTransmission(longPass(), 1000), 0.82944, 1e-9);
    expectClose(absorptionFilterTransmission(longPass({ peakInternalTransmission: 1 }), 1000), 0.9216, 1e-9);
  });
});

describe('stacks', () => {
  it('a stack transmits the product of its filters', () => {
    // 0.9 × 0.9216 × 0.8 × 0.9216 = 0.72 × 0.84934656 = 0.6115295 on the plateau (hand-computed).
    const filters = [longPass(), longPass({ peakInternalTransmission: 0.8, edgeNm: 450 })];
    expectClose(stackTransmission(filters, 1000), 0.6115295, 1e-6);
    expectClose(
      stackTransmission(filters, 430),
      absorptionFilterTransmission(filters[0]!, 430) * absorptionFilterTransmission(filters[1]!, 430),
      1e-12,
    );
    expect(stackTransmission([], 500)).toBe(1);
  });

  it('stacking two identical filters sharpens the edge and lowers the peak', () => {
    // One logistic edge: 10–90 % width = 2 ln 9 · s = 4.39445 s. Two copies, T ∝ L²: 10 % and 90 %
    // of the plateau where L = √0.1 and L = √0.9, i.e. at s·ln(L/(1 − L)) = −0.77115 s and 2.91707 s,
    // a width of 3.68822 s. With w = 10 nm: 10 × 3.68822/4.39445 = 8.39290 nm. Plateau 0.82944 → 0.68797.
    const one = [longPass()];
    const two = [longPass(), longPass()];
    expectClose(edgeWidthNm((nm) => stackTransmission(one, nm)), 10, 1e-6);
    expectClose(edgeWidthNm((nm) => stackTransmission(two, nm)), 8.3929, 1e-4);
    expectClose(stackTransmission(two, 2000), 0.82944 ** 2, 1e-9);
  });

  it('doubling the thickness sharpens the edge the same way, without the extra surfaces', () => {
    // Beer–Lambert: T_int(2t) = T_int(t)², the same L² edge (8.3929 nm); plateau 0.81 × 0.9216 = 0.746496.
    const thick = [longPass({ thicknessMm: 4 })];
    expectClose(edgeWidthNm((nm) => stackTransmission(thick, nm)), 8.3929, 1e-4);
    expectClose(stackTransmission(thick, 2000), 0.746496, 1e-9);
  });

  it('the answer lists each point, its peak, and warns when the peak is under 10 %', () => {
    const answer = absorptionStack({ kind: 'absorption-stack', filters: [longPass()], wavelengthsNm: [300, 400, 1000] });
    expect(answer.points.map((p) => p.wavelengthNm)).toEqual([300, 400, 1000]);
    expectClose(answer.peakTransmission, 0.82944, 1e-9);
    expect(answer.warnings).toEqual([]);

    // Ten 0.5 filters: 0.5¹⁰ × 0.9216¹⁰ ≈ 4.3e-4 — far below 10 %.
    const dark = absorptionStack({
      kind: 'absorption-stack',
      filters: Array.from({ length: 10 }, () => longPass({ peakInternalTransmission: 0.5 })),
      wavelengthsNm: [1000],
    });
    expect(dark.warnings.map((w) => w.code)).toEqual(['low-peak']);
  });

  it.each([0.001, 1e7])('stays finite in [0, 1] at %s nm, even with a 1000 mm filter', (wavelengthNm) => {
    const filters = [longPass({ thicknessMm: 1000, referenceThicknessMm: 0.001 }), longPass({ shape: 'band-pass', upperEdgeNm: 500 })];
    for (const f of filters) {
      const t = absorptionFilterTransmission(f, wavelengthNm);
      expect(Number.isFinite(t)).toBe(true);
      expect(t).toBeGreaterThanOrEqual(0);
      expect(t).toBeLessThanOrEqual(1);
    }
    const t = stackTransmission(filters, wavelengthNm);
    expect(t >= 0 && t <= 1).toBe(true);
  });
});
