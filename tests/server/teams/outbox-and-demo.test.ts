import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { outboxResponseSchema } from '../../../shared/outbox';
import { demoPassword, demoTeamName, demoUsers, seedDemoData } from '../../../server/seed/demo';
import { browserAgent, createTestApp, testPassword, type TestApp } from '../../support/test-app';

describe('the outbox mailer and GET /api/dev/outbox', () => {
  let ctx: TestApp;
  beforeAll(async () => {
    ctx = await createTestApp({ outbox: true });
  });
  afterAll(() => ctx.close());

  it('keeps every sent message, plain text and HTML, newest first', async () => {
    await browserAgent(ctx.app).post('/api/auth/sign-up').send({ email: 'first@example.com', displayName: 'First', password: testPassword }).expect(201);
    ctx.clock.advance(1000);
    await browserAgent(ctx.app).post('/api/auth/password-reset').send({ email: 'first@example.com' }).expect(202);
    const { messages } = outboxResponseSchema.parse((await browserAgent(ctx.app).get('/api/dev/outbox').expect(200)).body);
    expect(messages.map((m) => [m.to, m.subject])).toEqual([
      ['first@example.com', 'Choose a new Blazebook password'],
      ['first@example.com', 'Confirm your e-mail address for Blazebook'],
    ]);
    expect(messages[0]!.text).toMatch(/\/reset-password\?token=[a-z0-9]{40}/);
    expect(messages[0]!.html).toMatch(/<a href="http:\/\/blazebook\.example\.com\/reset-password\?token=[a-z0-9]{40}"/);
    expect(messages[0]!.createdAt).toBe('2026-03-14T09:00:01.000Z');
    expect(ctx.mailer.sent).toEqual([]);
  });
});

describe('demo data', () => {
  let ctx: TestApp;
  beforeAll(async () => {
    ctx = await createTestApp();
  });
  afterAll(() => ctx.close());

  it('creates the invented lab team once, with an owner, a reviewer and a viewer who can sign in', async () => {
    const lines = await seedDemoData({ database: ctx.database, clock: ctx.clock });
    expect(lines?.join('\n')).toContain(demoPassword);
    for (const person of demoUsers) expect(lines?.join('\n')).toContain(person.email);
    expect(await seedDemoData({ database: ctx.database, clock: ctx.clock })).toBeNull();

    for (const person of demoUsers) {
      const agent = browserAgent(ctx.app);
      await agent.post('/api/auth/sign-in').send({ email: person.email, password: demoPassword }).expect(200);
      const { teams } = (await agent.get('/api/teams').expect(200)).body;
      expect(teams.find((t: { name: string }) => t.name === demoTeamName)).toMatchObject({ role: person.role, memberCount: 3 });
    }
  });
});
