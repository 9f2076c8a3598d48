import request from 'supertest';
import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest';
import { inboxItems, mailSettings } from '../../../db/schema';
import { defaultMailSettings } from '../../../shared/reviews';
import { createTeamsRepository } from '../../../server/teams/repository';
import { browserAgent } from '../../support/test-app';
import type { Person } from '../notebooks/fixture';
import { createInboxFixture, type InboxFixture } from './fixture';

describe('the inbox routes', () => {
  let fx: InboxFixture;
  let threadId: string;
  beforeAll(async () => {
    fx = await createInboxFixture();
    threadId = await fx.thread(fx.reviewer);
  }, 120_000);
  afterAll(() => fx?.ctx.close());
  beforeEach(async () => {
    await fx.ctx.database.db.delete(inboxItems);
    await fx.ctx.database.db.delete(mailSettings);
  });

  /** One remark per body, each mentioning `who`, one second apart so the order is plain. */
  async function mention(who: Person, ...bodies: string[]) {
    for (const body of bodies) {
      fx.ctx.clock.advance(1000);
      await fx.inbox.notifier.notify({
        designId: fx.design.id,
        version: 1,
        kind: 'remark-added',
        threadId,
        actor: fx.actor(fx.reviewer),
        body,
        mentions: [who.user.id],
        versionAuthorId: null,
        threadStarterId: null,
      });
    }
  }

  it('lists newest first with the unread count, filters unread and limits', async () => {
    await mention(fx.owner, 'first', 'second', 'third');
    const all = await fx.inboxOf(fx.owner);
    expect(all.items.map((item) => item.excerpt)).toEqual(['third', 'second', 'first']);
    expect(all.unread).toBe(3);
    expect(all.items[0]).toMatchObject({ kind: 'mentioned', designTitle: 'Teaching monochromator', readAt: null, actor: { id: fx.reviewer.user.id } });

    const two = await fx.inboxOf(fx.owner, '?limit=2');
    expect(two.items.map((item) => item.excerpt)).toEqual(['third', 'second']);
    expect(two.unread).toBe(3);

    const second = all.items.find((item) => item.excerpt === 'second')!;
    await fx.owner.agent.post('/api/inbox/read').send({ ids: [second.id] }).expect(200, { unread: 2 });
    const unread = await fx.inboxOf(fx.owner, '?unread=only');
    expect(unread.items.map((item) => item.excerpt)).toEqual(['third', 'first']);
    const again = await fx.inboxOf(fx.owner, '?unread=all');
    expect(again.items.find((item) => item.id === second.id)!.readAt).toBe(fx.ctx.clock.now().toISOString());
  });

  it('refuses a bad filter or limit, naming the field', async () => {
    for (const [query, field] of [
      ['?unread=some', 'unread'],
      ['?limit=0', 'limit'],
      ['?limit=101', 'limit'],
      ['?limit=ten', 'limit'],
    ] as const) {
      const res = await fx.owner.agent.get(`/api/inbox${query}`).expect(400);
      expect(Object.keys(res.body.error.fields), query).toEqual([field]);
    }
  });

  it('counts unread and marks read only the caller’s own items; {all:true} marks all', async () => {
    await mention(fx.owner, 'a', 'b');
    await mention(fx.viewer, 'c');
    await fx.owner.agent.get('/api/inbox/unread-count').expect(200, { unread: 2 });
    const viewerItem = (await fx.inboxOf(fx.viewer)).items[0]!;

    // Someone else's id changes nothing, for them or for the caller.
    await fx.owner.agent.post('/api/inbox/read').send({ ids: [viewerItem.id] }).expect(200, { unread: 2 });
    await fx.viewer.agent.get('/api/inbox/unread-count').expect(200, { unread: 1 });
    expect((await fx.inboxOf(fx.viewer)).items[0]!.readAt).toBeNull();

    await fx.owner.agent.post('/api/inbox/read').send({ all: true }).expect(200, { unread: 0 });
    expect((await fx.inboxOf(fx.owner)).items.every((item) => item.readAt !== null)).toBe(true);
    await fx.viewer.agent.get('/api/inbox/unread-count').expect(200, { unread: 1 });
  });

  it('refuses a mark-read body that is neither ids nor all', async () => {
    for (const body of [{}, { ids: [] }, { all: false }, { ids: 'x' }, { ids: ['a'], all: true }]) {
      const res = await fx.owner.agent.post('/api/inbox/read').send(body);
      expect(res.status, JSON.stringify(body)).toBe(400);
    }
  });

  it('hides items of a team the caller left, in the list and the count', async () => {
    await mention(fx.viewer, 'before leaving');
    await fx.viewer.agent.get('/api/inbox/unread-count').expect(200, { unread: 1 });
    const teams = createTeamsRepository(fx.ctx.database.db);
    await teams.removeMember(fx.teamId, fx.viewer.user.id);
    try {
      expect(await fx.inboxOf(fx.viewer)).toEqual({ items: [], unread: 0 });
      await fx.viewer.agent.get('/api/inbox/unread-count').expect(200, { unread: 0 });
    } finally {
      await fx.addMember(fx.teamId, fx.viewer, 'viewer');
    }
    await fx.viewer.agent.get('/api/inbox/unread-count').expect(200, { unread: 1 });
  });

  it('answers the default mail settings when none are stored, and stores what is sent', async () => {
    await fx.owner.agent.get('/api/account/mail-settings').expect(200, { settings: defaultMailSettings });
    const settings = { reviewRequests: false, mentions: true, threadsOnMyDesigns: false, decisionsOnMyVersions: true };
    await fx.owner.agent.put('/api/account/mail-settings').send(settings).expect(200, { settings });
    await fx.owner.agent.get('/api/account/mail-settings').expect(200, { settings });
    const changed = { ...settings, mentions: false };
    await fx.owner.agent.put('/api/account/mail-settings').send(changed).expect(200, { settings: changed });
    await fx.owner.agent.get('/api/account/mail-settings').expect(200, { settings: changed });
    // One person's settings are theirs alone.
    await fx.viewer.agent.get('/api/account/mail-settings').expect(200, { settings: defaultMailSettings });
  });

  it('refuses bad mail settings with a 400 naming the field', async () => {
    const good = { ...defaultMailSettings };
    for (const [body, field] of [
      [{ ...good, mentions: 'no' }, 'mentions'],
      [{ ...good, reviewRequests: 1 }, 'reviewRequests'],
      [{ reviewRequests: true, mentions: true, threadsOnMyDesigns: true }, 'decisionsOnMyVersions'],
    ] as const) {
      const res = await fx.owner.agent.put('/api/account/mail-settings').send(body).expect(400);
      expect(res.body.error.fields, field).toEqual({ [field]: 'must be true or false' });
    }
    const unknown = await fx.owner.agent.put('/api/account/mail-settings').send({ ...good, everything: false }).expect(400);
    expect(JSON.stringify(unknown.body.error.fields)).toContain('everything');
    await fx.owner.agent.get('/api/account/mail-settings').expect(200, { settings: defaultMailSettings });
  });

  it('answers 401 to a signed-out caller on every inbox route', async () => {
    const anonymous = browserAgent(fx.ctx.app);
    await anonymous.get('/api/inbox').expect(401);
    await anonymous.get('/api/inbox/unread-count').expect(401);
    await anonymous.post('/api/inbox/read').send({ all: true }).expect(401);
    await anonymous.get('/api/account/mail-settings').expect(401);
    await anonymous.put('/api/account/mail-settings').send(defaultMailSettings).expect(401);
    await request(fx.ctx.app).get('/api/inbox').expect(401);
  });
});
