import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createNotebook, createNotebookFixture, designWith, saveVersion, type NotebookFixture, type Person } from '../notebooks/fixture';
import { signUp } from '../../support/test-app';
import { decide, decisionsPath, getReview, requestReview, requestsPath, startThread, states, setStatus } from './support';

let fx: NotebookFixture;
/** A second owner who writes versions, so the fixture's owner may decide on them. */
let author: Person;
beforeAll(async () => {
  fx = await createNotebookFixture();
  author = await signUp(fx.ctx.app, 'Second owner');
  await fx.addMember(fx.teamId, author, 'owner');
}, 60_000);
afterAll(() => fx?.ctx.close());

const slit = (exitWidthUm: number) => designWith({ slits: { exitWidthUm } });

/** A design whose v1 the fixture's owner wrote and whose v2 `author` wrote. */
async function designWithTwoAuthors(title: string) {
  const { design } = await createNotebook(fx, title, slit(100));
  await author.agent
    .post(`/api/designs/${design.id}/versions`)
    .send({ baseVersion: 1, params: slit(80), notes: '', message: 'Narrower exit slit' })
    .expect(201);
  return design;
}

describe('decisions', () => {
  it('refuses a viewer (403) and the version’s author (403 in plain words), and records a reviewer’s', async () => {
    const design = await designWithTwoAuthors('Decisions');
    const viewer = await fx.viewer.agent.post(decisionsPath(design.id, 2)).send({ outcome: 'signed-off', summary: 'ok' }).expect(403);
    expect(viewer.body.error.message).toMatch(/viewer/);
    const own = await author.agent.post(decisionsPath(design.id, 2)).send({ outcome: 'signed-off', summary: 'Mine is fine' }).expect(403);
    expect(own.body.error.message).toBe('You wrote v2; another owner or reviewer must decide on it.');
    // The fixture's owner wrote v1: they cannot sign it off either, but may decide on v2.
    await fx.owner.agent.post(decisionsPath(design.id, 1)).send({ outcome: 'revise', summary: 'x' }).expect(403);
    expect((await getReview(fx.owner, design.id, 2)).authorId).toBe(author.user.id);

    const decision = await decide(fx.reviewer, design.id, 2, 'signed-off-with-remarks', '  Fine; watch the stray light.  ');
    expect(decision).toEqual({
      id: expect.any(String),
      version: 2,
      reviewer: { id: fx.reviewer.user.id, displayName: fx.reviewer.user.displayName },
      reviewerName: fx.reviewer.user.displayName,
      outcome: 'signed-off-with-remarks',
      summary: 'Fine; watch the stray light.',
      createdAt: fx.ctx.clock.now().toISOString(),
    });
    await decide(fx.owner, design.id, 2, 'revise', 'On second thought, revise.');
    const review = await getReview(fx.viewer, design.id, 2);
    expect(review.decisions.map((d) => d.outcome)).toEqual(['signed-off-with-remarks', 'revise']);
    expect(review.state).toBe('revise');
  });

  it.each([
    { case: 'an unknown outcome', body: { outcome: 'approved', summary: 'ok' }, field: 'outcome', why: /signed-off/ },
    { case: 'no summary', body: { outcome: 'revise' }, field: 'summary', why: /is required/ },
    { case: 'a blank summary', body: { outcome: 'revise', summary: '  ' }, field: 'summary', why: /is required/ },
    { case: 'a summary too long', body: { outcome: 'revise', summary: 'x'.repeat(4001) }, field: 'summary', why: /at most 4000/ },
  ])('refuses a decision with $case (400 naming the field)', async ({ body, field, why }) => {
    const design = await designWithTwoAuthors('Bad decision');
    const res = await fx.reviewer.agent.post(decisionsPath(design.id, 2)).send(body).expect(400);
    expect(res.body.error.fields[field]).toMatch(why);
    expect((await getReview(fx.owner, design.id, 2)).decisions).toEqual([]);
  });

  it('keeps a sign-off with its version: a new version starts unreviewed and names the earlier sign-off and what changed', async () => {
    const design = await designWithTwoAuthors('Sign-off stays');
    const signOff = await decide(fx.reviewer, design.id, 2, 'signed-off', 'Good to build.');
    expect((await getReview(fx.owner, design.id, 2)).state).toBe('signed-off');
    await saveVersion(fx, design.id, 2, designWith({ slits: { exitWidthUm: 60 }, detector: { pixelCount: 2048 } }), 'v3').expect(201);

    const v3 = await getReview(fx.owner, design.id, 3);
    expect(v3.state).toBe('unreviewed');
    expect(v3.decisions).toEqual([]);
    expect(v3.earlierSignOff).toEqual({ decision: signOff, changedPaths: ['detector.pixelCount', 'slits.exitWidthUm'] });
    // v1 and v2 see no sign-off before them.
    expect((await getReview(fx.owner, design.id, 2)).earlierSignOff).toBeNull();
    expect((await states(fx.viewer, design.id)).map((s) => [s.version, s.state])).toEqual([
      [3, 'unreviewed'],
      [2, 'signed-off'],
      [1, 'unreviewed'],
    ]);
  });

  it('does not take a revise as an earlier sign-off', async () => {
    const design = await designWithTwoAuthors('Revise is no sign-off');
    await decide(fx.reviewer, design.id, 2, 'revise', 'Slit too wide.');
    await saveVersion(fx, design.id, 2, slit(60), 'v3').expect(201);
    expect((await getReview(fx.owner, design.id, 3)).earlierSignOff).toBeNull();
  });
});

describe('review requests', () => {
  it('asks named reviewers, answers all of the version’s requests, and a decision answers the reviewer’s request', async () => {
    const design = await designWithTwoAuthors('Requests');
    const requests = await requestReview(fx.owner, design.id, 2, {
      reviewerIds: [fx.reviewer.user.id],
      dueDate: '2026-03-20',
      note: 'Please check the slit.',
    });
    expect(requests).toEqual([
      {
        id: expect.any(String),
        version: 2,
        requestedBy: { id: fx.owner.user.id, displayName: fx.owner.user.displayName },
        reviewer: { id: fx.reviewer.user.id, displayName: fx.reviewer.user.displayName },
        dueDate: '2026-03-20',
        note: 'Please check the slit.',
        createdAt: fx.ctx.clock.now().toISOString(),
        answeredAt: null,
      },
    ]);
    expect((await getReview(fx.viewer, design.id, 2)).state).toBe('requested');
    // Asking the owner too (not v2's author) adds a request and keeps the first.
    fx.ctx.clock.advance(1000);
    const both = await requestReview(author, design.id, 2, { reviewerIds: [fx.owner.user.id] });
    expect(both.map((r) => r.reviewer.id)).toEqual([fx.reviewer.user.id, fx.owner.user.id]);

    fx.ctx.clock.advance(3_600_000);
    await decide(fx.reviewer, design.id, 2, 'signed-off');
    const review = await getReview(fx.viewer, design.id, 2);
    expect(review.requests.map((r) => [r.reviewer.id, r.answeredAt])).toEqual([
      [fx.reviewer.user.id, fx.ctx.clock.now().toISOString()],
      [fx.owner.user.id, null],
    ]);
    expect(review.state).toBe('signed-off');

    // Asking again updates the due date and note and waits for a new answer.
    const again = await requestReview(fx.owner, design.id, 2, { reviewerIds: [fx.reviewer.user.id], dueDate: null, note: 'Once more' });
    expect(again.find((r) => r.reviewer.id === fx.reviewer.user.id)).toMatchObject({ dueDate: null, note: 'Once more', answeredAt: null });
    expect(again).toHaveLength(2);
  });

  it.each([
    { case: 'a viewer', who: () => fx.viewer.user.id, why: /viewer, who cannot review/ },
    { case: 'the version’s author', who: () => author.user.id, why: /who wrote v2/ },
    { case: 'someone outside the team', who: () => fx.outsider.user.id, why: /not in this team/ },
    { case: 'a made-up id', who: () => 'no-such-person', why: /not in this team/ },
  ])('refuses a request naming $case (400 on reviewerIds)', async ({ who, why }) => {
    const design = await designWithTwoAuthors('Bad request');
    const res = await fx.owner.agent
      .post(requestsPath(design.id, 2))
      .send({ reviewerIds: [fx.reviewer.user.id, who()] })
      .expect(400);
    expect(res.body.error.fields.reviewerIds).toMatch(why);
    expect((await getReview(fx.owner, design.id, 2)).requests).toEqual([]);
  });

  it('lets only owners ask (a reviewer gets 403) and refuses bad fields', async () => {
    const design = await designWithTwoAuthors('Who asks');
    await fx.reviewer.agent.post(requestsPath(design.id, 2)).send({ reviewerIds: [fx.owner.user.id] }).expect(403);
    const none = await fx.owner.agent.post(requestsPath(design.id, 2)).send({ reviewerIds: [] }).expect(400);
    expect(none.body.error.fields.reviewerIds).toMatch(/at least one/);
    const date = await fx.owner.agent.post(requestsPath(design.id, 2)).send({ reviewerIds: [fx.reviewer.user.id], dueDate: 'soon' }).expect(400);
    expect(date.body.error.fields.dueDate).toMatch(/date/);
    await fx.owner.agent.post(requestsPath(design.id, 9)).send({ reviewerIds: [fx.reviewer.user.id] }).expect(404);
  });
});

describe('review states', () => {
  it('lists every version newest first with its latest decision and open threads started on it', async () => {
    const design = await designWithTwoAuthors('States');
    await startThread(fx.reviewer, design.id, 1, { kind: 'version' }, 'One');
    const resolved = await startThread(fx.reviewer, design.id, 1, { kind: 'version' }, 'Two');
    await setStatus(fx.reviewer, resolved.id, 'resolved');
    await startThread(fx.reviewer, design.id, 2, { kind: 'version' }, 'Three');
    await requestReview(fx.owner, design.id, 1, { reviewerIds: [fx.reviewer.user.id] });
    fx.ctx.clock.advance(1000);
    await decide(fx.reviewer, design.id, 2, 'revise', 'Narrower still.');
    expect(await states(fx.viewer, design.id)).toEqual([
      {
        version: 2,
        state: 'revise',
        decidedBy: { id: fx.reviewer.user.id, displayName: fx.reviewer.user.displayName },
        decidedAt: fx.ctx.clock.now().toISOString(),
        openThreads: 1,
      },
      { version: 1, state: 'requested', decidedBy: null, decidedAt: null, openThreads: 1 },
    ]);
    await fx.outsider.agent.get(`/api/designs/${design.id}/review-states`).expect(404);
  });
});
