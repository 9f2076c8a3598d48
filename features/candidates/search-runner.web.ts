import { proxy, wrap, type Remote } from 'comlink';
import type { SearchRequest } from '@/shared/search';
import { createMainThreadRunner, type SearchHandle, type SearchRunner } from './main-thread-runner';
import type { SearchService } from './search-service';
import type { OnProgress, SearchOutcome } from './search-steps';

export type { SearchHandle, SearchRunner } from './main-thread-runner';

type Started = { worker: Worker; remote: Remote<SearchService>; failed: Promise<void> };

/** Metro's `require`, which can name a module's worker bundle (typed here: Expo ships no declaration). */
type MetroRequire = { unstable_resolveWorker(path: string): string };

/**
 * The URL of search.worker.ts's own bundle. Metro seals it as a chunk with everything it imports
 * and runs it on load. Not `new Worker(new URL('./search.worker', import.meta.url))`: with the
 * optimised graph the web export uses (EXPO_UNSTABLE_METRO_OPTIMIZE_GRAPH, scripts/web-build.ts)
 * Expo 56 rewrites that form's `new Worker` in its first pass and no longer sees it in the second,
 * so no chunk is written and the URL stays a bare './search.worker'. Metro rewrites this call in
 * both passes. The argument must stay a string literal for Metro to see it.
 */
function workerUrl(): string {
  return (require as unknown as MetroRequire).unstable_resolveWorker('./search.worker');
}

/**
 * The search in a Web Worker (search.worker.ts), called through comlink. When the worker cannot
 * start or its script fails, the search runs on the main thread in batches instead, which keeps
 * the page a little less smooth but gives the same answer.
 */
export function createSearchRunner(): SearchRunner {
  let started: Started | null = null;
  let broken = false;
  const mainThread = createMainThreadRunner();

  function startWorker(): Started | null {
    if (started || broken) return started;
    try {
      const worker = new Worker(workerUrl());
      const failed = new Promise<void>((resolve) => worker.addEventListener('error', () => resolve(), { once: true }));
      started = { worker, remote: wrap<SearchService>(worker), failed };
    } catch {
      broken = true;
    }
    return started;
  }

  function giveUpOnWorker() {
    broken = true;
    started?.worker.terminate();
    started = null;
  }

  return {
    start(request: SearchRequest, onProgress: OnProgress): SearchHandle {
      const inWorker = startWorker();
      if (!inWorker) return mainThread.start(request, onProgress);
      let fallback: SearchHandle | null = null;
      let cancelled = false;
      const fallBack = (): Promise<SearchOutcome> => {
        giveUpOnWorker();
        if (cancelled) return Promise.resolve({ kind: 'cancelled', done: 0, total: 0 });
        fallback = mainThread.start(request, onProgress);
        return fallback.outcome;
      };
      const outcome = Promise.race([
        inWorker.remote.run(request, proxy(onProgress)),
        inWorker.failed.then((): 'failed' => 'failed'),
      ]).then((result) => (result === 'failed' ? fallBack() : result), fallBack);
      return {
        outcome,
        cancel() {
          cancelled = true;
          if (fallback) fallback.cancel();
          else void inWorker.remote.cancel().catch(() => undefined);
        },
      };
    },
    dispose() {
      mainThread.dispose();
      started?.worker.terminate();
      started = null;
    },
  };
}
