import { describe, expect, it } from 'vitest';
import { requirementSensitivities, toleranceView, type SensitivityRow } from '@/features/requirements';
import { expectClose } from '../solver/close-to';
import { makeDesign } from '../solver/fixtures';
import { littrowDesign } from './littrow-fixture';

const D_NM = 1e6 / 1200;
const ARCSEC_RAD = Math.PI / 648_000;
/** Littrow, α = β = φ, sin φ = λ / 2d: cos φ at 400, 500 and 600 nm. */
const COS_400 = Math.sqrt(1 - 0.24 ** 2);
const COS_500 = Math.sqrt(1 - 0.3 ** 2);
const COS_600 = Math.sqrt(1 - 0.36 ** 2);
/** RLD = d cos β / (m f) (Palmer & Loewen, ch. 2), f = 500 mm. Worst (largest) at 400 nm. */
const RLD_400 = (D_NM * COS_400) / 500;

function effect(rows: SensitivityRow[], path: string, figure: string) {
  const found = rows.find((r) => r.path === path)?.effects.find((e) => e.requirement === figure);
  expect(found, `${figure} under ${path}`).toBeDefined();
  return found!;
}

describe('requirementSensitivities', () => {
  it('without requirements follows bandpass, reciprocal dispersion and resolving power at their worst', () => {
    const rows = requirementSensitivities(littrowDesign());
    // One optic in Littrow: one focal-length row; no deviation row (it must stay 0).
    expect(rows.map((r) => r.path)).toEqual([
      'slits.exitWidthUm',
      'slits.entranceWidthUm',
      'layout.collimatorFocalMm',
      'grating.grooveDensityPerMm',
      'grating.ruledWidthMm',
    ]);
    expect(rows[0]!.effects.map((e) => e.requirement)).toEqual(['bandpass', 'reciprocalDispersion', 'resolvingPower']);
  });

  it('a wider exit slit widens the bandpass by RLD × 10 µm (Palmer & Loewen, ch. 9)', () => {
    // The exit slit becomes the wider one: bandpass = RLD × 0.110 mm, up by 1.61804 × 0.01 = 0.0161804 nm at 400 nm.
    const rows = requirementSensitivities(littrowDesign());
    const bandpass = effect(rows, 'slits.exitWidthUm', 'bandpass');
    expectClose(bandpass.delta, RLD_400 * 0.01, 1e-9);
    expect(bandpass.text).toBe('+10\u00A0µm exit slit → +0.016\u00A0nm bandpass');
    expect(effect(rows, 'slits.exitWidthUm', 'resolvingPower').delta).toBeLessThan(0);
    // Littrow's one lens images the entrance slit at its own width, so with matched slits either
    // one opened alone becomes the wider and sets the FWHM: the same step.
    expectClose(effect(rows, 'slits.entranceWidthUm', 'bandpass').delta, RLD_400 * 0.01, 1e-9);
  });

  it('a longer focal length lowers the reciprocal dispersion as 1/f', () => {
    // d cos β / 510 − d cos β / 500 at 400 nm = 1.61804 × (500/510 − 1) = −0.0317263 nm/mm.
    const rows = requirementSensitivities(littrowDesign());
    const rld = effect(rows, 'layout.collimatorFocalMm', 'reciprocalDispersion');
    expectClose(rld.delta, RLD_400 * (500 / 510 - 1), 1e-9);
    expect(rld.text).toMatch(/^\+10\u00A0mm focal length → −0\.032\u00A0nm\/mm reciprocal dispersion$/u);
  });

  it('signs match the physics for a Czerny–Turner’s requirements, with the margin moving the other way', () => {
    const design = makeDesign({ requirements: { maxBandpassNm: 0.5, maxReciprocalDispersionNmPerMm: 3 } });
    const rows = requirementSensitivities(design);
    const exitBandpass = effect(rows, 'slits.exitWidthUm', 'maxBandpassNm');
    expect(exitBandpass.delta).toBeGreaterThan(0);
    expect(exitBandpass.marginDelta).toBeLessThan(0);
    const cameraRld = effect(rows, 'layout.cameraFocalMm', 'maxReciprocalDispersionNmPerMm');
    expect(cameraRld.delta).toBeLessThan(0);
    expect(cameraRld.marginDelta).toBeGreaterThan(0);
    // The collimator does not enter d cos β / (m f_cam).
    expect(effect(rows, 'layout.collimatorFocalMm', 'maxReciprocalDispersionNmPerMm').delta).toBe(0);
    // More grooves per mm, smaller d: lower RLD.
    expect(effect(rows, 'grating.grooveDensityPerMm', 'maxReciprocalDispersionNmPerMm').delta).toBeLessThan(0);
  });

  it('a wider ruled width makes the collimator beam faster (smaller f-number)', () => {
    // f / (W cos α): 300 / (55 cos α) < 300 / (50 cos α).
    const rows = requirementSensitivities(makeDesign({ requirements: { maxFNumber: 10 } }));
    expect(effect(rows, 'grating.ruledWidthMm', 'maxFNumber').delta).toBeLessThan(0);
  });
});

describe('toleranceView', () => {
  const design = littrowDesign({ driveStepArcsec: 2, maxWavelengthErrorNm: 1 });

  it('slits ±10 % → bandpass ±10 % at the worst wavelength (bandpass ∝ slit width)', () => {
    const { slits } = toleranceView(design);
    expect(slits?.wavelengthNm).toBe(400);
    expectClose(slits?.nominalNm, RLD_400 * 0.1, 1e-9);
    expectClose(slits?.lowNm, RLD_400 * 0.09, 1e-9);
    expectClose(slits?.highNm, RLD_400 * 0.11, 1e-9);
    expect(slits?.text).toContain('at 400\u00A0nm');
  });

  it('drive error → wavelength error 2d cos φ / m per radian at start, centre and end', () => {
    // Palmer & Loewen, ch. 2, K = 0: dλ/dφ = 2d cos φ; the requirements' 2″ step by default.
    const { drive } = toleranceView(design);
    expect(drive.errorArcsec).toBe(2);
    const expected = [COS_400, COS_500, COS_600].map((c) => 2 * D_NM * c * ARCSEC_RAD * 2);
    drive.points.forEach((p, i) => expectClose(p.errorNm, expected[i]!, 1e-9));
    expect(drive.points.map((p) => p.wavelengthNm)).toEqual([400, 500, 600]);
    expect(toleranceView(design, { driveErrorArcsec: 1 }).drive.points[0]!.errorNm).toBeCloseTo(expected[0]! / 2, 12);
  });

  it('focal length ±1 % → RLD / (1 ∓ 0.01) at the centre', () => {
    const { focal } = toleranceView(design);
    const nominal = (D_NM * COS_500) / 500;
    expectClose(focal?.shortFocalNmPerMm, nominal / 0.99, 1e-9);
    expectClose(focal?.longFocalNmPerMm, nominal / 1.01, 1e-9);
    expectClose(focal?.errorNmPerMm, nominal / 0.99 - nominal, 1e-9);
  });

  it('refuses out-of-range options, naming the option', () => {
    expect(() => toleranceView(design, { slitFraction: 1.5 })).toThrow(/slitFraction/);
    expect(() => toleranceView(design, { focalFraction: 0 })).toThrow(/focalFraction/);
    expect(() => toleranceView(design, { driveErrorArcsec: -1 })).toThrow(/driveErrorArcsec/);
  });
});
