import { z } from 'zod';
import { storedDesignSchema } from '../design';
import { personSchema } from './fields';

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
