import { describe, expect, it } from 'vitest';
import {
  astigmaticFocalDifferenceMm,
  comaFreeCameraAngleRad,
  evaluateDesign,
  solveTPlusTCubed,
} from '@/features/solver';
import { deg, expectClose } from './close-to';
import { makeDesign, spacing } from './fixtures';
import { bisect, buildMount, tangentialComaMm } from './trace-2d';

/** Camera angle (deg) where the traced tangential coma of the whole mount vanishes. */
function tracedComaFreeDeg(c: {
  grooves: number;
  order: number;
  lambda: number;
  incidenceRad: number;
  fCol: number;
  fCam: number;
  theta1Deg: number;
}): number {
  const coma = (theta2Deg: number) =>
    tangentialComaMm(
      buildMount(
        {
          collimatorFocalMm: c.fCol,
          cameraFocalMm: c.fCam,
          collimatorOffAxisRad: deg(c.theta1Deg),
          cameraOffAxisRad: deg(theta2Deg),
          incidenceRad: c.incidenceRad,
          order: c.order,
          spacingNm: spacing(c.grooves),
        },
        c.lambda,
      ),
      // A small ±h pupil pair: keeps the h⁴ terms below the fourth decimal of a degree.
      2e-4,
      c.lambda,
    );
  return bisect(coma, 0.01, 60, 100);
}

describe('coma-free Czerny–Turner (Shafer, Megill & Droppleman, JOSA 54, 879, 1964)', () => {
  it('equal mirrors with α = β need equal off-axis angles', () => {
    // Sanity check named in the paper's condition: all ratios are 1.
    expectClose(comaFreeCameraAngleRad(deg(9), 300, 300, Math.cos(deg(20)), Math.cos(deg(20))), deg(9), 1e-12);
  });

  it('when α > β the wider diffracted beam needs the smaller camera angle', () => {
    const theta2 = comaFreeCameraAngleRad(deg(8), 300, 300, Math.cos(deg(40)), Math.cos(deg(10)));
    expect(theta2).toBeLessThan(deg(8));
    expect(theta2).toBeGreaterThan(0);
  });

  it('solves sin θ₂ / sin θ₁ = (R₂/R₁)² (cos θ₂ / cos θ₁)³ (cos α / cos β)³ exactly', () => {
    const [t1, fCol, fCam, ca, cb] = [deg(7), 250, 400, Math.cos(deg(33)), Math.cos(deg(3))];
    const t2 = comaFreeCameraAngleRad(t1, fCol, fCam, ca, cb);
    const lhs = Math.sin(t2) / Math.sin(t1);
    const rhs = ((2 * fCam) / (2 * fCol)) ** 2 * (Math.cos(t2) / Math.cos(t1)) ** 3 * (ca / cb) ** 3;
    expectClose(lhs, rhs, 1e-12);
  });

  it.each([
    { name: 'example design at 600 nm', grooves: 1200, order: 1, lambda: 600, deviationDeg: 30, fCol: 300, fCam: 300, theta1Deg: 8 },
    { name: 'asymmetric mirrors', grooves: 1200, order: 1, lambda: 600, deviationDeg: 30, fCol: 200, fCam: 400, theta1Deg: 6 },
    { name: 'order −1, 2400 g/mm', grooves: 2400, order: -1, lambda: 350, deviationDeg: 26, fCol: 500, fCam: 500, theta1Deg: 5 },
    { name: 'second order, wide deviation', grooves: 600, order: 2, lambda: 700, deviationDeg: 50, fCol: 320, fCam: 350, theta1Deg: 10 },
  ] satisfies readonly {
    name: string;
    grooves: number;
    order: number;
    lambda: number;
    deviationDeg: number;
    fCol: number;
    fCam: number;
    theta1Deg: number;
  }[])('$name: a tangential-fan ray trace agrees to four decimals of a degree', (c) => {
    const design = makeDesign({
      grating: { grooveDensityPerMm: c.grooves, order: c.order },
      layout: {
        deviationAngleDeg: c.deviationDeg,
        collimatorFocalMm: c.fCol,
        cameraFocalMm: c.fCam,
        collimatorOffAxisDeg: c.theta1Deg,
      },
      range: { startNm: c.lambda - 20, endNm: c.lambda + 20 },
    });
    const evaluation = evaluateDesign(design, { wavelengthsNm: [c.lambda] });
    const point = evaluation.points[0]!;
    const traced = tracedComaFreeDeg({ ...c, incidenceRad: deg(point.incidenceDeg ?? NaN) });
    expect(Math.abs(traced - (evaluation.design.aberrations.comaFreeCameraOffAxisDeg ?? NaN))).toBeLessThan(1e-4);
  });

  it('reports the residual at the range ends against the camera angle in use', () => {
    // The residual at 900 nm is the traced coma-free angle there minus the design's 10°.
    const design = makeDesign();
    const evaluation = evaluateDesign(design, { wavelengthsNm: [300, 900] });
    const aberrations = evaluation.design.aberrations;
    expect(aberrations.cameraOffAxisInUseDeg).toBe(10);
    for (const [index, residual] of [[0, aberrations.comaResidualAtStartDeg], [1, aberrations.comaResidualAtEndDeg]] as const) {
      const p = evaluation.points[index]!;
      const traced = tracedComaFreeDeg({
        grooves: 1200, order: 1, lambda: p.wavelengthNm, incidenceRad: deg(p.incidenceDeg ?? NaN),
        fCol: 300, fCam: 300, theta1Deg: 8,
      });
      expect(Math.abs((residual ?? NaN) - (traced - 10))).toBeLessThan(1e-4);
    }
  });

  it('has no coma-free angle for Littrow (one element both ways) or without a collimator angle', () => {
    const littrow = evaluateDesign(makeDesign({ layout: { kind: 'littrow', deviationAngleDeg: 0 } }), { points: 3 });
    expect(littrow.design.aberrations.comaFreeCameraOffAxisDeg).toBeNull();
    const noAngle = makeDesign();
    delete noAngle.layout.collimatorOffAxisDeg;
    const e = evaluateDesign(noAngle, { points: 3 });
    expect(e.design.aberrations.comaFreeCameraOffAxisDeg).toBeNull();
    expect(e.design.aberrations.comaResidualAtEndDeg).toBeNull();
    expect(e.design.aberrations.collimatorAstigmatismMm).toBeNull();
  });

  it('the cubic t + t³ = c is solved to machine precision for small and huge c', () => {
    for (const c of [0, 1e-12, 0.3, 2, -5, 1e9]) {
      const t = solveTPlusTCubed(c);
      expectClose(t + t ** 3, c, 1e-13, 1e-25);
    }
  });
});

describe('astigmatism of an off-axis spherical mirror (Coddington)', () => {
  it('is the gap between the sagittal focus f / cos θ and the tangential focus f cos θ', () => {
    // Coddington for a mirror with the object at infinity: 1/s'_t = 2/(R cos θ), 1/s'_s = 2 cos θ/R.
    const R = 600;
    const theta = deg(8);
    const tangential = (R * Math.cos(theta)) / 2;
    const sagittal = R / (2 * Math.cos(theta));
    expectClose(astigmaticFocalDifferenceMm(300, theta), sagittal - tangential, 1e-12);
    // About 5.87 mm for a 0.3 m mirror at 8° (by hand: 300 · (1/0.99027 − 0.99027)).
    expectClose(astigmaticFocalDifferenceMm(300, theta), 5.868, 1e-3);
    expect(astigmaticFocalDifferenceMm(300, 0)).toBe(0);
  });

  it('is reported for each mirror of the design', () => {
    const e = evaluateDesign(makeDesign(), { points: 3 });
    expectClose(e.design.aberrations.cameraAstigmatismMm, 300 / Math.cos(deg(10)) - 300 * Math.cos(deg(10)), 1e-12);
  });
});
