import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { designListResponseSchema } from '../../../shared/notebooks';
import { demoPassword, demoTeamName, demoUsers, seedDemoData } from '../../../server/seed/demo';
import { browserAgent, createTestApp, type TestApp } from '../../support/test-app';
import { getReview } from './support';

let ctx: TestApp;
beforeAll(async () => {
  ctx = await createTestApp();
  await seedDemoData({ database: ctx.database, clock: ctx.clock });
}, 60_000);
afterAll(() => ctx?.close());

describe('the demo lab’s design review', () => {
  it('has an open thread on v1’s exit slit that v3 shows as changed, v2 signed off, and v3 waiting for its reviewer', async () => {
    const owner = demoUsers.find((p) => p.role === 'owner')!;
    const reviewer = demoUsers.find((p) => p.role === 'reviewer')!;
    const agent = browserAgent(ctx.app);
    const session = await agent.post('/api/auth/sign-in').send({ email: owner.email, password: demoPassword }).expect(200);
    const teams = (await agent.get('/api/teams').expect(200)).body.teams as { id: string; name: string }[];
    const lab = teams.find((t) => t.name === demoTeamName)!;
    const list = designListResponseSchema.parse((await agent.get(`/api/teams/${lab.id}/designs?sort=title`).expect(200)).body);
    expect(list.designs.map((d) => [d.title, d.latestReviewState])).toEqual([
      ['Teaching-lab visible scanner', 'requested'],
      ['UV excitation arm', 'unreviewed'],
    ]);

    const person = { agent, user: session.body.user };
    const v3 = await getReview(person, list.designs[0]!.id, 3);
    expect(v3.state).toBe('requested');
    expect(v3.threads).toHaveLength(1);
    expect(v3.threads[0]).toMatchObject({
      version: 1,
      pin: { kind: 'field', path: 'slits.exitWidthUm' },
      status: 'open',
      carry: { state: 'field-changed', since: 1, was: 100, now: 50 },
    });
    expect(v3.threads[0]!.remarks.map((r) => r.authorName)).toEqual([reviewer.displayName, owner.displayName]);
    expect(v3.earlierSignOff?.decision).toMatchObject({ version: 2, outcome: 'signed-off', reviewerName: reviewer.displayName });
    expect(v3.earlierSignOff?.changedPaths).toEqual(['grating.blazeWavelengthNm', 'grating.grooveDensityPerMm']);
    expect(v3.requests.map((r) => [r.reviewer.displayName, r.answeredAt])).toEqual([[reviewer.displayName, null]]);
  });
});
