import type { SearchRequest } from '@/shared/search';
import { createSearchService } from './search-service';
import type { OnProgress, SearchOutcome } from './search-steps';

/** A started search: its outcome, and a way to stop it. */
export type SearchHandle = { outcome: Promise<SearchOutcome>; cancel(): void };

/** Starts searches and lets go of what they hold (a worker) once the screen is gone. */
export type SearchRunner = { start(request: SearchRequest, onProgress: OnProgress): SearchHandle; dispose(): void };

/**
 * On the main thread, in batches with a yield between them: the editor stays live, since a
 * keystroke waits for one batch at most. Native has no Web Worker; the web falls back to it.
 */
export function createMainThreadRunner(): SearchRunner {
  const service = createSearchService();
  return {
    start(request: SearchRequest, onProgress: OnProgress) {
      return { outcome: service.run(request, onProgress), cancel: () => service.cancel() };
    },
    dispose: () => service.cancel(),
  };
}
