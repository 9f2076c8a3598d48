import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { User } from '../../../shared/auth';
import { createReviews } from '../../../server/reviews/index';
import type { ReviewEvent } from '../../../server/reviews/events';
import { createNotebook, createNotebookFixture, type NotebookFixture, type Person } from '../notebooks/fixture';

/**
 * What the review service tells the inbox after each committed write (server/reviews/events.ts),
 * seen through a notifier that records, and what happens when telling fails.
 */
let fx: NotebookFixture;
const events: ReviewEvent[] = [];
const logged: unknown[] = [];
const forgotten: string[] = [];
let failing = false;
let reviews: ReturnType<typeof createReviews>['service'];

beforeAll(async () => {
  fx = await createNotebookFixture();
  reviews = createReviews({
    db: fx.ctx.database.db,
    clock: fx.ctx.clock,
    notifier: {
      notify: async (event) => {
        if (failing) throw new Error('The inbox is down');
        events.push(event);
      },
    },
    lists: { forgetTeam: (teamId) => forgotten.push(teamId) },
    log: (error) => logged.push(error),
  }).service;
}, 60_000);
afterAll(() => fx?.ctx.close());

const user = (person: Person): User => ({ ...person.user, emailVerified: true });
const actor = (person: Person) => ({ id: person.user.id, displayName: person.user.displayName });

describe('events told to the inbox', () => {
  it('names the version’s author, the thread’s starter, the mentions and only the newly mentioned on an edit', async () => {
    const { design } = await createNotebook(fx, 'Events');
    events.length = 0;
    const thread = await reviews.startThread(user(fx.reviewer), design.id, 1, {
      pin: { kind: 'field', path: 'slits.exitWidthUm' },
      body: 'Too wide, @viewer?',
      mentions: [fx.viewer.user.id],
    });
    await reviews.reply(user(fx.owner), thread.id, { body: 'Will narrow it.', mentions: [] });
    await reviews.editRemark(user(fx.reviewer), thread.remarks[0]!.id, {
      body: 'Too wide, @viewer and @owner?',
      mentions: [fx.viewer.user.id, fx.owner.user.id],
    });
    await reviews.requestReview(user(fx.owner), design.id, 1, { reviewerIds: [fx.reviewer.user.id], dueDate: '2026-04-01', note: 'Slit' });
    await reviews.decide(user(fx.reviewer), design.id, 1, { outcome: 'revise', summary: 'Narrow the slit.' });
    // Resolving tells nobody.
    await reviews.setThreadStatus(user(fx.owner), thread.id, 'resolved');

    const common = { designId: design.id, version: 1 };
    expect(events).toEqual([
      {
        kind: 'thread-started',
        ...common,
        threadId: thread.id,
        actor: actor(fx.reviewer),
        body: 'Too wide, @viewer?',
        mentions: [fx.viewer.user.id],
        versionAuthorId: fx.owner.user.id,
      },
      {
        kind: 'remark-added',
        ...common,
        threadId: thread.id,
        actor: actor(fx.owner),
        body: 'Will narrow it.',
        mentions: [],
        versionAuthorId: fx.owner.user.id,
        threadStarterId: fx.reviewer.user.id,
      },
      {
        kind: 'remark-edited',
        ...common,
        threadId: thread.id,
        actor: actor(fx.reviewer),
        body: 'Too wide, @viewer and @owner?',
        newMentions: [fx.owner.user.id],
      },
      {
        kind: 'review-requested',
        ...common,
        actor: actor(fx.owner),
        reviewerIds: [fx.reviewer.user.id],
        dueDate: '2026-04-01',
        note: 'Slit',
      },
      {
        kind: 'decision',
        ...common,
        actor: actor(fx.reviewer),
        outcome: 'revise',
        summary: 'Narrow the slit.',
        versionAuthorId: fx.owner.user.id,
      },
    ]);
    // The request and the decision changed the design's review state: the list pages are forgotten.
    expect(forgotten).toEqual([fx.teamId, fx.teamId]);
  });

  it('tells nothing of a refused write', async () => {
    const { design } = await createNotebook(fx, 'Refused');
    events.length = 0;
    await expect(
      reviews.startThread(user(fx.reviewer), design.id, 1, { pin: { kind: 'version' }, body: 'x', mentions: [fx.outsider.user.id] }),
    ).rejects.toMatchObject({ status: 400 });
    await expect(reviews.decide(user(fx.owner), design.id, 1, { outcome: 'signed-off', summary: 'Mine' })).rejects.toMatchObject({ status: 403 });
    expect(events).toEqual([]);
  });

  it('logs a failure to tell and still answers the write, which stays written', async () => {
    const { design } = await createNotebook(fx, 'Inbox down');
    failing = true;
    try {
      const thread = await reviews.startThread(user(fx.reviewer), design.id, 1, { pin: { kind: 'version' }, body: 'Still saved', mentions: [] });
      const decision = await reviews.decide(user(fx.reviewer), design.id, 1, { outcome: 'signed-off', summary: 'Fine' });
      expect(decision.outcome).toBe('signed-off');
      expect(logged).toEqual([new Error('The inbox is down'), new Error('The inbox is down')]);
      const review = await reviews.get(user(fx.viewer), design.id, 1);
      expect(review.threads.map((t) => t.id)).toEqual([thread.id]);
      expect(review.state).toBe('signed-off');
    } finally {
      failing = false;
    }
  });
});
