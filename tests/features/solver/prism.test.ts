import { describe, expect, it } from 'vitest';
import {
  PRISM_MATERIALS,
  prismAngularDispersionRadPerNm,
  prismBandpassNm,
  prismMinDeviationRad,
  prismMonochromator,
  prismPoint,
  prismResolvingPower,
} from '@/features/solver';
import type { PrismInput } from '@/shared/selectors';
import { deg, expectClose, toDeg } from './close-to';

const silica = PRISM_MATERIALS['fused-silica'].sellmeier;

const prism = (over: Partial<PrismInput> = {}): PrismInput => ({
  kind: 'prism',
  material: 'fused-silica',
  apexDeg: 60,
  baseMm: 50,
  wavelengthsNm: [400, 500, 600],
  ...over,
});

describe('prism at minimum deviation', () => {
  it.each([
    // D = 2 asin(n sin(A/2)) − A on a 60° prism (Born & Wolf, §4.7; Hecht, §5.5):
    { index: 1.5, expectedDeg: 37.18076 }, // asin(0.75) = 48.59038°, 2·48.59038 − 60
    { index: 1.4, expectedDeg: 28.85401 }, // asin(0.7) = 44.427004°, 2·44.427004 − 60
    { index: 1.0, expectedDeg: 0 }, // no glass, no deviation
  ] satisfies { index: number; expectedDeg: number }[])('n = $index gives D = $expectedDeg°', ({ index, expectedDeg }) => {
    expectClose(toDeg(prismMinDeviationRad(index, deg(60))!), expectedDeg, 1e-6, 1e-9);
  });

  it.each([1.3, 1.5, 1.7, 1.9])('n = sin((D + A)/2) / sin(A/2) recovers n = %s from the deviation', (index) => {
    // Born & Wolf, §4.7: the minimum-deviation method of measuring n.
    const a = deg(60);
    const d = prismMinDeviationRad(index, a)!;
    expectClose(Math.sin((d + a) / 2) / Math.sin(a / 2), index, 1e-12);
  });

  it('no ray passes when n sin(A/2) ≥ 1: null deviation and dispersion', () => {
    // n = 1.5, A = 90°: 1.5·sin 45° = 1.0607 ≥ 1 (Hecht, §5.5: total internal reflection).
    expect(prismMinDeviationRad(1.5, deg(90))).toBeNull();
    expect(prismAngularDispersionRadPerNm(1.5, -1e-4, deg(90))).toBeNull();
    // Exactly at the limit, n sin(A/2) = 1 (n = 2, A = 60°): grazing in and out, still no path.
    expect(prismMinDeviationRad(2, deg(60))).toBeNull();
  });

  it('angular dispersion 2 sin(A/2)/√(1 − n² sin²(A/2)) · |dn/dλ|', () => {
    // Born & Wolf, §4.7. n = 1.5, A = 60°, dn/dλ = −1e-4 /nm: 2·0.5/√(1 − 0.5625) = 1/0.661438
    // = 1.511858 → 1.511858e-4 rad/nm (a magnitude).
    expectClose(prismAngularDispersionRadPerNm(1.5, -1e-4, deg(60)), 1.511858e-4, 1e-6);
  });

  it('R = b |dn/dλ|: a 50 mm fused-silica base at 500 nm resolves about 2768', () => {
    // Born & Wolf, §4.7. dn/dλ at 500 nm from Malitson 1965 by hand (see sellmeier.test.ts):
    // −5.53564e-5 /nm; b = 50 mm = 5e7 nm → R = 5e7·5.53564e-5 = 2767.82.
    expectClose(prismResolvingPower(50, -5.53564e-5), 2767.82, 1e-6);
    expectClose(prismPoint(silica, deg(60), 50, 500).resolvingPower, 2767.82, 1e-5);
  });

  it('bandpass = RLD × wider slit, RLD = 1/(f_cam dD/dλ), the entrance image scaled by f_cam/f_col', () => {
    // Palmer & Loewen, ch. 9 (the grating's model with the prism's dispersion). dD/dλ = 1.511858e-4
    // rad/nm, f_cam = 500 mm → RLD = 1/0.0755929 = 13.2288 nm/mm; 50 µm slits → 0.661438 nm.
    expectClose(prismBandpassNm(1.511858e-4, 500, 500, 50, 50), 0.661438, 1e-5);
    // f_cam = 1000, f_col = 500: image 100 µm is the wider; RLD 6.61438 nm/mm → 0.661438 nm again.
    expectClose(prismBandpassNm(1.511858e-4, 1000, 500, 50, 50), 0.661438, 1e-5);
    // A 200 µm exit slit with a 100 µm image: 6.61438·0.2 = 1.322876 nm.
    expectClose(prismBandpassNm(1.511858e-4, 1000, 500, 50, 200), 1.322876, 1e-5);
  });
});

describe('prism points and the monochromator answer', () => {
  it('a point on fused silica carries index, deviation, dispersion and R, in degrees', () => {
    // Malitson 1965 at 500 nm: n = 1.4623265; D = 2 asin(0.73116325) − 60° = 33.96800°.
    const p = prismPoint(silica, deg(60), 50, 500);
    expect(p.reason).toBeNull();
    expectClose(p.index, 1.4623265, 0, 1e-7);
    expectClose(p.minDeviationDeg, 33.968, 0, 1e-3);
    expectClose(p.angularDispersionDegPerNm, toDeg(prismAngularDispersionRadPerNm(p.index!, p.dnDlambdaPerNm!, deg(60))!), 1e-12);
    expect(p.bandpassNm).toBeNull(); // no monochromator given
  });

  it('a TIR point keeps its index and gives a reason instead of the path figures', () => {
    // Fused silica n ≈ 1.46 and A = 100°: 1.46·sin 50° = 1.12 ≥ 1.
    const p = prismPoint(silica, deg(100), 50, 500);
    expect(p.index).not.toBeNull();
    expect(p.minDeviationDeg).toBeNull();
    expect(p.angularDispersionDegPerNm).toBeNull();
    expect(p.resolvingPower).toBeNull();
    expect(p.reason).toMatch(/total.*internal/i);
  });

  it('dispersion rises toward the blue: the prism is non-linear, bandpass widening to the red', () => {
    // Normal dispersion: |dn/dλ| falls with λ (Hecht, §3.5), so R and dD/dλ fall, bandpass grows.
    const answer = prismMonochromator(
      prism({ wavelengthsNm: [300, 500, 800], collimatorFocalMm: 500, cameraFocalMm: 500, entranceWidthUm: 50, exitWidthUm: 50 }),
    );
    const [blue, green, red] = answer.points;
    expect(blue!.resolvingPower!).toBeGreaterThan(green!.resolvingPower!);
    expect(green!.resolvingPower!).toBeGreaterThan(red!.resolvingPower!);
    expect(blue!.bandpassNm!).toBeLessThan(green!.bandpassNm!);
    expect(green!.bandpassNm!).toBeLessThan(red!.bandpassNm!);
    expect(answer.warnings).toEqual([]);
  });

  it('warns outside the fitted range and where no ray passes', () => {
    const outside = prismMonochromator(prism({ wavelengthsNm: [200, 500, 5000] }));
    const message = outside.warnings.find((w) => w.code === 'outside-data')!.message;
    expect(message).toContain('200');
    expect(message).toContain('5000');
    expect(outside.material.validFromNm).toBe(210);

    const tir = prismMonochromator(prism({ apexDeg: 100 }));
    expect(tir.warnings.map((w) => w.code)).toContain('no-path');
  });

  it('a custom formula with a resonance inside the range gives null there and a no-index warning', () => {
    const answer = prismMonochromator(prism({ material: { sellmeier: { B: [1], C: [0.5] } }, wavelengthsNm: [400, 500, 600] }));
    expect(answer.material.id).toBe('custom');
    expect(answer.points[1]!.index).toBeNull();
    expect(answer.points[1]!.reason).toMatch(/no real index/);
    expect(answer.warnings.map((w) => w.code)).toContain('no-index');
  });

  it('asks for all four optics fields when only some are given', () => {
    const answer = prismMonochromator(prism({ cameraFocalMm: 500 }));
    expect(answer.points.every((p) => p.bandpassNm === null)).toBe(true);
    expect(answer.warnings.map((w) => w.code)).toContain('incomplete-monochromator');
  });
});
