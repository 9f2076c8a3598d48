import type { BrowserContext, Page } from 'playwright-core';
import { describe, expect, it } from 'vitest';
import { presets } from '../../features/workbench/presets';
import { liveServerAndBrowser, screenshot, viewports, type ViewportName } from '../support/browser';

const field = (page: Page, path: string) => page.getByTestId(`field-${path}`);

/** The sketch's drawing as text: any change of geometry changes it. */
const sketchMarkup = (page: Page) => page.getByTestId('ray-sketch').evaluate((el) => el.innerHTML);

const readout = async (page: Page, id: string) => ((await page.getByTestId(id).textContent()) ?? '').trim();

describe('design workbench in Chromium', () => {
  const live = liveServerAndBrowser();

  async function open(
    size: ViewportName,
  ): Promise<{ context: BrowserContext; page: Page; errors: string[] }> {
    const context = await live.browser.newContext({ viewport: viewports[size] });
    const page = await context.newPage();
    const errors: string[] = [];
    page.on('pageerror', (error) => errors.push(error.message));
    await page.goto(`${live.server.url}/workbench`);
    await page.getByTestId('readout-bandpass').waitFor();
    return { context, page, errors };
  }

  it('follows a groove-density change in the bandpass and the sketch', async () => {
    const { context, page, errors } = await open('wide');
    const bandpassBefore = Number(await readout(page, 'readout-bandpass').then((t) => t.split(' ')[0]));
    const sketchBefore = await sketchMarkup(page);
    await field(page, 'grating.grooveDensityPerMm').fill('2400');
    // Twice the grooves, twice the dispersion (Palmer & Loewen ch. 2): the bandpass falls.
    await expect
      .poll(async () => Number((await readout(page, 'readout-bandpass')).split(' ')[0]))
      .toBeLessThan(bandpassBefore * 0.6);
    expect(await sketchMarkup(page)).not.toBe(sketchBefore);
    expect(errors).toEqual([]);
    await context.close();
  });

  it('reads "0.5 m" typed into a focal length as 500 mm', async () => {
    const { context, page } = await open('wide');
    const input = field(page, 'layout.cameraFocalMm');
    await input.fill('0.5 m');
    await expect.poll(() => page.getByText('= 500 mm').count()).toBe(1);
    await input.blur();
    await expect.poll(() => input.inputValue()).toBe('500');
    await context.close();
  });

  it('keeps the last valid results, dimmed, while a negative slit width shows its error', async () => {
    const { context, page } = await open('wide');
    const before = await readout(page, 'readout-bandpass');
    await field(page, 'slits.exitWidthUm').fill('-5');
    await page.getByText('must be greater than 0').first().waitFor();
    const note = page.getByTestId('blocked-note');
    await note.waitFor();
    expect(await note.textContent()).toContain('Exit slit width');
    expect(await readout(page, 'readout-bandpass')).toBe(before);
    await screenshot(page, 'workbench-blocked-wide');
    await context.close();
  });

  it('warns about a wavelength beyond reach and leaves a gap in the plots', async () => {
    const { context, page } = await open('wide');
    await page.getByTestId('preset-visible-scanner').click();
    // 1200/mm with K = 12°: λ_max = 2d cos²K/|m| ≈ 1595 nm (Palmer & Loewen ch. 2), so 2000 nm is out.
    await field(page, 'range.endNm').fill('2000');
    await page.getByTestId('warning-unreachable').waitFor();
    const gaps = await page.getByTestId('plot-bandpass').evaluate((el) => {
      const d =
        [...el.querySelectorAll('path')]
          .map((p) => p.getAttribute('d') ?? '')
          .sort((a, b) => b.length - a.length)[0] ?? '';
      return (d.match(/M/g) ?? []).length;
    });
    // One continuous run below the limit: the line stops there instead of running on to 2000 nm.
    expect(gaps).toBeGreaterThanOrEqual(1);
    await field(page, 'readout-wavelength').fill('1800');
    await page.getByTestId('readout-unreachable').waitFor();
    await page.getByTestId('warning-unreachable').click();
    await expect
      .poll(() => page.evaluate(() => document.activeElement?.getAttribute('data-testid')))
      .toBe('field-range.endNm');
    await screenshot(page, 'workbench-unreachable-wide');
    await context.close();
  });

  it('finds the design as it was left after a reload', async () => {
    const { context, page } = await open('tablet');
    await field(page, 'grating.grooveDensityPerMm').fill('1800');
    await field(page, 'slits.entranceWidthUm').fill('0.2 mm');
    // Leaving a field normalises "0.2 mm" to the field's unit once the lazy unit parser has read
    // it (the hint says what it was read as); on a loaded machine that can take a moment.
    await page.getByText('= 200 µm').waitFor();
    await field(page, 'slits.exitWidthUm').fill('-5');
    await page.reload();
    await page.getByTestId('readout-bandpass').waitFor();
    expect(await field(page, 'grating.grooveDensityPerMm').inputValue()).toBe('1800');
    // The value is kept, not the spelling.
    expect(await field(page, 'slits.entranceWidthUm').inputValue()).toBe('200');
    expect(await field(page, 'slits.exitWidthUm').inputValue()).toBe('-5');
    await page.getByTestId('blocked-note').waitFor();
    await context.close();
  });

  it.each(
    presets.flatMap((preset) =>
      (['phone', 'tablet', 'wide'] as const).map((size) => [preset.id, size] as const),
    ),
  )('lays out the %s preset at %s size without horizontal overflow', async (presetId, size) => {
    const { context, page, errors } = await open(size);
    await page.getByTestId(`preset-${presetId}`).click();
    await page.getByTestId(`workbench-${size}`).waitFor();
    await page.getByTestId('ray-sketch').waitFor();
    // Nothing wider than the window: no clipped sidebars, no sideways scrolling of the page.
    const overflow = await page.evaluate(() => document.documentElement.scrollWidth - window.innerWidth);
    expect(overflow).toBeLessThanOrEqual(0);
    await screenshot(page, `workbench-${presetId}-${size}`);
    expect(errors).toEqual([]);
    await context.close();
  });
});
