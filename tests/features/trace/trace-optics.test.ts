import { describe, expect, it } from 'vitest';
import { traceDesign, type TracedWavelength } from '../../../features/trace';
import { buildMount, gratingAt } from '../../../features/trace/optical-system';
import { allocateBundle, traceBundle, traceChief } from '../../../features/trace/trace-bundle';
import type { Design } from '../../../shared/design';
import { bisect, buildMount as build2d, type TracedMount } from '../solver/trace-2d';

/**
 * The exact trace against optics handbooks. Every expected value is computed here from the
 * textbook formula, with no code shared with the trace (the angles come from the grating equation
 * written out below, not from the solver).
 */

const deg = (d: number) => (d * Math.PI) / 180;

/** Constant-deviation grating angles: mλ = 2d cos K sin φ, α = φ + K, β = φ − K (Palmer & Loewen, ch. 2). */
function angles(design: Design, wavelengthNm: number): { alpha: number; beta: number; spacingNm: number } {
  const spacingNm = 1e6 / design.grating.grooveDensityPerMm;
  const K = deg(design.layout.deviationAngleDeg) / 2;
  const phi = Math.asin((design.grating.order * wavelengthNm) / (2 * spacingNm * Math.cos(K)));
  return { alpha: phi + K, beta: phi - K, spacingNm };
}

const czernyTurner: Design = {
  grating: { grooveDensityPerMm: 1200, order: 1, ruledWidthMm: 40, ruledHeightMm: 40 },
  layout: { kind: 'czerny-turner', deviationAngleDeg: 30, collimatorFocalMm: 500, cameraFocalMm: 500, collimatorOffAxisDeg: 6, cameraOffAxisDeg: 8 },
  slits: { entranceWidthUm: 50, exitWidthUm: 50, heightMm: 4 },
  range: { startNm: 400, endNm: 700 },
};
const ebertFastie: Design = {
  ...czernyTurner,
  layout: { kind: 'ebert-fastie', deviationAngleDeg: 20, collimatorFocalMm: 500, cameraFocalMm: 500 },
};
const littrow: Design = {
  ...czernyTurner,
  layout: { kind: 'littrow', deviationAngleDeg: 0, collimatorFocalMm: 500, cameraFocalMm: 500 },
};

const centre = (design: Design, report = traceDesign(design, { rays: 2000 })): TracedWavelength =>
  report.wavelengths.find((w) => w.role === 'centre')!;

describe('traced linear dispersion at the centre wavelength', () => {
  it.each([
    ['Czerny–Turner', czernyTurner],
    ['Ebert–Fastie', ebertFastie],
    ['Littrow', littrow],
  ] as const)('%s: within 0.5 % of L·|m|/(d cos β) with L the traced camera-to-image distance, and 2 % of f_cam·|m|/(d cos β)', (_, design) => {
    // Palmer & Loewen, Diffraction Grating Handbook, ch. 2: linear dispersion = f·|m| / (d cos β),
    // f the distance to the image along the diffracted chief ray. The image plane is traced at the
    // camera's tangential focus (≈ f cos θ₂), so L, not f, is the distance that applies.
    const w = centre(design);
    const { beta, spacingNm } = angles(design, w.wavelengthNm);
    const m = Math.abs(design.grating.order);
    // mm/nm: with d in nm, f·|m|/(d cos β) is in mm per nm directly.
    const fromTracedDistance = (w.cameraToImageMm * m) / (spacingNm * Math.cos(beta));
    const nominal = (design.layout.cameraFocalMm * m) / (spacingNm * Math.cos(beta));
    const traced = Math.abs(w.tracedLinearDispersionMmPerNm);
    expect(Math.abs(traced / fromTracedDistance - 1)).toBeLessThan(0.005);
    expect(Math.abs(traced / nominal - 1)).toBeLessThan(0.02);
    // Longer wavelengths land at larger x (the documented sign).
    expect(w.tracedLinearDispersionMmPerNm).toBeGreaterThan(0);
  });
});

describe('an off-axis spherical mirror focusing a collimated beam (Coddington)', () => {
  it('puts the tangential focus at f cos θ and the sagittal at f / cos θ, to 0.5 %', () => {
    // A near-perfect collimator (on axis, f/25) feeds a camera used 12° off axis; the grating keeps
    // a collimated beam collimated. Coddington's equations for a mirror: s_t = f cos θ, s_s = f / cos θ.
    const theta = 12;
    const design: Design = {
      grating: { grooveDensityPerMm: 600, order: 1, ruledWidthMm: 40, ruledHeightMm: 40 },
      layout: { kind: 'czerny-turner', deviationAngleDeg: 30, collimatorFocalMm: 1000, cameraFocalMm: 1000, collimatorOffAxisDeg: 0, cameraOffAxisDeg: theta },
      slits: { entranceWidthUm: 10, exitWidthUm: 10, heightMm: 0.01 },
      range: { startNm: 500, endNm: 600 },
    };
    const w = centre(design);
    const f = design.layout.cameraFocalMm;
    const tangential = w.cameraToImageMm + w.tangentialFocusShiftMm;
    const sagittal = w.cameraToImageMm + w.sagittalFocusShiftMm;
    expect(Math.abs(tangential / (f * Math.cos(deg(theta))) - 1)).toBeLessThan(0.005);
    expect(Math.abs(sagittal / (f / Math.cos(deg(theta))) - 1)).toBeLessThan(0.005);
    // The astigmatism is their gap: f/cos θ − f cos θ = 44.5 mm here.
    expect(w.astigmatismMm).toBeCloseTo(f / Math.cos(deg(theta)) - f * Math.cos(deg(theta)), 0);
  });
});

describe('coma and the Shafer–Megill–Droppleman angle', () => {
  it('leaves the centre spot least lopsided with the camera at the coma-free angle, not 2° either side', () => {
    // Shafer, Megill & Droppleman, J. Opt. Soc. Am. 54, 879 (1964), with R₁ = R₂:
    // sin θ₂ / cos³ θ₂ = (sin θ₁ / cos³ θ₁) · (cos α / cos β)³, solved here by bisection.
    const base: Design = { ...czernyTurner, slits: { entranceWidthUm: 10, exitWidthUm: 10, heightMm: 0.01 } };
    const { alpha, beta } = angles(base, 550);
    const theta1 = deg(base.layout.collimatorOffAxisDeg!);
    const target = (Math.sin(theta1) / Math.cos(theta1) ** 3) * (Math.cos(alpha) / Math.cos(beta)) ** 3;
    const theta2 = bisect((t) => Math.sin(t) / Math.cos(t) ** 3 - target, 0, deg(60));
    const comaAt = (thetaDeg: number) => {
      const design = { ...base, layout: { ...base.layout, cameraOffAxisDeg: thetaDeg } };
      return Math.abs(centre(design).spots.find((s) => s.role === 'centre')!.comaMm);
    };
    const best = comaAt((theta2 * 180) / Math.PI);
    expect(best).toBeLessThan(comaAt((theta2 * 180) / Math.PI - 2));
    expect(best).toBeLessThan(comaAt((theta2 * 180) / Math.PI + 2));
  });
});

describe('slit-image curvature', () => {
  it('bows by (mλ/d) y² / (2 f cos β) with near-on-axis mirrors, within 5 %', () => {
    // Schroeder, Astronomical Optics, ch. 12 (the conical term of a plane grating): a point y from
    // the slit's centre meets the grating γ = y/f out of plane, and sin β grows by (mλ/d)γ²/2,
    // so its image moves f Δβ = (mλ/d) y² / (2 f cos β) along the dispersion (f₁ = f₂ = f).
    const design: Design = {
      ...czernyTurner,
      layout: { ...czernyTurner.layout, collimatorOffAxisDeg: 1, cameraOffAxisDeg: 1 },
      slits: { entranceWidthUm: 10, exitWidthUm: 10, heightMm: 20 },
    };
    const w = centre(design);
    const { beta, spacingNm } = angles(design, w.wavelengthNm);
    const y = design.slits.heightMm / 2;
    const expected = (((design.grating.order * w.wavelengthNm) / spacingNm) * y * y) / (2 * design.layout.cameraFocalMm * Math.cos(beta));
    expect(Math.abs(Math.abs(w.curvatureSagittaMm) / expected - 1)).toBeLessThan(0.05);
  });

  it('straightens with the curved entrance slit it proposes', () => {
    const design: Design = { ...czernyTurner, slits: { entranceWidthUm: 10, exitWidthUm: 10, heightMm: 20 } };
    const straight = traceDesign(design, { rays: 1000 });
    const curved = traceDesign(design, { rays: 1000, curvedEntrance: true });
    expect(straight.straighteningRadiusMm).not.toBeNull();
    expect(curved.curvedEntrance).toBe(true);
    const bow = (r: typeof straight) => Math.abs(r.wavelengths.find((w) => w.role === 'centre')!.curvatureSagittaMm);
    expect(bow(curved)).toBeLessThan(0.2 * bow(straight));
  });
});

describe('every ray is accounted for', () => {
  it.each([
    ['Czerny–Turner', czernyTurner],
    ['Ebert–Fastie', ebertFastie],
    ['Littrow', littrow],
  ] as const)('%s: traced + vignetted = launched, for the whole slit and every spot', (_, design) => {
    const report = traceDesign(design, { rays: 1200, atNm: [450] });
    expect(report.wavelengths.map((w) => w.wavelengthNm)).toEqual([400, 450, 550, 700]);
    for (const w of report.wavelengths) {
      expect(w.raysLaunched).toBe(1200);
      expect(w.raysTraced + w.raysVignetted).toBe(w.raysLaunched);
      expect(w.raysTraced).toBeGreaterThan(0.8 * w.raysLaunched);
      for (const s of w.spots) expect(s.x.length + s.raysVignetted).toBe(s.raysLaunched);
    }
  });

  it('counts rays that miss an undersized grating as vignetted, not lost', () => {
    // A point 15 mm up a 30 mm slit sends its collimated beam γ = 15/500 rad downward, which has
    // walked γ·f = 15 mm by the grating 500 mm on: with the grating 10 mm tall, the ends' rays miss it.
    const design: Design = { ...czernyTurner, grating: { ...czernyTurner.grating, ruledHeightMm: 10 }, slits: { ...czernyTurner.slits, heightMm: 30 } };
    const w = centre(design);
    expect(w.raysVignetted).toBeGreaterThan(0.1 * w.raysLaunched);
    expect(w.raysTraced + w.raysVignetted).toBe(w.raysLaunched);
  });
});

describe('the independent 2-D trace', () => {
  it('agrees with the 3-D trace on meridional rays of a Czerny–Turner', () => {
    const design = czernyTurner;
    const nm = 550;
    const mount = buildMount(design);
    const grating = gratingAt(design, nm)!;
    const { slitCentre, pupilCentre } = mount.launch;
    const chief = traceChief(mount, grating, nm, slitCentre, pupilCentre)!;
    const f = design.layout.cameraFocalMm;
    const plane = {
      point: {
        x: chief.cameraHit.x + chief.direction.x * f * Math.cos(chief.cameraIncidenceRad),
        y: chief.cameraHit.y + chief.direction.y * f * Math.cos(chief.cameraIncidenceRad),
        z: chief.cameraHit.z + chief.direction.z * f * Math.cos(chief.cameraIncidenceRad),
      },
      normal: chief.direction,
      xAxis: { x: -chief.direction.y, y: chief.direction.x, z: 0 },
      yAxis: { x: 0, y: 0, z: 1 },
    };
    // A fan in the dispersion plane from the slit's centre, ±1.5° about the chief ray.
    const fan = [-1.5, -1, -0.5, 0, 0.5, 1, 1.5].map(deg);
    const toCollimator = {
      x: pupilCentre.x - slitCentre.x,
      y: pupilCentre.y - slitCentre.y,
    };
    const base = Math.atan2(toCollimator.y, toCollimator.x);
    const bundle = allocateBundle(fan.length);
    fan.forEach((e, i) => {
      bundle.ox[i] = slitCentre.x;
      bundle.oy[i] = slitCentre.y;
      bundle.oz[i] = 0;
      bundle.dx[i] = Math.cos(base + e);
      bundle.dy[i] = Math.sin(base + e);
      bundle.dz[i] = 0;
    });
    expect(traceBundle(mount, grating, plane, nm, bundle)).toBe(fan.length);
    const ours = fan.map((_, i) => bundle.x[i]! - bundle.x[3]!);

    // The same mount in the 2-D trace: same focal lengths, off-axis angles, incidence and arms
    // (the sketch puts each mirror f from the grating), each fold turning the same way as ours.
    const { alpha, spacingNm } = angles(design, nm);
    const turn = (a: { x: number; y: number }, b: { x: number; y: number }) => Math.sign(a.x * b.y - a.y * b.x);
    const d0 = toCollimator;
    const d1 = { x: -mount.collimator.vertex.x, y: -mount.collimator.vertex.y };
    const d2 = { x: mount.camera.vertex.x, y: mount.camera.vertex.y };
    const d3 = chief.direction;
    const collimatorTurn = turn(d0, d1) * turn(d1, d2);
    const cameraTurn = turn(d2, d3) * turn(d1, d2);
    const theirsFor = (t1: number, t2: number): TracedMount =>
      build2d(
        {
          collimatorFocalMm: design.layout.collimatorFocalMm,
          cameraFocalMm: f,
          collimatorOffAxisRad: t1,
          cameraOffAxisRad: t2,
          incidenceRad: alpha,
          order: design.grating.order,
          spacingNm,
          armMm: f,
        },
        nm,
      );
    // Find the 2-D sign pair whose folds turn as ours do (the 2-D trace's own chief rays).
    const theta1 = deg(design.layout.collimatorOffAxisDeg!);
    const theta2 = deg(design.layout.cameraOffAxisDeg!);
    const pairs = [
      [theta1, theta2],
      [theta1, -theta2],
      [-theta1, theta2],
      [-theta1, -theta2],
    ] as const;
    const matching = pairs.filter(([t1, t2]) => {
      // The 2-D chief ray: +x to the collimator (vertex at f₁ cos θ₁), folded there, on to the
      // grating one arm further, diffracted to the camera, folded again onto the exit plane's normal.
      const m2 = theirsFor(t1, t2);
      const u0 = { x: 1, y: 0 };
      const u1 = rotateFold(u0, t1);
      const v1 = { x: design.layout.collimatorFocalMm * Math.cos(t1), y: 0 };
      const gratingPoint = { x: v1.x + u1.x * f, y: v1.y + u1.y * f };
      const v2 = m2.trace(0, nm).origin;
      const u2 = { x: v2.x - gratingPoint.x, y: v2.y - gratingPoint.y };
      const u3 = m2.exitPlane.normal;
      return turn(u0, u1) * turn(u1, u2) === collimatorTurn && turn(u2, u3) * turn(u1, u2) === cameraTurn;
    });
    expect(matching.length).toBeGreaterThan(0);
    const [t1, t2] = matching[0]!;
    const theirs2d = theirsFor(t1, t2);
    const theirs = fan.map((e) => theirs2d.exitPositionMm(theirs2d.trace(e, nm)) - theirs2d.exitPositionMm(theirs2d.trace(0, nm)));
    // A mirror image flips both the fan and the exit axis: compare with either reading.
    const direct = ours.map((x, i) => Math.abs(x - theirs[i]!));
    const mirrored = ours.map((x, i) => Math.abs(x + theirs[fan.length - 1 - i]!));
    const worst = Math.min(Math.max(...direct), Math.max(...mirrored));
    // Positions across the fan span some 25 mm; agreement to 0.1 µm.
    expect(Math.max(...ours.map(Math.abs))).toBeGreaterThan(1e-3);
    expect(worst).toBeLessThan(1e-4);
  });
});

/** 2-D: the collimator folds the +x chief ray by 2θ₁ (as the 2-D trace builds it). */
function rotateFold(u0: { x: number; y: number }, theta: number): { x: number; y: number } {
  // n₁ = rotate(−u₀, θ₁); u₁ = reflect(u₀, n₁).
  const n = { x: -Math.cos(theta) * u0.x + Math.sin(theta) * u0.y, y: -Math.sin(theta) * u0.x - Math.cos(theta) * u0.y };
  const dn = u0.x * n.x + u0.y * n.y;
  return { x: u0.x - 2 * dn * n.x, y: u0.y - 2 * dn * n.y };
}
