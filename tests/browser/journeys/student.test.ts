import { describe, expect, it } from 'vitest';
import { liveServerAndBrowser } from '../../support/browser';
import {
  demo,
  expectNoProblems,
  expectTitle,
  ownerApi,
  person,
  signUpFromInvitation,
  shown,
  eventually,
  type Person,
} from './journey';

const student = {
  name: 'Ayo Lindqvist-Mensah',
  email: 'ayo.lm@example.com',
  password: 'littrow return beam',
};

/**
 * A student on a phone joins the teaching lab from an invitation as a viewer, finds the design the
 * lab marked as its baseline, clones that version (not the newest, exploratory one) into their
 * own workspace, saves a change in the copy, and archives it by mistake and takes it back.
 */
describe(
  'journey: the student, from an invitation to their own copy of the baseline',
  { timeout: 180_000 },
  () => {
    // Development mode seeds the demo team, its owner and its notebooks (server/seed/).
    const live = liveServerAndBrowser({ NODE_ENV: 'development' });
    let who: Person;
    let teamId = '';
    let notebookId = '';
    let copyId = '';

    it('joins from the invitation and lands on the team’s designs', async () => {
      const owner = await ownerApi(live.browser, live.server);
      teamId = owner.teamId;
      await owner.invite(student.email, 'viewer');
      await owner.context.close();

      who = await person(live.browser, 'student', 'phone');
      const { page } = who;
      page.setDefaultTimeout(15_000);
      const invitationPath = await signUpFromInvitation(live.server, who, student);

      await page.goto(`${live.server.url}${invitationPath}`);
      await page.getByRole('button', { name: 'Accept the invitation' }).click();
      await page.waitForURL((url) => url.pathname === `/teams/${teamId}/notebooks`);
      await shown(page, `design-${demo.notebook}`).first().waitFor();
      await expectTitle(page, `Designs of ${demo.teamName} · Blazebook`);
      await who.shoot('team-designs');

      // Later visits start from /teams, where every team leads to its designs.
      await page.goto(`${live.server.url}/teams`);
      const designs = page.getByRole('link', { name: `Designs of ${demo.teamName}` });
      await designs.waitFor();
      await who.checkA11y('teams');
      await designs.click();
      await page.waitForURL((url) => url.pathname === `/teams/${teamId}/notebooks`);
    });

    it('follows the baseline chip with the keyboard to the baseline version', async () => {
      const { page } = who;
      const chip = page.getByRole('link', { name: new RegExp(`^Baseline: v${demo.baseline}\\b`) });
      await chip.first().waitFor();
      expect(await chip.count()).toBe(1);
      await chip.focus();
      await page.keyboard.press('Enter');
      await page.waitForURL((url) => new RegExp(`^/notebooks/[^/]+/v/${demo.baseline}$`).test(url.pathname));
      notebookId = new URL(page.url()).pathname.split('/')[2] ?? '';
      await shown(page, 'notebook-title').filter({ hasText: demo.notebook }).waitFor();
      await expectTitle(page, `${demo.notebook} v${demo.baseline} · Blazebook`);
      await eventually(() => shown(page, 'version-line').textContent()).toContain(
        `v${demo.baseline} of ${demo.latest}`,
      );
    });

    it('sees the baseline named on the newest version too, and clones the baseline from there', async () => {
      const { page } = who;
      await page.goto(`${live.server.url}/notebooks/${notebookId}`);
      await eventually(() => shown(page, 'version-line').textContent()).toContain(
        `v${demo.latest} of ${demo.latest}`,
      );
      const baselineLink = page.getByRole('link', { name: `Baseline: v${demo.baseline}` });
      await baselineLink.waitFor();
      await who.shoot('notebook');

      await page.getByRole('button', { name: `Clone baseline (v${demo.baseline})` }).click();
      await page.waitForURL(
        (url) => /^\/notebooks\/[^/]+$/.test(url.pathname) && !url.pathname.includes(notebookId),
      );
      copyId = new URL(page.url()).pathname.split('/')[2] ?? '';
      await shown(page, 'provenance').waitFor();
      expect(await shown(page, 'provenance').textContent()).toBe(`from ${demo.notebook} v${demo.baseline}`);
      await eventually(() => shown(page, 'version-line').textContent()).toContain('v1 of 1');
    });

    it('works in the copy: changes the exit slit and saves v2', async () => {
      const { page } = who;
      // On a phone the editor's sections fold; the slits section is open from the start.
      const exit = shown(page, 'field-slits.exitWidthUm');
      await exit.fill('30');
      await exit.press('Tab');
      await page.getByRole('button', { name: 'Save version', exact: true }).click();
      await shown(page, 'version-message').fill('Narrower exit slit to split the mercury yellow lines');
      await shown(page, 'save-version').click();
      await eventually(() => shown(page, 'version-line').textContent()).toContain('v2 of 2');
      await who.shoot('copy-saved', ['phone', 'wide']);
    });

    it('archives the copy from the list and takes it back with Undo', async () => {
      const { page } = who;
      const copyTitle = ((await shown(page, 'notebook-title').textContent()) ?? '').trim();
      expect(copyTitle).not.toBe('');
      await shown(page, 'to-design-list').click();
      const archive = page.getByRole('button', { name: `Archive ${copyTitle}` });
      await archive.waitFor();
      await archive.click();
      const notice = page.getByRole('status').filter({ hasText: `Archived “${copyTitle}”` });
      await notice.waitFor();
      await who.shoot('archived', ['phone', 'wide']);
      await page.getByRole('button', { name: 'Undo' }).click();
      await page.getByRole('button', { name: `Archive ${copyTitle}` }).waitFor();
      const answer = await who.context.request.get(`${live.server.url}/api/designs/${copyId}`);
      expect(answer.status()).toBe(200);
      expect(((await answer.json()) as { design: { archived: boolean } }).design.archived).toBe(false);
    });

    it('met no console error and no page error on the way', async () => {
      expectNoProblems(who);
      await who.context.close();
    });
  },
);
