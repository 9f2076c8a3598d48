/**
 * How passing candidates are ranked. Each part is a number from 0 (worst) to 1 (best); the score
 * is their weighted mean, `Σ wᵢ pᵢ / Σ wᵢ` (0 when every weight is 0), so reweighting moves the
 * order without changing what passes.
 */

import type { SearchWeights } from '../../shared/search';

export type ScoreWeights = Readonly<Required<SearchWeights>>;

/** Every part counts the same unless the request says otherwise. */
export const DEFAULT_WEIGHTS: ScoreWeights = Object.freeze({ margin: 1, efficiency: 1, size: 1, overlap: 1 });

/** The weights a request asks for, each missing one at its default. */
export function resolveWeights(weights: SearchWeights | undefined): ScoreWeights {
  return { ...DEFAULT_WEIGHTS, ...Object.fromEntries(Object.entries(weights ?? {}).filter(([, w]) => w !== undefined)) };
}

/** The four parts, each 0…1. */
export interface ScoreParts {
  margin: number;
  efficiency: number;
  size: number;
  overlap: number;
}

/** What the parts are computed from, all figures of one candidate. */
export interface ScoreInput {
  /**
   * The smallest margin (a fraction of its limit) among the requirements the slit width was not
   * solved for, or null when there are none. The width uses up the bandpass and resolving-power
   * headroom on purpose (the widest slit that meets them passes the most light), so counting them
   * would make this part the same for every candidate.
   */
  minMarginUnsolved: number | null;
  /** The lowest scalar blaze efficiency over the checked wavelengths, 0…1. */
  minBlazeEfficiency: number;
  focalLengthMm: number;
  /** The longest focal length searched. */
  longestFocalMm: number;
  /** Checked wavelengths with another order landing on them, and how many were checked. */
  overlappedWavelengths: number;
  checkedWavelengths: number;
}

function clamp01(value: number): number {
  return Number.isFinite(value) ? Math.min(1, Math.max(0, value)) : 0;
}

/**
 * - margin: the smallest unsolved margin, 0 at the limit, 1 at 100 % headroom or more (1 when no
 *   such requirement is given: nothing is tight);
 * - efficiency: the lowest blaze efficiency over the checked wavelengths;
 * - size: `1 − f / f_longest`, so shorter instruments score higher (0 for the longest searched);
 * - overlap: the share of checked wavelengths with no other order landing on them.
 */
export function scoreParts(input: ScoreInput): ScoreParts {
  return {
    margin: input.minMarginUnsolved === null ? 1 : clamp01(input.minMarginUnsolved),
    efficiency: clamp01(input.minBlazeEfficiency),
    size: clamp01(1 - input.focalLengthMm / input.longestFocalMm),
    overlap: input.checkedWavelengths > 0 ? clamp01(1 - input.overlappedWavelengths / input.checkedWavelengths) : 1,
  };
}

/** `Σ wᵢ pᵢ / Σ wᵢ`, 0…1; 0 when every weight is 0. */
export function weightedScore(parts: ScoreParts, weights: ScoreWeights): number {
  const total = weights.margin + weights.efficiency + weights.size + weights.overlap;
  if (!(total > 0)) return 0;
  return (
    (weights.margin * parts.margin +
      weights.efficiency * parts.efficiency +
      weights.size * parts.size +
      weights.overlap * parts.overlap) /
    total
  );
}

/** The score in words, for the search screen and the API's description. */
export const SCORE_EXPLANATION =
  'Score: the weighted mean of four parts, each from 0 to 1 (weights 1 each unless you change them). ' +
  'Margin: headroom against the tightest requirement the slit width was not chosen for (0 at the limit, 1 at double it or more). ' +
  'Efficiency: the lowest blaze efficiency across the checked wavelengths. ' +
  'Size: shorter focal lengths score higher (1 − focal length ÷ the longest searched). ' +
  'Overlap: the share of checked wavelengths with no other order landing on them. ' +
  'Ties go to the lower groove density, then blaze, order, deviation and focal length.';
