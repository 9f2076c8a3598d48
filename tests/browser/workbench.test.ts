import type { BrowserContext, Page } from 'playwright-core';
import { describe, expect, it } from 'vitest';
import { fieldByPath } from '../../features/workbench/fields';
import { stepValue } from '../../features/workbench/form-model';
import { DEFAULT_DEVIATION_DEG } from '../../features/workbench/mount-switch';
import { presets } from '../../features/workbench/presets';
import { liveServerAndBrowser, screenshot, viewports, type ViewportName } from '../support/browser';

const field = (page: Page, path: string) => page.getByTestId(`field-${path}`);

/** The sketch's drawing as text: any change of geometry changes it. */
const sketchMarkup = (page: Page) => page.getByTestId('ray-sketch').evaluate((el) => el.innerHTML);

const readout = async (page: Page, id: string) => ((await page.getByTestId(id).textContent()) ?? '').trim();

/** The number a read-out starts with ("0.5 nm" with a no-break space → 0.5). */
const leadingNumber = (text: string) => Number(text.split(/\s/)[0]);

/** Pairs of sketch labels whose drawn boxes overlap by more than a pixel, as the browser laid them out. */
const overlappingLabels = (page: Page) =>
  page.getByTestId('ray-sketch').evaluate((el) => {
    const boxes = [...el.querySelectorAll('text')].map((t) => ({ text: t.textContent ?? '', r: t.getBoundingClientRect() }));
    const found: string[] = [];
    for (let i = 0; i < boxes.length; i++) {
      for (let j = i + 1; j < boxes.length; j++) {
        const a = boxes[i]!;
        const b = boxes[j]!;
        const x = Math.min(a.r.right, b.r.right) - Math.max(a.r.left, b.r.left);
        const y = Math.min(a.r.bottom, b.r.bottom) - Math.max(a.r.top, b.r.top);
        if (x > 1 && y > 1) found.push(`${a.text} / ${b.text}`);
      }
    }
    return found;
  });

/** The unit shown after a field's box (its suffix), '' when none. */
const suffixOf = (page: Page, path: string) =>
  field(page, path).evaluate((input) => (input.parentElement?.textContent ?? '').trim());

const isChecked = async (page: Page, testID: string) =>
  (await page.getByTestId(testID).getAttribute('aria-checked')) === 'true';

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
    const bandpassBefore = leadingNumber(await readout(page, 'readout-bandpass'));
    const sketchBefore = await sketchMarkup(page);
    await field(page, 'grating.grooveDensityPerMm').fill('2400');
    // Twice the grooves, twice the dispersion (Palmer & Loewen ch. 2): the bandpass falls.
    await expect
      .poll(async () => leadingNumber(await readout(page, 'readout-bandpass')))
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

  it('lists the safety cautions that apply, the ultraviolet one only while the design reaches below 300 nm', async () => {
    const { context, page, errors } = await open('wide');
    const card = page.getByTestId('cautions-card');
    await card.getByRole('heading', { name: 'Safety cautions' }).waitFor();
    // The starting design works in the visible with a source from 350 nm: no deep-UV caution.
    await page.getByTestId('caution-lasers').waitFor();
    expect(await page.getByTestId('caution-deep-uv').count()).toBe(0);
    await field(page, 'source.minNm').fill('200');
    await page.getByTestId('caution-deep-uv').waitFor();
    expect(await page.getByTestId('caution-deep-uv').textContent()).toMatch(/200\snm/);
    // Every caution still listed ends with the line that leaves the decision to the site.
    const items = await card.locator('[data-testid^="caution-"]').allTextContents();
    expect(items.length).toBeGreaterThanOrEqual(2);
    for (const text of items) expect(text).toContain('safety officer decide');
    await card.scrollIntoViewIfNeeded();
    await screenshot(page, 'workbench-cautions-wide');
    expect(errors).toEqual([]);
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

  // One page per size, every preset picked in turn (a pick replaces the design): each page load
  // costs seconds, and a page opened at its size is how a visitor arrives.
  it.each(['phone', 'tablet', 'wide'] as const)('lays out every preset at %s size without horizontal overflow', async (size) => {
    const { context, page, errors } = await open(size);
    for (const preset of presets) {
      await page.getByTestId(`preset-${preset.id}`).click();
      // The picker names the preset it applied: the design is now this one.
      await page.getByTestId('preset-picker').getByText(preset.summary, { exact: true }).waitFor();
      await page.getByTestId(`workbench-${size}`).waitFor();
      await page.getByTestId('ray-sketch').waitFor();
      // Nothing wider than the window: no clipped sidebars, no sideways scrolling of the page.
      const overflow = await page.evaluate(() => document.documentElement.scrollWidth - window.innerWidth);
      expect(overflow, `${preset.id} at ${size}`).toBeLessThanOrEqual(0);
      await screenshot(page, `workbench-${preset.id}-${size}`);
    }
    expect(errors).toEqual([]);
    await context.close();
  });
  describe('on a phone (390 × 844)', () => {
    it('switches the mount with the arrow keys and Space, bringing back a sensible deviation each time (items 2, 6)', async () => {
      const { context, page, errors } = await open('phone');
      await page.getByRole('button', { name: 'Mount: show fields' }).click();
      const deviation = field(page, 'layout.deviationAngleDeg');
      await deviation.fill('30');
      // Tab lands on the checked option of the radio group; the arrows move the choice.
      await page.getByTestId('mount-kind-czerny-turner').focus();
      await page.keyboard.press('ArrowRight');
      await expect.poll(() => isChecked(page, 'mount-kind-littrow')).toBe(true);
      expect(await deviation.inputValue()).toBe('0');
      await page.keyboard.press('ArrowLeft');
      await expect.poll(() => isChecked(page, 'mount-kind-czerny-turner')).toBe(true);
      // The angle typed for the Czerny–Turner comes back, not the Littrow's 0.
      expect(await deviation.inputValue()).toBe('30');
      // Space chooses the focused option: Ebert–Fastie, never typed for, starts at its default.
      await page.getByTestId('mount-kind-ebert-fastie').focus();
      await page.keyboard.press(' ');
      await expect.poll(() => isChecked(page, 'mount-kind-ebert-fastie')).toBe(true);
      expect(await deviation.inputValue()).toBe(String(DEFAULT_DEVIATION_DEG['ebert-fastie']));
      expect(Number(await deviation.inputValue())).toBeGreaterThan(0);
      await screenshot(page, 'workbench-mount-keys-phone');
      expect(errors).toEqual([]);
      await context.close();
    });

    it('never draws one sketch label on another, even at a Czerny–Turner deviation of 0 (item 2)', async () => {
      const { context, page } = await open('phone');
      await page.getByRole('button', { name: 'Mount: show fields' }).click();
      expect(await overlappingLabels(page)).toEqual([]);
      await field(page, 'layout.deviationAngleDeg').fill('0');
      await field(page, 'layout.collimatorOffAxisDeg').fill('');
      await expect.poll(() => page.getByTestId('ray-sketch').locator('text', { hasText: 'Camera' }).count()).toBe(1);
      expect(await overlappingLabels(page)).toEqual([]);
      await page.getByTestId('sketch-card').screenshot({ path: 'tests/artifacts/workbench-deviation-0-sketch-phone.png' });
      await context.close();
    });

    it('names the angle drawn for each mirror, and an Ebert–Fastie shows one mirror only (item 3)', async () => {
      const { context, page } = await open('phone');
      const notes = page.getByTestId('ray-sketch-notes');
      // The preset gives the collimator 6° and leaves the camera out.
      await expect.poll(async () => (await notes.textContent()) ?? '').toMatch(/Camera off-axis angle not given: drawn at 12\.00°/);
      expect(await notes.textContent()).toMatch(/collimator drawn at 6\.00°\sas given/);
      expect(await notes.textContent()).not.toMatch(/Mirror off-axis angles not given/);
      await page.getByRole('button', { name: 'Mount: show fields' }).click();
      expect(await field(page, 'layout.cameraFocalMm').count()).toBe(1);
      await page.getByTestId('mount-kind-ebert-fastie').click();
      await page.getByTestId('one-mirror-note').waitFor();
      // The camera's fields do not apply to one mirror: hidden, with the reason in one line.
      expect(await field(page, 'layout.cameraFocalMm').count()).toBe(0);
      expect(await field(page, 'layout.cameraOffAxisDeg').count()).toBe(0);
      expect(await page.getByTestId('one-mirror-note').textContent()).toMatch(/one mirror is both collimator and camera/);
      await expect.poll(async () => (await notes.textContent()) ?? '').toMatch(/One mirror, used twice/);
      expect(await notes.textContent()).not.toMatch(/camera/i);
      expect(await page.getByTestId('ray-sketch').getAttribute('aria-label')).toMatch(/one mirror of 150\smm focal length, used twice/);
      await screenshot(page, 'workbench-ebert-fastie-phone');
      await context.close();
    });

    it('shows one unit while a field has focus: the typed one, or the suffix (item 4)', async () => {
      const { context, page } = await open('phone');
      const path = 'slits.entranceWidthUm';
      await field(page, path).focus();
      expect(await suffixOf(page, path)).toBe('µm');
      await field(page, path).fill('25 µm');
      await expect.poll(() => suffixOf(page, path)).toBe('');
      await field(page, path).fill('-25 µm');
      await expect.poll(() => suffixOf(page, path)).toBe('');
      const box = await field(page, path).evaluate((input) => (input as HTMLInputElement).value + (input.parentElement?.textContent ?? ''));
      expect(box.match(/µm/g)).toHaveLength(1);
      await field(page, path).fill('25');
      await expect.poll(() => suffixOf(page, path)).toBe('µm');
      await context.close();
    });

    it('keeps the read-out and the plots on one wavelength, and moves it with a note when the range leaves it (item 5)', async () => {
      const { context, page } = await open('phone');
      const marker = page.getByTestId('plot-bandpass-selected');
      const header = page.getByTestId('plot-bandpass-readout');
      const wanted = await field(page, 'readout-wavelength').inputValue();
      await field(page, 'range.startNm').fill('250');
      await field(page, 'range.endNm').fill('800');
      await expect.poll(() => marker.getAttribute('data-nm')).toBe(wanted);
      // The plots name the read-out's own wavelength, not the nearest of their samples.
      expect(leadingNumber((await header.textContent()) ?? '')).toBe(Number(wanted));
      expect(await page.getByTestId('readout-moved').count()).toBe(0);
      await field(page, 'range.startNm').fill('600');
      await page.getByTestId('readout-moved').waitFor();
      expect(await field(page, 'readout-wavelength').inputValue()).toBe('600');
      expect(await page.getByTestId('readout-moved').textContent()).toMatch(new RegExp(`moved from ${wanted}\\snm to 600\\snm`));
      await expect.poll(() => marker.getAttribute('data-nm')).toBe('600');
      expect(leadingNumber((await header.textContent()) ?? '')).toBe(600);
      await page.getByTestId('readout-card').screenshot({ path: 'tests/artifacts/workbench-readout-moved-phone.png' });
      // Typed outside the range, the wavelength is refused with the range named.
      await field(page, 'readout-wavelength').fill('900');
      await page.getByText(/must be within the wavelength range, 600–800\snm/).waitFor();
      await page.getByTestId('readout-card').screenshot({ path: 'tests/artifacts/workbench-readout-refused-phone.png' });
      await context.close();
    });

    it('steps a numeric field with ArrowUp, ten steps with Shift+ArrowUp, and stops at its bounds (item 6)', async () => {
      const { context, page } = await open('phone');
      const path = 'slits.exitWidthUm';
      const spec = fieldByPath.get(path)!;
      const input = field(page, path);
      const start = await input.inputValue();
      const once = stepValue(spec, start, 1)!;
      await input.focus();
      await page.keyboard.press('ArrowUp');
      await expect.poll(() => input.inputValue()).toBe(once);
      expect(Number(once)).toBeGreaterThan(Number(start));
      await page.keyboard.press('Shift+ArrowUp');
      const tenMore = stepValue(spec, once, 1, 10)!;
      await expect.poll(() => input.inputValue()).toBe(tenMore);
      expect(Number(tenMore) - Number(once)).toBe(10 * (spec.step as number));
      await page.keyboard.press('ArrowDown');
      await expect.poll(() => input.inputValue()).toBe(stepValue(spec, tenMore, -1)!);
      // Down and down again: never below the field's minimum.
      for (let i = 0; i < 5; i++) await page.keyboard.press('Shift+ArrowDown');
      await expect.poll(() => input.inputValue()).toBe(String(spec.min));
      await context.close();
    });

    it('says the range table scrolls sideways, and which way the rest lies (item 8)', async () => {
      const { context, page } = await open('phone');
      const cue = page.getByTestId('range-table-scroll-cue');
      await cue.waitFor();
      expect(await cue.textContent()).toMatch(/Scroll sideways for all 7 columns →/);
      const scroller = page.getByTestId('range-table-scroll');
      expect(await scroller.evaluate((el) => el.scrollWidth > el.clientWidth)).toBe(true);
      await page.getByTestId('range-table').screenshot({ path: 'tests/artifacts/workbench-range-table-phone.png' });
      // Sideways, as a trackpad or a mouse with a tilt wheel does it.
      await scroller.hover();
      await page.mouse.wheel(400, 0);
      await expect.poll(() => scroller.evaluate((el) => el.scrollLeft)).toBeGreaterThan(0);
      await expect.poll(async () => (await cue.textContent()) ?? '').toMatch(/← Scroll back/);
      // The last column is in view once scrolled.
      const lastHeader = page.getByRole('columnheader').last();
      expect(await lastHeader.textContent()).toMatch(/other/);
      expect(await lastHeader.isVisible()).toBe(true);
      await context.close();
    });

    it('never breaks a number from its unit at 390 px, and signs orders with a true minus (items 19, 21)', async () => {
      const { context, page } = await open('phone');
      await field(page, 'grating.order').fill('-2');
      // Order −2 sends 580 nm out where order −1 sends 1160 nm: the overlap list names m = −1.
      await expect.poll(() => page.getByTestId('readout-card').textContent()).toMatch(/m=\u22121/);
      for (const id of ['readout-card', 'range-table', 'summary-bar', 'sketch-card']) {
        const text = (await page.getByTestId(id).textContent()) ?? '';
        // A plain (breakable) space between a figure and its unit is the defect.
        expect(text, id).not.toMatch(/\d (nm|mm|µm|°|%)/);
        expect(text, id).not.toMatch(/[=\s(]-\d/);
      }
      // The folded Grating section sums itself up with the order signed the same way.
      await page.getByRole('button', { name: 'Grating: hide fields' }).click();
      await expect.poll(() => page.getByTestId('section-grating').textContent()).toMatch(/order \u22122/);
      // Each figure's value and unit stay on one line in the laid-out page.
      const wrapped = await page.getByTestId('readout-card').evaluate((card) =>
        [...card.querySelectorAll('[data-testid^="readout-"]:not([data-testid="readout-card"])')]
          .filter((el) => el.children.length > 0 || /\d/.test(el.textContent ?? ''))
          .filter((el) => {
            const range = document.createRange();
            range.selectNodeContents(el);
            const lines = new Set([...range.getClientRects()].map((r) => Math.round(r.top)));
            return lines.size > 1;
          })
          .map((el) => el.textContent),
      );
      expect(wrapped).toEqual([]);
      await screenshot(page, 'workbench-units-phone');
      await context.close();
    });
  });

  it.each(['phone', 'tablet', 'wide'] as const)('lays out a Czerny–Turner at deviation 0 with clear labels at %s size', async (size) => {
    const { context, page, errors } = await open(size);
    if (size === 'phone') await page.getByRole('button', { name: 'Mount: show fields' }).click();
    await field(page, 'layout.deviationAngleDeg').fill('0');
    await expect.poll(() => overlappingLabels(page)).toEqual([]);
    const overflow = await page.evaluate(() => document.documentElement.scrollWidth - window.innerWidth);
    expect(overflow).toBeLessThanOrEqual(0);
    await screenshot(page, `workbench-deviation-0-${size}`);
    expect(errors).toEqual([]);
    await context.close();
  });
});
