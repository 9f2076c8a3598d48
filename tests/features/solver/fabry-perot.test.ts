import { describe, expect, it } from 'vitest';
import {
  airyTransmission,
  designInterferenceFilter,
  fabryPerotFwhmNm,
  fabryPerotPeaksNm,
  reflectingFinesse,
  spacerThicknessNm,
  tiltedPeakNm,
} from '@/features/solver';
import type { InterferenceFilterInput } from '@/shared/selectors';
import { deg, expectClose } from './close-to';

const filter = (over: Partial<InterferenceFilterInput> = {}): InterferenceFilterInput => ({
  kind: 'interference-filter',
  targetNm: 500,
  order: 3,
  spacerIndex: 1.5,
  mirrorReflectance: 0.9,
  rangeNm: { startNm: 300, endNm: 1100 },
  ...over,
});

describe('Fabry–Pérot spacer and peaks', () => {
  it('a first-order cavity at normal incidence has optical thickness n·t = λ/2', () => {
    // Hecht, Optics, §9.6: 2nt = mλ. λ = 500 nm, n = 1.5, m = 1 → t = 500/3 = 166.67 nm, n·t = 250 nm.
    const t = spacerThicknessNm(500, 1, 1.5);
    expectClose(t, 500 / 3, 1e-12);
    expectClose(1.5 * t, 250, 1e-12);
  });

  it.each([
    // t = mλ/(2n): Hecht, Optics, §9.6 (hand-computed).
    { targetNm: 500, order: 3, index: 1.5, expected: 500 }, // 3·500/3 = 500
    { targetNm: 633, order: 2, index: 1.38, expected: 458.6957 }, // 2·633/2.76
    { targetNm: 1000, order: 1000, index: 1, expected: 500_000 }, // 1000·1000/2
  ] satisfies { targetNm: number; order: number; index: number; expected: number }[])(
    'spacer for $targetNm nm in order $order, n = $index, is $expected nm',
    ({ targetNm, order, index, expected }) => {
      expectClose(spacerThicknessNm(targetNm, order, index), expected, 1e-6);
    },
  );

  it('a tilted cavity needs a thicker spacer: t = mλ/(2n cos θ_t), sin θ_t = sin θ / n', () => {
    // Hecht, §9.6 with Snell's law. θ = 30°, n = 2: sin θ_t = 0.25, cos θ_t = √0.9375 = 0.968246;
    // m = 1, λ = 500 → t = 500/(4·0.968246) = 129.0994 nm.
    expectClose(spacerThicknessNm(500, 1, 2, deg(30)), 129.0994, 1e-6);
  });

  it('lists every peak λ_k = 2nt/k in the range, ascending', () => {
    // Hecht, §9.6. t = 500 nm, n = 1.5 → 2nt = 1500 nm: k = 2…5 give 750, 500, 375, 300 nm in
    // 300–1100 nm (k = 1 at 1500 nm and k = 6 at 250 nm fall outside; 300 nm is an end, included).
    const peaks = fabryPerotPeaksNm(500, 1.5, 300, 1100);
    expect(peaks.peakCount).toBe(4);
    expect(peaks.truncated).toBe(false);
    expect(peaks.peaksNm).toHaveLength(4);
    [300, 375, 500, 750].forEach((expected, i) => expectClose(peaks.peaksNm[i], expected, 1e-12));
  });

  it('counts peaks in closed form: a 0.001 nm – 10 mm range in a thick cavity does not loop over them', () => {
    // 2nt = 10⁶ nm (n = 1, t = 0.5 mm): k from ⌈10⁶/10⁷⌉ = 1 to ⌊10⁶/0.001⌋ = 10⁹ → 10⁹ peaks.
    const peaks = fabryPerotPeaksNm(500_000, 1, 0.001, 1e7, 200);
    expect(peaks.peakCount).toBe(1_000_000_000);
    expect(peaks.truncated).toBe(true);
    expect(peaks.peaksNm).toHaveLength(200);
    // Without a target the longest peaks are listed: k = 200 … 1, i.e. 5000 nm … 10⁶ nm, ascending.
    expectClose(peaks.peaksNm[0], 5000, 1e-12);
    expectClose(peaks.peaksNm[199], 1e6, 1e-12);
  });

  it('when truncated, lists the orders around the target', () => {
    // 2nt = 10⁶ nm; around 1000 nm is k = 1000, so k = 1099 … 900 are listed (200 of them):
    // 10⁶/1099 = 909.918 nm up to 10⁶/900 = 1111.111 nm, with 1000 nm among them.
    const peaks = fabryPerotPeaksNm(500_000, 1, 0.001, 1e7, 200, 1000);
    expect(peaks.peaksNm).toHaveLength(200);
    expectClose(peaks.peaksNm[0], 909.918107, 1e-8);
    expectClose(peaks.peaksNm[199], 1111.111111, 1e-8);
    expect(peaks.peaksNm.some((p) => Math.abs(p - 1000) < 1e-9)).toBe(true);
    // Near an end of the range the window stops at the end: around 10⁷ nm → k = 1 … 200 (longest).
    expectClose(fabryPerotPeaksNm(500_000, 1, 0.001, 1e7, 200, 1e7).peaksNm[199], 1e6, 1e-12);
    // A design in order 1000 over the widest range lists its own target among the peaks.
    const answer = designInterferenceFilter(filter({ targetNm: 1000, order: 1000, spacerIndex: 1, rangeNm: { startNm: 0.001, endNm: 1e7 } }));
    expect(answer.peaksTruncated).toBe(true);
    expect(answer.peaksNm.some((p) => Math.abs(p - 1000) < 1e-9)).toBe(true);
    for (let i = 1; i < answer.peaksNm.length; i++) expect(answer.peaksNm[i]!).toBeGreaterThan(answer.peaksNm[i - 1]!);
  });

  it('counts 10¹³ peaks exactly, with none beyond the range', () => {
    // 2nt = 10¹⁰ nm (order 1000 at 10⁷ nm, n = 1): k from ⌈10¹⁰/10⁷⌉ = 1000 to ⌊10¹⁰/0.001⌋ = 10¹³,
    // so 10¹³ − 999 peaks.
    expect(fabryPerotPeaksNm(5e9, 1, 0.001, 1e7).peakCount).toBe(1e13 - 999);
  });

  it('gives no peaks for an empty or unusable range rather than throwing', () => {
    expect(fabryPerotPeaksNm(500, 1.5, 1600, 2000).peakCount).toBe(0); // the longest peak is 1500 nm
    expect(fabryPerotPeaksNm(0, 1.5, 300, 1100).peakCount).toBe(0);
    expect(fabryPerotPeaksNm(500, 1.5, 1100, 300).peakCount).toBe(0);
  });
});

describe('Fabry–Pérot finesse, width and tilt', () => {
  it.each([
    // π√R/(1 − R), Hecht, §9.6 (hand-computed).
    { reflectance: 0.9, expected: 29.80376 }, // π·0.948683/0.1
    { reflectance: 0.5, expected: 4.442883 }, // π·0.707107/0.5
    { reflectance: 0.99, expected: 312.5845 }, // π·0.994987/0.01 = 3.125845/0.01
  ] satisfies { reflectance: number; expected: number }[])('finesse for R = $reflectance is $expected', ({ reflectance, expected }) => {
    expectClose(reflectingFinesse(reflectance), expected, 1e-6);
  });

  it('FWHM is FSR / finesse', () => {
    // Hecht, §9.6. λ = 500, m = 3 → FSR = 166.667 nm; R = 0.9 → finesse 29.8038 → FWHM 5.59213 nm.
    expectClose(fabryPerotFwhmNm(500 / 3, reflectingFinesse(0.9)), 5.59213, 1e-5);
    const answer = designInterferenceFilter(filter());
    expectClose(answer.freeSpectralRangeNm, 166.6667, 1e-6);
    expectClose(answer.fwhmNm, 5.59213, 1e-5);
    expectClose(answer.finesse, 29.80376, 1e-6);
  });

  it.each([
    // λ₀ √(1 − (sin θ/n_eff)²), Hecht, §9.6 (hand-computed).
    { peakNm: 500, tiltDeg: 30, nEff: 2, expected: 484.1229 }, // 500·√(1 − 0.0625)
    { peakNm: 500, tiltDeg: 0, nEff: 2, expected: 500 },
    { peakNm: 633, tiltDeg: 10, nEff: 1.45, expected: 628.4444 }, // sin 10° = 0.173648; /1.45 = 0.119757; 633·√(1 − 0.014342) = 633·0.992803
  ] satisfies { peakNm: number; tiltDeg: number; nEff: number; expected: number }[])(
    'tilting $peakNm nm by $tiltDeg° with n_eff = $nEff moves the peak to $expected nm',
    ({ peakNm, tiltDeg, nEff, expected }) => {
      expectClose(tiltedPeakNm(peakNm, deg(tiltDeg), nEff), expected, 1e-6);
    },
  );

  it('the answer lists the tilt curve with the effective index, defaulting to the spacer index', () => {
    // λ₀ = 500, n_eff = 2, 30° → 484.1229 nm (above); with n_eff = n = 1.5: 500·√(1 − (0.5/1.5)²) = 471.4045 nm.
    const withEffective = designInterferenceFilter(filter({ effectiveIndex: 2, tiltsDeg: [0, 30] }));
    expect(withEffective.tilt.map((t) => t.tiltDeg)).toEqual([0, 30]);
    expectClose(withEffective.tilt[1]!.peakNm, 484.1229, 1e-6);
    expectClose(designInterferenceFilter(filter({ tiltsDeg: [30] })).tilt[0]!.peakNm, 471.4045, 1e-6);
    expect(designInterferenceFilter(filter()).tilt).toEqual([]);
  });

  it('the Airy transmission is 1 at a peak and 1/(1 + F) half-way between peaks', () => {
    // Born & Wolf, §7.6. 2nt = 1500 nm: λ = 500 nm is order 3 (peak); λ = 1500/3.5 = 428.571 nm is
    // half-way in phase, sin²(δ/2) = 1. R = 0.9 → F = 4·0.9/0.01 = 360 → T = 1/361.
    expectClose(airyTransmission(500, 500, 1.5, 0.9), 1, 1e-12);
    expectClose(airyTransmission(1500 / 3.5, 500, 1.5, 0.9), 1 / 361, 1e-9);
    // Tilting shifts the peak to λ₀ cos θ_t (above: 471.4045 nm at 30°, n = 1.5).
    expectClose(airyTransmission(471.4045208, 500, 1.5, 0.9, deg(30)), 1, 1e-6);
  });

  it('the Airy half-height width matches FSR / finesse for a high-finesse cavity', () => {
    // Hecht, §9.6: FWHM ≈ FSR/finesse. m = 3 at 500 nm, R = 0.9: FWHM ≈ 5.592 nm, so the
    // transmission half a width from the peak is close to ½ (the approximation is good to ~1 % here).
    const half = 5.59213 / 2;
    expectClose(airyTransmission(500 + half, 500, 1.5, 0.9), 0.5, 0.03);
    expectClose(airyTransmission(500 - half, 500, 1.5, 0.9), 0.5, 0.03);
  });
});

describe('interference filter design warnings', () => {
  it('names the other peaks in range and gives a long-pass and a short-pass edge to block them', () => {
    // m = 3 at 500 nm: neighbours 500·3/4 = 375 nm and 500·3/2 = 750 nm; 300 nm is also in range.
    const answer = designInterferenceFilter(filter());
    const warning = answer.warnings.find((w) => w.code === 'other-peaks');
    expect(warning).toBeDefined();
    expect(warning!.message).toContain('3 other transmission peaks');
    expect(warning!.message).toContain('375 nm');
    expect(warning!.message).toContain('750 nm');
    expect(warning!.message).toMatch(/long-pass.*437\.5 nm.*2 shorter peaks/); // (375 + 500)/2
    expect(warning!.message).toMatch(/short-pass.*625 nm.*longer peak/); // (500 + 750)/2
  });

  it('a first-order filter has no longer neighbour, so only a long-pass is suggested', () => {
    // m = 1 at 500 nm: 2nt = 500 nm, shorter peaks 250, 166.7 nm; range 200–800 holds 250 nm only.
    const answer = designInterferenceFilter(filter({ order: 1, rangeNm: { startNm: 200, endNm: 800 } }));
    expect(answer.peakCount).toBe(2);
    const message = answer.warnings.find((w) => w.code === 'other-peaks')!.message;
    expect(message).toContain('One other transmission peak');
    expect(message).toContain('long-pass');
    expect(message).not.toContain('short-pass');
  });

  it('no warning when the target is the only peak in range', () => {
    // m = 3 at 500 nm: the neighbours 375 and 750 nm lie outside 400–700 nm.
    const answer = designInterferenceFilter(filter({ rangeNm: { startNm: 400, endNm: 700 } }));
    expect(answer.peaksNm).toHaveLength(1);
    expectClose(answer.peaksNm[0], 500, 1e-12);
    expect(answer.warnings).toEqual([]);
  });

  it('warns of low finesse, where FSR/finesse understates the width', () => {
    // R = 0.5 → finesse 4.44 < 5: the Airy half-width is ~2 % wider than FSR/finesse (Born & Wolf, §7.6).
    expect(designInterferenceFilter(filter({ mirrorReflectance: 0.5 })).warnings.map((w) => w.code)).toContain('low-finesse');
    expect(designInterferenceFilter(filter({ mirrorReflectance: 0.7 })).warnings.map((w) => w.code)).not.toContain('low-finesse');
  });

  it('says so when the target is outside the range', () => {
    const answer = designInterferenceFilter(filter({ rangeNm: { startNm: 520, endNm: 700 } }));
    expect(answer.warnings.map((w) => w.code)).toContain('target-outside-range');
  });
});

describe('Fabry–Pérot edge inputs', () => {
  it('R = 0.999999 in order 1000 stays finite: finesse ≈ 3.1416e6, Airy 1 at the peak, tiny between', () => {
    // π√R/(1 − R) = π·0.9999995/1e-6 = 3.141591e6 (Hecht, §9.6); F = 4R/(1 − R)² ≈ 4e12.
    expectClose(reflectingFinesse(0.999999), 3.141591e6, 1e-6);
    const t = spacerThicknessNm(500, 1000, 1.5); // 2nt = 5e5 nm
    // The order-number reduction keeps the peak exact even in order 1000.
    expectClose(airyTransmission(500, t, 1.5, 0.999999), 1, 1e-9);
    // Half-way to the next order, 1/(1 + F) ≈ 2.5e-13.
    expectClose(airyTransmission(5e5 / 1000.5, t, 1.5, 0.999999), 1 / (1 + 4 * 0.999999 / 1e-12), 1e-6);
  });

  it.each([0.001, 1e7, 0, -5, Number.NaN, Number.POSITIVE_INFINITY])('the Airy function at %s nm is a number in [0, 1]', (wavelengthNm) => {
    const value = airyTransmission(wavelengthNm, 5e5, 1.5, 0.9);
    expect(Number.isFinite(value)).toBe(true);
    expect(value).toBeGreaterThanOrEqual(0);
    expect(value).toBeLessThanOrEqual(1);
    if (!(wavelengthNm > 0 && wavelengthNm < Number.POSITIVE_INFINITY)) expect(value).toBe(0); // no phase to form
  });

  it('tilting beyond what n_eff allows gives 0 nm, not NaN', () => {
    // n_eff = 1 at 90°: √(1 − 1) = 0 (the formula's own limit).
    expectClose(tiltedPeakNm(500, deg(90), 1), 0, 0, 1e-9);
    expect(tiltedPeakNm(500, deg(90), 0.5)).toBe(0);
  });
});
