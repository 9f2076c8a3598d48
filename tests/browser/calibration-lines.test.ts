import path from 'node:path';
import type { Page } from 'playwright-core';
import { describe, expect, it } from 'vitest';
import { draftFromDesign } from '../../features/workbench/draft';
import { exampleDesign, type Design } from '../../shared/design';
import { expectAccessible } from '../support/axe';
import { artifactsDir, liveServerAndBrowser, screenshot, viewports, watchConsole } from '../support/browser';

/**
 * One part of the screen, saved on its own. The card is taller than the screen and sits in a
 * scroll view, whose element shots come out blank past the window: the window is made as tall as
 * the part for the shot (same width, so the same layout), then put back.
 */
async function shootPart(page: Page, testID: string, name: string): Promise<void> {
  const size = page.viewportSize()!;
  const part = page.getByTestId(testID);
  const box = (await part.boundingBox())!;
  await page.setViewportSize({ width: size.width, height: Math.max(size.height, Math.ceil(box.height) + 200) });
  await part.scrollIntoViewIfNeeded();
  await part.screenshot({ path: path.join(artifactsDir, `${name}.png`) });
  await page.setViewportSize(size);
}

/** Waits for a condition on a loaded machine (expect.poll's 1 s default is short). */
const eventually = <T>(read: () => Promise<T>) => expect.poll(read, { timeout: 15_000 });

const plain = (text: string | null) => (text ?? '').replace(/[\u00A0\u202F]/g, ' ');

/** The number of lines the card says land on the detector, from its coverage sentence. */
async function statedOnDetector(page: Page): Promise<number> {
  const words = plain(await page.getByTestId('calibration-coverage').textContent());
  const match = /(\d+) lines? lands? on the detector/.exec(words);
  expect(match, words).not.toBeNull();
  return Number(match![1]);
}

/** The strip draws one tick per line the card says lands, and its spoken summary says the same. */
async function expectStripMatchesCoverage(page: Page): Promise<number> {
  await page.getByTestId('calibration-strip-drawing').waitFor();
  const stated = await statedOnDetector(page);
  expect(await page.getByTestId('calibration-strip-tick').count()).toBe(stated);
  const summary = plain(await page.getByTestId('calibration-strip-drawing').getAttribute('aria-label'));
  // The detector's ends by hand: 564.68 and 635.14 nm (tests/features/calibration/detector-strip.test.ts).
  expect(summary).toMatch(new RegExp(`^Detector strip, pixels 0 to 1,?023 \\(564\\.68–635\\.14 nm\\): ${stated} lamp lines`));
  return stated;
}

describe('the calibration lamp lines in the workbench', () => {
  const live = liveServerAndBrowser();

  it('opens on a phone, ticks each lamp line that lands on the detector at its pixel, and fits every size', async () => {
    const context = await live.browser.newContext({ viewport: viewports.phone });
    const page = await context.newPage();
    const errors = watchConsole(page);
    await page.goto(`${live.server.url}/workbench`);
    await page.getByTestId('readout-bandpass').waitFor();

    // The default preset has no detector: the card says placement needs one.
    await page.getByTestId('calibration-card').scrollIntoViewIfNeeded();
    await page.getByTestId('calibration-toggle').click();
    expect(await page.getByTestId('calibration-no-detector').textContent()).toMatch(/^Pixel placement needs a detector/);
    expect(await page.getByTestId('calibration-strip').count()).toBe(0);

    // The example design, with a line list of the bench's own (two invented demo lines).
    const design: Design = {
      ...exampleDesign,
      curves: [
        { kind: 'line-list', name: 'Bench lamp', checksum: 'a'.repeat(64), medium: 'air', wavelengthsNm: [590.5, 620.5], values: [1, 0.4] },
      ],
    };
    const draft = { version: 1, value: draftFromDesign(design) };
    await page.evaluate((stored) => localStorage.setItem('blazebook.scratch-design', stored), JSON.stringify(draft));
    await page.reload();
    await page.getByTestId('readout-bandpass').waitFor();

    // Collapsed at first on a phone: nothing is worked out until it is opened.
    const card = page.getByTestId('calibration-card');
    await card.scrollIntoViewIfNeeded();
    expect(await page.getByTestId('calibration-body').count()).toBe(0);
    const toggle = page.getByTestId('calibration-toggle');
    expect(await toggle.getAttribute('aria-expanded')).toBe('false');
    await toggle.focus();
    await page.keyboard.press('Enter');
    await page.getByTestId('calibration-body').waitFor();
    expect(await toggle.getAttribute('aria-expanded')).toBe('true');

    // The example design: 300–900 nm, 1200 g/mm, f = 300 mm, 1024 × 25 µm detector; mercury and neon shown.
    expect(await page.getByTestId('calibration-lamp-Hg').getAttribute('aria-pressed')).toBe('true');
    expect(await page.getByTestId('calibration-lamp-Na').getAttribute('aria-pressed')).toBe('false');
    expect(plain(await page.getByTestId('calibration-count').textContent())).toMatch(/^\d+ lines fall in 300–900 nm\.$/);
    expect(await page.getByTestId('calibration-source').textContent()).toMatch(/NIST Atomic Spectra Database.*to be verified/);
    expect(await page.getByTestId('calibration-user-lists').textContent()).toBe('Your line list included: Bench lamp.');
    expect(await page.getByTestId('calibration-line-590.5').textContent()).toMatch(/^Bench lamp590\.5/);

    const onDetector = await expectStripMatchesCoverage(page);
    expect(onDetector).toBeGreaterThanOrEqual(4);
    // By hand (grating equation, Palmer & Loewen ch. 2): grating set for 600 nm at 30° deviation,
    // α = 36.882°, β_c = 6.882°; Hg 576.9598 nm leaves at β = 5.289°, x = 300 mm · tan(−1.593°) =
    // −8.344 mm, pixel −8.344 / 0.025 + 511.5 = 177.7. Hg 546.0735 nm (β = 3.160°, x = −19.5 mm)
    // falls short of the 25.6 mm detector.
    expect(plain(await page.getByTestId('calibration-line-576.9598-pixel').textContent())).toBe('177.7');
    expect(plain(await page.getByTestId('calibration-line-546.0735-pixel').textContent())).toBe('before pixel 0');
    expect(plain(await page.getByTestId('calibration-off-detector').textContent())).toMatch(/before pixel 0 .*546\.0735 nm/);
    // A cubic against the design's own dispersion, with its residual as a fraction of a pixel.
    expect(plain(await page.getByTestId('calibration-coverage').textContent())).toMatch(/RMS .* nm\): .* of a pixel/);
    // Hg 253.652 nm through the 2nd order at 507.304 nm (2 × 253.652): the example has no filters.
    expect(plain(await page.getByTestId('calibration-ghosts').textContent())).toContain(
      'Hg 253.652 nm in 2nd order appears at 507.304 nm — not blocked',
    );
    // Mercury is shown: the lamp's caution, ending with the safety module's closing line.
    expect(await page.getByTestId('calibration-mercury-caution').textContent()).toMatch(/Ultraviolet below 300 nm.*safety officer/s);

    await shootPart(page, 'calibration-card', 'calibration-card-phone');
    await shootPart(page, 'calibration-strip', 'calibration-strip-phone');
    // The strip fits the phone: inside the card, the card inside the 390 px screen.
    const stripBox = (await page.getByTestId('calibration-strip-drawing').boundingBox())!;
    const cardBox = (await card.boundingBox())!;
    expect(stripBox.x).toBeGreaterThanOrEqual(cardBox.x);
    expect(stripBox.x + stripBox.width).toBeLessThanOrEqual(cardBox.x + cardBox.width);
    expect(cardBox.x + cardBox.width).toBeLessThanOrEqual(viewports.phone.width);
    await expectAccessible(page, 'workbench with the calibration lines open at phone');

    // Sodium on, mercury off: the D pair joins the table, and the mercury caution goes.
    await page.getByTestId('calibration-lamp-Na').click();
    await eventually(() => page.getByTestId('calibration-lamp-Na').getAttribute('aria-pressed')).toBe('true');
    await page.getByTestId('calibration-line-588.995').waitFor();
    await page.getByTestId('calibration-lamp-Hg').click();
    await eventually(() => page.getByTestId('calibration-mercury-caution').count()).toBe(0);
    await expectStripMatchesCoverage(page);
    await page.getByTestId('calibration-lamp-Hg').click();
    await page.getByTestId('calibration-mercury-caution').waitFor();

    // Closing it takes the report away.
    await toggle.focus();
    await page.keyboard.press('Enter');
    await eventually(() => page.getByTestId('calibration-body').count()).toBe(0);

    // Tablet and wide: open from the start.
    for (const size of ['tablet', 'wide'] as const) {
      await page.setViewportSize(viewports[size]);
      await page.getByTestId(`workbench-${size}`).waitFor();
      await page.getByTestId('calibration-card').scrollIntoViewIfNeeded();
      await page.getByTestId('calibration-body').waitFor();
      await expectStripMatchesCoverage(page);
      expect(plain(await page.getByTestId('calibration-line-576.9598-pixel').textContent())).toBe('177.7');
      await shootPart(page, 'calibration-card', `calibration-card-${size}`);
      await shootPart(page, 'calibration-strip', `calibration-strip-${size}`);
      await screenshot(page, `calibration-${size}`);
      await expectAccessible(page, `workbench with the calibration lines open at ${size}`);
    }

    expect(errors).toEqual([]);
    await context.close();
  });
});
