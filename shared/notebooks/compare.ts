import { z } from 'zod';
import { versionNumberText } from './version-number';
import { versionSchema } from './versions';

/**
 * `GET /api/designs/:id/compare?a=1&b=3`: `a` is "before", `b` is "after". Without `b`, the latest;
 * without `a`, the parent of `b` (itself for version 1).
 */
export const compareQuerySchema = z.object({
  a: versionNumberText.optional(),
  b: versionNumberText.optional(),
});

export const parameterChangeSchema = z.object({
  /** Dotted path into the design, e.g. `slits.exitWidthUm`; a section present in only one side is one entry. */
  path: z.string(),
  /** Undefined values (an optional field absent on one side) are sent as null. */
  before: z.unknown(),
  after: z.unknown(),
});
export type ParameterChange = z.infer<typeof parameterChangeSchema>;

export const figureKeys = [
  'bandpassAtCentreNm',
  'resolvingPowerAtCentre',
  'reciprocalDispersionAtCentreNmPerMm',
  'fNumber',
  'warningCount',
] as const;
export type FigureKey = (typeof figureKeys)[number];

export const figureChangeSchema = z.object({
  key: z.enum(figureKeys),
  before: z.number().nullable(),
  after: z.number().nullable(),
  /** `(after − before) / |before|`: −0.12 reads "−12 %". Null when either is null or before is 0. */
  relativeChange: z.number().nullable(),
});
export type FigureChange = z.infer<typeof figureChangeSchema>;

export const compareResponseSchema = z.object({
  a: versionSchema,
  b: versionSchema,
  changes: z.array(parameterChangeSchema),
  figures: z.array(figureChangeSchema),
});
export type CompareResponse = z.infer<typeof compareResponseSchema>;
