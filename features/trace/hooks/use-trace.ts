import { startTransition, useEffect, useRef, useState } from 'react';
import type { Design } from '@/shared/design';
import type { TraceOptions } from '@/shared/trace';
import { createTraceRunner, type TraceRunner } from '../trace-runner';
import { latestOnly, type LatestOnly } from '../trace-queue';
import type { TraceReport } from '../types';

export type TraceState = {
  /** The latest delivered trace; kept on screen while the next one runs, so nothing jumps. */
  report: TraceReport | null;
  /** A trace is running or waiting for the latest edit. */
  tracing: boolean;
  /** Why the latest trace failed, in words; null when it did not. */
  failure: string | null;
  /** From asking to having the report (worker round trip included), ms. */
  elapsedMs: number | null;
};

type Request = { design: Design; options: TraceOptions; askedAt: number };

/**
 * The design traced live, off the UI thread where the platform allows (trace-runner.*). Every
 * change asks again; only the latest is traced and shown (trace-queue.ts). `design` null, or
 * `enabled` false, traces nothing (a closed card costs nothing).
 */
export function useTrace(design: Design | null, options: TraceOptions, enabled = true): TraceState {
  const [state, setState] = useState<TraceState>({ report: null, tracing: false, failure: null, elapsedMs: null });
  const queue = useRef<LatestOnly<Request> | null>(null);
  const runner = useRef<TraceRunner | null>(null);

  useEffect(() => {
    const own = createTraceRunner();
    runner.current = own;
    queue.current = latestOnly<Request, TraceReport>((request) => own.trace(request.design, request.options), {
      onResult(report, request) {
        const elapsedMs = performance.now() - request.askedAt;
        // A low-priority render: a keystroke arriving meanwhile is drawn first.
        startTransition(() => setState((s) => ({ ...s, report, failure: null, elapsedMs })));
      },
      onError(error) {
        const message = error instanceof Error && error.message ? error.message : 'the trace stopped unexpectedly';
        setState((s) => ({ ...s, failure: message }));
      },
      onBusy(tracing) {
        setState((s) => (s.tracing === tracing ? s : { ...s, tracing }));
      },
    });
    return () => {
      queue.current?.dispose();
      queue.current = null;
      own.dispose();
      runner.current = null;
    };
  }, []);

  // Keyed by content: a re-render with an equal design and options does not trace again.
  const key = enabled && design ? JSON.stringify([design, options]) : null;
  useEffect(() => {
    if (key === null) return;
    const [d, o] = JSON.parse(key) as [Design, TraceOptions];
    queue.current?.submit({ design: d, options: o, askedAt: performance.now() });
  }, [key]);

  return state;
}
