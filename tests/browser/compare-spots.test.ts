import type { Browser, BrowserContext, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { exampleDesign } from '../../shared/design';
import { launchBrowser, screenshot, startServer, viewports, type RunningServer } from '../support/browser';

// The demo accounts the server seeds in development (README, "Demo data").
const password = 'grating-demo-2026';
const owner = 'maren.owner@quillmere-lab.example.com';

/**
 * The compare screen's spot diagrams: both versions traced in the browser (a Web Worker each) and
 * drawn side by side with the change in words, with no console errors, on a phone and wide.
 */
describe('compare: spot diagrams in Chromium', () => {
  let server: RunningServer;
  let browser: Browser;
  let context: BrowserContext;
  let page: Page;
  let notebookId = '';
  const errors: string[] = [];

  beforeAll(async () => {
    server = await startServer({ NODE_ENV: 'development' });
    browser = await launchBrowser();
    context = await browser.newContext({ viewport: viewports.wide });
    const headers = { origin: server.url };
    expect((await context.request.post(`${server.url}/api/auth/sign-in`, { data: { email: owner, password }, headers })).status()).toBe(200);
    const teams = (await (await context.request.get(`${server.url}/api/teams`)).json()) as { teams: { id: string; personal: boolean }[] };
    const teamId = teams.teams.find((team) => !team.personal)?.id ?? '';
    const created = await context.request.post(`${server.url}/api/teams/${teamId}/designs`, {
      data: { title: 'Spot compare check', params: exampleDesign },
      headers,
    });
    expect(created.status()).toBe(201);
    notebookId = ((await created.json()) as { design: { id: string } }).design.id;
    // v2: the camera mirror nearer its axis, so the spot changes.
    const saved = await context.request.post(`${server.url}/api/designs/${notebookId}/versions`, {
      data: { baseVersion: 1, params: { ...exampleDesign, layout: { ...exampleDesign.layout, cameraOffAxisDeg: 4 } }, notes: '', message: 'Camera nearer its axis' },
      headers,
    });
    expect(saved.status()).toBe(201);
    page = await context.newPage();
    page.on('pageerror', (error) => errors.push(error.message));
    page.on('console', (message) => {
      if (message.type() === 'error') errors.push(message.text());
    });
  }, 600_000);
  afterAll(async () => {
    await browser?.close();
    await server?.stop();
  });

  it('shows both versions’ centre spots side by side with the change in words', async () => {
    await page.goto(`${server.url}/notebooks/${notebookId}/compare?a=1&b=2`);
    await page.getByTestId('compare-spots').waitFor();
    await page.getByTestId('compare-spot-v1-rays').waitFor({ timeout: 30_000 });
    await page.getByTestId('compare-spot-v2-rays').waitFor({ timeout: 30_000 });
    // Each diagram draws its rays as one path of dots.
    for (const v of [1, 2]) expect(((await page.getByTestId(`compare-spot-v${v}-rays`).getAttribute('d')) ?? '').length).toBeGreaterThan(100);
    await expect.poll(() => page.getByTestId('compare-spots-change').textContent()).toMatch(/^From v1 to v2: RMS width \S+\sµm → \S+\sµm \(.+\); traced FWHM \S+\snm → \S+\snm \(.+\)\.$/);
    expect(await page.getByTestId('compare-spot-v1-figures').textContent()).toMatch(/^Traced FWHM \d\S*\snm \(slit-limited \d\S*\snm\)$/);
    // Both squares at one scale: the same scale bar under each.
    const scaleOf = async (v: number) => /scale bar ([^;.]+)/.exec((await page.getByTestId(`compare-spot-v${v}`).getAttribute('aria-label')) ?? '')?.[1];
    await expect.poll(async () => (await scaleOf(1)) !== undefined && (await scaleOf(1)) === (await scaleOf(2))).toBe(true);
    for (const size of ['phone', 'wide'] as const) {
      await page.setViewportSize(viewports[size]);
      await page.waitForTimeout(250);
      await page.getByTestId('compare-spots').scrollIntoViewIfNeeded();
      await screenshot(page, `compare-spots-${size}`);
    }
    expect(errors).toEqual([]);
  }, 120_000);
});
