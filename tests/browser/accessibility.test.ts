import type { BrowserContext, Locator, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { demoPassword, demoUsers } from '../../server/seed/demo';
import { expectAccessible } from '../support/axe';
import { liveServerAndBrowser, screenshot, viewports, type ViewportName } from '../support/browser';

/**
 * Every screen at the three sizes, signed out and as each role of the demo team, through axe-core
 * with the WCAG 2.0/2.1/2.2 A and AA rules: no serious or critical violation. One browser context
 * per audience; each screen is opened once and checked at each size by resizing the window.
 */
const sizes = ['phone', 'tablet', 'wide'] as const satisfies readonly ViewportName[];

type Fixture = { teamId: string; notebookId: string; sharePath: string };
type Audience = 'signed out' | (typeof demoUsers)[number]['role'];
type Screen = {
  name: string;
  path: (f: Fixture) => string;
  /** Clicked after the page has loaded (a tab). */
  tab?: string;
  /** What is on screen once it has its data: testIDs, or a heading's name. */
  ready: readonly (string | { heading: string })[];
  audiences: readonly Audience[];
};

const everyone: readonly Audience[] = ['signed out', 'owner', 'reviewer', 'viewer'];
const members: readonly Audience[] = ['owner', 'reviewer', 'viewer'];
/**
 * Screens whose content does not depend on the caller's role (only the account button changes):
 * checked signed out and signed in once, not once per role — that took a minute of every run.
 */
const outAndIn: readonly Audience[] = ['signed out', 'owner'];

const screens = [
  { name: 'landing', path: () => '/', ready: ['landing-heading'], audiences: outAndIn },
  { name: 'workbench', path: () => '/workbench', ready: ['readout-bandpass', 'ray-sketch'], audiences: outAndIn },
  { name: 'selectors', path: () => '/selectors?tool=prism', ready: ['prism-bandpass', 'prism-source'], audiences: ['signed out'] },
  { name: 'sign-in', path: () => '/sign-in', ready: ['sign-in-submit'], audiences: ['signed out'] },
  { name: 'sign-up', path: () => '/sign-up', ready: ['sign-up-submit'], audiences: ['signed out'] },
  { name: 'forgot-password', path: () => '/forgot-password', ready: ['reset-submit'], audiences: ['signed out'] },
  { name: 'teams', path: () => '/teams', ready: ['create-team'], audiences: members },
  { name: 'design list', path: (f) => `/teams/${f.teamId}/notebooks`, ready: ['list-heading', 'design-Teaching-lab visible scanner'], audiences: members },
  { name: 'members', path: (f) => `/teams/${f.teamId}/members`, ready: ['members-table'], audiences: members },
  { name: 'notebook design tab', path: (f) => `/notebooks/${f.notebookId}`, ready: ['notebook-title', 'readout-bandpass', 'ray-sketch'], audiences: members },
  { name: 'notebook history tab', path: (f) => `/notebooks/${f.notebookId}`, tab: 'tab-history', ready: ['history-v1'], audiences: members },
  { name: 'notebook sharing tab', path: (f) => `/notebooks/${f.notebookId}`, tab: 'tab-sharing', ready: ['clone-submit'], audiences: members },
  { name: 'compare', path: (f) => `/notebooks/${f.notebookId}/compare?a=1&b=2`, ready: ['compare-heading', 'compare-plot-bandpass'], audiences: members },
  { name: 'share link', path: (f) => f.sharePath, ready: ['shared-title', 'plots-card'], audiences: outAndIn },
  { name: 'outbox', path: () => '/outbox', ready: [{ heading: 'Outbox' }], audiences: outAndIn },
  // The same for every role (only one's own items and settings): checked as the owner once.
  { name: 'inbox', path: () => '/inbox', ready: ['inbox-heading', 'inbox-unread-count'], audiences: ['owner'] },
  { name: 'settings', path: () => '/settings', ready: ['settings-heading', 'mail-setting-mentions'], audiences: ['owner'] },
] as const satisfies readonly Screen[];

const readyLocator = (page: Page, item: Screen['ready'][number]): Locator =>
  typeof item === 'string' ? page.getByTestId(item) : page.getByRole('heading', { name: item.heading, level: 1 });

/** Two frames after a resize: React Native Web has re-rendered for the new window size. */
const settle = (page: Page) =>
  page.evaluate(() => new Promise((resolve) => requestAnimationFrame(() => requestAnimationFrame(resolve))));

describe('accessibility of every screen (axe-core, WCAG 2.2 A and AA)', () => {
  const live = liveServerAndBrowser({ NODE_ENV: 'development' });
  const fixture: Fixture = { teamId: '', notebookId: '', sharePath: '' };

  beforeAll(async () => {
    // The seeded demo team and its first notebook; a share link made by its owner.
    const owner = demoUsers.find((user) => user.role === 'owner')!;
    const context = await live.browser.newContext();
    const api = context.request;
    const origin = { origin: live.server.url };
    expect((await api.post(`${live.server.url}/api/auth/sign-in`, { data: { email: owner.email, password: demoPassword }, headers: origin })).status()).toBe(200);
    const { teams } = (await (await api.get(`${live.server.url}/api/teams`)).json()) as { teams: { id: string; personal: boolean }[] };
    fixture.teamId = teams.find((team) => !team.personal)!.id;
    const { designs } = (await (await api.get(`${live.server.url}/api/teams/${fixture.teamId}/designs`)).json()) as {
      designs: { id: string; title: string }[];
    };
    fixture.notebookId = designs.find((design) => design.title === 'Teaching-lab visible scanner')!.id;
    const link = await api.post(`${live.server.url}/api/designs/${fixture.notebookId}/share-links`, { data: {}, headers: origin });
    expect(link.status()).toBe(201);
    fixture.sharePath = ((await link.json()) as { path: string }).path;
    await context.close();
  });

  describe.each(everyone)('%s', (audience) => {
    let context: BrowserContext;
    let page: Page;
    const errors: string[] = [];

    beforeAll(async () => {
      context = await live.browser.newContext({ viewport: viewports.phone });
      const user = demoUsers.find((person) => person.role === audience);
      if (user) {
        const answer = await context.request.post(`${live.server.url}/api/auth/sign-in`, {
          data: { email: user.email, password: demoPassword },
          headers: { origin: live.server.url },
        });
        expect(answer.status()).toBe(200);
      }
      page = await context.newPage();
      page.on('pageerror', (error) => errors.push(error.message));
    });
    afterAll(async () => {
      await context?.close();
    });

    it.each(screens.filter((screen) => (screen.audiences as readonly Audience[]).includes(audience)))(
      'the $name screen has no serious or critical violation at phone, tablet and wide size',
      async (screen: Screen) => {
        await page.setViewportSize(viewports.phone);
        await page.goto(`${live.server.url}${screen.path(fixture)}`);
        if (screen.tab) await page.getByTestId(screen.tab).click();
        // Every size is checked before the test fails, so one run lists all that needs fixing.
        const failures: string[] = [];
        for (const size of sizes) {
          await page.setViewportSize(viewports[size]);
          await settle(page);
          for (const item of screen.ready) await readyLocator(page, item).first().waitFor();
          await expectAccessible(page, `${screen.name} at ${size}, ${audience}`).catch(async (error: Error) => {
            failures.push(error.message);
            await screenshot(page, `accessibility-${screen.name.replaceAll(' ', '-')}-${audience.replace(' ', '-')}-${size}`);
          });
        }
        expect(failures).toEqual([]);
        expect(errors).toEqual([]);
      },
      // Three axe runs over a full screen; the workbench's take seconds each on a loaded machine.
      180_000,
    );
  });

  it('draws a clear focus ring on every control reached with Tab on the workbench', async () => {
    const context = await live.browser.newContext({ viewport: viewports.tablet });
    const page = await context.newPage();
    await page.goto(`${live.server.url}/workbench`);
    await page.getByTestId('readout-bandpass').waitFor();
    const seen: { control: string; outline: string }[] = [];
    for (let step = 0; step < 24; step++) {
      await page.keyboard.press('Tab');
      seen.push(
        await page.evaluate(() => {
          const el = document.activeElement as HTMLElement;
          const style = getComputedStyle(el);
          const name = el.getAttribute('aria-label') ?? el.textContent?.slice(0, 30) ?? '';
          return {
            control: `${el.getAttribute('role') ?? el.tagName.toLowerCase()} ${name}`,
            outline: `${style.outlineStyle} ${style.outlineWidth} ${style.outlineColor}`,
          };
        }),
      );
    }
    await screenshot(page, 'accessibility-focus-ring-tablet');
    await context.close();
    // Buttons, links, radios and fields all among them; each with the 2 px ring in the focus colour
    // (theme colors.focus, #2F7FA8).
    const kinds = new Set(seen.map((item) => item.control.split(' ')[0]));
    expect([...kinds]).toEqual(expect.arrayContaining(['link', 'button', 'radio', 'input']));
    expect(seen.filter((item) => item.outline !== 'solid 2px rgb(47, 127, 168)')).toEqual([]);
  });

  it('fails a page with a serious violation, naming the rule, the screen and the element', async () => {
    // The check above passing means something only if it can fail: an unnamed button (axe rule
    // button-name, critical) and grey-on-white text at 1.6:1 (color-contrast, serious).
    const page = await live.browser.newPage({ viewport: viewports.phone });
    await page.setContent(
      '<html lang="en"><head><title>t</title></head><body><main><h1>Check</h1><button id="mute"></button>' +
        '<p id="faint" style="color:#ccc;background:#fff">Faint words</p></main></body></html>',
    );
    const failure = await expectAccessible(page, 'the planted page at phone').then(
      () => null,
      (error: Error) => error.message,
    );
    await page.close();
    expect(failure).toContain('the planted page at phone');
    expect(failure).toMatch(/button-name \(critical\).*#mute/);
    expect(failure).toMatch(/color-contrast \(serious\).*#faint/);
  });
});
