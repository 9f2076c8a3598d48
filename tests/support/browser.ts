import { mkdirSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import type { Browser, BrowserContext, BrowserContextOptions, Page } from 'playwright-core';
import { afterAll, beforeAll, inject } from 'vitest';
import { launchBrowser, startServer as startLiveServer, type RunningServer } from './live-server';
import { webBuildReady } from './web-build';

const rootDir = fileURLToPath(new URL('../..', import.meta.url));
export const artifactsDir = path.join(rootDir, 'tests', 'artifacts');

export { chromiumPath, launchBrowser, viewports, type RunningServer, type ViewportName } from './live-server';

/**
 * Starts the real server on a copy of the migrated template (db-template.ts provides it to every
 * test project); see live-server.ts.
 */
export async function startServer(env: Record<string, string> = {}): Promise<RunningServer> {
  // The export runs beside the unit and API files (web-build.ts); the server serves what it wrote.
  await webBuildReady(inject('webBuildOutcome'));
  return startLiveServer(inject('dataDirTemplate'), env);
}

/** Page errors and console errors as they happen: a test ends by expecting the list empty. */
export function watchConsole(page: Page): string[] {
  const errors: string[] = [];
  page.on('pageerror', (error) => errors.push(error.message));
  page.on('console', (message) => {
    if (message.type() === 'error') errors.push(message.text());
  });
  return errors;
}

/** Saves a full-page screenshot to tests/artifacts/<name>.png and returns its path. */
export async function screenshot(page: Page, name: string): Promise<string> {
  mkdirSync(artifactsDir, { recursive: true });
  const file = path.join(artifactsDir, `${name}.png`);
  await page.screenshot({ path: file, fullPage: true });
  return file;
}

/** Context methods that leave nothing behind once its pages are closed and its cookies and storage cleared. */
const harmless = new Set<PropertyKey>([
  'newPage',
  'pages',
  'request',
  'cookies',
  'addCookies',
  'clearCookies',
  'storageState',
  'browser',
  'newCDPSession',
  'waitForEvent',
  'close',
  'then',
]);

/**
 * The browser, handing out contexts that are kept for the next caller instead of closed. A new
 * context starts with an empty HTTP cache, so each test's first page fetched the 2 MB bundle and
 * the fonts again (gzipped by the server each time) and compiled the bundle cold. A kept context
 * is returned to the pool by `close()`: its pages are closed, its cookies cleared and the origin's
 * local storage, IndexedDB, cache storage and service workers removed, so the next caller gets a
 * context with no state but the HTTP cache (the bundles are content-hashed and immutable).
 * `newContext({ viewport })` and `newPage({ viewport })` take their viewport per page. A context
 * asked for with other options, or changed in a way that would outlive its pages (routes, init
 * scripts, permissions, listeners…), is a real one and is closed for real.
 */
export function reusingContexts(browser: Browser, origin: () => string): Browser {
  const idle: BrowserContext[] = [];
  // A null viewport (no emulation) cannot be set per page, so it gets a context of its own.
  const reusable = (options: BrowserContextOptions | undefined) =>
    Object.keys(options ?? {}).every((key) => key === 'viewport') && options?.viewport !== null;

  async function created(): Promise<BrowserContext> {
    const context = await browser.newContext();
    // Closed for real through a page's context(): it can no longer be lent.
    context.once('close', () => {
      const at = idle.indexOf(context);
      if (at >= 0) idle.splice(at, 1);
    });
    return context;
  }

  async function release(context: BrowserContext, tainted: boolean): Promise<void> {
    if (tainted) return context.close();
    try {
      await Promise.all(context.pages().map((page) => page.close()));
      await context.clearCookies();
      const page = await context.newPage();
      const cdp = await context.newCDPSession(page);
      await cdp.send('Storage.clearDataForOrigin', {
        origin: origin(),
        storageTypes: 'local_storage,indexeddb,websql,cache_storage,service_workers,file_systems,shared_storage,storage_buckets',
      });
      await page.close();
      idle.push(context);
    } catch {
      // Not cleared (the browser is closing, say): never lent again.
      await context.close().catch(() => undefined);
    }
  }

  async function lend(options: BrowserContextOptions | undefined): Promise<BrowserContext> {
    if (!reusable(options)) return browser.newContext(options);
    const context = idle.pop() ?? (await created());
    // Playwright's own default when none is asked for.
    const viewport = options?.viewport ?? { width: 1280, height: 720 };
    let tainted = false;
    let returned: Promise<void> | null = null;
    return new Proxy(context, {
      get(target, key) {
        if (key === 'newPage') {
          return async () => {
            const page = await target.newPage();
            await page.setViewportSize(viewport);
            return page;
          };
        }
        if (key === 'close') return () => (returned ??= release(target, tainted));
        if (!harmless.has(key)) tainted = true;
        const value: unknown = Reflect.get(target, key);
        return typeof value === 'function' ? value.bind(target) : value;
      },
    });
  }

  return new Proxy(browser, {
    get(target, key) {
      if (key === 'newContext') return lend;
      if (key === 'newPage') {
        return async (options?: BrowserContextOptions) => {
          if (!reusable(options)) return target.newPage(options);
          const context = await lend(options);
          const page = await context.newPage();
          page.once('close', () => void context.close());
          return page;
        };
      }
      const value: unknown = Reflect.get(target, key);
      return typeof value === 'function' ? value.bind(target) : value;
    },
  });
}

/**
 * The real server and Chromium for the enclosing `describe`: started before its first test and
 * stopped after its last. Read them as `live.server` and `live.browser` inside the tests; contexts
 * and pages from `live.browser` are reused between tests with their state cleared
 * (`reusingContexts`), so closing them as usual keeps the HTTP cache for the next test.
 */
export function liveServerAndBrowser(env: Record<string, string> = {}): { readonly server: RunningServer; readonly browser: Browser } {
  const live = {} as { server: RunningServer; browser: Browser };
  beforeAll(async () => {
    live.server = await startServer(env);
    live.browser = reusingContexts(await launchBrowser(), () => new URL(live.server.url).origin);
    // The first file may wait for the web export (up to its own 10-minute limit) before its server.
  }, 11 * 60_000);
  afterAll(async () => {
    await live.browser?.close();
    await live.server?.stop();
  });
  return live;
}
