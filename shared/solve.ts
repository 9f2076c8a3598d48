import { z } from 'zod';
import { LAYOUT_KINDS } from './design';
import { orderSortingFilterSchema } from './filters';

/**
 * The answer of `POST /api/solve`, described for the API contract and its OpenAPI document. The
 * solver's own types (features/solver/results.ts) are the source; `tests/shared/solve.test.ts`
 * parses real evaluations with these strict objects, so a field added or renamed on one side
 * fails there. Units are in the names; angle-dependent figures of an unreachable wavelength are
 * null, never NaN.
 */
const nullableNumber = z.number().nullable();

export const slitFunctionSchema = z.strictObject({
  shape: z.enum(['triangle', 'trapezoid']),
  baseNm: z.number(),
  topNm: z.number(),
});

export const overlapSchema = z.strictObject({ order: z.int(), wavelengthNm: z.number(), blocked: z.boolean() });

export const wavelengthPointSchema = z.strictObject({
  wavelengthNm: z.number(),
  reachable: z.boolean(),
  reason: z.string().nullable(),
  incidenceDeg: nullableNumber,
  diffractionDeg: nullableNumber,
  gratingRotationDeg: nullableNumber,
  angularDispersionDegPerNm: nullableNumber,
  linearDispersionMmPerNm: nullableNumber,
  reciprocalDispersionNmPerMm: nullableNumber,
  anamorphicMagnification: nullableNumber,
  bandpassNm: nullableNumber,
  slitFunction: slitFunctionSchema.nullable(),
  diffractionLimitNm: z.number(),
  resolvingPower: nullableNumber,
  theoreticalResolvingPower: z.number(),
  freeSpectralRangeNm: z.number(),
  blazeEfficiency: nullableNumber,
  overlaps: z.array(overlapSchema).readonly(),
  overlapCount: z.int(),
  unblockedOverlapCount: z.int(),
  overlapsTruncated: z.boolean(),
  filterTransmission: z.number(),
  scanSensitivityNmPerArcsec: nullableNumber,
  relativeThroughput: nullableNumber,
});

export const aberrationSummarySchema = z.strictObject({
  comaFreeCameraOffAxisDeg: nullableNumber,
  cameraOffAxisInUseDeg: nullableNumber,
  comaResidualAtStartDeg: nullableNumber,
  comaResidualAtCentreDeg: nullableNumber,
  comaResidualAtEndDeg: nullableNumber,
  collimatorAstigmatismMm: nullableNumber,
  cameraAstigmatismMm: nullableNumber,
});

export const detectorSampleSchema = z.strictObject({
  position: z.enum(['start', 'centre', 'end']),
  wavelengthNm: z.number(),
  entranceImageUm: z.number(),
  diffractionSpotUm: z.number(),
  pixelsPerResolutionElement: z.number(),
});

export const detectorCoverageSchema = z.strictObject({
  widthMm: z.number(),
  startNm: nullableNumber,
  endNm: nullableNumber,
  coverageNm: nullableNumber,
  coversRange: z.boolean(),
  nmPerPixel: z.number(),
  pixelsPerBandpass: z.number(),
  pixelsPerResolutionElement: z.number(),
  samples: z.array(detectorSampleSchema),
});

export const designSummarySchema = z.strictObject({
  kind: z.enum(LAYOUT_KINDS),
  grooveSpacingNm: z.number(),
  illuminatedGrooves: z.number(),
  halfDeviationDeg: z.number(),
  centreWavelengthNm: z.number(),
  reachableMinNm: z.number(),
  reachableMaxNm: z.number(),
  gratingRotationStartDeg: nullableNumber,
  gratingRotationEndDeg: nullableNumber,
  fNumberProjectedWidth: nullableNumber,
  fNumberHeight: z.number(),
  cameraFNumberProjectedWidth: nullableNumber,
  cameraFNumberHeight: z.number(),
  blazeWavelengthInMountNm: nullableNumber,
  aberrations: aberrationSummarySchema,
  detector: detectorCoverageSchema.nullable(),
});

export const warningCodes = [
  'unreachable',
  'near-grazing',
  'below-diffraction-limit',
  'undersampled',
  'order-overlap',
  'filter-attenuates',
  'low-efficiency',
  'beyond-scalar-blaze',
  'few-grooves',
  'fast-optics',
  'degenerate-mount',
  'input-overfills',
  'input-underfills',
  'curve-gap',
] as const;

export const designWarningSchema = z.strictObject({
  code: z.enum(warningCodes),
  message: z.string(),
  wavelengthNm: z.number().optional(),
});

export const orderSortingSummarySchema = z.strictObject({
  proposedFilters: z.array(orderSortingFilterSchema),
  unblockedOverlaps: z.int(),
  proposedUnblockedOverlaps: z.int(),
  filterChangesNm: z.array(z.number()),
});

const nullableNumbers = z.array(nullableNumber);

export const inputFillSchema = z.strictObject({
  inputFNumber: nullableNumber,
  pupilFraction: z.number(),
  slitFraction: z.number(),
  coupling: z.number(),
  litWidthFraction: z.number(),
  litGrooves: z.number(),
  litResolvingPower: z.number(),
  state: z.enum(['matched', 'overfilled', 'underfilled', 'assumed-matched']),
});

export const throughputFactorSchema = z.strictObject({
  id: z.enum(['grating', 'collimator', 'camera', 'filter', 'detector', 'input']),
  basis: z.enum(['measured', 'estimate', 'model', 'not-counted']),
  curveNames: z.array(z.string()),
  values: nullableNumbers,
  gapsNm: z.array(z.strictObject({ fromNm: z.number(), toNm: z.number() })),
});

export const lightBudgetSchema = z.strictObject({
  inputKind: z.enum(['none', 'free-space', 'fibre', 'lens']),
  slitAreaMm2: z.number(),
  acceptanceSolidAngleSr: nullableNumber,
  acceptanceFNumber: nullableNumber,
  etendueMm2Sr: nullableNumber,
  fill: inputFillSchema.nullable(),
  factors: z.array(throughputFactorSchema),
  throughput: nullableNumbers,
  signal: nullableNumbers,
  sourceBasis: z.enum(['measured', 'flat']),
  lowest: z.strictObject({ value: z.number(), wavelengthNm: z.number() }).nullable(),
});

export const solveResponseSchema = z.strictObject({
  points: z.array(wavelengthPointSchema),
  design: designSummarySchema,
  orderSorting: orderSortingSummarySchema,
  lightBudget: lightBudgetSchema,
  warnings: z.array(designWarningSchema),
});
