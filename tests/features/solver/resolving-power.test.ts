import { describe, expect, it } from 'vitest';
import {
  diffractionLimitNm,
  evaluateDesign,
  freeSpectralRangeNm,
  grooveCount,
  resolutionElementNm,
  resolvingPower,
  theoreticalResolvingPower,
} from '@/features/solver';
import { expectClose } from './close-to';
import { makeDesign } from './fixtures';

describe('resolving power', () => {
  it('the grating can resolve R = |m| N, N the grooves across the ruled width', () => {
    // Born & Wolf, Principles of Optics: R = mN. 1200 g/mm × 50 mm = 60,000 grooves.
    expect(grooveCount(1200, 50)).toBe(60000);
    expect(theoreticalResolvingPower(2, 60000)).toBe(120000);
    expect(theoreticalResolvingPower(-2, 60000)).toBe(120000);
    expectClose(diffractionLimitNm(600, 1, 60000), 0.01, 1e-12);
  });

  it('free spectral range is λ / |m|', () => {
    // Palmer & Loewen, ch. 2.
    expectClose(freeSpectralRangeNm(600, 3), 200, 1e-12);
    expectClose(freeSpectralRangeNm(600, -3), 200, 1e-12);
  });

  it('delivered resolving power adds the slit bandpass and the diffraction limit in quadrature', () => {
    // Common practice: FWHMs of convolved near-Gaussian profiles add in quadrature.
    const p = evaluateDesign(makeDesign(), { wavelengthsNm: [500] }).points[0]!;
    const b = p.bandpassNm ?? NaN;
    expectClose(p.resolvingPower, 500 / Math.sqrt(b * b + p.diffractionLimitNm ** 2), 1e-12);
    // Wide slits: the slits set the resolution, within a fraction of a per cent of λ / bandpass.
    expectClose(p.resolvingPower, 500 / b, 0.01 * (500 / b));
    expect(p.resolvingPower!).toBeLessThan(p.theoreticalResolvingPower);
  });

  it('where the bandpass equals the diffraction limit, R is |m|N / √2, not |m|N', () => {
    // The case the larger-of-the-two rule got wrong by √2 (common practice: quadrature sum).
    expectClose(resolutionElementNm(0.01, 0.01), 0.01 * Math.SQRT2, 1e-15);
    expectClose(resolvingPower(600, 0.01, 0.01), 60000 / Math.SQRT2, 1e-9);
  });

  it('the quadrature sum is the FWHM of two convolved Gaussians (numerical convolution)', () => {
    // Independent check: convolve two Gaussians of FWHM 3 and 4 on a grid and measure the FWHM
    // of the result; for Gaussians the quadrature rule is exact (5).
    const step = 0.005;
    const xs = Array.from({ length: 6001 }, (_, i) => (i - 3000) * step);
    const gauss = (fwhm: number) => xs.map((x) => Math.exp((-4 * Math.LN2 * x * x) / (fwhm * fwhm)));
    const a = gauss(3);
    const g = gauss(4);
    const conv = xs.map((_, i) => {
      let sum = 0;
      for (let j = Math.max(0, i - 3000); j <= Math.min(6000, i + 3000); j++) sum += a[j]! * g[i - j + 3000]!;
      return sum;
    });
    const peak = Math.max(...conv);
    const above = xs.filter((_, i) => conv[i]! >= peak / 2);
    const fwhm = above[above.length - 1]! - above[0]!;
    expectClose(fwhm, resolutionElementNm(3, 4), 2 * step);
  });

  it('slits below the diffraction limit: the grating sets the resolution and both figures are reported', () => {
    // Trap: a 1 µm slit on a 10 mm wide, 300 g/mm grating (N = 3000) at 600 nm. The slit bandpass
    // is about 0.01 nm; the diffraction limit λ/(mN) = 0.2 nm (Born & Wolf) dominates.
    const design = makeDesign({
      grating: { grooveDensityPerMm: 300, ruledWidthMm: 10 },
      slits: { entranceWidthUm: 1, exitWidthUm: 1 },
      range: { startNm: 550, endNm: 650 },
      detector: undefined,
      source: undefined,
    });
    const evaluation = evaluateDesign(design, { wavelengthsNm: [600] });
    const p = evaluation.points[0]!;
    expect(p.bandpassNm!).toBeLessThan(p.diffractionLimitNm);
    expectClose(p.diffractionLimitNm, 0.2, 1e-12);
    // Never claims more than the grating can do: close to |m|N, below it.
    expect(p.resolvingPower!).toBeLessThan(p.theoreticalResolvingPower);
    expect(p.resolvingPower!).toBeGreaterThan(0.99 * p.theoreticalResolvingPower);
    const warning = evaluation.warnings.find((w) => w.code === 'below-diffraction-limit');
    expect(warning?.wavelengthNm).toBe(600);
    expect(warning?.message).toContain('diffraction limit 0.2 nm');
    expect(warning?.message).toMatch(/slit bandpass 0\.0\d+ nm/);
  });
});
