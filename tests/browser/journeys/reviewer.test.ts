import { describe, expect, it } from 'vitest';
import { liveServerAndBrowser } from '../../support/browser';
import {
  demo,
  expectNoProblems,
  expectTitle,
  ownerApi,
  overlap,
  person,
  signUpFromInvitation,
  textBoxes,
  shown,
  eventually,
  type Person,
} from './journey';

const reviewer = {
  name: 'Idris Okonkwo-Bell',
  email: 'idris.ob@example.com',
  password: 'free spectral range',
};

/**
 * A colleague is invited to review the team's designs: they join from the e-mail with a new
 * account, land on the team's designs, open the teaching-lab notebook, compare its last two
 * versions, and record a decision on v3, revise, with its summary. On a wide screen, as at a desk.
 */
describe('journey: the reviewer, from an invitation to a review decision', { timeout: 180_000 }, () => {
  // Development mode seeds the demo team, its owner and its notebooks (server/seed/).
  const live = liveServerAndBrowser({ NODE_ENV: 'development' });
  let who: Person;
  let teamId = '';
  let invitationPath = '';

  it('opens the invitation, makes an account from it and confirms the address', async () => {
    const owner = await ownerApi(live.browser, live.server);
    teamId = owner.teamId;
    await owner.invite(reviewer.email, 'reviewer');
    await owner.context.close();

    who = await person(live.browser, 'reviewer', 'wide');
    const { page } = who;
    page.setDefaultTimeout(15_000);
    invitationPath = await signUpFromInvitation(live.server, who, reviewer, async () => {
      await expectTitle(page, `Join ${demo.teamName} · Blazebook`);
      await who.shoot('invitation');
    });
  });

  it('accepts with the keyboard and lands on the team’s designs', async () => {
    const { page } = who;
    await page.goto(`${live.server.url}${invitationPath}`);
    const accept = page.getByRole('button', { name: 'Accept the invitation' });
    await accept.focus();
    await page.keyboard.press('Enter');
    await page.waitForURL((url) => url.pathname === `/teams/${teamId}/notebooks`);
    await shown(page, `design-${demo.notebook}`).first().waitFor();
    await expectTitle(page, `Designs of ${demo.teamName} · Blazebook`);
    await who.shoot('team-designs');
  });

  it('opens the notebook and compares its last two versions in the editor’s words', async () => {
    const { page } = who;
    await shown(page, `open-${demo.notebook}`).first().click();
    await shown(page, 'notebook-title').filter({ hasText: demo.notebook }).waitFor();
    await expectTitle(page, new RegExp(`^${demo.notebook} v\\d · Blazebook$`));

    await shown(page, 'tab-history').click();
    await shown(page, 'compare-picker').waitFor();
    // Versions run newest first (v3, v2, v1): from v1 one step left is v2.
    await page.getByRole('radio', { name: 'Before: version 1' }).click();
    await page.keyboard.press('ArrowLeft');
    await eventually(() =>
      page.getByRole('radio', { name: 'Before: version 2' }).getAttribute('aria-checked'),
    ).toBe('true');
    await page.getByRole('radio', { name: 'After: version 3' }).click();
    await who.checkA11y('history');
    await page.getByRole('button', { name: 'Compare v2 with v3' }).click();

    await shown(page, 'compare-heading').waitFor();
    const params = shown(page, 'compare-params');
    await shown(page, 'changed-grating.grooveDensityPerMm').waitFor();
    const words = (await params.textContent()) ?? '';
    // The editor says "Czerny–Turner" and "Mount type"; the stored keys must not show through.
    expect(words).toContain('Czerny–Turner');
    expect(words).not.toMatch(/czerny-turner|\bkind\b|[a-z]+\.[a-z]+[A-Z]/);

    // Resolving power: one value scale, so one axis title, clear of every tick label.
    const plot = shown(page, 'compare-plot-power').first();
    await plot.scrollIntoViewIfNeeded();
    const texts = await textBoxes(plot);
    const axisTitles = texts.filter((text) => /rotate/.test(text.transform));
    expect(axisTitles.map((text) => text.text)).toHaveLength(1);
    const others = texts.filter((text) => !/rotate/.test(text.transform) && text.text.trim() !== '');
    for (const axisTitle of axisTitles) {
      expect(others.filter((text) => overlap(axisTitle, text)).map((text) => text.text)).toEqual([]);
    }
    await who.shoot('compare');
  });

  it('asks for a revision of v3 with a decision summary', async () => {
    const { page } = who;
    await shown(page, 'back-to-notebook').click();
    await shown(page, 'notebook-title').filter({ hasText: demo.notebook }).waitFor();
    await eventually(() => shown(page, 'version-line').textContent()).toContain(
      `v${demo.latest} of ${demo.latest}`,
    );
    const review = page.getByRole('button', { name: 'Review', exact: true });
    await review.focus();
    await page.keyboard.press('Enter');
    const section = shown(page, 'decision-section');
    await section.waitFor();
    // The demo owner asked for a review of v3 and nobody has decided on it yet; the v2 sign-off is
    // named with what changed since. This reviewer did not write v3: the three decisions are offered.
    await eventually(() => shown(page, 'review-state').textContent()).toBe('Review requested');
    expect(await shown(page, 'earlier-sign-off').textContent()).toContain('v2 was signed off');
    const summary = 'The 600/mm grating costs the line-lamp exercise its doublet; keep v2 as the baseline.';
    await shown(page, 'decision-summary').fill(summary);
    await section.getByRole('button', { name: 'Revise', exact: true }).click();
    const item = shown(page, 'decision-item').filter({ hasText: summary });
    await item.waitFor();
    expect(await item.textContent()).toContain(reviewer.name);
    await eventually(() => shown(page, 'review-state').textContent()).toBe('Revise');
    await eventually(() => shown(page, 'decision-summary').inputValue()).toBe('');
    await who.shoot('review', ['wide', 'phone']);
  });

  it('met no console error and no page error on the way', async () => {
    expectNoProblems(who);
    await who.context.close();
  });
});
