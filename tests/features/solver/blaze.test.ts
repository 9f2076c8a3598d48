import { describe, expect, it } from 'vitest';
import { blazeEfficiency, blazeWavelengthInMountNm, evaluateDesign } from '@/features/solver';
import { deg, expectClose } from './close-to';
import { makeDesign } from './fixtures';

describe('scalar blaze envelope', () => {
  it('peaks at λ_B cos K / |m| in a constant-deviation mount', () => {
    // Palmer & Loewen, ch. 9: the blaze wavelength moves to λ_B(Littrow) · cos K.
    const K = deg(15);
    const peak = blazeWavelengthInMountNm(500, K, 1);
    expectClose(peak, 500 * Math.cos(K), 1e-14);
    expectClose(blazeEfficiency(peak, 1, 500, K), 1, 1e-12);
    expect(blazeEfficiency(peak * 1.01, 1, 500, K)).toBeLessThan(1);
    expect(blazeEfficiency(peak * 0.99, 1, 500, K)).toBeLessThan(1);
    // Second order peaks at half the wavelength.
    expectClose(blazeEfficiency(peak / 2, 2, 500, K), 1, 1e-12);
  });

  it('falls to about 40 % at 2/3 and 2× the blaze wavelength in first order', () => {
    // Common practice: sinc²(π/2) = 4/π² ≈ 0.405 at both ends of the useful range.
    expectClose(blazeEfficiency((2 / 3) * 500, 1, 500, 0), 4 / Math.PI ** 2, 1e-12);
    expectClose(blazeEfficiency(1000, 1, 500, 0), 4 / Math.PI ** 2, 1e-12);
  });

  it('is zero at the wavelengths where the facet phase makes a whole extra wave', () => {
    // sinc²(π·n) = 0: in first order at λ_B/2, where the second order is at its blaze.
    expect(blazeEfficiency(250, 1, 500, 0)).toBeLessThan(1e-25);
  });

  it('treats a negative working order like its positive twin (blaze faces the working order)', () => {
    expectClose(blazeEfficiency(420, -1, 500, deg(10)), blazeEfficiency(420, 1, 500, deg(10)), 1e-15);
  });

  it('is null without a blaze wavelength, and flagged below 20 % of its peak', () => {
    const none = evaluateDesign(makeDesign({ grating: { blazeWavelengthNm: undefined } }), { points: 5 });
    expect(none.points.every((p) => p.blazeEfficiency === null)).toBe(true);
    expect(none.design.blazeWavelengthInMountNm).toBeNull();

    // Blazed at 250 nm, measured at 600–900 nm: far past 2× the blaze.
    const far = evaluateDesign(makeDesign({ grating: { blazeWavelengthNm: 250 }, range: { startNm: 600, endNm: 900 } }), { points: 7 });
    const warning = far.warnings.find((w) => w.code === 'low-efficiency');
    expect(warning).toBeDefined();
    expect(warning?.message).toContain('scalar blaze estimate');
  });
});
