import type { Design } from '@/shared/design';

/**
 * Rebasing unsaved edits after someone else saved first. Three designs meet: the version the
 * edits started from (base), the edits (mine) and the newest version (latest). Pure, so the rules
 * are tested without a screen.
 */

type Flat = Record<string, unknown>;

/** `{ slits: { exitWidthUm: 50 } }` → `{ 'slits.exitWidthUm': 50 }`; absent optional sections add nothing. */
export function flattenDesign(design: Design): Flat {
  const flat: Flat = {};
  for (const [section, fields] of Object.entries(design as Record<string, unknown>)) {
    if (fields === null || fields === undefined) continue;
    for (const [field, value] of Object.entries(fields as Record<string, unknown>)) {
      if (value !== undefined) flat[`${section}.${field}`] = value;
    }
  }
  return flat;
}

function unflatten(flat: Flat): Design {
  const design: Record<string, Record<string, unknown>> = {};
  for (const [path, value] of Object.entries(flat)) {
    const [section, field] = path.split('.') as [string, string];
    (design[section] ??= {})[field] = value;
  }
  return design as unknown as Design;
}

/** Dotted paths whose values differ between two designs, in a stable order. */
export function changedPaths(before: Design, after: Design): string[] {
  const a = flattenDesign(before);
  const b = flattenDesign(after);
  const paths = new Set([...Object.keys(a), ...Object.keys(b)]);
  return [...paths].filter((path) => a[path] !== b[path]).sort();
}

export type RebaseResult = {
  /** Latest with my changes applied on top. */
  design: Design;
  /** Paths I changed that are now as I wanted them. */
  applied: string[];
  /** Paths both sides changed to different values; mine wins, and the user is told. */
  overridden: { path: string; latest: unknown; mine: unknown }[];
};

/**
 * Start from latest and re-apply my edits: every field I changed since base takes my value;
 * every other field keeps latest's. A field both changed is reported, not silently merged.
 */
export function reapplyEdits(base: Design, mine: Design, latest: Design): RebaseResult {
  const baseFlat = flattenDesign(base);
  const mineFlat = flattenDesign(mine);
  const latestFlat = flattenDesign(latest);
  const result: Flat = { ...latestFlat };
  const applied: string[] = [];
  const overridden: RebaseResult['overridden'] = [];
  for (const path of changedPaths(base, mine)) {
    const wanted = mineFlat[path];
    const theirs = latestFlat[path];
    if (baseFlat[path] !== theirs && theirs !== wanted) overridden.push({ path, latest: theirs ?? null, mine: wanted ?? null });
    if (wanted === undefined) delete result[path];
    else result[path] = wanted;
    applied.push(path);
  }
  return { design: unflatten(result), applied, overridden };
}

/** The rows of the "latest and yours" table: every path where the two differ. */
export function conflictRows(mine: Design, latest: Design): { path: string; latest: unknown; mine: unknown }[] {
  const mineFlat = flattenDesign(mine);
  const latestFlat = flattenDesign(latest);
  return changedPaths(latest, mine).map((path) => ({ path, latest: latestFlat[path] ?? null, mine: mineFlat[path] ?? null }));
}
