import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { checkRequirements } from '../../features/requirements/index';
import { errorBodySchema } from '../../shared/api-error';
import { designSchema, exampleDesign } from '../../shared/design';
import { searchAnswerSchema } from '../../shared/search';
import type { DatabaseHandle } from '../../db/client';
import { createTestApp } from '../support/test-app';
import { openTestDatabase } from '../support/test-db';

/** A small search: 2 densities × 2 blazes × orders ±1 × 2 deviations × 3 focal lengths = 48 candidates. */
const small = {
  range: { startNm: 400, endNm: 700 },
  source: { minNm: 380, maxNm: 780 },
  requirements: { maxBandpassNm: 0.5, minBlazeEfficiency: 0.3, maxFocalLengthMm: 400 },
  search: {
    grooveDensitiesPerMm: [600, 1200],
    blazeWavelengthsNm: [400, 500],
    maxOrder: 1,
    deviationAnglesDeg: [20, 30],
    focalLengthsMm: [200, 300, 500],
    top: 5,
  },
};

let database: DatabaseHandle;
beforeAll(async () => {
  database = await openTestDatabase();
});
afterAll(() => database?.close());

describe('POST /api/search', () => {
  let ctx: Awaited<ReturnType<typeof createTestApp>>;
  beforeAll(async () => {
    ctx = await createTestApp({ database });
  });
  afterAll(() => ctx?.close());

  it('answers ranked candidates without signing in or an Origin header, each passing its requirements', async () => {
    const res = await request(ctx.app).post('/api/search').send(small).expect(200);
    const answer = searchAnswerSchema.parse(res.body);
    expect(answer.considered).toBe(48);
    expect(answer.candidates).toHaveLength(5);
    for (const candidate of answer.candidates) {
      const design = designSchema.parse(candidate.design);
      expect(checkRequirements(design).failed).toBe(0);
      // The design solves unchanged through the solver's own route.
      await request(ctx.app).post('/api/solve').send({ design: candidate.design, points: 5 }).expect(200);
    }
  });

  it('refuses a bad field with a 400 naming it', async () => {
    const res = await request(ctx.app)
      .post('/api/search')
      .send({ ...small, requirements: { maxBandpassNm: -1 }, search: { ...small.search, maxOrder: 4 } })
      .expect(400);
    const { error } = errorBodySchema.parse(res.body);
    expect(error.code).toBe('invalid_request');
    expect(error.fields).toMatchObject({
      'requirements.maxBandpassNm': 'must be greater than 0',
      'search.maxOrder': 'must be at most 3',
    });
  });

  it('refuses more candidates than the cap with a 400 naming search, before any work', async () => {
    const forty = (from: number, step: number) => Array.from({ length: 40 }, (_, i) => from + i * step);
    // 8 stock densities × 10 stock blazes × 6 orders × 40 × 40 = 768,000 > 50,000.
    const started = Date.now();
    const res = await request(ctx.app)
      .post('/api/search')
      .send({ ...small, search: { deviationAnglesDeg: forty(1, 1), focalLengthsMm: forty(100, 10) } })
      .expect(400);
    expect(Date.now() - started).toBeLessThan(2000);
    const { error } = errorBodySchema.parse(res.body);
    expect(error.fields?.search).toMatch(/would evaluate 768000 candidates .*at most 50000/);
  });

  it('refuses a detector requirement without a detector, naming the requirement', async () => {
    const res = await request(ctx.app)
      .post('/api/search')
      .send({ ...small, requirements: { oneShotCoverage: true } })
      .expect(400);
    expect(errorBodySchema.parse(res.body).error.fields?.['requirements.oneShotCoverage']).toMatch(/needs a detector/);
  });

  it.each([
    ['no body', undefined],
    ['null', null],
    ['a list', [1, 2]],
    ['a string', 'search'],
    ['numbers as text', { ...small, range: { startNm: '400', endNm: '700' } }],
    ['an unknown field', { ...small, colour: 'blue' }],
    ['no requirements', { range: small.range }],
    ['a list too long', { ...small, search: { grooveDensitiesPerMm: Array.from({ length: 41 }, (_, i) => i + 1) } }],
    ['nested nonsense', { ...small, search: { weights: { margin: 'lots' } } }],
  ] satisfies [string, unknown][])('answers %s with a 4xx, never a 500', async (_name, body) => {
    const res = await request(ctx.app).post('/api/search').set('content-type', 'application/json').send(JSON.stringify(body ?? ''));
    expect(res.status).toBeGreaterThanOrEqual(400);
    expect(res.status).toBeLessThan(500);
    expect(errorBodySchema.safeParse(res.body).success).toBe(true);
  });

  it('is in the OpenAPI document, named by its contract name', async () => {
    const res = await request(ctx.app).get('/api/openapi.json').expect(200);
    expect(res.body.paths['/search'].post.operationId).toBe('search.run');
    expect(res.body.paths['/search'].post.security).toBeUndefined();
  });
});

describe('POST /api/search rate limit', () => {
  it('takes its limit from AppDeps.rateLimits and answers the next call with 429, apart from solving', async () => {
    const ctx = await createTestApp({ database, rateLimits: { searchPerIp: 2, solveWindowMs: 60_000 } });
    try {
      for (let i = 0; i < 2; i++) await request(ctx.app).post('/api/search').send(small).expect(200);
      const res = await request(ctx.app).post('/api/search').send(small).expect(429);
      const { error } = errorBodySchema.parse(res.body);
      expect(error.code).toBe('rate_limited');
      expect(error.message).toMatch(/searches/);
      await request(ctx.app).post('/api/solve').send({ design: exampleDesign, points: 2 }).expect(200);
    } finally {
      await ctx.close();
    }
  });
});
