import { describe, expect, it } from 'vitest';
import { createSearchService } from '../../../features/candidates/search-service';
import { BATCH_SIZE, stepToEnd, type SteppedRun } from '../../../features/candidates/search-steps';
import { createMainThreadRunner } from '../../../features/candidates/main-thread-runner';
import { runSearch } from '../../../features/search';
import { exampleDesign } from '../../../shared/design';
import type { SearchAnswer, SearchRequest } from '../../../shared/search';

const answer: SearchAnswer = { candidates: [], considered: 0, excludedBy: {}, nearest: [], weights: { margin: 1, efficiency: 1, size: 1, overlap: 1 } };

/** A run of `total` candidates that records each step it is asked for. */
function fakeRun(total: number) {
  let done = 0;
  const steps: number[] = [];
  const run: SteppedRun = {
    total,
    step(count) {
      steps.push(count);
      done = Math.min(total, done + count);
      return done;
    },
    finish: () => ({ ...answer, considered: done }),
  };
  return { run, steps };
}

describe('stepping a search in batches', () => {
  it('reports progress after every batch and finishes with the answer', async () => {
    const { run, steps } = fakeRun(600);
    const progress: number[] = [];
    const outcome = await stepToEnd(run, (done) => progress.push(done), () => false);
    // 600 = 250 + 250 + 100.
    expect(steps).toEqual([BATCH_SIZE, BATCH_SIZE, BATCH_SIZE]);
    expect(progress).toEqual([0, 250, 500, 600]);
    expect(outcome).toEqual({ kind: 'done', answer: { ...answer, considered: 600 } });
  });

  it('stops at the next batch once cancelled and says how far it got', async () => {
    const { run } = fakeRun(10_000);
    const service = createSearchService(() => run);
    const outcome = service.run({} as never, (done) => {
      if (done >= 750) service.cancel();
    });
    await expect(outcome).resolves.toEqual({ kind: 'cancelled', done: 750, total: 10_000 });
  });

  it('lets a new run replace the running one without the old cancel reaching it', async () => {
    const first = fakeRun(5000);
    const second = fakeRun(500);
    const runs = [first.run, second.run];
    const service = createSearchService(() => runs.shift()!);
    const old = service.run({} as never, () => undefined);
    const next = service.run({} as never, () => undefined);
    await expect(old).resolves.toMatchObject({ kind: 'cancelled' });
    await expect(next).resolves.toMatchObject({ kind: 'done', answer: { considered: 500 } });
  });

  it('does not spin on a run that stops advancing', async () => {
    const run: SteppedRun = { total: 100, step: () => 0, finish: () => answer };
    await expect(stepToEnd(run, () => undefined, () => false)).resolves.toEqual({ kind: 'done', answer });
  });
});

describe('the main-thread runner on the real engine', () => {
  it('gives the same answer in batches as the search in one go (deterministic for one input)', async () => {
    const request: SearchRequest = {
      range: exampleDesign.range,
      source: exampleDesign.source,
      detector: exampleDesign.detector,
      requirements: { maxBandpassNm: 0.5, minBlazeEfficiency: 0.3 },
      search: { maxOrder: 1, top: 5 },
    };
    const runner = createMainThreadRunner();
    const progress: number[] = [];
    const outcome = await runner.start(request, (done) => progress.push(done)).outcome;
    expect(outcome).toEqual({ kind: 'done', answer: runSearch(request) });
    // Several batches, each reported, the last at the total.
    expect(progress.length).toBeGreaterThan(2);
    expect(progress.at(-1)).toBe(outcome.kind === 'done' ? outcome.answer.considered : -1);
  });

  it("rejects a request the engine refuses with the engine's words, not a throw at the caller", async () => {
    const runner = createMainThreadRunner();
    const bad = { range: exampleDesign.range, requirements: { maxBandpassNm: 0.5 }, search: { grooveDensitiesPerMm: [] } } as unknown as SearchRequest;
    const handle = runner.start(bad, () => undefined);
    await expect(handle.outcome).rejects.toThrow(/search/i);
  });
});
