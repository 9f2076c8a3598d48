import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { sessionResponseSchema, signedInResponseSchema } from '../../../shared/auth';
import { teamListResponseSchema } from '../../../shared/teams';
import { browserAgent, createTestApp, linkIn, testOrigin, tokenFrom, type TestApp } from '../../support/test-app';

const password = 'a long enough password';

function cookieOf(res: request.Response): string {
  const cookies = res.headers['set-cookie'] as unknown as string[] | undefined;
  const cookie = cookies?.find((c) => c.startsWith('blazebook_session='));
  if (!cookie) throw new Error('no session cookie');
  return cookie;
}

describe('sign-up, sign-in and sign-out', () => {
  let ctx: TestApp;
  beforeAll(async () => {
    // Limits are tested in request-guards; here the many sign-ups must not run into them.
    ctx = await createTestApp({ rateLimits: { signUpPerIp: 100 } });
  });
  afterAll(() => ctx.close());

  it('signs a new account up, signs it in at once and gives it a personal workspace it owns', async () => {
    const agent = browserAgent(ctx.app);
    const res = await agent
      .post('/api/auth/sign-up')
      .send({ email: '  Ada.Lindqvist@Example.com ', displayName: 'Ada Lindqvist', password })
      .expect(201);
    const { user } = signedInResponseSchema.parse(res.body);
    expect(user).toMatchObject({ email: 'ada.lindqvist@example.com', displayName: 'Ada Lindqvist', emailVerified: false });

    const session = sessionResponseSchema.parse((await agent.get('/api/auth/session').expect(200)).body);
    expect(session.user?.id).toBe(user.id);

    const { teams } = teamListResponseSchema.parse((await agent.get('/api/teams').expect(200)).body);
    expect(teams).toEqual([
      expect.objectContaining({ name: 'Ada Lindqvist’s workspace', personal: true, role: 'owner', memberCount: 1 }),
    ]);
  });

  it('sets an HttpOnly, SameSite=Lax session cookie for the whole site, not Secure over http', async () => {
    const res = await browserAgent(ctx.app)
      .post('/api/auth/sign-up')
      .send({ email: 'cookie.flags@example.com', displayName: 'Cookie Flags', password })
      .expect(201);
    const cookie = cookieOf(res);
    expect(cookie).toMatch(/HttpOnly/i);
    expect(cookie).toMatch(/SameSite=Lax/i);
    expect(cookie).toMatch(/Path=\//);
    expect(cookie).toMatch(/Max-Age=\d+/);
    expect(cookie).not.toMatch(/Secure/i);
  });

  it('marks the session cookie Secure when the app is served over https', async () => {
    const https = await createTestApp({ https: true, database: ctx.database });
    const res = await browserAgent(https.app)
      .post('/api/auth/sign-up')
      .send({ email: 'secure.cookie@example.com', displayName: 'Secure Cookie', password })
      .expect(201);
    expect(cookieOf(res)).toMatch(/; Secure/i);
    await https.close();
  });

  it('refuses a second account for the same e-mail whatever its case', async () => {
    await browserAgent(ctx.app).post('/api/auth/sign-up').send({ email: 'twice@example.com', displayName: 'One', password }).expect(201);
    const res = await browserAgent(ctx.app)
      .post('/api/auth/sign-up')
      .send({ email: 'TWICE@example.com', displayName: 'Two', password })
      .expect(409);
    expect(res.body.error.fields).toEqual({ email: 'already has an account' });
  });

  it.each([
    { password: 'short1', why: 'must be at least 10 characters' },
    { password: 'password123', why: 'is one of the most used passwords; choose another' },
    { password: 'QwertyUiop', why: 'is one of the most used passwords; choose another' },
  ] satisfies { password: string; why: string }[])('refuses the password “$password”: $why', async ({ password: bad, why }) => {
    const res = await browserAgent(ctx.app)
      .post('/api/auth/sign-up')
      .send({ email: `weak-${bad.length}-${bad[0]}@example.com`, displayName: 'Weak', password: bad })
      .expect(400);
    expect(res.body.error.fields.password).toBe(why);
  });

  it.each([
    { email: 'spaces@example.com', password: ' '.repeat(10), why: 'must not be only spaces' },
    { email: 'many-spaces@example.com', password: ' '.repeat(40), why: 'must not be only spaces' },
    { email: 'repeated@example.com', password: 'aaaaaaaaaa', why: 'must not be one character repeated' },
    { email: 'own.address@example.com', password: 'own.address@example.com', why: 'must not be your e-mail address' },
    { email: 'Own.Case@Example.com', password: '  OWN.CASE@example.COM ', why: 'must not be your e-mail address' },
  ] satisfies { email: string; password: string; why: string }[])(
    'refuses the password “$password” for $email ($why), and creates no account',
    async ({ email, password: bad, why }) => {
      const res = await browserAgent(ctx.app).post('/api/auth/sign-up').send({ email, displayName: 'Weak', password: bad }).expect(400);
      expect(res.body.error.fields).toEqual({ password: why });
      await browserAgent(ctx.app).post('/api/auth/sign-up').send({ email, displayName: 'Weak', password }).expect(201);
    },
  );

  it('names every bad field of a sign-up', async () => {
    const res = await browserAgent(ctx.app).post('/api/auth/sign-up').send({ email: 'not-an-address', displayName: '' }).expect(400);
    expect(Object.keys(res.body.error.fields).sort()).toEqual(['displayName', 'email', 'password']);
  });

  it('signs in with any case of the e-mail, and answers the same for a wrong password and an unknown e-mail', async () => {
    await browserAgent(ctx.app).post('/api/auth/sign-up').send({ email: 'grace@example.com', displayName: 'Grace', password }).expect(201);
    const ok = await browserAgent(ctx.app).post('/api/auth/sign-in').send({ email: 'Grace@Example.com', password }).expect(200);
    expect(ok.body.user.email).toBe('grace@example.com');

    const wrong = await browserAgent(ctx.app).post('/api/auth/sign-in').send({ email: 'grace@example.com', password: 'not the password' }).expect(401);
    const unknown = await browserAgent(ctx.app).post('/api/auth/sign-in').send({ email: 'nobody@example.com', password: 'not the password' }).expect(401);
    expect(wrong.body).toEqual(unknown.body);
    expect(wrong.headers['set-cookie']).toBeUndefined();
  });

  it('signs out this browser only, and sign-out-everywhere ends every session', async () => {
    await browserAgent(ctx.app).post('/api/auth/sign-up').send({ email: 'many@example.com', displayName: 'Many', password }).expect(201);
    const [a, b, c] = [browserAgent(ctx.app), browserAgent(ctx.app), browserAgent(ctx.app)];
    const signIns: request.Response[] = [];
    for (const agent of [a, b, c]) signIns.push(await agent.post('/api/auth/sign-in').send({ email: 'many@example.com', password }).expect(200));
    const stolen = cookieOf(signIns[0]!).split(';')[0]!;
    expect((await a.get('/api/auth/session')).body.user).not.toBeNull();

    await request(ctx.app).get('/api/teams').set('cookie', stolen).expect(200);
    const out = await a.post('/api/auth/sign-out').expect(204);
    expect(cookieOf(out)).toMatch(/blazebook_session=;/);
    expect((await a.get('/api/auth/session')).body.user).toBeNull();
    // The browser forgets its cookie; a copy of it must be worthless too.
    await request(ctx.app).get('/api/teams').set('cookie', stolen).expect(401);
    expect((await b.get('/api/auth/session')).body.user).not.toBeNull();
    // c's session was just checked too: the server now answers it from memory, and must not.
    expect((await c.get('/api/auth/session')).body.user).not.toBeNull();

    await b.post('/api/auth/sign-out-everywhere').expect(204);
    expect((await b.get('/api/auth/session')).body.user).toBeNull();
    expect((await c.get('/api/auth/session')).body.user).toBeNull();
    await c.get('/api/teams').expect(401);
  });

  it('confirms the e-mail address through the mailed link, once', async () => {
    const agent = browserAgent(ctx.app);
    await agent.post('/api/auth/sign-up').send({ email: 'verify@example.com', displayName: 'Verify', password }).expect(201);
    expect((await agent.get('/api/auth/session')).body.user.emailVerified).toBe(false);
    const link = linkIn(ctx.mailer, 'verify@example.com', '/verify-email');
    expect(link.startsWith(`${testOrigin}/verify-email?token=`)).toBe(true);
    const message = ctx.mailer.sent.find((m) => m.to === 'verify@example.com')!;
    expect(message.html).toContain('href="');
    expect(message.text).toContain(link);

    const res = await browserAgent(ctx.app).post('/api/auth/verify-email').send({ token: tokenFrom(link) }).expect(200);
    expect(res.body.user.emailVerified).toBe(true);
    expect((await agent.get('/api/auth/session')).body.user.emailVerified).toBe(true);
    await browserAgent(ctx.app).post('/api/auth/verify-email').send({ token: tokenFrom(link) }).expect(400);
  });
});
