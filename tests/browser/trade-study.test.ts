import path from 'node:path';
import type { Page } from 'playwright-core';
import { describe, expect, it } from 'vitest';
import { expectAccessible } from '../support/axe';
import { artifactsDir, liveServerAndBrowser, screenshot, viewports, watchConsole } from '../support/browser';

/** One part of the screen, saved on its own: the phone's scroll view keeps most of the page out of a full shot. */
const shootPart = (page: Page, testID: string, name: string) =>
  page.getByTestId(testID).screenshot({ path: path.join(artifactsDir, `${name}.png`) });

/** Waits for a condition on a loaded machine (expect.poll's 1 s default is short). */
const eventually = <T>(read: () => Promise<T>) => expect.poll(read, { timeout: 15_000 });

const drawingLabel = (page: Page, plot: string) => page.getByTestId(`${plot}-drawing`).getAttribute('aria-label');

/** Both the grating's and the prism's resolving power are drawn and named for a screen reader. */
async function expectBothPlotted(page: Page): Promise<void> {
  const summary = await drawingLabel(page, 'trade-plot-resolving-power');
  expect(summary).toMatch(/^Resolving power against wavelength, .* on a logarithmic scale\./);
  expect(summary).toMatch(/Grating \(solid line, circles\) from [\d.,\s]+ to [\d.,\s]+/);
  expect(summary).toMatch(/Prism \(long dashes, squares\) from [\d.,\s]+ to [\d.,\s]+/);
  expect(summary).toMatch(/Interference filter \(dotted line, triangles\)/);
  expect(summary).toMatch(/Coloured glass \(dash-dot line, diamonds\)/);
  for (const id of ['grating', 'prism']) {
    const d = await page.getByTestId(`trade-plot-resolving-power-series-${id}`).getAttribute('d');
    // A drawn line: a move and at least one segment.
    expect(d, id).toMatch(/^M[\d.]+,[\d.]+L/);
  }
  // The bandpass plot names the prism's non-linear growth in its caption.
  expect(await page.getByTestId('trade-plot-bandpass-caption').textContent()).toMatch(/grows toward the red/);
}

describe('the trade study card in the workbench', () => {
  const live = liveServerAndBrowser();

  it('opens from the keyboard on a phone, plots the grating and the prism, and gives verdicts in words at every size', async () => {
    const context = await live.browser.newContext({ viewport: viewports.phone });
    const page = await context.newPage();
    const errors = watchConsole(page);
    await page.goto(`${live.server.url}/workbench`);
    await page.getByTestId('readout-bandpass').waitFor();

    // A 0.5 nm bandpass limit: the workbench's grating is a few tenths of a nm wide (RLD × slit,
    // Palmer & Loewen ch. 2), a prism with the same mirrors and slits several nm (Born & Wolf §4.7).
    await page.getByRole('button', { name: 'Requirements: show fields' }).click();
    await page.getByTestId('field-requirements.maxBandpassNm').fill('0.5 nm');

    // Collapsed at first on a phone: nothing is worked out until it is opened.
    const card = page.getByTestId('trade-study-card');
    await card.scrollIntoViewIfNeeded();
    expect(await page.getByTestId('trade-study-body').count()).toBe(0);
    const toggle = page.getByTestId('trade-study-toggle');
    await toggle.focus();
    await page.keyboard.press('Enter');
    await page.getByTestId('trade-plot-resolving-power-drawing').waitFor();
    await expectBothPlotted(page);

    // Phone: one card per selector, and the verdicts as words, not colour alone.
    await page.getByTestId('trade-study-cards').waitFor();
    await eventually(() => page.getByTestId('trade-verdict-maxBandpassNm-grating').textContent()).toMatch(/^Pass/);
    expect(await page.getByTestId('trade-verdict-maxBandpassNm-prism').textContent()).toMatch(/^Fail.*over/);
    expect(await page.getByTestId('trade-verdict-coverage-coloured-glass').textContent()).toMatch(/^Fail.*span the range/);

    // The calculators are one link away.
    const link = page.getByRole('link', { name: 'Open the selector calculators' });
    expect(await link.getAttribute('href')).toBe('/selectors');

    await shootPart(page, 'trade-study-card', 'trade-study-card-phone');
    await shootPart(page, 'trade-plot-resolving-power', 'trade-study-plot-power-phone');
    await shootPart(page, 'trade-plot-bandpass', 'trade-study-plot-bandpass-phone');
    await shootPart(page, 'trade-study-cards', 'trade-study-figures-phone');
    await shootPart(page, 'trade-study-verdicts', 'trade-study-verdicts-phone');
    await expectAccessible(page, 'workbench with the trade study open at phone');

    // Closing it again from the keyboard takes the figures away.
    await toggle.focus();
    await page.keyboard.press('Enter');
    await eventually(() => page.getByTestId('trade-study-body').count()).toBe(0);

    // Tablet and wide: open from the start, the figures as a table.
    for (const size of ['tablet', 'wide'] as const) {
      await page.setViewportSize(viewports[size]);
      await page.getByTestId(`workbench-${size}`).waitFor();
      await page.getByTestId('trade-study-card').scrollIntoViewIfNeeded();
      await page.getByTestId('trade-plot-resolving-power-drawing').waitFor();
      await expectBothPlotted(page);
      await page.getByTestId('trade-study-table').waitFor();
      const header = await page.getByTestId('trade-study-table').getByRole('columnheader').allTextContents();
      expect(header).toEqual(['Figure', 'Grating', 'Prism', 'Interference filter', 'Coloured glass']);
      await eventually(() => page.getByTestId('trade-verdict-maxBandpassNm-prism').textContent()).toMatch(/^Fail/);
      await shootPart(page, 'trade-study-card', `trade-study-card-${size}`);
      await shootPart(page, 'trade-plot-resolving-power', `trade-study-plot-power-${size}`);
      await shootPart(page, 'trade-study-table', `trade-study-figures-${size}`);
      await shootPart(page, 'trade-study-verdicts', `trade-study-verdicts-${size}`);
      await screenshot(page, `trade-study-${size}`);
      await expectAccessible(page, `workbench with the trade study open at ${size}`);
    }

    // A prism of its own: a longer base resolves more (R = b|dn/dλ|, Born & Wolf §4.7).
    const before = await drawingLabel(page, 'trade-plot-resolving-power');
    await page.getByTestId('trade-prism-base').fill('200');
    await eventually(() => drawingLabel(page, 'trade-plot-resolving-power')).not.toBe(before);
    await page.getByTestId('trade-prism-apex').fill('200');
    await eventually(() => page.getByText('Apex angle: must be greater than 0° and less than 180°').count()).toBe(1);

    expect(errors).toEqual([]);
    await context.close();
  });
});
