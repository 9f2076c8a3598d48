import { describe, expect, it } from 'vitest';
import {
  REQUIREMENT_POINTS,
  checkRequirements,
  hasRequirements,
  requirementFailsAt,
  type RequirementCheck,
} from '@/features/requirements';
import { evaluateDesign, proposeOrderSortingPlan } from '@/features/solver';
import type { Requirements } from '@/shared/requirements';
import { expectClose } from '../solver/close-to';
import { makeDesign } from '../solver/fixtures';
import { JUST, littrowDesign } from './littrow-fixture';

const D_NM = 1e6 / 1200;
const COS_BETA_500 = Math.sqrt(0.91);

function only(requirements: Requirements, design = littrowDesign(requirements)): RequirementCheck {
  const { checks } = checkRequirements(design);
  expect(checks).toHaveLength(1);
  return checks[0]!;
}

describe('a design without limits', () => {
  it('gives an empty report without a requirements block', () => {
    expect(checkRequirements(littrowDesign())).toEqual({ checks: [], passed: 0, failed: 0, unknown: 0 });
    expect(hasRequirements(littrowDesign())).toBe(false);
  });

  it('gives an empty report when only the qualifiers are set (a wavelength list, a drive step)', () => {
    const design = littrowDesign({ atWavelengthsNm: [500], driveStepArcsec: 2, oneShotCoverage: false });
    expect(checkRequirements(design).checks).toEqual([]);
    expect(hasRequirements(design)).toBe(false);
  });
});

describe('each requirement at its boundary (Littrow, 1200/mm, f = 500 mm, 100 µm slits)', () => {
  // Palmer & Loewen, Diffraction Grating Handbook, ch. 2: RLD = d cos β / (m f) at 500 nm
  // = 833.33 × 0.953939 / 500 = 1.58990 nm/mm; ch. 9: bandpass = RLD × slit width with matched
  // slits (Littrow with one lens: image of the 0.1 mm entrance slit is 0.1 mm) = 0.158990 nm.
  const rld500 = (D_NM * COS_BETA_500) / 500;
  const bandpass500 = rld500 * 0.1;

  it('bandpass ≤ limit at 500 nm', () => {
    const pass = only({ maxBandpassNm: bandpass500 * (1 + JUST), atWavelengthsNm: [500] });
    expect(pass.status).toBe('pass');
    expectClose(pass.worst, bandpass500, 1e-9);
    expectClose(pass.margin, JUST / (1 + JUST), 1e-6);
    expect(pass.worstWavelengthNm).toBe(500);
    expect(pass.fixPath).toBe('slits.exitWidthUm');
    expect(pass.limitText).toBe('bandpass ≤ 0.1591\u00A0nm');
    // Units after a no-break space, "%" after a narrow one (shared/format.ts).
    expect(pass.message).toBe('bandpass 0.159\u00A0nm at worst (500\u00A0nm), 0.1\u202F% to spare');

    const fail = only({ maxBandpassNm: bandpass500 * (1 - JUST), atWavelengthsNm: [500] });
    expect(fail.status).toBe('fail');
    expect(fail.margin).toBeLessThan(0);
    expect(fail.failingSpansNm).toEqual([[500, 500]]);
    expect(fail.message).toContain('over');
  });

  it('resolving power ≥ limit at 500 nm', () => {
    // λ / √(bandpass² + (λ/mN)²), N = 1200 × 50 = 60 000 (slit and diffraction widths in
    // quadrature, common practice): 500 / √(0.158990² + 0.0083333²) = 3140.54.
    const expected = 500 / Math.hypot(bandpass500, 500 / 60_000);
    expectClose(expected, 3140.54, 1e-5);
    expect(only({ minResolvingPower: expected * (1 - JUST), atWavelengthsNm: [500] }).status).toBe('pass');
    const fail = only({ minResolvingPower: expected * (1 + JUST), atWavelengthsNm: [500] });
    expect(fail.status).toBe('fail');
    expect(fail.message).toContain('short');
  });

  it('blaze efficiency ≥ limit at 400 nm', () => {
    // Scalar blaze envelope sinc²(π(m − λ_B/λ)) (Palmer & Loewen, ch. 9; K = 0 in Littrow):
    // λ_B = 500, λ = 400 → sinc²(−π/4) = (0.707107 / 0.785398)² = 0.810569.
    const expected = 0.810569;
    expect(only({ minBlazeEfficiency: expected * (1 - JUST), atWavelengthsNm: [400] }).status).toBe('pass');
    expect(only({ minBlazeEfficiency: expected * (1 + JUST), atWavelengthsNm: [400] }).status).toBe('fail');
  });

  it('blaze efficiency is unknown without a blaze wavelength', () => {
    const design = littrowDesign({ minBlazeEfficiency: 0.4 });
    delete design.grating.blazeWavelengthNm;
    const check = only({ minBlazeEfficiency: 0.4 }, design);
    expect(check.status).toBe('unknown');
    expect(check.fixPath).toBe('grating.blazeWavelengthNm');
  });

  it('f-number ≤ limit: the slower of width and height', () => {
    // Collimator f / (W cos α) at the centre, 500 / (50 × 0.953939) = 10.4828; along the slit
    // 500 / 50 = 10; the slower is 10.4828 (grating as the stop, common practice).
    const expected = 500 / (50 * COS_BETA_500);
    expect(only({ maxFNumber: expected * (1 + JUST) }).status).toBe('pass');
    const fail = only({ maxFNumber: expected * (1 - JUST) });
    expect(fail.status).toBe('fail');
    expectClose(fail.worst, expected, 1e-9);
    expect(fail.worstWavelengthNm).toBeNull();
  });

  it('focal length ≤ limit: the longer of the two', () => {
    const design = makeDesign({ layout: { cameraFocalMm: 350 }, requirements: { maxFocalLengthMm: 350 } });
    expect(only({ maxFocalLengthMm: 350 }, design).status).toBe('pass');
    const fail = only({ maxFocalLengthMm: 349.9 }, { ...design, requirements: { maxFocalLengthMm: 349.9 } });
    expect(fail.status).toBe('fail');
    expect(fail.message).toContain('camera');
  });

  it('pixels per bandpass ≥ limit (Nyquist: 2, common practice)', () => {
    // bandpass × dx/dλ = the wider slit width on the detector = 100 µm; over 25 µm pixels = 4.
    expect(only({ minPixelsPerBandpass: 4 * (1 - JUST) }).status).toBe('pass');
    const fail = only({ minPixelsPerBandpass: 4 * (1 + JUST) });
    expect(fail.status).toBe('fail');
    expect(fail.fixPath).toBe('detector.pixelPitchUm');
  });

  it('pixels per bandpass is unknown without a detector, and says to add one', () => {
    const design = littrowDesign({ minPixelsPerBandpass: 2 });
    delete design.detector;
    const check = only({ minPixelsPerBandpass: 2 }, design);
    expect(check.status).toBe('unknown');
    expect(check.message).toMatch(/add one/);
  });

  it('reciprocal dispersion ≤ limit at 500 nm', () => {
    expect(only({ maxReciprocalDispersionNmPerMm: rld500 * (1 + JUST), atWavelengthsNm: [500] }).status).toBe('pass');
    const fail = only({ maxReciprocalDispersionNmPerMm: rld500 * (1 - JUST), atWavelengthsNm: [500] });
    expect(fail.status).toBe('fail');
    expect(fail.fixPath).toBe('layout.cameraFocalMm');
  });

  it('sends an Ebert–Fastie’s reciprocal-dispersion fix to its one mirror, the field its editor shows', () => {
    const design = littrowDesign({ maxReciprocalDispersionNmPerMm: rld500 * (1 - JUST), atWavelengthsNm: [500] });
    design.layout = { kind: 'ebert-fastie', deviationAngleDeg: 20, collimatorFocalMm: 500, cameraFocalMm: 500 };
    expect(only(design.requirements!, design).fixPath).toBe('layout.collimatorFocalMm');
  });

  it('reciprocal dispersion over the range is worst at the short end (cos β largest)', () => {
    // At 400 nm sin β = 0.24, RLD = 833.33 × √(1 − 0.0576) / 500 = 1.61804 nm/mm.
    const rld400 = (D_NM * Math.sqrt(1 - 0.24 ** 2)) / 500;
    const check = only({ maxReciprocalDispersionNmPerMm: 1.6 });
    expect(check.status).toBe('fail');
    expect(check.worstWavelengthNm).toBe(400);
    expectClose(check.worst, rld400, 1e-9);
    // cos β falls with λ: fails from 400 nm up to where d cos β / f = 1.6, cos β = 0.96,
    // sin β = 0.28, λ = 2d sin β = 466.67 nm; the sweep has a point every 2 nm.
    expect(check.failingSpansNm).toEqual([[400, 466]]);
  });

  it('wavelength error ≤ limit over the range, worst at the start', () => {
    // |dλ/dφ| = 2d cos K cos φ / m (Palmer & Loewen, ch. 2), K = 0, at 400 nm cos φ = 0.970824:
    // 1618.04 nm/rad × 4.84814e-6 rad/″ × 2″ = 0.0156881 nm.
    const expected = 2 * D_NM * Math.sqrt(1 - 0.24 ** 2) * (Math.PI / 648_000) * 2;
    expect(only({ maxWavelengthErrorNm: expected * (1 + JUST), driveStepArcsec: 2 }).status).toBe('pass');
    const fail = only({ maxWavelengthErrorNm: expected * (1 - JUST), driveStepArcsec: 2 });
    expect(fail.status).toBe('fail');
    expect(fail.worstWavelengthNm).toBe(400);
    expect(fail.fixPath).toBe('grating.grooveDensityPerMm');
  });

  it('one-shot coverage: the detector at the 500 nm setting covers 459.99–539.39 nm', () => {
    // λ(x) = d(sin α + sin(β_c + atan(x/f))) with x = ±25 mm (2000 × 25 µm), β_c = asin 0.3:
    // 459.990 and 539.386 nm. A range centred on 500 nm fits when its half-width ≤ 39.386 nm.
    const fits = littrowDesign({ oneShotCoverage: true });
    fits.range = { startNm: 460.62, endNm: 539.38 };
    expect(only({ oneShotCoverage: true }, fits).status).toBe('pass');
    const misses = littrowDesign({ oneShotCoverage: true });
    misses.range = { startNm: 460.6, endNm: 539.4 };
    const fail = only({ oneShotCoverage: true }, misses);
    expect(fail.status).toBe('fail');
    expect(fail.fixPath).toBe('detector.pixelCount');
    expect(fail.failingSpansNm).toHaveLength(1);
    expectClose(fail.failingSpansNm[0]![0], 539.386, 1e-5);
  });

  it('one-shot coverage is unknown without a detector', () => {
    const design = littrowDesign({ oneShotCoverage: true });
    delete design.detector;
    expect(only({ oneShotCoverage: true }, design).status).toBe('unknown');
  });

  it('order overlap: forbidden fails where the second order of the source lands', () => {
    // Second order of λ/2 leaves at λ's angle (Palmer & Loewen, ch. 2): with a 250–1100 nm source,
    // every λ ≥ 500 nm has λ/2 in the source.
    const forbidden = littrowDesign({ orderOverlap: 'forbidden' });
    forbidden.source = { minNm: 250, maxNm: 1100 };
    const fail = only({ orderOverlap: 'forbidden' }, forbidden);
    expect(fail.status).toBe('fail');
    expect(fail.failingSpansNm).toEqual([[500, 600]]);

    const narrow = { ...forbidden, source: { minNm: 251, maxNm: 1100 } };
    // λ/2 ≥ 251 needs λ ≥ 502: still fails, from the next sweep point.
    expect(only({ orderOverlap: 'forbidden' }, narrow).failingSpansNm).toEqual([[502, 600]]);
    const clear = { ...forbidden, source: { minNm: 300.01, maxNm: 799.9 } };
    expect(only({ orderOverlap: 'forbidden' }, clear).status).toBe('pass');
  });

  it('order overlap: allowed passes; filtered fails where no filter blocks an order and passes with the proposed plan', () => {
    const design = littrowDesign();
    // 250–1100 nm source on a 400–600 nm range: λ/2 ≥ 250 nm from λ = 500 nm on (Palmer & Loewen,
    // Diffraction Grating Handbook, ch. 2: order 2 puts λ/2 on λ's angle).
    design.source = { minNm: 250, maxNm: 1100 };
    expect(only({ orderOverlap: 'allowed' }, { ...design, requirements: { orderOverlap: 'allowed' } }).status).toBe(
      'pass',
    );
    const unfiltered = only({ orderOverlap: 'filtered' }, { ...design, requirements: { orderOverlap: 'filtered' } });
    expect(unfiltered.status).toBe('fail');
    expect(unfiltered.failingSpansNm[0]?.[0]).toBeGreaterThanOrEqual(500);
    expect(unfiltered.message).toMatch(/proposed order-sorting plan/);
    const filters = proposeOrderSortingPlan(design);
    expect(filters.length).toBeGreaterThan(0);
    const filtered = only(
      { orderOverlap: 'filtered' },
      { ...design, filters, requirements: { orderOverlap: 'filtered' } },
    );
    expect(filtered.status).toBe('pass');
    expect(filtered.message).toMatch(/filters block every other order/);
  });
});

describe('the report', () => {
  it('lists the checks in REQUIREMENT_IDS order with a tally', () => {
    const report = checkRequirements(
      littrowDesign({ orderOverlap: 'allowed', maxBandpassNm: 0.01, maxFocalLengthMm: 1000, minPixelsPerBandpass: 2 }),
    );
    expect(report.checks.map((c) => c.id)).toEqual([
      'maxBandpassNm',
      'maxFocalLengthMm',
      'minPixelsPerBandpass',
      'orderOverlap',
    ]);
    expect([report.passed, report.failed, report.unknown]).toEqual([3, 1, 0]);
  });

  it('a wavelength out of reach fails the wavelength requirements there, in words', () => {
    // Reach of a Littrow mount is 2d/m = 1666.7 nm: 1700 nm is beyond it.
    const check = only({ maxBandpassNm: 10, atWavelengthsNm: [500, 1700] });
    expect(check.status).toBe('fail');
    expect(check.worstWavelengthNm).toBe(1700);
    expect(check.failingSpansNm).toEqual([[1700, 1700]]);
    expect(check.message).toContain('unreachable at 1700\u00A0nm');
  });

  it('sweeps REQUIREMENT_POINTS wavelengths, the solver’s default', () => {
    expect(REQUIREMENT_POINTS).toBe(101);
  });

  it('requirementFailsAt shades exactly what the check fails', () => {
    const design = littrowDesign({ maxReciprocalDispersionNmPerMm: 1.6, maxBandpassNm: 1 });
    const points = evaluateDesign(design, { points: 11 }).points;
    const failing = points.filter((p) => requirementFailsAt(design.requirements!, p, design).length > 0);
    // 400…460 nm in steps of 20 fail (boundary 466.67 nm, above); the bandpass limit never does.
    expect(failing.map((p) => p.wavelengthNm)).toEqual([400, 420, 440, 460]);
    expect(requirementFailsAt(design.requirements!, points[0]!, design)).toEqual(['maxReciprocalDispersionNmPerMm']);
  });

  it('requirementFailsAt leaves out what the design cannot be judged on, even where unreachable', () => {
    const requirements: Requirements = { minPixelsPerBandpass: 2, maxBandpassNm: 10 };
    const design = littrowDesign(requirements);
    delete design.detector;
    // 1700 nm is past the Littrow reach 2d/m = 1666.7 nm.
    const [far] = evaluateDesign(design, { wavelengthsNm: [1700] }).points;
    expect(requirementFailsAt(requirements, far!, design)).toEqual(['maxBandpassNm']);
  });

  it('requirementFailsAt judges listed requirements only at the listed wavelengths', () => {
    const requirements: Requirements = { maxReciprocalDispersionNmPerMm: 1.6, atWavelengthsNm: [500] };
    const design = littrowDesign(requirements);
    const [at400] = evaluateDesign(design, { wavelengthsNm: [400] }).points;
    expect(requirementFailsAt(requirements, at400!, design)).toEqual([]);
  });
});
