import { z } from 'zod';
import { curvesSchema } from './curves';
import { filtersSchema } from './filters';
import { formatNumber } from './format';
import { lightInputSchema } from './light-input';
import { requirementsSchema } from './requirements';
import { number, section } from './schema-words';
import { MAX_SOLVE_WAVELENGTHS, MIN_SOLVE_POINTS } from './solve-limits';

/**
 * The stored format of a design (in a notebook) and the scripting interface of the solver.
 * Field names carry their units and are part of the public contract: renaming one breaks saved
 * notebooks and lab scripts.
 *
 * Bounds are deliberately generous (they admit echelles, far-IR and metre-class instruments) but
 * finite, so every derived number stays finite in double precision.
 */

/** A positive quantity with a physically sensible upper and lower bound in the field's unit. */
function positive(min: number, max: number, unitWords: string) {
  return number()
    .gt(0, { error: 'must be greater than 0' })
    .min(min, { error: `must be at least ${min} ${unitWords}` })
    .max(max, { error: `must be at most ${max} ${unitWords}` });
}

/** An angle in degrees, at least 0 and strictly below `limitDeg`. */
function angleBelow(limitDeg: number) {
  const message = `must be at least 0° and less than ${limitDeg}°`;
  return number().min(0, { error: message }).lt(limitDeg, { error: message });
}

/** A finite number above 0: what a field that passed its own check holds. */
function isPositive(value: unknown): value is number {
  return typeof value === 'number' && Number.isFinite(value) && value > 0;
}

const wavelengthNm = () => positive(0.001, 10_000_000, 'nm');

export const LAYOUT_KINDS = ['czerny-turner', 'littrow', 'ebert-fastie'] as const;
export type LayoutKind = (typeof LAYOUT_KINDS)[number];

/**
 * Physical limits a design cannot cross, whatever the closed forms would compute past them. The
 * solver warns (rather than refuses) where a design is possible but the closed forms grow rough.
 */
export const PHYSICAL_LIMITS = {
  /** A grating needs at least two grooves under the beam to diffract at all. */
  minGrooves: 2,
  /**
   * Fastest possible beam: a system obeying the Abbe sine condition has f-number `1/(2 sin u)`,
   * at least 0.5 in air (Born & Wolf, Principles of Optics, sine condition; from memory).
   */
  minFNumber: 0.5,
} as const;

export const gratingSchema = section({
  grooveDensityPerMm: positive(0.001, 100_000, 'per mm'),
  order: number()
    .int({ error: 'must be a whole number other than 0' })
    .refine((order) => order !== 0, { error: 'must be a whole number other than 0' })
    .min(-1000, { error: 'must be between -1000 and 1000' })
    .max(1000, { error: 'must be between -1000 and 1000' }),
  /** First-order Littrow blaze wavelength, as gratings are sold. */
  blazeWavelengthNm: wavelengthNm().optional(),
  ruledWidthMm: positive(0.001, 100_000, 'mm'),
  ruledHeightMm: positive(0.001, 100_000, 'mm'),
});

export const layoutSchema = section({
  kind: z.enum(LAYOUT_KINDS, {
    error: (issue) =>
      issue.input === undefined ? 'is required' : 'must be one of czerny-turner, littrow or ebert-fastie',
  }),
  deviationAngleDeg: angleBelow(180),
  collimatorFocalMm: positive(0.001, 10_000_000, 'mm'),
  cameraFocalMm: positive(0.001, 10_000_000, 'mm'),
  collimatorOffAxisDeg: angleBelow(90).optional(),
  cameraOffAxisDeg: angleBelow(90).optional(),
}).superRefine((layout, ctx) => {
  // Littrow is required to be 0 rather than silently treated as 0: a stored design should mean
  // what it says, and the message tells the user the one-keystroke fix.
  if (layout.kind === 'littrow' && layout.deviationAngleDeg !== 0) {
    ctx.addIssue({
      code: 'custom',
      path: ['deviationAngleDeg'],
      message: 'must be 0 for a Littrow layout (the light returns along its own path)',
    });
  }
  if (layout.kind === 'ebert-fastie' && layout.cameraFocalMm !== layout.collimatorFocalMm) {
    ctx.addIssue({
      code: 'custom',
      path: ['cameraFocalMm'],
      message: 'must equal collimatorFocalMm: an Ebert–Fastie layout uses one mirror for both',
    });
  }
});

export const slitsSchema = section({
  entranceWidthUm: positive(0.001, 1_000_000, 'µm'),
  exitWidthUm: positive(0.001, 1_000_000, 'µm'),
  heightMm: positive(0.001, 100_000, 'mm'),
});

export const rangeSchema = section({
  startNm: wavelengthNm(),
  endNm: wavelengthNm(),
}).superRefine((range, ctx) => {
  if (range.endNm <= range.startNm) {
    ctx.addIssue({ code: 'custom', path: ['endNm'], message: 'must be greater than range.startNm' });
  }
});

export const sourceSchema = section({
  minNm: wavelengthNm(),
  maxNm: wavelengthNm(),
}).superRefine((source, ctx) => {
  if (source.maxNm <= source.minNm) {
    ctx.addIssue({ code: 'custom', path: ['maxNm'], message: 'must be greater than source.minNm' });
  }
});

export const detectorSchema = section({
  pixelPitchUm: positive(0.001, 100_000, 'µm'),
  pixelCount: number()
    .int({ error: 'must be a whole number' })
    .min(1, { error: 'must be at least 1' })
    .max(10_000_000, { error: 'must be at most 10000000' }),
});

/**
 * A grating monochromator or spectrograph design as stored: each field in its bounds. Answers that
 * read saved versions back use it, so a version saved before a physical limit was added still
 * opens (the workbench and the solver's warnings then say what is wrong with it).
 */
export const storedDesignSchema = section({
  grating: gratingSchema,
  layout: layoutSchema,
  slits: slitsSchema,
  range: rangeSchema,
  /** What the light source emits; used to find other orders landing on the same angle. */
  source: sourceSchema.optional(),
  detector: detectorSchema.optional(),
  /** What the instrument must do (shared/requirements.ts); checked, never used to compute. */
  requirements: requirementsSchema.optional(),
  /** Order-sorting filters and where each is in the beam (shared/filters.ts). */
  filters: filtersSchema.optional(),
  /** How light reaches the entrance slit (shared/light-input.ts); matched to the instrument when absent. */
  input: lightInputSchema.optional(),
  /** Measured curves the design's light budget uses (shared/curves.ts), each with its own points. */
  curves: curvesSchema.optional(),
});

/**
 * Refuses designs no grating can be. Kept apart from the fields' own checks so that what was saved
 * before a limit existed still reads back (`storedDesignSchema`) while nothing new crosses it.
 * Checks between fields run only once each field passed its own check: one wrong number, one message.
 */
function refusePhysicallyImpossible(design: z.infer<typeof storedDesignSchema>, ctx: z.RefinementCtx): void {
  const { grating, layout } = design;
  if (isPositive(grating.grooveDensityPerMm) && isPositive(grating.ruledWidthMm)) {
    const spacingNm = 1e6 / grating.grooveDensityPerMm;
    // First-order Littrow blaze λ_B = 2d sin θ_B, θ_B < 90°: no facet angle blazes at 2d or beyond
    // (Palmer & Loewen, Diffraction Grating Handbook, ch. 9).
    if (isPositive(grating.blazeWavelengthNm) && grating.blazeWavelengthNm >= 2 * spacingNm) {
      ctx.addIssue({
        code: 'custom',
        path: ['grating', 'blazeWavelengthNm'],
        message:
          `must be less than twice the groove spacing (${formatNumber(2 * spacingNm)} nm at ` +
          `${formatNumber(grating.grooveDensityPerMm)} grooves/mm): a first-order Littrow blaze is 2d·sin θ_B, ` +
          'and no facet angle reaches 2d',
      });
    }
    const grooves = grating.grooveDensityPerMm * grating.ruledWidthMm;
    if (grooves < PHYSICAL_LIMITS.minGrooves) {
      ctx.addIssue({
        code: 'custom',
        path: ['grating', 'grooveDensityPerMm'],
        message:
          `puts only ${formatNumber(grooves, 3)} grooves across the ${formatNumber(grating.ruledWidthMm)} mm ` +
          `ruled width: a grating needs at least ${PHYSICAL_LIMITS.minGrooves} to diffract (raise the groove ` +
          'density or the ruled width)',
      });
    }
  }
  // Along the slit the beam is as tall as the ruled height whatever the grating angle, so
  // focal length / ruled height is an f-number no mirror or lens can go below.
  if (!isPositive(grating.ruledHeightMm)) return;
  for (const [field, focalMm] of [
    ['collimatorFocalMm', layout.collimatorFocalMm],
    ['cameraFocalMm', layout.cameraFocalMm],
  ] as const) {
    const fNumber = focalMm / grating.ruledHeightMm;
    if (isPositive(focalMm) && fNumber < PHYSICAL_LIMITS.minFNumber) {
      ctx.addIssue({
        code: 'custom',
        path: ['layout', field],
        message:
          `makes the beam f/${formatNumber(fNumber, 3)} over the ${formatNumber(grating.ruledHeightMm)} mm ` +
          `ruled height: no mirror or lens is faster than f/${PHYSICAL_LIMITS.minFNumber} (sine condition), so ` +
          `use at least ${formatNumber(PHYSICAL_LIMITS.minFNumber * grating.ruledHeightMm)} mm`,
      });
    }
  }
}

/**
 * A design as it comes in (solve calls, saves, new notebooks, the workbench): every field in its
 * bounds and nothing physically impossible (`PHYSICAL_LIMITS`).
 */
export const designSchema = storedDesignSchema.superRefine(refusePhysicallyImpossible);

export type Design = z.infer<typeof designSchema>;

export { MAX_SOLVE_WAVELENGTHS, MIN_SOLVE_POINTS } from './solve-limits';

const POINTS_MESSAGE = `must be a whole number from ${MIN_SOLVE_POINTS} to ${MAX_SOLVE_WAVELENGTHS}`;

/**
 * Body of a solve call (HTTP and scripts): a design and optionally where to evaluate it. The
 * caps bound one call's work and answer (see shared/solve-limits.ts); zod checks the length of
 * `at` before its items, so an oversized list is refused without checking each one.
 */
export const solveRequestSchema = z.object({
  design: designSchema,
  at: z
    .array(wavelengthNm(), { error: 'must be a list of wavelengths in nm' })
    .max(MAX_SOLVE_WAVELENGTHS, { error: `must list at most ${MAX_SOLVE_WAVELENGTHS} wavelengths` })
    .optional(),
  points: number()
    .int({ error: POINTS_MESSAGE })
    .min(MIN_SOLVE_POINTS, { error: POINTS_MESSAGE })
    .max(MAX_SOLVE_WAVELENGTHS, { error: POINTS_MESSAGE })
    .optional(),
});

export type SolveRequest = z.infer<typeof solveRequestSchema>;

/** The example design of the solver's spec: a 0.3 m Czerny–Turner with a 1200 g/mm grating. */
export const exampleDesign: Design = {
  grating: {
    grooveDensityPerMm: 1200,
    order: 1,
    blazeWavelengthNm: 500,
    ruledWidthMm: 50,
    ruledHeightMm: 50,
  },
  layout: {
    kind: 'czerny-turner',
    deviationAngleDeg: 30,
    collimatorFocalMm: 300,
    cameraFocalMm: 300,
    collimatorOffAxisDeg: 8,
    cameraOffAxisDeg: 10,
  },
  slits: { entranceWidthUm: 100, exitWidthUm: 100, heightMm: 10 },
  range: { startNm: 300, endNm: 900 },
  source: { minNm: 200, maxNm: 1100 },
  detector: { pixelPitchUm: 25, pixelCount: 1024 },
};
