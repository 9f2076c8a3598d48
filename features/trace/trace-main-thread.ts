import type { Design } from '@/shared/design';
import type { TraceOptions } from '@/shared/trace';
import { traceDesign } from './trace-design';
import type { TraceReport } from './types';

/** Traces designs somewhere (a Web Worker, or the main thread) and lets go of it once the screen is gone. */
export type TraceRunner = { trace(design: Design, options: TraceOptions): Promise<TraceReport>; dispose(): void };

/**
 * On the main thread, after the current frame's work (a macrotask later), so the keystroke that
 * asked for it is drawn first. Native has no Web Worker; the web uses this only when its worker fails.
 */
export function createMainThreadTraceRunner(): TraceRunner {
  return {
    trace: (design, options) =>
      new Promise<TraceReport>((resolve, reject) => {
        setTimeout(() => {
          try {
            resolve(traceDesign(design, options));
          } catch (error) {
            reject(error);
          }
        }, 0);
      }),
    dispose: () => undefined,
  };
}
