import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { DatabaseHandle } from '../../db/client';
import { createTestApp } from '../support/test-app';
import { openTestDatabase } from '../support/test-db';

/**
 * Several API processes sit behind a reverse proxy on the same machine (README, Operations): every
 * request reaches them from the proxy's address. With TRUST_PROXY=loopback the rate limits count
 * the client the proxy names in X-Forwarded-For; without it, all clients share the proxy's count.
 */
let database: DatabaseHandle;
beforeAll(async () => {
  database = await openTestDatabase();
});
afterAll(async () => {
  await database.close();
});

/** A trace body the schema refuses: it still counts, and costs nothing to answer. */
const traceFrom = (app: Parameters<typeof request>[0], client: string) =>
  request(app).post('/api/trace').set('x-forwarded-for', client).send({ design: 'not a design' });

describe('clients behind a reverse proxy', () => {
  it('counts each forwarded client on its own when the proxy on loopback is trusted', async () => {
    const ctx = await createTestApp({ database, trustProxy: 'loopback', rateLimits: { tracePerIp: 2 } });
    for (let i = 0; i < 2; i++) expect((await traceFrom(ctx.app, '198.51.100.7')).status).toBe(400);
    expect((await traceFrom(ctx.app, '198.51.100.7')).status).toBe(429);
    // Another person behind the same proxy still has their allowance.
    expect((await traceFrom(ctx.app, '203.0.113.9')).status).toBe(400);
    await ctx.close();
  });

  it('ignores X-Forwarded-For without TRUST_PROXY, so a client cannot pick its own address', async () => {
    const ctx = await createTestApp({ database, rateLimits: { tracePerIp: 2 } });
    expect((await traceFrom(ctx.app, '198.51.100.7')).status).toBe(400);
    expect((await traceFrom(ctx.app, '198.51.100.8')).status).toBe(400);
    expect((await traceFrom(ctx.app, '198.51.100.9')).status).toBe(429);
    await ctx.close();
  });
});
