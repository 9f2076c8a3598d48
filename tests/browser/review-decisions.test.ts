import type { Page } from 'playwright-core';
import { describe, expect, it } from 'vitest';
import { fieldLabel } from '../../shared/design-fields';
import { formatDay } from '../../shared/format';
import { liveServerAndBrowser } from '../support/browser';
import { demo, eventually, expectNoProblems, openReview, signInAs, person, shown, type Person } from './journeys/journey';

const reviewerAccount = { email: 'tobiah.reviewer@quillmere-lab.example.com', name: 'Tobiah Rennick' };
const title = 'Review decisions: argon line survey';
const remarks = 'Signed off for the teaching lab; the 25 µm exit slit only just splits the 696/697 nm pair.';

/** The accessible name of the element that has the keyboard focus. */
function focusedName(page: Page) {
  return page.evaluate(() => {
    const active = document.activeElement;
    return active?.getAttribute('aria-label') ?? active?.textContent ?? '';
  });
}

/**
 * An owner asks the demo reviewer to review v1 with a due date; the reviewer signs it off with
 * remarks from a phone, with the keyboard; the history and the list show it, and the list's
 * filter keeps it over a reload; v2, saved by the owner, starts unreviewed and names the v1
 * sign-off and what changed; the owner never sees sign-off buttons on a version they wrote.
 */
describe('review requests and sign-off in Chromium', { timeout: 240_000 }, () => {
  const live = liveServerAndBrowser({ NODE_ENV: 'development' });
  let owner: Person;
  let reviewer: Person;
  let teamId = '';
  let designId = '';
  // Two weeks ahead, as a calendar day (the form takes YYYY-MM-DD).
  const due = new Date(Date.now() + 14 * 86_400_000).toISOString().slice(0, 10);

  it('lets the owner request a review of v1 from the demo reviewer, with a due date checked first', async () => {
    owner = await person(live.browser, 'review-owner', 'wide');
    await signInAs(owner, live.server, demo.owner);
    const api = owner.context.request;
    const teams = (await (await api.get(`${live.server.url}/api/teams`)).json()) as { teams: { id: string; name: string }[] };
    teamId = teams.teams.find((team) => team.name === demo.teamName)?.id ?? '';
    expect(teamId).not.toBe('');
    // A design of its own, made from the demo notebook's latest parameters, so no other test's review shows.
    const list = (await (await api.get(`${live.server.url}/api/teams/${teamId}/designs?q=${encodeURIComponent(demo.notebook)}`)).json()) as {
      designs: { id: string }[];
    };
    const source = (await (await api.get(`${live.server.url}/api/designs/${list.designs[0]!.id}`)).json()) as { version: { params: unknown } };
    const made = await api.post(`${live.server.url}/api/teams/${teamId}/designs`, {
      data: { title, params: source.version.params, message: 'First version' },
      headers: { origin: live.server.url },
    });
    expect(made.status()).toBe(201);
    designId = ((await made.json()) as { design: { id: string } }).design.id;

    const { page } = owner;
    page.setDefaultTimeout(15_000);
    await page.goto(`${live.server.url}/notebooks/${designId}/v/1`);
    await shown(page, 'notebook-title').filter({ hasText: title }).waitFor();
    await openReview(page, 'decision-section');
    const section = shown(page, 'decision-section');
    await eventually(() => shown(page, 'review-state').textContent()).toBe('Not reviewed');
    // The owner wrote v1: no way to decide on it, and a line that says why.
    await eventually(() => shown(page, 'decision-author-note').textContent()).toBe('You wrote v1; another owner or reviewer decides on it.');
    for (const name of ['Sign off', 'Sign off with remarks', 'Revise']) {
      expect(await section.getByRole('button', { name, exact: true }).count(), name).toBe(0);
    }

    await section.getByRole('button', { name: 'Request a review', exact: true }).click();
    const choice = section.getByRole('button', { name: reviewerAccount.name, exact: true });
    await choice.waitFor();
    // The owner wrote v1, so they are not offered as its reviewer.
    expect(await section.getByRole('button', { name: 'Maren Okafor-Lind', exact: true }).count()).toBe(0);
    await choice.click();
    await eventually(() => choice.getAttribute('aria-pressed')).toBe('true');

    await shown(page, 'review-request-due').fill('2026-02-30');
    await section.getByRole('button', { name: 'Send the request', exact: true }).click();
    await eventually(() => section.getByRole('alert').first().textContent()).toContain('Due date must be a date such as');
    expect(await shown(page, 'review-request-due').getAttribute('aria-invalid')).toBe('true');

    await shown(page, 'review-request-due').fill(due);
    await shown(page, 'review-request-note').fill('Please check the exit slit against the argon pair.');
    await section.getByRole('button', { name: 'Send the request', exact: true }).click();
    await eventually(() => shown(page, 'review-request-done').textContent()).toBe(`Review of v1 requested from ${reviewerAccount.name}.`);
    const request = shown(page, 'review-request-item');
    await eventually(() => request.textContent()).toContain(`${reviewerAccount.name}, due ${formatDay(`${due}T00:00:00Z`, 'UTC')} — waiting`);
    await eventually(() => shown(page, 'review-state').textContent()).toBe('Review requested');
  });

  it('lets the reviewer sign v1 off with remarks on a phone, with the keyboard, after a 403 in its own words and a missing summary named', async () => {
    reviewer = await person(live.browser, 'review-reviewer', 'phone');
    await signInAs(reviewer, live.server, reviewerAccount.email);
    const { page } = reviewer;
    page.setDefaultTimeout(15_000);
    await page.goto(`${live.server.url}/notebooks/${designId}/v/1`);
    await shown(page, 'notebook-title').filter({ hasText: title }).waitFor();
    await openReview(page, 'decision-section');
    await eventually(() => shown(page, 'review-state').textContent()).toBe('Review requested');
    await eventually(() => shown(page, 'review-request-item').textContent()).toContain('waiting');

    // The owner makes the reviewer a viewer while the form is open: the server's 403 is shown in its
    // own words, and the summary stays in the box. Chromium logs the refused request as a console
    // error, the one this test means to cause: exactly that one is checked and taken off the list.
    const summary = shown(page, 'decision-summary');
    const setReviewerRole = async (role: 'viewer' | 'reviewer') => {
      const members = (await (await owner.context.request.get(`${live.server.url}/api/teams/${teamId}/members`)).json()) as {
        members: { userId: string; email: string }[];
      };
      const userId = members.members.find((member) => member.email === reviewerAccount.email)?.userId;
      const answer = await owner.context.request.patch(`${live.server.url}/api/teams/${teamId}/members/${userId}`, {
        data: { role },
        headers: { origin: live.server.url },
      });
      expect(answer.status()).toBe(200);
    };
    await setReviewerRole('viewer');
    await summary.fill('Too late: no longer a reviewer.');
    await shown(page, 'decision-section').getByRole('button', { name: 'Revise', exact: true }).click();
    await eventually(() => shown(page, 'decision-error').textContent()).toBe('A viewer of this team may not do that.');
    expect(await summary.inputValue()).toBe('Too late: no longer a reviewer.');
    expect(reviewer.problems).toEqual([expect.stringMatching(/status of 403 .*\/decisions\)$/)]);
    reviewer.problems.length = 0;
    await setReviewerRole('reviewer');
    await summary.fill('');

    await summary.focus();
    // Straight to the buttons with nothing written: the form names the field it needs.
    await page.keyboard.press('Tab');
    expect(await focusedName(page)).toBe('Sign off');
    await page.keyboard.press('Enter');
    await eventually(() => shown(page, 'decision-section').getByRole('alert').first().textContent()).toBe('Decision summary is required');

    await summary.focus();
    await page.keyboard.type(remarks);
    await page.keyboard.press('Tab');
    await page.keyboard.press('Tab');
    expect(await focusedName(page)).toBe('Sign off with remarks');
    await page.keyboard.press('Enter');

    await eventually(() => shown(page, 'decision-done').textContent()).toBe('Your decision on v1 is recorded: Signed off with remarks.');
    await eventually(() => shown(page, 'review-state').textContent()).toBe('Signed off with remarks');
    const decision = shown(page, 'decision-item');
    await eventually(() => decision.textContent()).toContain(reviewerAccount.name);
    expect(await decision.textContent()).toContain(remarks);
    await eventually(() => shown(page, 'review-request-item').textContent()).toContain('answered');
    expect(await summary.inputValue()).toBe('');
    await shown(page, 'decision-section').scrollIntoViewIfNeeded();
    await reviewer.shoot('decision-section');
  });

  it('shows the sign-off in the history', async () => {
    const { page } = reviewer;
    await page.goto(`${live.server.url}/notebooks/${designId}`);
    await shown(page, 'tab-history').click();
    await eventually(() => shown(page, 'history-review-state-1').textContent()).toBe('Signed off with remarks');
    await reviewer.checkA11y('history with a sign-off');
  });

  it('filters the design list by "Signed off with remarks", and the filter survives a reload', async () => {
    const { page } = owner;
    await page.goto(`${live.server.url}/teams/${teamId}/notebooks`);
    await shown(page, `design-${title}`).first().waitFor();
    await eventually(() => shown(page, `review-state-${title}`).textContent()).toBe('Signed off with remarks');
    await page.getByRole('radio', { name: 'Signed off with remarks', exact: true }).click();
    await page.waitForURL((url) => url.searchParams.get('review') === 'signed-off-with-remarks');
    const showsOnly = async () => {
      await shown(page, `design-${title}`).first().waitFor();
      // Every row left is in that state: the demo notebooks, never decided on so, are gone.
      const states = await page.locator('[data-testid^="review-state-"]').filter({ visible: true }).allTextContents();
      expect(states.length).toBeGreaterThan(0);
      expect(new Set(states)).toEqual(new Set(['Signed off with remarks']));
      expect(await shown(page, `design-${demo.notebook}`).count()).toBe(0);
    };
    await eventually(() => shown(page, `design-${demo.notebook}`).count()).toBe(0);
    await showsOnly();
    await page.reload();
    await eventually(() => page.getByRole('radio', { name: 'Signed off with remarks', exact: true }).getAttribute('aria-checked')).toBe('true');
    await showsOnly();
    await owner.shoot('list-filtered');
  });

  it('starts v2 unreviewed, naming the v1 sign-off and what changed, with no sign-off buttons for its author', async () => {
    const { page } = owner;
    await page.goto(`${live.server.url}/notebooks/${designId}`);
    await shown(page, 'field-slits.exitWidthUm').fill('30');
    await page.getByRole('button', { name: 'Save version', exact: true }).filter({ visible: true }).first().click();
    await shown(page, 'version-message').fill('Wider exit slit for more light');
    await shown(page, 'save-version').click();
    await eventually(() => shown(page, 'version-line').textContent()).toContain('v2 of 2');

    await openReview(page, 'decision-section');
    await eventually(() => shown(page, 'review-state').textContent()).toBe('Not reviewed');
    const earlier = shown(page, 'earlier-sign-off');
    await eventually(() => earlier.textContent()).toContain(`v1 was signed off with remarks by ${reviewerAccount.name} on `);
    expect(await earlier.textContent()).toContain(`Changed since: ${fieldLabel('slits.exitWidthUm')}`);
    await eventually(() => shown(page, 'decision-author-note').textContent()).toBe('You wrote v2; another owner or reviewer decides on it.');
    const section = shown(page, 'decision-section');
    for (const name of ['Sign off', 'Sign off with remarks', 'Revise']) {
      expect(await section.getByRole('button', { name, exact: true }).count(), name).toBe(0);
    }
    await section.scrollIntoViewIfNeeded();
    await owner.shoot('decision-section-v2');

    await shown(page, 'tab-history').click();
    await eventually(() => shown(page, 'history-review-state-2').textContent()).toBe('Not reviewed');
    expect(await shown(page, 'history-review-state-1').textContent()).toBe('Signed off with remarks');
    await owner.shoot('history');
  });

  it('met no console error, no page error and no serious axe finding on the way', async () => {
    expectNoProblems(reviewer);
    expectNoProblems(owner);
    await reviewer.context.close();
    await owner.context.close();
  });
});
