import { describe, expect, it } from 'vitest';
import { PRISM_MATERIALS, resolvePrismMaterial, sellmeierDnDlambdaPerNm, sellmeierIndex } from '@/features/solver';
import { PRISM_MATERIAL_IDS, type PrismMaterialId } from '@/shared/selectors';
import { expectClose } from './close-to';

const formula = (id: PrismMaterialId) => PRISM_MATERIALS[id].sellmeier;

describe('Sellmeier index of the built-in materials', () => {
  it.each([
    // Malitson 1965 (J. Opt. Soc. Am. 55, 1205), his table: n(587.6 nm) = 1.45846.
    { id: 'fused-silica', wavelengthNm: 587.6, expected: 1.45846, within: 1e-5 },
    // Malitson 1965: the sodium D line, n(589.3 nm) ≈ 1.4584.
    { id: 'fused-silica', wavelengthNm: 589.3, expected: 1.4584, within: 5e-5 },
    // Malitson 1963 (Appl. Opt. 2, 1103): CaF₂ n ≈ 1.4338 near 589 nm.
    { id: 'calcium-fluoride', wavelengthNm: 589.3, expected: 1.4338, within: 5e-5 },
    // Glass code 517642 means n_d = 1.517, V_d = 64.2 (common practice for glass codes); the
    // catalogue gives n_d = 1.5168 at the helium d line, 587.56 nm.
    { id: 'borosilicate-crown', wavelengthNm: 587.56, expected: 1.5168, within: 5e-5 },
  ] satisfies { id: PrismMaterialId; wavelengthNm: number; expected: number; within: number }[])(
    '$id: n($wavelengthNm nm) ≈ $expected',
    ({ id, wavelengthNm, expected, within }) => {
      expectClose(sellmeierIndex(formula(id), wavelengthNm), expected, 0, within);
    },
  );

  it('the borosilicate crown has the Abbe number of its glass code, V_d ≈ 64.2', () => {
    // V_d = (n_d − 1)/(n_F − n_C), F = 486.13 nm, C = 656.27 nm (common practice); code 517642 → 64.2.
    const f = formula('borosilicate-crown');
    const vd = (sellmeierIndex(f, 587.56)! - 1) / (sellmeierIndex(f, 486.13)! - sellmeierIndex(f, 656.27)!);
    expectClose(vd, 64.2, 0, 0.1);
  });

  it('fused silica at 500 nm by hand from Malitson’s coefficients', () => {
    // λ = 0.5 µm, λ² = 0.25. Terms B λ²/(λ² − C²):
    //   0.6961663·0.25/(0.25 − 0.004679148) = 0.7094447
    //   0.4079426·0.25/(0.25 − 0.013512063) = 0.4312510
    //   0.8974794·0.25/(0.25 − 97.934002538) = −0.0022969
    // n² = 2.1383988 → n = 1.4623265.
    expectClose(sellmeierIndex(formula('fused-silica'), 500), 1.4623265, 0, 1e-7);
    // d(n²)/dλ = Σ −2 B λ C²/(λ² − C²)² = −0.0541266 − 0.0985605 − 0.0092111 = −0.1618982 /µm;
    // dn/dλ = that / (2n) = −0.0553564 /µm = −5.53564e-5 /nm.
    expectClose(sellmeierDnDlambdaPerNm(formula('fused-silica'), 500), -5.53564e-5, 1e-5);
  });

  it.each(
    PRISM_MATERIAL_IDS.flatMap((id) => [400, 700, 1500].map((wavelengthNm) => ({ id, wavelengthNm }))),
  )('$id at $wavelengthNm nm: the analytic dn/dλ matches a central difference', ({ id, wavelengthNm }) => {
    // Numerical check of the derivative (common practice): h = 0.01 nm, error O(h²) far below 1e-6.
    const h = 0.01;
    const numeric = (sellmeierIndex(formula(id), wavelengthNm + h)! - sellmeierIndex(formula(id), wavelengthNm - h)!) / (2 * h);
    expectClose(sellmeierDnDlambdaPerNm(formula(id), wavelengthNm), numeric, 1e-5);
  });

  it.each(PRISM_MATERIAL_IDS.flatMap((id) => [400, 550, 700].map((wavelengthNm) => ({ id, wavelengthNm }))))(
    '$id disperses normally at $wavelengthNm nm: dn/dλ < 0',
    ({ id, wavelengthNm }) => {
      // Normal dispersion in the visible, away from the absorption bands (Hecht, Optics, §3.5).
      expect(sellmeierDnDlambdaPerNm(formula(id), wavelengthNm)!).toBeLessThan(0);
    },
  );

  it('each material names its source and the range its coefficients were fitted over', () => {
    for (const id of PRISM_MATERIAL_IDS) {
      const entry = PRISM_MATERIALS[id];
      expect(entry.id).toBe(id);
      expect(entry.source.length).toBeGreaterThan(10);
      expect(entry.validToNm).toBeGreaterThan(entry.validFromNm);
      expect(entry.sellmeier.B).toHaveLength(entry.sellmeier.C.length);
    }
    expect(PRISM_MATERIALS['fused-silica'].source).toContain('Malitson');
    expect(PRISM_MATERIALS['calcium-fluoride'].source).toContain('1963');
    expect(PRISM_MATERIALS['borosilicate-crown'].label).toBe('Borosilicate crown (517642)');
  });
});

describe('Sellmeier edge cases', () => {
  it('no index at a resonance: a custom C equal to the wavelength gives null, not Infinity or NaN', () => {
    const custom = { B: [1], C: [0.5] }; // resonance at 0.5 µm
    expect(sellmeierIndex(custom, 500)).toBeNull();
    expect(sellmeierDnDlambdaPerNm(custom, 500)).toBeNull();
    // Just below the resonance n² = 1 + λ²/(λ² − C²) is large and negative → no real index.
    expect(sellmeierIndex(custom, 499.9)).toBeNull();
    // Just above it is large and positive: a (meaningless but finite) index.
    expect(Number.isFinite(sellmeierIndex(custom, 500.1))).toBe(true);
  });

  it('no index where n² ≤ 0 or the wavelength is not positive and finite', () => {
    // n² = 1 + B with C = 0: B = −2 gives n² = −1.
    expect(sellmeierIndex({ B: [-2], C: [0] }, 500)).toBeNull();
    expect(sellmeierIndex(formula('fused-silica'), 0)).toBeNull();
    expect(sellmeierIndex(formula('fused-silica'), Number.NaN)).toBeNull();
    expect(sellmeierIndex(formula('fused-silica'), Number.POSITIVE_INFINITY)).toBeNull();
  });

  it.each([0.001, 1e7])('the built-in formulas stay finite or null at %s nm', (wavelengthNm) => {
    for (const id of PRISM_MATERIAL_IDS) {
      const n = sellmeierIndex(formula(id), wavelengthNm);
      const dn = sellmeierDnDlambdaPerNm(formula(id), wavelengthNm);
      expect(n === null || Number.isFinite(n)).toBe(true);
      expect(dn === null || Number.isFinite(dn)).toBe(true);
    }
  });

  it('a user-entered formula resolves as custom with no valid range', () => {
    const resolved = resolvePrismMaterial({ sellmeier: { B: [1], C: [0.1] } });
    expect(resolved.id).toBe('custom');
    expect(resolved.validFromNm).toBeNull();
    expect(resolved.sellmeier.B).toEqual([1]);
    expect(resolvePrismMaterial('calcium-fluoride').label).toBe('Calcium fluoride');
  });
});
