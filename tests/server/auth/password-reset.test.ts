import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { browserAgent, createTestApp, linkIn, tokenFrom, type TestApp } from '../../support/test-app';

const oldPassword = 'the old password here';
const newPassword = 'a brand new password';
const minute = 60_000;

describe('password reset by e-mail link', () => {
  let ctx: TestApp;
  beforeAll(async () => {
    // Limits are tested in request-guards; here they must not get in the way.
    ctx = await createTestApp({ rateLimits: { resetPerEmail: 100, resetPerIp: 100 } });
    await browserAgent(ctx.app).post('/api/auth/sign-up').send({ email: 'reset@example.com', displayName: 'Reset', password: oldPassword }).expect(201);
  });
  afterAll(() => ctx.close());

  async function requestLink(email = 'reset@example.com') {
    await browserAgent(ctx.app).post('/api/auth/password-reset').send({ email }).expect(202);
    return tokenFrom(linkIn(ctx.mailer, email, '/reset-password'));
  }

  it('answers the same for an unknown e-mail and mails nothing', async () => {
    const before = ctx.mailer.sent.length;
    const unknown = await browserAgent(ctx.app).post('/api/auth/password-reset').send({ email: 'ghost@example.com' }).expect(202);
    const known = await browserAgent(ctx.app).post('/api/auth/password-reset').send({ email: 'reset@example.com' }).expect(202);
    expect(unknown.body).toEqual(known.body);
    expect(ctx.mailer.sent.slice(before).map((m) => m.to)).toEqual(['reset@example.com']);
  });

  it('sets the new password, ends the old sessions and signs this browser in', async () => {
    const oldSession = browserAgent(ctx.app);
    await oldSession.post('/api/auth/sign-in').send({ email: 'reset@example.com', password: oldPassword }).expect(200);
    // Used a moment ago, so the server remembers it as valid: the reset must still end it.
    expect((await oldSession.get('/api/auth/session')).body.user).not.toBeNull();
    const token = await requestLink();

    const browser = browserAgent(ctx.app);
    const res = await browser.post('/api/auth/password-reset/confirm').send({ token, password: newPassword }).expect(200);
    expect(res.body.user.email).toBe('reset@example.com');
    expect((await browser.get('/api/auth/session')).body.user.email).toBe('reset@example.com');
    expect((await oldSession.get('/api/auth/session')).body.user).toBeNull();

    await browserAgent(ctx.app).post('/api/auth/sign-in').send({ email: 'reset@example.com', password: oldPassword }).expect(401);
    await browserAgent(ctx.app).post('/api/auth/sign-in').send({ email: 'reset@example.com', password: newPassword }).expect(200);
  });

  it('works once: the same link a second time is refused', async () => {
    const token = await requestLink();
    await browserAgent(ctx.app).post('/api/auth/password-reset/confirm').send({ token, password: 'first new password' }).expect(200);
    const again = await browserAgent(ctx.app).post('/api/auth/password-reset/confirm').send({ token, password: 'second new password' }).expect(400);
    expect(again.body.error.fields.token).toBe('has expired or was already used');
  });

  it('works for 30 minutes and not a second longer', async () => {
    const early = await requestLink();
    ctx.clock.advance(30 * minute - 1000);
    await browserAgent(ctx.app).post('/api/auth/password-reset/confirm').send({ token: early, password: 'in time password' }).expect(200);

    const late = await requestLink();
    ctx.clock.advance(30 * minute);
    await browserAgent(ctx.app).post('/api/auth/password-reset/confirm').send({ token: late, password: 'too late password' }).expect(400);
  });

  it('keeps only the newest link: asking again invalidates the previous one', async () => {
    const first = await requestLink();
    const second = await requestLink();
    await browserAgent(ctx.app).post('/api/auth/password-reset/confirm').send({ token: first, password: 'first link password' }).expect(400);
    await browserAgent(ctx.app).post('/api/auth/password-reset/confirm').send({ token: second, password: 'second link password' }).expect(200);
  });

  it('stores only a hash of the token', async () => {
    const token = await requestLink();
    const rows = await ctx.database.db.query.authTokens.findMany();
    expect(rows.length).toBeGreaterThan(0);
    expect(rows.some((row) => row.tokenHash === token)).toBe(false);
    expect(rows.every((row) => /^[0-9a-f]{64}$/.test(row.tokenHash))).toBe(true);
  });

  it.each([
    { password: ' '.repeat(10), why: 'must not be only spaces' },
    { password: 'zzzzzzzzzzzz', why: 'must not be one character repeated' },
    { password: 'reset@example.com', why: 'must not be your e-mail address' },
    { password: ' Reset@Example.COM  ', why: 'must not be your e-mail address' },
  ] satisfies { password: string; why: string }[])(
    'refuses the new password “$password” ($why) and leaves the link usable',
    async ({ password, why }) => {
      const token = await requestLink();
      const res = await browserAgent(ctx.app).post('/api/auth/password-reset/confirm').send({ token, password }).expect(400);
      expect(res.body.error.fields).toEqual({ password: why });
      await browserAgent(ctx.app).post('/api/auth/sign-in').send({ email: 'reset@example.com', password }).expect(401);

      const good = `${why} is fixed`;
      await browserAgent(ctx.app).post('/api/auth/password-reset/confirm').send({ token, password: good }).expect(200);
      await browserAgent(ctx.app).post('/api/auth/sign-in').send({ email: 'reset@example.com', password: good }).expect(200);
    },
  );

  it('refuses a common password as the new one', async () => {
    const token = await requestLink();
    const res = await browserAgent(ctx.app).post('/api/auth/password-reset/confirm').send({ token, password: 'qwertyuiop' }).expect(400);
    expect(res.body.error.fields.password).toMatch(/most used/);
  });
});
