/**
 * Performance marks for `npm run bench:ui`: an edit starts when a field changes and ends when the
 * workbench has committed the new sketch and plots. Cheap enough to leave on; no-ops where the
 * User Timing API is missing.
 */
const START = 'blazebook:edit-start';
export const EDIT_MEASURE = 'blazebook:edit';

export function markEditStart(): void {
  globalThis.performance?.mark?.(START);
}

export function measureEditEnd(): void {
  const perf = globalThis.performance;
  if (!perf?.getEntriesByName || perf.getEntriesByName(START, 'mark').length === 0) return;
  perf.measure(EDIT_MEASURE, START);
  perf.clearMarks(START);
}
