import { wrap, type Remote } from 'comlink';
import { createMainThreadTraceRunner, type TraceRunner } from './trace-main-thread';
import type { TraceService } from './trace-service';

export type { TraceRunner } from './trace-main-thread';

type Started = { worker: Worker; remote: Remote<TraceService>; failed: Promise<void> };

/** Metro's `require`, which can name a module's worker bundle (typed here: Expo ships no declaration). */
type MetroRequire = { unstable_resolveWorker(path: string): string };

/**
 * The URL of trace.worker.ts's own bundle. Not `new Worker(new URL(…, import.meta.url))`: with
 * the optimised graph of the web export Expo 56 drops that form's chunk (see search-runner.web.ts
 * in features/candidates). The argument must stay a string literal for Metro to see it.
 */
function workerUrl(): string {
  return (require as unknown as MetroRequire).unstable_resolveWorker('./trace.worker');
}

/**
 * The trace in a Web Worker (trace.worker.ts), called through comlink. The live trace asks for
 * one trace at a time (trace-queue.ts), so the worker never has a backlog. When the worker cannot
 * start or its script fails, traces run on the main thread from then on: slower frames, same answer.
 */
export function createTraceRunner(): TraceRunner {
  let started: Started | null = null;
  let broken = false;
  const mainThread = createMainThreadTraceRunner();

  function startWorker(): Started | null {
    if (started || broken) return started;
    try {
      const worker = new Worker(workerUrl());
      const failed = new Promise<void>((resolve) => worker.addEventListener('error', () => resolve(), { once: true }));
      started = { worker, remote: wrap<TraceService>(worker), failed };
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
    async trace(design, options) {
      const inWorker = startWorker();
      if (!inWorker) return mainThread.trace(design, options);
      const result = await Promise.race([
        inWorker.remote.trace(design, options).then((report) => ({ report })),
        inWorker.failed.then(() => 'failed' as const),
      ]);
      if (result !== 'failed') return result.report;
      giveUpOnWorker();
      return mainThread.trace(design, options);
    },
    dispose() {
      started?.worker.terminate();
      started = null;
    },
  };
}
