/**
 * Latest-wins scheduling for the live trace: at most one trace runs and at most one waits. A new
 * request replaces the waiting one (never traced), and a result whose request has since been
 * replaced is dropped, so typing fast costs one trace in flight and one at the end, not one per
 * keystroke. Pure: the runner (a Web Worker, or the main thread) is handed in.
 */
export interface LatestOnly<Request> {
  /** Asks for `request` to be run; returns its generation (later requests have higher ones). */
  submit(request: Request): number;
  /** Stops delivering: results still on their way are dropped. */
  dispose(): void;
}

export interface LatestOnlyHandlers<Request, Result> {
  onResult(result: Result, request: Request, generation: number): void;
  onError(error: unknown, request: Request, generation: number): void;
  /** True while a request runs or waits, false once the latest one has been delivered. */
  onBusy?(busy: boolean): void;
}

export function latestOnly<Request, Result>(
  run: (request: Request) => Promise<Result>,
  handlers: LatestOnlyHandlers<Request, Result>,
): LatestOnly<Request> {
  let generation = 0;
  let running = false;
  let waiting: { request: Request; generation: number } | null = null;
  let disposed = false;

  function start(request: Request, ownGeneration: number) {
    running = true;
    let outcome: Promise<Result>;
    try {
      outcome = run(request);
    } catch (error) {
      outcome = Promise.reject(error);
    }
    outcome
      .then(
        (result) => {
          if (!disposed && ownGeneration === generation) handlers.onResult(result, request, ownGeneration);
        },
        (error: unknown) => {
          if (!disposed && ownGeneration === generation) handlers.onError(error, request, ownGeneration);
        },
      )
      .finally(() => {
        running = false;
        if (disposed) return;
        const next = waiting;
        waiting = null;
        if (next) start(next.request, next.generation);
        else handlers.onBusy?.(false);
      });
  }

  return {
    submit(request) {
      generation += 1;
      if (disposed) return generation;
      if (running) waiting = { request, generation };
      else {
        handlers.onBusy?.(true);
        start(request, generation);
      }
      return generation;
    },
    dispose() {
      disposed = true;
      waiting = null;
    },
  };
}
