import { lazyWorker, type MetroRequire } from '@/features/workers/lazy-worker';
import { createMainThreadTraceRunner, type TraceRunner } from './trace-main-thread';
import type { TraceService } from './trace-service';

export type { TraceRunner } from './trace-main-thread';

/** The URL of trace.worker.ts's own bundle (the argument must stay a string literal for Metro). */
function workerUrl(): string {
  return (require as unknown as MetroRequire).unstable_resolveWorker('./trace.worker');
}

/**
 * The trace in a Web Worker (trace.worker.ts), called through comlink. The live trace asks for
 * one trace at a time (trace-queue.ts), so the worker never has a backlog. When the worker cannot
 * start or its script fails, traces run on the main thread from then on: slower frames, same answer.
 */
export function createTraceRunner(): TraceRunner {
  const worker = lazyWorker<TraceService>(workerUrl);
  const mainThread = createMainThreadTraceRunner();
  return {
    async trace(design, options) {
      const inWorker = worker.get();
      if (!inWorker) return mainThread.trace(design, options);
      const result = await Promise.race([
        inWorker.remote.trace(design, options).then((report) => ({ report })),
        inWorker.failed.then(() => 'failed' as const),
      ]);
      if (result !== 'failed') return result.report;
      worker.giveUp();
      return mainThread.trace(design, options);
    },
    dispose() {
      worker.dispose();
    },
  };
}
