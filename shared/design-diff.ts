import type { Design } from './design';
import { describeDesignPath } from './design-fields';

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

function walk(before: unknown, after: unknown, prefix: string): DesignChange[] {
  if (isPlainObject(before) || isPlainObject(after)) {
    const a = isPlainObject(before) ? before : {};
    const b = isPlainObject(after) ? after : {};
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

/** Every differing value with its name as the compare and conflict tables show it, sorted by path. */
export function describedChanges(before: Design, after: Design): (DesignChange & { label: string })[] {
  return designChanges(before, after)
    .sort((x, y) => (x.path < y.path ? -1 : x.path > y.path ? 1 : 0))
    .map((change) => ({ ...change, label: describeDesignPath(change.path) }));
}

/** `{ slits: { exitWidthUm: 50 } }` → `{ 'slits.exitWidthUm': 50 }`; absent optional values add nothing. */
export function flattenDesign(design: Design): Flat {
  const flat: Flat = {};
  const visit = (value: unknown, prefix: string) => {
    if (isPlainObject(value)) {
      for (const [key, inner] of Object.entries(value)) visit(inner, prefix ? `${prefix}.${key}` : key);
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
    target[last] = value;
  }
  return design as unknown as Design;
}
