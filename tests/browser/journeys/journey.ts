import type { Browser, BrowserContext, Locator, Page } from 'playwright-core';
import { expect } from 'vitest';
import { expectAccessible } from '../../support/axe';
import { screenshot, viewports, type RunningServer, type ViewportName } from '../../support/browser';

/** The demo data a development server seeds on an empty database (server/seed/demo.ts, notebooks.ts). */
export const demo = {
  password: 'grating-demo-2026',
  owner: 'maren.owner@quillmere-lab.example.com',
  teamName: 'Quillmere Optics Teaching Lab',
  notebook: 'Teaching-lab visible scanner',
  /** The seed marks v2 of three as the team's baseline. */
  baseline: 2,
  latest: 3,
} as const;

export const allSizes: readonly ViewportName[] = ['phone', 'tablet', 'wide'];

/**
 * One person's browser for a journey: a context of their own at their usual size, a page, and every
 * console error and uncaught page error it produces, so the journey can end by asserting none.
 */
export type Person = {
  name: string;
  context: BrowserContext;
  page: Page;
  problems: string[];
  /** axe's serious and critical findings, screen by screen, asserted empty when the journey ends. */
  axeFindings: string[];
  size: ViewportName;
  /** Screenshots at the given sizes (then back to the person's own), with axe at each. */
  shoot(step: string, sizes?: readonly ViewportName[]): Promise<void>;
  /** axe on the screen as it is now, at the current size. */
  checkA11y(step: string): Promise<void>;
};

export async function person(
  browser: Browser,
  name: string,
  size: ViewportName,
  options: { acceptDownloads?: boolean } = {},
): Promise<Person> {
  const context = await browser.newContext({
    viewport: viewports[size],
    acceptDownloads: options.acceptDownloads ?? false,
  });
  const page = await context.newPage();
  const problems: string[] = [];
  page.on('console', (message) => {
    if (message.type() === 'error') problems.push(`console: ${message.text()} (${message.location().url})`);
  });
  page.on('pageerror', (error) => problems.push(`page error: ${error.message}`));
  const axeFindings: string[] = [];
  // A finding is kept and the walk goes on, so one screen's defect does not hide the next screen's;
  // the journey's last step asserts there were none.
  const checkA11y = async (step: string) => {
    try {
      await expectAccessible(page, `${name}: ${step}`);
    } catch (error) {
      // The assertion's actual value lists each violation (rule, impact, targets, help).
      const actual = (error as { actual?: unknown }).actual;
      axeFindings.push(`${step}: ${Array.isArray(actual) ? actual.join('\n  ') : String(error)}`);
    }
  };
  return {
    name,
    context,
    page,
    problems,
    axeFindings,
    size,
    checkA11y,
    async shoot(step, sizes = allSizes) {
      for (const each of sizes) {
        await page.setViewportSize(viewports[each]);
        // React Native Web lays out again on resize; let it settle before the picture and the check.
        await page.waitForTimeout(300);
        await screenshot(page, `journey-${name}-${step}-${each}`);
        await checkA11y(`${step} at ${each}`);
      }
      await page.setViewportSize(viewports[size]);
      await page.waitForTimeout(200);
    },
  };
}

/** The newest outbox message to `to` whose subject contains `subject`, read through the dev API. */
export async function newestMail(
  server: RunningServer,
  context: BrowserContext,
  to: string,
  subject: string,
) {
  const answer = await context.request.get(`${server.url}/api/dev/outbox`);
  expect(answer.status()).toBe(200);
  const { messages } = (await answer.json()) as { messages: { to: string; subject: string; text: string }[] };
  const message = messages.find((m) => m.to === to && m.subject.includes(subject));
  expect(message, `a message to ${to} about “${subject}”`).toBeDefined();
  return message!;
}

/** The path of the first link in a message's text that points at `route` ("/invitations/…"). */
export function linkPath(text: string, route: string): string {
  const match = new RegExp(`https?://[^\\s]+?(${route}[^\\s]*)`).exec(text);
  expect(match, `a ${route} link in:\n${text}`).not.toBeNull();
  return match![1]!;
}

/** A signed-in API context for the demo team's owner, who sets up what a journey starts from. */
export async function ownerApi(browser: Browser, server: RunningServer) {
  const context = await browser.newContext();
  const signIn = await context.request.post(`${server.url}/api/auth/sign-in`, {
    data: { email: demo.owner, password: demo.password },
    headers: { origin: server.url },
  });
  expect(signIn.status()).toBe(200);
  const teams = (await (await context.request.get(`${server.url}/api/teams`)).json()) as {
    teams: { id: string; name: string; personal: boolean }[];
  };
  const team = teams.teams.find((t) => t.name === demo.teamName);
  expect(team).toBeDefined();
  const invite = async (email: string, role: 'reviewer' | 'viewer' | 'owner') => {
    const answer = await context.request.post(`${server.url}/api/teams/${team!.id}/invitations`, {
      data: { email, role },
      headers: { origin: server.url },
    });
    expect(answer.status()).toBe(201);
  };
  return { context, teamId: team!.id, invite };
}

/**
 * Someone invited by the demo owner opens the mailed invitation, makes an account from it and
 * confirms the address, ending signed in and confirmed. `onInvitation` runs while the invitation
 * page shows, before sign-up. Answers the invitation's path, for accepting it.
 */
export async function signUpFromInvitation(
  server: RunningServer,
  who: Person,
  account: { name: string; email: string; password: string },
  onInvitation: () => Promise<void> = async () => {},
): Promise<string> {
  const { page, context } = who;
  const invitation = await newestMail(server, context, account.email, `invited you to ${demo.teamName}`);
  const invitationPath = linkPath(invitation.text, '/invitations/');
  await page.goto(`${server.url}${invitationPath}`);
  await page.getByRole('heading', { name: `Join ${demo.teamName}` }).waitFor();
  await onInvitation();
  await shown(page, 'invitation-sign-up').click();
  await fillSignUp(page, account);
  // Back on the invitation, which needs the address confirmed before it can be accepted.
  await shown(page, 'invitation-confirm-first').waitFor();
  const confirmation = await newestMail(server, context, account.email, 'Confirm');
  await page.goto(`${server.url}${linkPath(confirmation.text, '/verify-email')}`);
  await eventually(() => shown(page, 'verify-result').textContent()).toBe(`Thank you: ${account.email} is confirmed.`);
  return invitationPath;
}

/** Signs up through the form on the current sign-up screen. */
export async function fillSignUp(page: Page, who: { name: string; email: string; password: string }) {
  await page.getByRole('heading', { name: 'Create your account' }).waitFor();
  await shown(page, 'display-name').fill(who.name);
  const email = shown(page, 'email');
  if ((await email.inputValue()) !== who.email) await email.fill(who.email);
  await shown(page, 'password').fill(who.password);
  await shown(page, 'sign-up-submit').click();
}

/** Waits for document.title to equal `title` (titles are set after the screen renders). */
export async function expectTitle(page: Page, title: string | RegExp) {
  await expect
    .poll(() => page.title(), { timeout: 10_000 })
    .toMatch(typeof title === 'string' ? new RegExp(`^${escapeRegExp(title)}$`) : title);
}

export function escapeRegExp(text: string): string {
  return text.replace(/[.*+?^${}()|[\]\\]/g, '\\$&');
}

/** True when two on-screen boxes share any area. */
export function overlap(a: { x: number; y: number; width: number; height: number }, b: typeof a): boolean {
  return a.x < b.x + b.width && b.x < a.x + a.width && a.y < b.y + b.height && b.y < a.y + a.height;
}

/** The boxes of the SVG text elements under `root` whose text matches, in page pixels. */
export async function textBoxes(root: Locator, pattern?: RegExp) {
  const boxes = await root.locator('text').evaluateAll((nodes) =>
    nodes.map((node) => {
      const box = node.getBoundingClientRect();
      return {
        text: node.textContent ?? '',
        x: box.x,
        y: box.y,
        width: box.width,
        height: box.height,
        transform: node.getAttribute('transform') ?? '',
      };
    }),
  );
  return pattern ? boxes.filter((box) => pattern.test(box.text)) : boxes;
}

/** The local calendar date as the app's formatting module would print a day (checked loosely). */
export function todayYear(): string {
  return String(new Date().getFullYear());
}

/** Ends a journey: no console error, no uncaught error and no serious axe finding anywhere on the way. */
export function expectNoProblems(who: Person) {
  expect(who.problems, `console errors or page errors in the ${who.name} journey`).toEqual([]);
  expect(who.axeFindings, `axe findings in the ${who.name} journey`).toEqual([]);
}

/**
 * The element with this testID that is on screen. The app's stack keeps the screens a person came
 * from mounted but hidden, so a testID can match a hidden copy on an earlier screen too.
 */
export function shown(page: Page, testID: string): Locator {
  return page.getByTestId(testID).filter({ visible: true });
}

/** `expect.poll` with room for a loaded machine: Vitest's default gives up after one second. */
export function eventually<T>(read: () => T | Promise<T>, timeout = 15_000) {
  return expect.poll(read, { timeout });
}

/** Signs the person's context in as a demo account through the API (cookies are shared with its page). */
export async function signInAs(who: Person, server: { url: string }, email: string) {
  const answer = await who.context.request.post(`${server.url}/api/auth/sign-in`, {
    data: { email, password: demo.password },
    headers: { origin: server.url },
  });
  expect(answer.status()).toBe(200);
}

/**
 * Opens the version's review from the design bar (a side panel from 1024 px, a sheet below) and
 * waits for `ready` (a test id inside it) to show.
 */
export async function openReview(page: Page, ready = 'review-panel') {
  const toggle = page.getByRole('button', { name: 'Review', exact: true }).filter({ visible: true }).first();
  await toggle.waitFor();
  if ((await toggle.getAttribute('aria-expanded')) !== 'true') await toggle.click();
  await shown(page, ready).waitFor();
}
