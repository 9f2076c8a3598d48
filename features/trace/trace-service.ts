import { transfer } from 'comlink';
import type { Design } from '@/shared/design';
import type { TraceOptions } from '@/shared/trace';
import { traceDesign } from './trace-design';
import type { TraceReport } from './types';

/** Every buffer under the report's typed arrays, once each (a buffer listed twice cannot be transferred). */
function reportBuffers(report: TraceReport): ArrayBuffer[] {
  const buffers = new Set<ArrayBuffer>();
  const add = (array: Float64Array) => {
    if (array.buffer instanceof ArrayBuffer) buffers.add(array.buffer);
  };
  for (const w of report.wavelengths) {
    for (const spot of w.spots) {
      add(spot.x);
      add(spot.y);
    }
    add(w.lineShape.offsetNm);
    add(w.lineShape.traced);
    add(w.lineShape.closedForm);
    add(w.throughFocus.shiftMm);
    add(w.throughFocus.rmsWidthMm);
  }
  return [...buffers];
}

/** What the trace worker offers through comlink. */
export type TraceService = { trace(design: Design, options: TraceOptions): TraceReport };

/**
 * The worker's side: the report's ray positions are handed over (transferred), not copied, so a
 * 20 000-ray report reaches the page without a second copy of its arrays.
 */
export function createTraceService(): TraceService {
  return {
    trace(design, options) {
      const report = traceDesign(design, options);
      return transfer(report, reportBuffers(report));
    },
  };
}
