import { z } from 'zod';
import { detectorSchema, rangeSchema, sourceSchema, storedDesignSchema } from './design';
import { requirementsSchema } from './requirements';
import { number } from './schema-words';

/**
 * The candidate search's input and answer: `POST /api/search`, `npm run search -- input.json` and
 * the workbench's search panel (run in a Web Worker) all take and give these shapes.
 */

/** Bounds on one search: the HTTP route runs on the server's only thread. */
export const SEARCH_LIMITS = {
  /** Most candidates one search may evaluate (the product of the lists' lengths). */
  maxCandidates: 50_000,
  /** Most candidates returned. */
  maxTop: 20,
  /** Longest list for any one searched parameter. */
  maxListLength: 40,
} as const;

const num = number;

function list(item: z.ZodNumber, words: string) {
  return z
    .array(item, { error: `must be a list of ${words}` })
    .min(1, { error: `must list at least one of the ${words}` })
    .max(SEARCH_LIMITS.maxListLength, { error: `must list at most ${SEARCH_LIMITS.maxListLength} ${words}` });
}

const weight = () =>
  num()
    .min(0, { error: 'must be at least 0' })
    .max(100, { error: 'must be at most 100' });

/** How candidates are ranked: each part is 0…1, the score their weighted mean (see features/search/score.ts). */
export const searchWeightsSchema = z.strictObject({
  /** The smallest requirement margin: headroom against the tightest requirement. */
  margin: weight().optional(),
  /** The lowest blaze efficiency across the checked wavelengths. */
  efficiency: weight().optional(),
  /** A short instrument: the longer focal length, relative to the longest searched. */
  size: weight().optional(),
  /** Few wavelengths with another order landing on them. */
  overlap: weight().optional(),
});
export type SearchWeights = z.infer<typeof searchWeightsSchema>;

/** What is searched over; each list has a stock default (features/search/space.ts). */
export const searchLimitsSchema = z.strictObject({
  grooveDensitiesPerMm: list(num().gt(0, { error: 'must be greater than 0' }).max(100_000), 'groove densities').optional(),
  blazeWavelengthsNm: list(num().gt(0, { error: 'must be greater than 0' }).max(10_000_000), 'blaze wavelengths').optional(),
  /** Orders tried: ±1…±maxOrder. */
  maxOrder: num().int({ error: 'must be a whole number' }).min(1, { error: 'must be at least 1' }).max(3, { error: 'must be at most 3' }).optional(),
  deviationAnglesDeg: list(num().min(0, { error: 'must be at least 0' }).lt(180, { error: 'must be less than 180' }), 'deviation angles').optional(),
  focalLengthsMm: list(num().gt(0, { error: 'must be greater than 0' }).max(10_000_000), 'focal lengths').optional(),
  /** The grating's ruled width and height, mm (one size for every candidate). */
  gratingSizeMm: num().gt(0, { error: 'must be greater than 0' }).max(100_000).optional(),
  /** Candidates returned, 1…20 (default 20). */
  top: num().int({ error: 'must be a whole number' }).min(1, { error: 'must be at least 1' }).max(SEARCH_LIMITS.maxTop, { error: `must be at most ${SEARCH_LIMITS.maxTop}` }).optional(),
  weights: searchWeightsSchema.optional(),
});
export type SearchLimits = z.infer<typeof searchLimitsSchema>;

export const searchRequestSchema = z.strictObject({
  range: rangeSchema,
  source: sourceSchema.optional(),
  detector: detectorSchema.optional(),
  requirements: requirementsSchema,
  search: searchLimitsSchema.optional(),
});
export type SearchRequest = z.infer<typeof searchRequestSchema>;

/** The figures that matter for choosing between candidates; worst values over the checked wavelengths. */
export const candidateFiguresSchema = z.object({
  grooveDensityPerMm: num(),
  order: num(),
  blazeWavelengthNm: num(),
  deviationAngleDeg: num(),
  focalLengthMm: num(),
  slitWidthUm: num(),
  worstBandpassNm: num().nullable(),
  worstResolvingPower: num().nullable(),
  minBlazeEfficiency: num().nullable(),
  reciprocalDispersionAtCentreNmPerMm: num().nullable(),
  fNumber: num().nullable(),
  /** Wavelengths (of those checked) with another order landing on them. */
  overlappedWavelengths: num(),
  /** The smallest requirement margin (a fraction of its limit). */
  minMargin: num().nullable(),
});
export type CandidateFigures = z.infer<typeof candidateFiguresSchema>;

export const candidateSchema = z.object({
  /** A complete design (requirements included) that `npm run solve` takes unchanged. */
  design: storedDesignSchema,
  score: num(),
  figures: candidateFiguresSchema,
});
export type Candidate = z.infer<typeof candidateSchema>;

/** A candidate that failed, and by how much: shown when nothing passes. */
export const nearMissSchema = z.object({
  design: storedDesignSchema,
  /** Requirement id → signed margin of each failed requirement (negative: how far it misses). */
  misses: z.record(z.string(), num()),
});
export type NearMiss = z.infer<typeof nearMissSchema>;

export const searchAnswerSchema = z.object({
  candidates: z.array(candidateSchema),
  /** Candidates evaluated. */
  considered: num(),
  /** How many candidates each requirement excluded (one candidate may count under several). */
  excludedBy: z.record(z.string(), num()),
  /** When nothing passes: the closest candidates and how far each misses; empty otherwise. */
  nearest: z.array(nearMissSchema),
  /** The weights the score used, defaults filled in. */
  weights: z.object({ margin: num(), efficiency: num(), size: num(), overlap: num() }),
});
export type SearchAnswer = z.infer<typeof searchAnswerSchema>;
