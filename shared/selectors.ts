import { z } from 'zod';
import { number, section } from './schema-words';

/**
 * The simpler wavelength selectors' calculators: `POST /api/selectors`,
 * `npm run --silent selectors -- input.json` and the selectors screens take these inputs
 * (discriminated by `kind`) and give the answers typed below. The maths is in
 * features/solver/ (fabry-perot.ts, absorption.ts, prism.ts, sellmeier.ts).
 */

/** Bounds on one call: every list is short enough that an answer stays small. */
export const SELECTOR_LIMITS = {
  /** Wavelengths evaluated in one call (prism, absorption stack). */
  maxWavelengths: 1000,
  /** Tilt angles in one interference-filter call. */
  maxTilts: 181,
  /** Filters in one absorption stack. */
  maxStackFilters: 10,
  /** Transmission peaks listed for one interference filter (`peakCount` says how many there are). */
  maxListedPeaks: 200,
  /** Terms of a user-entered Sellmeier formula. */
  maxSellmeierTerms: 6,
} as const;

export const PRISM_MATERIAL_IDS = ['fused-silica', 'calcium-fluoride', 'borosilicate-crown'] as const;
export type PrismMaterialId = (typeof PRISM_MATERIAL_IDS)[number];

export const ABSORPTION_SHAPES = ['long-pass', 'band-pass'] as const;

const positive = (max: number, unitWords: string) =>
  number()
    .gt(0, { error: 'must be greater than 0' })
    .max(max, { error: `must be at most ${max}${unitWords ? ` ${unitWords}` : ''}` });

/** The design's own bounds (0.001 nm to 10 mm): a range from 1e-320 nm would hold every order at once. */
const wavelengthNm = () => positive(10_000_000, 'nm').min(0.001, { error: 'must be at least 0.001 nm' });

const fraction = (words: string) =>
  number()
    .gt(0, { error: `must be greater than 0 (${words})` })
    .lt(1, { error: `must be less than 1 (${words})` });

const wavelengthList = () =>
  z
    .array(wavelengthNm(), { error: 'must be a list of wavelengths in nm' })
    .min(1, { error: 'must list at least one wavelength' })
    .max(SELECTOR_LIMITS.maxWavelengths, {
      error: `must list at most ${SELECTOR_LIMITS.maxWavelengths} wavelengths`,
    });

const rangeNmSchema = section({ startNm: wavelengthNm(), endNm: wavelengthNm() }).superRefine((range, ctx) => {
  if (typeof range.startNm === 'number' && typeof range.endNm === 'number' && !(range.endNm > range.startNm)) {
    ctx.addIssue({ code: 'custom', path: ['endNm'], message: 'must be greater than startNm' });
  }
});

const refractiveIndex = () =>
  number()
    .min(1, { error: 'must be at least 1' })
    .max(5, { error: 'must be at most 5' });

/** A Fabry–Pérot interference filter designed for normal incidence (Hecht, Optics, §9.6). */
export const interferenceFilterInputSchema = section({
  kind: z.literal('interference-filter'),
  /** Peak wavelength at normal incidence, nm. */
  targetNm: wavelengthNm(),
  /** Interference order m of the spacer, 1…1000. */
  order: number()
    .int({ error: 'must be a whole number from 1 to 1000' })
    .min(1, { error: 'must be a whole number from 1 to 1000' })
    .max(1000, { error: 'must be a whole number from 1 to 1000' }),
  spacerIndex: refractiveIndex(),
  /** Reflectance R of each mirror, a fraction between 0 and 1. */
  mirrorReflectance: fraction('a fraction: 0.9 means 90 %'),
  /** n_eff of the tilt-tuning formula; the spacer index when left out. */
  effectiveIndex: refractiveIndex().optional(),
  /** Tilt angles to tune to, degrees from the normal, 0 up to 89. */
  tiltsDeg: z
    .array(number().min(0, { error: 'must be at least 0°' }).max(89, { error: 'must be at most 89°' }), {
      error: 'must be a list of angles in degrees',
    })
    .max(SELECTOR_LIMITS.maxTilts, { error: `must list at most ${SELECTOR_LIMITS.maxTilts} angles` })
    .optional(),
  /** Where to list every transmission peak (and warn about the ones that are not the target). */
  rangeNm: rangeNmSchema,
});
export type InterferenceFilterInput = z.infer<typeof interferenceFilterInputSchema>;

/**
 * One coloured-glass filter: a parametric edge at a reference thickness (`internal transmittance`
 * excludes the surface reflections), used at `thicknessMm`.
 */
export const absorptionFilterSchema = section({
  shape: z.enum(ABSORPTION_SHAPES, {
    error: (issue) => (issue.input === undefined ? 'is required' : 'must be long-pass or band-pass'),
  }),
  /** Long-pass: the 50 % point of the rising edge (at the reference thickness); band-pass: the rising edge. */
  edgeNm: wavelengthNm(),
  /** Band-pass only: the 50 % point of the falling edge, nm. */
  upperEdgeNm: wavelengthNm().optional(),
  /** 10 %–90 % width of each edge at the reference thickness, nm. */
  edgeWidthNm: positive(1_000_000, 'nm'),
  /** Internal transmittance on the plateau at the reference thickness, above 0 and at most 1. */
  peakInternalTransmission: number()
    .gt(0, { error: 'must be greater than 0 (a fraction: 0.9 means 90 %)' })
    .max(1, { error: 'must be at most 1 (a fraction: 0.9 means 90 %)' }),
  referenceThicknessMm: positive(1000, 'mm'),
  thicknessMm: positive(1000, 'mm'),
  refractiveIndex: refractiveIndex(),
}).superRefine((filter, ctx) => {
  if (filter.shape === 'band-pass') {
    if (filter.upperEdgeNm === undefined) {
      ctx.addIssue({ code: 'custom', path: ['upperEdgeNm'], message: 'is required for a band-pass filter' });
    } else if (typeof filter.edgeNm === 'number' && !(filter.upperEdgeNm > filter.edgeNm)) {
      ctx.addIssue({ code: 'custom', path: ['upperEdgeNm'], message: 'must be greater than edgeNm' });
    }
  } else if (filter.upperEdgeNm !== undefined) {
    ctx.addIssue({ code: 'custom', path: ['upperEdgeNm'], message: 'applies to band-pass filters only' });
  }
});
export type AbsorptionFilter = z.infer<typeof absorptionFilterSchema>;

export const absorptionStackInputSchema = section({
  kind: z.literal('absorption-stack'),
  filters: z
    .array(absorptionFilterSchema, { error: 'must be a list of filters' })
    .min(1, { error: 'must list at least one filter' })
    .max(SELECTOR_LIMITS.maxStackFilters, { error: `must list at most ${SELECTOR_LIMITS.maxStackFilters} filters` }),
  wavelengthsNm: wavelengthList(),
});
export type AbsorptionStackInput = z.infer<typeof absorptionStackInputSchema>;

const sellmeierList = (words: string) =>
  z
    .array(number(), { error: `must be a list of ${words}` })
    .min(1, { error: `must list at least one of the ${words}` })
    .max(SELECTOR_LIMITS.maxSellmeierTerms, {
      error: `must list at most ${SELECTOR_LIMITS.maxSellmeierTerms} ${words}`,
    });

/**
 * `n² − 1 = Σ B_i λ² / (λ² − C_i²)`, λ and C_i (resonance wavelengths) in µm, as Malitson writes it.
 */
export const sellmeierSchema = section({
  B: sellmeierList('coefficients B'),
  C: sellmeierList('resonance wavelengths C in µm'),
}).superRefine((formula, ctx) => {
  if (Array.isArray(formula.B) && Array.isArray(formula.C) && formula.B.length !== formula.C.length) {
    ctx.addIssue({ code: 'custom', path: ['C'], message: 'must list as many resonance wavelengths as B has coefficients' });
  }
  formula.B?.forEach((b, i) => {
    if (typeof b === 'number' && !(Math.abs(b) <= 100)) {
      ctx.addIssue({ code: 'custom', path: ['B', i], message: 'must be between -100 and 100' });
    }
  });
  formula.C?.forEach((c, i) => {
    if (typeof c === 'number' && !(c >= 0 && c <= 10_000)) {
      ctx.addIssue({ code: 'custom', path: ['C', i], message: 'must be from 0 to 10000 µm' });
    }
  });
});
export type SellmeierFormula = z.infer<typeof sellmeierSchema>;

export const prismMaterialSchema = z.union(
  [
    z.enum(PRISM_MATERIAL_IDS),
    z.strictObject({ sellmeier: sellmeierSchema }),
  ],
  { error: `must be one of ${PRISM_MATERIAL_IDS.join(', ')}, or { "sellmeier": { "B": [..], "C": [..] } }` },
);
export type PrismMaterial = z.infer<typeof prismMaterialSchema>;

export const prismInputSchema = section({
  kind: z.literal('prism'),
  material: prismMaterialSchema,
  /** Apex (refracting) angle, degrees, above 0 and below 180. */
  apexDeg: number().gt(0, { error: 'must be greater than 0°' }).lt(180, { error: 'must be less than 180°' }),
  /** Base length b, mm: the longest glass path, which sets the resolving power b·|dn/dλ|. */
  baseMm: positive(100_000, 'mm'),
  wavelengthsNm: wavelengthList(),
  /** Optional monochromator around the prism: with all four, each point gains `bandpassNm`. */
  collimatorFocalMm: positive(10_000_000, 'mm').optional(),
  cameraFocalMm: positive(10_000_000, 'mm').optional(),
  entranceWidthUm: positive(1_000_000, 'µm').optional(),
  exitWidthUm: positive(1_000_000, 'µm').optional(),
});
export type PrismInput = z.infer<typeof prismInputSchema>;

export const SELECTOR_KINDS = ['interference-filter', 'absorption-stack', 'prism'] as const;

/** Body of `POST /api/selectors` and the selectors script's input file. */
export const selectorInputSchema = z.discriminatedUnion(
  'kind',
  [interferenceFilterInputSchema, absorptionStackInputSchema, prismInputSchema],
  { error: `must have a kind: one of ${SELECTOR_KINDS.join(', ')}` },
);
export type SelectorInput = z.infer<typeof selectorInputSchema>;

/** A problem with an answer in plain words, and what to do about it. */
export interface SelectorWarning {
  code: string;
  message: string;
}

export interface InterferenceFilterAnswer {
  kind: 'interference-filter';
  /** Physical spacer thickness `t = mλ/(2n)` at normal incidence, nm. */
  spacerThicknessNm: number;
  /** Every transmission peak `λ_k = 2nt/k` inside `rangeNm`, ascending (at most 200 listed). */
  peaksNm: number[];
  peakCount: number;
  peaksTruncated: boolean;
  /** Reflecting finesse `π√R/(1 − R)`. */
  finesse: number;
  /** Free spectral range at the target, `λ/m`, nm. */
  freeSpectralRangeNm: number;
  /** FSR / finesse, nm. */
  fwhmNm: number;
  /** `λ(θ) = λ₀ √(1 − (sin θ / n_eff)²)` at each requested tilt. */
  tilt: { tiltDeg: number; peakNm: number }[];
  warnings: SelectorWarning[];
}

export interface AbsorptionStackAnswer {
  kind: 'absorption-stack';
  points: { wavelengthNm: number; transmission: number }[];
  /** Highest stack transmission among the points. */
  peakTransmission: number;
  warnings: SelectorWarning[];
}

export interface PrismPoint {
  wavelengthNm: number;
  /** Null with `reason` where the formula has no real index or the prism cannot pass light. */
  index: number | null;
  dnDlambdaPerNm: number | null;
  minDeviationDeg: number | null;
  angularDispersionDegPerNm: number | null;
  /** `b |dn/dλ|` (Born & Wolf; Hecht). */
  resolvingPower: number | null;
  /** With the optional focal lengths and slits; otherwise null. */
  bandpassNm: number | null;
  reason: string | null;
}

export interface PrismAnswer {
  kind: 'prism';
  material: { id: PrismMaterialId | 'custom'; label: string; source: string; validFromNm: number | null; validToNm: number | null };
  points: PrismPoint[];
  warnings: SelectorWarning[];
}

export type SelectorAnswer = InterferenceFilterAnswer | AbsorptionStackAnswer | PrismAnswer;
