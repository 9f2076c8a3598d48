import { z } from 'zod';
import { VALUE_SCALES, WAVELENGTH_UNITS } from './curve-file';
import { CURVE_KINDS, FRACTION_KINDS, MAX_CURVE_NAME, MEDIA, type CurveKind } from './curves';
import { teamParamsSchema } from './teams';

/**
 * The team's curve library over HTTP: the multipart upload's fields, the preview, and the curves
 * as listed and as read one at a time. A curve read one at a time carries `designCurve`, exactly
 * what a design's `curves` list holds (`designCurveSchema` without the optional per-kind fields),
 * so the client copies it into a draft as it is.
 */

const words = (list: readonly string[]) => list.join(', ');

const fileFields = {
  file: z.file({ error: 'is required: send the curve file as a multipart/form-data part named file' }),
  kind: z.enum(CURVE_KINDS, { error: (issue) => (issue.input === undefined ? 'is required' : `must be one of ${words(CURVE_KINDS)}`) }),
  wavelengthUnit: z.enum(WAVELENGTH_UNITS, { error: `must be one of ${words(WAVELENGTH_UNITS)}` }).optional(),
  valueScale: z.enum(VALUE_SCALES, { error: `must be one of ${words(VALUE_SCALES)}` }).optional(),
  medium: z.enum(MEDIA, { error: `must be one of ${words(MEDIA)}` }).optional(),
};

function formSchema<T extends typeof fileFields>(shape: T) {
  return z
    .strictObject(shape, {
      error: (issue) =>
        issue.code === 'unrecognized_keys' ? `has an unknown field ${issue.keys.map((k) => `'${k}'`).join(', ')} (check the spelling)` : 'must be a multipart form',
    })
    .superRefine((fields, ctx) => {
      const { kind, valueScale } = fields as { kind: CurveKind; valueScale?: string };
      if (valueScale !== undefined && !FRACTION_KINDS.includes(kind)) {
        ctx.addIssue({ code: 'custom', path: ['valueScale'], message: `applies only to ${words(FRACTION_KINDS)} curves` });
      }
    });
}

/**
 * The multipart fields of a preview: `file` arrives as a File (the server turns multer's buffer
 * into one before the fields are checked), so a missing file is refused here by name like any
 * other field; the corrections override what the parser detected.
 */
export const curveFileFieldsSchema = formSchema(fileFields);

/** An upload's fields: a preview's, and the curve's name (default: the file's name). */
export const curveUploadFieldsSchema = formSchema({
  ...fileFields,
  name: z
    .string({ error: 'must be text' })
    .trim()
    .min(1, { error: 'must not be empty' })
    .max(MAX_CURVE_NAME, { error: `must be at most ${MAX_CURVE_NAME} characters` })
    .optional(),
});

const detectionSchema = <T extends readonly [string, ...string[]]>(values: T) =>
  z.object({ value: z.enum(values), from: z.enum(['header', 'comment', 'values', 'not-stated']), reason: z.string() });
const appliedSchema = <T extends readonly [string, ...string[]]>(values: T) => z.object({ value: z.enum(values), corrected: z.boolean() });
const columnUseSchema = z.object({ column: z.number().int(), name: z.string().nullable() });

/** What `parseCurveFile` read (its `CurveFileParsed` without `ok`), plus the file's SHA-256. */
export const curvePreviewSchema = z.object({
  kind: z.enum(CURVE_KINDS),
  fileName: z.string(),
  checksum: z.string(),
  wavelengthsNm: z.array(z.number()),
  values: z.array(z.number()),
  labels: z.array(z.string()).nullable(),
  detected: z.object({
    wavelengthUnit: detectionSchema(WAVELENGTH_UNITS),
    valueScale: detectionSchema(VALUE_SCALES).nullable(),
    medium: detectionSchema(MEDIA),
  }),
  applied: z.object({
    wavelengthUnit: appliedSchema(WAVELENGTH_UNITS),
    valueScale: appliedSchema(VALUE_SCALES).nullable(),
    medium: appliedSchema(MEDIA),
  }),
  delimiter: z.enum([',', '\t', ';']),
  decimalComma: z.boolean(),
  header: z.object({ row: z.number().int(), cells: z.array(z.string()) }).nullable(),
  columns: z.object({ wavelength: columnUseSchema, value: columnUseSchema.nullable(), label: columnUseSchema.nullable(), ignored: z.array(columnUseSchema) }),
  firstRows: z.array(z.object({ row: z.number().int(), cells: z.array(z.string()) })),
  pointCount: z.number().int(),
});
export type CurvePreview = z.infer<typeof curvePreviewSchema>;
export const curvePreviewResponseSchema = z.object({ preview: curvePreviewSchema });

/** A library entry without its points, as listed. */
export const teamCurveSummarySchema = z.object({
  id: z.string(),
  teamId: z.string(),
  kind: z.enum(CURVE_KINDS),
  name: z.string(),
  fileName: z.string(),
  fileSizeBytes: z.number().int(),
  checksum: z.string(),
  wavelengthUnit: z.enum(WAVELENGTH_UNITS),
  /** null for kinds whose values are not fractions of the light (source spectra, line lists). */
  valueScale: z.enum(VALUE_SCALES).nullable(),
  medium: z.enum(MEDIA),
  /** What the uploader corrected over what was detected. */
  corrections: z.object({
    wavelengthUnit: z.enum(WAVELENGTH_UNITS).optional(),
    valueScale: z.enum(VALUE_SCALES).optional(),
    medium: z.enum(MEDIA).optional(),
  }),
  pointCount: z.number().int(),
  startNm: z.number(),
  endNm: z.number(),
  uploadedBy: z.string().nullable(),
  uploadedByName: z.string(),
  createdAt: z.iso.datetime(),
});
export type TeamCurveSummary = z.infer<typeof teamCurveSummarySchema>;

/** What a design copies: `designCurveSchema`'s shape without the optional per-kind fields. */
export const libraryDesignCurveSchema = z.object({
  kind: z.enum(CURVE_KINDS),
  name: z.string(),
  checksum: z.string(),
  medium: z.enum(MEDIA),
  wavelengthsNm: z.array(z.number()),
  values: z.array(z.number()),
});

export const teamCurveSchema = teamCurveSummarySchema.extend({
  designCurve: libraryDesignCurveSchema,
  /** A line list's labels, one per point; null for other kinds. */
  labels: z.array(z.string()).nullable(),
});
export type TeamCurve = z.infer<typeof teamCurveSchema>;

export const teamCurveListResponseSchema = z.object({ curves: z.array(teamCurveSummarySchema) });
export const teamCurveResponseSchema = z.object({ curve: teamCurveSchema });
/** `recognised`: the same file, read the same way, was already in the library (answered 200, nothing stored). */
export const teamCurveUploadResponseSchema = z.object({ curve: teamCurveSchema, recognised: z.boolean() });

export const teamCurveParamsSchema = teamParamsSchema.extend({ curveId: z.string().min(1).max(64) });
