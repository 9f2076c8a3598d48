import { describe, expect, it } from 'vitest';
import {
  diffractionLimitNm,
  evaluateDesign,
  freeSpectralRangeNm,
  grooveCount,
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

  it('delivered resolving power is λ / bandpass when the slits set the resolution', () => {
    const p = evaluateDesign(makeDesign(), { wavelengthsNm: [500] }).points[0]!;
    expectClose(p.resolvingPower, 500 / (p.bandpassNm ?? NaN), 1e-12);
    expect(p.resolvingPower!).toBeLessThan(p.theoreticalResolvingPower);
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
    // Never claims more than the grating can do.
    expectClose(p.resolvingPower, p.theoreticalResolvingPower, 1e-12);
    const warning = evaluation.warnings.find((w) => w.code === 'below-diffraction-limit');
    expect(warning?.wavelengthNm).toBe(600);
    expect(warning?.message).toContain('diffraction limit 0.2 nm');
    expect(warning?.message).toMatch(/slit bandpass 0\.0\d+ nm/);
  });
});
