import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { designSchema } from '../../../shared/design';
import { designListResponseSchema, versionListResponseSchema } from '../../../shared/notebooks';
import { demoPassword, demoTeamName, demoUsers, seedDemoData } from '../../../server/seed/demo';
import { demoNotebooks } from '../../../server/seed/notebooks';
import { browserAgent, createTestApp, type TestApp } from '../../support/test-app';

let ctx: TestApp;
beforeAll(async () => {
  ctx = await createTestApp();
  await seedDemoData({ database: ctx.database, clock: ctx.clock });
}, 60_000);
afterAll(() => ctx?.close());

describe('demo notebooks', () => {
  it.each(
    demoNotebooks.flatMap((n) => n.versions.map((v, i) => ({ title: n.title, n: i + 1, design: v.design }))),
  )('$title v$n is a valid design', ({ design }) => {
    expect(designSchema.safeParse(design).success).toBe(true);
  });

  it('gives the lab team two notebooks with a few versions each, the baseline first in its list', async () => {
    const viewer = browserAgent(ctx.app);
    const juno = demoUsers.find((p) => p.role === 'viewer')!;
    await viewer.post('/api/auth/sign-in').send({ email: juno.email, password: demoPassword }).expect(200);
    const teams = (await viewer.get('/api/teams').expect(200)).body.teams as { id: string; name: string }[];
    const lab = teams.find((t) => t.name === demoTeamName)!;
    const list = designListResponseSchema.parse(
      (await viewer.get(`/api/teams/${lab.id}/designs?sort=title`).expect(200)).body,
    );
    expect(list.designs.map((d) => [d.title, d.latestVersion, d.baselineVersion])).toEqual([
      ['Teaching-lab visible scanner', 3, 2],
      ['UV excitation arm', 2, null],
    ]);
    const history = versionListResponseSchema.parse(
      (await viewer.get(`/api/designs/${list.designs[0]!.id}/versions`).expect(200)).body,
    );
    expect(history.versions.map((v) => v.number)).toEqual([3, 2, 1]);
    expect(history.versions.every((v) => v.author?.displayName === demoUsers[0].displayName)).toBe(true);
  });
});
