import path from 'node:path';
import type { Page } from 'playwright-core';
import { describe, expect, it } from 'vitest';
import { draftFromDesign } from '../../features/workbench/draft';
import { exampleDesign } from '../../shared/design';
import { expectAccessible } from '../support/axe';
import { artifactsDir, liveServerAndBrowser, viewports, watchConsole, type ViewportName } from '../support/browser';

/**
 * The image-quality card on the example design (a 0.3 m Czerny–Turner, 1200/mm, camera 10° off
 * axis): the exact trace runs in its Web Worker and the spot diagrams follow an edit of the
 * camera's off-axis angle.
 */

/** A part scrolled to the top of its pane, then the viewport. */
async function shootPart(page: Page, testID: string, name: string) {
  await page.getByTestId(testID).evaluate((node) => node.scrollIntoView({ block: 'start' }));
  await page.screenshot({ path: path.join(artifactsDir, `${name}.png`) });
}

/** The card scrolled to the top of its pane, then the viewport: an element inside a scroll view shoots blank. */
async function shootCard(page: Page, name: string) {
  await page.getByTestId('trace-card').evaluate((node) => node.scrollIntoView({ block: 'start' }));
  await page.screenshot({ path: path.join(artifactsDir, `${name}.png`) });
}

async function openWithExample(page: Page, url: string) {
  await page.goto(`${url}/workbench`);
  const draft = { version: 1, value: draftFromDesign(exampleDesign) };
  await page.evaluate((stored) => localStorage.setItem('blazebook.scratch-design', stored), JSON.stringify(draft));
  await page.reload();
  await page.getByTestId('trace-card').waitFor();
}

/** Every figure the spot diagrams print (their RMS widths), with the coma sentence: what an edit should move. */
const spotFigures = (page: Page) =>
  page.evaluate(() =>
    [...document.querySelectorAll('[data-testid$="-rms"], [data-testid="trace-coma"]')].map((node) => node.textContent ?? '').join(' | '),
  );

describe('the image quality card', () => {
  const live = liveServerAndBrowser();

  it('traces in a Web Worker at tablet size and follows an edit of the camera’s off-axis angle', async () => {
    const context = await live.browser.newContext({ viewport: viewports.tablet });
    const page = await context.newPage();
    const errors = watchConsole(page);
    const workers: string[] = [];
    page.on('worker', (worker) => workers.push(worker.url()));
    await openWithExample(page, live.server.url);
    // Open at first on a tablet: it traces on its own.
    await page.getByTestId('trace-spot-centre-centre-rms').waitFor({ timeout: 30_000 });
    expect(await page.getByTestId('trace-status').textContent()).toMatch(/^Traced 4\D?000 rays per wavelength/);
    // The range's start, centre and end, each with the slit's top, centre and bottom.
    for (const role of ['start', 'centre', 'end']) {
      for (const height of ['top', 'centre', 'bottom']) expect(await page.getByTestId(`trace-spot-${role}-${height}`).count()).toBe(1);
    }
    // The trace ran off the page's thread, in the worker chunk the export wrote.
    expect(workers.some((url) => /trace/.test(url)), workers.join(', ')).toBe(true);
    const before = await spotFigures(page);
    await shootCard(page, 'trace-card-tablet');

    await shootPart(page, 'trace-line-shape', 'trace-details-tablet');

    // 10° → 4°: a camera nearer its axis has less astigmatism and coma, so the spots change.
    // Long tasks on the page's thread from the edit until the new spots are drawn: the trace
    // itself runs in the worker, so only React's commit of the new figures may take the thread.
    await page.evaluate(() => {
      const seen: number[] = [];
      (window as unknown as { traceLongTasks: number[] }).traceLongTasks = seen;
      new PerformanceObserver((list) => list.getEntries().forEach((entry) => seen.push(entry.duration))).observe({ type: 'longtask' });
    });
    const field = page.getByTestId('field-layout.cameraOffAxisDeg');
    await field.fill('4');
    const editedAt = Date.now();
    await expect.poll(() => spotFigures(page), { timeout: 15_000 }).not.toBe(before);
    const followedMs = Date.now() - editedAt;
    const longTasks = await page.evaluate(() => (window as unknown as { traceLongTasks: number[] }).traceLongTasks);
    console.log(`Long tasks on the page's thread meanwhile (ms): ${longTasks.map((ms) => ms.toFixed(0)).join(', ') || 'none'}.`);
    await expect.poll(() => page.getByTestId('trace-status').textContent(), { timeout: 15_000 }).toMatch(/^Traced/);
    expect(await field.inputValue()).toBe('4');
    console.log(`Spot diagrams followed the edit in ${followedMs} ms (poll granularity included).`);

    await shootCard(page, 'trace-card-tablet-edited');
    await expectAccessible(page, 'image quality card at tablet');
    expect(errors).toEqual([]);
    await context.close();
  });

  it('lays the spots out as a strip on a phone and a grid on wide screens, and re-traces with a curved slit', async () => {
    for (const size of ['phone', 'wide'] as const satisfies readonly ViewportName[]) {
      const context = await live.browser.newContext({ viewport: viewports[size] });
      const page = await context.newPage();
      const errors = watchConsole(page);
      await openWithExample(page, live.server.url);
      // Collapsed at first on a phone; open it.
      if (size === 'phone') await page.getByTestId('trace-toggle').click();
      await page.getByTestId('trace-spot-centre-centre-rms').waitFor({ timeout: 30_000 });
      expect(await page.getByTestId(size === 'phone' ? 'trace-spot-strip' : 'trace-spot-grid').count()).toBe(1);
      const straight = await page.getByTestId('trace-curvature').textContent();
      expect(straight).toMatch(/straight entrance slit/);
      await page.getByTestId('trace-curved-entrance').click();
      await expect.poll(() => page.getByTestId('trace-curvature').textContent(), { timeout: 15_000 }).toMatch(/^With the curved entrance slit/);
      await shootCard(page, `trace-card-${size}`);
      await shootPart(page, 'trace-curvature', `trace-details-${size}`);
      await expectAccessible(page, `image quality card at ${size}`);
      expect(errors).toEqual([]);
      await context.close();
    }
  });
});
