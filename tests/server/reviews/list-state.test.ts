import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { designListResponseSchema, notebookResponseSchema } from '../../../shared/notebooks';
import { exampleDesign } from '../../../shared/design';
import { createNotebookFixture, designWith, type NotebookFixture } from '../notebooks/fixture';
import { decide, requestReview } from './support';

let fx: NotebookFixture;
beforeAll(async () => {
  fx = await createNotebookFixture();
}, 60_000);
afterAll(() => fx?.ctx.close());

/** A team of its own, so the list holds only this test's designs. */
async function freshTeam(name: string) {
  const teamId = (await fx.owner.agent.post('/api/teams').send({ name }).expect(201)).body.team.id as string;
  await fx.addMember(teamId, fx.reviewer, 'reviewer');
  await fx.addMember(teamId, fx.viewer, 'viewer');
  return teamId;
}

async function create(teamId: string, title: string) {
  const res = await fx.owner.agent
    .post(`/api/teams/${teamId}/designs`)
    .send({ title, params: exampleDesign, message: 'First cut' })
    .expect(201);
  return notebookResponseSchema.parse(res.body).design;
}

async function list(teamId: string, query = '') {
  const res = await fx.viewer.agent.get(`/api/teams/${teamId}/designs?sort=title${query}`).expect(200);
  return designListResponseSchema.parse(res.body).designs.map((d) => [d.title, d.latestReviewState]);
}

describe('review state on the design list', () => {
  it('shows each design’s latest review state, fresh after a request and a decision, and a new version starts unreviewed', async () => {
    const teamId = await freshTeam('List states');
    const created = await create(teamId, 'Alpha');
    expect(created.latestReviewState).toBe('unreviewed');
    const beta = await create(teamId, 'Beta');
    await create(teamId, 'Gamma');
    // Read once so the page is remembered; each change below must make it forget.
    expect(await list(teamId)).toEqual([
      ['Alpha', 'unreviewed'],
      ['Beta', 'unreviewed'],
      ['Gamma', 'unreviewed'],
    ]);
    await requestReview(fx.owner, beta.id, 1, { reviewerIds: [fx.reviewer.user.id] });
    expect(await list(teamId)).toEqual([
      ['Alpha', 'unreviewed'],
      ['Beta', 'requested'],
      ['Gamma', 'unreviewed'],
    ]);
    await decide(fx.reviewer, created.id, 1, 'signed-off');
    await decide(fx.reviewer, beta.id, 1, 'revise');
    expect(await list(teamId)).toEqual([
      ['Alpha', 'signed-off'],
      ['Beta', 'revise'],
      ['Gamma', 'unreviewed'],
    ]);
    // The design's own answer says the same.
    const one = await fx.viewer.agent.get(`/api/designs/${created.id}`).expect(200);
    expect(notebookResponseSchema.parse(one.body).design.latestReviewState).toBe('signed-off');

    // A new version of Alpha is not reviewed: the sign-off stays with v1.
    const saved = await fx.owner.agent
      .post(`/api/designs/${created.id}/versions`)
      .send({ baseVersion: 1, params: designWith({ slits: { exitWidthUm: 60 } }), message: 'Narrower' })
      .expect(201);
    expect(notebookResponseSchema.parse(saved.body).design.latestReviewState).toBe('unreviewed');
    expect(await list(teamId)).toEqual([
      ['Alpha', 'unreviewed'],
      ['Beta', 'revise'],
      ['Gamma', 'unreviewed'],
    ]);
  });

  it('filters by review state', async () => {
    const teamId = await freshTeam('List filter');
    const signed = await create(teamId, 'Signed');
    const waiting = await create(teamId, 'Waiting');
    await create(teamId, 'Untouched');
    expect(await list(teamId, '&review=signed-off')).toEqual([]);
    await decide(fx.reviewer, signed.id, 1, 'signed-off-with-remarks');
    await requestReview(fx.owner, waiting.id, 1, { reviewerIds: [fx.reviewer.user.id] });
    expect(await list(teamId, '&review=signed-off-with-remarks')).toEqual([['Signed', 'signed-off-with-remarks']]);
    expect(await list(teamId, '&review=requested')).toEqual([['Waiting', 'requested']]);
    expect(await list(teamId, '&review=unreviewed')).toEqual([['Untouched', 'unreviewed']]);
    expect(await list(teamId, '&review=revise')).toEqual([]);
    const total = await fx.viewer.agent.get(`/api/teams/${teamId}/designs?review=requested`).expect(200);
    expect(total.body.total).toBe(1);

    const bad = await fx.viewer.agent.get(`/api/teams/${teamId}/designs?review=approved`).expect(400);
    expect(bad.body.error.fields.review).toMatch(/must be one of unreviewed, requested/);
  });
});
