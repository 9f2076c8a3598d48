import type { Browser, BrowserContext, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { launchBrowser, screenshot, startServer, viewports, type RunningServer } from '../support/browser';

// The demo accounts the server seeds in development (README, "Demo data").
const password = 'grating-demo-2026';
const owner = 'maren.owner@quillmere-lab.example.com';
const reviewer = 'tobiah.reviewer@quillmere-lab.example.com';
const viewer = 'juno.viewer@quillmere-lab.example.com';
const title = 'Sodium doublet monochromator';

describe('design notebooks in Chromium', () => {
  let server: RunningServer;
  let browser: Browser;
  let ownerContext: BrowserContext;
  let page: Page;
  let teamId = '';
  let notebookId = '';
  let sharePath = '';
  const errors: string[] = [];

  async function signedInContext(email: string): Promise<BrowserContext> {
    const context = await browser.newContext({ viewport: viewports.wide });
    const answer = await context.request.post(`${server.url}/api/auth/sign-in`, {
      data: { email, password },
      headers: { origin: server.url },
    });
    expect(answer.status()).toBe(200);
    return context;
  }

  async function shoot(target: Page, name: string) {
    for (const size of ['phone', 'wide'] as const) {
      await target.setViewportSize(viewports[size]);
      await target.waitForTimeout(250);
      await screenshot(target, `${name}-${size}`);
    }
    await target.setViewportSize(viewports.wide);
    await target.waitForTimeout(150);
  }

  beforeAll(async () => {
    server = await startServer({ NODE_ENV: 'development' });
    browser = await launchBrowser();
    ownerContext = await signedInContext(owner);
    page = await ownerContext.newPage();
    page.on('pageerror', (error) => errors.push(error.message));
    const teams = (await (await ownerContext.request.get(`${server.url}/api/teams`)).json()) as {
      teams: { id: string; personal: boolean }[];
    };
    teamId = teams.teams.find((team) => !team.personal)?.id ?? '';
    expect(teamId).not.toBe('');
  });
  afterAll(async () => {
    await browser?.close();
    await server?.stop();
  });

  it('creates a notebook from the team’s design list', async () => {
    await page.goto(`${server.url}/teams/${teamId}/notebooks`);
    await page.getByTestId('list-heading').waitFor();
    await page.getByTestId('show-create').click();
    await page.getByTestId('new-title').fill(title);
    await page.getByTestId('new-from-visible-scanner').click();
    await page.getByTestId('create-design').click();
    await page.getByTestId('notebook-title').filter({ hasText: title }).waitFor();
    notebookId = new URL(page.url()).pathname.split('/')[2] ?? '';
    expect(notebookId).not.toBe('');
    await expect.poll(() => page.getByTestId('version-line').textContent()).toContain('v1 of 1');

    await page.goto(`${server.url}/teams/${teamId}/notebooks`);
    await page.getByTestId(`design-${title}`).waitFor();
    await shoot(page, 'notebooks-list');
  });

  it('saves v2 with a message and notes, and shows it in the history', async () => {
    await page.goto(`${server.url}/notebooks/${notebookId}`);
    await page.getByTestId('field-slits.exitWidthUm').fill('25');
    await page.getByTestId('version-message').fill('Narrower exit slit to split the sodium doublet');
    await page
      .getByTestId('version-notes')
      .fill('# Why\nThe doublet is **0.6 nm** apart.\n\n- exit slit `25 um`\n- <b>not bold</b>');
    await page.getByTestId('save-version').click();
    await expect.poll(() => page.getByTestId('version-line').textContent()).toContain('v2 of 2');
    await expect.poll(() => page.getByTestId('notes').textContent()).toContain('<b>not bold</b>');
    await shoot(page, 'notebooks-notebook');

    await page.getByTestId('tab-history').click();
    await page.getByTestId('history-v2').waitFor();
    await expect.poll(() => page.getByTestId('history-v2').textContent()).toContain('Narrower exit slit');
    await shoot(page, 'notebooks-history');
  });

  it('shows a save on a stale base beside the newer version and saves on top only when asked', async () => {
    // A colleague's save (the same owner, from another tab) lands first.
    const other = await ownerContext.request.post(`${server.url}/api/designs/${notebookId}/versions`, {
      data: {
        baseVersion: 2,
        params: (await (await ownerContext.request.get(`${server.url}/api/designs/${notebookId}`)).json())
          .version.params,
        notes: '',
        message: 'Saved in another tab',
      },
      headers: { origin: server.url },
    });
    expect(other.status()).toBe(201);
    await page.getByTestId('tab-design').click();
    await page.getByTestId('field-slits.entranceWidthUm').fill('30');
    await page.getByTestId('version-message').fill('Narrower entrance slit too');
    await page.getByTestId('save-version').click();
    await page.getByTestId('conflict-card').waitFor();
    await expect
      .poll(() => page.getByTestId('conflict-card').textContent())
      .toContain('Saved in another tab');
    await page.getByTestId('rebase-reapply').click();
    await page.getByTestId('rebase-note').waitFor();
    await expect.poll(() => page.getByTestId('field-slits.entranceWidthUm').inputValue()).toBe('30');
    await page.getByTestId('save-version').click();
    await expect.poll(() => page.getByTestId('version-line').textContent()).toContain('v4 of 4');
  });

  it('compares v1 and v2: changed parameters, figure changes, both sketches and plots', async () => {
    await page.goto(`${server.url}/notebooks/${notebookId}/compare?a=1&b=2`);
    await page.getByTestId('compare-heading').waitFor();
    await page.getByTestId('changed-slits.exitWidthUm').waitFor();
    await expect
      .poll(() => page.getByTestId('change-bandpassAtCentreNm').textContent())
      .toMatch(/^−\d+(\.\d)?\u202F%$/);
    // Both versions on one drawing: the earlier one's grating lies beneath the later one's.
    const overlay = page.getByTestId('compare-sketch-overlay');
    await overlay.waitFor();
    expect(await overlay.locator('[data-testid="before-sketch-grating"]').count()).toBe(1);
    expect(await overlay.locator('[data-testid="sketch-grating"]').count()).toBe(1);
    await page.getByTestId('compare-plot-bandpass').waitFor();
    await shoot(page, 'notebooks-compare');
  });

  it('lets the reviewer approve v2 with a comment, shown with its decision', async () => {
    const reviewerContext = await signedInContext(reviewer);
    const reviewerPage = await reviewerContext.newPage();
    reviewerPage.on('pageerror', (error) => errors.push(error.message));
    await reviewerPage.goto(`${server.url}/notebooks/${notebookId}/v/2`);
    await reviewerPage.getByTestId('review-empty').waitFor();
    await reviewerPage.getByTestId('review-body').fill('The doublet is split; fine for the teaching lab.');
    await reviewerPage.getByTestId('review-approve').click();
    await reviewerPage.getByTestId('review-item').filter({ hasText: 'fine for the teaching lab' }).waitFor();
    await reviewerPage.getByTestId('review-list').getByTestId('review-decision-approved').waitFor();
    // The box empties once the comment is sent; wait for it rather than race the render.
    await reviewerPage.waitForFunction(
      () => (document.querySelector('[data-testid="review-body"]') as HTMLTextAreaElement | null)?.value === '',
      undefined,
      { timeout: 5_000 },
    );
    expect(await reviewerPage.getByTestId('review-body').inputValue()).toBe('');
    await screenshot(reviewerPage, 'notebooks-review-wide');
    await reviewerContext.close();
  });

  it('lets the viewer read it only, and clone it into their workspace with where it came from', async () => {
    const viewerContext = await signedInContext(viewer);
    const viewerPage = await viewerContext.newPage();
    viewerPage.on('pageerror', (error) => errors.push(error.message));
    await viewerPage.goto(`${server.url}/notebooks/${notebookId}/v/2`);
    await viewerPage.getByTestId('read-only-note').waitFor();
    expect(await viewerPage.getByTestId('save-card').count()).toBe(0);
    // The reviewer's approval is there to read; the viewer has no form to answer it.
    await viewerPage.getByTestId('review-decision-approved').first().waitFor();
    expect(await viewerPage.getByTestId('review-body').count()).toBe(0);
    await viewerPage.getByTestId('tab-sharing').click();
    expect(await viewerPage.getByTestId('share-card').count()).toBe(0);
    await viewerPage.getByTestId('clone-submit').click();
    await viewerPage.getByTestId('provenance').waitFor();
    expect(await viewerPage.getByTestId('provenance').textContent()).toBe(`from ${title} v2`);
    expect(new URL(viewerPage.url()).pathname).not.toContain(notebookId);
    await viewerContext.close();
  });

  it('creates a read-only link that a signed-out visitor can open', async () => {
    await page.goto(`${server.url}/notebooks/${notebookId}/v/2`);
    await page.getByTestId('tab-sharing').click();
    await page.getByTestId('create-share-link').click();
    const url = (await page.getByTestId('share-url').textContent()) ?? '';
    sharePath = new URL(url).pathname;
    expect(sharePath).toMatch(/^\/share\//);

    const visitor = await browser.newContext({ viewport: viewports.wide });
    const visitorPage = await visitor.newPage();
    visitorPage.on('pageerror', (error) => errors.push(error.message));
    await visitorPage.goto(`${server.url}${sharePath}`);
    await visitorPage.getByTestId('shared-title').filter({ hasText: title }).waitFor();
    await expect
      .poll(() => visitorPage.getByTestId('notes').textContent())
      .toContain('The doublet is 0.6 nm apart.');
    await visitorPage.getByTestId('plots-card').waitFor();
    expect(await visitorPage.getByTestId('save-card').count()).toBe(0);
    expect(await visitorPage.getByText('Members').count()).toBe(0);
    expect(await visitorPage.getByTestId('review-panel').count()).toBe(0);
    // A read-only page offers no starting presets: nothing here can replace the shared design.
    expect(await visitorPage.getByTestId('preset-picker').count()).toBe(0);
    await shoot(visitorPage, 'notebooks-share');
    await visitor.close();
  });

  it('raised no page errors', () => {
    expect(errors).toEqual([]);
  });
});
