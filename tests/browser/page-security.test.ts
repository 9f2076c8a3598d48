import type { Page } from 'playwright-core';
import { describe, expect, it } from 'vitest';
import { liveServerAndBrowser, viewports } from '../support/browser';

/**
 * The pages run under a Content-Security-Policy without 'unsafe-eval'. Nothing of ours may need
 * it: a refused `new Function` (even one that is caught) is reported as a violation and logged
 * as a console error on every page. The browser also must not complain about our headers.
 */
describe('pages under the Content-Security-Policy', () => {
  const live = liveServerAndBrowser();

  async function visit(path: string, ready: (page: Page) => Promise<unknown>) {
    const page = await live.browser.newPage({ viewport: viewports.phone });
    const console: string[] = [];
    page.on('console', (message) => {
      if (message.type() === 'error' || message.type() === 'warning') console.push(message.text());
    });
    page.on('pageerror', (error) => console.push(error.message));
    await page.addInitScript(() => {
      const seen: string[] = [];
      (window as unknown as { cspViolations: string[] }).cspViolations = seen;
      document.addEventListener('securitypolicyviolation', (event) => {
        seen.push(`${event.effectiveDirective} ${event.blockedURI} ${event.sourceFile}:${event.lineNumber}`);
      });
    });
    const response = await page.goto(`${live.server.url}${path}`);
    await ready(page);
    // Let lazy chunks (the unit parser) load and parse their first schemas.
    await page.waitForTimeout(500);
    const violations = await page.evaluate(() => (window as unknown as { cspViolations: string[] }).cspViolations);
    const headers = response?.headers() ?? {};
    await page.close();
    return { violations, console, headers };
  }

  it.each([
    { path: '/', ready: (page: Page) => page.getByRole('heading', { level: 1 }).waitFor() },
    { path: '/workbench', ready: (page: Page) => page.getByText('Bandpass', { exact: false }).first().waitFor() },
    { path: '/selectors', ready: (page: Page) => page.getByTestId('thin-film-airy').waitFor() },
    { path: '/sign-in', ready: (page: Page) => page.getByTestId('sign-in-submit').waitFor() },
    { path: '/notebooks', ready: (page: Page) => page.getByTestId('sign-in-submit').waitFor() },
  ])('$path loads with no CSP violation and no console error or warning', async ({ path, ready }) => {
    const { violations, console, headers } = await visit(path, ready);
    expect(violations).toEqual([]);
    expect(console).toEqual([]);
    expect(headers['content-security-policy']).not.toMatch(/unsafe-eval/);
    expect(headers['permissions-policy']).toContain('camera=()');
  });
});
