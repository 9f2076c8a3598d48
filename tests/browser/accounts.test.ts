import type { Browser, BrowserContext, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { launchBrowser, screenshot, startServer, viewports, type RunningServer } from '../support/browser';

const owner = { name: 'Ilka Brandauer', email: 'ilka.brandauer@example.com', password: 'grooves per millimetre' };
const colleague = { name: 'Oren Vasquez-Holm', email: 'oren.vh@example.com', password: 'blaze angle notebook' };

describe('accounts and teams in Chromium', () => {
  let server: RunningServer;
  let browser: Browser;
  let ownerContext: BrowserContext;
  let page: Page;
  const errors: string[] = [];

  beforeAll(async () => {
    server = await startServer();
    browser = await launchBrowser();
    ownerContext = await browser.newContext({ viewport: viewports.wide });
    page = await ownerContext.newPage();
    page.on('pageerror', (error) => errors.push(error.message));
  });
  afterAll(async () => {
    await browser?.close();
    await server?.stop();
  });

  async function shoot(target: Page, name: string) {
    for (const size of ['phone', 'wide'] as const) {
      await target.setViewportSize(viewports[size]);
      await target.waitForTimeout(150);
      await screenshot(target, `${name}-${size}`);
    }
    await target.setViewportSize(viewports.wide);
  }

  it('sends a signed-out visitor of the workspace to sign-in, and shows the sign-in and sign-up screens', async () => {
    await page.goto(`${server.url}/teams`);
    await page.getByRole('heading', { name: 'Sign in', level: 1 }).waitFor();
    expect(new URL(page.url()).searchParams.get('next')).toBe('/teams');
    await shoot(page, 'accounts-sign-in');

    await page.getByTestId('to-sign-up').click();
    await page.getByRole('heading', { name: 'Create your account' }).waitFor();
    await shoot(page, 'accounts-sign-up');
  });

  it('shows field errors from the schema under their fields', async () => {
    await page.getByTestId('email').fill('not an address');
    await page.getByTestId('password').fill('short');
    await page.getByTestId('sign-up-submit').click();
    await expect.poll(() => page.getByRole('alert').allTextContents()).toEqual([
      'Your name is required',
      'E-mail must be an e-mail address such as name@example.com',
      'Password must be at least 10 characters',
    ]);

    // Once submitted, the form checks again as the person types.
    await page.getByTestId('password').fill(' '.repeat(12));
    await expect.poll(() => page.getByRole('alert').allTextContents()).toContain('Password must not be only spaces');
    await page.getByTestId('display-name').fill(owner.name);
    await page.getByTestId('email').fill(owner.email);
    await page.getByTestId('password').fill(owner.email.toUpperCase());
    await expect.poll(() => page.getByRole('alert').allTextContents()).toEqual(['Password must not be your e-mail address']);
  });

  it('signs up, signs out and signs in again, coming back to the teams page', async () => {
    await page.getByTestId('display-name').fill(owner.name);
    await page.getByTestId('email').fill(owner.email);
    await page.getByTestId('password').fill(owner.password);
    await page.getByTestId('sign-up-submit').click();
    await page.getByRole('heading', { name: 'Your teams' }).waitFor();
    await page.getByText('Personal workspace').first().waitFor();

    await page.getByTestId('sign-out').click();
    await page.getByRole('heading', { name: 'Sign in', level: 1 }).waitFor();
    await page.goto(`${server.url}/teams`);
    await page.getByRole('heading', { name: 'Sign in', level: 1 }).waitFor();

    await page.getByTestId('email').fill(owner.email.toUpperCase());
    await page.getByTestId('password').fill('the wrong password');
    await page.getByTestId('sign-in-submit').click();
    await expect.poll(() => page.getByTestId('form-error').textContent()).toBe('The e-mail or the password is not right.');

    await page.getByTestId('password').fill(owner.password);
    await page.getByTestId('sign-in-submit').click();
    await page.getByRole('heading', { name: 'Your teams' }).waitFor();
    expect(new URL(page.url()).pathname).toBe('/teams');
  });

  it('creates a team and invites a colleague as reviewer', async () => {
    await page.getByTestId('team-name-input').fill('Grating bench');
    await page.getByTestId('create-team').click();
    await page.getByRole('heading', { name: 'Grating bench', level: 1 }).waitFor();
    expect(await page.getByTestId('my-role').textContent()).toBe('You are owner of this team.');

    await page.getByTestId('invite-email').fill(colleague.email);
    await page.getByTestId('invite-role-reviewer').click();
    await page.getByTestId('invite-submit').click();
    await page.getByTestId('invite-sent').waitFor();
    await page.getByTestId(`invitation-${colleague.email}`).waitFor();
    await shoot(page, 'accounts-members');
  });

  let invitationPath = '';

  it('shows the invitation in the outbox with a link to follow', async () => {
    await page.goto(`${server.url}/outbox`);
    const message = page.getByTestId('outbox-message').filter({ hasText: 'invited you to Grating bench' });
    await message.waitFor();
    expect(await message.textContent()).toContain(`To ${colleague.email}`);
    await shoot(page, 'accounts-outbox');
    const text = (await message.textContent()) ?? '';
    const match = /https?:\/\/[^\s]+?(\/invitations\/[a-z0-9]{40})/.exec(text);
    expect(match).not.toBeNull();
    invitationPath = match![1]!;
  });

  it('lets the colleague accept in another browser through sign-up, and shows them as reviewer', async () => {
    const other = await browser.newContext({ viewport: viewports.phone });
    const guest = await other.newPage();
    guest.on('pageerror', (error) => errors.push(error.message));
    await guest.goto(`${server.url}${invitationPath}`);
    await guest.getByRole('heading', { name: 'Join Grating bench' }).waitFor();
    expect(await guest.getByText(`invited ${colleague.email} to this team as reviewer`).count()).toBe(1);

    await guest.getByTestId('invitation-sign-up').click();
    await guest.getByRole('heading', { name: 'Create your account' }).waitFor();
    expect(await guest.getByTestId('email').inputValue()).toBe(colleague.email);
    await guest.getByTestId('display-name').fill(colleague.name);
    await guest.getByTestId('password').fill(colleague.password);
    await guest.getByTestId('sign-up-submit').click();

    // Back on the invitation, which asks for the address to be confirmed before it can be accepted.
    const confirmFirst = guest.getByTestId('invitation-confirm-first');
    await confirmFirst.waitFor();
    expect(await confirmFirst.textContent()).toBe(
      `Confirm your e-mail address first: open the link we sent to ${colleague.email}, then come back to this invitation.`,
    );
    expect(await guest.getByTestId('accept-invitation').count()).toBe(0);
    await guest.getByTestId('resend-confirmation').click();
    await guest.getByTestId('confirmation-resent').waitFor();
    await screenshot(guest, 'accounts-invitation-confirm-first-phone');

    // The newest confirmation mail (the resent one) is first in the outbox.
    await guest.goto(`${server.url}/outbox`);
    const confirmation = guest
      .getByTestId('outbox-message')
      .filter({ hasText: 'Confirm your e-mail address for Blazebook' })
      .filter({ hasText: `To ${colleague.email}` })
      .first();
    await confirmation.getByTestId('outbox-open-link').click();
    await expect.poll(() => guest.getByTestId('verify-result').textContent()).toBe(`Thank you: ${colleague.email} is confirmed.`);

    await guest.goto(`${server.url}${invitationPath}`);
    await guest.getByTestId('accept-invitation').click();
    await guest.getByRole('heading', { name: 'Grating bench', level: 1 }).waitFor();
    expect(await guest.getByTestId('my-role').textContent()).toBe('You are reviewer of this team.');
    // A reviewer sees roles as text, with no controls to change them and no invite form.
    expect(await guest.getByTestId(`role-${colleague.email}`).textContent()).toBe('Reviewer');
    expect(await guest.getByTestId('invite-form').count()).toBe(0);
    await screenshot(guest, 'accounts-members-reviewer-phone');
    await other.close();

    await page.goto(`${server.url}/teams`);
    await page.getByTestId('team-Grating bench').click();
    const row = page.getByTestId(`member-${colleague.email}`);
    await row.waitFor();
    expect(await row.textContent()).toContain(colleague.name);
    expect(await page.getByTestId(`role-${colleague.email}-reviewer`).getAttribute('aria-checked')).toBe('true');
    expect(errors).toEqual([]);
  });
});
