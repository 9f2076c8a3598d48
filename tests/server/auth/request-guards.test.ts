import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import type { DatabaseHandle } from '../../../db/client';
import { browserAgent, createTestApp, fromAddress, testOrigin, type TestApp } from '../../support/test-app';
import { openTestDatabase } from '../../support/test-db';

const password = 'a long enough password';

// One database for the file: its cases use addresses of their own, and each copy takes seconds to
// open. Each describe still builds its own app, so rate limits and settings start afresh.
let database: DatabaseHandle;
beforeAll(async () => {
  database = await openTestDatabase();
});
afterAll(() => database?.close());

describe('Origin check on state-changing requests (CSRF)', () => {
  let ctx: TestApp;
  beforeAll(async () => {
    ctx = await createTestApp({ database });
  });
  afterAll(() => ctx.close());

  it.each([
    { origin: 'https://evil.example.net', why: 'another site' },
    { origin: 'https://blazebook.example.com', why: 'our host over another scheme' },
    { origin: 'http://blazebook.example.com:8443', why: 'our host on another port' },
    { origin: 'null', why: 'an opaque origin' },
    { origin: undefined, why: 'no Origin at all' },
  ])('refuses a sign-up from $why with 403', async ({ origin }) => {
    const req = request(ctx.app).post('/api/auth/sign-up');
    if (origin) req.set('origin', origin);
    const res = await req.send({ email: 'csrf@example.com', displayName: 'Csrf', password }).expect(403);
    expect(res.body.error.code).toBe('forbidden');
  });

  it('refuses a forged request that carries a valid session cookie', async () => {
    const agent = browserAgent(ctx.app);
    await agent.post('/api/auth/sign-up').send({ email: 'victim@example.com', displayName: 'Victim', password }).expect(201);
    await agent.post('/api/teams').set('origin', 'https://evil.example.net').send({ name: 'Forged' }).expect(403);
    const { body } = await agent.get('/api/teams').expect(200);
    expect(body.teams.map((t: { name: string }) => t.name)).not.toContain('Forged');
  });

  it('lets reads through without an Origin', async () => {
    await request(ctx.app).get('/api/auth/session').expect(200);
  });

  it('exempts POST /api/solve, a pure computation that lab scripts call without an Origin', async () => {
    const res = await request(ctx.app).post('/api/solve').send({});
    expect(res.status).not.toBe(403);
  });

  it('accepts our own origin', async () => {
    await request(ctx.app).post('/api/auth/sign-out').set('origin', testOrigin).expect(204);
  });
});

describe('failed sign-ins cannot lock the owner out from elsewhere', () => {
  let ctx: TestApp;
  const owner = 'owner-lockout@example.com';
  const attacker = '203.0.113.66';
  const ownerAddress = '198.51.100.7';
  const signIn = (address: string, email: string, pass: string) =>
    request(fromAddress(ctx.app, address)).post('/api/auth/sign-in').set('origin', testOrigin).send({ email, password: pass });

  beforeAll(async () => {
    ctx = await createTestApp({ database, rateLimits: { signInFailuresPerEmailPerIp: 3, signInFailuresPerIp: 5, signInPerIp: 8 } });
    await browserAgent(ctx.app).post('/api/auth/sign-up').send({ email: owner, displayName: 'Owner', password }).expect(201);
  });
  afterAll(() => ctx.close());

  it('lets the owner sign in from their own address after an attacker failed on their e-mail from another', async () => {
    for (let i = 0; i < 3; i += 1) await signIn(attacker, owner, `guess ${i} for owner`).expect(401);
    const blocked = await signIn(attacker, owner, 'one more guess here').expect(429);
    expect(blocked.body.error.code).toBe('rate_limited');
    // The right password, from the owner's address: not locked.
    await signIn(ownerAddress, owner, password).expect(200);
  });

  it('stops the attacker after five failures from one address, whichever e-mails they try', async () => {
    const elsewhere = '203.0.113.77';
    for (let i = 0; i < 5; i += 1) await signIn(elsewhere, `victim${i}@example.com`, 'wrong password!').expect(401);
    await signIn(elsewhere, 'victim9@example.com', 'wrong password!').expect(429);
    await signIn(ownerAddress, owner, password).expect(200);
  });

  it('keeps the overall limit per address: the 9th attempt from one address is refused, even with successes', async () => {
    const busy = '192.0.2.10';
    for (let i = 0; i < 8; i += 1) await signIn(busy, owner, password).expect(200);
    await signIn(busy, owner, password).expect(429);
  });
});

describe('rate limits on sign-in and password reset', () => {
  let ctx: TestApp;
  beforeAll(async () => {
    ctx = await createTestApp({ database, rateLimits: { signInFailuresPerEmailPerIp: 3, signInPerIp: 5, resetPerEmail: 2, resetPerIp: 10 } });
    await browserAgent(ctx.app).post('/api/auth/sign-up').send({ email: 'target@example.com', displayName: 'Target', password }).expect(201);
  });
  afterAll(() => ctx.close());

  it('answers the 4th failed sign-in for one e-mail with 429, even with the right password', async () => {
    for (let i = 0; i < 3; i += 1) {
      await browserAgent(ctx.app).post('/api/auth/sign-in').send({ email: 'target@example.com', password: `wrong guess ${i}` }).expect(401);
    }
    const res = await browserAgent(ctx.app).post('/api/auth/sign-in').send({ email: 'TARGET@example.com', password }).expect(429);
    expect(res.body.error.code).toBe('rate_limited');
  });

  it('answers the 6th sign-in from one IP with 429 whatever the e-mail', async () => {
    const perIp = await createTestApp({ database, rateLimits: { signInPerIp: 5, signInFailuresPerEmailPerIp: 100, signInFailuresPerIp: 100 } });
    for (let i = 1; i <= 5; i += 1) {
      await browserAgent(perIp.app).post('/api/auth/sign-in').send({ email: `other${i}@example.com`, password: 'whatever it is' }).expect(401);
    }
    await browserAgent(perIp.app).post('/api/auth/sign-in').send({ email: 'other6@example.com', password: 'whatever it is' }).expect(429);
    await perIp.close();
  });

  it('answers the 11th confirmation resend from one address with 429 (each one sends an e-mail)', async () => {
    const agent = browserAgent(ctx.app);
    await agent.post('/api/auth/sign-up').send({ email: 'resender@example.com', displayName: 'Resender', password }).expect(201);
    for (let i = 0; i < 10; i += 1) await agent.post('/api/auth/verify-email/resend').expect(202);
    const res = await agent.post('/api/auth/verify-email/resend').expect(429);
    expect(res.body.error.code).toBe('rate_limited');
  });

  it('answers the 3rd reset request for one e-mail with 429, known or not', async () => {
    for (const email of ['ghost@example.com', 'target@example.com']) {
      await browserAgent(ctx.app).post('/api/auth/password-reset').send({ email }).expect(202);
      await browserAgent(ctx.app).post('/api/auth/password-reset').send({ email }).expect(202);
      await browserAgent(ctx.app).post('/api/auth/password-reset').send({ email }).expect(429);
    }
  });
});

describe('sliding session expiry', () => {
  let ctx: TestApp;
  beforeAll(async () => {
    ctx = await createTestApp({ database });
  });
  afterAll(async () => {
    vi.useRealTimers();
    await ctx.close();
  });

  // Lucia reads the system clock for sessions, so these tests move it with fake timers.
  it('renews a session used in the second half of its 30 days and ends an unused one', async () => {
    const day = 24 * 60 * 60_000;
    vi.useFakeTimers({ toFake: ['Date'], now: new Date('2026-03-14T09:00:00Z') });
    const agent = browserAgent(ctx.app);
    await agent.post('/api/auth/sign-up').send({ email: 'slide@example.com', displayName: 'Slide', password }).expect(201);

    vi.setSystemTime(Date.now() + 10 * day);
    const early = await agent.get('/api/auth/session').expect(200);
    expect(early.body.user).not.toBeNull();
    expect(early.headers['set-cookie']).toBeUndefined();

    vi.setSystemTime(Date.now() + 10 * day);
    const renewed = await agent.get('/api/auth/session').expect(200);
    expect(renewed.body.user).not.toBeNull();
    expect(String(renewed.headers['set-cookie'])).toMatch(/blazebook_session=\w+/);

    // 29 days after the renewal the session is still alive: it slid forward.
    vi.setSystemTime(Date.now() + 29 * day);
    expect((await agent.get('/api/auth/session')).body.user).not.toBeNull();

    vi.setSystemTime(Date.now() + 31 * day);
    const gone = await agent.get('/api/auth/session').expect(200);
    expect(gone.body.user).toBeNull();
    expect(String(gone.headers['set-cookie'])).toMatch(/blazebook_session=;/);
    vi.useRealTimers();
  });
});
