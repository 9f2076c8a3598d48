import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { remarkBodyMaxLength, threadResponseSchema, type Pin } from '../../../shared/reviews';
import { browserAgent, signUp } from '../../support/test-app';
import { createNotebook, createNotebookFixture, designWith, type NotebookFixture } from '../notebooks/fixture';
import {
  exitSlit,
  getReview,
  getThread,
  remarkPath,
  reviewPath,
  setStatus,
  startThread,
  threadPath,
  threadsPath,
} from './support';

let fx: NotebookFixture;
beforeAll(async () => {
  fx = await createNotebookFixture();
}, 60_000);
afterAll(() => fx?.ctx.close());

describe('a thread from its first remark to resolved and back', () => {
  it('keeps who wrote, replied, edited, removed, resolved and reopened, and when', async () => {
    const { design } = await createNotebook(fx, 'Lifecycle', designWith({ slits: { exitWidthUm: 100 } }));
    const started = await startThread(fx.reviewer, design.id, 1, exitSlit, '  Too wide for the 0.2 nm requirement.  ');
    expect(started).toMatchObject({
      designId: design.id,
      version: 1,
      pin: exitSlit,
      pinnedValue: 100,
      status: 'open',
      resolvedBy: null,
      resolvedAt: null,
      statusEvents: [],
      carry: { state: 'here' },
    });
    expect(started.remarks).toEqual([
      {
        id: expect.any(String),
        author: { id: fx.reviewer.user.id, displayName: fx.reviewer.user.displayName },
        authorName: fx.reviewer.user.displayName,
        body: 'Too wide for the 0.2 nm requirement.',
        mentions: [],
        createdAt: fx.ctx.clock.now().toISOString(),
        editedAt: null,
        earlierBodies: [],
        removedAt: null,
      },
    ]);

    fx.ctx.clock.advance(60_000);
    const reply = await fx.owner.agent
      .post(`${threadPath(started.id)}/remarks`)
      .send({ body: 'Agreed; 60 µm next.', mentions: [fx.reviewer.user.id] })
      .expect(201);
    const replied = threadResponseSchema.parse(reply.body).thread;
    expect(replied.remarks.map((r) => [r.author?.id, r.body])).toEqual([
      [fx.reviewer.user.id, 'Too wide for the 0.2 nm requirement.'],
      [fx.owner.user.id, 'Agreed; 60 µm next.'],
    ]);
    expect(replied.remarks[1]!.mentions).toEqual([{ id: fx.reviewer.user.id, displayName: fx.reviewer.user.displayName }]);

    // Editing keeps the earlier text and shows as edited.
    fx.ctx.clock.advance(60_000);
    const firstId = started.remarks[0]!.id;
    const edited = threadResponseSchema.parse(
      (await fx.reviewer.agent.patch(remarkPath(firstId)).send({ body: 'Too wide for 0.2 nm.' }).expect(200)).body,
    ).thread;
    expect(edited.remarks[0]).toMatchObject({
      body: 'Too wide for 0.2 nm.',
      editedAt: fx.ctx.clock.now().toISOString(),
      earlierBodies: [{ body: 'Too wide for the 0.2 nm requirement.', replacedAt: fx.ctx.clock.now().toISOString() }],
    });

    // Resolve: who and when.
    fx.ctx.clock.advance(60_000);
    const resolvedAt = fx.ctx.clock.now().toISOString();
    const resolved = await setStatus(fx.owner, started.id, 'resolved');
    expect(resolved).toMatchObject({
      status: 'resolved',
      resolvedBy: { id: fx.owner.user.id },
      resolvedAt,
      statusEvents: [{ status: 'resolved', by: { id: fx.owner.user.id, displayName: fx.owner.user.displayName }, at: resolvedAt }],
    });
    // Resolving a resolved thread changes nothing.
    fx.ctx.clock.advance(60_000);
    expect(await setStatus(fx.reviewer, started.id, 'resolved')).toEqual(resolved);

    // Reopen clears who resolved it and keeps both events.
    const reopenedAt = fx.ctx.clock.now().toISOString();
    const reopened = await setStatus(fx.reviewer, started.id, 'open');
    expect(reopened).toMatchObject({ status: 'open', resolvedBy: null, resolvedAt: null });
    expect(reopened.statusEvents.map((e) => [e.status, e.by?.id, e.at])).toEqual([
      ['resolved', fx.owner.user.id, resolvedAt],
      ['open', fx.reviewer.user.id, reopenedAt],
    ]);

    // Remove: the thread shows that a remark was removed, with no trace of its text.
    const removed = threadResponseSchema.parse((await fx.reviewer.agent.delete(remarkPath(firstId)).expect(200)).body).thread;
    expect(removed.remarks[0]).toMatchObject({ id: firstId, body: null, earlierBodies: [], removedAt: reopenedAt });
    expect(JSON.stringify(removed)).not.toContain('0.2 nm');
    expect(removed.remarks).toHaveLength(2);
    const again = await fx.reviewer.agent.patch(remarkPath(firstId)).send({ body: 'Back again' }).expect(409);
    expect(again.body.error.message).toMatch(/removed/);

    // The thread reads the same through its own route and in the version's review.
    expect(await getThread(fx.viewer, started.id)).toEqual(removed);
    expect((await getReview(fx.viewer, design.id, 1)).threads).toEqual([removed]);
  });

  it('keeps remarks oldest first, even in the same instant', async () => {
    const { design } = await createNotebook(fx, 'Ordered remarks');
    const thread = await startThread(fx.reviewer, design.id, 1, { kind: 'version' }, 'first');
    for (const body of ['second', 'third', 'fourth'])
      await fx.owner.agent.post(`${threadPath(thread.id)}/remarks`).send({ body }).expect(201);
    expect((await getThread(fx.owner, thread.id)).remarks.map((r) => r.body)).toEqual(['first', 'second', 'third', 'fourth']);
  });

  it('lets only the author edit or remove a remark (403), and a viewer neither write nor resolve', async () => {
    const { design } = await createNotebook(fx, 'Own remarks');
    const thread = await startThread(fx.reviewer, design.id, 1);
    const remarkId = thread.remarks[0]!.id;
    const edit = await fx.owner.agent.patch(remarkPath(remarkId)).send({ body: 'Rewritten by the owner' }).expect(403);
    expect(edit.body.error.message).toBe('You can only edit your own remarks.');
    const remove = await fx.owner.agent.delete(remarkPath(remarkId)).expect(403);
    expect(remove.body.error.message).toBe('You can only remove your own remarks.');
    await fx.viewer.agent.post(threadsPath(design.id, 1)).send({ pin: exitSlit, body: 'Hi' }).expect(403);
    await fx.viewer.agent.post(`${threadPath(thread.id)}/remarks`).send({ body: 'Hi' }).expect(403);
    await fx.viewer.agent.put(`${threadPath(thread.id)}/status`).send({ status: 'resolved' }).expect(403);
    await fx.viewer.agent.patch(remarkPath(remarkId)).send({ body: 'x' }).expect(403);
    expect(await getThread(fx.viewer, thread.id)).toEqual(thread);
  });
});

describe('pins', () => {
  it.each([
    { pin: { kind: 'version' } },
    { pin: { kind: 'field', path: 'grating.grooveDensityPerMm' }, pinnedValue: 1200 },
    { pin: { kind: 'result', result: 'bandpass', wavelengthNm: 500 } },
    { pin: { kind: 'region', figure: 'sketch', x: 0.25, y: 1 } },
  ] satisfies { pin: Pin; pinnedValue?: number }[])('pins a thread to $pin.kind', async ({ pin, pinnedValue }) => {
    const { design } = await createNotebook(fx, `Pinned to ${pin.kind}`);
    const thread = await startThread(fx.reviewer, design.id, 1, pin);
    expect(thread.pin).toEqual(pin);
    if (pinnedValue === undefined) expect(thread).not.toHaveProperty('pinnedValue');
    else expect(thread.pinnedValue).toBe(pinnedValue);
  });

  it('reads the pinned value from the version, never from the caller', async () => {
    const { design } = await createNotebook(fx, 'Value from server', designWith({ slits: { exitWidthUm: 42 } }));
    const res = await fx.reviewer.agent
      .post(threadsPath(design.id, 1))
      .send({ pin: exitSlit, body: 'x', pinnedValue: 1 })
      .expect(400);
    expect(JSON.stringify(res.body.error.fields)).toMatch(/pinnedValue/);
    expect((await startThread(fx.reviewer, design.id, 1)).pinnedValue).toBe(42);
  });

  it.each([
    { case: 'a made-up field path', pin: { kind: 'field', path: 'slits.nope' }, field: 'pin.path', why: /design field/ },
    { case: 'a wavelength of 0', pin: { kind: 'result', result: 'bandpass', wavelengthNm: 0 }, field: 'pin.wavelengthNm', why: /more than 0/ },
    { case: 'a negative wavelength', pin: { kind: 'result', result: 'efficiency', wavelengthNm: -5 }, field: 'pin.wavelengthNm', why: /more than 0/ },
    { case: 'an unknown result', pin: { kind: 'result', result: 'colour', wavelengthNm: 500 }, field: 'pin.result', why: /bandpass/ },
    { case: 'x past the figure', pin: { kind: 'region', figure: 'sketch', x: 1.5, y: 0 }, field: 'pin.x', why: /at most 1/ },
    { case: 'an unknown figure', pin: { kind: 'region', figure: 'poster', x: 0, y: 0 }, field: 'pin.figure', why: /sketch/ },
    { case: 'an unknown kind', pin: { kind: 'sticker' }, field: 'pin.kind', why: /version, field, result or region/ },
    { case: 'a field pin without a path', pin: { kind: 'field' }, field: 'pin.path', why: /./ },
  ])('refuses $case with a 400 naming the field', async ({ pin, field, why }) => {
    const { design } = await createNotebook(fx, 'Bad pin');
    const res = await fx.reviewer.agent.post(threadsPath(design.id, 1)).send({ pin, body: 'Look here' }).expect(400);
    expect(res.body.error.fields[field]).toMatch(why);
    expect((await getReview(fx.owner, design.id, 1)).threads).toEqual([]);
  });
});

describe('what a remark may hold', () => {
  it(`takes a body of exactly ${remarkBodyMaxLength} characters and refuses one more with a clear error`, async () => {
    const { design } = await createNotebook(fx, 'Long remarks');
    await startThread(fx.reviewer, design.id, 1, exitSlit, 'y'.repeat(remarkBodyMaxLength));
    const res = await fx.reviewer.agent
      .post(threadsPath(design.id, 1))
      .send({ pin: exitSlit, body: 'y'.repeat(remarkBodyMaxLength + 1) })
      .expect(400);
    expect(res.body.error.fields).toEqual({ body: 'must be at most 10,000 characters' });
    const thread = (await getReview(fx.owner, design.id, 1)).threads[0]!;
    const reply = await fx.owner.agent.post(`${threadPath(thread.id)}/remarks`).send({ body: 'z'.repeat(10_001) }).expect(400);
    expect(reply.body.error.fields).toEqual({ body: 'must be at most 10,000 characters' });
    const empty = await fx.owner.agent.post(`${threadPath(thread.id)}/remarks`).send({ body: '   ' }).expect(400);
    expect(empty.body.error.fields).toEqual({ body: 'is required' });
  });

  it('refuses a mention of someone outside the team, on a new thread, a reply and an edit', async () => {
    const { design } = await createNotebook(fx, 'Mentions');
    const bad = { pin: exitSlit, body: 'Ask @outsider', mentions: [fx.outsider.user.id] };
    const res = await fx.reviewer.agent.post(threadsPath(design.id, 1)).send(bad).expect(400);
    expect(res.body.error.fields).toEqual({ mentions: 'names someone who is not in this team' });
    await fx.reviewer.agent.post(threadsPath(design.id, 1)).send({ ...bad, mentions: ['no-such-person'] }).expect(400);
    expect((await getReview(fx.owner, design.id, 1)).threads).toEqual([]);

    const thread = await startThread(fx.reviewer, design.id, 1, exitSlit, 'Ask @viewer', [fx.viewer.user.id, fx.viewer.user.id]);
    expect(thread.remarks[0]!.mentions).toEqual([{ id: fx.viewer.user.id, displayName: fx.viewer.user.displayName }]);
    const reply = await fx.owner.agent
      .post(`${threadPath(thread.id)}/remarks`)
      .send({ body: 'x', mentions: [fx.outsider.user.id] })
      .expect(400);
    expect(reply.body.error.fields).toEqual({ mentions: 'names someone who is not in this team' });
    await fx.reviewer.agent
      .patch(remarkPath(thread.remarks[0]!.id))
      .send({ body: 'x', mentions: [fx.outsider.user.id] })
      .expect(400);
    expect(await getThread(fx.owner, thread.id)).toEqual(thread);
  });
});

describe('who can reach a thread', () => {
  it('answers a reviewer of another team 404 on every route, as for made-up ids, and writes nothing', async () => {
    const { design } = await createNotebook(fx, 'Team A only');
    const thread = await startThread(fx.reviewer, design.id, 1);
    const remarkId = thread.remarks[0]!.id;
    // A reviewer in team B, whose owner is someone else.
    const ownerB = await signUp(fx.ctx.app, 'Owner B');
    const teamB = (await ownerB.agent.post('/api/teams').send({ name: 'Team B' }).expect(201)).body.team.id as string;
    const reviewerB = await signUp(fx.ctx.app, 'Reviewer B');
    await fx.addMember(teamB, reviewerB, 'reviewer');

    for (const person of [reviewerB, fx.outsider]) {
      const read = await person.agent.get(reviewPath(design.id, 1)).expect(404);
      expect(read.body).toEqual((await person.agent.get(reviewPath('no-such-design', 1)).expect(404)).body);
      await person.agent.post(threadsPath(design.id, 1)).send({ pin: exitSlit, body: 'Sneaky' }).expect(404);
      const got = await person.agent.get(threadPath(thread.id)).expect(404);
      expect(got.body).toEqual((await person.agent.get(threadPath('no-such-thread')).expect(404)).body);
      expect(got.body.error.message).toBe('No such thread.');
      await person.agent.post(`${threadPath(thread.id)}/remarks`).send({ body: 'Sneaky' }).expect(404);
      await person.agent.put(`${threadPath(thread.id)}/status`).send({ status: 'resolved' }).expect(404);
      const edit = await person.agent.patch(remarkPath(remarkId)).send({ body: 'Sneaky' }).expect(404);
      expect(edit.body.error.message).toBe('No such remark.');
      await person.agent.delete(remarkPath(remarkId)).expect(404);
    }
    expect(await getThread(fx.owner, thread.id)).toEqual(thread);
  });

  it('answers a signed-out caller 401 and a share-link visitor nothing of the review', async () => {
    const { design } = await createNotebook(fx, 'Shared and reviewed');
    const thread = await startThread(fx.reviewer, design.id, 1, exitSlit, 'Secret remark about the mirror.');
    const anonymous = browserAgent(fx.ctx.app);
    await anonymous.get(reviewPath(design.id, 1)).expect(401);
    await anonymous.get(threadPath(thread.id)).expect(401);
    const link = await fx.owner.agent.post(`/api/designs/${design.id}/share-links`).send({ version: 1 }).expect(201);
    const res = await anonymous.get(`/api/share/${link.body.token}`).expect(200);
    expect(JSON.stringify(res.body)).not.toMatch(/Secret remark|thread|remark/i);
  });

  it('answers 404 for a version the design does not have', async () => {
    const { design } = await createNotebook(fx, 'One version');
    const res = await fx.reviewer.agent.get(reviewPath(design.id, 2)).expect(404);
    expect(res.body.error.message).toMatch(/no version 2/);
    await fx.reviewer.agent.post(threadsPath(design.id, 2)).send({ pin: exitSlit, body: 'Where?' }).expect(404);
  });
});
