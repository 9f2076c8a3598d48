import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { healthSchema } from '../../shared/health';
import { createTestApp } from '../support/test-app';

describe('GET /api/health', () => {
  let ctx: Awaited<ReturnType<typeof createTestApp>>;
  beforeAll(async () => {
    ctx = await createTestApp();
  });
  afterAll(() => ctx.close());

  it('reports ok, the build version and a database that answers', async () => {
    const res = await request(ctx.app).get('/api/health').expect(200);
    const body = healthSchema.parse(res.body);
    expect(body.status).toBe('ok');
    expect(body.version).toBe('test');
    expect(body.database.ok).toBe(true);
    expect(body.time).toBe('2026-03-14T09:00:00.000Z');
    expect(res.headers['cache-control']).toBe('private, no-store');
  });

  // Last, as it closes the file's database: a second copy would cost seconds to open.
  it('reports degraded with 503 once the database is gone', async () => {
    await ctx.database.close();
    const res = await request(ctx.app).get('/api/health').expect(503);
    expect(res.body.status).toBe('degraded');
    expect(res.body.database.ok).toBe(false);
  });
});
