import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { outboxResponseSchema } from '../../shared/outbox';
import { isLoopbackAddress, isLoopbackHost } from '../../server/http/loopback';
import type { DatabaseHandle } from '../../db/client';
import { browserAgent, createTestApp, fromAddress, testPassword, type TestApp } from '../support/test-app';
import { openTestDatabase } from '../support/test-db';

/**
 * `npm start` runs in development mode: demo accounts, and an outbox that holds every password-
 * reset link. Reading it from another machine would be an account takeover, so it answers only on
 * this machine; and without PUBLIC_URL the Origin rule accepts only loopback host names, so a
 * DNS-rebinding page cannot pass it by naming itself in both Origin and Host.
 */

// One database for the file: its cases use addresses of their own and look in the outbox only for
// a message they sent, and each copy takes seconds to open. Each describe still builds its own
// app, so rate limits and settings start afresh.
let database: DatabaseHandle;
beforeAll(async () => {
  database = await openTestDatabase();
});
afterAll(() => database?.close());

describe('the development outbox answers only on this machine', () => {
  let ctx: TestApp;
  beforeAll(async () => {
    ctx = await createTestApp({ database, outbox: true, nodeEnv: 'development', trustedOrigin: null });
    await browserAgent(ctx.app).post('/api/auth/sign-up').send({ email: 'colleague@example.com', displayName: 'Colleague', password: testPassword }).set('origin', 'http://127.0.0.1').set('host', '127.0.0.1');
    await request(ctx.app).post('/api/auth/password-reset').set('host', 'localhost:8080').set('origin', 'http://localhost:8080').send({ email: 'colleague@example.com' }).expect(202);
  });
  afterAll(() => ctx.close());

  it.each(['127.0.0.1', '::1', '::ffff:127.0.0.1', '127.8.9.10'])('answers a request from %s', async (address) => {
    const res = await request(fromAddress(ctx.app, address)).get('/api/dev/outbox').set('host', 'localhost:8080').expect(200);
    expect(outboxResponseSchema.parse(res.body).messages.some((m) => /reset-password\?token=/.test(m.text))).toBe(true);
  });

  it.each(['192.168.1.20', '10.0.0.7', '203.0.113.9', '::ffff:192.168.1.20', '2001:db8::1', 'fe80::1'])(
    'refuses a request from %s with 403 and says why, showing no message',
    async (address) => {
      const res = await request(fromAddress(ctx.app, address)).get('/api/dev/outbox').set('host', 'localhost:8080').expect(403);
      expect(res.body.error.code).toBe('outbox_local_only');
      expect(res.body.error.message).toMatch(/only on the machine/);
      expect(res.text).not.toMatch(/token=/);
    },
  );

  it('ignores headers that claim to be local: only the socket counts', async () => {
    const res = await request(fromAddress(ctx.app, '198.51.100.4'))
      .get('/api/dev/outbox')
      .set('host', 'localhost')
      .set('x-forwarded-for', '127.0.0.1')
      .set('x-real-ip', '127.0.0.1')
      .set('forwarded', 'for=127.0.0.1');
    expect(res.status).toBe(403);
  });

  it('refuses a loopback request for a foreign host name (a DNS-rebinding page)', async () => {
    const res = await request(ctx.app).get('/api/dev/outbox').set('host', 'rebind.attacker.example:8080').expect(403);
    expect(res.body.error.code).toBe('outbox_local_only');
  });
});

describe('the Origin rule without PUBLIC_URL', () => {
  let ctx: TestApp;
  beforeAll(async () => {
    ctx = await createTestApp({ database, nodeEnv: 'development', trustedOrigin: null });
  });
  afterAll(() => ctx.close());

  const signUp = (host: string, origin: string, email: string) =>
    request(ctx.app).post('/api/auth/sign-up').set('host', host).set('origin', origin).send({ email, displayName: 'Someone', password: testPassword });

  it.each([
    ['localhost:8080', 'http://localhost:8080'],
    ['127.0.0.1:8080', 'http://127.0.0.1:8080'],
    ['[::1]:8080', 'http://[::1]:8080'],
  ])('accepts a change from its own loopback page (%s)', async (host, origin) => {
    await signUp(host, origin, `local-${host.replace(/\W/g, '')}@example.com`).expect(201);
  });

  it('refuses a rebinding page whose Origin matches its own Host, and says PUBLIC_URL opens other names', async () => {
    const res = await signUp('rebind.attacker.example:8080', 'http://rebind.attacker.example:8080', 'rebind@example.com').expect(403);
    expect(res.body.error.message).toMatch(/PUBLIC_URL/);
  });

  it('still refuses another site against a loopback host', async () => {
    await signUp('localhost:8080', 'http://evil.example.net', 'cross@example.com').expect(403);
  });

  it('accepts any name that PUBLIC_URL names, and only that one', async () => {
    const named = await createTestApp({ database, trustedOrigin: 'http://lab-pc.quillmere.example.com:8080' });
    await request(named.app)
      .post('/api/auth/sign-up')
      .set('host', 'lab-pc.quillmere.example.com:8080')
      .set('origin', 'http://lab-pc.quillmere.example.com:8080')
      .send({ email: 'named@example.com', displayName: 'Named', password: testPassword })
      .expect(201);
    await request(named.app)
      .post('/api/auth/sign-up')
      .set('host', 'localhost:8080')
      .set('origin', 'http://localhost:8080')
      .send({ email: 'named2@example.com', displayName: 'Named', password: testPassword })
      .expect(403);
    await named.close();
  });
});

describe('loopback helpers', () => {
  it.each([
    ['127.0.0.1', true],
    ['127.255.0.1', true],
    ['::1', true],
    ['::ffff:127.0.0.1', true],
    ['128.0.0.1', false],
    ['::ffff:10.0.0.1', false],
    ['0.0.0.0', false],
    ['', false],
    [undefined, false],
  ] satisfies [string | undefined, boolean][])('isLoopbackAddress(%s) is %s', (address, expected) => {
    expect(isLoopbackAddress(address)).toBe(expected);
  });

  it.each([
    ['localhost', true],
    ['localhost:8080', true],
    ['127.0.0.1:1', true],
    ['[::1]:8080', true],
    ['localhost.attacker.example', false],
    ['127.0.0.1.nip.example', false],
    ['evil.example.net', false],
    ['', false],
    ['%', false],
  ] satisfies [string, boolean][])('isLoopbackHost(%s) is %s', (host, expected) => {
    expect(isLoopbackHost(host)).toBe(expected);
  });
});

describe('headers on every answer', () => {
  let ctx: TestApp;
  beforeAll(async () => {
    ctx = await createTestApp({ database });
  });
  afterAll(() => ctx.close());

  it('marks signed-in and signed-out API answers private and not to be stored', async () => {
    const agent = browserAgent(ctx.app);
    await agent.post('/api/auth/sign-up').send({ email: 'headers@example.com', displayName: 'Headers', password: testPassword }).expect(201);
    for (const path of ['/api/teams', '/api/auth/session', '/api/health', '/api/no-such-route']) {
      const res = await agent.get(path);
      expect(res.headers['cache-control'], path).toBe('private, no-store');
    }
    const anonymous = await request(ctx.app).get('/api/teams').expect(401);
    expect(anonymous.headers['cache-control']).toBe('private, no-store');
  });

  it('turns off browser features the app never uses', async () => {
    const res = await request(ctx.app).get('/api/health');
    const policy = res.headers['permissions-policy'] as string;
    for (const feature of ['camera=()', 'microphone=()', 'geolocation=()', 'payment=()', 'usb=()']) expect(policy).toContain(feature);
  });
});
