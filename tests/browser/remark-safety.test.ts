import type { Page } from 'playwright-core';
import { describe, expect, it } from 'vitest';
import { expectAccessible } from '../support/axe';
import { liveServerAndBrowser, screenshot, viewports } from '../support/browser';
import { demo, eventually, shown } from './journeys/journey';

const reviewerEmail = 'tobiah.reviewer@quillmere-lab.example.com';
const ownerName = 'Maren Okafor-Lind';

/** A remark written to run code in every way Markdown with HTML would allow, and one honest link. */
const hostileBody = [
  'Three ways in, none should work:',
  '',
  '<script>window.__pwned=1</script>',
  '',
  '<img src=x onerror="window.__pwned=2">',
  '',
  '[click](javascript:window.__pwned=3) and [ok](https://example.com/a)',
  '',
  `Over to @${ownerName}; @nobody else.`,
].join('\n');

/** What the DOM holds inside the rendered bodies with this test id, and whether anything ran. */
function inspectRendered(page: Page, testID: string) {
  return page.evaluate((testID) => {
    const bodies = [...document.querySelectorAll(`[data-testid="${testID}"]`)].filter(
      (body) => (body as HTMLElement).offsetParent !== null,
    );
    const inside = (selector: string) => bodies.flatMap((body) => [...body.querySelectorAll(selector)]);
    return {
      bodies: bodies.length,
      text: bodies.map((body) => body.textContent ?? '').join('\n'),
      active: inside('script, img, iframe, object, embed, svg, style, link, meta, form').map((el) => el.outerHTML),
      handlers: inside('*').flatMap((el) => [...el.attributes].filter((a) => /^on/i.test(a.name)).map((a) => `${el.tagName} ${a.name}`)),
      anchors: inside('a').map((a) => ({
        href: a.getAttribute('href') ?? '',
        protocol: (a as HTMLAnchorElement).protocol,
        target: a.getAttribute('target'),
        rel: a.getAttribute('rel') ?? '',
        text: a.textContent ?? '',
      })),
      mentions: inside('[aria-label^="mention of "]').map((el) => ({ label: el.getAttribute('aria-label'), text: el.textContent })),
      // Anywhere on the page, not only in the bodies.
      scriptLinks: [...document.querySelectorAll('a[href]')]
        .map((a) => a.getAttribute('href') ?? '')
        .filter((href) => !/^(https?:|mailto:|\/|#|\?)/i.test(href.trim())),
      pwned: (window as unknown as { __pwned?: unknown }).__pwned,
    };
  }, testID);
}

/** The checks every rendering of the hostile text must pass. */
function expectInert(seen: Awaited<ReturnType<typeof inspectRendered>>, where: string) {
  expect(seen.bodies, where).toBeGreaterThan(0);
  expect(seen.active, where).toEqual([]);
  expect(seen.handlers, where).toEqual([]);
  expect(seen.pwned, where).toBeUndefined();
  expect(seen.scriptLinks, where).toEqual([]);
  // The markup is shown as the characters it was written with.
  expect(seen.text, where).toContain('<script>window.__pwned=1</script>');
  expect(seen.text, where).toContain('<img src=x onerror="window.__pwned=2">');
  expect(seen.text, where).toContain('[click](javascript:window.__pwned=3)');
  // One anchor only: the https link, opening in a new tab with no opener and no referrer.
  expect(seen.anchors, where).toEqual([
    { href: 'https://example.com/a', protocol: 'https:', target: '_blank', rel: expect.stringContaining('noopener'), text: 'ok' },
  ]);
  expect(seen.anchors[0]?.rel, where).toContain('noreferrer');
}

/**
 * The security test of issue 13: a remark holding a `<script>`, an `onerror` image and a
 * `javascript:` link is drawn inert in the review panel, and its https link opens outside.
 */
describe('a hostile remark in Chromium', { timeout: 240_000 }, () => {
  const live = liveServerAndBrowser({ NODE_ENV: 'development' });

  it('renders <script>, <img onerror> and javascript: as text; only the https link is an anchor, opening in a new tab', async () => {
    const url = live.server.url;
    // The demo owner makes a design of its own, so the test reads only its own thread.
    const ownerContext = await live.browser.newContext({ viewport: viewports.wide });
    const signIn = async (request: typeof ownerContext.request, email: string) => {
      const answer = await request.post(`${url}/api/auth/sign-in`, { data: { email, password: demo.password }, headers: { origin: url } });
      expect(answer.status()).toBe(200);
    };
    await signIn(ownerContext.request, demo.owner);
    const teams = (await (await ownerContext.request.get(`${url}/api/teams`)).json()) as { teams: { id: string; name: string }[] };
    const teamId = teams.teams.find((team) => team.name === demo.teamName)?.id ?? '';
    expect(teamId).not.toBe('');
    const list = (await (
      await ownerContext.request.get(`${url}/api/teams/${teamId}/designs?q=${encodeURIComponent(demo.notebook)}`)
    ).json()) as { designs: { id: string }[] };
    const source = (await (await ownerContext.request.get(`${url}/api/designs/${list.designs[0]!.id}`)).json()) as {
      version: { params: unknown };
    };
    const made = await ownerContext.request.post(`${url}/api/teams/${teamId}/designs`, {
      // The notes hold the same text: they are drawn by the same view.
      data: { title: 'Remark safety check', tags: [], params: source.version.params, notes: hostileBody, message: 'First cut' },
      headers: { origin: url },
    });
    expect(made.status()).toBe(201);
    const { design } = (await made.json()) as { design: { id: string; createdBy: { id: string } } };
    const designId = design.id;
    await ownerContext.close();

    // The demo reviewer writes the remark through the API, as any client could.
    const reviewerContext = await live.browser.newContext({ viewport: viewports.wide });
    await signIn(reviewerContext.request, reviewerEmail);
    const started = await reviewerContext.request.post(`${url}/api/designs/${designId}/versions/1/threads`, {
      data: { pin: { kind: 'version' }, body: hostileBody, mentions: [design.createdBy.id] },
      headers: { origin: url },
    });
    expect(started.status()).toBe(201);

    const page = await reviewerContext.newPage();
    const problems: string[] = [];
    page.on('pageerror', (error) => problems.push(error.message));
    page.on('dialog', (dialog) => {
      problems.push(`dialog: ${dialog.message()}`);
      void dialog.dismiss();
    });
    // A request for `x` would mean the image element was made, even if its handler did not run.
    const imageRequests: string[] = [];
    page.on('request', (request) => {
      if (request.resourceType() === 'image' && new URL(request.url()).pathname.endsWith('/x')) imageRequests.push(request.url());
    });

    for (const size of ['wide', 'phone'] as const) {
      await page.setViewportSize(viewports[size]);
      await page.goto(`${url}/notebooks/${designId}/v/1`);
      const toggle = page.getByRole('button', { name: 'Review', exact: true }).filter({ visible: true }).first();
      await toggle.waitFor();
      if ((await toggle.getAttribute('aria-expanded')) !== 'true') await toggle.click();
      await shown(page, 'remark-body').first().waitFor();
      // Give anything that could run a moment to do so.
      await page.waitForTimeout(500);

      const seen = await inspectRendered(page, 'remark-body');
      expectInert(seen, `remark at ${size}`);
      // The mentioned owner is marked and named for screen readers; other @ text is plain.
      expect(seen.mentions, size).toEqual([{ label: `mention of ${ownerName}`, text: `@${ownerName}` }]);
      await screenshot(page, `remark-safety-${size}`);
      // The link and the mention keep the panel within WCAG A/AA.
      await expectAccessible(page, `hostile remark in the review panel at ${size}`);
    }

    // The version's notes hold the same text and are drawn by the same view.
    await page.setViewportSize(viewports.wide);
    const notesToggle = page.getByRole('button', { name: 'Notes', exact: true }).filter({ visible: true }).first();
    if ((await notesToggle.getAttribute('aria-expanded')) !== 'true') await notesToggle.click();
    await shown(page, 'notes').waitFor();
    const notes = await inspectRendered(page, 'notes');
    expectInert(notes, 'notes');
    expect(notes.mentions).toEqual([]);
    await screenshot(page, 'remark-safety-notes-wide');

    // Pressing the link opens a new page (never this one), and this page is left as it was.
    await page.setViewportSize(viewports.wide);
    await page.goto(`${url}/notebooks/${designId}/v/1`);
    const toggle = page.getByRole('button', { name: 'Review', exact: true }).filter({ visible: true }).first();
    await toggle.waitFor();
    if ((await toggle.getAttribute('aria-expanded')) !== 'true') await toggle.click();
    // The outside address is not reached in a test: the new tab's request is answered here.
    await reviewerContext.route('https://example.com/**', (route) => route.fulfill({ status: 200, contentType: 'text/plain', body: 'outside' }));
    const link = shown(page, 'remark-body').getByRole('link', { name: 'ok', exact: true });
    const [opened] = await Promise.all([reviewerContext.waitForEvent('page'), link.click()]);
    await opened.waitForLoadState();
    expect(opened.url()).toBe('https://example.com/a');
    // noopener: the new page cannot reach back to this window.
    expect(await opened.evaluate(() => window.opener)).toBeNull();
    expect(page.url()).toBe(`${url}/notebooks/${designId}/v/1`);
    await opened.close();

    await eventually(() => imageRequests).toEqual([]);
    expect(problems).toEqual([]);
    await reviewerContext.close();
  });
});
