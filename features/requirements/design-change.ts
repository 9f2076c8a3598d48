/**
 * A design with some fields set by their paths (`slits.exitWidthUm`): how a solved value, a
 * sensitivity step or a tolerance is applied. Returns a copy; the design given is left as it was.
 */

import type { Design } from '../../shared/design';

export interface DesignChange {
  /** Two-level path into the design: `section.field`. */
  path: string;
  value: number;
}

export function applyDesignChanges(design: Design, changes: readonly DesignChange[]): Design {
  const next = structuredClone(design);
  for (const { path, value } of changes) {
    const [section, field, ...rest] = path.split('.');
    const target = section === undefined ? undefined : (next as Record<string, unknown>)[section];
    if (field === undefined || rest.length > 0 || typeof target !== 'object' || target === null) {
      throw new Error(`${path}: not a field of the design (expected section.field)`);
    }
    (target as Record<string, unknown>)[field] = value;
  }
  return next;
}
