/**
 * Whole-design evaluation. What depends only on the design is read once in `prepareDesign`;
 * `evaluatePoint` runs per wavelength and calls the one-concept functions (no mathjs, overlap
 * lists only where they exist and never longer than `MAX_LISTED_OVERLAPS`).
 */

import type { Design } from '../../shared/design';
import { MAX_SOLVE_WAVELENGTHS, MIN_SOLVE_POINTS } from '../../shared/solve-limits';
import { comaFreeCameraAngleRad, astigmaticFocalDifferenceMm } from './aberrations';
import { bandpassNm, entranceImageWidthMm, slitFunction } from './bandpass';
import { blazeEfficiency, blazeWavelengthInMountNm } from './blaze';
import { detectorCoverage, type DetectorCoverage } from './detector';
import {
  angularDispersionDegPerNm,
  linearDispersionMmPerNm,
  reciprocalDispersionNmPerMm,
} from './dispersion';
import { grooveSpacingNm, reachableMaxNm, solveGrating } from './grating';
import { UM_PER_MM, degToRad, radToDeg } from './math';
import {
  anamorphicMagnification,
  fNumberHeight,
  fNumberProjectedWidth,
  halfDeviationRad,
  hasTwoMirrorPaths,
} from './mount';
import { NO_OVERLAPS, overlapCount, overlappingOrders, type Overlap } from './orders';
import {
  blockedUpToAtSettingNm,
  filterChangesNm,
  proposeOrderSortingPlan,
  transmissionAtSetting,
  unblockedOverlapCount,
} from './order-sorting';
import {
  diffractionLimitNm,
  freeSpectralRangeNm,
  grooveCount,
  resolvingPower,
  theoreticalResolvingPower,
} from './resolving-power';
import type { OrderSortingFilter } from '../../shared/filters';
import type {
  AberrationSummary,
  DesignSummary,
  Evaluation,
  OrderSortingSummary,
  WavelengthPoint,
} from './results';
import { lightBudget } from './light-budget';
import { scanSensitivityNmPerArcsec } from './scan';
import { collectWarnings } from './warnings';

/** Wavelengths sampled over `range` when the caller gives neither a list nor a count. */
export const DEFAULT_POINTS = 101;
/** Bounds on an evenly spaced sweep: the solve request's, so the client and the API agree. */
export const MIN_POINTS = MIN_SOLVE_POINTS;
export const MAX_POINTS = MAX_SOLVE_WAVELENGTHS;

export interface EvaluateOptions {
  /** Evaluate exactly these wavelengths (in this order) instead of a sweep over `range`. */
  wavelengthsNm?: readonly number[];
  /** Number of evenly spaced wavelengths over `range`, ends included (2…1000, default 101). */
  points?: number;
}

/** What `evaluatePoint` needs that depends on the design only, computed once per evaluation. */
export interface PreparedDesign {
  readonly order: number;
  readonly spacingNm: number;
  readonly halfDeviationRad: number;
  readonly collimatorFocalMm: number;
  readonly cameraFocalMm: number;
  readonly entranceWidthMm: number;
  readonly exitWidthMm: number;
  /** N, grooves across the ruled width. */
  readonly grooves: number;
  readonly theoreticalResolvingPower: number;
  /** First-order Littrow blaze wavelength, or null without one. */
  readonly blazeWavelengthNm: number | null;
  readonly overlapMinNm: number;
  readonly overlapMaxNm: number;
  /** The design's order-sorting filters (empty without any). */
  readonly filters: readonly OrderSortingFilter[];
}

export function prepareDesign(design: Design): PreparedDesign {
  const { grating, layout, slits, range, source } = design;
  const grooves = grooveCount(grating.grooveDensityPerMm, grating.ruledWidthMm);
  return {
    order: grating.order,
    spacingNm: grooveSpacingNm(grating.grooveDensityPerMm),
    halfDeviationRad: halfDeviationRad(layout),
    collimatorFocalMm: layout.collimatorFocalMm,
    cameraFocalMm: layout.cameraFocalMm,
    entranceWidthMm: slits.entranceWidthUm / UM_PER_MM,
    exitWidthMm: slits.exitWidthUm / UM_PER_MM,
    grooves,
    theoreticalResolvingPower: theoreticalResolvingPower(grating.order, grooves),
    blazeWavelengthNm: grating.blazeWavelengthNm ?? null,
    // Without a declared source, assume at least the design range is lit: that is the light
    // the instrument is meant to measure, and its other orders land on it.
    overlapMinNm: source?.minNm ?? range.startNm,
    overlapMaxNm: source?.maxNm ?? range.endNm,
    filters: design.filters ?? [],
  };
}

function unreachablePoint(plan: PreparedDesign, wavelengthNm: number, reason: string): WavelengthPoint {
  const finite = Number.isFinite(wavelengthNm) && wavelengthNm > 0;
  return {
    wavelengthNm,
    reachable: false,
    reason,
    incidenceDeg: null,
    diffractionDeg: null,
    gratingRotationDeg: null,
    angularDispersionDegPerNm: null,
    linearDispersionMmPerNm: null,
    reciprocalDispersionNmPerMm: null,
    anamorphicMagnification: null,
    bandpassNm: null,
    slitFunction: null,
    diffractionLimitNm: finite ? diffractionLimitNm(wavelengthNm, plan.order, plan.grooves) : 0,
    resolvingPower: null,
    theoreticalResolvingPower: plan.theoreticalResolvingPower,
    freeSpectralRangeNm: finite ? freeSpectralRangeNm(wavelengthNm, plan.order) : 0,
    blazeEfficiency: null,
    overlaps: NO_OVERLAPS,
    overlapCount: 0,
    unblockedOverlapCount: 0,
    overlapsTruncated: false,
    filterTransmission: 1,
    scanSensitivityNmPerArcsec: null,
    relativeThroughput: null,
  };
}

/**
 * Everything the solver reports at one wavelength. Never throws; every number is finite for a
 * finite λ > 0. Each figure comes from its one-concept function; only the per-design constants
 * are taken from `plan`.
 */
export function evaluatePoint(plan: PreparedDesign, wavelengthNm: number): WavelengthPoint {
  const { order, spacingNm, halfDeviationRad: K, cameraFocalMm, exitWidthMm } = plan;
  const solution = solveGrating(order, wavelengthNm, spacingNm, K);
  if (!solution.reachable) return unreachablePoint(plan, wavelengthNm, solution.reason);
  const { rotationRad, incidenceRad, diffractionRad } = solution;
  const cosAlpha = Math.cos(incidenceRad);
  const cosBeta = Math.cos(diffractionRad);

  const rld = reciprocalDispersionNmPerMm(order, spacingNm, cosBeta, cameraFocalMm);
  const magnification = anamorphicMagnification(cosAlpha, cosBeta, plan.collimatorFocalMm, cameraFocalMm);
  const imageMm = entranceImageWidthMm(plan.entranceWidthMm, magnification);
  const bandpass = bandpassNm(rld, imageMm, exitWidthMm);
  const limitNm = diffractionLimitNm(wavelengthNm, order, plan.grooves);
  const overlapTotal = overlapCount(order, wavelengthNm, plan.overlapMinNm, plan.overlapMaxNm);
  const blockedNm = blockedUpToAtSettingNm(plan.filters, wavelengthNm);
  const filtered = blockedNm > Number.NEGATIVE_INFINITY;
  // Most wavelengths have no overlapping order: skip building an empty list for them.
  let overlaps: readonly Overlap[] = NO_OVERLAPS;
  if (overlapTotal > 0) {
    overlaps = overlappingOrders(order, wavelengthNm, plan.overlapMinNm, plan.overlapMaxNm);
    // The list comes unblocked; mark it only where a filter is in the beam.
    if (filtered) for (const o of overlaps as Overlap[]) o.blocked = o.wavelengthNm <= blockedNm;
  }

  return {
    wavelengthNm,
    reachable: true,
    reason: null,
    incidenceDeg: radToDeg(incidenceRad),
    diffractionDeg: radToDeg(diffractionRad),
    gratingRotationDeg: radToDeg(rotationRad),
    angularDispersionDegPerNm: angularDispersionDegPerNm(order, spacingNm, cosBeta),
    linearDispersionMmPerNm: linearDispersionMmPerNm(order, spacingNm, cosBeta, cameraFocalMm),
    reciprocalDispersionNmPerMm: rld,
    anamorphicMagnification: magnification,
    bandpassNm: bandpass,
    slitFunction: slitFunction(rld, imageMm, exitWidthMm),
    diffractionLimitNm: limitNm,
    resolvingPower: resolvingPower(wavelengthNm, bandpass, limitNm),
    theoreticalResolvingPower: plan.theoreticalResolvingPower,
    freeSpectralRangeNm: freeSpectralRangeNm(wavelengthNm, order),
    blazeEfficiency:
      plan.blazeWavelengthNm === null
        ? null
        : blazeEfficiency(wavelengthNm, order, plan.blazeWavelengthNm, K),
    overlaps,
    overlapCount: overlapTotal,
    unblockedOverlapCount:
      overlapTotal === 0 || !filtered
        ? overlapTotal
        : unblockedOverlapCount(order, wavelengthNm, plan.overlapMinNm, plan.overlapMaxNm, blockedNm),
    overlapsTruncated: overlapTotal > overlaps.length,
    filterTransmission: filtered ? transmissionAtSetting(plan.filters, wavelengthNm) : 1,
    scanSensitivityNmPerArcsec: scanSensitivityNmPerArcsec(order, spacingNm, K, rotationRad),
    // The product of the light budget's factors, filled in by `evaluateDesign` once they are known.
    relativeThroughput: null,
  };
}

/** The wavelengths a sweep visits: `points` evenly spaced over `[startNm, endNm]`, ends included. */
export function sweepWavelengthsNm(startNm: number, endNm: number, points = DEFAULT_POINTS): number[] {
  const n = Number.isFinite(points)
    ? Math.min(MAX_POINTS, Math.max(MIN_POINTS, Math.round(points)))
    : DEFAULT_POINTS;
  const out = new Array<number>(n);
  const step = (endNm - startNm) / (n - 1);
  for (let i = 0; i < n; i++) out[i] = i === n - 1 ? endNm : startNm + i * step;
  return out;
}

function rotationDeg(plan: PreparedDesign, wavelengthNm: number): number | null {
  const solution = solveGrating(plan.order, wavelengthNm, plan.spacingNm, plan.halfDeviationRad);
  return solution.reachable ? radToDeg(solution.rotationRad) : null;
}

function aberrationSummary(design: Design, plan: PreparedDesign): AberrationSummary {
  const { layout, range } = design;
  const collimatorRad = layout.collimatorOffAxisDeg === undefined ? null : degToRad(layout.collimatorOffAxisDeg);
  const cameraRad = layout.cameraOffAxisDeg === undefined ? null : degToRad(layout.cameraOffAxisDeg);

  const comaFreeAtRad = (wavelengthNm: number): number | null => {
    if (collimatorRad === null || !hasTwoMirrorPaths(layout.kind)) return null;
    const s = solveGrating(plan.order, wavelengthNm, plan.spacingNm, plan.halfDeviationRad);
    if (!s.reachable) return null;
    return comaFreeCameraAngleRad(
      collimatorRad,
      layout.collimatorFocalMm,
      layout.cameraFocalMm,
      Math.cos(s.incidenceRad),
      Math.cos(s.diffractionRad),
    );
  };

  const centreNm = (range.startNm + range.endNm) / 2;
  const centreFree = comaFreeAtRad(centreNm);
  const inUse = centreFree === null ? null : (cameraRad ?? centreFree);
  const residualDeg = (wavelengthNm: number): number | null => {
    const free = comaFreeAtRad(wavelengthNm);
    return free === null || inUse === null ? null : radToDeg(free - inUse);
  };

  return {
    comaFreeCameraOffAxisDeg: centreFree === null ? null : radToDeg(centreFree),
    cameraOffAxisInUseDeg: inUse === null ? null : radToDeg(inUse),
    comaResidualAtStartDeg: residualDeg(range.startNm),
    comaResidualAtCentreDeg: residualDeg(centreNm),
    comaResidualAtEndDeg: residualDeg(range.endNm),
    collimatorAstigmatismMm:
      collimatorRad === null ? null : astigmaticFocalDifferenceMm(layout.collimatorFocalMm, collimatorRad),
    cameraAstigmatismMm:
      cameraRad === null ? null : astigmaticFocalDifferenceMm(layout.cameraFocalMm, cameraRad),
  };
}

/** Design-wide figures: reach, rotation range, f-numbers, aberrations, detector coverage. */
export function summarizeDesign(design: Design, plan: PreparedDesign = prepareDesign(design)): DesignSummary {
  const { grating, layout, range, detector } = design;
  const centreNm = (range.startNm + range.endNm) / 2;
  const centre = solveGrating(plan.order, centreNm, plan.spacingNm, plan.halfDeviationRad);

  let detectorSummary: DetectorCoverage | null = null;
  if (detector && centre.reachable) {
    const centrePoint = evaluatePoint(plan, centreNm);
    detectorSummary = detectorCoverage(
      {
        order: plan.order,
        spacingNm: plan.spacingNm,
        incidenceRad: centre.incidenceRad,
        centreDiffractionRad: centre.diffractionRad,
        cameraFocalMm: layout.cameraFocalMm,
      },
      detector,
      range,
      centrePoint.reciprocalDispersionNmPerMm ?? 0,
      centrePoint.bandpassNm ?? 0,
      { collimatorFocalMm: layout.collimatorFocalMm, entranceWidthMm: plan.entranceWidthMm, grooves: plan.grooves },
    );
  }

  return {
    kind: layout.kind,
    grooveSpacingNm: plan.spacingNm,
    illuminatedGrooves: plan.grooves,
    halfDeviationDeg: radToDeg(plan.halfDeviationRad),
    centreWavelengthNm: centreNm,
    reachableMinNm: 0,
    reachableMaxNm: reachableMaxNm(plan.order, plan.spacingNm, plan.halfDeviationRad),
    gratingRotationStartDeg: rotationDeg(plan, range.startNm),
    gratingRotationEndDeg: rotationDeg(plan, range.endNm),
    fNumberProjectedWidth: centre.reachable
      ? fNumberProjectedWidth(layout.collimatorFocalMm, grating.ruledWidthMm, centre.incidenceRad)
      : null,
    fNumberHeight: fNumberHeight(layout.collimatorFocalMm, grating.ruledHeightMm),
    // The camera takes the diffracted beam, `W cos β` wide: the same ratio with f_cam and β.
    cameraFNumberProjectedWidth: centre.reachable
      ? fNumberProjectedWidth(layout.cameraFocalMm, grating.ruledWidthMm, centre.diffractionRad)
      : null,
    cameraFNumberHeight: fNumberHeight(layout.cameraFocalMm, grating.ruledHeightMm),
    blazeWavelengthInMountNm:
      grating.blazeWavelengthNm === undefined
        ? null
        : blazeWavelengthInMountNm(grating.blazeWavelengthNm, plan.halfDeviationRad, plan.order),
    aberrations: aberrationSummary(design, plan),
    detector: detectorSummary,
  };
}

/**
 * Evaluates a schema-valid design at the given wavelengths (or a sweep over its range) and
 * collects its warnings. Never throws on schema-valid input; every number in the result is finite.
 */
export function evaluateDesign(design: Design, options: EvaluateOptions = {}): Evaluation {
  const plan = prepareDesign(design);
  const wavelengths =
    options.wavelengthsNm ?? sweepWavelengthsNm(design.range.startNm, design.range.endNm, options.points);
  const points = new Array<WavelengthPoint>(wavelengths.length);
  for (let i = 0; i < wavelengths.length; i++) {
    points[i] = evaluatePoint(plan, wavelengths[i] as number);
  }
  const summary = summarizeDesign(design, plan);
  const orderSorting = orderSortingSummary(design, plan, points);
  const light = lightBudget(design, points);
  for (let i = 0; i < points.length; i++) (points[i] as WavelengthPoint).relativeThroughput = light.throughput[i] ?? null;
  return {
    points,
    design: summary,
    orderSorting,
    lightBudget: light,
    warnings: collectWarnings(points, summary, plan.order, orderSorting, light),
  };
}

/** Overlaps left unblocked at these points: (point × order) pairs, listed or not. */
function unblockedTotal(points: readonly WavelengthPoint[]): number {
  let total = 0;
  for (const p of points) total += p.unblockedOverlapCount;
  return total;
}

/**
 * The design's filters against the proposed plan over the same points. The plan is counted with
 * the closed forms alone (no second evaluation): only which orders get through changes.
 */
function orderSortingSummary(
  design: Design,
  plan: PreparedDesign,
  points: readonly WavelengthPoint[],
): OrderSortingSummary {
  const proposedFilters = proposeOrderSortingPlan(design);
  let proposedUnblocked = 0;
  for (const p of points) {
    if (p.overlapCount === 0) continue;
    proposedUnblocked += unblockedOverlapCount(
      plan.order,
      p.wavelengthNm,
      plan.overlapMinNm,
      plan.overlapMaxNm,
      blockedUpToAtSettingNm(proposedFilters, p.wavelengthNm),
    );
  }
  return {
    proposedFilters,
    unblockedOverlaps: unblockedTotal(points),
    proposedUnblockedOverlaps: proposedUnblocked,
    filterChangesNm: filterChangesNm(plan.filters, design.range.startNm, design.range.endNm),
  };
}
