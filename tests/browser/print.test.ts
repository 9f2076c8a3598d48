import { execFileSync } from 'node:child_process';
import { mkdirSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import type { Page } from 'playwright-core';
import { describe, expect, it } from 'vitest';
import { artifactsDir, liveServerAndBrowser, screenshot, viewports, type ViewportName } from '../support/browser';

/** What the printer would get as text, read back with poppler's pdftotext (installed beside Chromium). */
function pdfText(pdf: Buffer, name: string): string {
  mkdirSync(artifactsDir, { recursive: true });
  const file = path.join(artifactsDir, `${name}.pdf`);
  writeFileSync(file, pdf);
  return execFileSync('pdftotext', ['-layout', file, '-'], { encoding: 'utf8' });
}

/** Is the element laid out on the page (not display: none, some area)? */
const shown = (page: Page, testID: string) =>
  page.getByTestId(testID).first().evaluate((el) => {
    const box = el.getBoundingClientRect();
    return getComputedStyle(el).display !== 'none' && box.width > 0 && box.height > 0;
  });

describe('printing a screen in Chromium', () => {
  const live = liveServerAndBrowser();

  it.each(['phone', 'wide'] as const satisfies readonly ViewportName[])(
    'prints the workbench at %s size with the sketch and plots and without its buttons',
    async (size) => {
      const page = await live.browser.newPage({ viewport: viewports[size] });
      await page.goto(`${live.server.url}/workbench`);
      await page.getByTestId('readout-bandpass').waitFor();
      await page.getByTestId('ray-sketch').waitFor();
      const bandpass = ((await page.getByTestId('readout-bandpass').textContent()) ?? '').trim();
      expect(bandpass).not.toBe('');

      // On screen the controls are there and the page is one window high, its panes scrolling.
      expect(await shown(page, 'save-to-notebook')).toBe(true);

      await page.emulateMedia({ media: 'print' });
      expect(await shown(page, 'save-to-notebook')).toBe(false);
      expect(await shown(page, 'ray-sketch')).toBe(true);
      expect(await shown(page, 'plots-card')).toBe(true);
      // Nothing on paper may be cut off by a scrolling pane: the document is as tall as its content.
      const heights = await page.evaluate(() => ({
        document: document.documentElement.scrollHeight,
        clipped: [...document.querySelectorAll('#root *')].filter((el) => {
          const style = getComputedStyle(el);
          return (style.overflowY === 'auto' || style.overflowY === 'scroll') && el.scrollHeight > el.clientHeight + 1;
        }).length,
      }));
      expect(heights.clipped).toBe(0);
      expect(heights.document).toBeGreaterThan(viewports[size].height);
      await screenshot(page, `print-workbench-${size}`);

      const text = pdfText(await page.pdf({ printBackground: true, width: `${viewports[size].width}px` }), `print-workbench-${size}`);
      expect(text).toContain('Ray sketch');
      expect(text).toContain('Across the range');
      // The read-out's figure is in the printed text (pdftotext may set its no-break spaces as spaces).
      expect(text.replace(/\s+/g, ' ')).toContain(bandpass.replace(/\s+/g, ' '));
      expect(text).not.toContain('Save to a notebook');
      await page.close();
    },
  );

  it('prints the landing page without its buttons', async () => {
    const page = await live.browser.newPage({ viewport: viewports.wide });
    await page.goto(live.server.url);
    await page.getByTestId('landing-heading').waitFor();
    await page.emulateMedia({ media: 'print' });
    expect(await shown(page, 'open-workbench')).toBe(false);
    const text = pdfText(await page.pdf(), 'print-landing');
    expect(text).toContain('Design monochromators you can defend.');
    expect(text).toContain('Keep the reasoning');
    expect(text).not.toContain('Open the workbench');
    await screenshot(page, 'print-landing-wide');
    await page.close();
  });
});
