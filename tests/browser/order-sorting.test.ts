import path from 'node:path';
import type { Page } from 'playwright-core';
import { describe, expect, it } from 'vitest';
import { draftFromDesign } from '../../features/workbench/draft';
import { exampleDesign } from '../../shared/design';
import { expectAccessible } from '../support/axe';
import { artifactsDir, liveServerAndBrowser, screenshot, viewports, watchConsole } from '../support/browser';

/**
 * The order-sorting filter plan in the workbench, on the example design: a 200–1100 nm source
 * and a 300–900 nm range in first order. The second order brings source light λ/2 ≥ 200 nm onto
 * every setting from 400 nm on (mλ = nλ′, the grating equation; Palmer & Loewen, Diffraction
 * Grating Handbook, ch. 2), so the design overlaps until long-pass filters block it; a range that
 * ends below 400 nm lies within one octave of the source and needs none.
 */

const shootPart = (page: Page, testID: string, name: string) =>
  page.getByTestId(testID).screenshot({ path: path.join(artifactsDir, `${name}.png`) });

/** Waits for a condition on a loaded machine (expect.poll's 1 s default is short). */
const eventually = <T>(read: () => Promise<T>) => expect.poll(read, { timeout: 15_000 });

const shadedIntervals = async (page: Page) => {
  const shade = page.getByTestId('plot-efficiency-shaded');
  return (await shade.count()) === 0 ? 0 : Number(await shade.getAttribute('data-intervals'));
};
const efficiencySummary = (page: Page) =>
  page.getByTestId('plot-efficiency').locator('[role="img"]').getAttribute('aria-label');
const overlapWarnings = (page: Page) => page.getByTestId('warning-order-overlap').count();

describe('order-sorting filters in the workbench', () => {
  const live = liveServerAndBrowser();

  it('accepts the proposed plan, clears the shading and the warning, undoes it, and says when no filter is needed', async () => {
    const context = await live.browser.newContext({ viewport: viewports.phone });
    const page = await context.newPage();
    const errors = watchConsole(page);
    await page.goto(`${live.server.url}/workbench`);
    // The scratch workbench opens the draft it finds: the example design, before any filter.
    const draft = { version: 1, value: draftFromDesign(exampleDesign) };
    await page.evaluate((stored) => localStorage.setItem('blazebook.scratch-design', stored), JSON.stringify(draft));
    await page.reload();
    await page.getByTestId('order-sorting-card').waitFor();

    // Before: the overlap warning, the shaded efficiency plot, a count in the card, a plan offered.
    await eventually(() => overlapWarnings(page)).toBe(1);
    expect(await shadedIntervals(page)).toBeGreaterThan(0);
    expect(await efficiencySummary(page)).toMatch(/shaded where other orders reach the exit slit unblocked: 40\d(\.\d)?–900/);
    expect(await page.getByTestId('order-sorting-count').textContent()).toMatch(/^\d+ unblocked overlaps$/);
    await page.getByTestId('order-sorting-plan').waitFor();
    await screenshot(page, 'order-sorting-before-phone');
    await shootPart(page, 'order-sorting-card', 'order-sorting-card-before-phone');
    await shootPart(page, 'plot-efficiency', 'order-sorting-efficiency-before-phone');
    await expectAccessible(page, 'workbench with overlapping orders at phone');

    // Accept the plan from the keyboard: focus the button, press Enter.
    await page.getByTestId('order-sorting-use-plan').focus();
    await page.keyboard.press('Enter');
    await eventually(() => overlapWarnings(page)).toBe(0);
    await eventually(() => shadedIntervals(page)).toBe(0);
    expect(await page.getByTestId('order-sorting-count').textContent()).toBe('none left');
    expect(await efficiencySummary(page)).toMatch(/no overlapping order is left unblocked/);
    // The plan's filters are now the design's, each with where it is in the beam.
    expect(await page.getByTestId('order-sorting-filter-0').count()).toBe(1);
    expect(await page.getByTestId('order-sorting-in-beam-0').textContent()).toMatch(/^In the beam from 400 to \d+/);
    expect(await page.getByTestId('field-filters.0.cutOnNm').inputValue()).toMatch(/^\d+(\.\d+)?$/);
    // The scan curve marks where each filter goes in, in words.
    const marks = page.getByTestId('plot-rotation-marks');
    expect(Number(await marks.getAttribute('data-marks'))).toBeGreaterThanOrEqual(2);
    expect(await marks.textContent()).toContain('filter 2 in');
    expect(await page.getByTestId('plot-rotation').locator('[role="img"]').getAttribute('aria-label')).toMatch(
      /order-sorting filters change: filter 1 in at 400\s*nm, filter 2 in at/,
    );
    await shootPart(page, 'order-sorting-card', 'order-sorting-card-after-phone');
    await shootPart(page, 'plot-efficiency', 'order-sorting-efficiency-after-phone');
    await shootPart(page, 'plot-rotation', 'order-sorting-scan-marks-phone');
    await expectAccessible(page, 'workbench with the plan used at phone');

    // Undo puts the design back as it was: no filters, the warning and the shading return.
    await page.getByTestId('order-sorting-undo').click();
    await eventually(() => overlapWarnings(page)).toBe(1);
    await eventually(() => shadedIntervals(page)).toBeGreaterThan(0);
    expect(await page.getByTestId('order-sorting-filter-0').count()).toBe(0);

    // Use it again, then remove the second filter: the overlaps past its switch-in come back.
    await page.getByTestId('order-sorting-use-plan').click();
    await eventually(() => overlapWarnings(page)).toBe(0);
    const switchNm = Number(await page.getByTestId('field-filters.1.inFromNm').inputValue());
    await page.getByTestId('order-sorting-remove-1').click();
    await eventually(() => overlapWarnings(page)).toBe(1);
    await eventually(() => shadedIntervals(page)).toBe(1);
    expect(await efficiencySummary(page)).toContain(`unblocked: ${Math.floor(switchNm / 10)}`);
    expect(await page.getByTestId('order-sorting-count').textContent()).toMatch(/unblocked overlaps?$/);

    // A value the filter cannot take is named with its field and keeps its text.
    const cutOn = page.getByTestId('field-filters.0.cutOnNm');
    await cutOn.fill('blue');
    await page.getByTestId('blocked-note').waitFor();
    expect(await page.getByTestId('blocked-note').textContent()).toMatch(/Filter 1 cut-on could not read "blue"/);
    expect(await cutOn.inputValue()).toBe('blue');
    // Units read as in the design's fields: 0.395 µm is 395 nm.
    await cutOn.fill('0.395 µm');
    await eventually(() => page.getByTestId('blocked-note').count()).toBe(0);

    // Undo the removal: the design holds the whole plan again.
    await page.getByTestId('order-sorting-undo').click();
    await page.getByTestId('order-sorting-uses-plan').waitFor();
    await eventually(() => overlapWarnings(page)).toBe(0);

    // Wider screens: the card sits with the warnings in every layout.
    for (const size of ['tablet', 'wide'] as const) {
      await page.setViewportSize(viewports[size]);
      await page.getByTestId(`workbench-${size}`).waitFor();
      await page.getByTestId('order-sorting-card').scrollIntoViewIfNeeded();
      await screenshot(page, `order-sorting-${size}`);
      await expectAccessible(page, `workbench with the filter card at ${size}`);
    }

    // A range inside one octave of the source: λ/2 ≤ 195 nm below 390 nm, short of the 200 nm source.
    // The plan's filters stay in the design (never in the beam now), and the card says none is needed.
    await page.setViewportSize(viewports.phone);
    await page.getByTestId('workbench-phone').waitFor();
    const end = page.getByTestId('field-range.endNm');
    await end.fill('390');
    await page.getByTestId('order-sorting-none-needed').waitFor();
    expect(await page.getByTestId('order-sorting-none-needed').textContent()).toMatch(/^No filter needed/);
    await eventually(() => overlapWarnings(page)).toBe(0);
    expect(await shadedIntervals(page)).toBe(0);
    await shootPart(page, 'order-sorting-card', 'order-sorting-none-needed-phone');

    expect(errors).toEqual([]);
    await context.close();
  });
});
