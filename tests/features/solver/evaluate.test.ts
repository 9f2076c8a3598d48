import * as fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import {
  anamorphicMagnification,
  bandpassNm,
  blazeEfficiency,
  DEFAULT_POINTS,
  evaluateDesign,
  linearDispersionMmPerNm,
  MAX_POINTS,
  overlapCount,
  overlappingOrders,
  reciprocalDispersionNmPerMm,
  scanSensitivityNmPerArcsec,
  slitFunction,
  solveGrating,
} from '@/features/solver';
import { designSchema, MAX_SOLVE_WAVELENGTHS, type Design } from '@/shared/design';
import { deg, expectClose } from './close-to';
import { makeDesign, spacing } from './fixtures';

/** Every number anywhere in a value is finite. */
function allFinite(value: unknown): boolean {
  if (typeof value === 'number') return Number.isFinite(value);
  if (Array.isArray(value)) return value.every(allFinite);
  if (value && typeof value === 'object') return Object.values(value).every(allFinite);
  return true;
}

/** Random schema-valid designs across realistic and awkward corners. */
const designArb: fc.Arbitrary<Design> = fc
  .record({
    grooves: fc.double({ min: 10, max: 6000, noNaN: true }),
    order: fc.integer({ min: -12, max: 12 }).filter((m) => m !== 0),
    // As a fraction of 2d, the longest first-order blaze a grating can have (the schema refuses more).
    blaze: fc.option(fc.double({ min: 0.02, max: 0.99, noNaN: true }), { nil: undefined }),
    width: fc.double({ min: 1, max: 400, noNaN: true }),
    kind: fc.constantFrom('czerny-turner', 'littrow', 'ebert-fastie' as const),
    deviation: fc.double({ min: 0, max: 179.9, noNaN: true }),
    fCol: fc.double({ min: 10, max: 3000, noNaN: true }),
    fCam: fc.double({ min: 10, max: 3000, noNaN: true }),
    t1: fc.option(fc.double({ min: 0, max: 45, noNaN: true }), { nil: undefined }),
    t2: fc.option(fc.double({ min: 0, max: 45, noNaN: true }), { nil: undefined }),
    entrance: fc.double({ min: 0.5, max: 3000, noNaN: true }),
    exit: fc.double({ min: 0.5, max: 3000, noNaN: true }),
    start: fc.double({ min: 1, max: 5000, noNaN: true }),
    span: fc.double({ min: 0.01, max: 5000, noNaN: true }),
    detector: fc.option(fc.record({ pixelPitchUm: fc.double({ min: 1, max: 100, noNaN: true }), pixelCount: fc.integer({ min: 1, max: 8192 }) }), { nil: undefined }),
  })
  .map((r) => {
    const littrow = r.kind === 'littrow';
    const design: Design = {
      grating: {
        grooveDensityPerMm: r.grooves,
        order: r.order,
        blazeWavelengthNm: r.blaze === undefined ? undefined : (r.blaze * 2e6) / r.grooves,
        ruledWidthMm: r.width,
        // No faster than f/0.5 along the slit, which the schema refuses: few draws are thrown away.
        ruledHeightMm: Math.min(r.width, 2 * Math.min(r.fCol, r.kind === 'ebert-fastie' ? r.fCol : r.fCam)),
      },
      layout: {
        kind: r.kind,
        deviationAngleDeg: littrow ? 0 : r.deviation,
        collimatorFocalMm: r.fCol,
        cameraFocalMm: r.kind === 'ebert-fastie' ? r.fCol : r.fCam,
        collimatorOffAxisDeg: r.t1,
        cameraOffAxisDeg: r.t2,
      },
      slits: { entranceWidthUm: r.entrance, exitWidthUm: r.exit, heightMm: 5 },
      range: { startNm: r.start, endNm: r.start + r.span },
      source: { minNm: r.start * 0.5, maxNm: (r.start + r.span) * 1.5 },
      detector: r.detector,
    };
    return design;
  })
  .filter((d) => designSchema.safeParse(d).success);

describe('evaluateDesign', () => {
  it('samples the range evenly, ends included, by default', () => {
    const e = evaluateDesign(makeDesign());
    expect(e.points).toHaveLength(DEFAULT_POINTS);
    expect(e.points[0]!.wavelengthNm).toBe(300);
    expect(e.points[DEFAULT_POINTS - 1]!.wavelengthNm).toBe(900);
    expectClose(e.points[50]!.wavelengthNm, 600, 1e-12);
  });

  it("sweeps at most MAX_POINTS wavelengths, the solve request's cap", () => {
    expect(MAX_POINTS).toBe(MAX_SOLVE_WAVELENGTHS);
    expect(evaluateDesign(makeDesign(), { points: 1_000_000 }).points).toHaveLength(MAX_SOLVE_WAVELENGTHS);
  });

  it('evaluates exactly the wavelengths asked for, in order', () => {
    const e = evaluateDesign(makeDesign(), { wavelengthsNm: [700, 310, 450] });
    expect(e.points.map((p) => p.wavelengthNm)).toEqual([700, 310, 450]);
  });

  it('reports at each wavelength what the one-concept functions give', () => {
    const design = makeDesign({ layout: { collimatorFocalMm: 250, cameraFocalMm: 420 } });
    const lambdas = [305, 480, 611.3, 777, 899];
    const { points } = evaluateDesign(design, { wavelengthsNm: lambdas });
    lambdas.forEach((lambda, i) => {
      const p = points[i]!;
      const s = solveGrating(1, lambda, spacing(1200), deg(15));
      if (!s.reachable) throw new Error('reachable');
      const cb = Math.cos(s.diffractionRad);
      const rld = reciprocalDispersionNmPerMm(1, spacing(1200), cb, 420);
      const mag = anamorphicMagnification(Math.cos(s.incidenceRad), cb, 250, 420);
      expectClose(deg(p.gratingRotationDeg ?? NaN), s.rotationRad, 1e-14);
      expectClose(p.linearDispersionMmPerNm, linearDispersionMmPerNm(1, spacing(1200), cb, 420), 1e-14);
      expectClose(p.reciprocalDispersionNmPerMm, rld, 1e-14);
      expectClose(p.anamorphicMagnification, mag, 1e-14);
      expectClose(p.bandpassNm, bandpassNm(rld, 0.1 * mag, 0.1), 1e-14);
      expect(p.slitFunction).toEqual(slitFunction(rld, 0.1 * mag, 0.1));
      expectClose(p.blazeEfficiency, blazeEfficiency(lambda, 1, 500, deg(15)), 1e-12);
      expect(p.overlaps).toEqual(overlappingOrders(1, lambda, 200, 1100));
      expect(p.overlapCount).toBe(overlapCount(1, lambda, 200, 1100));
      expectClose(p.scanSensitivityNmPerArcsec, scanSensitivityNmPerArcsec(1, spacing(1200), deg(15), s.rotationRad), 1e-14);
    });
  });

  it('an unreachable wavelength carries a reason and nulls, never NaN', () => {
    const e = evaluateDesign(makeDesign(), { wavelengthsNm: [2000] });
    const p = e.points[0]!;
    expect(p.reachable).toBe(false);
    expect(p.reason).toMatch(/beyond/);
    for (const key of ['incidenceDeg', 'diffractionDeg', 'gratingRotationDeg', 'bandpassNm', 'resolvingPower', 'scanSensitivityNmPerArcsec', 'slitFunction', 'blazeEfficiency'] as const) {
      expect(p[key], key).toBeNull();
    }
    expect(p.overlaps).toEqual([]);
    expect(allFinite(e)).toBe(true);
    expect(e.warnings[0]).toMatchObject({ code: 'unreachable', wavelengthNm: 2000 });
  });

  it('warns near grazing, above 80° from the normal', () => {
    // 1800 g/mm, 2K = 20°, 1000 nm: sin φ = 0.9139 → φ = 66°, α = 76°; 1060 nm: α ≈ 82.5°.
    const design = makeDesign({ grating: { grooveDensityPerMm: 1800 }, layout: { deviationAngleDeg: 20 }, range: { startNm: 900, endNm: 1060 } });
    const e = evaluateDesign(design, { wavelengthsNm: [1000, 1060] });
    expect(e.points[1]!.incidenceDeg!).toBeGreaterThan(80);
    const w = e.warnings.find((x) => x.code === 'near-grazing');
    expect(w?.wavelengthNm).toBe(1060);
    expect(w?.message).toMatch(/1 of 2 wavelengths at 1060 nm/);
  });

  it('summarises reach, rotation range and f-numbers', () => {
    const e = evaluateDesign(makeDesign(), { points: 3 });
    // 2d cos²K = 2 · 833.33 · cos²15° = 1555.02 nm (by hand).
    expectClose(e.design.reachableMaxNm, 1555.0211698, 1e-9);
    expectClose(e.design.gratingRotationStartDeg, (Math.asin(300 / (2 * 833.3333333333334 * Math.cos(deg(15)))) * 180) / Math.PI, 1e-12);
    expectClose(e.design.fNumberHeight, 6, 1e-15);
    const alpha = deg(e.points[1]!.incidenceDeg ?? NaN);
    expectClose(e.design.fNumberProjectedWidth, 300 / (50 * Math.cos(alpha)), 1e-12);
  });
});

// Hundreds of evaluations each: on a shared 2-core machine under load they outlast the 5 s default.
describe('properties over random valid designs (fast-check)', { timeout: 30_000 }, () => {
  it('never throws and never produces NaN or Infinity', () => {
    fc.assert(
      fc.property(designArb, fc.integer({ min: 2, max: 40 }), (design, points) => {
        const e = evaluateDesign(design, { points });
        expect(allFinite(e)).toBe(true);
        expect(JSON.stringify(e)).not.toMatch(/null,\s*"reachable": true/);
        for (const p of e.points) {
          expect(p.reachable ? p.reason === null && p.bandpassNm !== null : typeof p.reason === 'string').toBe(true);
        }
      }),
      { numRuns: 300 },
    );
  });

  it('solutions satisfy the grating equation to a relative residual below 1e-9', () => {
    // Palmer & Loewen, ch. 2: mλ = d(sin α + sin β), recomputed from the reported degrees.
    fc.assert(
      fc.property(designArb, (design) => {
        const d = 1e6 / design.grating.grooveDensityPerMm;
        for (const p of evaluateDesign(design, { points: 9 }).points) {
          if (!p.reachable) continue;
          const sum = d * (Math.sin(deg(p.incidenceDeg!)) + Math.sin(deg(p.diffractionDeg!)));
          const mLambda = design.grating.order * p.wavelengthNm;
          expect(Math.abs(mLambda - sum) / Math.abs(mLambda)).toBeLessThan(1e-9);
          expect(Math.abs(p.incidenceDeg! - p.diffractionDeg! - design.layout.deviationAngleDeg)).toBeLessThan(1e-9);
        }
      }),
      { numRuns: 300 },
    );
  });

  it('linear × reciprocal dispersion = 1', () => {
    fc.assert(
      fc.property(designArb, (design) => {
        for (const p of evaluateDesign(design, { points: 9 }).points) {
          if (p.reachable) expect(Math.abs(p.linearDispersionMmPerNm! * p.reciprocalDispersionNmPerMm! - 1)).toBeLessThan(1e-12);
        }
      }),
      { numRuns: 300 },
    );
  });

  it('bandpass grows with either slit: never shrinks, and doubles once that slit is twice the wider', () => {
    fc.assert(
      fc.property(designArb, fc.double({ min: 1.01, max: 10, noNaN: true }), fc.constantFrom('entranceWidthUm', 'exitWidthUm' as const), (design, factor, slit) => {
        const lambda = (design.range.startNm + design.range.endNm) / 2;
        const base = evaluateDesign(design, { wavelengthsNm: [lambda] }).points[0]!;
        if (!base.reachable) return;
        const wider = structuredClone(design);
        wider.slits[slit] *= factor;
        const after = evaluateDesign(wider, { wavelengthsNm: [lambda] }).points[0]!;
        expect(after.bandpassNm!).toBeGreaterThanOrEqual(base.bandpassNm!);
        // Widened to twice the wider of the two (at the exit plane), that slit alone sets the
        // bandpass, which then doubles.
        const m = base.anamorphicMagnification!;
        const widest = Math.max(design.slits.entranceWidthUm * m, design.slits.exitWidthUm);
        const dominant = structuredClone(design);
        dominant.slits[slit] = slit === 'exitWidthUm' ? 2 * widest : (2 * widest) / m;
        const doubled = evaluateDesign(dominant, { wavelengthsNm: [lambda] }).points[0]!;
        expectClose(doubled.bandpassNm, 2 * base.bandpassNm!, 1e-12);
      }),
      { numRuns: 300 },
    );
  });

  it('Littrow with equal focal lengths has anamorphic magnification 1', () => {
    // Palmer & Loewen, ch. 2: cos α / cos β = 1 when α = β.
    fc.assert(
      fc.property(designArb, (d) => {
        const design: Design = { ...d, layout: { ...d.layout, kind: 'littrow', deviationAngleDeg: 0, cameraFocalMm: d.layout.collimatorFocalMm } };
        for (const p of evaluateDesign(design, { points: 5 }).points) {
          if (p.reachable) {
            expect(p.anamorphicMagnification).toBe(1);
            // Magnification 1: the trapezoid's top is just the difference of the two slits.
            const mismatchMm = Math.abs(design.slits.entranceWidthUm - design.slits.exitWidthUm) / 1000;
            expectClose(p.slitFunction!.topNm, p.reciprocalDispersionNmPerMm! * mismatchMm, 1e-6, 1e-9 * p.slitFunction!.baseNm);
          }
        }
      }),
      { numRuns: 200 },
    );
  });

  it('never throws at the schema bounds either', () => {
    // Each number at a bound of its field, within the physical limits the schema also checks
    // (two grooves, f/0.5 along the slit, blaze below 2d).
    const extremes: Design[] = [
      makeDesign({ grating: { grooveDensityPerMm: 0.001, ruledWidthMm: 100_000, ruledHeightMm: 0.001, order: 1000 }, layout: { collimatorFocalMm: 0.001, cameraFocalMm: 10_000_000 }, slits: { entranceWidthUm: 1_000_000, exitWidthUm: 0.001 } }),
      makeDesign({ grating: { grooveDensityPerMm: 100_000, ruledWidthMm: 100_000, ruledHeightMm: 0.001, order: -1000, blazeWavelengthNm: 19.99 }, layout: { deviationAngleDeg: 179.999, collimatorFocalMm: 10_000_000, cameraFocalMm: 0.001 }, range: { startNm: 0.001, endNm: 10_000_000 } }),
    ];
    for (const design of extremes) {
      expect(designSchema.safeParse(design).success).toBe(true);
      const e = evaluateDesign(design, { points: 50 });
      expect(allFinite(e)).toBe(true);
    }
    // Past those limits the schema refuses, but the solver still answers with finite numbers.
    const refused: Design[] = [
      makeDesign({ grating: { grooveDensityPerMm: 0.001, ruledWidthMm: 0.001, order: 1000 }, layout: { collimatorFocalMm: 0.001, cameraFocalMm: 10_000_000 }, slits: { entranceWidthUm: 1_000_000, exitWidthUm: 0.001 } }),
      makeDesign({ grating: { grooveDensityPerMm: 100_000, ruledWidthMm: 100_000, order: -1000 }, layout: { deviationAngleDeg: 179.999, collimatorFocalMm: 10_000_000, cameraFocalMm: 0.001 }, range: { startNm: 0.001, endNm: 10_000_000 } }),
    ];
    for (const design of refused) {
      expect(designSchema.safeParse(design).success).toBe(false);
      expect(allFinite(evaluateDesign(design, { points: 50 }))).toBe(true);
    }
  });

});
