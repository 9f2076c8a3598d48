import type { Page } from 'playwright-core';
import { describe, expect, it } from 'vitest';
import { expectAccessible } from '../support/axe';
import path from 'node:path';
import { artifactsDir, liveServerAndBrowser, screenshot, viewports } from '../support/browser';

/** One part of the screen, saved on its own: the phone's scroll view keeps most of the page out of a full shot. */
const shootPart = (page: Page, testID: string, name: string) =>
  page.getByTestId(testID).screenshot({ path: path.join(artifactsDir, `${name}.png`) });

const label = (page: Page, testID: string) => page.getByTestId(testID).getAttribute('aria-label');

/** Waits for a condition on a loaded machine (expect.poll's 1 s default is short). */
const eventually = <T>(read: () => Promise<T>) => expect.poll(read, { timeout: 15_000 });

describe('requirements in the workbench, on a phone', () => {
  const live = liveServerAndBrowser();

  it('fails a bandpass limit, shades it, fixes it with a solved value, and passes', async () => {
    const context = await live.browser.newContext({ viewport: viewports.phone });
    const page = await context.newPage();
    const errors: string[] = [];
    page.on('pageerror', (error) => errors.push(error.message));
    page.on('console', (message) => {
      if (message.type() === 'error') errors.push(message.text());
    });
    await page.goto(`${live.server.url}/workbench`);
    await page.getByTestId('readout-bandpass').waitFor();

    // The ultraviolet preset: 500 µm slits on 1200/mm at 200 nm. Its bandpass there is about
    // 0.83 nm — Δλ = w·RLD, RLD = d·cos β / (m·F) (Palmer & Loewen, ch. 2) — over a 0.5 nm limit.
    await page.getByTestId('preset-uv-excitation').click();
    await page.getByRole('button', { name: 'Requirements: show fields' }).click();
    await page.getByTestId('field-requirements.maxBandpassNm').fill('0.5 nm');

    const row = 'requirement-maxBandpassNm';
    await eventually(() => label(page, row)).toMatch(/^Fail: bandpass ≤ 0\.5\s*nm\./);
    // The worst wavelength is the short end: RLD grows as cos β does toward short wavelengths here.
    expect(await label(page, row)).toMatch(/at 200\s*nm, \d+\s*% over/);
    await eventually(() => page.getByTestId('requirements-summary').textContent()).toMatch(/^0 of 1 met/);

    // The bandpass plot hatches where the limit fails, and says so to a screen reader.
    const failing = page.getByTestId('plot-bandpass-failing');
    expect(Number(await failing.getAttribute('data-intervals'))).toBeGreaterThan(0);
    const plotLabel = await page.getByTestId('plot-bandpass').locator('[role="img"]').getAttribute('aria-label');
    expect(plotLabel).toMatch(/fails its requirements: bandpass over 0\.5 nm (between|at) 200/);
    await screenshot(page, 'requirements-fail-phone');
    await shootPart(page, 'requirements-card', 'requirements-card-fail-phone');
    await shootPart(page, 'plot-bandpass', 'requirements-plot-fail-phone');
    await expectAccessible(page, 'workbench with a failing requirement at phone');

    // The warning's fix link takes the designer to the exit slit.
    await page.getByTestId(`warning-${row}`).click();
    await eventually(() =>
      page.evaluate(() => document.activeElement?.getAttribute('data-testid') ?? ''),
    ).toBe('field-slits.exitWidthUm');

    // Solving for the slit width meets the limit.
    await page.getByTestId('solve-for-maxBandpassNm:slits').click();
    await eventually(() => label(page, row)).toMatch(/^Pass: /);
    await eventually(() => page.getByTestId('plot-bandpass-failing').count()).toBe(0);
    expect(await page.getByTestId(`warning-${row}`).count()).toBe(0);
    await shootPart(page, 'requirements-card', 'requirements-card-pass-phone');
    await page.getByTestId('sensitivity-toggle').click();
    await page.getByTestId('tolerance-view').waitFor();
    await shootPart(page, 'sensitivity-card', 'requirements-sensitivity-phone');

    // The same page, wider: the card sits near the warnings in each layout.
    for (const size of ['tablet', 'wide'] as const) {
      await page.setViewportSize(viewports[size]);
      await page.getByTestId(`workbench-${size}`).waitFor();
      await page.getByTestId('requirements-card').scrollIntoViewIfNeeded();
      await screenshot(page, `requirements-${size}`);
    }
    await expectAccessible(page, 'workbench with requirements at wide');
    expect(errors).toEqual([]);
    await context.close();
  });
});
