import { proxy } from 'comlink';
import { lazyWorker, type MetroRequire } from '@/features/workers/lazy-worker';
import type { SearchRequest } from '@/shared/search';
import { createMainThreadRunner, type SearchHandle, type SearchRunner } from './main-thread-runner';
import type { SearchService } from './search-service';
import type { OnProgress, SearchOutcome } from './search-steps';

export type { SearchHandle, SearchRunner } from './main-thread-runner';

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
  const worker = lazyWorker<SearchService>(workerUrl);
  const mainThread = createMainThreadRunner();

  return {
    start(request: SearchRequest, onProgress: OnProgress): SearchHandle {
      const inWorker = worker.get();
      if (!inWorker) return mainThread.start(request, onProgress);
      let fallback: SearchHandle | null = null;
      let cancelled = false;
      const fallBack = (): Promise<SearchOutcome> => {
        worker.giveUp();
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
      worker.dispose();
    },
  };
}
