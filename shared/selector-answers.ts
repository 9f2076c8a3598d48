import { z } from 'zod';
import {
  PRISM_MATERIAL_IDS,
  type AbsorptionStackAnswer,
  type InterferenceFilterAnswer,
  type PrismAnswer,
  type PrismPoint,
  type SelectorAnswer,
  type SelectorWarning,
} from './selectors';

/**
 * The selector calculators' answers as zod schemas, for the API contract's output (and so the
 * OpenAPI document) and for tests that read an answer back. They mirror the interfaces in
 * shared/selectors.ts field for field; the checks at the bottom fail the type check when the two
 * drift apart.
 */

const warningSchema = z.object({ code: z.string(), message: z.string() });

export const interferenceFilterAnswerSchema = z.object({
  kind: z.literal('interference-filter'),
  spacerThicknessNm: z.number(),
  peaksNm: z.array(z.number()),
  peakCount: z.number(),
  peaksTruncated: z.boolean(),
  finesse: z.number(),
  freeSpectralRangeNm: z.number(),
  fwhmNm: z.number(),
  tilt: z.array(z.object({ tiltDeg: z.number(), peakNm: z.number() })),
  warnings: z.array(warningSchema),
});

export const absorptionStackAnswerSchema = z.object({
  kind: z.literal('absorption-stack'),
  points: z.array(z.object({ wavelengthNm: z.number(), transmission: z.number() })),
  peakTransmission: z.number(),
  warnings: z.array(warningSchema),
});

export const prismPointSchema = z.object({
  wavelengthNm: z.number(),
  index: z.number().nullable(),
  dnDlambdaPerNm: z.number().nullable(),
  minDeviationDeg: z.number().nullable(),
  angularDispersionDegPerNm: z.number().nullable(),
  resolvingPower: z.number().nullable(),
  bandpassNm: z.number().nullable(),
  reason: z.string().nullable(),
});

export const prismAnswerSchema = z.object({
  kind: z.literal('prism'),
  material: z.object({
    id: z.enum([...PRISM_MATERIAL_IDS, 'custom']),
    label: z.string(),
    source: z.string(),
    validFromNm: z.number().nullable(),
    validToNm: z.number().nullable(),
  }),
  points: z.array(prismPointSchema),
  warnings: z.array(warningSchema),
});

/** The answer of `POST /api/selectors` and of the selectors script, by the input's `kind`. */
export const selectorAnswerSchema = z.discriminatedUnion('kind', [
  interferenceFilterAnswerSchema,
  absorptionStackAnswerSchema,
  prismAnswerSchema,
]);

// Each schema's type and its interface must be assignable both ways: a field added, dropped or
// retyped on either side is a type error here.
type Same<A, B> = [A] extends [B] ? ([B] extends [A] ? true : false) : false;
const agree = <T extends true>(value: T) => value;
agree<Same<z.infer<typeof warningSchema>, SelectorWarning>>(true);
agree<Same<z.infer<typeof interferenceFilterAnswerSchema>, InterferenceFilterAnswer>>(true);
agree<Same<z.infer<typeof absorptionStackAnswerSchema>, AbsorptionStackAnswer>>(true);
agree<Same<z.infer<typeof prismPointSchema>, PrismPoint>>(true);
agree<Same<z.infer<typeof prismAnswerSchema>, PrismAnswer>>(true);
agree<Same<z.infer<typeof selectorAnswerSchema>, SelectorAnswer>>(true);
