import type { Design } from '@/shared/design';
import { changedPaths, describedChanges, flattenDesign, unflattenDesign } from '@/shared/design-diff';

/**
 * Rebasing unsaved edits after someone else saved first. Three designs meet: the version the
 * edits started from (base), the edits (mine) and the newest version (latest). Pure, so the rules
 * are tested without a screen.
 */

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
  const result = { ...latestFlat };
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
  return { design: unflattenDesign(result), applied, overridden };
}

/** The rows of the "latest and yours" table: every path where the two differ, with its name. */
export function conflictRows(mine: Design, latest: Design): { path: string; label: string; latest: unknown; mine: unknown }[] {
  return describedChanges(latest, mine).map(({ path, label, before, after }) => ({ path, label, latest: before, mine: after }));
}
