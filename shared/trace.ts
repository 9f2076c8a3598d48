import { z } from 'zod';

/**
 * What a trace may be asked for, shared by the workbench's Web Worker, `POST /api/trace` and
 * `npm run trace`: which wavelengths, how many rays, and whether the entrance slit is curved to
 * straighten its image. The bounds keep one request's work small (a trace of the largest allowed
 * request runs in well under a second on this machine; `npm run bench:trace`).
 */
export const TRACE_LIMITS = {
  /** Rays per wavelength when none is asked for: smooth spot diagrams, a few ms per wavelength. */
  defaultRays: 4000,
  minRays: 200,
  maxRays: 50_000,
  /** Wavelengths per request (`--at`, `at`): the range's start, centre and end are added to them. */
  maxWavelengths: 8,
} as const;

/** The ray counts the workbench offers (a segmented control). */
export const TRACE_RAY_CHOICES = [1000, 4000, 20_000] as const;

export const traceOptionsSchema = z.strictObject({
  /** Extra wavelengths to trace (nm), besides the range's start, centre and end. */
  atNm: z
    .array(z.number({ error: 'must be a number (nm)' }).finite().min(1, { error: 'must be at least 1 nm' }).max(100_000, { error: 'must be at most 100000 nm' }))
    .max(TRACE_LIMITS.maxWavelengths, { error: `must list at most ${TRACE_LIMITS.maxWavelengths} wavelengths` })
    .optional(),
  /** Rays per wavelength, spread over the entrance slit and the collimator's aperture. */
  rays: z
    .number({ error: 'must be a whole number of rays' })
    .int({ error: 'must be a whole number of rays' })
    .min(TRACE_LIMITS.minRays, { error: `must be at least ${TRACE_LIMITS.minRays}` })
    .max(TRACE_LIMITS.maxRays, { error: `must be at most ${TRACE_LIMITS.maxRays}` })
    .optional(),
  /** Trace with the entrance slit bent to the radius that straightens its image. */
  curvedEntrance: z.boolean({ error: 'must be true or false' }).optional(),
});
export type TraceOptions = z.infer<typeof traceOptionsSchema>;

/**
 * One traced wavelength as the API and the script answer it. Axes in the image plane (the exit
 * slit's plane, or the detector's): x along the dispersion, positive toward longer wavelengths;
 * y along the slit, positive toward the top of the entrance slit's image; both in mm from the
 * exit slit's centre. `bestFocusShiftMm` is along the chief ray, positive away from the camera.
 * The counts and the centroid are of the whole entrance slit's image; the RMS width and height are
 * of the spot from the slit's centre point (the blur the optics add to a point).
 */
export const tracedWavelengthSchema = z.strictObject({
  wavelengthNm: z.number(),
  raysTraced: z.number().int(),
  raysVignetted: z.number().int(),
  centroidMm: z.strictObject({ x: z.number(), y: z.number() }),
  rmsWidthMm: z.number(),
  rmsHeightMm: z.number(),
  tracedFwhmNm: z.number().nullable(),
  curvatureSagittaMm: z.number(),
  tracedLinearDispersionMmPerNm: z.number(),
  bestFocusShiftMm: z.number(),
});
export type TracedWavelengthSummary = z.infer<typeof tracedWavelengthSchema>;
