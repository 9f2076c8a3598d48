import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { errorBodySchema } from '../../shared/api-error';
import { exampleDesign } from '../../shared/design';
import { createTestApp } from '../support/test-app';

describe('POST /api/solve', () => {
  let ctx: Awaited<ReturnType<typeof createTestApp>>;
  beforeAll(async () => {
    ctx = await createTestApp();
  });
  afterAll(() => ctx.close());

  it('evaluates a design at the wavelengths asked for, without signing in', async () => {
    const res = await request(ctx.app)
      .post('/api/solve')
      .send({ design: exampleDesign, at: [400, 500, 600] })
      .expect(200);
    expect(res.body.points.map((p: { wavelengthNm: number }) => p.wavelengthNm)).toEqual([400, 500, 600]);
    const at500 = res.body.points[1];
    expect(at500.reachable).toBe(true);
    // Grating equation, Palmer & Loewen ch. 2: mλ = d(sin α + sin β), d = 1e6/1200 nm.
    const d = 1e6 / 1200;
    const sum = Math.sin((at500.incidenceDeg * Math.PI) / 180) + Math.sin((at500.diffractionDeg * Math.PI) / 180);
    expect(Math.abs(d * sum - 500)).toBeLessThan(1e-6);
    // Deviation 30° is kept between the chief rays: α − β = 2K.
    expect(at500.incidenceDeg - at500.diffractionDeg).toBeCloseTo(30, 9);
    expect(res.body.design).toBeTypeOf('object');
    expect(Array.isArray(res.body.warnings)).toBe(true);
  });

  it('samples the design range evenly when no wavelengths are given', async () => {
    const res = await request(ctx.app).post('/api/solve').send({ design: exampleDesign, points: 7 }).expect(200);
    const wavelengths = res.body.points.map((p: { wavelengthNm: number }) => p.wavelengthNm);
    expect(wavelengths).toHaveLength(7);
    expect(wavelengths[0]).toBe(exampleDesign.range.startNm);
    expect(wavelengths[6]).toBe(exampleDesign.range.endNm);
  });

  it('reports a wavelength beyond the grating as unreachable, with a reason and no NaN', async () => {
    // 2d cos K / m = 2 × 833.3 nm × cos 15° ≈ 1610 nm is the longest wavelength this mount delivers.
    const res = await request(ctx.app).post('/api/solve').send({ design: exampleDesign, at: [1700] }).expect(200);
    const [point] = res.body.points;
    expect(point.reachable).toBe(false);
    expect(typeof point.reason).toBe('string');
    expect(res.text).not.toMatch(/NaN|Infinity/);
    expect(res.body.warnings.some((w: { code: string }) => w.code === 'unreachable')).toBe(true);
  });

  it('answers an invalid design with 400 and the path of every bad field', async () => {
    const design = {
      ...exampleDesign,
      grating: { ...exampleDesign.grating, grooveDensityPerMm: -1200 },
      slits: { ...exampleDesign.slits, exitWidthUm: 'wide' },
    };
    const res = await request(ctx.app).post('/api/solve').send({ design, at: [500, -3] }).expect(400);
    const { error } = errorBodySchema.parse(res.body);
    expect(error.code).toBe('invalid_request');
    expect(Object.keys(error.fields ?? {}).sort()).toEqual(
      ['at.1', 'design.grating.grooveDensityPerMm', 'design.slits.exitWidthUm'].sort(),
    );
    expect(error.fields?.['design.grating.grooveDensityPerMm']).toMatch(/greater than 0/);
  });

  it('answers a body without a design with 400 naming the design field', async () => {
    const res = await request(ctx.app).post('/api/solve').send({ at: [500] }).expect(400);
    expect(Object.keys(res.body.error.fields)).toEqual(['design']);
  });
});
