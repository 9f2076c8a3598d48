import { z } from 'zod';
import { number, section } from './schema-words';

/**
 * What an instrument must do: the optional `requirements` block of a design. Field names carry
 * their units and are part of the scripting interface (`POST /api/search`, the notebook file).
 * Every field is optional; a design without the block, or with an empty one, is unchanged.
 *
 * Bandpass, resolving power, blaze efficiency and pixels per bandpass apply across the whole
 * design range unless `atWavelengthsNm` lists where they matter.
 */

function positive(max: number, unitWords: string) {
  return number()
    .gt(0, { error: 'must be greater than 0' })
    .max(max, { error: `must be at most ${max}${unitWords ? ` ${unitWords}` : ''}` });
}

export const ORDER_OVERLAP_POLICIES = ['forbidden', 'filtered', 'allowed'] as const;
export type OrderOverlapPolicy = (typeof ORDER_OVERLAP_POLICIES)[number];

/**
 * What `maxBandpassNm` is judged on: the closed-form slit-limited FWHM, or the FWHM of the line
 * shape the exact ray trace finds (mirror aberrations included). Absent means slit-limited, so a
 * stored design without the field reads as it always did.
 */
export const BANDPASS_BASES = ['slit-limited', 'traced'] as const;
export type BandpassBasis = (typeof BANDPASS_BASES)[number];

/** At most this many named wavelengths: they are checked one by one on every edit. */
export const MAX_REQUIREMENT_WAVELENGTHS = 20;

export const footprintSchema = section({
  /** Across the instrument, along the bisector's normal (the sketch's horizontal). */
  widthMm: positive(100_000, 'mm'),
  /** Along the bisector (the sketch's vertical). */
  depthMm: positive(100_000, 'mm'),
});

export const requirementsSchema = section({
  /** FWHM bandpass, at most this, nm: slit-limited, or traced when `bandpassBasis` says so. */
  maxBandpassNm: positive(10_000_000, 'nm').optional(),
  /** Which bandpass `maxBandpassNm` limits; slit-limited when absent. */
  bandpassBasis: z
    .enum(BANDPASS_BASES, {
      error: (issue) => (issue.input === undefined ? 'is required' : 'must be one of slit-limited or traced'),
    })
    .optional(),
  /** λ/Δλ (slit and diffraction widths in quadrature), at least this. */
  minResolvingPower: positive(100_000_000, '').optional(),
  /** Where bandpass, resolving power, efficiency and sampling are checked; the whole range when absent. */
  atWavelengthsNm: z
    .array(positive(10_000_000, 'nm'), { error: 'must be a list of wavelengths in nm' })
    .min(1, { error: 'must list at least one wavelength, or be left out to mean the whole range' })
    .max(MAX_REQUIREMENT_WAVELENGTHS, {
      error: `must list at most ${MAX_REQUIREMENT_WAVELENGTHS} wavelengths`,
    })
    .optional(),
  /** Scalar blaze efficiency relative to its peak, a fraction from 0 to 1. */
  minBlazeEfficiency: number()
    .gt(0, { error: 'must be greater than 0 (a fraction from 0 to 1)' })
    .max(1, { error: 'must be at most 1 (a fraction: 0.4 means 40 %)' })
    .optional(),
  /**
   * The light budget's relative throughput (grating × mirrors × filter × detector × input), at
   * least this, a fraction from 0 to 1; judged where every counted factor is known.
   */
  minRelativeThroughput: number()
    .gt(0, { error: 'must be greater than 0 (a fraction from 0 to 1)' })
    .max(1, { error: 'must be at most 1 (a fraction: 0.2 means 20 %)' })
    .optional(),
  /** The slower of the collimator's width and height f-numbers at the range centre, at most this. */
  maxFNumber: number()
    .min(0.5, { error: 'must be at least 0.5 (no mirror or lens is faster)' })
    .max(1000, { error: 'must be at most 1000' })
    .optional(),
  /** The longer of the collimator and camera focal lengths, at most this, mm. */
  maxFocalLengthMm: positive(10_000_000, 'mm').optional(),
  /** The mount's outline (every optic and slit, as the sketch places them) fits inside this. */
  maxFootprintMm: footprintSchema.optional(),
  /** Detector pixels across one bandpass, at least this (2: Nyquist, common practice). */
  minPixelsPerBandpass: positive(10_000, '').optional(),
  /** The detector records the whole range at one grating setting (a spectrograph). */
  oneShotCoverage: z.boolean({ error: 'must be true or false' }).optional(),
  /** Wavelength error from one step of the scan drive, at most this, nm (needs `driveStepArcsec`). */
  maxWavelengthErrorNm: positive(10_000_000, 'nm').optional(),
  /** The scan drive's smallest step (or its error) in arc-seconds of grating rotation. */
  driveStepArcsec: positive(3600, 'arcsec').optional(),
  /** Reciprocal linear dispersion at the exit plane, at most this, nm/mm. */
  maxReciprocalDispersionNmPerMm: positive(10_000_000, 'nm/mm').optional(),
  /** Other orders landing on the working wavelength: refused, allowed where a filter blocks them, or allowed. */
  orderOverlap: z
    .enum(ORDER_OVERLAP_POLICIES, {
      error: (issue) =>
        issue.input === undefined ? 'is required' : 'must be one of forbidden, filtered or allowed',
    })
    .optional(),
}).superRefine((requirements, ctx) => {
  if (requirements.maxWavelengthErrorNm !== undefined && requirements.driveStepArcsec === undefined) {
    ctx.addIssue({
      code: 'custom',
      path: ['driveStepArcsec'],
      message: 'is required with maxWavelengthErrorNm: the wavelength error is one drive step times the scan sensitivity',
    });
  }
});

export type Requirements = z.infer<typeof requirementsSchema>;
export type Footprint = z.infer<typeof footprintSchema>;

/** The requirements a design can be checked against, one per limit (the wavelength list and drive step qualify others). */
export const REQUIREMENT_IDS = [
  'maxBandpassNm',
  'minResolvingPower',
  'minBlazeEfficiency',
  'minRelativeThroughput',
  'maxFNumber',
  'maxFocalLengthMm',
  'maxFootprintMm',
  'minPixelsPerBandpass',
  'oneShotCoverage',
  'maxWavelengthErrorNm',
  'maxReciprocalDispersionNmPerMm',
  'orderOverlap',
] as const;
export type RequirementId = (typeof REQUIREMENT_IDS)[number];

/** Words for every requirements field: the editor's label, and its name in compare tables. */
export const requirementWords: Readonly<
  Record<keyof Requirements | 'maxFootprintMm.widthMm' | 'maxFootprintMm.depthMm', { label: string; short: string }>
> = {
  maxBandpassNm: { label: 'Bandpass at most', short: 'max bandpass (nm)' },
  bandpassBasis: { label: 'Bandpass judged on', short: 'bandpass basis' },
  minResolvingPower: { label: 'Resolving power at least', short: 'min resolving power' },
  atWavelengthsNm: { label: 'Only at these wavelengths', short: 'at wavelengths (nm)' },
  minBlazeEfficiency: { label: 'Blaze efficiency at least', short: 'min blaze efficiency' },
  minRelativeThroughput: { label: 'Throughput at least', short: 'min relative throughput' },
  maxFNumber: { label: 'f-number at most', short: 'max f-number' },
  maxFocalLengthMm: { label: 'Focal length at most', short: 'max focal length (mm)' },
  maxFootprintMm: { label: 'Footprint at most', short: 'max footprint (mm)' },
  'maxFootprintMm.widthMm': { label: 'Footprint width at most', short: 'max footprint width (mm)' },
  'maxFootprintMm.depthMm': { label: 'Footprint depth at most', short: 'max footprint depth (mm)' },
  minPixelsPerBandpass: { label: 'Pixels per bandpass at least', short: 'min pixels per bandpass' },
  oneShotCoverage: { label: 'Whole range in one shot', short: 'one-shot coverage' },
  maxWavelengthErrorNm: { label: 'Wavelength error at most', short: 'max wavelength error (nm)' },
  driveStepArcsec: { label: 'Drive step', short: 'drive step (arcsec)' },
  maxReciprocalDispersionNmPerMm: {
    label: 'Reciprocal dispersion at most',
    short: 'max reciprocal dispersion (nm/mm)',
  },
  orderOverlap: { label: 'Overlapping orders', short: 'order overlap' },
};

/** `requirements.maxFootprintMm.widthMm` → "Requirements: max footprint width (mm)"; null for other paths. */
export function describeRequirementPath(path: string): string | null {
  if (path !== 'requirements' && !path.startsWith('requirements.')) return null;
  const rest = path.slice('requirements.'.length);
  if (path === 'requirements') return 'Requirements';
  const words = requirementWords[rest as keyof typeof requirementWords];
  return `Requirements: ${words?.short ?? rest}`;
}
