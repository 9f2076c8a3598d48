import { useCallback, useEffect, useRef, useState } from 'react';
import type { SearchAnswer, SearchRequest } from '@/shared/search';
import { createSearchRunner, type SearchHandle, type SearchRunner } from '../search-runner';

export type CandidateSearchState =
  | { status: 'idle' }
  | { status: 'running'; done: number; total: number | null }
  | { status: 'cancelled'; done: number; total: number }
  | { status: 'done'; answer: SearchAnswer; request: SearchRequest }
  | { status: 'failed'; message: string };

/**
 * The last finished search. The workbench lays a phone, a tablet and a wide screen out as different
 * trees, so turning a tablet remounts the panel; its answer comes back when the request is the same.
 */
let kept: { key: string; answer: SearchAnswer; request: SearchRequest } | null = null;

/**
 * One search at a time, off the UI thread where the platform allows (search-runner.*). Starting
 * again replaces the running search; progress from a replaced or cancelled run is ignored.
 */
export function useCandidateSearch(request: SearchRequest | null) {
  const [state, setState] = useState<CandidateSearchState>(() =>
    kept && request && kept.key === JSON.stringify(request) ? { status: 'done', answer: kept.answer, request: kept.request } : { status: 'idle' },
  );
  const runner = useRef<SearchRunner | null>(null);
  const current = useRef<{ handle: SearchHandle | null } | null>(null);

  useEffect(
    () => () => {
      current.current = null;
      runner.current?.dispose();
      runner.current = null;
    },
    [],
  );

  const start = useCallback((request: SearchRequest) => {
    current.current?.handle?.cancel();
    runner.current ??= createSearchRunner();
    setState({ status: 'running', done: 0, total: null });
    const run: { handle: SearchHandle | null } = { handle: null };
    const handle = runner.current.start(request, (done, total) => {
      if (current.current !== run) return;
      setState({ status: 'running', done, total });
    });
    run.handle = handle;
    current.current = run;
    handle.outcome.then(
      (outcome) => {
        if (current.current !== run) return;
        current.current = null;
        if (outcome.kind === 'done') kept = { key: JSON.stringify(request), answer: outcome.answer, request };
        setState(
          outcome.kind === 'done'
            ? { status: 'done', answer: outcome.answer, request }
            : { status: 'cancelled', done: outcome.done, total: outcome.total },
        );
      },
      (error: unknown) => {
        if (current.current !== run) return;
        current.current = null;
        setState({
          status: 'failed',
          message: error instanceof Error && error.message ? error.message : 'The search stopped unexpectedly.',
        });
      },
    );
  }, []);

  const cancel = useCallback(() => {
    current.current?.handle?.cancel();
  }, []);

  return { state, start, cancel };
}
