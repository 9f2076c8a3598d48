import type { FigureChange, FigureKey, ParameterChange, VersionSummary } from '../../shared/notebooks';
import { figureKeys } from '../../shared/notebooks';
import { designChanges } from '../../shared/design-diff';

/** The compare answer's parameter changes: the one design diff, shared with the client. */
export function changedParameters(before: unknown, after: unknown): ParameterChange[] {
  return designChanges(before, after);
}

/** `(after − before) / |before|`; null when either side is missing or before is 0. */
export function relativeChange(before: number | null, after: number | null): number | null {
  if (before === null || after === null || before === 0) return null;
  return (after - before) / Math.abs(before);
}

export function figureChanges(before: VersionSummary, after: VersionSummary): FigureChange[] {
  return figureKeys.map((key: FigureKey) => ({
    key,
    before: before[key],
    after: after[key],
    relativeChange: relativeChange(before[key], after[key]),
  }));
}
