import { mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import type { Page } from 'playwright-core';
import { describe, expect, it } from 'vitest';
import { liveServerAndBrowser, viewports } from '../../support/browser';
import {
  escapeRegExp,
  expectNoProblems,
  expectTitle,
  fillSignUp,
  overlap,
  person,
  textBoxes,
  todayYear,
  shown,
  eventually,
  type Person,
} from './journey';

const designer = {
  name: 'Sunniva Prykhodko',
  email: 's.prykhodko@example.com',
  password: 'reciprocal dispersion',
};
const title = 'Fluorescence excitation, 2400/mm';

/** A field's text as a number ("25" → 25); the workbench shows canonical numbers once a field reads. */
async function fieldNumber(page: Page, fieldPath: string): Promise<number> {
  const text = await shown(page, `field-${fieldPath}`).inputValue();
  const value = Number.parseFloat(text.replace('−', '-'));
  expect(Number.isFinite(value), `${fieldPath} reads as a number: “${text}”`).toBe(true);
  return value;
}

/** Where an element starts below the top of the page, in CSS pixels. */
async function pageTop(page: Page, testID: string): Promise<number> {
  return shown(page, testID)
    .first()
    .evaluate((element) => element.getBoundingClientRect().top + window.scrollY);
}

/**
 * A designer on a tablet, signed out, shapes an instrument on the workbench, keeps it in a notebook
 * (making an account on the way, losing nothing), saves versions with their reasons, reads the
 * history, and takes the notebook out as a file and back in.
 */
describe(
  'journey: the designer, from the scratch workbench to a versioned notebook and back from a file',
  { timeout: 180_000 },
  () => {
    const live = liveServerAndBrowser();
    let who: Person;
    let notebookId = '';
    // What the designer set on the workbench before signing up, to find again afterwards.
    const typed: Record<string, string> = {};

    it('starts on the workbench from a preset', async () => {
      who = await person(live.browser, 'designer', 'tablet', { acceptDownloads: true });
      const { page } = who;
      page.setDefaultTimeout(15_000);
      await page.goto(`${live.server.url}/workbench`);
      await shown(page, 'design-editor').waitFor();
      await expectTitle(page, 'Workbench · Blazebook');
      await who.shoot('workbench');

      await page.getByRole('button', { name: /^Start from UV excitation monochromator/ }).click();
      await eventually(() => shown(page, 'field-grating.grooveDensityPerMm').inputValue()).toBe('2400');
    });

    it('switches the mount with the arrow keys, and Czerny–Turner gets back the deviation typed for it', async () => {
      const { page } = who;
      const deviation = shown(page, 'field-layout.deviationAngleDeg');
      await deviation.fill('26');
      await deviation.press('Tab');
      await eventually(() => fieldNumber(page, 'layout.deviationAngleDeg')).toBe(26);

      const czernyTurner = shown(page, 'mount-kind-czerny-turner');
      const littrow = shown(page, 'mount-kind-littrow');
      expect(await czernyTurner.getAttribute('aria-checked')).toBe('true');
      await czernyTurner.focus();
      // The options run Czerny–Turner, Littrow, Ebert–Fastie: one step right is Littrow.
      await page.keyboard.press('ArrowRight');
      await eventually(() => littrow.getAttribute('aria-checked')).toBe('true');
      await eventually(() => fieldNumber(page, 'layout.deviationAngleDeg')).toBe(0);
      expect(await littrow.evaluate((element) => element === document.activeElement)).toBe(true);

      await page.keyboard.press('ArrowLeft');
      await eventually(() => czernyTurner.getAttribute('aria-checked')).toBe('true');
      await eventually(() => fieldNumber(page, 'layout.deviationAngleDeg')).toBe(26);

      // Two mirrors at a real deviation: the sketch names both, and no label sits on another.
      const sketch = shown(page, 'ray-sketch').first();
      await sketch.waitFor();
      const labels = await textBoxes(sketch);
      expect(labels.map((label) => label.text)).toEqual(expect.arrayContaining(['Collimator', 'Camera']));
      const clashes: string[] = [];
      for (const [i, a] of labels.entries()) {
        for (const b of labels.slice(i + 1)) {
          // A pixel of slack each way: glyph boxes of neighbouring runs may touch without overlapping.
          const shrink = (box: typeof a) => ({
            x: box.x + 1,
            y: box.y + 1,
            width: box.width - 2,
            height: box.height - 2,
          });
          if (a.text.trim() && b.text.trim() && overlap(shrink(a), shrink(b)))
            clashes.push(`“${a.text}” on “${b.text}”`);
        }
      }
      expect(clashes).toEqual([]);
      await sketch.scrollIntoViewIfNeeded();
      await who.shoot('mount-czerny-turner', ['tablet']);
    });

    it('steps a numeric field with ArrowUp, ten steps with Shift', async () => {
      const { page } = who;
      const field = shown(page, 'field-slits.entranceWidthUm');
      const before = await fieldNumber(page, 'slits.entranceWidthUm');
      await field.focus();
      await page.keyboard.press('ArrowUp');
      await eventually(() => fieldNumber(page, 'slits.entranceWidthUm')).toBeGreaterThan(before);
      const once = await fieldNumber(page, 'slits.entranceWidthUm');
      await page.keyboard.press('Shift+ArrowUp');
      await eventually(() => fieldNumber(page, 'slits.entranceWidthUm')).not.toBe(once);
      const tenTimes = await fieldNumber(page, 'slits.entranceWidthUm');
      expect(tenTimes - once).toBeCloseTo(10 * (once - before), 6);
      await field.press('Tab');
      for (const fieldPath of [
        'grating.grooveDensityPerMm',
        'layout.deviationAngleDeg',
        'slits.entranceWidthUm',
      ]) {
        typed[fieldPath] = await shown(page, `field-${fieldPath}`).inputValue();
      }
    });

    it('saves to a notebook: signs up on the way and comes back to the workbench with nothing lost', async () => {
      const { page } = who;
      await page.getByRole('button', { name: 'Save to a notebook' }).click();
      await page.getByRole('heading', { name: 'Sign in', level: 1 }).waitFor();
      expect(new URL(page.url()).searchParams.get('next')).toBe('/workbench');
      await page.getByRole('link', { name: 'Create an account' }).click();
      await fillSignUp(page, designer);

      await page.waitForURL((url) => url.pathname === '/workbench');
      const panel = shown(page, 'save-to-notebook-panel');
      await panel.waitFor();
      for (const [fieldPath, text] of Object.entries(typed)) {
        expect(await shown(page, `field-${fieldPath}`).inputValue(), fieldPath).toBe(text);
      }
      expect(await shown(page, 'mount-kind-czerny-turner').getAttribute('aria-checked')).toBe('true');

      const titleField = panel.getByRole('textbox', { name: 'Title' });
      await titleField.fill(title);
      // A reload (or a trip to sign in again) keeps the panel and what was typed in it.
      await page.reload();
      await panel.waitFor();
      expect(await panel.getByRole('textbox', { name: 'Title' }).inputValue()).toBe(title);
      const team = panel.getByRole('radiogroup', { name: 'Team' });
      expect(await team.getByRole('radio', { name: 'Personal workspace' }).getAttribute('aria-checked')).toBe(
        'true',
      );
      await panel.scrollIntoViewIfNeeded();
      await who.shoot('save-to-notebook', ['phone', 'tablet', 'wide']);

      await panel.getByRole('button', { name: 'Create notebook' }).click();
      await page.waitForURL(/\/notebooks\/[^/]+$/);
      notebookId = new URL(page.url()).pathname.split('/')[2] ?? '';
      await shown(page, 'notebook-title').filter({ hasText: title }).waitFor();
      await expectTitle(page, `${title} v1 · Blazebook`);
      expect(await shown(page, 'field-slits.entranceWidthUm').inputValue()).toBe(
        typed['slits.entranceWidthUm'],
      );
    });

    it('finds the editor first on the Design tab, saves v2 with its reasons, and starts v3 with empty notes', async () => {
      const { page } = who;
      for (const size of ['phone', 'tablet'] as const) {
        await page.setViewportSize(viewports[size]);
        await page.waitForTimeout(300);
        expect(
          await pageTop(page, 'design-editor'),
          `the editor starts on the first screen at ${size}`,
        ).toBeLessThan(viewports[size].height);
      }
      await who.shoot('notebook-design');

      const save = page.getByRole('button', { name: 'Save version', exact: true });
      await shown(page, 'field-slits.exitWidthUm').fill('40');
      await shown(page, 'field-slits.exitWidthUm').press('Tab');
      await save.click();
      await shown(page, 'version-message').fill('Exit slit to 40 µm for the 2 nm excitation band');
      const v2Notes = '# Why 40 µm\n\nThe sample wants a **2 nm** band; the lamp has light to spare.';
      await shown(page, 'version-notes').fill(v2Notes);
      await shown(page, 'save-version').click();
      await eventually(() => shown(page, 'version-line').textContent()).toContain('v2 of 2');

      await shown(page, 'field-slits.entranceWidthUm').fill('40');
      await shown(page, 'field-slits.entranceWidthUm').press('Tab');
      // A save closes its card with the version it made; the bar opens it again.
      if ((await save.getAttribute('aria-expanded')) !== 'true') await save.click();
      await shown(page, 'version-message').fill('Entrance slit matched to the exit');
      // The new version's notes start empty; v2's are beside them, one press away.
      expect(await shown(page, 'version-notes').inputValue()).toBe('');
      const startFrom = page.getByRole('button', { name: /^Start from v2[’']s notes$/ });
      await startFrom.waitFor();
      await startFrom.scrollIntoViewIfNeeded();
      await who.shoot('new-version-notes', ['tablet', 'phone']);
      await startFrom.press('Enter');
      await eventually(() => shown(page, 'version-notes').inputValue()).toContain(
        'The sample wants a **2 nm** band',
      );
      await shown(page, 'save-version').click();
      await eventually(() => shown(page, 'version-line').textContent()).toContain('v3 of 3');
      await expectTitle(page, `${title} v3 · Blazebook`);
    });

    it('reads the history, whose links name their versions', async () => {
      const { page } = who;
      // The notebook's sections are a radio group: the arrow keys move between them.
      const designTab = shown(page, 'tab-design');
      await designTab.focus();
      await page.keyboard.press('ArrowRight');
      await shown(page, 'history-v3').waitFor();
      const table = shown(page, 'history-table');
      // v3 is the one on screen; the others are a link away, each named by its version.
      await table.getByText('On screen').waitFor();
      for (const n of [1, 2]) {
        expect(
          await table.getByRole('link', { name: new RegExp(`\\bv${n}\\b`) }).count(),
          `a link that names v${n}`,
        ).toBeGreaterThan(0);
      }
      expect(await table.getByRole('link', { name: 'Open', exact: true }).count()).toBe(0);
      await eventually(() => shown(page, 'history-v2').textContent()).toContain('Exit slit to 40 µm');
      await who.shoot('history');
    });

    it('exports the notebook as a file and imports it, landing on the imported copy with its origin', async () => {
      const { page } = who;
      await shown(page, 'tab-sharing').click();
      const downloading = page.waitForEvent('download');
      await page.getByRole('button', { name: 'Download notebook file' }).click();
      const download = await downloading;
      const file = path.join(
        mkdtempSync(path.join(tmpdir(), 'blazebook-journey-')),
        download.suggestedFilename(),
      );
      await download.saveAs(file);
      await shown(page, 'export-status').waitFor();
      await who.checkA11y('sharing tab');

      await shown(page, 'to-design-list').click();
      await page.getByRole('button', { name: 'Import a notebook file' }).waitFor();
      await who.checkA11y('design list');
      const choosing = page.waitForEvent('filechooser');
      await page.getByRole('button', { name: 'Import a notebook file' }).click();
      await (await choosing).setFiles(file);

      await page.waitForURL(
        (url) => /^\/notebooks\/[^/]+$/.test(url.pathname) && !url.pathname.endsWith(notebookId),
      );
      await shown(page, 'notebook-title').filter({ hasText: title }).waitFor();
      const origin = page.getByText(/^Imported from a file on /);
      await origin.waitFor();
      expect(await origin.textContent()).toMatch(
        new RegExp(`^Imported from a file on .*${escapeRegExp(todayYear())}`),
      );
      await eventually(() => shown(page, 'version-line').textContent()).toContain('v3 of 3');
      await who.shoot('imported');
    });

    it('met no console error and no page error on the way', async () => {
      expectNoProblems(who);
      await who.context.close();
    });
  },
);
