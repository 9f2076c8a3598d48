import type { Design } from '../../shared/design';
import type { TraceOptions } from '../../shared/trace';
import type { TraceReport } from './types';

/** Being written by the lead: traces `design` (placeholder until the engine lands). */
export function traceDesign(design: Design, options: TraceOptions = {}): TraceReport {
  void design;
  void options;
  throw new Error('the ray trace is not written yet');
}
