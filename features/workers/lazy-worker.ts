import { wrap, type Remote } from 'comlink';

/** A started worker: its comlink proxy, and a promise that settles if its script fails. */
export type StartedWorker<Service> = { worker: Worker; remote: Remote<Service>; failed: Promise<void> };

/** Metro's `require`, which can name a module's worker bundle (typed here: Expo ships no declaration). */
export type MetroRequire = { unstable_resolveWorker(path: string): string };

export interface LazyWorker<Service> {
  /** The worker, started on first use; null once it could not start or was given up. */
  get(): StartedWorker<Service> | null;
  /** Stops it for good: the caller runs on the main thread from then on. */
  giveUp(): void;
  /** Stops it; a later `get` starts a new one. */
  dispose(): void;
}

/**
 * One Web Worker behind comlink, started when first needed, for the search and the ray trace.
 * `url` names the worker's own bundle; each runner writes it with Metro's
 * `require.unstable_resolveWorker('./x.worker')` itself, as a string literal Metro can see (not
 * `new Worker(new URL(…, import.meta.url))`: with the optimised graph of the web export Expo 56
 * drops that form's chunk). A worker that cannot start, or whose script fails, is given up.
 */
export function lazyWorker<Service>(url: () => string): LazyWorker<Service> {
  let started: StartedWorker<Service> | null = null;
  let broken = false;
  return {
    get() {
      if (started || broken) return started;
      try {
        const worker = new Worker(url());
        const failed = new Promise<void>((resolve) => worker.addEventListener('error', () => resolve(), { once: true }));
        started = { worker, remote: wrap<Service>(worker), failed };
      } catch {
        broken = true;
      }
      return started;
    },
    giveUp() {
      broken = true;
      started?.worker.terminate();
      started = null;
    },
    dispose() {
      started?.worker.terminate();
      started = null;
    },
  };
}
