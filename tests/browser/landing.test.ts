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
    await page.close();
  });
});
