import { describe, expect, it } from 'vitest';
import {
  angularDispersionDegPerNm,
  evaluateDesign,
  linearDispersionMmPerNm,
  reciprocalDispersionNmPerMm,
  solveGrating,
} from '@/features/solver';
import { deg, expectClose } from './close-to';
import { makeDesign, spacing } from './fixtures';
import { buildMount } from './trace-2d';

describe('dispersion closed forms', () => {
  it('angular dispersion is |m| / (d cos β)', () => {
    // Palmer & Loewen, ch. 2: dβ/dλ = m / (d cos β). 1200 g/mm, β = 0: 1/833.33 rad/nm = 0.068755°/nm.
    expectClose(angularDispersionDegPerNm(1, spacing(1200), 1), (1 / 833.3333333333334) * (180 / Math.PI), 1e-12);
    // Negative orders report the same magnitude.
    expectClose(angularDispersionDegPerNm(-1, spacing(1200), 1), angularDispersionDegPerNm(1, spacing(1200), 1), 1e-15);
  });

  it('a 1200 g/mm grating in first order with a 0.5 m camera gives about 1.6 nm/mm', () => {
    // Common practice (rule of thumb); exactly d cos β / (m f) = 833.33 · cos β / 500 ≈ 1.6–1.67.
    const design = makeDesign({
      layout: { deviationAngleDeg: 20, collimatorFocalMm: 500, cameraFocalMm: 500 },
      range: { startNm: 400, endNm: 600 },
    });
    const point = evaluateDesign(design, { wavelengthsNm: [500] }).points[0]!;
    expect(point.reciprocalDispersionNmPerMm).toBeGreaterThan(1.5);
    expect(point.reciprocalDispersionNmPerMm).toBeLessThan(1.7);
  });

  it('reciprocal linear dispersion is d cos β / (|m| f_cam), with the camera not the collimator', () => {
    // Palmer & Loewen, ch. 2. Asymmetric mount: f_col = 200 mm, f_cam = 400 mm.
    const design = makeDesign({ layout: { collimatorFocalMm: 200, cameraFocalMm: 400 } });
    const p = evaluateDesign(design, { wavelengthsNm: [550] }).points[0]!;
    const s = solveGrating(1, 550, spacing(1200), deg(15));
    if (!s.reachable) throw new Error('reachable');
    expectClose(p.reciprocalDispersionNmPerMm, (833.3333333333334 * Math.cos(s.diffractionRad)) / 400, 1e-12);
    expectClose(p.linearDispersionMmPerNm, 1 / (p.reciprocalDispersionNmPerMm ?? NaN), 1e-12);
  });

  it('third order disperses three times as much as first at the same angles', () => {
    // Same β (same mλ): 3rd order at 200 nm vs 1st at 600 nm; Palmer & Loewen, ch. 2.
    const first = linearDispersionMmPerNm(1, spacing(1200), Math.cos(deg(5)), 300);
    const third = linearDispersionMmPerNm(3, spacing(1200), Math.cos(deg(5)), 300);
    expectClose(third / first, 3, 1e-14);
    expectClose(reciprocalDispersionNmPerMm(-3, spacing(1200), Math.cos(deg(5)), 300) * third, 1, 1e-14);
  });
});

describe('independent chief-ray trace', () => {
  // An independent 2-D trace (vector grating equation, real spherical mirrors) differentiated
  // numerically must match the closed-form linear dispersion f_cam · |m| / (d cos β) within 0.5 %.
  // The closed form is paraxial with an on-axis camera; with the exit plane at the camera's
  // tangential focus the trace scales it by cos θ₂, so these mounts use small off-axis angles.
  const cases = [
    { name: 'Czerny–Turner, first order', grooves: 1200, order: 1, lambda: 600, deviationDeg: 30, fCol: 300, fCam: 300 },
    { name: 'order −1', grooves: 1200, order: -1, lambda: 600, deviationDeg: 30, fCol: 300, fCam: 300 },
    { name: 'second order, 600 g/mm', grooves: 600, order: 2, lambda: 450, deviationDeg: 24, fCol: 500, fCam: 500 },
    { name: 'asymmetric mount, f_col ≠ f_cam', grooves: 1800, order: 1, lambda: 400, deviationDeg: 40, fCol: 200, fCam: 450 },
    { name: 'near-Littrow, high order', grooves: 79, order: 35, lambda: 550, deviationDeg: 8, fCol: 750, fCam: 750 },
  ] satisfies readonly {
    name: string;
    grooves: number;
    order: number;
    lambda: number;
    deviationDeg: number;
    fCol: number;
    fCam: number;
  }[];

  it.each(cases)('$name: traced dx/dλ matches the closed form within 0.5 %', (c) => {
    const design = makeDesign({
      grating: { grooveDensityPerMm: c.grooves, order: c.order },
      layout: {
        deviationAngleDeg: c.deviationDeg,
        collimatorFocalMm: c.fCol,
        cameraFocalMm: c.fCam,
        collimatorOffAxisDeg: 2,
        cameraOffAxisDeg: 3,
      },
      range: { startNm: c.lambda - 10, endNm: c.lambda + 10 },
    });
    const point = evaluateDesign(design, { wavelengthsNm: [c.lambda] }).points[0]!;
    const incidence = deg(point.incidenceDeg ?? NaN);
    const mount = buildMount(
      {
        collimatorFocalMm: c.fCol,
        cameraFocalMm: c.fCam,
        collimatorOffAxisRad: deg(2),
        cameraOffAxisRad: deg(3),
        incidenceRad: incidence,
        order: c.order,
        spacingNm: spacing(c.grooves),
      },
      c.lambda,
    );
    // The traced deviation confirms the grating sits where the solver put it.
    expectClose(mount.chiefDiffractionRad(c.lambda), deg(point.diffractionDeg ?? NaN), 1e-9);
    const h = 1e-3;
    const x = (lambda: number) => mount.exitPositionMm(mount.trace(0, lambda));
    const traced = Math.abs((x(c.lambda + h) - x(c.lambda - h)) / (2 * h));
    expectClose(traced, point.linearDispersionMmPerNm ?? NaN, 0.005);
  });

  it('with a 10° camera the trace shows the cos θ₂ factor the paraxial closed form leaves out', () => {
    // Coddington: tangential focal length of an off-axis mirror is f cos θ. This pins the
    // closed form's known approximation rather than hiding it.
    const point = evaluateDesign(makeDesign(), { wavelengthsNm: [600] }).points[0]!;
    const mount = buildMount(
      {
        collimatorFocalMm: 300,
        cameraFocalMm: 300,
        collimatorOffAxisRad: deg(8),
        cameraOffAxisRad: deg(10),
        incidenceRad: deg(point.incidenceDeg ?? NaN),
        order: 1,
        spacingNm: spacing(1200),
      },
      600,
    );
    const x = (lambda: number) => mount.exitPositionMm(mount.trace(0, lambda));
    const traced = Math.abs((x(600.001) - x(599.999)) / 0.002);
    expectClose(traced, (point.linearDispersionMmPerNm ?? NaN) * Math.cos(deg(10)), 1e-4);
  });
});
