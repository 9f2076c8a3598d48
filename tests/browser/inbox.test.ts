import type { APIRequestContext, BrowserContext, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { demoPassword, demoUsers } from '../../server/seed/demo';
import { expectAccessible } from '../support/axe';
import { liveServerAndBrowser, screenshot, viewports, type ViewportName } from '../support/browser';
import { demo, eventually, expectTitle, linkPath, newestMail, overlap, shown } from './journeys/journey';

const owner = demoUsers.find((user) => user.role === 'owner')!;
const reviewer = demoUsers.find((user) => user.role === 'reviewer')!;
const sizes: readonly ViewportName[] = ['phone', 'tablet', 'wide'];

/**
 * What waits for the owner of the demo team: the reviewer writes through the API (a thread that
 * mentions the owner, one on the owner's version), and the owner works through the header's inbox
 * link, the inbox and the review e-mail settings in Chromium at phone size.
 */
describe('the inbox and the review e-mail settings in Chromium', () => {
  const live = liveServerAndBrowser({ NODE_ENV: 'development' });
  let reviewerContext: BrowserContext;
  let ownerApi: APIRequestContext;
  let context: BrowserContext;
  let page: Page;
  const problems: string[] = [];
  const axeFindings: string[] = [];
  const fixture = { ownerId: '', notebookId: '', mentionThread: '', designThread: '' };

  const url = (path: string) => `${live.server.url}${path}`;
  const origin = () => ({ origin: live.server.url });

  async function signedIn(who: { email: string }): Promise<BrowserContext> {
    const made = await live.browser.newContext();
    const answer = await made.request.post(url('/api/auth/sign-in'), { data: { email: who.email, password: demoPassword }, headers: origin() });
    expect(answer.status()).toBe(200);
    return made;
  }

  /** The reviewer starts a thread on `version`, pinned to the exit slit, naming `mentions`. */
  async function startThread(version: number, body: string, mentions: string[] = []): Promise<string> {
    const answer = await reviewerContext.request.post(url(`/api/designs/${fixture.notebookId}/versions/${version}/threads`), {
      data: { pin: { kind: 'field', path: 'slits.exitWidthUm' }, body, mentions },
      headers: origin(),
    });
    expect(answer.status(), await answer.text()).toBe(201);
    return ((await answer.json()) as { thread: { id: string } }).thread.id;
  }

  async function ownerUnread(): Promise<number> {
    return ((await (await ownerApi.get(url('/api/inbox/unread-count'))).json()) as { unread: number }).unread;
  }

  async function mailsTo(to: string, subject: string): Promise<number> {
    const { messages } = (await (await ownerApi.get(url('/api/dev/outbox'))).json()) as { messages: { to: string; subject: string }[] };
    return messages.filter((message) => message.to === to && message.subject.includes(subject)).length;
  }

  /** A picture at each size and axe at each; findings are kept and asserted empty at the end. */
  async function shoot(step: string) {
    for (const size of sizes) {
      await page.setViewportSize(viewports[size]);
      await page.evaluate(() => new Promise((resolve) => requestAnimationFrame(() => requestAnimationFrame(resolve))));
      await screenshot(page, `inbox-${step}-${size}`);
      await expectAccessible(page, `${step} at ${size}`).catch((error: Error) => axeFindings.push(error.message));
    }
    await page.setViewportSize(viewports.phone);
  }

  const headerInbox = () => shown(page, 'header-inbox');
  const headerName = () => headerInbox().getAttribute('aria-label');

  beforeAll(async () => {
    reviewerContext = await signedIn(reviewer);
    const ownerContext = await signedIn(owner);
    ownerApi = ownerContext.request;
    const session = (await (await ownerApi.get(url('/api/auth/session'))).json()) as { user: { id: string } };
    fixture.ownerId = session.user.id;
    const { teams } = (await (await ownerApi.get(url('/api/teams'))).json()) as { teams: { id: string; name: string }[] };
    const team = teams.find((each) => each.name === demo.teamName)!;
    const { designs } = (await (await ownerApi.get(url(`/api/teams/${team.id}/designs`))).json()) as { designs: { id: string; title: string }[] };
    fixture.notebookId = designs.find((design) => design.title === demo.notebook)!.id;

    // Oldest first: the mention on v2, then a thread on the owner's v3.
    fixture.mentionThread = await startThread(2, `@${owner.displayName} the exit slit is too wide for the 0.2 nm requirement.`, [fixture.ownerId]);
    fixture.designThread = await startThread(3, 'Is 60 µm at the exit the value we agreed on?');
    // The inbox hears of a thread after it is committed; expect.poll is for tests, not hooks.
    for (let tries = 0; (await ownerUnread()) < 2; tries++) {
      if (tries > 100) throw new Error('The two threads did not reach the owner’s inbox within 20 s.');
      await new Promise((resolve) => setTimeout(resolve, 200));
    }

    context = await live.browser.newContext({ viewport: viewports.phone });
    page = await context.newPage();
    page.on('console', (message) => {
      if (message.type() === 'error') problems.push(`console: ${message.text()} (${message.location().url})`);
    });
    page.on('pageerror', (error) => problems.push(`page error: ${error.message}`));
  }, 120_000);

  afterAll(async () => {
    await context?.close();
    await reviewerContext?.close();
  });

  it('follows the mention e-mail while signed out through sign-in back to the same thread address', async () => {
    const mail = await newestMail(live.server, reviewerContext, owner.email, 'mentioned you in a remark');
    const link = linkPath(mail.text, '/notebooks/');
    expect(link).toBe(`/notebooks/${fixture.notebookId}/v/2?thread=${fixture.mentionThread}`);

    await page.goto(url(link));
    await page.getByRole('heading', { name: 'Sign in', level: 1 }).waitFor();
    expect(new URL(page.url()).searchParams.get('next')).toBe(link);
    await shown(page, 'email').fill(owner.email);
    await shown(page, 'password').fill(demoPassword);
    await shown(page, 'sign-in-submit').click();
    await eventually(() => {
      const here = new URL(page.url());
      return `${here.pathname}${here.search}`;
    }).toBe(link);
  });

  it('shows the unread count in the phone header as words, beside the wordmark and the account button', async () => {
    await eventually(headerName).toBe('Inbox, 2 unread');
    expect(await shown(page, 'header-inbox-count').textContent()).toBe('2');
    expect(await headerInbox().textContent()).toBe('Inbox 2');

    const wordmark = (await shown(page, 'wordmark').boundingBox())!;
    const inbox = (await headerInbox().boundingBox())!;
    const account = (await shown(page, 'account-menu').boundingBox())!;
    for (const box of [wordmark, inbox, account]) {
      expect(box.x).toBeGreaterThanOrEqual(0);
      expect(box.x + box.width).toBeLessThanOrEqual(viewports.phone.width);
    }
    expect(overlap(wordmark, inbox)).toBe(false);
    expect(overlap(inbox, account)).toBe(false);
    // The whole word stays on screen: not cut down to an ellipsis.
    expect(await shown(page, 'wordmark').evaluate((node) => node.scrollWidth <= node.clientWidth + 1)).toBe(true);
  });

  it('reaches the inbox from the header with Tab and Enter', async () => {
    await page.goto(url('/teams'));
    await shown(page, 'create-team').waitFor();
    await eventually(headerName).toBe('Inbox, 2 unread');
    let reached = false;
    for (let step = 0; step < 8 && !reached; step++) {
      await page.keyboard.press('Tab');
      reached = await page.evaluate(() => document.activeElement?.getAttribute('data-testid') === 'header-inbox');
    }
    expect(reached).toBe(true);
    await page.keyboard.press('Enter');
    await page.getByRole('heading', { name: 'Inbox', level: 1 }).filter({ visible: true }).waitFor();
    expect(new URL(page.url()).pathname).toBe('/inbox');
    await expectTitle(page, 'Inbox · Blazebook');
  });

  it('lists the events newest first with kind, design and version, who, the excerpt and Unread in words', async () => {
    const items = shown(page, 'inbox-list').getByRole('link');
    await eventually(() => items.count()).toBe(2);
    const texts = await items.allTextContents();
    expect(texts[0]).toContain('Unread');
    expect(texts[0]).toContain('New thread on your design');
    expect(texts[0]).toContain(`“${demo.notebook}” v3`);
    expect(texts[0]).toContain(`${reviewer.displayName}: Is 60 µm at the exit the value we agreed on?`);
    expect(texts[1]).toContain('Unread');
    expect(texts[1]).toContain('You were mentioned');
    expect(texts[1]).toContain(`“${demo.notebook}” v2`);
    expect(await shown(page, 'inbox-unread-count').textContent()).toBe('2 unread');
    await shoot('unread');
  });

  it('opens an item at its thread, marks it read, and the header count drops', async () => {
    const mention = shown(page, 'inbox-list').getByRole('link').filter({ hasText: 'You were mentioned' });
    await mention.click();
    await eventually(() => {
      const here = new URL(page.url());
      return `${here.pathname}${here.search}`;
    }).toBe(`/notebooks/${fixture.notebookId}/v/2?thread=${fixture.mentionThread}`);
    await eventually(headerName).toBe('Inbox, 1 unread');
    await eventually(ownerUnread).toBe(1);
    await screenshot(page, 'inbox-opened-thread-phone');

    // Back from the thread (on a phone its sheet covers the header) to the inbox, now refreshed.
    await page.goBack();
    await page.getByRole('heading', { name: 'Inbox', level: 1 }).filter({ visible: true }).waitFor();
    const items = shown(page, 'inbox-list').getByRole('link');
    await eventually(async () => (await items.allTextContents()).map((text) => text.startsWith('Unread'))).toEqual([true, false]);
  });

  it('shows only the unread ones on request, and Mark all read zeroes the count', async () => {
    const onlyUnread = shown(page, 'inbox-only-unread');
    expect(await onlyUnread.getAttribute('aria-checked')).toBe('false');
    await onlyUnread.click();
    expect(await onlyUnread.getAttribute('aria-checked')).toBe('true');
    const items = shown(page, 'inbox-list').getByRole('link');
    await eventually(() => items.count()).toBe(1);
    expect(await items.first().textContent()).toContain('New thread on your design');

    await shown(page, 'inbox-mark-all-read').click();
    await eventually(headerName).toBe('Inbox, nothing unread');
    expect(await headerInbox().textContent()).toBe('Inbox');
    await eventually(() => shown(page, 'inbox-empty').textContent()).toContain('Nothing unread');
    expect(await ownerUnread()).toBe(0);
    expect(await shown(page, 'inbox-mark-all-read').getAttribute('aria-disabled')).toBe('true');

    // Space turns the switch off again, as it would a checkbox; everything read is still listed.
    await onlyUnread.focus();
    await page.keyboard.press('Space');
    expect(await onlyUnread.getAttribute('aria-checked')).toBe('false');
    await eventually(() => items.count()).toBe(2);
    expect((await items.allTextContents()).some((text) => text.includes('Unread'))).toBe(false);
    await shoot('read');
  });

  it('reaches the settings from the account menu; a switched-off kind keeps the inbox item and sends no e-mail', async () => {
    await shown(page, 'account-menu').click();
    await shown(page, 'account-settings').click();
    await page.getByRole('heading', { name: 'Settings', level: 1 }).filter({ visible: true }).waitFor();
    await expectTitle(page, 'Settings · Blazebook');
    expect(await page.getByText('Your inbox keeps every event whatever you choose here.').filter({ visible: true }).count()).toBe(1);

    const mentions = shown(page, 'mail-setting-mentions');
    await eventually(() => mentions.getAttribute('aria-checked')).toBe('true');
    // Named by its visible label (the tick is hidden from screen readers; aria-checked says it).
    expect(await page.getByRole('switch', { name: 'When someone mentions me in a remark', exact: true }).filter({ visible: true }).count()).toBe(1);
    await mentions.click();
    await eventually(() => shown(page, 'mail-settings-status').textContent()).toBe('Saved');
    expect(await shown(page, 'mail-settings-status').getAttribute('role')).toBe('status');
    expect(await mentions.getAttribute('aria-checked')).toBe('false');
    await shoot('settings');

    await page.reload();
    await eventually(() => shown(page, 'mail-setting-mentions').getAttribute('aria-checked')).toBe('false');
    expect(await shown(page, 'mail-setting-threadsOnMyDesigns').getAttribute('aria-checked')).toBe('true');
    const saved = (await (await ownerApi.get(url('/api/account/mail-settings'))).json()) as { settings: Record<string, boolean> };
    expect(saved.settings).toEqual({ reviewRequests: true, mentions: false, threadsOnMyDesigns: true, decisionsOnMyVersions: true });

    const mentionMails = await mailsTo(owner.email, 'mentioned you in a remark');
    const threadMails = await mailsTo(owner.email, 'pinned a remark to');
    await startThread(3, `@${owner.displayName} one more look at the exit slit, please.`, [fixture.ownerId]);
    // A kind still on is the control: its e-mail does arrive, so the quiet one is not a lag.
    await startThread(2, 'The entrance slit matches the exit one here.');
    await eventually(ownerUnread).toBe(2);
    await eventually(() => mailsTo(owner.email, 'pinned a remark to')).toBe(threadMails + 1);
    expect(await mailsTo(owner.email, 'mentioned you in a remark')).toBe(mentionMails);

    // The inbox keeps the mention all the same, and the header polls its way to the new count.
    await shown(page, 'settings-inbox-link').click();
    await eventually(headerName).toBe('Inbox, 2 unread');
    const items = shown(page, 'inbox-list').getByRole('link');
    await eventually(async () => (await items.allTextContents())[1] ?? '').toContain('You were mentioned');
  });

  it('shows the inbox and settings with no console error and no serious axe finding', () => {
    expect(problems).toEqual([]);
    expect(axeFindings).toEqual([]);
  });
});
