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

  describe('against the groove-facet scalar model', () => {
    // The groove-facet form of scalar theory (Schroeder & Hilliard, Appl. Opt. 19, 2833 (1980);
    // from memory): a facet of width d cos θ_B tilted by θ_B gives the envelope
    // sinc²(π d cos θ_B (sin(α − θ_B) + sin(β − θ_B)) / λ). Our estimate is its small-angle form.
    const sinc = (x: number) => (Math.abs(x) < 1e-12 ? 1 : Math.sin(x) / x);
    const facetModel = (lambda: number, d: number, thetaB: number) => {
      const phi = Math.asin(lambda / (2 * d)); // Littrow, first order
      const arg = (Math.PI * d * Math.cos(thetaB) * 2 * Math.sin(phi - thetaB)) / lambda;
      return sinc(arg) ** 2;
    };
    /** Largest gap between the two over 2/3 to 2× the blaze wavelength (the useful range, common practice). */
    const largestGap = (blazeDeg: number, maxLambdaOverD = Infinity) => {
      const d = 1000;
      const thetaB = deg(blazeDeg);
      const blazeNm = 2 * d * Math.sin(thetaB);
      let gap = 0;
      for (let i = 0; i <= 200; i++) {
        const lambda = blazeNm * (2 / 3 + (i / 200) * (4 / 3));
        if (lambda / d > Math.min(1.9, maxLambdaOverD)) continue;
        gap = Math.max(gap, Math.abs(facetModel(lambda, d, thetaB) - blazeEfficiency(lambda, 1, blazeNm, 0)));
      }
      return gap;
    };

    it('agrees to 0.005 where λ/d stays below 0.2 (small blaze angles), where the solver does not warn', () => {
      expect(largestGap(2)).toBeLessThan(0.005);
      expect(largestGap(5, 0.2)).toBeLessThan(0.005);
    });

    it('drifts by a tenth or more at blaze angles of 25–30°, where λ/d is well past 0.2', () => {
      expect(largestGap(25)).toBeGreaterThan(0.1);
      expect(largestGap(30)).toBeGreaterThan(0.15);
    });
  });
});
