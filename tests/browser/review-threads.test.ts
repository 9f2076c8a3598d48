import type { Page } from 'playwright-core';
import { describe, expect, it } from 'vitest';
import { expectAccessible } from '../support/axe';
import { liveServerAndBrowser, screenshot, viewports, type ViewportName } from '../support/browser';
import { demo, eventually, expectNoProblems, openReview, signInAs, linkPath, newestMail, person, shown, type Person } from './journeys/journey';

const reviewerAccount = { email: 'tobiah.reviewer@quillmere-lab.example.com', name: 'Tobiah Rennick' };
const ownerName = 'Maren Okafor-Lind';
const title = 'Review threads: sodium lamp exit slit';
const exitSlit = 'slits.exitWidthUm';
const remark = 'The exit slit is too wide for the 0.2 nm requirement between the sodium lines; narrow it.';
const reply = 'Narrowed to 60 µm in v3; the bandpass is now under 0.2 nm across the doublet.';

/** The test id, else the accessible name, of the element with the keyboard focus. */
function focused(page: Page) {
  return page.evaluate(() => {
    const active = document.activeElement;
    return active?.getAttribute('data-testid') ?? active?.getAttribute('aria-label') ?? active?.textContent ?? '';
  });
}

/** Screenshots of the review at each size (`review-threads-<step>-<size>.png`), with axe at each. */
async function shoot(who: Person, step: string) {
  for (const size of ['phone', 'tablet', 'wide'] as const satisfies readonly ViewportName[]) {
    await who.page.setViewportSize(viewports[size]);
    await who.page.waitForTimeout(350);
    await shown(who.page, 'review-panel').waitFor();
    await screenshot(who.page, `review-threads-${step}-${size}`);
    await expectAccessible(who.page, `review threads: ${step} at ${size}`);
  }
  await who.page.setViewportSize(viewports[who.size]);
  await who.page.waitForTimeout(250);
}

/** "100 µm" as the app writes it: the unit after a no-break space. */
const quantity = (value: number, unit: string) => `${value}\u00A0${unit}`;

/**
 * The browser journey: the demo reviewer pins a remark to the exit slit of v2 on a phone;
 * the owner follows the e-mailed link, sees the marker on the field, saves v3 with a narrower slit
 * (the save card names the open thread); on v3 the thread reads "Field changed since v2"; the
 * reviewer replies and resolves it by keyboard and signs v3 off; the history shows it; the owner,
 * who wrote v3, has no sign-off button.
 */
describe('review threads pinned to a field, in Chromium', { timeout: 300_000 }, () => {
  const live = liveServerAndBrowser({ NODE_ENV: 'development' });
  let owner: Person;
  let reviewer: Person;
  let designId = '';

  it('starts from a design of its own with v2 at a 100 µm exit slit', async () => {
    owner = await person(live.browser, 'threads-owner', 'wide');
    await signInAs(owner, live.server, demo.owner);
    const api = owner.context.request;
    const url = live.server.url;
    const teams = (await (await api.get(`${url}/api/teams`)).json()) as { teams: { id: string; name: string }[] };
    const teamId = teams.teams.find((team) => team.name === demo.teamName)?.id ?? '';
    expect(teamId).not.toBe('');
    const list = (await (await api.get(`${url}/api/teams/${teamId}/designs?q=${encodeURIComponent(demo.notebook)}`)).json()) as {
      designs: { id: string }[];
    };
    const source = (await (await api.get(`${url}/api/designs/${list.designs[0]!.id}`)).json()) as {
      version: { params: { slits: Record<string, number> } };
    };
    const params = source.version.params;
    const made = await api.post(`${url}/api/teams/${teamId}/designs`, {
      data: { title, params: { ...params, slits: { ...params.slits, exitWidthUm: 150 } }, message: 'First version' },
      headers: { origin: url },
    });
    expect(made.status()).toBe(201);
    designId = ((await made.json()) as { design: { id: string } }).design.id;
    const v2 = await api.post(`${url}/api/designs/${designId}/versions`, {
      data: { baseVersion: 1, params: { ...params, slits: { ...params.slits, exitWidthUm: 100 } }, message: 'Exit slit 100 µm' },
      headers: { origin: url },
    });
    expect(v2.status()).toBe(201);
    // A thread of the owner's own on a result, for the read-out's marker and the design-changed line.
    const onResult = await api.post(`${url}/api/designs/${designId}/versions/2/threads`, {
      data: { pin: { kind: 'result', result: 'bandpass', wavelengthNm: 589 }, body: 'Check the bandpass at the sodium D lines.' },
      headers: { origin: url },
    });
    expect(onResult.status()).toBe(201);
  });

  it('lets the reviewer pin a remark to the exit slit of v2 on a phone, mentioning the owner', async () => {
    reviewer = await person(live.browser, 'threads-reviewer', 'phone');
    await signInAs(reviewer, live.server, reviewerAccount.email);
    const { page } = reviewer;
    page.setDefaultTimeout(15_000);
    await page.goto(`${live.server.url}/notebooks/${designId}/v/2`);
    await shown(page, 'notebook-title').filter({ hasText: title }).waitFor();

    // On a phone the review is a modal sheet: the focus moves into it, Escape closes it and gives
    // the focus back to the bar's Review button.
    await openReview(page);
    await page.getByRole('dialog').waitFor();
    await eventually(() => focused(page)).toBe('review-close');
    await page.keyboard.press('Escape');
    await eventually(() => shown(page, 'review-panel').count()).toBe(0);
    await eventually(() => focused(page)).toBe('bar-review');
    await openReview(page);
    await eventually(() => shown(page, 'threads-here').getByRole('article').count()).toBe(1);
    expect(await shown(page, 'threads-here').getByTestId('thread-pin').textContent()).toBe('Bandpass at 589 nm');

    await shown(page, 'new-remark').click();
    const form = shown(page, 'new-remark-form');
    await form.getByRole('radio', { name: 'Design field' }).click();
    await form.getByRole('radio', { name: 'Slits' }).click();
    await form.getByRole('radio', { name: 'Exit slit width' }).click();
    await eventually(() => shown(page, 'pin-preview').textContent()).toBe('Pinned to: Exit slit width');
    await reviewer.checkA11y('the new-remark form in the sheet');

    // Over the limit first: the error names the remark.
    const body = shown(page, 'new-remark-body');
    await body.fill('x'.repeat(10_001));
    await shown(page, 'start-thread').click();
    await eventually(() => shown(page, 'new-remark-error').textContent()).toBe('The remark must be at most 10,000 characters');

    // `@Mar` offers the owner; choosing writes the whole name.
    await body.fill(`${remark} @Mar`);
    const mention = form.getByRole('button', { name: `${ownerName}, mention` });
    await mention.click();
    await eventually(() => body.inputValue()).toBe(`${remark} @${ownerName} `);
    await shown(page, 'start-thread').click();

    const thread = shown(page, 'threads-here').getByRole('article', { name: 'Thread on Exit slit width' });
    await thread.waitFor();
    await eventually(() => page.getByRole('radio', { name: 'Open (2)' }).count()).toBe(1);
    await eventually(() => thread.getByTestId('remark-body').textContent()).toBe(`${remark} @${ownerName}`);
    expect(await thread.getByTestId('thread-pin').textContent()).toBe('Exit slit width');
    // The marker beside the field counts it (behind the sheet).
    await shown(page, 'review-close').click();
    const marker = page.getByRole('button', { name: '1 open remark on Exit slit width' });
    await eventually(() => marker.count()).toBe(1);
    await marker.scrollIntoViewIfNeeded();
    await screenshot(page, 'review-threads-marker-phone');
  });

  it('takes the owner from the e-mail to the thread, with the marker on the field', async () => {
    const mail = await newestMail(live.server, owner.context, demo.owner, title);
    expect(mail.subject).toContain(reviewerAccount.name);
    const path = linkPath(mail.text, '/notebooks/');
    expect(path).toMatch(new RegExp(`^/notebooks/${designId}/v/2\\?thread=`));
    const threadId = new URL(path, live.server.url).searchParams.get('thread') ?? '';

    const { page } = owner;
    page.setDefaultTimeout(15_000);
    await page.goto(`${live.server.url}${path}`);
    // Wide: the side panel beside the editor, turned to the linked thread.
    const panel = shown(page, 'review-panel');
    await panel.waitFor();
    const thread = shown(page, `thread-${threadId}`);
    await eventually(() => thread.getByTestId('remark-body').textContent()).toBe(`${remark} @${ownerName}`);
    const marker = page.getByRole('button', { name: '1 open remark on Exit slit width' });
    await eventually(() => marker.textContent()).toBe('1 open');
    // The read-out counts the thread on the bandpass, whatever its wavelength.
    await eventually(() => page.getByRole('button', { name: '1 open remark on Bandpass' }).textContent()).toBe('1 open');
    await screenshot(page, 'review-threads-link-wide');
    await owner.checkA11y('the thread opened from the e-mail link');

    // The pin label shows its field: scrolled to, highlighted and focused.
    await thread.getByRole('button', { name: 'Exit slit width, show the field' }).click();
    await eventually(() => focused(page)).toBe(`field-${exitSlit}`);
    // The marker opens the panel on its thread.
    await shown(page, 'review-close').click();
    await eventually(() => shown(page, 'review-panel').count()).toBe(0);
    await marker.click();
    await shown(page, `thread-${threadId}`).waitFor();
  });

  it('lets the owner save v3 with a narrower slit, the save card naming the open thread', async () => {
    const { page } = owner;
    const field = shown(page, `field-${exitSlit}`);
    await field.fill('60');
    await field.blur();
    await shown(page, 'bar-save').click();
    const leaves = shown(page, 'save-open-threads');
    await eventually(() => leaves.textContent()).toMatch(/^This save leaves 2 open threads unresolved: .+\. They carry over to v3\.$/);
    expect(await leaves.textContent()).toContain('Exit slit width');
    expect(await leaves.textContent()).toContain('Bandpass at 589 nm');
    await shown(page, 'version-message').fill('Exit slit 60 µm for the doublet');
    await shown(page, 'save-version').click();
    await eventually(() => shown(page, 'version-line').textContent()).toContain('v3 of 3');

    await openReview(page);
    const carried = shown(page, 'threads-carried').getByRole('article', { name: 'Thread on Exit slit width' });
    await eventually(() => carried.getByTestId('thread-carry').textContent()).toBe(
      `Field changed since v2 (was ${quantity(100, 'µm')}, now ${quantity(60, 'µm')})`,
    );
    const onBandpass = shown(page, 'threads-carried').getByRole('article', { name: 'Thread on Bandpass at 589 nm' });
    expect(await onBandpass.getByTestId('thread-carry').textContent()).toBe('Design changed since v2 (1 field)');
    // The owner wrote v3: the decision part has no sign-off for them.
    await shown(page, 'decision-section').waitFor();
    expect(await page.getByRole('button', { name: 'Sign off', exact: true }).count()).toBe(0);
    await owner.checkA11y('v3 with the carried thread');
  });

  // In one full run of the suite (browser files beside the unit and API projects, load ~15 on two
  // cores) the focus went back to the bar's Review button after Enter on Reply, once; alone it
  // passes every time. One retry (a fresh page load; nothing was written yet) while the cause is
  // looked into: see the issue 13 note.
  it('lets the reviewer reply and resolve by keyboard on v3, then sign v3 off', { retry: 1 }, async () => {
    const { page } = reviewer;
    await page.goto(`${live.server.url}/notebooks/${designId}`);
    await shown(page, 'notebook-title').filter({ hasText: title }).waitFor();
    await eventually(() => shown(page, 'version-line').textContent()).toContain('v3 of 3');
    await openReview(page);
    const thread = shown(page, 'threads-carried').getByRole('article', { name: 'Thread on Exit slit width' });
    await eventually(() => thread.getByTestId('thread-carry').textContent()).toBe(
      `Field changed since v2 (was ${quantity(100, 'µm')}, now ${quantity(60, 'µm')})`,
    );

    // Compose by keyboard: Reply opens a box that takes the focus; Tab reaches Send reply.
    await thread.getByRole('button', { name: 'Reply on Exit slit width' }).focus();
    await page.keyboard.press('Enter');
    await eventually(() => focused(page)).toBe('reply-body');
    await page.keyboard.type(reply);
    await page.keyboard.press('Tab');
    expect(await focused(page)).toBe('send-reply');
    await page.keyboard.press('Enter');
    await eventually(() => thread.getByTestId('remark-body').count()).toBe(2);
    expect(await thread.getByTestId('remark-body').nth(1).textContent()).toBe(reply);
    await shoot(reviewer, 'thread');

    // One's own remark: edited (the earlier text can be read), then a removal asked for and kept.
    const second = thread.getByTestId('remark').nth(1);
    await second.getByRole('button', { name: 'Edit your remark on Exit slit width' }).click();
    const edit = shown(page, 'edit-remark-body');
    await edit.fill(`${reply} Checked at 589.0 and 589.6 nm.`);
    await shown(page, 'save-remark').click();
    await eventually(() => thread.getByTestId('remark-body').nth(1).textContent()).toBe(`${reply} Checked at 589.0 and 589.6 nm.`);
    await second.getByRole('button', { name: 'edited, show the earlier text' }).click();
    await eventually(() => second.getByTestId('remark-earlier').textContent()).toContain(reply);
    await second.getByRole('button', { name: 'Remove your remark on Exit slit width' }).click();
    await second.getByRole('button', { name: 'Keep it' }).click();
    expect(await thread.getByTestId('remark-body').count()).toBe(2);
    await second.getByRole('button', { name: 'Remove your remark on Exit slit width' }).click();
    await second.getByRole('button', { name: 'Remove', exact: true }).click();
    await eventually(() => thread.getByTestId('remark-removed').textContent()).toMatch(/^A remark was removed/);
    expect(await thread.getByTestId('remark-body').count()).toBe(1);

    await thread.getByRole('button', { name: 'Resolve the thread on Exit slit width' }).focus();
    await page.keyboard.press('Enter');
    await eventually(() => page.getByRole('radio', { name: 'Open (1)' }).count()).toBe(1);
    expect(await shown(page, 'threads-carried').getByRole('article', { name: 'Thread on Exit slit width' }).count()).toBe(0);
    await page.getByRole('radio', { name: 'Resolved (1)' }).click();
    await eventually(() => shown(page, 'thread-resolved').textContent()).toMatch(new RegExp(`^Resolved by ${reviewerAccount.name} on \\d{1,2} \\w+ \\d{4}$`));

    // Sign-off through the decision form, at the top of the same sheet.
    await shown(page, 'decision-summary').fill('Signed off: the 60 µm exit slit meets the 0.2 nm requirement.');
    await page.getByRole('button', { name: 'Sign off', exact: true }).click();
    await eventually(() => shown(page, 'review-state').textContent()).toBe('Signed off');
    await shown(page, 'review-close').click();
    await shown(page, 'tab-history').click();
    await eventually(() => shown(page, 'history-review-state-3').textContent()).toBe('Signed off');
  });

  it('shows the owner the resolved thread and still no sign-off button on v3', async () => {
    const { page } = owner;
    await page.goto(`${live.server.url}/notebooks/${designId}/v/3?review=1`);
    await shown(page, 'review-panel').waitFor();
    await eventually(() => shown(page, 'review-state').textContent()).toBe('Signed off');
    expect(await page.getByRole('button', { name: 'Sign off', exact: true }).count()).toBe(0);
    await eventually(() => shown(page, 'threads-carried').getByTestId('thread-pin').allTextContents()).toEqual(['Bandpass at 589 nm']);
    expect(await page.getByRole('button', { name: /open remarks? on Exit slit width/ }).count()).toBe(0);
  });

  it('lets a viewer follow a link to the resolved thread on v2 and read it, with nothing to write', async () => {
    const viewer = await person(live.browser, 'threads-viewer', 'tablet');
    await signInAs(viewer, live.server, 'juno.viewer@quillmere-lab.example.com');
    const { page } = viewer;
    page.setDefaultTimeout(15_000);
    const review = (await (await viewer.context.request.get(`${live.server.url}/api/designs/${designId}/versions/2/review`)).json()) as {
      threads: { id: string; status: string; pin: { kind: string } }[];
    };
    const onSlit = review.threads.find((t) => t.pin.kind === 'field');
    const threadId = onSlit?.id ?? '';
    expect(onSlit?.status).toBe('resolved');
    await page.goto(`${live.server.url}/notebooks/${designId}/v/2?thread=${threadId}`);
    // A link to a resolved thread opens the resolved list.
    const thread = shown(page, `thread-${threadId}`);
    await eventually(() => thread.getByTestId('thread-resolved').textContent()).toMatch(/^Resolved by Tobiah Rennick on /);
    expect(await thread.getByTestId('remark-body').count()).toBe(1);
    expect(await thread.getByTestId('remark-removed').count()).toBe(1);
    expect(await shown(page, 'new-remark').count()).toBe(0);
    expect(await thread.getByRole('button', { name: /^(Reply|Reopen|Edit|Remove)/ }).count()).toBe(0);
    await viewer.checkA11y('a resolved thread read by a viewer');
    expectNoProblems(viewer);
    await viewer.context.close();
  });

  it('met no console error, page error or axe finding', async () => {
    expectNoProblems(reviewer);
    expectNoProblems(owner);
    await reviewer.context.close();
    await owner.context.close();
  });
});
