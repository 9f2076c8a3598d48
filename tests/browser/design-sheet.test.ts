import { readFile } from 'node:fs/promises';
import type { Download, Page } from 'playwright-core';
import { afterAll, describe, expect, it } from 'vitest';
import { liveServerAndBrowser, screenshot, viewports } from '../support/browser';
import { demo, eventually, expectNoProblems, ownerApi, person, shown, signInAs, type Person } from './journeys/journey';

// The file names issue 14 asks for: `<design>-v<n>.pdf`, from the demo notebook's title.
const versionFile = 'teaching-lab-visible-scanner-v2.pdf';
const compareFile = 'teaching-lab-visible-scanner-v1-vs-v3.pdf';

/** Clicks the visible button named `name` and answers the download it starts. */
async function downloadFrom(page: Page, name: string): Promise<Download> {
  const button = page.getByRole('button', { name, exact: true }).filter({ visible: true });
  const started = page.waitForEvent('download', { timeout: 30_000 });
  await button.click();
  return started;
}

/** The first bytes of a received download: a PDF starts with `%PDF` (ISO 32000-1, 7.5.2). */
async function firstBytes(download: Download, count = 4): Promise<string> {
  const file = await download.path();
  return (await readFile(file)).subarray(0, count).toString('latin1');
}

/**
 * The screen at phone and at wide size (then back to the person's own), with axe at each. The
 * workbench lays its header out again on a resize, so a status shown before it is not kept.
 */
async function shoot(who: Person, name: string) {
  for (const size of ['phone', 'wide'] as const) {
    await who.page.setViewportSize(viewports[size]);
    await who.page.waitForTimeout(300);
    await screenshot(who.page, `design-sheet-${name}-${size}`);
    await who.checkA11y(`${name} at ${size}`);
  }
  await who.page.setViewportSize(viewports[who.size]);
}

describe('design sheet downloads in Chromium', { timeout: 180_000 }, () => {
  // Development mode seeds the demo team, its owner and the teaching-lab notebook (server/seed/).
  const live = liveServerAndBrowser({ NODE_ENV: 'development' });
  const people: Person[] = [];
  let designId = '';
  let sharePath = '';

  async function member(name: string, size: 'phone' | 'wide' = 'wide'): Promise<Person> {
    const who = await person(live.browser, name, size, { acceptDownloads: true });
    who.page.setDefaultTimeout(20_000);
    people.push(who);
    await signInAs(who, live.server, demo.owner);
    return who;
  }

  afterAll(async () => {
    for (const who of people) await who.context.close();
  });

  it('downloads the sheet of a version from its bar, named after the design and version', async () => {
    const owner = await ownerApi(live.browser, live.server);
    const list = (await (await owner.context.request.get(`${live.server.url}/api/teams/${owner.teamId}/designs`)).json()) as {
      designs: { id: string; title: string }[];
    };
    designId = list.designs.find((design) => design.title === demo.notebook)?.id ?? '';
    expect(designId).not.toBe('');
    const link = await owner.context.request.post(`${live.server.url}/api/designs/${designId}/share-links`, {
      data: { version: 2 },
      headers: { origin: live.server.url },
    });
    expect(link.status()).toBe(201);
    sharePath = ((await link.json()) as { path: string }).path;
    await owner.context.close();

    const who = await member('sheet-member');
    const { page } = who;
    await page.goto(`${live.server.url}/notebooks/${designId}/v/2`);
    await shown(page, 'design-bar').waitFor();
    // A4 until someone picks another paper.
    expect(await shown(page, 'sheet-paper-a4').getAttribute('aria-checked')).toBe('true');
    const asked = page.waitForRequest((request) => request.url().includes(`/api/designs/${designId}/versions/2/sheet.pdf?paper=a4`));
    const download = await downloadFrom(page, 'Design sheet (PDF)');
    await asked;
    expect(download.suggestedFilename()).toBe(versionFile);
    expect(await firstBytes(download)).toBe('%PDF');
    await eventually(() => shown(page, 'sheet-download-status').textContent()).toBe(`Downloaded ${versionFile}.`);
    await shoot(who, 'version');
    expectNoProblems(who);
  });

  it('works by keyboard, and keeps the paper chosen for the next visit', async () => {
    const who = await member('sheet-keyboard');
    const { page } = who;
    await page.goto(`${live.server.url}/notebooks/${designId}/v/2`);
    await shown(page, 'sheet-paper-a4').focus();
    // The arrow keys move the choice of a radio group (WAI-ARIA radio group pattern).
    await page.keyboard.press('ArrowRight');
    await eventually(() => shown(page, 'sheet-paper-letter').getAttribute('aria-checked')).toBe('true');
    // Back from the paper to the button, then Enter.
    await page.keyboard.press('Shift+Tab');
    expect(await page.evaluate(() => document.activeElement?.getAttribute('aria-label'))).toBe('Design sheet (PDF)');
    const asked = page.waitForRequest((request) => request.url().includes('/sheet.pdf?paper=letter'));
    const started = page.waitForEvent('download', { timeout: 30_000 });
    await page.keyboard.press('Enter');
    await asked;
    const download = await started;
    expect(download.suggestedFilename()).toBe(versionFile);
    expect(await firstBytes(download)).toBe('%PDF');

    await page.reload();
    await shown(page, 'sheet-paper-letter').waitFor();
    expect(await shown(page, 'sheet-paper-letter').getAttribute('aria-checked')).toBe('true');
    expectNoProblems(who);
  });

  it('downloads the compare sheet of the two versions compared', async () => {
    const who = await member('sheet-compare');
    const { page } = who;
    await page.goto(`${live.server.url}/notebooks/${designId}/compare?a=1&b=3`);
    await shown(page, 'compare-figures').waitFor();
    const asked = page.waitForRequest((request) => request.url().includes(`/api/designs/${designId}/compare.pdf?a=1&b=3&paper=a4`));
    const download = await downloadFrom(page, 'Compare sheet (PDF)');
    await asked;
    expect(download.suggestedFilename()).toBe(compareFile);
    expect(await firstBytes(download)).toBe('%PDF');
    expect(await page.getByRole('button', { name: 'Design sheet (PDF)', exact: true }).filter({ visible: true }).count()).toBe(0);
    await shoot(who, 'compare');
    expectNoProblems(who);
  });

  it('downloads the shared version’s sheet signed out, through the share link', async () => {
    const visitor = await person(live.browser, 'sheet-visitor', 'phone', { acceptDownloads: true });
    people.push(visitor);
    const { page } = visitor;
    page.setDefaultTimeout(20_000);
    await page.goto(`${live.server.url}${sharePath}`);
    await shown(page, 'shared-title').waitFor();
    const token = sharePath.split('/').pop() ?? '';
    const asked = page.waitForRequest((request) => request.url().includes(`/api/share/${token}/sheet.pdf?paper=a4`));
    const download = await downloadFrom(page, 'Design sheet (PDF)');
    await asked;
    expect(download.suggestedFilename()).toBe(versionFile);
    expect(await firstBytes(download)).toBe('%PDF');
    await shoot(visitor, 'share');
    expectNoProblems(visitor);
  });

  it('says it is preparing the sheet, then shows the server’s message when it fails', async () => {
    const who = await member('sheet-failure', 'phone');
    const { page } = who;
    let release = () => undefined as void;
    const held = new Promise<void>((resolve) => (release = resolve));
    await page.route('**/sheet.pdf?**', async (route) => {
      await held;
      await route.fulfill({
        status: 500,
        contentType: 'application/json',
        body: JSON.stringify({ error: { code: 'internal', message: 'The sheet could not be drawn; try again.' } }),
      });
    });
    await page.goto(`${live.server.url}/notebooks/${designId}/v/2`);
    await shown(page, 'design-bar').waitFor();
    const button = page.getByRole('button', { name: 'Design sheet (PDF)', exact: true }).filter({ visible: true });
    await button.click();
    // While the answer is held: a polite status with the spinner, and the button waits.
    const status = shown(page, 'sheet-download-status');
    await eventually(() => status.textContent()).toBe('Preparing the design sheet…');
    expect(await status.getAttribute('aria-live')).toBe('polite');
    expect(await shown(page, 'sheet-download').getAttribute('aria-disabled')).toBe('true');
    await screenshot(page, 'design-sheet-preparing-phone');
    release();
    const failed = 'The design sheet could not be made. The sheet could not be drawn; try again.';
    const error = shown(page, 'sheet-download-error');
    await eventually(() => error.textContent()).toBe(failed);
    expect(await error.getAttribute('role')).toBe('alert');
    expect(await shown(page, 'sheet-download').getAttribute('aria-disabled')).not.toBe('true');
    // The status empties (and has no height then), leaving the alert to speak.
    expect(await page.getByTestId('sheet-download-status').textContent()).toBe('');
    await screenshot(page, 'design-sheet-failed-phone');
    // Again at wide size, where the bar sits in the editor's column.
    await page.setViewportSize(viewports.wide);
    await page.waitForTimeout(300);
    await button.click();
    await eventually(() => error.textContent()).toBe(failed);
    await screenshot(page, 'design-sheet-failed-wide');
    // The browser logs the refused requests itself; nothing else may go wrong.
    expect(who.problems.filter((problem) => !problem.includes('500'))).toEqual([]);
  });
});
