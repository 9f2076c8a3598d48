import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { outboxResponseSchema } from '../../../shared/outbox';
import { browserAgent, testOrigin } from '../../support/test-app';
import { createNotebook, createNotebookFixture, type NotebookFixture } from '../notebooks/fixture';

describe('a remark that mentions the owner, through the API', () => {
  let fx: NotebookFixture;
  beforeAll(async () => {
    fx = await createNotebookFixture({ outbox: true });
  }, 120_000);
  afterAll(() => fx?.ctx.close());

  it('puts one "mentioned" item in the owner’s inbox and one e-mail with the thread link in the outbox', async () => {
    const { design } = await createNotebook(fx, 'Teaching monochromator');
    const started = await fx.reviewer.agent
      .post(`/api/designs/${design.id}/versions/1/threads`)
      .send({
        pin: { kind: 'field', path: 'slits.exitWidthUm' },
        body: `@${fx.owner.user.displayName} the exit slit is too wide for the 0.2 nm requirement.`,
        mentions: [fx.owner.user.id],
      })
      .expect(201);
    const threadId: string = started.body.thread.id;

    const inbox = (await fx.owner.agent.get('/api/inbox').expect(200)).body;
    expect(inbox.unread).toBe(1);
    expect(inbox.items).toMatchObject([
      { kind: 'mentioned', designId: design.id, designTitle: 'Teaching monochromator', version: 1, threadId, actor: { id: fx.reviewer.user.id } },
    ]);
    // The one who wrote it hears nothing of their own remark.
    expect((await fx.reviewer.agent.get('/api/inbox').expect(200)).body.items).toEqual([]);

    const { messages } = outboxResponseSchema.parse((await browserAgent(fx.ctx.app).get('/api/dev/outbox').expect(200)).body);
    const reviewMail = messages.filter((m) => m.text.includes('/notebooks/'));
    expect(reviewMail.map((m) => m.to)).toEqual([fx.owner.user.email]);
    expect(reviewMail[0]!.subject).toBe(`${fx.reviewer.user.displayName} mentioned you in a remark on “Teaching monochromator” v1`);
    expect(reviewMail[0]!.text).toContain(`${testOrigin}/notebooks/${design.id}/v/1?thread=${threadId}`);
  });
});
