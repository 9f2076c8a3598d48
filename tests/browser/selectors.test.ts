import type { Page } from 'playwright-core';
import { describe, expect, it } from 'vitest';
import { expectAccessible } from '../support/axe';
import { liveServerAndBrowser, screenshot, viewports, watchConsole, type ViewportName } from '../support/browser';

/** Replaces a field's text the way a person does: focus, select all, type. */
async function typeInto(page: Page, testID: string, text: string) {
  const field = page.getByTestId(testID);
  await field.click();
  await page.keyboard.press('ControlOrMeta+A');
  await page.keyboard.type(text);
}

const sizes = ['phone', 'tablet', 'wide'] as const satisfies readonly ViewportName[];

describe('filters and prisms screen in Chromium', () => {
  const live = liveServerAndBrowser();

  it.each(sizes)('works out a thin-film filter as it is typed, names a refused field, and stays accessible at %s size', async (size) => {
    const page = await live.browser.newPage({ viewport: viewports[size] });
    const errors = watchConsole(page);
    await page.goto(`${live.server.url}/selectors`);
    await page.getByRole('heading', { name: 'Filters and prisms', level: 1 }).waitFor();
    await page.getByTestId('thin-film-airy').waitFor();
    await expect.poll(() => page.title()).toBe('Filters and prisms · Blazebook');

    // t = mλ/(2n) = 2 × 550 / (2 × 1.45) = 379.31 nm (Hecht, Optics, §9.6; hand computation).
    await expect.poll(() => page.getByTestId('thin-film-figures-thickness').textContent()).toBe('379.31\u00A0nm');
    // 2nt = 1100 nm: peaks 1100/2 = 550 and 1100/3 = 366.67 nm in 350–800 nm, so the shorter one needs blocking.
    await expect.poll(() => page.getByTestId('thin-film-peaks').textContent()).toBe('366.67, 550 nm');
    expect(await page.getByTestId('thin-film-warning-other-peaks').textContent()).toMatch(/long-pass/);

    // 0.6 µm in order 2: t = 2 × 600 / 2.9 = 413.79 nm; finesse π√0.9/0.1 = 29.80 (hand computation).
    await typeInto(page, 'thin-film-targetNm', '0.6 um');
    await expect.poll(() => page.getByTestId('thin-film-figures-thickness').textContent()).toBe('413.79\u00A0nm');
    expect(await page.getByTestId('thin-film-figures-finesse').textContent()).toBe('29.8');
    // The tilt curve: λ(30°) = 600 √(1 − (0.5/1.8)²) = 600 × 0.96065 = 576.39 nm.
    expect(await page.getByTestId('thin-film-figures-tilt').textContent()).toBe('576.39\u00A0nm');
    // On a wide screen the inputs keep a 400 px column and the plots take the rest of the 1440 px.
    if (size === 'wide') expect((await page.getByTestId('thin-film-airy').boundingBox())?.width).toBeGreaterThan(800);
    const summary = await page.getByTestId('thin-film-airy-figure').getAttribute('aria-label');
    expect(summary).toMatch(/^Transmission at normal incidence against wavelength, 350 to 800\u00A0nm/);

    await typeInto(page, 'thin-film-mirrorReflectance', '100 %');
    await page.getByTestId('thin-film-blocked').waitFor();
    expect(await page.getByText('Mirror reflectance must be less than 1 (a fraction: 0.9 means 90 %)').count()).toBeGreaterThan(0);
    await screenshot(page, `selectors-thin-film-${size}`);
    await page.getByTestId('thin-film-tilt').scrollIntoViewIfNeeded();
    await screenshot(page, `selectors-thin-film-plots-${size}`);
    await expectAccessible(page, `selectors thin-film at ${size}`);
    await typeInto(page, 'thin-film-mirrorReflectance', '95 %');
    await expect.poll(() => page.getByTestId('thin-film-blocked').count()).toBe(0);
    expect(errors).toEqual([]);
    await page.close();
  });

  it.each(sizes)('chooses the glass stack with the keyboard, keeps it in the URL, and shows the stacking trade-off at %s size', async (size) => {
    const page = await live.browser.newPage({ viewport: viewports[size] });
    const errors = watchConsole(page);
    await page.goto(`${live.server.url}/selectors`);
    await page.getByTestId('thin-film-airy').waitFor();
    await page.getByRole('radio', { name: 'Thin-film filter' }).focus();
    await page.keyboard.press('ArrowRight');
    await page.getByTestId('glass-plot').waitFor();
    await expect.poll(() => new URL(page.url()).searchParams.get('tool')).toBe('glass');
    expect(await page.getByRole('radio', { name: 'Glass stack' }).getAttribute('aria-checked')).toBe('true');

    // One filter at its reference thickness is compared with twice the thickness.
    const sentence = page.getByTestId('glass-trade-off');
    await expect.poll(() => sentence.textContent()).toMatch(/^This filter at its reference thickness: 10–90 % edge 30\u00A0nm/);
    // Peak: 0.95 internal × (1 − ρ)², ρ = (0.52/2.52)² = 0.04258, (0.95742)² = 0.91665 → 87.08 % (Hecht, Optics, §4.6).
    expect(await page.getByTestId('glass-figures-stack-peak').textContent()).toBe('87.1\u202F%');

    await page.getByTestId('glass-add-filter').click();
    await page.getByRole('heading', { name: 'Filter 2', level: 3 }).waitFor();
    // Two of the same glass: 0.95² × 0.91665² = 0.7583 peak; the edge narrows (hand computation, Beer–Lambert).
    await expect.poll(() => page.getByTestId('glass-figures-stack-peak').textContent()).toBe('75.8\u202F%');
    expect(await sentence.textContent()).toMatch(/^This stack: 10–90 % edge 2\d\.\d\u00A0nm/);
    expect(await page.getByTestId('glass-plot-line-3').count()).toBe(1);

    await typeInto(page, 'glass-filter-2-edgeWidthNm', '-5');
    await page.getByTestId('glass-blocked').waitFor();
    expect(await page.getByText('Filter 2 edge width must be greater than 0').count()).toBeGreaterThan(0);
    await screenshot(page, `selectors-glass-${size}`);
    await page.getByTestId('glass-plot').scrollIntoViewIfNeeded();
    await screenshot(page, `selectors-glass-plots-${size}`);
    await expectAccessible(page, `selectors glass stack at ${size}`);

    await page.getByRole('button', { name: 'Remove filter 2' }).click();
    await expect.poll(() => page.getByTestId('glass-blocked').count()).toBe(0);
    expect(errors).toEqual([]);
    await page.close();
  });

  it.each(sizes)('opens the prism from a link, plots its non-linear bandpass and notes a range beyond its data at %s size', async (size) => {
    const page = await live.browser.newPage({ viewport: viewports[size] });
    const errors = watchConsole(page);
    await page.goto(`${live.server.url}/selectors?tool=prism`);
    await page.getByTestId('prism-bandpass').waitFor();
    expect(await page.getByTestId('prism-source').textContent()).toMatch(/Malitson.*1965/);
    // Bandpass grows toward the red: fused silica's dn/dλ is about −9.4×10⁻⁵/nm near 420 nm and
    // −1.4×10⁻⁵/nm near 930 nm (Malitson 1965's table, from memory), so the ends differ several-fold.
    const caption = (await page.getByTestId('prism-bandpass-caption').textContent()) ?? '';
    const times = Number(/, ([\d.]+) times wider/.exec(caption)?.[1]);
    expect(times).toBeGreaterThan(5);

    await typeInto(page, 'prism-startNm', '200');
    await page.getByTestId('prism-outside-data').waitFor();
    expect(await page.getByTestId('prism-uv').textContent()).toMatch(/Ultraviolet below 300/);

    await page.getByRole('radio', { name: 'Your own Sellmeier formula' }).click();
    await typeInto(page, 'prism-sellmeierC', '0.0684043, 0.1162414');
    expect(
      await page.getByText('Sellmeier C (µm) must list as many resonance wavelengths as B has coefficients').count(),
    ).toBeGreaterThan(0);
    await typeInto(page, 'prism-sellmeierC', '0.0684043, 0.1162414, 9.896161');
    await expect.poll(() => page.getByTestId('prism-blocked').count()).toBe(0);

    await typeInto(page, 'prism-apexDeg', '200');
    await page.getByTestId('prism-blocked').waitFor();
    expect(await page.getByText('Apex angle must be less than 180°').count()).toBeGreaterThan(0);
    await screenshot(page, `selectors-prism-${size}`);
    await page.getByTestId('prism-index').scrollIntoViewIfNeeded();
    await screenshot(page, `selectors-prism-plots-${size}`);
    await expectAccessible(page, `selectors prism at ${size}`);
    expect(errors).toEqual([]);
    await page.close();
  });

  it('is reached from the landing page', async () => {
    const page = await live.browser.newPage({ viewport: viewports.phone });
    await page.goto(live.server.url);
    await page.getByTestId('open-selectors').click();
    await page.getByRole('heading', { name: 'Filters and prisms', level: 1 }).waitFor();
    expect(new URL(page.url()).pathname).toBe('/selectors');
    await page.close();
  });
});
