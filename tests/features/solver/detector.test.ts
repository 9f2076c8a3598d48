import { describe, expect, it } from 'vitest';
import { evaluateDesign } from '@/features/solver';
import { deg, expectClose } from './close-to';
import { makeDesign, spacing } from './fixtures';

/**
 * Where a wavelength lands on a flat detector normal to the central ray at the camera focal
 * length, computed forward (λ → β by the grating equation at fixed α → x = f tan(β − β_c)): the
 * inverse of what the solver does, so the two meet only if both are right.
 */
function landingMm(lambda: number, order: number, d: number, alpha: number, betaC: number, f: number) {
  const beta = Math.asin((order * lambda) / d - Math.sin(alpha));
  return Math.sign(order) * f * Math.tan(beta - betaC);
}

describe('detector coverage with the exact per-pixel angle', () => {
  const design = makeDesign({ detector: { pixelPitchUm: 25, pixelCount: 2048 }, range: { startNm: 500, endNm: 700 } });
  const evaluation = evaluateDesign(design, { wavelengthsNm: [600] });
  const detector = evaluation.design.detector!;
  const centre = evaluation.points[0]!;
  const alpha = deg(centre.incidenceDeg ?? NaN);
  const betaC = deg(centre.diffractionDeg ?? NaN);

  it('puts the centre of the range on the detector centre and the edges at ±half its width', () => {
    // Palmer & Loewen, ch. 2 (grating equation at fixed incidence) plus flat-field geometry.
    expectClose(detector.widthMm, 51.2, 1e-12);
    expectClose(landingMm(detector.startNm!, 1, spacing(1200), alpha, betaC, 300), -25.6, 1e-9);
    expectClose(landingMm(detector.endNm!, 1, spacing(1200), alpha, betaC, 300), 25.6, 1e-9);
    expect(detector.startNm!).toBeLessThan(600);
    expect(detector.endNm!).toBeGreaterThan(600);
  });

  it('differs from the linear-dispersion estimate on a wide detector', () => {
    const linearCoverage = (centre.reciprocalDispersionNmPerMm ?? NaN) * detector.widthMm;
    expect(Math.abs((detector.coverageNm ?? NaN) - linearCoverage)).toBeGreaterThan(0.05);
    expectClose(detector.coverageNm, linearCoverage, 0.01); // but close: dispersion drifts slowly
  });

  it('gives nm per pixel from the centre dispersion and pixels per bandpass from it', () => {
    expectClose(detector.nmPerPixel, (centre.reciprocalDispersionNmPerMm ?? NaN) * 0.025, 1e-12);
    expectClose(detector.pixelsPerBandpass, (centre.bandpassNm ?? NaN) / detector.nmPerPixel, 1e-12);
    expect(detector.coversRange).toBe(false); // 2048 × 25 µm at ~2.76 nm/mm covers ~141 nm of 200
  });

  it('runs toward longer wavelengths in negative orders too', () => {
    const negative = evaluateDesign(makeDesign({ grating: { order: -1 }, range: { startNm: 500, endNm: 700 } }), { points: 3 });
    const d = negative.design.detector!;
    expect(d.endNm!).toBeGreaterThan(d.startNm!);
    expectClose((d.startNm! + d.endNm!) / 2, 600, 0.01);
  });

  it('warns when the bandpass covers fewer than 2 pixels (common practice: 2–3)', () => {
    const coarse = evaluateDesign(
      makeDesign({ detector: { pixelPitchUm: 100, pixelCount: 256 }, slits: { entranceWidthUm: 50, exitWidthUm: 50 } }),
      { points: 5 },
    );
    expect(coarse.design.detector!.pixelsPerBandpass).toBeLessThan(2);
    const w = coarse.warnings.find((x) => x.code === 'undersampled');
    expect(w?.message).toMatch(/at least 2/);
    const fine = evaluateDesign(makeDesign(), { points: 5 });
    expect(fine.warnings.some((x) => x.code === 'undersampled')).toBe(false);
  });

  it('is null without a detector', () => {
    expect(evaluateDesign(makeDesign({ detector: undefined }), { points: 3 }).design.detector).toBeNull();
  });
});
