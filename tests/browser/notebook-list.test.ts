import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import type { BrowserContext, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { exampleDesign } from '../../shared/design';
import { formatDay } from '../../shared/format';
import { expectAccessible } from '../support/axe';
import { liveServerAndBrowser, screenshot, viewports } from '../support/browser';

// The demo owner a development server seeds on an empty database (README, "Demo data").
const password = 'grating-demo-2026';
const ownerEmail = 'maren.owner@quillmere-lab.example.com';

/**
 * The design list's own journeys (issue 12, items 10, 11 and 14): an import opens the imported
 * notebook and says where it came from, the baseline chip is a link to that version, archiving can
 * be undone from the notice it leaves, and revoking a share link asks first.
 */
// Each step runs axe at two sizes on a machine other test runs share: a minute is not always enough.
describe('the design list in Chromium', { timeout: 180_000 }, () => {
  const live = liveServerAndBrowser({ NODE_ENV: 'development' });
  let context: BrowserContext;
  let page: Page;
  let teamId = '';
  const problems: string[] = [];
  const files = mkdtempSync(path.join(tmpdir(), 'blazebook-list-'));

  const api = (route: string) => `${live.server.url}/api${route}`;
  const write = { headers: { origin: '' } };

  async function createDesign(title: string) {
    const answer = await context.request.post(api(`/teams/${teamId}/designs`), {
      data: { title, params: exampleDesign, message: 'First cut' },
      headers: write.headers,
    });
    expect(answer.status()).toBe(201);
    return ((await answer.json()) as { design: { id: string } }).design.id;
  }

  /**
   * axe on the part of the screen these items changed (WCAG 2.2 A/AA, serious or critical). The
   * whole list page is checked; on a notebook only
   * `scope`: the rest of those screens is checked by the accessibility suite.
   */
  async function checkA11y(label: string, scope?: string) {
    await expectAccessible(page, label, scope ? { include: scope } : {});
  }

  /** Phone and wide screenshots, each checked with axe; `show` is scrolled into view first. */
  async function shoot(name: string, scope?: string, show?: string) {
    for (const size of ['phone', 'wide'] as const) {
      await page.setViewportSize(viewports[size]);
      await page.waitForTimeout(300);
      if (show) await page.locator(show).scrollIntoViewIfNeeded();
      await screenshot(page, `notebook-list-${name}-${size}`);
      await checkA11y(`${name} at ${size}`, scope);
    }
    await page.setViewportSize(viewports.wide);
    await page.waitForTimeout(200);
  }

  /** The accessible name of whatever has keyboard focus. */
  const focusedName = () => page.evaluate(() => document.activeElement?.getAttribute('aria-label') ?? document.activeElement?.textContent ?? '');

  beforeAll(async () => {
    write.headers.origin = live.server.url;
    context = await live.browser.newContext({ viewport: viewports.wide });
    const signIn = await context.request.post(api('/auth/sign-in'), {
      data: { email: ownerEmail, password },
      headers: write.headers,
    });
    expect(signIn.status()).toBe(200);
    const { teams } = (await (await context.request.get(api('/teams'))).json()) as { teams: { id: string; personal: boolean }[] };
    teamId = teams.find((team) => !team.personal)?.id ?? '';
    expect(teamId).not.toBe('');
    page = await context.newPage();
    page.on('console', (message) => {
      if (message.type() === 'error') problems.push(`console: ${message.text()} (${message.location().url})`);
    });
    page.on('pageerror', (error) => problems.push(`page error: ${error.message}`));
  });
  afterAll(() => rmSync(files, { recursive: true, force: true }));

  it('11: the baseline chip in the list is a link that opens the baseline version', async () => {
    const id = await createDesign('Chip scanner');
    const v2 = await context.request.post(api(`/designs/${id}/versions`), {
      data: { baseVersion: 1, params: { ...exampleDesign, slits: { ...exampleDesign.slits, exitWidthUm: 30 } }, message: 'Narrower' },
      headers: write.headers,
    });
    expect(v2.status()).toBe(201);
    const baseline = await context.request.put(api(`/designs/${id}/baseline`), { data: { version: 1 }, headers: write.headers });
    expect(baseline.status()).toBe(200);

    await page.goto(`${live.server.url}/teams/${teamId}/notebooks?q=Chip`);
    const chip = page.getByRole('link', { name: 'Baseline: v1 of Chip scanner', exact: true });
    await chip.waitFor();
    expect(await chip.textContent()).toBe('Baseline: v1');
    expect(await chip.getAttribute('href')).toBe(`/notebooks/${id}/v/1`);
    await shoot('baseline-chip');

    // By keyboard: the chip takes focus and Enter follows it to v1, not the latest v2.
    await chip.focus();
    await page.keyboard.press('Enter');
    await page.waitForURL(`**/notebooks/${id}/v/1`);
    await page.getByTestId('notebook-title').filter({ hasText: 'Chip scanner' }).waitFor();
    await expect.poll(() => page.getByTestId('version-line').first().textContent()).toContain('v1');
  });

  it('10: importing a file opens the imported notebook, whose header and list row say it came from a file', async () => {
    const sourceId = await createDesign('Twin scanner');
    const exported = await context.request.get(api(`/designs/${sourceId}/export`));
    expect(exported.status()).toBe(200);
    const file = path.join(files, 'twin-scanner.blazebook.json');
    writeFileSync(file, await exported.text());

    await page.goto(`${live.server.url}/teams/${teamId}/notebooks?q=Twin`);
    await page.getByRole('button', { name: 'Import a notebook file', exact: true }).waitFor();
    await page.getByTestId('import-file').setInputFiles(file);
    await page.waitForURL((url) => /^\/notebooks\/[^/]+$/.test(url.pathname) && !url.pathname.endsWith(sourceId));
    const importedId = new URL(page.url()).pathname.split('/')[2]!;
    const { design } = (await (await context.request.get(api(`/designs/${importedId}`))).json()) as {
      design: { title: string; importedAt: string | null };
    };
    expect(design.title).toBe('Twin scanner');
    expect(design.importedAt).not.toBeNull();
    // The browser and this process share the machine's time zone, so the day reads the same.
    const note = `Imported from a file on ${formatDay(design.importedAt!)}`;
    await page.getByTestId('notebook-title').filter({ hasText: 'Twin scanner' }).waitFor();
    expect(await page.getByTestId('import-origin').textContent()).toBe(note);
    await shoot('imported-notebook', '[data-testid="notebook-header"]');

    // Back in the list the two rows share the title, and only the copy carries the note.
    await page.goto(`${live.server.url}/teams/${teamId}/notebooks?q=Twin`);
    await page.getByTestId(`imported-${importedId}`).waitFor();
    expect(await page.getByTestId(`imported-${importedId}`).textContent()).toBe(note);
    expect(await page.getByRole('link', { name: 'Twin scanner', exact: true }).count()).toBe(2);
    expect(await page.getByText(/^Imported from a file on/).count()).toBe(1);
    await shoot('imported-row');
  });

  it('14: archiving leaves an announced notice whose Undo, reached by keyboard, brings the design back', async () => {
    const id = await createDesign('Scratch to archive');
    await page.goto(`${live.server.url}/teams/${teamId}/notebooks?q=Scratch`);
    const archive = page.getByRole('button', { name: 'Archive Scratch to archive', exact: true });
    await archive.focus();
    await page.keyboard.press('Enter');

    const status = page.getByRole('status').filter({ hasText: 'Archived “Scratch to archive”' });
    await status.waitFor();
    await page.getByTestId('no-designs').waitFor();
    expect(await page.getByRole('link', { name: 'Scratch to archive', exact: true }).count()).toBe(0);
    // The archived row took the focused button with it: focus is on the way back.
    await expect.poll(focusedName).toBe('Undo');
    await shoot('archived-notice');

    await page.keyboard.press('Enter');
    await page.getByRole('link', { name: 'Scratch to archive', exact: true }).waitFor();
    await page.getByRole('status').filter({ hasText: 'Restored “Scratch to archive”' }).waitFor();
    const { design } = (await (await context.request.get(api(`/designs/${id}`))).json()) as { design: { archived: boolean } };
    expect(design.archived).toBe(false);
  });

  it('14: revoking a share link asks first; “Keep link” keeps it, “Revoke link” revokes it', async () => {
    const id = await createDesign('Shared scanner');
    const made = await context.request.post(api(`/designs/${id}/share-links`), {
      data: { version: 1, expiresAt: null },
      headers: write.headers,
    });
    expect(made.status()).toBe(201);
    const linkId = ((await made.json()) as { link: { id: string } }).link.id;
    const linkActive = async () => {
      const { links } = (await (await context.request.get(api(`/designs/${id}/share-links`))).json()) as {
        links: { id: string; active: boolean }[];
      };
      return links.find((link) => link.id === linkId)?.active;
    };

    await page.goto(`${live.server.url}/notebooks/${id}`);
    await page.getByTestId('tab-sharing').click();
    const revoke = page.getByRole('button', { name: 'Revoke the link to v1', exact: true });
    await revoke.click();
    const keep = page.getByRole('button', { name: 'Keep link', exact: true });
    await keep.waitFor();
    await page.getByRole('button', { name: 'Revoke link', exact: true }).waitFor();
    // The safe choice has focus while the question is open.
    await expect.poll(focusedName).toBe('Keep link');
    await shoot('revoke-confirm', '[data-testid="share-card"]', `[data-testid="confirm-revoke-${linkId}"]`);

    await page.keyboard.press('Enter');
    await revoke.waitFor();
    await expect.poll(focusedName).toBe('Revoke the link to v1');
    expect(await linkActive()).toBe(true);

    await page.keyboard.press('Enter');
    await page.getByRole('button', { name: 'Revoke link', exact: true }).click();
    await page.getByTestId('revoke-status').waitFor();
    await expect.poll(linkActive).toBe(false);
    expect(await page.getByRole('button', { name: 'Revoke the link to v1', exact: true }).count()).toBe(0);
  });

  it('produced no console or page errors along the way', () => {
    expect(problems).toEqual([]);
  });
});
