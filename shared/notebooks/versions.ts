import { z } from 'zod';
import { storedDesignSchema } from '../design';
import { REQUIREMENT_IDS } from '../requirements';
import { personSchema } from './fields';

/**
 * How a version stood against its own requirements when it was saved: `met` of `total` checks
 * passed, `unknown` could not be judged (no detector, no blaze…), `failing` names the rest in
 * `REQUIREMENT_IDS` order.
 */
export const requirementsSummarySchema = z.object({
  met: z.number().int().nonnegative(),
  total: z.number().int().nonnegative(),
  unknown: z.number().int().nonnegative(),
  failing: z.array(z.enum(REQUIREMENT_IDS)),
});
export type RequirementsSummary = z.infer<typeof requirementsSummarySchema>;

/**
 * Key figures of a version, computed on the server with the solver when the version is saved
 * (so lists and history never run the solver per request). Figures at the centre wavelength
 * `(range.startNm + range.endNm) / 2`; null where the centre is unreachable.
 */
export const versionSummarySchema = z.object({
  rangeStartNm: z.number(),
  rangeEndNm: z.number(),
  centreWavelengthNm: z.number(),
  centreReachable: z.boolean(),
  bandpassAtCentreNm: z.number().nullable(),
  resolvingPowerAtCentre: z.number().nullable(),
  reciprocalDispersionAtCentreNmPerMm: z.number().nullable(),
  /** Collimator focal / (ruled width × cos α) at the centre. */
  fNumber: z.number().nullable(),
  /** Warnings over the default 101-point sweep of the range, as the workbench shows them. */
  warningCount: z.number().int().nonnegative(),
  /**
   * Left out when the design states no requirements, and absent from every summary stored before
   * requirements existed: optional, so each stored summary (jsonb) still parses as it is.
   */
  requirements: requirementsSummarySchema.nullable().optional(),
});
export type VersionSummary = z.infer<typeof versionSummarySchema>;

/** A version without its parameters and notes: one row of the history table. */
export const versionHeaderSchema = z.object({
  number: z.number().int().positive(),
  message: z.string(),
  author: personSchema.nullable(),
  createdAt: z.iso.datetime(),
  /** The version this one was saved on top of; null for version 1. */
  parentNumber: z.number().int().positive().nullable(),
  summary: versionSummarySchema,
});
export type VersionHeader = z.infer<typeof versionHeaderSchema>;

export const versionSchema = versionHeaderSchema.extend({
  params: storedDesignSchema,
  notes: z.string(),
});
export type Version = z.infer<typeof versionSchema>;

export const versionListResponseSchema = z.object({
  /** Newest first. */
  versions: z.array(versionHeaderSchema),
});
export const versionResponseSchema = z.object({ version: versionSchema });
export type VersionResponse = z.infer<typeof versionResponseSchema>;
