import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { designListResponseSchema } from '../../../shared/notebooks';
import { exampleDesign } from '../../../shared/design';
import { createNotebook, createNotebookFixture, designWith, saveVersion, type NotebookFixture } from './fixture';

/**
 * The server answers repeated reads (sessions, roles, list pages, versions) from memory. Each test
 * reads first, so the answer is remembered, then changes something and reads again: the second
 * answer must show the change at once.
 */
let fx: NotebookFixture;
beforeAll(async () => {
  fx = await createNotebookFixture();
}, 60_000);
afterAll(() => fx?.ctx.close());

const listOf = async (agent: NotebookFixture['owner']['agent'], teamId = fx.teamId) =>
  designListResponseSchema.parse((await agent.get(`/api/teams/${teamId}/designs?pageSize=100`).expect(200)).body);

describe('answers remembered by the server follow every change', () => {
  it('shuts a removed member out on their very next request', async () => {
    const { design } = await createNotebook(fx, 'Members only');
    const extra = fx.outsider;
    await fx.addMember(fx.teamId, extra, 'reviewer');
    await extra.agent.get(`/api/designs/${design.id}/versions/1`).expect(200);
    await listOf(extra.agent);

    await fx.owner.agent.delete(`/api/teams/${fx.teamId}/members/${extra.user.id}`).expect(204);
    await extra.agent.get(`/api/designs/${design.id}/versions/1`).expect(404);
    await extra.agent.get(`/api/teams/${fx.teamId}/designs`).expect(404);
    await extra.agent.get(`/api/designs/${design.id}`).expect(404);
  });

  it('stops a demoted member saving at once', async () => {
    const { design } = await createNotebook(fx, 'Demotion');
    await fx.owner.agent.patch(`/api/teams/${fx.teamId}/members/${fx.reviewer.user.id}`).send({ role: 'owner' }).expect(200);
    const saved = await fx.reviewer.agent
      .post(`/api/designs/${design.id}/versions`)
      .send({ baseVersion: 1, params: exampleDesign, notes: '', message: 'As owner' })
      .expect(201);
    expect(saved.body.version.number).toBe(2);

    await fx.owner.agent.patch(`/api/teams/${fx.teamId}/members/${fx.reviewer.user.id}`).send({ role: 'viewer' }).expect(200);
    await fx.reviewer.agent
      .post(`/api/designs/${design.id}/versions`)
      .send({ baseVersion: 2, params: exampleDesign, notes: '', message: 'As viewer' })
      .expect(403);
    // Put the fixture back as it was.
    await fx.owner.agent.patch(`/api/teams/${fx.teamId}/members/${fx.reviewer.user.id}`).send({ role: 'reviewer' }).expect(200);
  });

  it('shows saves, renames, tags, archiving and baselines in the very next list', async () => {
    const { design } = await createNotebook(fx, 'Listed');
    const row = async () => (await listOf(fx.viewer.agent)).designs.find((d) => d.id === design.id);
    expect((await row())?.latestVersion).toBe(1);

    await saveVersion(fx, design.id, 1, designWith({ slits: { exitWidthUm: 40 } })).expect(201);
    expect((await row())?.latestVersion).toBe(2);

    await fx.owner.agent.patch(`/api/designs/${design.id}`).send({ title: 'Listed and renamed', tags: ['fresh'] }).expect(200);
    expect(await row()).toMatchObject({ title: 'Listed and renamed', tags: ['fresh'] });
    expect((await listOf(fx.viewer.agent)).tags).toContain('fresh');

    await fx.owner.agent.put(`/api/designs/${design.id}/baseline`).send({ version: 2 }).expect(200);
    const withBaseline = await listOf(fx.viewer.agent);
    expect(withBaseline.designs[0]).toMatchObject({ id: design.id, baselineVersion: 2 });

    await fx.owner.agent.patch(`/api/designs/${design.id}`).send({ archived: true }).expect(200);
    expect(await row()).toBeUndefined();
  });

  it('lists a new, cloned or imported design at once, even when the list was empty', async () => {
    const made = await fx.owner.agent.post('/api/teams').send({ name: 'Empty bench' }).expect(201);
    const teamId: string = made.body.team.id;
    expect((await listOf(fx.owner.agent, teamId)).total).toBe(0);

    const { design } = await createNotebook(fx, 'Source');
    await fx.owner.agent.post(`/api/designs/${design.id}/clone`).send({ teamId }).expect(201);
    expect((await listOf(fx.owner.agent, teamId)).designs.map((d) => d.title)).toEqual(['Source']);

    const file = (await fx.owner.agent.get(`/api/designs/${design.id}/export`).expect(200)).body;
    await fx.owner.agent.post(`/api/teams/${teamId}/designs/import`).send({ ...file, title: 'Imported' }).expect(201);
    expect((await listOf(fx.owner.agent, teamId)).total).toBe(2);
  });

  it('forgets a deleted team: its designs answer 404 to former members', async () => {
    const made = await fx.owner.agent.post('/api/teams').send({ name: 'Short-lived' }).expect(201);
    const teamId: string = made.body.team.id;
    const created = await fx.owner.agent
      .post(`/api/teams/${teamId}/designs`)
      .send({ title: 'Doomed', tags: [], params: exampleDesign, notes: '', message: 'First' })
      .expect(201);
    const designId: string = created.body.design.id;
    await fx.owner.agent.get(`/api/designs/${designId}/versions/1`).expect(200);
    await listOf(fx.owner.agent, teamId);

    await fx.owner.agent.delete(`/api/teams/${teamId}`).expect(204);
    await fx.owner.agent.get(`/api/designs/${designId}/versions/1`).expect(404);
    await fx.owner.agent.get(`/api/teams/${teamId}/designs`).expect(404);
  });

  it('tags a remembered version like any answer and honours If-None-Match', async () => {
    const { design } = await createNotebook(fx, 'Tagged');
    const first = await fx.viewer.agent.get(`/api/designs/${design.id}/versions/1`).expect(200);
    const again = await fx.viewer.agent.get(`/api/designs/${design.id}/versions/1`).expect(200);
    expect(first.headers.etag).toMatch(/^W\/"/);
    expect(again.headers.etag).toBe(first.headers.etag);
    expect(again.headers['content-type']).toMatch(/^application\/json/);
    expect(again.body).toEqual(first.body);
    await fx.viewer.agent
      .get(`/api/designs/${design.id}/versions/1`)
      .set('if-none-match', first.headers.etag as string)
      .expect(304);
  });
});
