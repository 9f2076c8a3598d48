import type { Design } from './design';
import { CURVE_POINTS_KEY, describeDesignPath } from './design-fields';

/**
 * The one design diff: what the compare answer lists, what the editor calls unsaved, and what a
 * rebase re-applies. Pure, and shared by the server and the client so they cannot disagree.
 */

/** One value that differs between two designs; a side without it holds null. */
export type DesignChange = { path: string; before: unknown; after: unknown };

type Flat = Record<string, unknown>;

function isPlainObject(value: unknown): value is Record<string, unknown> {
  return typeof value === 'object' && value !== null && !Array.isArray(value);
}

function isRecordList(value: unknown): value is Record<string, unknown>[] {
  return Array.isArray(value) && value.length > 0 && value.every(isPlainObject);
}

function sameList(a: readonly unknown[], b: readonly unknown[]): boolean {
  return a.length === b.length && a.every((item, i) => Object.is(item, b[i]));
}

/** A measured curve's points, as `curvePointsOf` reads them back. */
export type CurvePoints = { wavelengthsNm: readonly number[]; values: readonly number[] };

/** A place in the design's curve list (`curves.2`). */
const CURVE_ITEM = /^curves\.\d+$/;

/**
 * A curve with its `wavelengthsNm` and `values` taken as one value, `points`, in the place of the
 * first: the two lists only mean something together (a rebase must never pair my wavelengths with
 * their values), and a re-upload is one change, not two lists of thousands of numbers. The value
 * is the JSON text of `[wavelengthsNm, values]`: exact (JSON writes each number so it reads back
 * the same) and compared by its text, so equal points are equal wherever a diff, a rebase or the
 * compare table checks them with `===`.
 */
function withPoints(curve: Record<string, unknown>): Record<string, unknown> {
  if (!('wavelengthsNm' in curve) && !('values' in curve)) return curve;
  const out: Record<string, unknown> = {};
  for (const [key, value] of Object.entries(curve)) {
    if (key === 'wavelengthsNm' || (key === 'values' && !('wavelengthsNm' in curve))) {
      out[CURVE_POINTS_KEY] = JSON.stringify([curve.wavelengthsNm ?? null, curve.values ?? null]);
    } else if (key !== 'values') {
      out[key] = value;
    }
  }
  return out;
}

/** A curve's points from the diff's one value (or from `{ wavelengthsNm, values }`); null when it is neither. */
export function curvePointsOf(value: unknown): CurvePoints | null {
  let parsed: unknown = value;
  if (typeof value === 'string') {
    try {
      parsed = JSON.parse(value);
    } catch {
      return null;
    }
  }
  const [wavelengthsNm, values] = Array.isArray(parsed)
    ? parsed
    : isPlainObject(parsed)
      ? [parsed.wavelengthsNm, parsed.values]
      : [undefined, undefined];
  if (!Array.isArray(wavelengthsNm) || !Array.isArray(values)) return null;
  return { wavelengthsNm: wavelengthsNm as number[], values: values as number[] };
}

function walk(before: unknown, after: unknown, prefix: string): DesignChange[] {
  if (isPlainObject(before) || isPlainObject(after)) {
    const curve = CURVE_ITEM.test(prefix);
    let a = isPlainObject(before) ? before : {};
    let b = isPlainObject(after) ? after : {};
    if (curve) {
      a = withPoints(a);
      b = withPoints(b);
    }
    const keys = [...new Set([...Object.keys(a), ...Object.keys(b)])];
    return keys.flatMap((key) => walk(a[key], b[key], prefix ? `${prefix}.${key}` : key));
  }
  // A list of records (the order-sorting filters) is walked item by item, so a change is named
  // by its filter and field (`filters.1.cutOnNm`) and equal filters are not a change.
  if (isRecordList(before) || isRecordList(after)) {
    const a = Array.isArray(before) ? before : [];
    const b = Array.isArray(after) ? after : [];
    return Array.from({ length: Math.max(a.length, b.length) }, (_, i) => walk(a[i], b[i], `${prefix}.${i}`)).flat();
  }
  // A list of numbers (the requirements' wavelengths) is one value: equal when its items are.
  if (Array.isArray(before) && Array.isArray(after) && sameList(before, after)) return [];
  if (Object.is(before ?? null, after ?? null)) return [];
  return [{ path: prefix, before: before ?? null, after: after ?? null }];
}

/**
 * Every leaf that differs between two designs, as dotted paths in a stable order (the order of
 * keys in `before`, then keys only in `after`). A section present on one side only is reported
 * leaf by leaf, with null on the missing side, so readers highlight fields, not sections.
 * Values compare with `Object.is`; an absent value and an undefined one are the same.
 */
export function designChanges(before: unknown, after: unknown): DesignChange[] {
  return walk(before, after, '');
}

/** Dotted paths whose values differ between two designs, sorted. */
export function changedPaths(before: Design, after: Design): string[] {
  return designChanges(before, after)
    .map((change) => change.path)
    .sort();
}

/**
 * Every differing value with its name as the compare and conflict tables show it, sorted by path;
 * a curve is named with its kind ("Curve 2 (grating efficiency): name").
 */
export function describedChanges(before: Design, after: Design): (DesignChange & { label: string })[] {
  return designChanges(before, after)
    .sort((x, y) => (x.path < y.path ? -1 : x.path > y.path ? 1 : 0))
    .map((change) => ({ ...change, label: describeDesignPath(change.path, before, after) }));
}

/** `{ slits: { exitWidthUm: 50 } }` → `{ 'slits.exitWidthUm': 50 }`; absent optional values add nothing. */
export function flattenDesign(design: Design): Flat {
  const flat: Flat = {};
  const visit = (value: unknown, prefix: string) => {
    if (isPlainObject(value)) {
      const fields = CURVE_ITEM.test(prefix) ? withPoints(value) : value;
      for (const [key, inner] of Object.entries(fields)) visit(inner, prefix ? `${prefix}.${key}` : key);
    } else if (isRecordList(value)) {
      value.forEach((inner, i) => visit(inner, `${prefix}.${i}`));
    } else if (value !== undefined && value !== null) {
      flat[prefix] = value;
    }
  };
  visit(design, '');
  return flat;
}

/** The inverse of `flattenDesign`. */
export function unflattenDesign(flat: Flat): Design {
  const design: Record<string, unknown> = {};
  for (const [path, value] of Object.entries(flat)) {
    // Requirements nest one level deeper (`requirements.maxFootprintMm.widthMm`).
    const keys = path.split('.');
    const last = keys.pop() as string;
    let target = design;
    // A numeric key is a place in a list (`filters.1.cutOnNm`): its parent is an array.
    keys.forEach((key, i) => {
      target = (target[key] ??= /^\d+$/.test(keys[i + 1] ?? last) ? [] : {}) as Record<string, unknown>;
    });
    // A curve's points come back as its two lists.
    const points = last === CURVE_POINTS_KEY && CURVE_ITEM.test(keys.join('.')) ? curvePointsOf(value) : null;
    if (points) {
      target.wavelengthsNm = [...points.wavelengthsNm];
      target.values = [...points.values];
    } else {
      target[last] = value;
    }
  }
  return design as unknown as Design;
}
