import { describe, expect, it } from 'vitest';
import {
  circleFractionInRectangle,
  coneHalfAngleRad,
  coneSolidAngleSr,
  equivalentFNumber,
  evaluateDesign,
  fibreFNumber,
  inputFill,
  interpolateCurve,
  rectangleSolidAngleSr,
  type FillGeometry,
} from '@/features/solver';
import type { DesignCurve } from '@/shared/curves';
import { designSchema, type Design } from '@/shared/design';
import { makeDesign } from './fixtures';

const curve = (kind: DesignCurve['kind'], points: [number, number][], extra: Partial<DesignCurve> = {}): DesignCurve => ({
  kind,
  name: `${kind} test`,
  checksum: 'c'.repeat(64),
  medium: 'air',
  wavelengthsNm: points.map(([nm]) => nm),
  values: points.map(([, v]) => v),
  ...extra,
});

describe('circle inside a centred rectangle (plane geometry, hand computation)', () => {
  it('is the rectangle when the rectangle fits inside the circle', () => {
    // r = 90.2, a 100 × 100 square: all of it is inside (half-diagonal 70.7 < 90.2), so 100²/(π·90.2²).
    expect(circleFractionInRectangle(90.2, 50, 50)).toBeCloseTo(10_000 / (Math.PI * 90.2 ** 2), 12);
  });
  it('is the whole disc when the disc fits inside the rectangle, an inscribed circle included', () => {
    expect(circleFractionInRectangle(10, 50, 50)).toBe(1);
    expect(circleFractionInRectangle(50, 50, 50)).toBeCloseTo(1, 12);
  });
  it('cuts a band of half the radius out of a tall rectangle as the integral says', () => {
    // 4∫₀^{r/2} √(r² − x²) dx = r²(√3/2 + π/3), so the share is (√3/2 + π/3)/π ≈ 0.6090.
    expect(circleFractionInRectangle(2, 1, 100)).toBeCloseTo((Math.sqrt(3) / 2 + Math.PI / 3) / Math.PI, 12);
  });
  it('is 0 for a degenerate disc or rectangle', () => {
    expect(circleFractionInRectangle(0, 1, 1)).toBe(0);
    expect(circleFractionInRectangle(1, 0, 1)).toBe(0);
  });
});

describe('solid angles and étendue (radiometry; hand computation)', () => {
  it('gives a cube face seen from the centre 4π/6', () => {
    // A 2 × 2 face at distance 1: 4·asin(1/√(2·2)) = 4·π/6, one sixth of the sphere.
    expect(rectangleSolidAngleSr(2, 2, 1)).toBeCloseTo((4 * Math.PI) / 6, 12);
  });
  it('tends to area / distance² for a slow beam', () => {
    expect(rectangleSolidAngleSr(50, 50, 3000) / ((50 * 50) / 3000 ** 2)).toBeCloseTo(1, 3);
  });
  it('turns an f-number into a cone and back', () => {
    // f/4: tan θ = 1/8, Ω = 2π(1 − cos θ) ≈ π/(4·16) = 0.0491 sr (the small-angle form).
    const omega = coneSolidAngleSr(coneHalfAngleRad(4));
    expect(omega).toBeCloseTo(Math.PI / 64, 2);
    expect(equivalentFNumber(omega)).toBeCloseTo(4, 10);
  });
  it('gives a fibre of NA 0.22 about f/2.2 (common practice: f/# ≈ 1/(2 NA) = 2.27)', () => {
    // Exactly 1/(2 tan(asin 0.22)) = √(1 − 0.22²)/0.44 = 2.2170.
    expect(fibreFNumber(0.22)).toBeCloseTo(Math.sqrt(1 - 0.22 ** 2) / 0.44, 12);
    expect(Math.abs(fibreFNumber(0.22) / (1 / (2 * 0.22)) - 1)).toBeLessThan(0.03);
  });
  it('multiplies the slit area by the acceptance for the design', () => {
    const design = makeDesign({ slits: { entranceWidthUm: 100, heightMm: 10 } });
    const evaluation = evaluateDesign(design, { points: 11 });
    const light = evaluation.lightBudget;
    // 0.1 mm × 10 mm = 1 mm²; Ω ≈ (50 cos α × 50 mm)/(300 mm)² at the centre, 600 nm.
    const cosAlpha = Math.cos(((evaluation.points[5]!.incidenceDeg ?? NaN) * Math.PI) / 180);
    expect(light.slitAreaMm2).toBeCloseTo(1, 12);
    // (within 1 %: the exact rectangle form is a little below the small-angle one at f/6).
    expect(Math.abs((light.acceptanceSolidAngleSr ?? NaN) / ((50 * cosAlpha * 50) / 300 ** 2) - 1)).toBeLessThan(0.01);
    expect(light.etendueMm2Sr).toBeCloseTo(light.acceptanceSolidAngleSr ?? NaN, 12);
    // Quoted as the circular cone of the same solid angle: f / (2√(area/π)).
    expect(Math.abs((light.acceptanceFNumber ?? NaN) / (300 / (2 * Math.sqrt((50 * cosAlpha * 50) / Math.PI))) - 1)).toBeLessThan(0.01);
  });
});

const geometry = (overrides: Partial<FillGeometry> = {}): FillGeometry => ({
  collimatorFocalMm: 400,
  ruledWidthMm: 100,
  ruledHeightMm: 100,
  grooveDensityPerMm: 1200,
  order: 1,
  incidenceRad: 0,
  entranceWidthMm: 0.1,
  slitHeightMm: 10,
  ...overrides,
});

describe('how the input fills an f/4 instrument (400 mm collimator, 100 mm square grating at normal incidence)', () => {
  it('is over-filled by a fibre of NA 0.22 (common practice: f/# ≈ 1/(2 NA) ≈ 2.3, faster than f/4)', () => {
    const fill = inputFill({ kind: 'fibre', numericalAperture: 0.22, coreDiameterUm: 100 }, geometry());
    // Beam diameter 2·400·tan(asin 0.22) = 180.4 mm; the square is wholly inside it: 100²/(π·90.2²) = 0.391.
    const diameter = 2 * 400 * (0.22 / Math.sqrt(1 - 0.22 ** 2));
    expect(fill.state).toBe('overfilled');
    expect(fill.pupilFraction).toBeCloseTo(10_000 / (Math.PI * (diameter / 2) ** 2), 10);
    expect(fill.litWidthFraction).toBe(1);
  });
  it('is matched by an f/4 lens (its beam is the circle inscribed in the grating)', () => {
    const fill = inputFill({ kind: 'lens', fNumber: 4 }, geometry());
    expect(fill.state).toBe('matched');
    expect(fill.pupilFraction).toBeCloseTo(1, 10);
    expect(fill.litGrooves).toBeCloseTo(120_000, 6);
  });
  it('is under-filled by an f/8 lens: half the width lit, half the grooves, half the diffraction-limited R', () => {
    const fill = inputFill({ kind: 'lens', fNumber: 8 }, geometry());
    expect(fill.state).toBe('underfilled');
    expect(fill.pupilFraction).toBe(1);
    expect(fill.litWidthFraction).toBeCloseTo(0.5, 12);
    // R = |m| N_lit = 1 × 1200/mm × 50 mm.
    expect(fill.litResolvingPower).toBeCloseTo(60_000, 6);
  });
  it('lets through the part of a fibre core the slit covers', () => {
    // A 200 µm core behind a 100 µm × 10 mm slit: a band half the radius each side, as above, 0.6090.
    const fill = inputFill({ kind: 'fibre', numericalAperture: 0.1, coreDiameterUm: 200 }, geometry());
    expect(fill.slitFraction).toBeCloseTo((Math.sqrt(3) / 2 + Math.PI / 3) / Math.PI, 10);
    expect(fill.coupling).toBeCloseTo(fill.slitFraction * fill.pupilFraction, 12);
  });
  it('takes free space without an f-number as matched, and says it is assumed', () => {
    expect(inputFill({ kind: 'free-space' }, geometry()).state).toBe('assumed-matched');
    expect(inputFill(undefined, geometry()).coupling).toBe(1);
  });
  it('warns of stray light when over-filled and of lost resolution when under-filled', () => {
    const codes = (design: Design) => evaluateDesign(design, { points: 11 }).warnings.map((w) => w.code);
    const base = makeDesign();
    expect(codes({ ...base, input: { kind: 'fibre', numericalAperture: 0.22, coreDiameterUm: 100 } })).toContain('input-overfills');
    expect(codes({ ...base, input: { kind: 'lens', fNumber: 20 } })).toContain('input-underfills');
    // At 600 nm the grating shows the slit 50 cos 36.9° = 40 mm across: an f/8 beam (37.5 mm) fits and lights 94 %.
    const clean = codes({ ...base, input: { kind: 'lens', fNumber: 8 } });
    expect(clean).not.toContain('input-overfills');
    expect(clean).not.toContain('input-underfills');
  });
});

describe('reading a measured curve (linear between points, no extrapolation)', () => {
  const nm = [400, 500, 700];
  const v = [0.2, 0.6, 0.4];
  it('returns the point on a point and the straight line between points', () => {
    expect(interpolateCurve(nm, v, 500)).toBe(0.6);
    expect(interpolateCurve(nm, v, 450)).toBeCloseTo(0.4, 12);
    expect(interpolateCurve(nm, v, 650)).toBeCloseTo(0.45, 12);
    expect(interpolateCurve(nm, v, 700)).toBe(0.4);
  });
  it('knows nothing outside the first and last points', () => {
    expect(interpolateCurve(nm, v, 399.999)).toBeNull();
    expect(interpolateCurve(nm, v, 700.001)).toBeNull();
  });
});

describe('throughput (hand-computed products on small curves)', () => {
  const design = (extra: Partial<Design>): Design =>
    designSchema.parse({ ...makeDesign({ range: { startNm: 400, endNm: 600 } }), ...extra });
  const at = (d: Design, wavelengthsNm: number[]) => evaluateDesign(d, { wavelengthsNm }).lightBudget;
  const factor = (light: ReturnType<typeof at>, id: string) => light.factors.find((f) => f.id === id)!;

  it('multiplies grating, both mirrors and the detector where all are measured', () => {
    const d = design({
      curves: [
        curve('grating-efficiency', [[400, 0.6], [600, 0.8]]),
        curve('mirror-reflectance', [[400, 0.9], [600, 0.9]]),
        curve('detector-response', [[400, 0.5], [600, 0.7]]),
      ],
    });
    const light = at(d, [500]);
    // 0.7 (grating) × 0.9 × 0.9 (two reflections off mirrors with one curve) × 0.6 (detector) = 0.3402.
    expect(light.throughput[0]).toBeCloseTo(0.7 * 0.9 * 0.9 * 0.6, 12);
    expect(factor(light, 'grating').basis).toBe('measured');
    expect(factor(light, 'input').basis).toBe('not-counted');
  });
  it('uses the scalar blaze estimate, labelled so, without a measured grating curve', () => {
    const d = design({});
    const evaluation = evaluateDesign(d, { wavelengthsNm: [450, 550] });
    const grating = evaluation.lightBudget.factors.find((f) => f.id === 'grating')!;
    expect(grating.basis).toBe('estimate');
    expect(grating.values).toEqual(evaluation.points.map((p) => p.blazeEfficiency));
    // Only the grating is counted, so the product is the estimate itself.
    expect(evaluation.lightBudget.throughput).toEqual(grating.values);
  });
  it('averages TE and TM when no unpolarised curve is attached, and ignores curves of another order', () => {
    const d = design({
      curves: [
        curve('grating-efficiency', [[400, 0.9], [600, 0.9]], { polarisation: 'te' }),
        curve('grating-efficiency', [[400, 0.5], [600, 0.5]], { polarisation: 'tm' }),
        curve('grating-efficiency', [[400, 0.1], [600, 0.1]], { order: 2 }),
      ],
    });
    expect(factor(at(d, [500]), 'grating').values[0]).toBeCloseTo(0.7, 12);
  });
  it('leaves the product unknown, never guessed, where a curve has no data, and warns with the gap', () => {
    const d = design({
      curves: [
        curve('grating-efficiency', [[400, 0.6], [600, 0.8]]),
        curve('detector-response', [[400, 0.5], [500, 0.7]]),
      ],
    });
    const evaluation = evaluateDesign(d, { wavelengthsNm: [450, 500, 550] });
    const light = evaluation.lightBudget;
    expect(light.throughput[0]).toBeCloseTo(0.65 * 0.6, 12);
    expect(light.throughput[1]).toBeCloseTo(0.7 * 0.7, 12);
    expect(light.throughput[2]).toBeNull();
    expect(factor(light, 'detector').gapsNm).toEqual([{ fromNm: 550, toNm: 550 }]);
    const gap = evaluation.warnings.find((w) => w.code === 'curve-gap');
    expect(gap?.message).toMatch(/detector response.*550 nm/);
  });
  it('switches from one filter to the next at the switch point, the measured curve replacing the edge model', () => {
    const filters = [
      { kind: 'long-pass' as const, cutOnNm: 395, inFromNm: 400, inToNm: 500, edgeWidthNm: 10 },
      { kind: 'long-pass' as const, cutOnNm: 480, inFromNm: 500, inToNm: 600, edgeWidthNm: 10 },
    ];
    const d = design({
      filters,
      curves: [curve('filter-transmission', [[450, 0.5], [600, 0.8]], { filterNumber: 2 })],
    });
    const light = at(d, [499, 501, 550]);
    const f = factor(light, 'filter');
    // At 499 nm only filter 1 is in (its edge fully passes above 400 nm): 1.
    expect(f.values[0]).toBe(1);
    // From 500 nm filter 2's measured curve: 0.5 + 0.3·(501 − 450)/150 = 0.602, and 0.5 + 0.3·100/150 = 0.7.
    expect(f.values[1]).toBeCloseTo(0.602, 12);
    expect(f.values[2]).toBeCloseTo(0.7, 12);
    expect(f.basis).toBe('measured');
  });
  it('includes the input coupling when an input is given', () => {
    const d = design({ input: { kind: 'fibre', numericalAperture: 0.22, coreDiameterUm: 50 } });
    const light = at(d, [500]);
    const input = factor(light, 'input');
    expect(input.basis).toBe('model');
    expect(input.values[0]).toBeGreaterThan(0);
    expect(input.values[0]).toBeLessThan(1);
    const grating = factor(light, 'grating').values[0]!;
    expect(light.throughput[0]).toBeCloseTo(grating * input.values[0]!, 12);
  });
  it('shapes the signal as source × throughput × bandpass, largest value 1', () => {
    const d = design({
      curves: [curve('grating-efficiency', [[400, 0.5], [600, 0.5]]), curve('source-spectrum', [[400, 1], [600, 3]])],
    });
    const evaluation = evaluateDesign(d, { wavelengthsNm: [400, 600] });
    const [b400, b600] = evaluation.points.map((p) => p.bandpassNm!);
    const raw = [1 * 0.5 * b400!, 3 * 0.5 * b600!];
    const max = Math.max(...raw);
    expect(evaluation.lightBudget.signal[0]).toBeCloseTo(raw[0]! / max, 12);
    expect(evaluation.lightBudget.signal[1]).toBeCloseTo(raw[1]! / max, 12);
    expect(evaluation.lightBudget.sourceBasis).toBe('measured');
  });
  it('claims nothing when nothing is counted (no blaze, no curves, no input)', () => {
    const base = makeDesign({ range: { startNm: 400, endNm: 600 } });
    delete (base.grating as { blazeWavelengthNm?: number }).blazeWavelengthNm;
    const light = at(base, [500]);
    expect(light.throughput).toEqual([null]);
    expect(light.lowest).toBeNull();
  });
});
