import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { reviewListResponseSchema, reviewResponseSchema } from '../../../shared/reviews';
import { sharedVersionResponseSchema } from '../../../shared/notebooks';
import { browserAgent, signUp } from '../../support/test-app';
import {
  createNotebook,
  createNotebookFixture,
  designWith,
  saveVersion,
  type NotebookFixture,
  type Person,
} from '../notebooks/fixture';

let fx: NotebookFixture;
beforeAll(async () => {
  fx = await createNotebookFixture();
}, 60_000);
afterAll(() => fx?.ctx.close());

const reviewsPath = (designId: string, n: number) => `/api/designs/${designId}/versions/${n}/reviews`;
const post = (person: Person, designId: string, n: number, body: object) =>
  person.agent.post(reviewsPath(designId, n)).send(body);
const list = async (person: Person, designId: string, n: number) =>
  reviewListResponseSchema.parse((await person.agent.get(reviewsPath(designId, n)).expect(200)).body).reviews;

describe('review comments on a version', () => {
  it('lets a reviewer comment and then approve, each stored with its author and time', async () => {
    const { design } = await createNotebook(fx, 'Reviewed scanner');
    const comment = await post(fx.reviewer, design.id, 1, { body: '  Entrance slit looks wide for the doublet.  ' }).expect(201);
    expect(reviewResponseSchema.parse(comment.body).review).toMatchObject({
      version: 1,
      body: 'Entrance slit looks wide for the doublet.',
      decision: null,
      author: { id: fx.reviewer.user.id, displayName: fx.reviewer.user.displayName },
      createdAt: fx.ctx.clock.now().toISOString(),
    });
    fx.ctx.clock.advance(60_000);
    const approval = await post(fx.reviewer, design.id, 1, { body: 'Fine for teaching.', decision: 'approved' }).expect(201);
    expect(reviewResponseSchema.parse(approval.body).review).toMatchObject({
      decision: 'approved',
      createdAt: fx.ctx.clock.now().toISOString(),
    });
  });

  it('lets an owner request changes', async () => {
    const { design } = await createNotebook(fx, 'Owner review');
    const res = await post(fx.owner, design.id, 1, { body: 'Check the order sorting filter.', decision: 'changes-requested' }).expect(201);
    expect(reviewResponseSchema.parse(res.body).review).toMatchObject({
      decision: 'changes-requested',
      author: { id: fx.owner.user.id },
    });
  });

  it('lists a version’s reviews oldest first, even when written in the same instant, and keeps versions apart', async () => {
    const { design } = await createNotebook(fx, 'Ordered reviews');
    await saveVersion(fx, design.id, 1, designWith({ slits: { exitWidthUm: 50 } }), 'Narrower').expect(201);
    for (const body of ['first', 'second', 'third']) await post(fx.reviewer, design.id, 1, { body }).expect(201);
    await post(fx.owner, design.id, 2, { body: 'on v2', decision: 'approved' }).expect(201);
    const v1 = await list(fx.viewer, design.id, 1);
    expect(v1.map((r) => r.body)).toEqual(['first', 'second', 'third']);
    expect(v1.every((r) => r.author?.displayName === fx.reviewer.user.displayName)).toBe(true);
    expect((await list(fx.viewer, design.id, 2)).map((r) => [r.body, r.decision])).toEqual([['on v2', 'approved']]);
  });

  it('lets a viewer read the reviews but not write one (403), with or without a decision', async () => {
    const { design } = await createNotebook(fx, 'Viewer reads');
    await post(fx.reviewer, design.id, 1, { body: 'Looks right.' }).expect(201);
    expect(await list(fx.viewer, design.id, 1)).toHaveLength(1);
    await post(fx.viewer, design.id, 1, { body: 'Me too' }).expect(403);
    await post(fx.viewer, design.id, 1, { body: 'Approve', decision: 'approved' }).expect(403);
    expect(await list(fx.owner, design.id, 1)).toHaveLength(1);
  });

  it('answers a member of another team 404 on read and on write, as for a made-up design, and writes nothing', async () => {
    const { design } = await createNotebook(fx, 'Team A only');
    // The outsider owns a team of their own: being an owner elsewhere grants nothing here.
    const other = await signUp(fx.ctx.app, 'Other lab owner');
    await other.agent.post('/api/teams').send({ name: 'Team B' }).expect(201);
    for (const person of [fx.outsider, other]) {
      const read = await person.agent.get(reviewsPath(design.id, 1)).expect(404);
      const madeUp = await person.agent.get(reviewsPath('no-such-design', 1)).expect(404);
      expect(read.body).toEqual(madeUp.body);
      await post(person, design.id, 1, { body: 'Sneaky', decision: 'approved' }).expect(404);
    }
    expect(await list(fx.owner, design.id, 1)).toEqual([]);
  });

  it('answers a signed-out caller 401', async () => {
    const { design } = await createNotebook(fx, 'Signed out');
    const anonymous = browserAgent(fx.ctx.app);
    await anonymous.get(reviewsPath(design.id, 1)).expect(401);
    await anonymous.post(reviewsPath(design.id, 1)).send({ body: 'Hello' }).expect(401);
  });

  it('answers 404 for a version the design does not have', async () => {
    const { design } = await createNotebook(fx, 'One version');
    const res = await fx.reviewer.agent.get(reviewsPath(design.id, 2)).expect(404);
    expect(res.body.error.message).toMatch(/no version 2/);
    await post(fx.reviewer, design.id, 2, { body: 'Where is it?' }).expect(404);
  });

  it.each([
    { case: 'empty', body: { body: '' }, fields: { body: 'is required' } },
    { case: 'only spaces', body: { body: '   \n ' }, fields: { body: 'is required' } },
    { case: 'missing', body: {}, fields: { body: 'is required' } },
    { case: 'too long', body: { body: 'x'.repeat(4001) }, fields: { body: 'must be at most 4000 characters' } },
    { case: 'an unknown decision', body: { body: 'ok', decision: 'maybe' }, fields: { decision: expect.stringMatching(/approved/) } },
  ] satisfies { case: string; body: object; fields: Record<string, unknown> }[])(
    'refuses a review that is $case with a 400 naming the field',
    async ({ body, fields }) => {
      const { design } = await createNotebook(fx, 'Validation');
      const res = await post(fx.reviewer, design.id, 1, body).expect(400);
      expect(res.body.error.fields).toEqual(fields);
    },
  );

  it('takes a review of exactly 4000 characters', async () => {
    const { design } = await createNotebook(fx, 'Long review');
    await post(fx.reviewer, design.id, 1, { body: 'y'.repeat(4000) }).expect(201);
  });

  it('never shows reviews through the design’s share link', async () => {
    const { design } = await createNotebook(fx, 'Shared and reviewed');
    await post(fx.reviewer, design.id, 1, { body: 'Secret remark about the mirror.', decision: 'changes-requested' }).expect(201);
    const link = await fx.owner.agent.post(`/api/designs/${design.id}/share-links`).send({ version: 1 }).expect(201);
    const res = await browserAgent(fx.ctx.app).get(`/api/share/${link.body.token}`).expect(200);
    sharedVersionResponseSchema.parse(res.body);
    expect(JSON.stringify(res.body)).not.toMatch(/Secret remark|changes-requested|reviews?"/i);
    expect(Object.keys(res.body).sort()).toEqual(['expiresAt', 'pinned', 'title', 'version']);
    // The share token opens no review route: it is not a session.
    await browserAgent(fx.ctx.app).get(reviewsPath(design.id, 1)).expect(401);
  });
});
