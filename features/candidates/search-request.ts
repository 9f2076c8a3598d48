import { DEFAULT_WEIGHTS } from '@/features/search';
import type { Design } from '@/shared/design';
import { REQUIREMENT_IDS, type Requirements } from '@/shared/requirements';
import { SEARCH_LIMITS, type SearchRequest } from '@/shared/search';

/** The limits the panel lets a user change; everything else keeps the search's stock lists. */
export type SearchControls = {
  /** Orders tried: ±1…±maxOrder. */
  maxOrder: 1 | 2 | 3;
  /** Candidates shown, 1…SEARCH_LIMITS.maxTop. */
  top: number;
  /** How much each part of the score counts, 0…100 each (relative to each other). */
  weights: { margin: number; efficiency: number; size: number; overlap: number };
};

/**
 * The engine's own defaults (all orders up to ±3, equal weights, the top 20), so the panel's first
 * answer is the one `npm run search` and `POST /api/search` give for the same design.
 */
export const DEFAULT_CONTROLS: SearchControls = {
  maxOrder: 3,
  top: SEARCH_LIMITS.maxTop,
  weights: { ...DEFAULT_WEIGHTS },
};

/** True when the requirements hold at least one limit to search for (a wavelength list or drive step alone limits nothing). */
export function hasRequirements(requirements: Requirements | undefined): requirements is Requirements {
  if (!requirements) return false;
  return REQUIREMENT_IDS.some((id) => requirements[id] !== undefined);
}

/**
 * The search's input from the design in the editor: its range, source, detector and
 * requirements, with the panel's limits. Null when the design has no requirements to search for.
 */
export function searchRequestFromDesign(design: Design, controls: SearchControls): SearchRequest | null {
  if (!hasRequirements(design.requirements)) return null;
  return {
    range: design.range,
    ...(design.source ? { source: design.source } : {}),
    ...(design.detector ? { detector: design.detector } : {}),
    requirements: design.requirements,
    search: {
      maxOrder: controls.maxOrder,
      top: Math.min(SEARCH_LIMITS.maxTop, Math.max(1, Math.round(controls.top))),
      weights: { ...controls.weights },
    },
  };
}
