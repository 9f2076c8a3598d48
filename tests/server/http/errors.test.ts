import express from 'express';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { z } from 'zod';
import { errorBodySchema } from '../../../shared/api-error';
import { errorHandler } from '../../../server/http/error-handler';
import { HttpError } from '../../../server/http/errors';
import { handle } from '../../../server/http/validate';
import { createTestApp } from '../../support/test-app';

describe('the API error shape', () => {
  let ctx: Awaited<ReturnType<typeof createTestApp>>;
  beforeAll(async () => {
    ctx = await createTestApp();
  });
  afterAll(() => ctx.close());

  it('answers an unknown /api route with a 404 in the error shape', async () => {
    const res = await request(ctx.app).get('/api/no-such-thing').expect(404);
    expect(res.headers['content-type']).toMatch(/application\/json/);
    expect(errorBodySchema.parse(res.body).error.code).toBe('not_found');
    expect(res.body.error.message).toContain('/api/no-such-thing');
  });

  it('answers malformed JSON with a 400 that says so', async () => {
    const res = await request(ctx.app)
      .post('/api/health')
      .set('content-type', 'application/json')
      .send('{"design": {')
      .expect(400);
    expect(errorBodySchema.parse(res.body).error.code).toBe('malformed_json');
  });

  it('answers a body over 1 MB with a 413', async () => {
    const big = JSON.stringify({ notes: 'x'.repeat(1024 * 1024 + 1) });
    const res = await request(ctx.app).post('/api/health').set('content-type', 'application/json').send(big).expect(413);
    expect(errorBodySchema.parse(res.body).error.code).toBe('payload_too_large');
  });

  it('turns off x-powered-by and sends security headers', async () => {
    const res = await request(ctx.app).get('/api/health');
    expect(res.headers['x-powered-by']).toBeUndefined();
    expect(res.headers['x-content-type-options']).toBe('nosniff');
    expect(res.headers['content-security-policy']).toContain("default-src 'self'");
    // Over plain http (tests, localhost) the browser must not be told to upgrade or pin https.
    expect(res.headers['strict-transport-security']).toBeUndefined();
    expect(res.headers['content-security-policy']).not.toContain('upgrade-insecure-requests');
  });
});

describe('the error middleware', () => {
  function appThatFails(handler: express.RequestHandler) {
    const logged: unknown[] = [];
    const app = express();
    app.use(express.json());
    app.post('/thing', handler);
    app.use(errorHandler((error) => logged.push(error)));
    return { app, logged };
  }

  it('hides an unexpected error behind a 500 with no stack, and logs it', async () => {
    const { app, logged } = appThatFails(() => {
      throw new Error('secret detail at /srv/blazebook/db.ts:42');
    });
    const res = await request(app).post('/thing').send({}).expect(500);
    expect(errorBodySchema.parse(res.body).error.code).toBe('internal');
    expect(JSON.stringify(res.body)).not.toContain('secret detail');
    expect(JSON.stringify(res.body)).not.toContain('.ts:');
    expect(logged).toHaveLength(1);
  });

  it('names every bad field with its path when validation fails', async () => {
    const schema = z.object({
      slits: z.object({ exitWidthUm: z.number().positive({ error: 'must be greater than 0' }) }),
      title: z.string({ error: 'is required' }),
    });
    const { app } = appThatFails(handle({ body: schema }, ({ body }) => body));
    const res = await request(app).post('/thing').send({ slits: { exitWidthUm: -5 } }).expect(400);
    const { error } = errorBodySchema.parse(res.body);
    expect(error.code).toBe('invalid_request');
    expect(error.fields).toEqual({ 'slits.exitWidthUm': 'must be greater than 0', title: 'is required' });
  });

  it('sends an HttpError’s details as error.details, and no details key when it has none', async () => {
    const { app } = appThatFails(() => {
      throw new HttpError(409, 'version_conflict', 'Saved meanwhile.', undefined, { latest: { number: 2 } });
    });
    const res = await request(app).post('/thing').send({}).expect(409);
    expect(errorBodySchema.parse(res.body).error).toEqual({
      code: 'version_conflict',
      message: 'Saved meanwhile.',
      details: { latest: { number: 2 } },
    });
    const plain = appThatFails(() => {
      throw new HttpError(404, 'not_found', 'Nothing here.');
    });
    expect((await request(plain.app).post('/thing').send({}).expect(404)).body).toEqual({
      error: { code: 'not_found', message: 'Nothing here.' },
    });
  });

  it('hands the parsed value on to the handler (defaults applied, parsed once)', async () => {
    let calls = 0;
    const schema = z.object({ n: z.number() }).transform((v) => {
      calls += 1;
      return { doubled: v.n * 2 };
    });
    const { app } = appThatFails(handle({ body: schema }, ({ body }) => body));
    const res = await request(app).post('/thing').send({ n: 21 }).expect(200);
    expect(res.body).toEqual({ doubled: 42 });
    expect(calls).toBe(1);
  });

  it('answers 503 with Retry-After when the database server is gone, and logs one line instead of a stack', async () => {
    const logged: unknown[] = [];
    const app = express();
    // As Drizzle wraps them: the driver's error is the cause of a query error.
    const wrapped = (cause: object) => Object.assign(new Error('Failed query: select 1'), { cause });
    app.get('/refused', () => {
      throw wrapped(Object.assign(new Error('connect ECONNREFUSED 127.0.0.1:5432'), { code: 'ECONNREFUSED' }));
    });
    app.get('/shutdown', () => {
      throw wrapped(Object.assign(new Error('terminating connection due to administrator command'), { code: '57P01' }));
    });
    app.get('/terminated', () => {
      throw wrapped(new Error('Connection terminated unexpectedly'));
    });
    app.get('/bug', () => {
      throw wrapped(Object.assign(new Error('column "nope" does not exist'), { code: '42703' }));
    });
    app.use(errorHandler((entry) => logged.push(entry)));
    for (const path of ['/refused', '/shutdown', '/terminated']) {
      const res = await request(app).get(path).expect(503);
      expect(res.headers['retry-after']).toBe('5');
      expect(errorBodySchema.parse(res.body).error.code).toBe('database_unavailable');
    }
    expect(logged).toHaveLength(3);
    for (const entry of logged) expect(entry).toEqual(expect.stringMatching(/^Database unavailable \(GET \/\w+\): /));
    // A query the database refuses for its own reasons is still our bug: a bare 500, logged whole.
    await request(app).get('/bug').expect(500);
    expect(logged[3]).toBeInstanceOf(Error);
  });
});
