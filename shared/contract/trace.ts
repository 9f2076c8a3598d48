import { z } from 'zod';
import { designSchema } from '../design';
import { TRACE_LIMITS, traceOptionsSchema, tracedWavelengthSchema } from '../trace';
import { route } from './route';

/**
 * `POST /api/trace`'s body: the design exactly as `POST /api/solve` checks it, and the trace's
 * options with the bounds the workbench and `npm run trace` use (shared/trace.ts), so a design that
 * solves also traces and one request's work stays small.
 */
export const traceRequestSchema = z.strictObject({
  design: designSchema,
  ...traceOptionsSchema.shape,
});
export type TraceRequest = z.infer<typeof traceRequestSchema>;

/** What the trace finds that the first-order figures miss (features/trace `traceWarnings`). */
export const traceWarningSchema = z.strictObject({
  code: z.enum(['traced-bandpass-differs', 'trace-vignettes']),
  wavelengthNm: z.number(),
  message: z.string(),
});

/** A spectrograph's flat detector turned to follow the tangential foci, and the blur it removes. */
export const detectorTiltSchema = z.strictObject({
  bestTiltDeg: z.number(),
  rmsWidthFlatMm: z.number(),
  rmsWidthTiltedMm: z.number(),
  gain: z.number(),
});

/** The answer of `POST /api/trace` and `npm run trace`, the same JSON from both. */
export const traceAnswerSchema = z.strictObject({
  /** Each reachable traced wavelength: the range's start, centre and end and those asked for. */
  wavelengths: z.array(tracedWavelengthSchema),
  /** Which plane the positions are measured in, in words (e.g. the camera's tangential focus). */
  imagePlane: z.string(),
  mode: z.enum(['monochromator', 'spectrograph']),
  raysPerWavelength: z.number().int(),
  /** Radius of the entrance-slit arc that straightens the centre wavelength's image; null when it is straight enough. */
  straighteningRadiusMm: z.number().nullable(),
  /** A spectrograph's best detector tilt; null for a monochromator's exit slit. */
  detectorTilt: detectorTiltSchema.nullable(),
  warnings: z.array(traceWarningSchema),
});
export type TraceAnswer = z.infer<typeof traceAnswerSchema>;

/** The exact ray trace for scripts and other tools: the engine the workbench runs in a Web Worker. */
export const trace = {
  run: route({
    tag: 'Solver',
    method: 'POST',
    path: '/trace',
    summary: 'Trace a design exactly, ray by ray: spot sizes, the traced bandpass, slit-image curvature and focus per wavelength',
    description:
      'No sign-in and no Origin header needed. The body holds `design` (checked as POST /api/solve checks it) and optional ' +
      `\`atNm\` (at most ${TRACE_LIMITS.maxWavelengths} wavelengths traced besides the range's start, centre and end), ` +
      `\`rays\` per wavelength (${TRACE_LIMITS.minRays} to ${TRACE_LIMITS.maxRays}, default ${TRACE_LIMITS.defaultRays}) and \`curvedEntrance\`.\n\n` +
      'Axes in the image plane (`imagePlane` says which: the exit slit, or a spectrograph’s detector): x along the dispersion, ' +
      'positive toward longer wavelengths; y along the slit, positive toward the top of the entrance slit’s image; both in mm from ' +
      'the exit slit’s centre. `bestFocusShiftMm` is along the chief ray, positive away from the camera mirror. ' +
      '`centroidMm` is the whole entrance slit’s image; `rmsWidthMm` and `rmsHeightMm` the spot from the slit’s centre point. ' +
      '`raysTraced + raysVignetted` is every ray launched for the wavelength.\n\n' +
      'A bad field is a 400 naming it (`rays`, `atNm.0`, `design.slits.heightMm`). 10 calls a minute per address, then 429 `rate_limited`.',
    access: { kind: 'anyone' },
    originExempt: true,
    body: traceRequestSchema,
    output: traceAnswerSchema,
  }),
};
