import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createNotebook, createNotebookFixture, designWith, saveVersion, type NotebookFixture } from '../notebooks/fixture';
import { exitSlit, getReview, getThread, setStatus, startThread } from './support';

let fx: NotebookFixture;
beforeAll(async () => {
  fx = await createNotebookFixture();
}, 60_000);
afterAll(() => fx?.ctx.close());

const slit = (exitWidthUm: number, entranceWidthUm = 100) => designWith({ slits: { exitWidthUm, entranceWidthUm } });

describe('threads that follow the design to its next versions', () => {
  it('reads "still applies" while the pinned field is unchanged and "field changed since" with was and now once it changes', async () => {
    const { design } = await createNotebook(fx, 'Carried', slit(100));
    const thread = await startThread(fx.reviewer, design.id, 1);
    // v2 changes another field only.
    await saveVersion(fx, design.id, 1, slit(100, 80), 'Entrance narrower').expect(201);
    // v3 changes the pinned field.
    await saveVersion(fx, design.id, 2, slit(60, 80), 'Exit slit to 60 µm').expect(201);

    const v2 = await getReview(fx.viewer, design.id, 2);
    expect(v2.threads.map((t) => [t.id, t.carry])).toEqual([[thread.id, { state: 'still-applies', since: 1 }]]);
    const v3 = await getReview(fx.viewer, design.id, 3);
    expect(v3.threads.map((t) => [t.id, t.carry])).toEqual([
      [thread.id, { state: 'field-changed', since: 1, was: 100, now: 60 }],
    ]);
    expect(v3.threads[0]!.pinnedValue).toBe(100);
    // On its own version, and through its own route, it is simply here.
    expect((await getReview(fx.viewer, design.id, 1)).threads[0]!.carry).toEqual({ state: 'here' });
    expect((await getThread(fx.viewer, thread.id)).carry).toEqual({ state: 'here' });
  });

  it('says which fields changed for a thread pinned to a result, a region or the whole version', async () => {
    const { design } = await createNotebook(fx, 'Design changed', slit(100));
    const result = await startThread(fx.reviewer, design.id, 1, { kind: 'result', result: 'bandpass', wavelengthNm: 500 });
    const region = await startThread(fx.reviewer, design.id, 1, { kind: 'region', figure: 'dispersion', x: 0.5, y: 0.5 });
    const whole = await startThread(fx.reviewer, design.id, 1, { kind: 'version' });
    await saveVersion(fx, design.id, 1, slit(100), 'Notes only').expect(201);
    await saveVersion(fx, design.id, 2, slit(60, 90), 'Both slits').expect(201);

    const v2 = await getReview(fx.owner, design.id, 2);
    expect(v2.threads.map((t) => t.carry)).toEqual([
      { state: 'still-applies', since: 1 },
      { state: 'still-applies', since: 1 },
      { state: 'still-applies', since: 1 },
    ]);
    const v3 = await getReview(fx.owner, design.id, 3);
    expect(v3.threads.map((t) => [t.id, t.carry])).toEqual(
      [result, region, whole].map((t) => [
        t.id,
        { state: 'design-changed', since: 1, paths: ['slits.entranceWidthUm', 'slits.exitWidthUm'] },
      ]),
    );
  });

  it('carries only open threads, never resolved ones, and never shows a later thread on an earlier version', async () => {
    const { design } = await createNotebook(fx, 'Only open', slit(100));
    const open = await startThread(fx.reviewer, design.id, 1, exitSlit, 'Still open');
    const resolved = await startThread(fx.reviewer, design.id, 1, { kind: 'version' }, 'Soon resolved');
    await setStatus(fx.owner, resolved.id, 'resolved');
    await saveVersion(fx, design.id, 1, slit(80), 'Narrower').expect(201);
    const later = await startThread(fx.reviewer, design.id, 2, { kind: 'version' }, 'On v2');

    const v1 = await getReview(fx.viewer, design.id, 1);
    expect(v1.threads.map((t) => t.id)).toEqual([open.id, resolved.id]);
    expect(v1.threads.map((t) => t.status)).toEqual(['open', 'resolved']);
    const v2 = await getReview(fx.viewer, design.id, 2);
    expect(v2.threads.map((t) => [t.id, t.carry.state])).toEqual([
      [open.id, 'field-changed'],
      [later.id, 'here'],
    ]);

    // Reopened, it is carried again; resolved on v2's page, it is gone from there but stays on v1.
    await setStatus(fx.reviewer, resolved.id, 'open');
    expect((await getReview(fx.viewer, design.id, 2)).threads.map((t) => t.id)).toEqual([open.id, resolved.id, later.id]);
    await setStatus(fx.reviewer, open.id, 'resolved');
    expect((await getReview(fx.viewer, design.id, 2)).threads.map((t) => t.id)).toEqual([resolved.id, later.id]);
    expect((await getReview(fx.viewer, design.id, 1)).threads.map((t) => t.id)).toEqual([open.id, resolved.id]);
  });
});
