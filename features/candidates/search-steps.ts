import type { SearchAnswer } from '@/shared/search';

/** What the search engine hands out (features/search `planSearch`): stepped so it can yield and stop. */
export type SteppedRun = { readonly total: number; step(count: number): number; finish(): SearchAnswer };

/** Done so far of the total; called after every batch. */
export type OnProgress = (done: number, total: number) => void;

export type SearchOutcome = { kind: 'done'; answer: SearchAnswer } | { kind: 'cancelled'; done: number; total: number };

/**
 * Candidates evaluated between yields: about 10 ms of work at the engine's rate (≤ 250 ms for
 * 10 000, issue 15's target), so a cancel or a keystroke waits no longer than a frame or so.
 */
export const BATCH_SIZE = 250;

const yieldToEvents = () => new Promise<void>((resolve) => setTimeout(resolve, 0));

/**
 * Steps a run to its end in batches, reporting progress after each and yielding to the event loop
 * between them, so messages (a cancel) and input are handled meanwhile. `cancelled` is read
 * after every batch; the run stops there and says how far it got.
 */
export async function stepToEnd(run: SteppedRun, onProgress: OnProgress, cancelled: () => boolean): Promise<SearchOutcome> {
  let done = 0;
  onProgress(0, run.total);
  while (done < run.total) {
    if (cancelled()) return { kind: 'cancelled', done, total: run.total };
    const next = run.step(BATCH_SIZE);
    // A run that stops advancing would spin forever: finish with what it has.
    if (next <= done) break;
    done = next;
    onProgress(done, run.total);
    await yieldToEvents();
  }
  if (cancelled()) return { kind: 'cancelled', done, total: run.total };
  return { kind: 'done', answer: run.finish() };
}
