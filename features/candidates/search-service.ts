import { planSearch } from '@/features/search';
import type { SearchRequest } from '@/shared/search';
import { stepToEnd, type OnProgress, type SearchOutcome, type SteppedRun } from './search-steps';

/** The search as a service with one run at a time: the worker exposes it, the main-thread runner calls it. */
export type SearchService = {
  run(request: SearchRequest, onProgress: OnProgress): Promise<SearchOutcome>;
  /** Stops the current run at its next batch. */
  cancel(): void;
};

export function createSearchService(plan: (request: SearchRequest) => SteppedRun = planSearch): SearchService {
  // Each run has its own token: a cancel stops the run it was meant for, never the next one.
  let current: { cancelled: boolean } | null = null;
  return {
    run(request, onProgress) {
      if (current) current.cancelled = true;
      const token = { cancelled: false };
      current = token;
      // A request the engine refuses rejects the outcome (with the engine's words), never throws here.
      return Promise.resolve()
        .then(() => stepToEnd(plan(request), onProgress, () => token.cancelled))
        .finally(() => {
          if (current === token) current = null;
        });
    },
    cancel() {
      if (current) current.cancelled = true;
    },
  };
}
