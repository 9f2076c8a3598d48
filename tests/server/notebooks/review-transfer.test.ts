import { count, eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { designs, reviewDecisions, reviewRemarks, reviewThreads, users } from '../../../db/schema';
import { exampleDesign } from '../../../shared/design';
import {
  notebookFileSchema,
  notebookFormatVersion,
  notebookWithVersionResponseSchema,
  type NotebookFile,
  type NotebookFileInput,
} from '../../../shared/notebooks';
import { threadResponseSchema, versionReviewResponseSchema, type Thread, type VersionReview } from '../../../shared/reviews';
import { signUp } from '../../support/test-app';
import { createNotebook, createNotebookFixture, designWith, saveVersion, type NotebookFixture, type Person } from './fixture';

/**
 * A notebook file (format 2) carries a design's threads, remarks and decisions; an import writes
 * them back with the names as written and no accounts, in the import's transaction.
 */
let fx: NotebookFixture;
let personalTeamId: string;
beforeAll(async () => {
  fx = await createNotebookFixture();
  const teams = (await fx.owner.agent.get('/api/teams').expect(200)).body.teams as { id: string; personal: boolean }[];
  personalTeamId = teams.find((t) => t.personal)!.id;
}, 60_000);
afterAll(() => fx?.ctx.close());

const tick = () => fx.ctx.clock.advance(60_000);

async function startThread(person: Person, designId: string, n: number, pin: unknown, body: string) {
  tick();
  const res = await person.agent.post(`/api/designs/${designId}/versions/${n}/threads`).send({ pin, body }).expect(201);
  return threadResponseSchema.parse(res.body).thread;
}
async function reply(person: Person, threadId: string, body: string) {
  tick();
  const res = await person.agent.post(`/api/threads/${threadId}/remarks`).send({ body }).expect(201);
  return threadResponseSchema.parse(res.body).thread;
}
async function review(person: Person, designId: string, n: number): Promise<VersionReview> {
  return versionReviewResponseSchema.parse(
    (await person.agent.get(`/api/designs/${designId}/versions/${n}/review`).expect(200)).body,
  );
}
async function exportFile(designId: string): Promise<NotebookFile> {
  return notebookFileSchema.parse((await fx.owner.agent.get(`/api/designs/${designId}/export`).expect(200)).body);
}
async function reviewRowCounts() {
  const { db } = fx.ctx.database;
  const [d] = await db.select({ n: count() }).from(designs);
  const [t] = await db.select({ n: count() }).from(reviewThreads);
  const [r] = await db.select({ n: count() }).from(reviewRemarks);
  const [s] = await db.select({ n: count() }).from(reviewDecisions);
  return { designs: d?.n, threads: t?.n, remarks: r?.n, decisions: s?.n };
}

/** What a reader of the review sees, without this installation's ids and accounts. */
const readable = (answer: VersionReview) => ({
  state: answer.state,
  threads: answer.threads.map((t: Thread) => ({
    version: t.version,
    pin: t.pin,
    status: t.status,
    resolvedAt: t.resolvedAt,
    statusEvents: t.statusEvents.map((e) => ({ status: e.status, at: e.at })),
    carry: t.carry,
    remarks: t.remarks.map((r) => ({
      authorName: r.authorName,
      body: r.body,
      createdAt: r.createdAt,
      editedAt: r.editedAt,
      earlierBodies: r.earlierBodies,
      removedAt: r.removedAt,
    })),
  })),
  decisions: answer.decisions.map((d) => ({
    version: d.version,
    reviewerName: d.reviewerName,
    outcome: d.outcome,
    summary: d.summary,
    createdAt: d.createdAt,
  })),
});

describe('export and import of the review', () => {
  it('round-trips threads with replies, an edit, a removal, a resolve and a decision; the copy names people as written', async () => {
    const { design } = await createNotebook(fx, 'Reviewed scanner');
    tick();
    await saveVersion(fx, design.id, 1, designWith({ slits: { exitWidthUm: 60 } }), 'Narrower exit slit').expect(201);

    const slit = await startThread(
      fx.reviewer,
      design.id,
      1,
      { kind: 'field', path: 'slits.exitWidthUm' },
      'Too wide for the 0.2 nm requirement',
    );
    tick();
    await fx.reviewer.agent
      .patch(`/api/remarks/${slit.remarks[0]!.id}`)
      .send({ body: 'Too wide for the **0.2 nm** requirement, @' + fx.owner.user.displayName })
      .expect(200);
    await reply(fx.owner, slit.id, 'Narrowed to 60 µm in v2.');
    tick();
    await fx.reviewer.agent.put(`/api/threads/${slit.id}/status`).send({ status: 'resolved' }).expect(200);

    const bandpass = await startThread(
      fx.owner,
      design.id,
      2,
      { kind: 'result', result: 'bandpass', wavelengthNm: 500 },
      'Check the bandpass at 500 nm.',
    );
    const withSlip = await reply(fx.owner, bandpass.id, 'Posted in the wrong thread.');
    tick();
    await fx.owner.agent.delete(`/api/remarks/${withSlip.remarks[1]!.id}`).expect(200);
    await reply(fx.reviewer, bandpass.id, 'It reads 0.19 nm: fine.');
    await startThread(fx.reviewer, design.id, 2, { kind: 'region', figure: 'sketch', x: 0.25, y: 0.75 }, 'Baffle here?');
    await startThread(fx.reviewer, design.id, 2, { kind: 'version' }, 'Overall the layout reads well.');
    tick();
    await fx.reviewer.agent
      .post(`/api/designs/${design.id}/versions/2/decisions`)
      .send({ outcome: 'signed-off-with-remarks', summary: 'Signed off; the baffle stays open.' })
      .expect(201);

    const res = await fx.owner.agent.get(`/api/designs/${design.id}/export`).expect(200);
    expect(res.headers['content-disposition']).toBe('attachment; filename=reviewed-scanner.blazebook.json');
    const file = notebookFileSchema.parse(res.body);
    expect(Object.keys(res.body).sort()).toEqual(
      ['kind', 'formatVersion', 'exportedAt', 'title', 'tags', 'baselineVersion', 'clonedFrom', 'versions', 'review'].sort(),
    );
    expect(file.formatVersion).toBe(notebookFormatVersion);
    const reviewer = fx.reviewer.user.displayName;
    const owner = fx.owner.user.displayName;
    expect(file.review?.threads.map((t) => [t.version, t.pin.kind, t.status, t.createdByName, t.remarks.length])).toEqual([
      [1, 'field', 'resolved', reviewer, 2],
      [2, 'result', 'open', owner, 3],
      [2, 'region', 'open', reviewer, 1],
      [2, 'version', 'open', reviewer, 1],
    ]);
    const [slitThread, bandpassThread] = file.review!.threads;
    expect(slitThread).toMatchObject({
      pinnedValue: exampleDesign.slits.exitWidthUm,
      resolvedByName: reviewer,
      statusEvents: [{ status: 'resolved', byName: reviewer }],
    });
    expect(slitThread!.remarks[0]).toMatchObject({
      authorName: reviewer,
      body: `Too wide for the **0.2 nm** requirement, @${owner}`,
      earlierBodies: [{ body: 'Too wide for the 0.2 nm requirement' }],
    });
    expect(slitThread!.remarks[0]!.editedAt).not.toBeNull();
    expect(bandpassThread!.remarks[1]).toMatchObject({ authorName: owner, body: null });
    expect(bandpassThread!.remarks[1]!.removedAt).not.toBeNull();
    expect(bandpassThread).not.toHaveProperty('pinnedValue');
    expect(file.review?.decisions).toEqual([
      {
        version: 2,
        reviewerName: reviewer,
        outcome: 'signed-off-with-remarks',
        summary: 'Signed off; the baffle stays open.',
        createdAt: expect.any(String),
      },
    ]);

    const imported = notebookWithVersionResponseSchema.parse(
      (await fx.owner.agent.post(`/api/teams/${personalTeamId}/designs/import`).send(res.body).expect(201)).body,
    );
    for (const n of [1, 2]) {
      const original = await review(fx.owner, design.id, n);
      const copy = await review(fx.owner, imported.design.id, n);
      expect(copy.threads.length).toBeGreaterThan(0);
      expect(readable(copy)).toEqual(readable(original));
      // Names as written, no accounts: nobody here wrote these.
      for (const thread of copy.threads) for (const remark of thread.remarks) expect(remark.author).toBeNull();
      for (const decision of copy.decisions) expect(decision.reviewer).toBeNull();
    }
    // Review requests stay behind, so the copy's review state comes from its decisions only.
    expect((await review(fx.owner, imported.design.id, 2)).state).toBe('signed-off-with-remarks');

    // Exported again, the copy says what the original said.
    const again = await exportFile(imported.design.id);
    expect(again.review).toEqual(file.review);
  });

  it('writes the people’s current names, or the name kept with the remark once the account is gone', async () => {
    const leaver = await signUp(fx.ctx.app, 'Leaver');
    await fx.addMember(fx.teamId, leaver, 'reviewer');
    const { design } = await createNotebook(fx, 'Left behind');
    await startThread(leaver, design.id, 1, { kind: 'version' }, 'One thing before I go.');
    tick();
    await leaver.agent
      .post(`/api/designs/${design.id}/versions/1/decisions`)
      .send({ outcome: 'revise', summary: 'Revise the grating choice.' })
      .expect(201);
    const { db } = fx.ctx.database;
    await db.update(users).set({ displayName: 'Renamed Leaver' }).where(eq(users.id, leaver.user.id));
    const renamed = await exportFile(design.id);
    expect(renamed.review?.threads[0]).toMatchObject({ createdByName: 'Renamed Leaver', remarks: [{ authorName: 'Renamed Leaver' }] });
    expect(renamed.review?.decisions[0]?.reviewerName).toBe('Renamed Leaver');

    await db.delete(users).where(eq(users.id, leaver.user.id));
    const gone = await exportFile(design.id);
    expect(gone.review?.threads[0]).toMatchObject({
      createdByName: leaver.user.displayName,
      remarks: [{ authorName: leaver.user.displayName, body: 'One thing before I go.' }],
    });
    expect(gone.review?.decisions[0]?.reviewerName).toBe(leaver.user.displayName);
  });

  it('still imports a format 1 file, which carries no review', async () => {
    const file: NotebookFileInput = {
      kind: 'blazebook-notebook',
      formatVersion: 1,
      title: 'Old format',
      versions: [{ number: 1, message: 'Start', params: exampleDesign, createdAt: '2025-11-02T10:00:00Z' }],
    };
    const res = await fx.owner.agent.post(`/api/teams/${fx.teamId}/designs/import`).send(file).expect(201);
    const { design } = notebookWithVersionResponseSchema.parse(res.body);
    const answer = await review(fx.owner, design.id, 1);
    expect(answer).toMatchObject({ state: 'unreviewed', threads: [], decisions: [] });
    expect((await exportFile(design.id)).review).toEqual({ threads: [], decisions: [] });
  });

  it('imports a hand-written format 2 review, with resolver and pinned value taken from the file and its version', async () => {
    const file: NotebookFileInput = {
      kind: 'blazebook-notebook',
      formatVersion: 2,
      title: 'Hand written',
      versions: [
        { number: 1, message: 'Start', params: exampleDesign, createdAt: '2025-11-02T10:00:00Z' },
        {
          number: 2,
          message: 'Narrower',
          params: designWith({ slits: { exitWidthUm: 40 } }),
          parentNumber: 1,
          createdAt: '2025-11-03T10:00:00Z',
        },
      ],
      review: {
        threads: [
          {
            version: 1,
            pin: { kind: 'field', path: 'slits.exitWidthUm' },
            // Informative only: the version's own value is kept.
            pinnedValue: 999,
            status: 'resolved',
            createdByName: 'Ines Varga',
            createdAt: '2025-11-02T11:00:00Z',
            resolvedByName: 'Tomas Reyes',
            resolvedAt: '2025-11-03T11:00:00Z',
            remarks: [{ authorName: 'Ines Varga', body: 'Narrow this.', createdAt: '2025-11-02T11:00:00Z' }],
          },
        ],
      },
    };
    const res = await fx.owner.agent.post(`/api/teams/${fx.teamId}/designs/import`).send(file).expect(201);
    const { design } = notebookWithVersionResponseSchema.parse(res.body);
    const [thread] = (await review(fx.owner, design.id, 1)).threads;
    expect(thread).toMatchObject({
      version: 1,
      status: 'resolved',
      resolvedAt: '2025-11-03T11:00:00.000Z',
      remarks: [{ authorName: 'Ines Varga', body: 'Narrow this.', author: null }],
    });
    const [exported] = (await exportFile(design.id)).review!.threads;
    expect(exported).toMatchObject({
      pinnedValue: exampleDesign.slits.exitWidthUm,
      resolvedByName: 'Tomas Reyes',
      statusEvents: [{ status: 'resolved', byName: 'Tomas Reyes', at: '2025-11-03T11:00:00.000Z' }],
    });
  });

  it('refuses bad review entries, naming each by its path, and writes nothing', async () => {
    const before = await reviewRowCounts();
    const remark = { authorName: 'Ines Varga', body: 'Fine.', createdAt: '2025-11-02T11:00:00Z' };
    const thread = {
      version: 1,
      pin: { kind: 'version' },
      status: 'open',
      createdByName: 'Ines Varga',
      createdAt: '2025-11-02T11:00:00Z',
      remarks: [remark],
    };
    const file = {
      kind: 'blazebook-notebook',
      formatVersion: 2,
      title: 'Bad review',
      versions: [{ number: 1, message: 'Start', params: exampleDesign, createdAt: '2025-11-02T10:00:00Z' }],
      review: {
        threads: [
          thread,
          { ...thread, version: 2 },
          { ...thread, pin: { kind: 'field', path: 'slits.nope' } },
          { ...thread, remarks: [{ ...remark, body: 'x'.repeat(10_001) }, { ...remark, mentions: ['u1'] }] },
          { ...thread, status: 'resolved' },
          { ...thread, remarks: [{ ...remark, body: null }] },
          { ...thread, remarks: [] },
          {
            ...thread,
            remarks: [
              { ...remark, body: null, removedAt: '2025-11-02T12:00:00Z', earlierBodies: [{ body: 'Gone', replacedAt: '2025-11-02T11:30:00Z' }] },
              { ...remark, earlierBodies: [{ body: 'Before', replacedAt: '2025-11-02T11:30:00Z' }] },
            ],
          },
        ],
        decisions: [
          { version: 3, reviewerName: 'Tomas Reyes', outcome: 'approved', summary: 'Fine.', createdAt: '2025-11-02T12:00:00Z' },
        ],
        requests: [],
      },
    };
    const res = await fx.owner.agent.post(`/api/teams/${fx.teamId}/designs/import`).send(file).expect(400);
    expect(res.body.error.fields).toEqual({
      review: "has an unknown field 'requests' (check the spelling)",
      'review.threads.1.version': 'must be one of the versions in the file',
      'review.threads.2.pin.path': 'must name a design field such as slits.exitWidthUm',
      'review.threads.3.remarks.0.body': 'must be at most 10,000 characters',
      'review.threads.3.remarks.1': "has an unknown field 'mentions' (check the spelling)",
      'review.threads.4.resolvedAt': 'is required for a resolved thread',
      'review.threads.5.remarks.0.removedAt': 'is required when the body is null (a removed remark)',
      'review.threads.6.remarks': 'must hold at least one remark',
      'review.threads.7.remarks.0.earlierBodies': 'must be empty for a removed remark',
      'review.threads.7.remarks.1.editedAt': 'is required when earlier texts are kept',
      'review.decisions.0.version': 'must be one of the versions in the file',
      'review.decisions.0.outcome': 'must be signed-off, signed-off-with-remarks or revise',
    });
    expect(await reviewRowCounts()).toEqual(before);
  });

  it('refuses more threads than a file may hold, and review data in a format 1 file', async () => {
    const base = {
      kind: 'blazebook-notebook',
      title: 'Too much',
      versions: [{ number: 1, message: 'Start', params: exampleDesign, createdAt: '2025-11-02T10:00:00Z' }],
    };
    const thread = {
      version: 1,
      pin: { kind: 'version' },
      status: 'open',
      createdByName: 'Ines Varga',
      createdAt: '2025-11-02T11:00:00Z',
      remarks: [{ authorName: 'Ines Varga', body: 'a', createdAt: '2025-11-02T11:00:00Z' }],
    };
    const tooMany = await fx.owner.agent
      .post(`/api/teams/${fx.teamId}/designs/import`)
      .send({ ...base, formatVersion: 2, review: { threads: Array.from({ length: 2001 }, () => thread) } })
      .expect(400);
    expect(tooMany.body.error.fields).toEqual({ 'review.threads': 'must hold at most 2000 threads' });
    const old = await fx.owner.agent
      .post(`/api/teams/${fx.teamId}/designs/import`)
      .send({ ...base, formatVersion: 1, review: { threads: [thread] } })
      .expect(400);
    expect(old.body.error.fields).toEqual({ review: 'is not part of format 1 (use formatVersion 2)' });
  });
});
