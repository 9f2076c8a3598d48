import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { errorBodySchema } from '../../shared/api-error';
import { exampleDesign, MAX_SOLVE_WAVELENGTHS, type Design } from '../../shared/design';
import type { DatabaseHandle } from '../../db/client';
import { createTestApp } from '../support/test-app';
import { openTestDatabase } from '../support/test-db';

/**
 * Order 1000 with a source from 0.001 nm to 10 mm (the schema's widest): about a million other
 * orders land on each wavelength. 1200 g/mm in order 1000 reaches only up to 2d cos²K / 1000 ≈ 1.56 nm.
 */
const hostileDesign: Design = {
  ...exampleDesign,
  grating: { ...exampleDesign.grating, order: 1000 },
  source: { minNm: 0.001, maxNm: 10_000_000 },
};

/** `count` wavelengths evenly over `[fromNm, toNm]`, with long decimals (the longest JSON). */
function wavelengthsNm(count: number, fromNm: number, toNm: number): number[] {
  return Array.from({ length: count }, (_, i) => fromNm + ((toNm - fromNm) * (i + 0.1)) / count);
}

// 2.5 MB: each listed overlap says whether a filter blocks it (issue 16) and the light budget adds its factors (issue 17) — about 2.2 MB measured.
const LIMIT_BYTES = 2.5 * 1024 * 1024;

// Solving reads and writes no data: one database for the file, and a new app (so new rate limits)
// where a case needs one. Each copy of the database takes seconds to open.
let database: DatabaseHandle;
beforeAll(async () => {
  database = await openTestDatabase();
});
afterAll(() => database?.close());

describe('POST /api/solve', () => {
  let ctx: Awaited<ReturnType<typeof createTestApp>>;
  beforeAll(async () => {
    ctx = await createTestApp({ database });
  });

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

  it('refuses a design no grating can be with 400 naming the field, and warns where the closed forms grow rough', async () => {
    // Palmer & Loewen, ch. 9: a first-order Littrow blaze λ_B = 2d sin θ_B stays below 2d (1667 nm at 1200/mm).
    const impossible = { ...exampleDesign, grating: { ...exampleDesign.grating, blazeWavelengthNm: 5000 } };
    const refused = await request(ctx.app).post('/api/solve').send({ design: impossible }).expect(400);
    expect(errorBodySchema.parse(refused.body).error.fields?.['design.grating.blazeWavelengthNm']).toMatch(/twice the groove spacing/);

    // A Czerny–Turner at deviation 0 is possible only out of plane: a warning, not a refusal.
    const degenerate = { ...exampleDesign, layout: { ...exampleDesign.layout, deviationAngleDeg: 0 } };
    const res = await request(ctx.app).post('/api/solve').send({ design: degenerate, points: 3 }).expect(200);
    expect(res.body.warnings.map((w: { code: string }) => w.code)).toEqual(expect.arrayContaining(['degenerate-mount', 'beyond-scalar-blaze']));
    expect(res.body.design.detector.samples.map((x: { position: string }) => x.position)).toEqual(['start', 'centre', 'end']);
  });

  it('answers a body without a design with 400 naming the design field', async () => {
    const res = await request(ctx.app).post('/api/solve').send({ at: [500] }).expect(400);
    expect(Object.keys(res.body.error.fields)).toEqual(['design']);
  });

  it('refuses more than 1000 wavelengths in `at` with 400 naming the field', async () => {
    // The body that once held the thread for seconds and answered 18 MB.
    const res = await request(ctx.app)
      .post('/api/solve')
      .send({ design: hostileDesign, at: wavelengthsNm(5000, 0.001, 1.5) })
      .expect(400);
    const { error } = errorBodySchema.parse(res.body);
    expect(error.code).toBe('invalid_request');
    expect(error.fields).toEqual({ at: 'must list at most 1000 wavelengths' });
  });

  it('refuses more than 1000 points with 400 naming the field', async () => {
    const res = await request(ctx.app).post('/api/solve').send({ design: exampleDesign, points: 1001 }).expect(400);
    expect(errorBodySchema.parse(res.body).error.fields).toEqual({ points: 'must be a whole number from 2 to 1000' });
  });

  it('answers a request at the caps with the widest source in under 2.5 MB, every cut list marked', async () => {
    const res = await request(ctx.app)
      .post('/api/solve')
      .set('accept-encoding', 'identity')
      .send({ design: hostileDesign, at: wavelengthsNm(MAX_SOLVE_WAVELENGTHS, 0.001, 1.5) })
      .expect(200);
    expect(Number(res.headers['content-length'])).toBeLessThan(LIMIT_BYTES);
    const points = res.body.points as {
      wavelengthNm: number;
      reachable: boolean;
      overlaps: { order: number; wavelengthNm: number }[];
      overlapCount: number;
      overlapsTruncated: boolean;
    }[];
    expect(points).toHaveLength(MAX_SOLVE_WAVELENGTHS);
    for (const p of points) {
      expect(p.reachable).toBe(true);
      expect(p.overlaps).toHaveLength(20);
      expect(p.overlapsTruncated).toBe(true);
      // n runs from 1 to floor(1000 λ / 0.001 nm), less the working order itself.
      expect(p.overlapCount).toBe(Math.floor((1000 * p.wavelengthNm) / 0.001) - 1);
      // The 20 nearest the working order: 990…999 and 1001…1010.
      expect(p.overlaps.map((o) => o.order)).toEqual([...range(990, 999), ...range(1001, 1010)]);
    }
  });

  it('lists a short overlap list whole, marked as not cut', async () => {
    const res = await request(ctx.app).post('/api/solve').send({ design: exampleDesign, at: [600] }).expect(200);
    expect(res.body.points[0]).toMatchObject({
      overlaps: [
        { order: 2, wavelengthNm: 300 },
        { order: 3, wavelengthNm: 200 },
      ],
      overlapCount: 2,
      overlapsTruncated: false,
    });
  });
});

describe('POST /api/solve rate limit', () => {
  it('answers the 121st call in a minute from one address with 429 and the usual error shape', async () => {
    const ctx = await createTestApp({ database });
    try {
      for (let i = 0; i < 120; i++) {
        await request(ctx.app).post('/api/solve').send({ design: exampleDesign, at: [500] }).expect(200);
      }
      const res = await request(ctx.app).post('/api/solve').send({ design: exampleDesign, at: [500] }).expect(429);
      const { error } = errorBodySchema.parse(res.body);
      expect(error.code).toBe('rate_limited');
      expect(error.message).toMatch(/solve/);
      // Only solving is limited: the rest of the API still answers.
      await request(ctx.app).get('/api/health').expect(200);
    } finally {
      await ctx.close();
    }
  });

  it('takes its limit and window from AppDeps.rateLimits', async () => {
    const ctx = await createTestApp({ database, rateLimits: { solvePerIp: 2, solveWindowMs: 60_000 } });
    try {
      for (let i = 0; i < 2; i++) await request(ctx.app).post('/api/solve').send({ design: exampleDesign, points: 2 }).expect(200);
      await request(ctx.app).post('/api/solve').send({ design: exampleDesign, points: 2 }).expect(429);
    } finally {
      await ctx.close();
    }
  });
});

function range(from: number, to: number): number[] {
  return Array.from({ length: to - from + 1 }, (_, i) => from + i);
}
