import path from 'node:path';
import type { Page } from 'playwright-core';
import { describe, expect, it } from 'vitest';
import { draftFromDesign } from '../../features/workbench/draft';
import { exampleDesign } from '../../shared/design';
import { expectAccessible } from '../support/axe';
import { artifactsDir, liveServerAndBrowser, screenshot, viewports, watchConsole } from '../support/browser';
import { demo, eventually as eventuallyIn, expectNoProblems, ownerApi, person, shown, signInAs } from './journeys/journey';

/**
 * The light budget card on the example design (300–900 nm, 1200/mm blazed at 500 nm): attach a
 * measured grating efficiency curve through the document picker at phone size, see the units it
 * detected and the preview, and the throughput follow the measured curve instead of the scalar
 * estimate. The curve is demo data of our own: a smooth hump peaking at 70 % near 500 nm, in µm
 * and percent so both detections show.
 */
const curveCsv = [
  '# Demo grating, ruled 1200/mm, test report 14 (invented)',
  'wavelength (um),efficiency (%)',
  ...Array.from({ length: 31 }, (_, i) => {
    const um = 0.3 + i * 0.02;
    const pct = 70 * Math.exp(-(((um - 0.5) / 0.25) ** 2));
    return `${um.toFixed(2)},${pct.toFixed(2)}`;
  }),
].join('\n');

/** The part scrolled to the top of its pane, then the viewport: an element taller than the screen inside a scroll view shoots blank. */
async function shootPart(page: Page, testID: string, name: string) {
  await page.getByTestId(testID).evaluate((node) => node.scrollIntoView({ block: 'start' }));
  await page.screenshot({ path: path.join(artifactsDir, `${name}.png`) });
}
const eventually = <T>(read: () => Promise<T>) => expect.poll(read, { timeout: 15_000 });
/** A factor's row reads its basis in words: "scalar blaze estimate", "measured (…)", "computed from …". */
const factorText = (page: Page, id: string) => page.getByTestId(`light-budget-factor-${id}`).textContent();
const throughputSummary = (page: Page) =>
  page.getByTestId('light-budget-throughput-plot-figure').getAttribute('aria-label');

async function openWithExample(page: Page, url: string) {
  await page.goto(`${url}/workbench`);
  const draft = { version: 1, value: draftFromDesign(exampleDesign) };
  await page.evaluate((stored) => localStorage.setItem('blazebook.scratch-design', stored), JSON.stringify(draft));
  await page.reload();
  await page.getByTestId('light-budget-card').waitFor();
}

describe('the light budget in the workbench', () => {
  const live = liveServerAndBrowser();

  it('attaches an uploaded efficiency curve at phone size after showing what it detected, and the throughput follows it', async () => {
    const context = await live.browser.newContext({ viewport: viewports.phone });
    const page = await context.newPage();
    const errors = watchConsole(page);
    await openWithExample(page, live.server.url);
    // Collapsed at first on a phone; open it.
    await page.getByTestId('light-budget-toggle').click();
    await page.getByTestId('light-budget-throughput-plot').waitFor();
    expect(await factorText(page, 'grating')).toContain('scalar blaze estimate');
    const before = await throughputSummary(page);

    await page.getByTestId('light-budget-add-curve').click();
    const chooser = page.waitForEvent('filechooser');
    await page.getByTestId('curve-upload-choose').click();
    await (await chooser).setFiles({ name: 'demo-grating-report-14.csv', mimeType: 'text/csv', buffer: Buffer.from(curveCsv) });
    const detected = page.getByTestId('curve-upload-detected');
    await detected.waitFor();
    expect(await detected.textContent()).toMatch(/Wavelengths: µm, from the header/);
    expect(await detected.textContent()).toMatch(/Values: percent, from the header/);
    expect(await detected.textContent()).toContain('31 points, 300–900 nm');
    await page.getByTestId('curve-upload-preview-table').waitFor();
    expect(await page.getByTestId('curve-upload-plot-line').getAttribute('data-points')).toBe('31');
    expect(await page.getByTestId('curve-upload-name').inputValue()).toBe('demo-grating-report-14');
    await shootPart(page, 'curve-upload-panel', 'light-budget-upload-preview-phone');
    await expectAccessible(page, 'curve upload preview at phone');

    await page.getByTestId('curve-upload-attach').click();
    await page.getByTestId('light-budget-curve-0').waitFor();
    expect(await page.getByTestId('light-budget-curve-0').textContent()).toContain('Grating efficiency, 31 points, 300–900 nm');
    await eventually(() => factorText(page, 'grating')).toContain('measured (demo-grating-report-14)');
    await eventually(() => throughputSummary(page)).not.toBe(before);
    // At the centre, near 600 nm (the sweep's middle point), the demo hump is 70 %·exp(−(0.1/0.25)²) = 59.65 %: 60 %.
    const grating = (await factorText(page, 'grating')) ?? '';
    expect(grating, grating).toMatch(/\b(59[89]|60[01])(\.\d+)?\s?nm 60\s%/);
    await screenshot(page, 'light-budget-attached-phone');
    await shootPart(page, 'light-budget-card', 'light-budget-card-phone');
    expect(errors).toEqual([]);
    await context.close();
  });

  it('names the row and column of a bad file and attaches nothing', async () => {
    const context = await live.browser.newContext({ viewport: viewports.phone });
    const page = await context.newPage();
    const errors = watchConsole(page);
    await openWithExample(page, live.server.url);
    await page.getByTestId('light-budget-toggle').click();
    await page.getByTestId('light-budget-add-curve').click();
    const chooser = page.waitForEvent('filechooser');
    await page.getByTestId('curve-upload-choose').click();
    await (await chooser).setFiles({ name: 'bad.csv', mimeType: 'text/csv', buffer: Buffer.from('nm,value\n400,0.5\n500,abc\n600,0.7\n') });
    const problems = page.getByTestId('curve-upload-errors');
    await problems.waitFor();
    expect(await problems.textContent()).toMatch(/row 3.*column 2/i);
    expect(await page.getByTestId('curve-upload-attach').isDisabled()).toBe(true);
    expect(await page.getByTestId('light-budget-curves').count()).toBe(0);
    expect(errors).toEqual([]);
    await context.close();
  });

  it('fits tablet and wide screens, with a fibre input over-filling the grating', async () => {
    for (const size of ['tablet', 'wide'] as const) {
      const context = await live.browser.newContext({ viewport: viewports[size] });
      const page = await context.newPage();
      const errors = watchConsole(page);
      await openWithExample(page, live.server.url);
      await page.getByTestId('light-budget-input-kind-fibre').click();
      await page.getByTestId('field-input.numericalAperture').fill('0.22');
      await page.getByTestId('field-input.coreDiameterUm').fill('200 µm');
      await eventually(() => page.getByTestId('light-budget-fill-state').textContent()).toBe('Over-filled');
      expect(await page.getByTestId('warning-input-overfills').count()).toBe(1);
      expect(await factorText(page, 'input')).toContain('computed from the input and the grating');
      await shootPart(page, 'light-budget-card', `light-budget-card-${size}`);
      await expectAccessible(page, `light budget at ${size}`);
      expect(errors).toEqual([]);
      await context.close();
    }
  });
});

describe('the team curve library from a notebook', { timeout: 180_000 }, () => {
  // Development mode seeds the demo team, its owner and the teaching-lab notebook (server/seed/).
  const live = liveServerAndBrowser({ NODE_ENV: 'development' });

  it('keeps an owner’s upload in the library, saves it with the next version, and recognises the same file again', async () => {
    const owner = await ownerApi(live.browser, live.server);
    const api = owner.context.request;
    const designs = (await (await api.get(`${live.server.url}/api/teams/${owner.teamId}/designs`)).json()) as {
      designs: { id: string; title: string; latestVersion: number }[];
    };
    const notebook = designs.designs.find((d) => d.title === demo.notebook)!;
    const who = await person(live.browser, 'owner', 'wide');
    await signInAs(who, live.server, demo.owner);
    const { page } = who;
    await page.goto(`${live.server.url}/notebooks/${notebook.id}/v/${notebook.latestVersion}`);
    await shown(page, 'light-budget-card').waitFor();

    const attachFile = async () => {
      await shown(page, 'light-budget-add-curve').click();
      await shown(page, 'curve-library').waitFor();
      const chooser = page.waitForEvent('filechooser');
      await shown(page, 'curve-upload-choose').click();
      await (await chooser).setFiles({ name: 'demo-grating-report-14.csv', mimeType: 'text/csv', buffer: Buffer.from(curveCsv) });
      await shown(page, 'curve-upload-detected').waitFor();
      await shown(page, 'curve-upload-attach').click();
    };
    await attachFile();
    await shown(page, 'light-budget-curve-0').waitFor();
    const library = async () =>
      ((await (await api.get(`${live.server.url}/api/teams/${owner.teamId}/curves`)).json()) as { curves: { name: string; checksum: string }[] }).curves;
    const stored = await library();
    expect(stored.map((c) => c.name)).toEqual(['demo-grating-report-14']);

    // The same file again: recognised, not stored twice.
    await attachFile();
    await shown(page, 'light-budget-curve-1').waitFor();
    expect(await library()).toHaveLength(1);

    // The attached curves are saved with the next version, carrying the library's checksum.
    await shown(page, 'bar-save').click();
    await shown(page, 'version-message').fill('Measured grating efficiency attached');
    await shown(page, 'save-version').click();
    const next = notebook.latestVersion + 1;
    const version = async () => {
      const answer = await api.get(`${live.server.url}/api/designs/${notebook.id}/versions/${next}`);
      return answer.status() === 200 ? ((await answer.json()) as { version: { params: { curves?: { checksum: string }[] } } }).version : null;
    };
    await eventuallyIn(async () => (await version())?.params.curves?.length ?? 0).toBe(2);
    expect((await version())!.params.curves![0]!.checksum).toBe(stored[0]!.checksum);

    // Removing the curve from the library leaves the saved version's copy as it was.
    await shown(page, 'light-budget-add-curve').click();
    await shown(page, 'curve-library-remove-0').click();
    await eventuallyIn(async () => (await library()).length).toBe(0);
    expect((await version())!.params.curves).toHaveLength(2);
    await screenshot(page, 'light-budget-notebook-wide');
    expectNoProblems(who);
    await who.context.close();
    await owner.context.close();
  });
});
