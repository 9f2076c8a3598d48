import { z } from 'zod';
import { number, section } from './schema-words';

/**
 * Measured curves: what a designer uploads from a datasheet or test report (a CSV or TSV of
 * wavelength and value), as stored in the team's library and as copied into a design's optional
 * `curves` list. A design keeps its own copy of the points, so removing a curve from the library
 * never changes a saved version. Field names are part of the scripting interface and the notebook
 * file.
 */

export const CURVE_KINDS = [
  'grating-efficiency',
  'mirror-reflectance',
  'filter-transmission',
  'detector-response',
  'source-spectrum',
  'line-list',
] as const;
export type CurveKind = (typeof CURVE_KINDS)[number];

/** Kinds whose values are a fraction of the light (0…1; percent is converted on upload). */
export const FRACTION_KINDS: readonly CurveKind[] = [
  'grating-efficiency',
  'mirror-reflectance',
  'filter-transmission',
  'detector-response',
];

export const CURVE_KIND_WORDS: Readonly<Record<CurveKind, string>> = {
  'grating-efficiency': 'grating efficiency',
  'mirror-reflectance': 'mirror reflectance',
  'filter-transmission': 'filter transmission',
  'detector-response': 'detector response (quantum efficiency)',
  'source-spectrum': 'source spectrum',
  'line-list': 'calibration line list',
};

export const POLARISATIONS = ['unpolarised', 'te', 'tm'] as const;
export type Polarisation = (typeof POLARISATIONS)[number];

export const MIRRORS = ['collimator', 'camera', 'both'] as const;
export type MirrorTarget = (typeof MIRRORS)[number];

/** The medium the file's wavelengths are in, when it says. */
export const MEDIA = ['air', 'vacuum', 'unstated'] as const;
export type Medium = (typeof MEDIA)[number];

/** Upload size limit: the multipart endpoint answers 413 above it. */
export const MAX_CURVE_FILE_BYTES = 2 * 1024 * 1024;
/** Most points one curve keeps (a datasheet has hundreds; a spectrometer's source spectrum a few thousand). */
export const MAX_CURVE_POINTS = 5000;
/** Most curves one design carries. */
export const MAX_DESIGN_CURVES = 12;
export const MAX_CURVE_NAME = 120;

const kindSchema = z.enum(CURVE_KINDS, {
  error: (issue) => (issue.input === undefined ? 'is required' : `must be one of ${CURVE_KINDS.join(', ')}`),
});

const pointList = (what: string) =>
  z
    .array(number(), { error: `must be a list of ${what}` })
    .min(2, { error: 'must hold at least 2 points' })
    .max(MAX_CURVE_POINTS, { error: `must hold at most ${MAX_CURVE_POINTS} points` });

/**
 * A curve's points, wavelengths in nm strictly increasing, each value ≥ 0 (and ≤ 1 for the
 * fraction kinds). Row numbers in messages count from 1, as a spreadsheet does.
 */
export function checkCurvePoints(
  kind: CurveKind | undefined,
  wavelengthsNm: readonly number[],
  values: readonly number[],
  ctx: z.RefinementCtx,
): void {
  if (wavelengthsNm.length !== values.length) {
    ctx.addIssue({ code: 'custom', path: ['values'], message: 'must hold one value per wavelength' });
    return;
  }
  for (let i = 0; i < wavelengthsNm.length; i++) {
    const w = wavelengthsNm[i] as number;
    if (!(w > 0) || w > 10_000_000) {
      ctx.addIssue({ code: 'custom', path: ['wavelengthsNm', i], message: 'must be greater than 0 and at most 10000000 nm' });
      return;
    }
    if (i > 0 && !(w > (wavelengthsNm[i - 1] as number))) {
      ctx.addIssue({
        code: 'custom',
        path: ['wavelengthsNm', i],
        message: w === wavelengthsNm[i - 1] ? `repeats the wavelength of point ${i}` : `must be greater than the wavelength of point ${i}`,
      });
      return;
    }
    const v = values[i] as number;
    if (v < 0) {
      ctx.addIssue({ code: 'custom', path: ['values', i], message: 'must be at least 0' });
      return;
    }
    if (kind !== undefined && FRACTION_KINDS.includes(kind) && v > 1) {
      ctx.addIssue({ code: 'custom', path: ['values', i], message: 'must be at most 1 (100 %)' });
      return;
    }
  }
}

/** A curve as a design carries it: what it is, where it came from, and its points. */
export const designCurveSchema = section({
  kind: kindSchema,
  name: z
    .string({ error: (issue) => (issue.input === undefined ? 'is required' : 'must be text') })
    .trim()
    .min(1, { error: 'must not be empty' })
    .max(MAX_CURVE_NAME, { error: `must be at most ${MAX_CURVE_NAME} characters` }),
  /** SHA-256 of the uploaded file's bytes, hex: how a re-upload is recognised. */
  checksum: z.string({ error: 'must be text' }).regex(/^[0-9a-f]{64}$/, { error: 'must be 64 lowercase hex digits (SHA-256)' }),
  medium: z.enum(MEDIA, { error: `must be one of ${MEDIA.join(', ')}` }),
  /** grating-efficiency: the order the curve was measured in (default: the design's order). */
  order: number()
    .int({ error: 'must be a whole number other than 0' })
    .refine((o) => o !== 0, { error: 'must be a whole number other than 0' })
    .min(-1000, { error: 'must be between -1000 and 1000' })
    .max(1000, { error: 'must be between -1000 and 1000' })
    .optional(),
  /** grating-efficiency: which polarisation; unpolarised when absent. TE and TM together average. */
  polarisation: z.enum(POLARISATIONS, { error: `must be one of ${POLARISATIONS.join(', ')}` }).optional(),
  /** mirror-reflectance: which mirror (both when absent). */
  mirror: z.enum(MIRRORS, { error: `must be one of ${MIRRORS.join(', ')}` }).optional(),
  /** filter-transmission: which of the design's filters, counting from 1 (all when absent). */
  filterNumber: number()
    .int({ error: 'must be a whole number' })
    .min(1, { error: 'must be at least 1' })
    .max(12, { error: 'must be at most 12' })
    .optional(),
  wavelengthsNm: pointList('wavelengths in nm'),
  values: pointList('values'),
}).superRefine((curve, ctx) => {
  if (Array.isArray(curve.wavelengthsNm) && Array.isArray(curve.values) && curve.values.length >= 2) {
    checkCurvePoints(curve.kind, curve.wavelengthsNm, curve.values, ctx);
  }
  const only = (field: 'order' | 'polarisation' | 'mirror' | 'filterNumber', kind: CurveKind) => {
    if (curve[field] !== undefined && curve.kind !== kind) {
      ctx.addIssue({ code: 'custom', path: [field], message: `applies only to a ${kind} curve` });
    }
  };
  only('order', 'grating-efficiency');
  only('polarisation', 'grating-efficiency');
  only('mirror', 'mirror-reflectance');
  only('filterNumber', 'filter-transmission');
});

export type DesignCurve = z.infer<typeof designCurveSchema>;

export const curvesSchema = z
  .array(designCurveSchema, { error: 'must be a list of curves' })
  .max(MAX_DESIGN_CURVES, { error: `must list at most ${MAX_DESIGN_CURVES} curves` });
