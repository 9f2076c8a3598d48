/**
 * Trade study: the design's grating against three simpler wavelength selectors — a prism
 * monochromator, a Fabry–Pérot interference filter tuned by tilt, and a band-pass coloured glass —
 * over the design's own range, with a verdict per requirement for each.
 *
 * Every figure comes from the one-concept functions (evaluate.ts for the grating, prism.ts,
 * fabry-perot.ts, absorption.ts); this file only chooses the stand-in selectors and states why.
 * Peak transmissions are scalar estimates: each says what it multiplies and what it leaves out.
 * Each default below carries its basis — a source, "common practice" or "from memory" — and the
 * same words go into the answer (`assumptions`) so the card and the sheet print them.
 */

import type { Design } from '../../shared/design';
import { layoutKindOptions } from '../../shared/design-fields';
import { formatInteger, formatNumber, formatPercent, formatQuantity, keepTogether } from '../../shared/format';
import { REQUIREMENT_IDS, type Footprint, type RequirementId, type Requirements } from '../../shared/requirements';
import { PRISM_MATERIAL_IDS, type PrismMaterial } from '../../shared/selectors';
import { airyTransmission, fabryPerotFwhmNm, fabryPerotPeaksNm, reflectingFinesse, spacerThicknessNm, tiltedPeakNm } from './fabry-perot';
import { absorptionFilterTransmission, surfaceReflectance } from './absorption';
import { DEFAULT_POINTS, evaluateDesign, sweepWavelengthsNm } from './evaluate';
import { degToRad } from './math';
import { prismPoint } from './prism';
import { freeSpectralRangeNm, resolvingPower } from './resolving-power';
import type { WavelengthPoint } from './results';
import { resolvePrismMaterial } from './sellmeier';

export const TRADE_SELECTOR_IDS = ['grating', 'prism', 'interference-filter', 'coloured-glass'] as const;
export type TradeSelectorId = (typeof TRADE_SELECTOR_IDS)[number];

/** The prism monochromator put in the grating's place: same mirrors and slits. */
export interface PrismStudyOptions {
  material: PrismMaterial;
  apexDeg: number;
  /** Base length b, mm; null means the grating's ruled width, so the two beams are about as wide. */
  baseMm: number | null;
}

/** One Fabry–Pérot filter design, used at every wavelength of the range (tuned by tilt or swapped). */
export interface InterferenceStudyOptions {
  order: number;
  spacerIndex: number;
  mirrorReflectance: number;
  maxTiltDeg: number;
  diameterMm: number;
}

/** One band-pass coloured glass, as many side by side as it takes to span the range. */
export interface ColouredGlassStudyOptions {
  /** Width between the half-transmission points, nm. */
  widthNm: number;
  /** 10–90 % width of each edge, nm. */
  edgeWidthNm: number;
  peakInternalTransmission: number;
  thicknessMm: number;
  refractiveIndex: number;
  diameterMm: number;
}

export interface TradeStudyOptions {
  /** Evenly spaced wavelengths over the range, ends included (the solver's sweep bounds apply). */
  points: number;
  /** Reflectance of each aluminium surface: the two mirror passes, and the grating's coating. */
  mirrorReflectance: number;
  prism: PrismStudyOptions;
  interferenceFilter: InterferenceStudyOptions;
  colouredGlass: ColouredGlassStudyOptions;
  /**
   * The grating mount's outline as the sketch places it (features/requirements `designFootprintMm`),
   * for the footprint verdict; null leaves the grating's footprint not checked. The solver cannot
   * draw the sketch itself, so callers that can pass it in.
   */
  gratingFootprintMm: Footprint | null;
}

/** What a caller may override: any field of any group. */
export type TradeStudyOverrides = {
  points?: number;
  mirrorReflectance?: number;
  prism?: Partial<PrismStudyOptions>;
  interferenceFilter?: Partial<InterferenceStudyOptions>;
  colouredGlass?: Partial<ColouredGlassStudyOptions>;
  gratingFootprintMm?: Footprint | null;
};

export const DEFAULT_TRADE_STUDY_OPTIONS: TradeStudyOptions = {
  // The solver's own default sweep, as the requirement checks use: the grating's verdicts here
  // then agree with the Requirements card's.
  points: DEFAULT_POINTS,
  // Aluminium in the visible reflects about 90 % (common practice; from memory 88–92 % for
  // protected aluminium at 550 nm).
  mirrorReflectance: 0.9,
  prism: {
    // Fused silica: transparent from about 210 nm into the infrared, with a published Sellmeier
    // fit (Malitson 1965); 60° is the usual dispersing prism (common practice).
    material: 'fused-silica',
    apexDeg: 60,
    baseMm: null,
  },
  interferenceFilter: {
    // A first-order cavity has the widest free spectral range, so the fewest other peaks.
    order: 1,
    // A silica spacer (n ≈ 1.45, from memory); a high-index spacer (about 2) tunes about half as far.
    spacerIndex: 1.45,
    // With R = 0.95 the finesse is about 61, so a first-order filter at 500 nm is about 8 nm wide:
    // the ~10 nm of stock visible band-pass filters (from memory).
    mirrorReflectance: 0.95,
    // Beyond about 15–20° a filter's passband broadens and splits by polarisation (from memory).
    maxTiltDeg: 20,
    // 25 mm is a common stock diameter (common practice; 12.5 and 50 mm are the others).
    diameterMm: 25,
  },
  colouredGlass: {
    // Band-pass coloured glasses are broad: about 100 nm or more between half-transmission points (from memory).
    widthNm: 100,
    edgeWidthNm: 30,
    // Plateau internal transmittance of a band-pass glass at its stock thickness, about 85 % (from memory).
    peakInternalTransmission: 0.85,
    // 3 mm is a common stock thickness (from memory); used at it, so Beer–Lambert scaling is 1.
    thicknessMm: 3,
    // Coloured glasses are crown-like, n ≈ 1.52 (from memory).
    refractiveIndex: 1.52,
    diameterMm: 25,
  },
  gratingFootprintMm: null,
};

/** Reflections in each monochromator: collimator and camera (one mirror used twice in Ebert–Fastie and Littrow). */
export const MIRROR_REFLECTIONS = 2;

/** Coloured glass is made for roughly this span (from memory); outside it there is no glass of this kind. */
const COLOURED_GLASS_SPAN_NM = { fromNm: 250, toNm: 3000 } as const;

export type TradeVerdictStatus = 'pass' | 'fail' | 'not-checked';

/** Printed and shown beside every verdict, so it never rests on colour alone. */
export const TRADE_VERDICT_WORDS: Readonly<Record<TradeVerdictStatus, string>> = {
  pass: 'Pass',
  fail: 'Fail',
  'not-checked': 'Not checked',
};

export interface TradeVerdict {
  status: TradeVerdictStatus;
  /** Plain words: the worst figure and where, or why it is not checked. */
  message: string;
}

export type TradeVerdictId =
  | 'coverage'
  | 'maxBandpassNm'
  | 'minResolvingPower'
  | 'orderOverlap'
  | 'maxFNumber'
  | 'maxFocalLengthMm'
  | 'maxFootprintMm';

export interface TradeVerdictRow {
  id: TradeVerdictId;
  /** "Bandpass", "Covers the range". */
  title: string;
  /** The limit in words: "≤ 0.5 nm", "whole range with one selector". */
  limitText: string;
  verdicts: Record<TradeSelectorId, TradeVerdict>;
}

/** One selector's side of the study. Curves follow `TradeStudy.wavelengthsNm`. */
export interface SelectorStudy {
  id: TradeSelectorId;
  /** Short name for plots and table headers. */
  label: string;
  /** What stands in for this selector, in one sentence. */
  setup: string;
  /** FWHM passband at each wavelength, nm; null where the selector gives none (with a note). */
  bandpassNm: (number | null)[];
  /** λ / FWHM (the monochromators: slit and diffraction widths in quadrature). */
  resolvingPower: (number | null)[];
  /** Smallest and largest bandpass over the range; null when there is none. */
  bandpassSpanNm: [number, number] | null;
  resolvingPowerSpan: [number, number] | null;
  /** A scalar estimate, 0…1; null when the selector cannot say (a grating without a blaze). */
  peakTransmission: number | null;
  /** What the estimate multiplies and leaves out. */
  peakTransmissionBasis: string;
  /** How it is tuned across the range, in words. */
  tunability: string;
  /** How many of these it takes to cover the range (1 for a monochromator that reaches it all); null when unknown. */
  unitsToCover: number | null;
  /** Whether other orders (or cavity peaks) fall on the working wavelength somewhere in the range. */
  hasOverlappingOrders: boolean;
  overlappingOrders: string;
  size: string;
  /** A few words each for a table cell: peak transmission, tuning, overlapping orders and size. */
  brief: { peak: string; tuning: string; overlaps: string; size: string };
  notes: string[];
}

export interface TradeStudy {
  wavelengthsNm: number[];
  selectors: SelectorStudy[];
  /** One row per comparable requirement present (after a "covers the range" row); empty without requirements. */
  verdicts: TradeVerdictRow[];
  /** Stated requirements that only a grating has (blaze efficiency…): judged in the requirements check. */
  gratingOnly: RequirementId[];
  /** "No requirements are set…" or where the verdicts were judged. */
  verdictNote: string;
  /** Each default and its basis, in words. */
  assumptions: string[];
  options: TradeStudyOptions;
}

// Options ----------------------------------------------------------------------------------------

/** Merge overrides onto the defaults, group by group. */
export function resolveTradeStudyOptions(overrides: TradeStudyOverrides = {}): TradeStudyOptions {
  const d = DEFAULT_TRADE_STUDY_OPTIONS;
  return {
    points: overrides.points ?? d.points,
    mirrorReflectance: overrides.mirrorReflectance ?? d.mirrorReflectance,
    prism: { ...d.prism, ...overrides.prism },
    interferenceFilter: { ...d.interferenceFilter, ...overrides.interferenceFilter },
    colouredGlass: { ...d.colouredGlass, ...overrides.colouredGlass },
    gratingFootprintMm: overrides.gratingFootprintMm === undefined ? d.gratingFootprintMm : overrides.gratingFootprintMm,
  };
}

const finitePositive = (v: number) => typeof v === 'number' && Number.isFinite(v) && v > 0;
const fraction = (v: number) => typeof v === 'number' && v > 0 && v < 1;

/**
 * What is wrong with the options, as `{ path: message }` (empty when nothing is): the card shows
 * each under its field, and `tradeStudy` refuses options with any.
 */
export function tradeStudyOptionIssues(options: TradeStudyOptions): Record<string, string> {
  const issues: Record<string, string> = {};
  const { prism, interferenceFilter: fp, colouredGlass: glass } = options;
  if (!(Number.isInteger(options.points) && options.points >= 2 && options.points <= 1000)) {
    issues.points = 'must be a whole number from 2 to 1000';
  }
  if (!fraction(options.mirrorReflectance)) issues.mirrorReflectance = 'must be between 0 and 1 (0.9 means 90 %)';
  if (typeof prism.material === 'string' && !(PRISM_MATERIAL_IDS as readonly string[]).includes(prism.material)) {
    issues['prism.material'] = `must be one of ${PRISM_MATERIAL_IDS.join(', ')}`;
  }
  if (!(prism.apexDeg > 0 && prism.apexDeg < 180)) issues['prism.apexDeg'] = 'must be greater than 0° and less than 180°';
  if (prism.baseMm !== null && !(finitePositive(prism.baseMm) && prism.baseMm <= 100_000)) {
    issues['prism.baseMm'] = 'must be greater than 0 and at most 100000 mm';
  }
  if (!(Number.isInteger(fp.order) && fp.order >= 1 && fp.order <= 1000)) {
    issues['interferenceFilter.order'] = 'must be a whole number from 1 to 1000';
  }
  if (!(fp.spacerIndex >= 1 && fp.spacerIndex <= 5)) issues['interferenceFilter.spacerIndex'] = 'must be from 1 to 5';
  if (!fraction(fp.mirrorReflectance)) {
    issues['interferenceFilter.mirrorReflectance'] = 'must be between 0 and 1 (0.95 means 95 %)';
  }
  if (!(fp.maxTiltDeg >= 0 && fp.maxTiltDeg <= 89)) issues['interferenceFilter.maxTiltDeg'] = 'must be from 0° to 89°';
  if (!finitePositive(fp.diameterMm)) issues['interferenceFilter.diameterMm'] = 'must be greater than 0 mm';
  if (!finitePositive(glass.widthNm)) issues['colouredGlass.widthNm'] = 'must be greater than 0 nm';
  if (!(glass.edgeWidthNm >= 0 && Number.isFinite(glass.edgeWidthNm))) issues['colouredGlass.edgeWidthNm'] = 'must be at least 0 nm';
  if (!(glass.peakInternalTransmission > 0 && glass.peakInternalTransmission <= 1)) {
    issues['colouredGlass.peakInternalTransmission'] = 'must be greater than 0 and at most 1';
  }
  if (!finitePositive(glass.thicknessMm)) issues['colouredGlass.thicknessMm'] = 'must be greater than 0 mm';
  if (!(glass.refractiveIndex >= 1 && glass.refractiveIndex <= 5)) issues['colouredGlass.refractiveIndex'] = 'must be from 1 to 5';
  if (!finitePositive(glass.diameterMm)) issues['colouredGlass.diameterMm'] = 'must be greater than 0 mm';
  const footprint = options.gratingFootprintMm;
  if (footprint !== null && !(finitePositive(footprint.widthMm) && finitePositive(footprint.depthMm))) {
    issues.gratingFootprintMm = 'must have a width and depth greater than 0 mm';
  }
  return issues;
}

// Small helpers ----------------------------------------------------------------------------------

const nm = (value: number) => formatQuantity(value, 'nm');
const mm = (value: number) => formatQuantity(value, 'mm');
const pct = (value: number) => formatPercent(value);
const finiteOrNull = (value: number | null | undefined): number | null =>
  value !== null && value !== undefined && Number.isFinite(value) ? value : null;

function span(values: readonly (number | null)[]): [number, number] | null {
  let lo = Number.POSITIVE_INFINITY;
  let hi = Number.NEGATIVE_INFINITY;
  for (const v of values) {
    if (v === null) continue;
    if (v < lo) lo = v;
    if (v > hi) hi = v;
  }
  return lo <= hi ? [lo, hi] : null;
}

/** Contiguous runs of `flagged` among ascending wavelengths, as "300–420 nm, 800 nm". */
function runsText(wavelengthsNm: readonly number[], flagged: (i: number) => boolean): string {
  const runs: [number, number][] = [];
  let open: [number, number] | null = null;
  wavelengthsNm.forEach((w, i) => {
    if (flagged(i)) {
      if (open) open[1] = w;
      else open = [w, w];
    } else if (open) {
      runs.push(open);
      open = null;
    }
  });
  if (open) runs.push(open);
  const shown = runs.slice(0, 3).map(([a, b]) => (a === b ? nm(a) : `${formatNumber(a)}–${nm(b)}`));
  return runs.length > 3 ? `${shown.join(', ')} and ${runs.length - 3} more` : shown.join(', ');
}

/** The mount's name as the editor shows it ("Czerny–Turner"). */
function mountName(kind: Design['layout']['kind']): string {
  return layoutKindOptions.find((option) => option.value === kind)?.label ?? kind;
}

/** "f 300 mm", or "f 200/240 mm" when the collimator and camera differ; never broken across lines. */
function focalBrief(design: Design): string {
  const { collimatorFocalMm: a, cameraFocalMm: b } = design.layout;
  return keepTogether(a === b ? `f ${mm(a)}` : `f ${formatNumber(a)}/${mm(b)}`);
}

/** "≈ 73 %": an estimate, marked as one; "—" without. */
function estimateText(value: number | null): string {
  return value === null || !Number.isFinite(value) ? '—' : `≈\u00A0${formatPercent(value)}`;
}

// Each selector at a list of wavelengths ---------------------------------------------------------

interface Curves {
  bandpassNm: (number | null)[];
  resolvingPower: (number | null)[];
  /** Why a wavelength has no figure (the first such reason). */
  missing: string | null;
}

function gratingCurves(points: readonly WavelengthPoint[]): Curves {
  return {
    bandpassNm: points.map((p) => finiteOrNull(p.bandpassNm)),
    resolvingPower: points.map((p) => finiteOrNull(p.resolvingPower)),
    missing: points.find((p) => !p.reachable)?.reason ?? null,
  };
}

interface PrismSetup {
  sellmeier: ReturnType<typeof resolvePrismMaterial>['sellmeier'];
  apexRad: number;
  baseMm: number;
  mono: { collimatorFocalMm: number; cameraFocalMm: number; entranceWidthUm: number; exitWidthUm: number };
}

function prismSetup(design: Design, options: TradeStudyOptions): PrismSetup {
  const { layout, slits, grating } = design;
  return {
    sellmeier: resolvePrismMaterial(options.prism.material).sellmeier,
    apexRad: degToRad(options.prism.apexDeg),
    baseMm: options.prism.baseMm ?? grating.ruledWidthMm,
    mono: {
      collimatorFocalMm: layout.collimatorFocalMm,
      cameraFocalMm: layout.cameraFocalMm,
      entranceWidthUm: slits.entranceWidthUm,
      exitWidthUm: slits.exitWidthUm,
    },
  };
}

/**
 * The prism's delivered resolving power, `λ / √(bandpass² + (λ / b|dn/dλ|)²)`: the grating's rule
 * (slit and diffraction widths in quadrature, resolving-power.ts) with the prism's limit, so the
 * two curves compare like with like. `b|dn/dλ|` alone is in `prismPoint` (Born & Wolf, §4.7).
 */
function prismCurves(wavelengthsNm: readonly number[], setup: PrismSetup): Curves & { theoretical: (number | null)[] } {
  const bandpass: (number | null)[] = [];
  const power: (number | null)[] = [];
  const theoretical: (number | null)[] = [];
  let missing: string | null = null;
  for (const w of wavelengthsNm) {
    const p = prismPoint(setup.sellmeier, setup.apexRad, setup.baseMm, w, setup.mono);
    const limit = finiteOrNull(p.resolvingPower);
    const bp = finiteOrNull(p.bandpassNm);
    theoretical.push(limit);
    bandpass.push(bp);
    power.push(bp !== null && limit !== null && limit > 0 ? finiteOrNull(resolvingPower(w, bp, w / limit)) : null);
    if (p.reason && missing === null) missing = p.reason;
  }
  return { bandpassNm: bandpass, resolvingPower: power, theoretical, missing };
}

/** A filter tuned to λ: FWHM = FSR / finesse with FSR = λ/m (Hecht, Optics, §9.6), so R = λ/FWHM = m × finesse. */
function interferenceCurves(wavelengthsNm: readonly number[], fp: InterferenceStudyOptions): Curves {
  const finesse = reflectingFinesse(fp.mirrorReflectance);
  const bandpass = wavelengthsNm.map((w) => finiteOrNull(fabryPerotFwhmNm(freeSpectralRangeNm(w, fp.order), finesse)));
  return {
    bandpassNm: bandpass,
    resolvingPower: wavelengthsNm.map((w, i) => {
      const b = bandpass[i];
      return b === null || b === undefined || !(b > 0) ? null : finiteOrNull(w / b);
    }),
    missing: null,
  };
}

function glassCurves(wavelengthsNm: readonly number[], glass: ColouredGlassStudyOptions): Curves {
  return {
    bandpassNm: wavelengthsNm.map(() => glass.widthNm),
    resolvingPower: wavelengthsNm.map((w) => finiteOrNull(w / glass.widthNm)),
    missing: null,
  };
}

/** Other peaks of a cavity tuned to each wavelength that also fall in the range (Hecht, Optics, §9.6). */
function otherCavityPeaks(wavelengthsNm: readonly number[], design: Design, fp: InterferenceStudyOptions): number[] {
  const { startNm, endNm } = design.range;
  return wavelengthsNm.map((w) => {
    const t = spacerThicknessNm(w, fp.order, fp.spacerIndex);
    const { peakCount } = fabryPerotPeaksNm(t, fp.spacerIndex, startNm, endNm, 0);
    return Math.max(0, peakCount - 1);
  });
}

// Selector summaries -----------------------------------------------------------------------------

interface Context {
  design: Design;
  options: TradeStudyOptions;
  wavelengthsNm: number[];
  gratingPoints: WavelengthPoint[];
  /** Long-pass filters in the solver's proposed order-sorting plan (order-sorting.ts). */
  orderSortingProposed: number;
  prism: PrismSetup;
  prismCurves: Curves & { theoretical: (number | null)[] };
  cavityPeaks: number[];
  /** How many tilt-tuned filters and glasses it takes (null when a filter cannot be tuned at all). */
  filtersToCover: number | null;
  glassesToCover: number;
  tiltFraction: number;
}

function gratingStudy(ctx: Context, summary: ReturnType<typeof evaluateDesign>['design']): SelectorStudy {
  const { design, options, gratingPoints } = ctx;
  const curves = gratingCurves(gratingPoints);
  const r = options.mirrorReflectance;
  const blazeValues = gratingPoints.map((p) => finiteOrNull(p.blazeEfficiency));
  const blazePeak = span(blazeValues)?.[1] ?? null;
  const peak = blazePeak === null ? null : blazePeak * r * r ** MIRROR_REFLECTIONS;
  const peakTransmissionBasis =
    blazePeak === null
      ? 'No blaze wavelength is given, so the scalar blaze efficiency is unknown.'
      : `Scalar blaze efficiency at its best in the range (${pct(blazePeak)}, relative to the blaze peak) × ` +
        `the grating's aluminium coating (${pct(r)}) × ${MIRROR_REFLECTIONS} mirror reflections at ${pct(r)} each ` +
        '(common practice); polarisation and groove shape are left out (Palmer & Loewen, ch. 9).';
  const overlapIdx = gratingPoints.map((p) => p.overlapCount > 0);
  const anyOverlap = overlapIdx.some(Boolean);
  const worst = gratingPoints.reduce((n, p) => Math.max(n, p.overlapCount), 0);
  const unblockedTotal = gratingPoints.reduce((total, p) => total + p.unblockedOverlapCount, 0);
  let overlapping = 'None in the range: no other order brings source light onto the working wavelength.';
  if (anyOverlap) {
    overlapping =
      `Other orders land on ${runsText(ctx.wavelengthsNm, (i) => overlapIdx[i]!)} (up to ${formatInteger(worst)} at once)` +
      (unblockedTotal === 0
        ? '; the design’s order-sorting filters block them all.'
        : `; ${ctx.orderSortingProposed > 0 ? `a plan of ${formatInteger(ctx.orderSortingProposed)} long-pass filter${ctx.orderSortingProposed === 1 ? '' : 's'} would block them` : 'order-sorting filters are needed'}.`);
  }
  const rot = [summary.gratingRotationStartDeg, summary.gratingRotationEndDeg];
  const reachable = gratingPoints.every((p) => p.reachable);
  const tunability =
    rot[0] !== null && rot[1] !== null
      ? `Continuous: the grating turns from ${formatNumber(rot[0], 4)}° to ${formatNumber(rot[1], 4)}° across the range.`
      : 'Continuous by turning the grating, but part of the range is unreachable in this mount.';
  const { layout, grating } = design;
  const footprint = options.gratingFootprintMm;
  const size =
    `Focal lengths ${formatNumber(layout.collimatorFocalMm)} / ${mm(layout.cameraFocalMm)}; grating ` +
    `${formatNumber(grating.ruledWidthMm)} × ${mm(grating.ruledHeightMm)}` +
    (footprint ? `; outline ${formatNumber(footprint.widthMm)} × ${mm(footprint.depthMm)} (width × depth, as sketched).` : '.');
  const notes: string[] = [];
  if (curves.missing) notes.push(curves.missing);
  return {
    id: 'grating',
    label: 'Grating',
    setup: `This design: ${formatNumber(grating.grooveDensityPerMm)}/mm in order ${grating.order}, ${mountName(layout.kind)} mount.`,
    bandpassNm: curves.bandpassNm,
    resolvingPower: curves.resolvingPower,
    bandpassSpanNm: span(curves.bandpassNm),
    resolvingPowerSpan: span(curves.resolvingPower),
    peakTransmission: finiteOrNull(peak),
    peakTransmissionBasis,
    tunability,
    unitsToCover: reachable ? 1 : null,
    hasOverlappingOrders: anyOverlap,
    overlappingOrders: overlapping,
    size,
    brief: {
      peak: estimateText(peak),
      tuning: reachable ? 'turn the grating' : 'turn the grating; part unreachable',
      overlaps: anyOverlap ? (unblockedTotal === 0 ? 'yes, all blocked' : 'yes: needs filters') : 'none',
      size: `${focalBrief(design)}; ${formatNumber(grating.ruledWidthMm)} × ${mm(grating.ruledHeightMm)} grating`,
    },
    notes,
  };
}

/** Width of the beam a prism passes at minimum deviation: face `L = b / (2 sin(A/2))`, beam `L cos i`, `sin i = n sin(A/2)` (Born & Wolf, §4.7). */
function prismBeamWidthMm(index: number, apexRad: number, baseMm: number): number | null {
  const s = index * Math.sin(apexRad / 2);
  if (!(s < 1)) return null;
  const faceMm = baseMm / (2 * Math.sin(apexRad / 2));
  return finiteOrNull(faceMm * Math.sqrt(1 - s * s));
}

function prismStudy(ctx: Context): SelectorStudy {
  const { design, options, prism, prismCurves: curves, wavelengthsNm } = ctx;
  const material = resolvePrismMaterial(options.prism.material);
  const r = options.mirrorReflectance;
  // Fresnel loss at the two faces: least where the index is lowest (the long end for normal dispersion).
  let best: { t: number; w: number; n: number } | null = null;
  const deviations: number[] = [];
  for (const w of wavelengthsNm) {
    const p = prismPoint(prism.sellmeier, prism.apexRad, prism.baseMm, w);
    if (p.index === null || p.minDeviationDeg === null) continue;
    deviations.push(p.minDeviationDeg);
    const surface = 1 - surfaceReflectance(p.index);
    const t = surface * surface;
    if (best === null || t > best.t) best = { t, w, n: p.index };
  }
  const peak = best === null ? null : best.t * r ** MIRROR_REFLECTIONS;
  const peakTransmissionBasis =
    best === null
      ? 'No light passes the prism anywhere in the range.'
      : `Two uncoated faces, each losing ((n − 1)/(n + 1))² = ${formatPercent(surfaceReflectance(best.n), { maximumFractionDigits: 1 })} at n = ${formatNumber(best.n, 5)} ` +
        `(${nm(best.w)}; Hecht, Optics, §4.6) × ${MIRROR_REFLECTIONS} mirror reflections at ${pct(r)} (common practice). ` +
        'Normal-incidence form: at minimum deviation the faces meet the beam near 45°, where unpolarised light loses somewhat more; ' +
        'absorption in the glass is left out.';
  const centreNm = (design.range.startNm + design.range.endNm) / 2;
  const centre = prismPoint(prism.sellmeier, prism.apexRad, prism.baseMm, centreNm);
  const beamMm = centre.index === null ? null : prismBeamWidthMm(centre.index, prism.apexRad, prism.baseMm);
  const faceMm = prism.baseMm / (2 * Math.sin(prism.apexRad / 2));
  const passes = curves.bandpassNm.every((b) => b !== null);
  const devSpan = span(deviations);
  const tunability =
    devSpan === null
      ? 'No light passes at this apex angle.'
      : `Continuous: the prism turns to keep minimum deviation, from ${formatNumber(devSpan[1], 4)}° to ${formatNumber(devSpan[0], 4)}° across the range.`;
  const notes: string[] = [];
  if (curves.missing) notes.push(curves.missing);
  const outside = material.validFromNm !== null && material.validToNm !== null &&
    (design.range.startNm < material.validFromNm || design.range.endNm > material.validToNm);
  if (outside) {
    notes.push(
      `${material.label}'s coefficients were fitted over ${formatNumber(material.validFromNm)}–${nm(material.validToNm!)}; ` +
        'outside it the index is extrapolated and the glass may absorb.',
    );
  }
  const theory = span(curves.theoretical);
  if (theory) {
    notes.push(
      `Diffraction-limited R = b|dn/dλ| (Born & Wolf, §4.7) runs from ${formatNumber(theory[0], 3)} to ${formatNumber(theory[1], 3)}; ` +
        'the slits set most of the bandpass, as for the grating.',
    );
  }
  return {
    id: 'prism',
    label: 'Prism',
    setup:
      `${material.label}, ${formatNumber(options.prism.apexDeg)}° apex, ${mm(prism.baseMm)} base` +
      `${options.prism.baseMm === null ? ' (the grating’s ruled width)' : ''}, with this design’s mirrors and slits.`,
    bandpassNm: curves.bandpassNm,
    resolvingPower: curves.resolvingPower,
    bandpassSpanNm: span(curves.bandpassNm),
    resolvingPowerSpan: span(curves.resolvingPower),
    peakTransmission: finiteOrNull(peak),
    peakTransmissionBasis,
    tunability,
    unitsToCover: passes ? 1 : null,
    hasOverlappingOrders: false,
    overlappingOrders: 'None: a prism has a single order.',
    brief: {
      peak: estimateText(peak),
      tuning: passes ? 'turn the prism' : 'turn the prism; no light in part',
      overlaps: 'none',
      size: `${focalBrief(design)}; ${mm(prism.baseMm)} base`,
    },
    size:
      `Same focal lengths as the design; prism faces ${mm(faceMm)}, base ${mm(prism.baseMm)}, ` +
      `${mm(design.grating.ruledHeightMm)} tall` + (beamMm === null ? '.' : `; beam ${mm(beamMm)} wide at the range centre.`),
    notes,
  };
}

function interferenceStudy(ctx: Context): SelectorStudy {
  const { design, options, wavelengthsNm, cavityPeaks, filtersToCover, tiltFraction } = ctx;
  const fp = options.interferenceFilter;
  const curves = interferenceCurves(wavelengthsNm, fp);
  const finesse = reflectingFinesse(fp.mirrorReflectance);
  const centreNm = (design.range.startNm + design.range.endNm) / 2;
  const peak = airyTransmission(centreNm, spacerThicknessNm(centreNm, fp.order, fp.spacerIndex), fp.spacerIndex, fp.mirrorReflectance);
  const withPeaks = cavityPeaks.map((n) => n > 0);
  const any = withPeaks.some(Boolean);
  const coverWords =
    filtersToCover === null
      ? 'A filter cannot be tuned with no tilt: one filter per wavelength.'
      : `Tilting up to ${formatNumber(fp.maxTiltDeg)}° moves a peak down by up to ${formatPercent(tiltFraction, { maximumFractionDigits: 1 })} ` +
        `(λ(θ) = λ₀√(1 − (sin θ/n)²), Hecht §9.6): ${formatInteger(filtersToCover)} filter${filtersToCover === 1 ? '' : 's'} cover the range.`;
  const next = fp.order === 1 ? 'λ/2' : `λ·${fp.order}/${fp.order + 1}`;
  return {
    id: 'interference-filter',
    label: 'Interference filter',
    setup:
      `A Fabry–Pérot cavity in order ${fp.order}, spacer n = ${formatNumber(fp.spacerIndex)}, mirrors R = ${pct(fp.mirrorReflectance)} ` +
      `(finesse ${formatNumber(finesse, 3)}), tuned by tilt.`,
    bandpassNm: curves.bandpassNm,
    resolvingPower: curves.resolvingPower,
    bandpassSpanNm: span(curves.bandpassNm),
    resolvingPowerSpan: span(curves.resolvingPower),
    peakTransmission: finiteOrNull(peak),
    peakTransmissionBasis:
      'Lossless Airy peak (Born & Wolf, §7.6): 1 for identical, lossless mirrors. Real all-dielectric filters with their ' +
      'blocking layers peak lower, often 40–90 % (from memory), and lower still when tilted.',
    tunability: coverWords,
    unitsToCover: filtersToCover,
    hasOverlappingOrders: any,
    brief: {
      peak: `${estimateText(peak)} (lossless)`,
      tuning: filtersToCover === null ? 'none (no tilt)' : `tilt ≤ ${formatNumber(fp.maxTiltDeg)}°: ${formatInteger(filtersToCover)} filter${filtersToCover === 1 ? '' : 's'}`,
      overlaps: any ? 'yes: needs blocking' : 'none',
      size: `${mm(fp.diameterMm)} each`,
    },
    overlappingOrders: any
      ? `Other cavity peaks (the next at ${next}) fall in the range for filters tuned to ${runsText(wavelengthsNm, (i) => withPeaks[i]!)}: ` +
        'those need a blocking filter.'
      : 'None in the range: each filter’s other peaks fall outside it.',
    size:
      `${mm(fp.diameterMm)} filters (stock size, common practice), ${filtersToCover === null ? 'one per wavelength' : `${formatInteger(filtersToCover)} of them`}, ` +
      'on a tilt mount in a near-collimated beam.',
    notes: [
      `FWHM = FSR / finesse with FSR = λ/m (Hecht, Optics, §9.6), so R = λ/FWHM = m × finesse = ${formatNumber(fp.order * finesse, 3)} everywhere; ` +
        'a tilted or converging beam broadens it.',
    ],
  };
}

function glassStudy(ctx: Context): SelectorStudy {
  const { design, options, wavelengthsNm, glassesToCover } = ctx;
  const glass = options.colouredGlass;
  const curves = glassCurves(wavelengthsNm, glass);
  const centreNm = (design.range.startNm + design.range.endNm) / 2;
  const filter = {
    shape: 'band-pass' as const,
    edgeNm: centreNm - glass.widthNm / 2,
    upperEdgeNm: centreNm + glass.widthNm / 2,
    edgeWidthNm: glass.edgeWidthNm,
    peakInternalTransmission: glass.peakInternalTransmission,
    referenceThicknessMm: glass.thicknessMm,
    thicknessMm: glass.thicknessMm,
    refractiveIndex: glass.refractiveIndex,
  };
  const peak = absorptionFilterTransmission(filter, centreNm);
  const notes: string[] = [];
  if (design.range.startNm < COLOURED_GLASS_SPAN_NM.fromNm || design.range.endNm > COLOURED_GLASS_SPAN_NM.toNm) {
    notes.push(
      `Coloured glass is made for roughly ${formatNumber(COLOURED_GLASS_SPAN_NM.fromNm)}–${nm(COLOURED_GLASS_SPAN_NM.toNm)} (from memory); ` +
        'part of this range lies outside it.',
    );
  }
  return {
    id: 'coloured-glass',
    label: 'Coloured glass',
    setup: `Band-pass coloured glasses ${nm(glass.widthNm)} wide between their half-transmission points, ${mm(glass.thicknessMm)} thick.`,
    bandpassNm: curves.bandpassNm,
    resolvingPower: curves.resolvingPower,
    bandpassSpanNm: span(curves.bandpassNm),
    resolvingPowerSpan: span(curves.resolvingPower),
    peakTransmission: finiteOrNull(peak),
    peakTransmissionBasis:
      `The parametric glass model's peak: plateau internal transmittance ${pct(glass.peakInternalTransmission)} (from memory) × ` +
      `two surfaces at n = ${formatNumber(glass.refractiveIndex)}, each losing ${formatPercent(surfaceReflectance(glass.refractiveIndex), { maximumFractionDigits: 1 })} (Hecht, Optics, §4.6).`,
    tunability: `None: fixed glasses, ${formatInteger(glassesToCover)} side by side to span the range, swapped by hand or on a wheel.`,
    unitsToCover: glassesToCover,
    hasOverlappingOrders: false,
    overlappingOrders: 'None: absorption has no orders.',
    brief: {
      peak: estimateText(peak),
      tuning: `fixed: ${formatInteger(glassesToCover)} glass${glassesToCover === 1 ? '' : 'es'}`,
      overlaps: 'none',
      size: `${mm(glass.diameterMm)} × ${mm(glass.thicknessMm)} each`,
    },
    size: `${mm(glass.diameterMm)} glasses, ${mm(glass.thicknessMm)} thick (stock sizes, from memory), ${formatInteger(glassesToCover)} of them.`,
    notes,
  };
}

// Verdicts ---------------------------------------------------------------------------------------

/** The comparable requirements, in `REQUIREMENT_IDS` order; the rest belong to the grating alone. */
const COMPARED: readonly RequirementId[] = ['maxBandpassNm', 'minResolvingPower', 'maxFNumber', 'maxFocalLengthMm', 'maxFootprintMm', 'orderOverlap'];

const pass = (message: string): TradeVerdict => ({ status: 'pass', message });
const fail = (message: string): TradeVerdict => ({ status: 'fail', message });
const notChecked = (message: string): TradeVerdict => ({ status: 'not-checked', message });

/** "24 % over", "12 % to spare": the requirement card's words for a margin. */
function marginWords(margin: number, kind: 'max' | 'min'): string {
  const abs = Math.abs(margin);
  const digits = abs >= 0.1 ? 0 : abs >= 0.01 ? 1 : 2;
  const text = formatPercent(abs, { maximumFractionDigits: digits });
  return margin >= 0 ? `${text} to spare` : `${text} ${kind === 'max' ? 'over' : 'short'}`;
}

/**
 * A per-wavelength limit over `values` at `wavelengthsNm`, judged as the requirement checks judge
 * the grating: a wavelength without a figure fails, and the worst figure and its margin are named.
 */
function curveVerdict(
  kind: 'max' | 'min',
  limit: number,
  wavelengthsNm: readonly number[],
  values: readonly (number | null)[],
  noun: string,
  format: (v: number) => string,
): TradeVerdict {
  const missing = wavelengthsNm.filter((_, i) => values[i] === null);
  let worst: number | null = null;
  let worstNm = 0;
  values.forEach((v, i) => {
    if (v === null) return;
    if (worst === null || (kind === 'max' ? v > worst : v < worst)) {
      worst = v;
      worstNm = wavelengthsNm[i]!;
    }
  });
  if (missing.length > 0) {
    return fail(`no ${noun} at ${runsText(wavelengthsNm, (i) => values[i] === null)}`);
  }
  if (worst === null) return notChecked(`no ${noun} to check`);
  const margin = kind === 'max' ? (limit - worst) / limit : (worst - limit) / limit;
  const ok = kind === 'max' ? worst <= limit : worst >= limit;
  const text = `${noun} ${format(worst)} at ${ok ? 'worst (' + nm(worstNm) + ')' : nm(worstNm)}, ${marginWords(margin, kind)}`;
  return ok ? pass(text) : fail(text);
}

function bySelector(make: (id: TradeSelectorId) => TradeVerdict): Record<TradeSelectorId, TradeVerdict> {
  return {
    grating: make('grating'),
    prism: make('prism'),
    'interference-filter': make('interference-filter'),
    'coloured-glass': make('coloured-glass'),
  };
}

function coverageRow(ctx: Context, studies: Record<TradeSelectorId, SelectorStudy>): TradeVerdictRow {
  const { design, gratingPoints, wavelengthsNm, options } = ctx;
  const unreachable = gratingPoints.map((p) => !p.reachable);
  const material = resolvePrismMaterial(options.prism.material);
  return {
    id: 'coverage',
    title: 'Covers the range',
    limitText: `${formatNumber(design.range.startNm)}–${nm(design.range.endNm)} with one selector`,
    verdicts: {
      grating: unreachable.some(Boolean)
        ? fail(`unreachable at ${runsText(wavelengthsNm, (i) => unreachable[i]!)}`)
        : pass('reaches the whole range by turning the grating'),
      prism: (() => {
        const dark = ctx.prismCurves.bandpassNm.map((b) => b === null);
        if (dark.some(Boolean)) return fail(`no light through the prism at ${runsText(wavelengthsNm, (i) => dark[i]!)}`);
        if (material.validFromNm !== null && material.validToNm !== null &&
          (design.range.startNm < material.validFromNm || design.range.endNm > material.validToNm)) {
          return notChecked(`the range leaves ${formatNumber(material.validFromNm)}–${nm(material.validToNm)}, where ${material.label}'s index is known`);
        }
        return pass('passes the whole range by turning the prism');
      })(),
      'interference-filter':
        ctx.filtersToCover === 1
          ? pass('one filter covers the range by tilting')
          : fail(
              ctx.filtersToCover === null
                ? 'a filter at 0° tilt covers one wavelength'
                : `one filter covers ${formatPercent(ctx.tiltFraction, { maximumFractionDigits: 1 })} of its wavelength by tilting; ${formatInteger(ctx.filtersToCover)} cover the range`,
            ),
      'coloured-glass':
        studies['coloured-glass'].notes.length > 0
          ? notChecked('part of the range lies outside what coloured glass is made for')
          : ctx.glassesToCover === 1
            ? pass('one glass spans the range')
            : fail(`one glass spans ${nm(options.colouredGlass.widthNm)}; ${formatInteger(ctx.glassesToCover)} span the range`),
    },
  };
}

function overlapRow(
  policy: NonNullable<Requirements['orderOverlap']>,
  ctx: Context,
  studies: Record<TradeSelectorId, SelectorStudy>,
): TradeVerdictRow {
  const single = (words: string) => pass(words);
  const grating = (): TradeVerdict => {
    if (policy === 'allowed') return pass('other orders are allowed');
    const overlapping = ctx.gratingPoints.some((p) => p.overlapCount > 0);
    if (!overlapping) return pass('no other order lands in the range');
    const where = runsText(ctx.wavelengthsNm, (i) => ctx.gratingPoints[i]!.overlapCount > 0);
    if (policy === 'forbidden') return fail(`other orders land on ${where}`);
    // As the requirements check judges it: every overlap blocked by the design's own filters.
    const open = ctx.gratingPoints.map((p) => p.unblockedOverlapCount > 0);
    return open.some(Boolean)
      ? fail(`no filter blocks the other orders at ${runsText(ctx.wavelengthsNm, (i) => open[i]!)}`)
      : pass('the design’s order-sorting filters block every other order');
  };
  const filter = (): TradeVerdict => {
    if (policy === 'allowed') return pass('other peaks are allowed');
    if (!studies['interference-filter'].hasOverlappingOrders) return pass('no other cavity peak falls in the range');
    return policy === 'forbidden'
      ? fail('other cavity peaks fall in the range')
      : pass('other cavity peaks fall in the range; a blocking filter, which stock filters carry (common practice), removes them');
  };
  return {
    id: 'orderOverlap',
    title: 'Order overlap',
    limitText: `other orders ${policy}`,
    verdicts: {
      grating: grating(),
      prism: single('a prism has a single order'),
      'interference-filter': filter(),
      'coloured-glass': single('absorption has no orders'),
    },
  };
}

/** Slower of the width and height f-numbers, as the requirement check takes it. */
function fNumberRow(limit: number, ctx: Context, summary: ReturnType<typeof evaluateDesign>['design']): TradeVerdictRow {
  const { design, prism } = ctx;
  const judge = (worst: number | null, which: string): TradeVerdict => {
    if (worst === null) return notChecked('the beam width at the range centre is unknown');
    const words = `collimator f/${formatNumber(worst, 3)} ${which}, ${marginWords((limit - worst) / limit, 'max')}`;
    return worst <= limit ? pass(words) : fail(words);
  };
  const grating = (() => {
    if (summary.fNumberProjectedWidth === null) return judge(null, '');
    const across = summary.fNumberProjectedWidth >= summary.fNumberHeight;
    return judge(across ? summary.fNumberProjectedWidth : summary.fNumberHeight, across ? 'across the grating' : 'along the slit');
  })();
  const centreNm = (design.range.startNm + design.range.endNm) / 2;
  const centre = prismPoint(prism.sellmeier, prism.apexRad, prism.baseMm, centreNm);
  const beamMm = centre.index === null ? null : prismBeamWidthMm(centre.index, prism.apexRad, prism.baseMm);
  const f = design.layout.collimatorFocalMm;
  const prismVerdict = (() => {
    if (beamMm === null || !(beamMm > 0)) return judge(null, '');
    const across = f / beamMm;
    const along = f / design.grating.ruledHeightMm;
    return judge(Math.max(across, along), across >= along ? 'across the prism' : 'along the slit');
  })();
  const filterWords = 'a filter sets no f-number; it wants a near-collimated beam, and a fast one broadens its passband';
  return {
    id: 'maxFNumber',
    title: 'f-number',
    limitText: `≤ ${formatNumber(limit)}`,
    verdicts: {
      grating,
      prism: prismVerdict,
      'interference-filter': notChecked(filterWords),
      'coloured-glass': notChecked('a glass accepts any f-number: it has no focal optics of its own'),
    },
  };
}

function focalRow(limit: number, design: Design): TradeVerdictRow {
  const worst = Math.max(design.layout.collimatorFocalMm, design.layout.cameraFocalMm);
  const words = `focal length ${mm(worst)}, ${marginWords((limit - worst) / limit, 'max')}`;
  const mono = worst <= limit ? pass(words) : fail(words);
  const filter = notChecked('a filter has no focal length of its own');
  return {
    id: 'maxFocalLengthMm',
    title: 'Focal length',
    limitText: `≤ ${mm(limit)}`,
    verdicts: {
      grating: mono,
      prism: { ...mono, message: `${words} (the design’s mirrors)` },
      'interference-filter': filter,
      'coloured-glass': filter,
    },
  };
}

function footprintRow(limit: Footprint, ctx: Context): TradeVerdictRow {
  const fits = (w: number, d: number) => w <= limit.widthMm && d <= limit.depthMm;
  const grating = (() => {
    const f = ctx.options.gratingFootprintMm;
    if (f === null) return notChecked('the mount’s outline comes from the sketch, which was not given');
    const words = `outline ${formatNumber(f.widthMm)} × ${mm(f.depthMm)} (width × depth)`;
    return fits(f.widthMm, f.depthMm) ? pass(`${words} fits`) : fail(`${words} does not fit`);
  })();
  const part = (d: number, what: string): TradeVerdict => {
    const words = `the ${what} alone, ${mm(d)} across; its mount and the light path around it are not counted`;
    return fits(d, d) ? pass(words) : fail(words);
  };
  return {
    id: 'maxFootprintMm',
    title: 'Footprint',
    limitText: `≤ ${formatNumber(limit.widthMm)} × ${mm(limit.depthMm)}`,
    verdicts: {
      grating,
      prism: notChecked('a prism mount’s outline is not drawn; with the same mirrors it is about the grating mount’s size'),
      'interference-filter': part(ctx.options.interferenceFilter.diameterMm, 'filter'),
      'coloured-glass': part(ctx.options.colouredGlass.diameterMm, 'glass'),
    },
  };
}

/** Wavelengths a per-wavelength requirement is judged at: the listed ones when given, else the sweep. */
function judgedIndices(wavelengthsNm: readonly number[], sweepCount: number): { from: number; to: number } {
  return wavelengthsNm.length > sweepCount ? { from: sweepCount, to: wavelengthsNm.length } : { from: 0, to: sweepCount };
}

// The study ---------------------------------------------------------------------------------------

function assumptionWords(design: Design, options: TradeStudyOptions, prismBaseMm: number): string[] {
  const { prism, interferenceFilter: fp, colouredGlass: glass } = options;
  const material = resolvePrismMaterial(prism.material);
  return [
    `Mirrors: ${MIRROR_REFLECTIONS} reflections (collimator and camera, or one mirror used twice) at ${pct(options.mirrorReflectance)} each, aluminium in the visible (common practice).`,
    `Prism: ${material.label} (${material.source}), ${formatNumber(prism.apexDeg)}° apex (the usual dispersing prism, common practice), ` +
      `${mm(prismBaseMm)} base${prism.baseMm === null ? ' (the grating’s ruled width, so the beams are about as wide)' : ''}, at minimum deviation, ` +
      `with this design’s focal lengths (${formatNumber(design.layout.collimatorFocalMm)} / ${mm(design.layout.cameraFocalMm)}) and slits ` +
      `(${formatNumber(design.slits.entranceWidthUm)} / ${formatQuantity(design.slits.exitWidthUm, 'µm')}), so its bandpass compares with the grating's.`,
    `Interference filter: a Fabry–Pérot cavity in order ${fp.order} (the widest free spectral range), spacer n = ${formatNumber(fp.spacerIndex)} (silica, from memory), ` +
      `mirrors R = ${pct(fp.mirrorReflectance)} (about the ~10 nm width of stock visible filters, from memory), tilted up to ${formatNumber(fp.maxTiltDeg)}° ` +
      '(beyond about 15–20° the passband broadens and splits by polarisation, from memory).',
    `Coloured glass: band-pass glasses ${nm(glass.widthNm)} wide with ${nm(glass.edgeWidthNm)} edges, plateau ${pct(glass.peakInternalTransmission)} internal, ` +
      `${mm(glass.thicknessMm)} thick, n = ${formatNumber(glass.refractiveIndex)} (typical values, from memory).`,
    'Peak transmissions are scalar estimates of the selector alone (no source, detector or order-sorting filters), each with its basis.',
  ];
}

/**
 * The grating of `design` beside a prism monochromator, an interference filter and a coloured
 * glass over the design's range, with a verdict per comparable requirement. Throws a RangeError
 * naming the option when an override is out of bounds (see `tradeStudyOptionIssues`).
 */
export function tradeStudy(design: Design, overrides: TradeStudyOverrides = {}): TradeStudy {
  const options = resolveTradeStudyOptions(overrides);
  const issues = Object.entries(tradeStudyOptionIssues(options));
  if (issues.length > 0) throw new RangeError(issues.map(([path, message]) => `${path}: ${message}`).join('; '));

  const sweepNm = sweepWavelengthsNm(design.range.startNm, design.range.endNm, options.points);
  const requirements = design.requirements;
  const listedNm = requirements?.atWavelengthsNm ? [...requirements.atWavelengthsNm].sort((a, b) => a - b) : [];
  const allNm = [...sweepNm, ...listedNm];
  const evaluation = evaluateDesign(design, { wavelengthsNm: allNm });
  const gratingAll = evaluation.points;
  const prism = prismSetup(design, options);
  const prismAll = prismCurves(allNm, prism);
  const fp = options.interferenceFilter;
  // One filter designed at λ₀ tilts down to λ₀ cos θ_t(max): k filters reach end × c^k.
  const tiltFactor = tiltedPeakNm(1, degToRad(fp.maxTiltDeg), fp.spacerIndex);
  const ratio = design.range.endNm / design.range.startNm;
  const filtersToCover = tiltFactor < 1 ? Math.max(1, Math.ceil(Math.log(ratio) / -Math.log(tiltFactor) - 1e-9)) : null;
  const glassesToCover = Math.max(1, Math.ceil((design.range.endNm - design.range.startNm) / options.colouredGlass.widthNm - 1e-9));

  const ctx: Context = {
    design,
    options,
    wavelengthsNm: sweepNm,
    gratingPoints: gratingAll.slice(0, sweepNm.length),
    orderSortingProposed: evaluation.orderSorting.proposedFilters.length,
    prism,
    prismCurves: {
      bandpassNm: prismAll.bandpassNm.slice(0, sweepNm.length),
      resolvingPower: prismAll.resolvingPower.slice(0, sweepNm.length),
      theoretical: prismAll.theoretical.slice(0, sweepNm.length),
      missing: prismAll.missing,
    },
    cavityPeaks: otherCavityPeaks(sweepNm, design, fp),
    filtersToCover,
    glassesToCover,
    tiltFraction: 1 - tiltFactor,
  };
  const selectors = [gratingStudy(ctx, evaluation.design), prismStudy(ctx), interferenceStudy(ctx), glassStudy(ctx)];
  const studies = Object.fromEntries(selectors.map((s) => [s.id, s])) as Record<TradeSelectorId, SelectorStudy>;

  const present = requirements
    ? REQUIREMENT_IDS.filter((id) => (id === 'oneShotCoverage' ? requirements.oneShotCoverage === true : requirements[id] !== undefined))
    : [];
  const verdicts: TradeVerdictRow[] = [];
  if (present.length > 0 && requirements) {
    verdicts.push(coverageRow(ctx, studies));
    // Per-wavelength figures at every judged wavelength (listed ones included), per selector.
    const judged = judgedIndices(allNm, sweepNm.length);
    const judgedNm = allNm.slice(judged.from, judged.to);
    const full: Record<TradeSelectorId, Curves> = {
      grating: gratingCurves(gratingAll),
      prism: prismAll,
      'interference-filter': interferenceCurves(allNm, fp),
      'coloured-glass': glassCurves(allNm, options.colouredGlass),
    };
    const cut = (values: (number | null)[]) => values.slice(judged.from, judged.to);
    for (const id of present) {
      if (id === 'maxBandpassNm' && requirements.maxBandpassNm !== undefined) {
        const limit = requirements.maxBandpassNm;
        verdicts.push({
          id,
          title: 'Bandpass',
          limitText: `≤ ${nm(limit)}`,
          verdicts: bySelector((s) => curveVerdict('max', limit, judgedNm, cut(full[s].bandpassNm), 'bandpass', nm)),
        });
      } else if (id === 'minResolvingPower' && requirements.minResolvingPower !== undefined) {
        const limit = requirements.minResolvingPower;
        verdicts.push({
          id,
          title: 'Resolving power',
          limitText: `≥ ${formatNumber(limit)}`,
          verdicts: bySelector((s) =>
            curveVerdict('min', limit, judgedNm, cut(full[s].resolvingPower), 'resolving power', (v) => formatNumber(v, 3)),
          ),
        });
      } else if (id === 'maxFNumber' && requirements.maxFNumber !== undefined) {
        verdicts.push(fNumberRow(requirements.maxFNumber, ctx, evaluation.design));
      } else if (id === 'maxFocalLengthMm' && requirements.maxFocalLengthMm !== undefined) {
        verdicts.push(focalRow(requirements.maxFocalLengthMm, design));
      } else if (id === 'maxFootprintMm' && requirements.maxFootprintMm !== undefined) {
        verdicts.push(footprintRow(requirements.maxFootprintMm, ctx));
      } else if (id === 'orderOverlap' && requirements.orderOverlap !== undefined) {
        verdicts.push(overlapRow(requirements.orderOverlap, ctx, studies));
      }
    }
  }
  const gratingOnly = present.filter((id) => !COMPARED.includes(id));
  const verdictNote =
    present.length === 0
      ? 'No requirements are set, so there is nothing to judge: the figures above compare the selectors on their own.'
      : [
          listedNm.length > 0
            ? `Bandpass and resolving power are judged at ${listedNm.map((w) => formatNumber(w)).join(', ')} nm; the rest over the range.`
            : `Judged over the range at ${formatInteger(sweepNm.length)} wavelengths, as the requirements check judges the grating.`,
          gratingOnly.length > 0
            ? `${gratingOnly.length === 1 ? 'One requirement applies' : `${formatInteger(gratingOnly.length)} requirements apply`} to the grating alone and ` +
              `${gratingOnly.length === 1 ? 'is' : 'are'} judged in the requirements check.`
            : '',
        ]
          .filter(Boolean)
          .join(' ');

  return {
    wavelengthsNm: sweepNm,
    selectors,
    verdicts,
    gratingOnly,
    verdictNote,
    assumptions: assumptionWords(design, options, prism.baseMm),
    options,
  };
}
