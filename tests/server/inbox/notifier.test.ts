import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest';
import { inboxItems, mailSettings } from '../../../db/schema';
import { createTeamsRepository } from '../../../server/teams/repository';
import { testOrigin } from '../../support/test-app';
import type { Person } from '../notebooks/fixture';
import { createInboxFixture, type InboxFixture } from './fixture';

describe('the review notifier', () => {
  let fx: InboxFixture;
  let threadId: string;
  beforeAll(async () => {
    fx = await createInboxFixture();
    threadId = await fx.thread(fx.reviewer);
  }, 120_000);
  afterAll(() => fx?.ctx.close());
  beforeEach(async () => {
    // Each case starts from an empty inbox, no e-mails, all settings on and a working mailer.
    await fx.ctx.database.db.delete(inboxItems);
    await fx.ctx.database.db.delete(mailSettings);
    fx.sent.length = 0;
    fx.logged.length = 0;
    fx.mailer.fail = false;
  });

  const base = () => ({ designId: fx.design.id, version: 1 });
  const kindsOf = async (person: Person) => (await fx.inboxOf(person)).items.map((item) => item.kind);

  it('tells the version’s author and each mentioned member of a new thread, and sends each one e-mail', async () => {
    await fx.inbox.notifier.notify({
      ...base(),
      kind: 'thread-started',
      threadId,
      actor: fx.actor(fx.reviewer),
      body: 'The exit slit is too wide for the 0.2 nm requirement.',
      mentions: [fx.viewer.user.id],
      versionAuthorId: fx.owner.user.id,
    });
    expect(await kindsOf(fx.owner)).toEqual(['thread-on-my-design']);
    expect(await kindsOf(fx.viewer)).toEqual(['mentioned']);
    expect(await kindsOf(fx.reviewer)).toEqual([]);
    expect(fx.sent.map((m) => m.to).sort()).toEqual([fx.owner.user.email, fx.viewer.user.email].sort());
    expect(fx.mailTo(fx.owner)[0]!.subject).toBe(`${fx.reviewer.user.displayName} pinned a remark to “Exit slit width” on “Teaching monochromator” v1`);
    expect(fx.mailTo(fx.viewer)[0]!.subject).toBe(`${fx.reviewer.user.displayName} mentioned you in a remark on “Teaching monochromator” v1`);
  });

  it('tells the author, the thread’s starter and the mentioned of a reply, but never the one who wrote it', async () => {
    await fx.inbox.notifier.notify({
      ...base(),
      kind: 'remark-added',
      threadId,
      actor: fx.actor(fx.owner),
      body: 'Narrowed it in the next version; @Viewer please check the throughput.',
      mentions: [fx.viewer.user.id, fx.owner.user.id],
      versionAuthorId: fx.owner.user.id,
      threadStarterId: fx.reviewer.user.id,
    });
    expect(await kindsOf(fx.owner)).toEqual([]);
    expect(await kindsOf(fx.reviewer)).toEqual(['remark-on-my-thread']);
    expect(await kindsOf(fx.viewer)).toEqual(['mentioned']);
    expect(fx.mailTo(fx.owner)).toEqual([]);
    expect(fx.mailTo(fx.reviewer)[0]!.subject).toBe(`${fx.owner.user.displayName} replied to your thread on “Teaching monochromator” v1`);
  });

  it('tells only the newly mentioned of an edit', async () => {
    await fx.inbox.notifier.notify({
      ...base(),
      kind: 'remark-edited',
      threadId,
      actor: fx.actor(fx.reviewer),
      body: 'Also asking @Viewer.',
      newMentions: [fx.viewer.user.id],
    });
    expect(await kindsOf(fx.owner)).toEqual([]);
    expect(await kindsOf(fx.viewer)).toEqual(['mentioned']);
    expect(fx.sent.map((m) => m.to)).toEqual([fx.viewer.user.email]);
  });

  it('tells each requested reviewer, with the due date as the excerpt and a link to the version’s review', async () => {
    await fx.inbox.notifier.notify({
      ...base(),
      kind: 'review-requested',
      actor: fx.actor(fx.owner),
      reviewerIds: [fx.reviewer.user.id, fx.viewer.user.id],
      dueDate: '2026-12-24',
      note: 'Mainly the slits.',
    });
    for (const person of [fx.reviewer, fx.viewer]) {
      const { items } = await fx.inboxOf(person);
      expect(items).toMatchObject([{ kind: 'review-requested', excerpt: 'Due 24 Dec 2026 — Mainly the slits.', threadId: null }]);
      const [mail] = fx.mailTo(person);
      expect(mail!.subject).toBe(`${fx.owner.user.displayName} asks you to review “Teaching monochromator” v1`);
      expect(mail!.text).toContain(`${testOrigin}/notebooks/${fx.design.id}/v/1?review=1`);
    }
    expect(await kindsOf(fx.owner)).toEqual([]);
  });

  it('tells the version’s author of a decision, excerpt "<label>: <summary>"', async () => {
    await fx.inbox.notifier.notify({
      ...base(),
      kind: 'decision',
      actor: fx.actor(fx.reviewer),
      outcome: 'signed-off-with-remarks',
      summary: 'Fine for the teaching lab;\n\n  keep the **slit** note.',
      versionAuthorId: fx.owner.user.id,
    });
    const { items } = await fx.inboxOf(fx.owner);
    expect(items).toMatchObject([{ kind: 'decision-on-my-version', excerpt: 'Signed off with remarks: Fine for the teaching lab; keep the slit note.' }]);
    expect(fx.mailTo(fx.owner)[0]!.subject).toBe(`${fx.reviewer.user.displayName} signed off “Teaching monochromator” v1 with remarks`);
    expect(await kindsOf(fx.reviewer)).toEqual([]);
  });

  it('gives a person concerned twice by one event one item and one e-mail, and a mention wins', async () => {
    await fx.inbox.notifier.notify({
      ...base(),
      kind: 'remark-added',
      threadId,
      actor: fx.actor(fx.viewer),
      body: '@Owner is this the slit you meant?',
      mentions: [fx.owner.user.id, fx.owner.user.id],
      versionAuthorId: fx.owner.user.id,
      threadStarterId: fx.owner.user.id,
    });
    expect(await kindsOf(fx.owner)).toEqual(['mentioned']);
    expect(fx.mailTo(fx.owner)).toHaveLength(1);
    expect(fx.mailTo(fx.owner)[0]!.subject).toContain('mentioned you');
  });

  it('skips people who are no longer members of the design’s team', async () => {
    const teams = createTeamsRepository(fx.ctx.database.db);
    await teams.removeMember(fx.teamId, fx.viewer.user.id);
    try {
      await fx.inbox.notifier.notify({
        ...base(),
        kind: 'thread-started',
        threadId,
        actor: fx.actor(fx.reviewer),
        body: 'Who chose this grating?',
        mentions: [fx.viewer.user.id, fx.outsider.user.id],
        versionAuthorId: fx.viewer.user.id,
      });
      expect(await fx.ctx.database.db.select().from(inboxItems)).toEqual([]);
      expect(fx.sent).toEqual([]);
    } finally {
      await fx.addMember(fx.teamId, fx.viewer, 'viewer');
    }
  });

  it('keeps the inbox item but sends no e-mail when that kind is turned off', async () => {
    await fx.owner.agent
      .put('/api/account/mail-settings')
      .send({ reviewRequests: true, mentions: true, threadsOnMyDesigns: false, decisionsOnMyVersions: true })
      .expect(200);
    await fx.inbox.notifier.notify({
      ...base(),
      kind: 'thread-started',
      threadId,
      actor: fx.actor(fx.reviewer),
      body: 'Entrance slit first.',
      mentions: [fx.viewer.user.id],
      versionAuthorId: fx.owner.user.id,
    });
    expect(await kindsOf(fx.owner)).toEqual(['thread-on-my-design']);
    expect(fx.mailTo(fx.owner)).toEqual([]);
    expect(fx.mailTo(fx.viewer)).toHaveLength(1);

    // A mention is its own kind: still mailed while threads on my designs are off.
    await fx.inbox.notifier.notify({
      ...base(),
      kind: 'thread-started',
      threadId,
      actor: fx.actor(fx.reviewer),
      body: '@Owner see above.',
      mentions: [fx.owner.user.id],
      versionAuthorId: fx.owner.user.id,
    });
    expect(fx.mailTo(fx.owner)).toHaveLength(1);
  });

  it('links each e-mail straight to the thread on the version’s notebook page', async () => {
    await fx.inbox.notifier.notify({
      ...base(),
      kind: 'thread-started',
      threadId,
      actor: fx.actor(fx.reviewer),
      body: 'Check the slit.',
      mentions: [],
      versionAuthorId: fx.owner.user.id,
    });
    const [mail] = fx.mailTo(fx.owner);
    const link = `${testOrigin}/notebooks/${fx.design.id}/v/1?thread=${threadId}`;
    expect(mail!.text).toContain(`Open the thread: ${link}\n`);
    expect(mail!.html).toContain(`<a href="${link}"`);
    const { items } = await fx.inboxOf(fx.owner);
    expect(items[0]).toMatchObject({ threadId, designTitle: 'Teaching monochromator', actor: { id: fx.reviewer.user.id } });
  });

  it('keeps a remark holding markup as text in the HTML part', async () => {
    const body = 'Look <script>alert("x")</script> and <img src=x onerror="alert(1)"> here';
    await fx.inbox.notifier.notify({
      ...base(),
      kind: 'thread-started',
      threadId,
      actor: { id: fx.reviewer.user.id, displayName: '<b>Rev</b>' },
      body,
      mentions: [],
      versionAuthorId: fx.owner.user.id,
    });
    const [mail] = fx.mailTo(fx.owner);
    expect(mail!.html).not.toMatch(/<script|<img|<b>/i);
    expect(mail!.html).toContain('&lt;script&gt;alert(&quot;x&quot;)&lt;/script&gt;');
    expect(mail!.html).toContain('&lt;img src=x onerror=&quot;alert(1)&quot;&gt;');
    expect(mail!.html).toContain('&lt;b&gt;Rev&lt;/b&gt;');
    expect(mail!.text).toContain(body);
  });

  it('writes a one-line excerpt of at most about 140 characters, whitespace collapsed', async () => {
    const body = `First   line\n\n${'word '.repeat(60)}`;
    await fx.inbox.notifier.notify({
      ...base(),
      kind: 'thread-started',
      threadId,
      actor: fx.actor(fx.reviewer),
      body,
      mentions: [],
      versionAuthorId: fx.owner.user.id,
    });
    const [item] = (await fx.inboxOf(fx.owner)).items;
    expect(item!.excerpt).toMatch(/^First line word word .*word…$/);
    expect(item!.excerpt.length).toBeLessThanOrEqual(140);
    expect(item!.excerpt).not.toMatch(/\s{2}|\n/);
  });

  it('logs a mailer failure without throwing, and the inbox item is still there', async () => {
    fx.mailer.fail = true;
    await expect(
      fx.inbox.notifier.notify({
        ...base(),
        kind: 'decision',
        actor: fx.actor(fx.reviewer),
        outcome: 'revise',
        summary: 'Narrow the exit slit.',
        versionAuthorId: fx.owner.user.id,
      }),
    ).resolves.toBeUndefined();
    expect(fx.logged).toHaveLength(1);
    expect(String(fx.logged[0])).toContain('SMTP server refused');
    expect(await kindsOf(fx.owner)).toEqual(['decision-on-my-version']);
  });
});
