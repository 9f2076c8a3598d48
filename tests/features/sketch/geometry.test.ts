import { describe, expect, it } from 'vitest';
import {
  scaleBarLengthMm,
  sketchGeometry,
  type PointMm,
  type SketchGeometry,
} from '../../../features/sketch/geometry';
import { evaluateDesign, grooveSpacingNm } from '../../../features/solver';
import { exampleDesign, type Design } from '../../../shared/design';

const ANGLE_TOLERANCE_DEG = 1e-9;
const DEG = 180 / Math.PI;

const sub = (p: PointMm, q: PointMm): PointMm => ({ x: p.x - q.x, y: p.y - q.y });
const length = (p: PointMm) => Math.hypot(p.x, p.y);
const distance = (p: PointMm, q: PointMm) => length(sub(p, q));
/** Signed angle from `from` to `to`, degrees, counter-clockwise positive. */
const signedAngleDeg = (from: PointMm, to: PointMm) =>
  Math.atan2(from.x * to.y - from.y * to.x, from.x * to.x + from.y * to.y) * DEG;
const point = (points: readonly PointMm[], i: number) => points[i] as PointMm;

const normalOf = (g: SketchGeometry) => sub(g.grating.normal.b, g.grating.normal.a);
/** Direction back toward where the light came from, at the grating (chief ray: slit, collimator, grating, camera, image). */
const incomingOf = (chief: readonly PointMm[]) => sub(point(chief, 1), point(chief, 2));
const outgoingOf = (chief: readonly PointMm[]) => sub(point(chief, 3), point(chief, 2));

const littrow: Design = {
  ...exampleDesign,
  layout: { kind: 'littrow', deviationAngleDeg: 0, collimatorFocalMm: 500, cameraFocalMm: 500 },
  range: { startNm: 590, endNm: 610 },
  detector: undefined,
};
const ebertFastie: Design = {
  ...exampleDesign,
  layout: { kind: 'ebert-fastie', deviationAngleDeg: 24, collimatorFocalMm: 400, cameraFocalMm: 400 },
  range: { startNm: 400, endNm: 700 },
  detector: undefined,
};
const negativeOrder: Design = { ...exampleDesign, grating: { ...exampleDesign.grating, order: -1 } };
const noOffAxisAngles: Design = {
  ...exampleDesign,
  layout: { kind: 'czerny-turner', deviationAngleDeg: 30, collimatorFocalMm: 250, cameraFocalMm: 350 },
};

const mounts = [
  { name: 'the example Czerny–Turner', design: exampleDesign },
  { name: 'a Czerny–Turner without off-axis angles and unequal focal lengths', design: noOffAxisAngles },
  { name: 'a Czerny–Turner in order −1', design: negativeOrder },
  { name: 'a Littrow', design: littrow },
  { name: 'an Ebert–Fastie', design: ebertFastie },
] satisfies { name: string; design: Design }[];

const settings = ['start', 'centre', 'end'] as const;

describe('sketchGeometry against the solver', () => {
  describe.each(mounts)('$name', ({ design }) => {
    it.each(settings)(
      'with the grating set for the range %s, the chief ray meets the grating at the solver’s α and leaves at its β',
      (role) => {
        const wavelengthNm =
          role === 'start'
            ? design.range.startNm
            : role === 'end'
              ? design.range.endNm
              : (design.range.startNm + design.range.endNm) / 2;
        const solved = evaluateDesign(design, { wavelengthsNm: [wavelengthNm] }).points[0]!;
        const g = sketchGeometry(design, { settingNm: wavelengthNm });
        const ray = g.rays.find((r) => r.wavelengthNm === wavelengthNm)!;
        expect(ray).toBeDefined();
        const normal = normalOf(g);
        expect(Math.abs(signedAngleDeg(normal, incomingOf(ray.chief)) - solved.incidenceDeg!)).toBeLessThan(
          ANGLE_TOLERANCE_DEG,
        );
        expect(Math.abs(signedAngleDeg(normal, outgoingOf(ray.chief)) - solved.diffractionDeg!)).toBeLessThan(
          ANGLE_TOLERANCE_DEG,
        );
        expect(Math.abs(g.rotationDeg - solved.gratingRotationDeg!)).toBeLessThan(ANGLE_TOLERANCE_DEG);
      },
    );

    it('turns the incident chief ray through the deviation 2K into the diffracted one', () => {
      const g = sketchGeometry(design);
      const centre = g.rays.find((r) => r.role === 'centre')!;
      const deviationDeg = Math.abs(signedAngleDeg(incomingOf(centre.chief), outgoingOf(centre.chief)));
      expect(Math.abs(deviationDeg - design.layout.deviationAngleDeg)).toBeLessThan(ANGLE_TOLERANCE_DEG);
    });

    it('puts each optic its focal length from the grating along the chief ray, and each slit its focal length from its optic', () => {
      const g = sketchGeometry(design);
      const origin = { x: 0, y: 0 };
      const { collimatorFocalMm, cameraFocalMm } = design.layout;
      const centre = g.rays.find((r) => r.role === 'centre')!;
      expect(point(centre.chief, 1)).toEqual(g.collimator.centre);
      expect(distance(g.collimator.centre, origin)).toBeCloseTo(collimatorFocalMm, 9);
      expect(distance(g.camera.centre, origin)).toBeCloseTo(
        design.layout.kind === 'littrow' ? collimatorFocalMm : cameraFocalMm,
        9,
      );
      // The centre wavelength's chief ray meets the camera at its centre (it is the axis ray).
      expect(distance(point(centre.chief, 3), g.camera.centre)).toBeLessThan(1e-9);
      if (design.layout.kind !== 'littrow') {
        expect(distance(g.entranceSlit.centre, g.collimator.centre)).toBeCloseTo(collimatorFocalMm, 9);
        expect(distance(g.exitSlit.centre, g.camera.centre)).toBeCloseTo(cameraFocalMm, 9);
      }
    });

    it('sends the edge rays through the two ends of the ruled width', () => {
      const g = sketchGeometry(design);
      for (const ray of g.rays) {
        const [a, b] = ray.edges;
        expect(distance(point(a, 2), point(b, 2))).toBeCloseTo(design.grating.ruledWidthMm, 9);
        // Edges and chief meet again at the image in the exit plane.
        expect(point(a, 4)).toEqual(point(ray.chief, 4));
        expect(point(b, 4)).toEqual(point(ray.chief, 4));
      }
    });

    it('diffracts every drawn wavelength by the grating equation mλ = d(sin α + sin β) on the one set grating', () => {
      const g = sketchGeometry(design);
      const d = grooveSpacingNm(design.grating.grooveDensityPerMm);
      const normal = normalOf(g);
      for (const ray of g.rays) {
        const alpha = signedAngleDeg(normal, incomingOf(ray.chief)) / DEG;
        const beta = signedAngleDeg(normal, outgoingOf(ray.chief)) / DEG;
        expect(d * (Math.sin(alpha) + Math.sin(beta))).toBeCloseTo(
          design.grating.order * ray.wavelengthNm,
          9,
        );
      }
    });
  });

  it('spaces the images of a narrow range by Δλ times the linear dispersion at the exit plane', () => {
    // Linear dispersion f_cam·|m| / (d cos β): Palmer & Loewen, Diffraction Grating Handbook, ch. 2.
    const narrow: Design = { ...exampleDesign, range: { startNm: 599.5, endNm: 600.5 } };
    const g = sketchGeometry(narrow);
    const start = g.rays.find((r) => r.role === 'start')!;
    const end = g.rays.find((r) => r.role === 'end')!;
    const centre = evaluateDesign(narrow, { wavelengthsNm: [600] }).points[0]!;
    const expectedMm = 1 * centre.linearDispersionMmPerNm!;
    expect(Math.abs(end.exitOffsetMm - start.exitOffsetMm) / expectedMm).toBeCloseTo(1, 4);
    expect(distance(point(start.chief, 4), point(end.chief, 4)) / expectedMm).toBeCloseTo(1, 4);
  });

  it('lays the incident and diffracted chief rays of a Littrow mount along one line', () => {
    const g = sketchGeometry(littrow);
    const centre = g.rays.find((r) => r.role === 'centre')!;
    expect(Math.abs(signedAngleDeg(incomingOf(centre.chief), outgoingOf(centre.chief)))).toBeLessThan(
      ANGLE_TOLERANCE_DEG,
    );
    expect(g.collimator).toBe(g.camera);
    expect(g.collimator.kind).toBe('lens');
    // Drawn side by side, since in the instrument they sit one above the other.
    expect(distance(g.entranceSlit.centre, g.exitSlit.centre)).toBeGreaterThan(0);
  });

  it('draws the two zones of an Ebert–Fastie mirror on one sphere', () => {
    const g = sketchGeometry(ebertFastie);
    expect(g.sharedMirror).not.toBeNull();
    const f = ebertFastie.layout.collimatorFocalMm;
    const K = ebertFastie.layout.deviationAngleDeg / 2 / DEG;
    // Centre of curvature f behind the grating on the bisector (the +y axis by default).
    const curvatureCentre = { x: 0, y: -f };
    const radius = 2 * f * Math.cos(K / 2);
    expect(distance(g.collimator.centre, curvatureCentre)).toBeCloseTo(radius, 9);
    expect(distance(g.camera.centre, curvatureCentre)).toBeCloseTo(radius, 9);
  });

  it('lays a detector of pixelCount × pixelPitch along the exit plane', () => {
    const g = sketchGeometry(exampleDesign);
    const { pixelCount, pixelPitchUm } = exampleDesign.detector!;
    expect(distance(g.detector!.a, g.detector!.b)).toBeCloseTo((pixelCount * pixelPitchUm) / 1000, 9);
  });

  it('draws no rays for a wavelength beyond the grating equation and says why', () => {
    // 1200 /mm with K = 15°: |mλ| ≤ 2d cos²K ≈ 1555 nm in first order.
    const far: Design = { ...exampleDesign, range: { startNm: 500, endNm: 2500 } };
    const g = sketchGeometry(far, { settingNm: 600 });
    expect(g.rays.map((r) => r.role)).not.toContain('end');
    const end = g.unreachable.find((u) => u.role === 'end');
    expect(end?.wavelengthNm).toBe(2500);
    expect(end?.reason).toMatch(/no diffracted order/);
  });

  it('draws no rays at all when the grating cannot be set for the chosen wavelength', () => {
    const g = sketchGeometry(exampleDesign, { settingNm: 5000 });
    expect(g.settingReachable).toBe(false);
    expect(g.rays).toEqual([]);
    expect(g.unreachable).toHaveLength(3);
    expect(g.unreachable[0]?.reason).toMatch(/cannot be set for 5000\snm/);
    expect(g.arcs).toEqual([]);
  });

  it('notes the off-axis angles it chose when the design leaves them out', () => {
    expect(sketchGeometry(noOffAxisAngles).notes.join(' ')).toMatch(/off-axis angles not given/);
    expect(sketchGeometry(exampleDesign).notes).toEqual([]);
  });

  it('annotates α, β and K with their values', () => {
    const g = sketchGeometry(exampleDesign);
    const solved = evaluateDesign(exampleDesign, { wavelengthsNm: [600] }).points[0]!;
    const byLabel = Object.fromEntries(g.arcs.map((a) => [a.label, a.valueDeg]));
    expect(byLabel['α']).toBeCloseTo(solved.incidenceDeg!, 9);
    expect(byLabel['β']).toBeCloseTo(solved.diffractionDeg!, 9);
    expect(byLabel['K']).toBeCloseTo(15, 9);
  });
});

describe('scaleBarLengthMm', () => {
  it.each([
    { spanMm: 400, expected: 100 },
    { spanMm: 250, expected: 50 },
    { spanMm: 1000, expected: 200 },
    { spanMm: 30, expected: 5 },
    { spanMm: 4, expected: 1 },
  ] satisfies { spanMm: number; expected: number }[])(
    'picks $expected mm for a drawing $spanMm mm wide',
    ({ spanMm, expected }) => {
      expect(scaleBarLengthMm(spanMm)).toBe(expected);
    },
  );
});
