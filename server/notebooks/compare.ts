import type { FigureChange, FigureKey, ParameterChange, VersionSummary } from '../../shared/notebooks';
import { figureKeys } from '../../shared/notebooks';

function isPlainObject(value: unknown): value is Record<string, unknown> {
  return typeof value === 'object' && value !== null && !Array.isArray(value);
}

/**
 * Every leaf that differs between two designs, as dotted paths in a stable order (the order of
 * keys in `before`, then keys only in `after`). A section present on one side only is reported
 * leaf by leaf, with null on the missing side, so the client highlights fields, not sections.
 */
export function changedParameters(before: unknown, after: unknown, prefix = ''): ParameterChange[] {
  if (isPlainObject(before) || isPlainObject(after)) {
    const a = isPlainObject(before) ? before : {};
    const b = isPlainObject(after) ? after : {};
    const keys = [...new Set([...Object.keys(a), ...Object.keys(b)])];
    return keys.flatMap((key) => changedParameters(a[key], b[key], prefix ? `${prefix}.${key}` : key));
  }
  if (Object.is(before, after)) return [];
  return [{ path: prefix, before: before ?? null, after: after ?? null }];
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
