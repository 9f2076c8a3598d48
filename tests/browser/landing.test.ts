import { describe, expect, it } from 'vitest';
import { liveServerAndBrowser, screenshot, viewports } from '../support/browser';

describe('landing screen in Chromium', () => {
  const live = liveServerAndBrowser();

  it.each(['phone', 'wide'] as const)('shows its heading in the shipped font at %s size', async (size) => {
    const page = await live.browser.newPage({ viewport: viewports[size] });
    const errors: string[] = [];
    page.on('pageerror', (error) => errors.push(error.message));
    await page.goto(live.server.url);
    const heading = page.getByRole('heading', { level: 1 });
    await heading.waitFor();
    expect(await heading.textContent()).toBe('Design monochromators you can defend.');

    const font = await heading.evaluate(async (el) => {
      await document.fonts.ready;
      const family = getComputedStyle(el).fontFamily;
      const faces = [...document.fonts].filter((f) => f.family.replace(/"/g, '') === 'Inter-Bold');
      return {
        family,
        faceStatus: faces.map((f) => f.status),
        check: document.fonts.check('34px "Inter-Bold"'),
      };
    });
    // The heading asks for our font, the face is registered and has loaded: no fallback in use.
    expect(font.family).toContain('Inter-Bold');
    expect(font.faceStatus).toContain('loaded');
    expect(font.check).toBe(true);
    // Text shows as typed: Inter's contextual alternates (which draw the x of "6x8" as a ×) are off
    // on the heading and in a field alike (features/ui/text-shaping.web.ts).
    const shaping = await page.evaluate(() => {
      const input = document.body.appendChild(document.createElement('input'));
      const found = [getComputedStyle(document.querySelector('h1')!).fontFeatureSettings, getComputedStyle(input).fontFeatureSettings];
      input.remove();
      return found;
    });
    expect(shaping).toEqual(['"calt" 0', '"calt" 0']);

    await expect.poll(() => page.getByTestId('server-status').textContent()).toContain('Notebook server ready');
    await screenshot(page, `landing-${size}`);
    expect(errors).toEqual([]);
    await page.close();
  });

  it('answers a deep link with the app, which shows its not-found page', async () => {
    const page = await live.browser.newPage({ viewport: viewports.phone });
    const res = await page.goto(`${live.server.url}/no/such/page`);
    expect(res?.status()).toBe(200);
    await page.getByRole('heading', { name: 'No page at this address' }).waitFor();
    await expect.poll(() => page.title()).toBe('Page not found · Blazebook');
    await page.close();
  });

  it('leads a newcomer to sign-up, names each page in its title, and the wordmark goes home', async () => {
    const page = await live.browser.newPage({ viewport: viewports.phone });
    const errors: string[] = [];
    page.on('pageerror', (error) => errors.push(error.message));
    page.on('console', (message) => {
      if (message.type() === 'error') errors.push(message.text());
    });
    await page.goto(live.server.url);
    await page.getByRole('heading', { level: 1 }).waitFor();
    await expect.poll(() => page.title()).toBe('Grating instrument design · Blazebook');
    await page.getByRole('link', { name: 'Create an account' }).click();
    await page.getByRole('heading', { name: 'Create your account', level: 1 }).waitFor();
    await expect.poll(() => page.title()).toBe('Create your account · Blazebook');

    await page.getByRole('link', { name: 'Blazebook home' }).click();
    await page.getByRole('heading', { name: 'Design monochromators you can defend.' }).waitFor();
    expect(new URL(page.url()).pathname).toBe('/');

    await page.getByTestId('open-workbench').click();
    await page.getByRole('heading', { name: 'Workbench', level: 1 }).waitFor();
    await expect.poll(() => page.title()).toBe('Workbench · Blazebook');
    expect(errors).toEqual([]);
    await page.close();
  });

  it('serves an icon of its own at /favicon.ico and names it in the page', async () => {
    const page = await live.browser.newPage({ viewport: viewports.wide });
    await page.goto(live.server.url);
    const href = await page.locator('link[rel="icon"]').getAttribute('href');
    expect(href).toBeTruthy();
    const icon = await page.request.get(new URL(href!, live.server.url).toString());
    expect(icon.status()).toBe(200);
    const bytes = await icon.body();
    // An ICO file starts with reserved 0, type 1 (icon); a PNG with its 8-byte signature (common practice:
    // the formats' own headers, from memory).
    const ico = bytes.readUInt16LE(0) === 0 && bytes.readUInt16LE(2) === 1;
    const png = bytes.subarray(0, 8).equals(Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]));
    expect(ico || png).toBe(true);
    expect((await page.request.get(`${live.server.url}/favicon.ico`)).status()).toBe(200);
    await page.close();
  });
});
