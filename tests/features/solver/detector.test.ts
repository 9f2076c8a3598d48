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

/**
 * Width on a flat detector of one resolution element at `lambda`, worked forward from the grating
 * equation at the fixed centre incidence: the entrance-slit image `w cos α / cos β · f_cam/f_col`
 * (Palmer & Loewen, ch. 2) or the diffraction-limited line `f_cam λ / (N d cos β)` (Born & Wolf:
 * angular half-width λ/(N d cos β)), the wider, stretched by `1/cos²(β − β_c)` where the flat
 * detector meets the ray obliquely.
 */
function elementUm(lambda: number, d: number, alpha: number, betaC: number, o: { entranceUm: number; fCol: number; fCam: number; grooves: number }) {
  const beta = Math.asin(lambda / d - Math.sin(alpha));
  const stretch = 1 / Math.cos(beta - betaC) ** 2;
  const image = ((o.entranceUm * Math.cos(alpha)) / Math.cos(beta)) * (o.fCam / o.fCol) * stretch;
  const spot = ((o.fCam * lambda) / (o.grooves * d * Math.cos(beta))) * 1000 * stretch;
  return Math.max(image, spot);
}

describe('spectrograph sampling: the detector sees the entrance-slit image, not the exit slit', () => {
  it('a 10 µm entrance and a 1000 µm exit slit give 0.32 pixels per resolution element, not 40, and warn', () => {
    // The case from the cross-check: the old figure divided the exit-slit bandpass by the pixel.
    const evaluation = evaluateDesign(makeDesign({ slits: { entranceWidthUm: 10, exitWidthUm: 1000 } }), { points: 5 });
    const detector = evaluation.design.detector!;
    expectClose(detector.pixelsPerBandpass, 40, 1e-9); // the monochromator's figure, kept
    const centre = evaluateDesign(makeDesign(), { wavelengthsNm: [600] }).points[0]!;
    const alpha = deg(centre.incidenceDeg ?? NaN);
    const betaC = deg(centre.diffractionDeg ?? NaN);
    const optics = { entranceUm: 10, fCol: 300, fCam: 300, grooves: 60000 };
    const centreSample = detector.samples.find((x) => x.position === 'centre')!;
    expectClose(centreSample.pixelsPerResolutionElement, elementUm(600, spacing(1200), alpha, betaC, optics) / 25, 1e-9);
    expect(centreSample.pixelsPerResolutionElement).toBeCloseTo(0.32, 2); // the figure
    const warning = evaluation.warnings.find((w) => w.code === 'undersampled');
    expect(warning?.message).toMatch(/fewer than 2 detector pixels: only 0\.32\d? at/);
    expect(warning?.message).toContain('entrance-slit image');
  });

  it('samples the range ends as well as the centre, and warns when only an end is undersampled', () => {
    // 60° deviation, 100–300 nm: the centre's β is steeper than the long end's, so the entrance
    // image is narrowest at 300 nm. A 20.9 µm pitch leaves the centre just above 2 pixels.
    const design = makeDesign({
      layout: { deviationAngleDeg: 60 },
      range: { startNm: 100, endNm: 300 },
      slits: { entranceWidthUm: 50 },
      detector: { pixelPitchUm: 20.9, pixelCount: 4096 },
    });
    const evaluation = evaluateDesign(design, { points: 5 });
    const detector = evaluation.design.detector!;
    expect(detector.samples.map((x) => [x.position, x.wavelengthNm])).toEqual([
      ['start', 100],
      ['centre', 200],
      ['end', 300],
    ]);
    const centre = evaluateDesign(design, { wavelengthsNm: [200] }).points[0]!;
    const alpha = deg(centre.incidenceDeg ?? NaN);
    const betaC = deg(centre.diffractionDeg ?? NaN);
    const optics = { entranceUm: 50, fCol: 300, fCam: 300, grooves: 60000 };
    for (const sample of detector.samples) {
      expectClose(sample.pixelsPerResolutionElement, elementUm(sample.wavelengthNm, spacing(1200), alpha, betaC, optics) / 20.9, 1e-9);
    }
    const [start, middle, end] = detector.samples;
    expect(middle!.pixelsPerResolutionElement).toBeGreaterThanOrEqual(2);
    expect(start!.pixelsPerResolutionElement).toBeGreaterThanOrEqual(2);
    expect(end!.pixelsPerResolutionElement).toBeLessThan(2);
    expect(detector.pixelsPerResolutionElement).toBe(end!.pixelsPerResolutionElement);
    const warning = evaluation.warnings.find((w) => w.code === 'undersampled');
    expect(warning?.wavelengthNm).toBe(300);
    expect(warning?.message).toMatch(/^At 300 nm \(range end\) a resolution element/);
  });

  it('uses the diffraction-limited line when it is wider than the entrance image', () => {
    // 1 µm slit on a 10 mm wide 300 g/mm grating (N = 3000): λ/(mN) = 0.2 nm at 600 nm (Born & Wolf).
    const design = makeDesign({
      grating: { grooveDensityPerMm: 300, ruledWidthMm: 10 },
      slits: { entranceWidthUm: 1, exitWidthUm: 1 },
      range: { startNm: 550, endNm: 650 },
      detector: { pixelPitchUm: 5, pixelCount: 1024 },
    });
    const evaluation = evaluateDesign(design, { wavelengthsNm: [600] });
    const centre = evaluation.design.detector!.samples.find((x) => x.position === 'centre')!;
    expect(centre.diffractionSpotUm).toBeGreaterThan(centre.entranceImageUm);
    const point = evaluation.points[0]!;
    // The line's width on the detector is the diffraction limit over the reciprocal dispersion.
    expectClose(centre.diffractionSpotUm, (0.2 / (point.reciprocalDispersionNmPerMm ?? NaN)) * 1000, 1e-9);
    expectClose(centre.pixelsPerResolutionElement, centre.diffractionSpotUm / 5, 1e-12);
  });

  it('names the sampled wavelengths where the range runs off the detector', () => {
    // 1024 × 25 µm at ~2.76 nm/mm sees about 71 nm of the 300–900 nm range: its edges are sampled.
    const detector = evaluateDesign(makeDesign(), { points: 3 }).design.detector!;
    expect(detector.coversRange).toBe(false);
    expect(detector.samples[0]!.wavelengthNm).toBe(detector.startNm);
    expect(detector.samples[2]!.wavelengthNm).toBe(detector.endNm);
  });
});
