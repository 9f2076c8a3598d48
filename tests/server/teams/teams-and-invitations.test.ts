import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { invitationPreviewSchema, memberListResponseSchema, teamListResponseSchema } from '../../../shared/teams';
import type { DatabaseHandle } from '../../../db/client';
import { browserAgent, createTestApp, linkIn, signUp, testOrigin, tokenFrom, type TestApp } from '../../support/test-app';
import { openTestDatabase } from '../../support/test-db';

const day = 24 * 60 * 60_000;

// One database for the file: its cases use addresses of their own, and each copy takes seconds to
// open. Each describe still builds its own app, with its own clock and mailer.
let database: DatabaseHandle;
beforeAll(async () => {
  database = await openTestDatabase();
});
afterAll(() => database?.close());

/** Follows the confirmation link of the latest message to `email`, as its owner would. */
async function confirmEmail(ctx: TestApp, email: string) {
  const token = tokenFrom(linkIn(ctx.mailer, email, '/verify-email'));
  await browserAgent(ctx.app).post('/api/auth/verify-email').send({ token }).expect(200);
}

describe('teams, members and invitations', () => {
  let ctx: TestApp;
  let owner: Awaited<ReturnType<typeof signUp>>;
  let teamId: string;

  beforeAll(async () => {
    ctx = await createTestApp({ database });
    owner = await signUp(ctx.app, 'Lab Lead', 'lead@example.com');
    teamId = (await owner.agent.post('/api/teams').send({ name: 'Spectroscopy bench' }).expect(201)).body.team.id;
  });
  afterAll(() => ctx.close());

  async function invite(email: string, role: 'owner' | 'reviewer' | 'viewer' = 'viewer', team = teamId) {
    await owner.agent.post(`/api/teams/${team}/invitations`).send({ email, role }).expect(201);
    return tokenFrom(linkIn(ctx.mailer, email, '/invitations/'));
  }

  it('lists the new team for its creator, owner, after the personal workspace', async () => {
    const { teams } = teamListResponseSchema.parse((await owner.agent.get('/api/teams').expect(200)).body);
    expect(teams.map((t) => [t.name, t.role, t.personal])).toEqual([
      ['Spectroscopy bench', 'owner', false],
      [`${owner.user.displayName}’s workspace`, 'owner', true],
    ]);
  });

  it('invites someone without an account: the mail links to the invitation, which leads through sign-up', async () => {
    const token = await invite('newcomer@example.com', 'reviewer');
    const message = ctx.mailer.sent.at(-1)!;
    expect(message.subject).toContain('Spectroscopy bench');
    expect(message.text).toContain(`${testOrigin}/invitations/${token}`);
    expect(message.html).toContain(`${testOrigin}/invitations/${token}`);

    const preview = invitationPreviewSchema.parse((await browserAgent(ctx.app).get(`/api/invitations/${token}`).expect(200)).body);
    expect(preview).toMatchObject({ teamName: 'Spectroscopy bench', role: 'reviewer', email: 'newcomer@example.com', accountExists: false });

    await browserAgent(ctx.app).post(`/api/invitations/${token}/accept`).expect(401);
    const newcomer = await signUp(ctx.app, 'Newcomer', 'newcomer@example.com');
    await confirmEmail(ctx, 'newcomer@example.com');
    const accepted = await newcomer.agent.post(`/api/invitations/${token}/accept`).expect(200);
    expect(accepted.body.team).toMatchObject({ id: teamId, role: 'reviewer' });

    const { members } = memberListResponseSchema.parse((await owner.agent.get(`/api/teams/${teamId}/members`).expect(200)).body);
    expect(members.map((m) => [m.email, m.role])).toEqual([
      ['lead@example.com', 'owner'],
      ['newcomer@example.com', 'reviewer'],
    ]);
    expect(members[1]!.joinedAt).toBe('2026-03-14T09:00:00.000Z');
  });

  it('invites an existing account, which says so and accepts once', async () => {
    const existing = await signUp(ctx.app, 'Existing', 'existing@example.com');
    await confirmEmail(ctx, 'existing@example.com');
    const token = await invite('Existing@Example.com', 'viewer');
    expect((await browserAgent(ctx.app).get(`/api/invitations/${token}`).expect(200)).body.accountExists).toBe(true);
    await existing.agent.post(`/api/invitations/${token}/accept`).expect(200);
    await existing.agent.post(`/api/invitations/${token}/accept`).expect(404);
    await browserAgent(ctx.app).get(`/api/invitations/${token}`).expect(404);
  });

  it('refuses an account whose address is not confirmed yet, and accepts once it is', async () => {
    const token = await invite('unconfirmed@example.com', 'reviewer');
    const person = await signUp(ctx.app, 'Unconfirmed', 'unconfirmed@example.com');
    const refused = await person.agent.post(`/api/invitations/${token}/accept`).expect(403);
    expect(refused.body.error.code).toBe('email_unverified');
    expect(refused.body.error.message).toBe(
      'Confirm your e-mail address first: open the link we sent to unconfirmed@example.com, then come back to this invitation.',
    );
    // Refusing it did not use the invitation up.
    await browserAgent(ctx.app).get(`/api/invitations/${token}`).expect(200);

    await confirmEmail(ctx, 'unconfirmed@example.com');
    const accepted = await person.agent.post(`/api/invitations/${token}/accept`).expect(200);
    expect(accepted.body.team).toMatchObject({ id: teamId, role: 'reviewer' });
  });

  it('lets only the addressee accept, so a forwarded link is useless', async () => {
    const token = await invite('addressee@example.com');
    const other = await signUp(ctx.app, 'Other', 'someone-else@example.com');
    const res = await other.agent.post(`/api/invitations/${token}/accept`).expect(403);
    expect(res.body.error.message).toContain('addressee@example.com');
  });

  it('refuses to invite a member again, and replaces a pending invitation with a new link', async () => {
    const res = await owner.agent.post(`/api/teams/${teamId}/invitations`).send({ email: 'lead@example.com', role: 'viewer' }).expect(409);
    expect(res.body.error.fields).toEqual({ email: 'is already a member' });

    const first = await invite('twice-invited@example.com', 'viewer');
    const second = await invite('twice-invited@example.com', 'reviewer');
    await browserAgent(ctx.app).get(`/api/invitations/${first}`).expect(404);
    expect((await browserAgent(ctx.app).get(`/api/invitations/${second}`).expect(200)).body.role).toBe('reviewer');
    const { invitations } = (await owner.agent.get(`/api/teams/${teamId}/invitations`).expect(200)).body;
    expect(invitations.filter((i: { email: string }) => i.email === 'twice-invited@example.com')).toHaveLength(1);
  });

  it('lets an invitation expire after 7 days, and the owner revoke one', async () => {
    const token = await invite('late@example.com');
    ctx.clock.advance(7 * day);
    await browserAgent(ctx.app).get(`/api/invitations/${token}`).expect(404);
    const late = await signUp(ctx.app, 'Late', 'late@example.com');
    await late.agent.post(`/api/invitations/${token}/accept`).expect(404);

    const revoked = await invite('revoked@example.com');
    const { invitations } = (await owner.agent.get(`/api/teams/${teamId}/invitations`).expect(200)).body;
    const id = invitations.find((i: { email: string }) => i.email === 'revoked@example.com').id;
    await owner.agent.delete(`/api/teams/${teamId}/invitations/${id}`).expect(204);
    await browserAgent(ctx.app).get(`/api/invitations/${revoked}`).expect(404);
  });

  it('keeps the personal workspace personal: no invitations, no deletion', async () => {
    const { teams } = (await owner.agent.get('/api/teams').expect(200)).body;
    const personal = teams.find((t: { personal: boolean }) => t.personal).id;
    await owner.agent.post(`/api/teams/${personal}/invitations`).send({ email: 'x@example.com', role: 'viewer' }).expect(409);
    await owner.agent.delete(`/api/teams/${personal}`).expect(409);
  });
});

describe('the last owner rule', () => {
  let ctx: TestApp;
  beforeAll(async () => {
    ctx = await createTestApp({ database });
  });
  afterAll(() => ctx.close());

  it('keeps at least one owner: the last one can neither be demoted nor leave, a second one can', async () => {
    const first = await signUp(ctx.app, 'First Owner', 'first@example.com');
    const teamId = (await first.agent.post('/api/teams').send({ name: 'Owners' }).expect(201)).body.team.id;

    const demote = await first.agent.patch(`/api/teams/${teamId}/members/${first.user.id}`).send({ role: 'reviewer' }).expect(409);
    expect(demote.body.error.message).toContain('at least one owner');
    await first.agent.delete(`/api/teams/${teamId}/members/${first.user.id}`).expect(409);

    const second = await signUp(ctx.app, 'Second Owner', 'second@example.com');
    await confirmEmail(ctx, 'second@example.com');
    await first.agent.post(`/api/teams/${teamId}/invitations`).send({ email: 'second@example.com', role: 'viewer' }).expect(201);
    await second.agent.post(`/api/invitations/${tokenFrom(linkIn(ctx.mailer, 'second@example.com', '/invitations/'))}/accept`).expect(200);
    await first.agent.patch(`/api/teams/${teamId}/members/${second.user.id}`).send({ role: 'owner' }).expect(200);

    await first.agent.patch(`/api/teams/${teamId}/members/${first.user.id}`).send({ role: 'viewer' }).expect(200);
    // Now `first` is a viewer: no longer allowed to manage members.
    await first.agent.patch(`/api/teams/${teamId}/members/${second.user.id}`).send({ role: 'viewer' }).expect(403);
    await second.agent.patch(`/api/teams/${teamId}/members/${second.user.id}`).send({ role: 'viewer' }).expect(409);

    // A viewer may leave; then the team is gone from their list and answers them 404.
    await first.agent.delete(`/api/teams/${teamId}/members/${first.user.id}`).expect(204);
    await first.agent.get(`/api/teams/${teamId}`).expect(404);
  });
});

describe('cross-team isolation', () => {
  let ctx: TestApp;
  beforeAll(async () => {
    ctx = await createTestApp({ database });
  });
  afterAll(() => ctx.close());

  it('gives a member of team A a 404 for every team-B resource, whatever its id', async () => {
    const a = await signUp(ctx.app, 'Alpha', 'alpha@example.com');
    const b = await signUp(ctx.app, 'Bravo', 'bravo@example.com');
    await a.agent.post('/api/teams').send({ name: 'Team A' }).expect(201);
    const teamB = (await b.agent.post('/api/teams').send({ name: 'Team B' }).expect(201)).body.team.id;
    await b.agent.post(`/api/teams/${teamB}/invitations`).send({ email: 'charlie@example.com', role: 'viewer' }).expect(201);
    const invitationId = (await b.agent.get(`/api/teams/${teamB}/invitations`).expect(200)).body.invitations[0].id;

    const attempts = [
      a.agent.get(`/api/teams/${teamB}`),
      a.agent.patch(`/api/teams/${teamB}`).send({ name: 'Mine now' }),
      a.agent.delete(`/api/teams/${teamB}`),
      a.agent.get(`/api/teams/${teamB}/members`),
      a.agent.patch(`/api/teams/${teamB}/members/${b.user.id}`).send({ role: 'viewer' }),
      a.agent.delete(`/api/teams/${teamB}/members/${b.user.id}`),
      a.agent.get(`/api/teams/${teamB}/invitations`),
      a.agent.post(`/api/teams/${teamB}/invitations`).send({ email: 'alpha@example.com', role: 'owner' }),
      a.agent.delete(`/api/teams/${teamB}/invitations/${invitationId}`),
    ];
    for (const res of await Promise.all(attempts)) expect(res.status).toBe(404);
    const { teams } = (await a.agent.get('/api/teams').expect(200)).body;
    expect(teams.map((t: { name: string }) => t.name)).not.toContain('Team B');
    expect((await b.agent.get(`/api/teams/${teamB}`).expect(200)).body.team.name).toBe('Team B');
  });
});
