/**
 * Whole-design evaluation. Everything that depends only on the design is computed once in
 * `prepareDesign`; `evaluatePoint` is the hot path (one `asin`, three `cos`, one `sin`, no mathjs,
 * one result object plus its slit function per wavelength, overlap lists only where they exist and
 * never longer than `MAX_LISTED_OVERLAPS`).
 */

import type { Design } from '../../shared/design';
import { MAX_SOLVE_WAVELENGTHS, MIN_SOLVE_POINTS } from '../../shared/solve-limits';
import { comaFreeCameraAngleRad, astigmaticFocalDifferenceMm } from './aberrations';
import { blazeWavelengthInMountNm } from './blaze';
import { detectorCoverage, type DetectorCoverage } from './detector';
import {
  grooveSpacingNm,
  reachableMaxNm,
  solveGrating,
  unreachableReason,
} from './grating';
import {
  DEG_PER_RAD,
  GRAZING_MARGIN_RAD,
  HALF_PI,
  RAD_PER_ARCSEC,
  UM_PER_MM,
  degToRad,
  radToDeg,
} from './math';
import {
  fNumberHeight,
  fNumberProjectedWidth,
  halfDeviationRad,
  hasTwoMirrorPaths,
} from './mount';
import { NO_OVERLAPS, overlappingOrders } from './orders';
import { grooveCount, theoreticalResolvingPower } from './resolving-power';
import type { AberrationSummary, DesignSummary, Evaluation, WavelengthPoint } from './results';
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

/** Per-design constants of the hot path. */
export interface PreparedDesign {
  readonly order: number;
  readonly absOrder: number;
  readonly spacingNm: number;
  readonly halfDeviationRad: number;
  /** `2d cos K`, nm. */
  readonly twoDCosKNm: number;
  readonly collimatorFocalMm: number;
  readonly cameraFocalMm: number;
  /** `f_cam / f_col`. */
  readonly focalRatio: number;
  readonly entranceWidthMm: number;
  readonly exitWidthMm: number;
  readonly theoreticalResolvingPower: number;
  /** `λ_B cos K` (first order), or NaN without a blaze wavelength. */
  readonly firstOrderBlazeInMountNm: number;
  readonly overlapMinNm: number;
  readonly overlapMaxNm: number;
  /** `2d cos K / |m|` in nm per arc-second of rotation at φ = 0. */
  readonly scanNmPerArcsecAtZero: number;
}

export function prepareDesign(design: Design): PreparedDesign {
  const { grating, layout, slits, range, source } = design;
  const spacingNm = grooveSpacingNm(grating.grooveDensityPerMm);
  const halfDev = halfDeviationRad(layout);
  const twoDCosKNm = 2 * spacingNm * Math.cos(halfDev);
  const absOrder = Math.abs(grating.order);
  return {
    order: grating.order,
    absOrder,
    spacingNm,
    halfDeviationRad: halfDev,
    twoDCosKNm,
    collimatorFocalMm: layout.collimatorFocalMm,
    cameraFocalMm: layout.cameraFocalMm,
    focalRatio: layout.cameraFocalMm / layout.collimatorFocalMm,
    entranceWidthMm: slits.entranceWidthUm / UM_PER_MM,
    exitWidthMm: slits.exitWidthUm / UM_PER_MM,
    theoreticalResolvingPower: theoreticalResolvingPower(
      grating.order,
      grooveCount(grating.grooveDensityPerMm, grating.ruledWidthMm),
    ),
    firstOrderBlazeInMountNm:
      grating.blazeWavelengthNm === undefined ? NaN : grating.blazeWavelengthNm * Math.cos(halfDev),
    // Without a declared source, assume at least the design range is lit: that is the light
    // the instrument is meant to measure, and its other orders land on it.
    overlapMinNm: source?.minNm ?? range.startNm,
    overlapMaxNm: source?.maxNm ?? range.endNm,
    scanNmPerArcsecAtZero: (twoDCosKNm / absOrder) * RAD_PER_ARCSEC,
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
    diffractionLimitNm: finite ? wavelengthNm / plan.theoreticalResolvingPower : 0,
    resolvingPower: null,
    theoreticalResolvingPower: plan.theoreticalResolvingPower,
    freeSpectralRangeNm: finite ? wavelengthNm / plan.absOrder : 0,
    blazeEfficiency: null,
    overlaps: NO_OVERLAPS,
    overlapCount: 0,
    overlapsTruncated: false,
    scanSensitivityNmPerArcsec: null,
  };
}

// Module-local copies for the hot path (see evaluatePoint for why).
const LIMIT_RAD = HALF_PI - GRAZING_MARGIN_RAD;
const RAD_TO_DEG = DEG_PER_RAD;
const EMPTY_OVERLAPS = NO_OVERLAPS;
/** Relative width mismatch below which the slit function counts as a triangle (as in bandpass.ts). */
const MATCHED_WIDTHS = 1e-9;

/**
 * Everything the solver reports at one wavelength. Never throws; every number is finite for a
 * finite λ > 0.
 *
 * This is the hot path, so the closed forms are written out here rather than called: under
 * CommonJS transpilation (tsx, the CLI and the server) every imported binding is a getter, and
 * calling through them made a 1,000-point evaluation about twice as slow. Each line names the
 * function it mirrors; tests/features/solver/evaluate.test.ts checks they agree.
 */
export function evaluatePoint(plan: PreparedDesign, wavelengthNm: number): WavelengthPoint {
  const sinPhi = (plan.order * wavelengthNm) / plan.twoDCosKNm; // grating.rotationSine
  const phi = Math.asin(sinPhi); // NaN when |sin φ| > 1: caught by the test below
  const K = plan.halfDeviationRad;
  // grating.anglesClearOfGrazing; `!(x < y)` is also true for NaN.
  if (!(wavelengthNm > 0) || !(wavelengthNm < Infinity) || !(Math.abs(phi) + K < LIMIT_RAD)) {
    const reason =
      unreachableReason(plan.order, wavelengthNm, plan.spacingNm, K, sinPhi) ?? 'unreachable';
    return unreachablePoint(plan, wavelengthNm, reason);
  }
  const { absOrder, spacingNm, cameraFocalMm, exitWidthMm } = plan;
  const alpha = phi + K; // mount.incidenceRad
  const beta = phi - K; // mount.diffractionRad
  const cosAlpha = Math.cos(alpha);
  const cosBeta = Math.cos(beta);

  const angularRadPerNm = absOrder / (spacingNm * cosBeta); // dispersion.angularDispersionRadPerNm
  const rld = (spacingNm * cosBeta) / (absOrder * cameraFocalMm); // dispersion.reciprocalDispersionNmPerMm
  const magnification = (cosAlpha / cosBeta) * plan.focalRatio; // mount.anamorphicMagnification
  const imageMm = plan.entranceWidthMm * magnification; // bandpass.entranceImageWidthMm
  const wider = imageMm > exitWidthMm ? imageMm : exitWidthMm;
  const bandpass = rld * wider; // bandpass.bandpassNm
  const mismatchMm = imageMm > exitWidthMm ? imageMm - exitWidthMm : exitWidthMm - imageMm;
  const matched = mismatchMm <= MATCHED_WIDTHS * (imageMm + exitWidthMm); // bandpass.slitFunction
  const limitNm = wavelengthNm / plan.theoreticalResolvingPower; // resolving-power.diffractionLimitNm

  let blaze: number | null = null; // blaze.blazeEfficiencyFromMountBlaze
  const blazeInMount = plan.firstOrderBlazeInMountNm;
  if (blazeInMount === blazeInMount) {
    const x = Math.PI * (absOrder - blazeInMount / wavelengthNm);
    const s = x > -1e-8 && x < 1e-8 ? 1 : Math.sin(x) / x; // math.sinc
    blaze = s * s;
  }

  // orders.overlapCount; the list (orders.overlappingOrders, at most MAX_LISTED_OVERLAPS) is
  // built only when some other order lands in the source range.
  const product = absOrder * wavelengthNm;
  const nLo = Math.max(1, Math.ceil(product / plan.overlapMaxNm));
  const nHi = Math.floor(product / plan.overlapMinNm);
  const overlapTotal = nHi < nLo ? 0 : nHi - nLo + 1 - (nLo <= absOrder && absOrder <= nHi ? 1 : 0);
  const overlaps =
    overlapTotal === 0
      ? EMPTY_OVERLAPS
      : overlappingOrders(plan.order, wavelengthNm, plan.overlapMinNm, plan.overlapMaxNm);

  return {
    wavelengthNm,
    reachable: true,
    reason: null,
    incidenceDeg: alpha * RAD_TO_DEG,
    diffractionDeg: beta * RAD_TO_DEG,
    gratingRotationDeg: phi * RAD_TO_DEG,
    angularDispersionDegPerNm: angularRadPerNm * RAD_TO_DEG,
    linearDispersionMmPerNm: angularRadPerNm * cameraFocalMm, // dispersion.linearDispersionMmPerNm
    reciprocalDispersionNmPerMm: rld,
    anamorphicMagnification: magnification,
    bandpassNm: bandpass,
    slitFunction: {
      shape: matched ? 'triangle' : 'trapezoid',
      baseNm: rld * (imageMm + exitWidthMm),
      topNm: matched ? 0 : rld * mismatchMm,
    },
    diffractionLimitNm: limitNm,
    resolvingPower: wavelengthNm / (bandpass > limitNm ? bandpass : limitNm), // resolving-power.resolvingPower
    theoreticalResolvingPower: plan.theoreticalResolvingPower,
    freeSpectralRangeNm: wavelengthNm / absOrder, // resolving-power.freeSpectralRangeNm
    blazeEfficiency: blaze,
    overlaps,
    overlapCount: overlapTotal,
    overlapsTruncated: overlapTotal > overlaps.length,
    scanSensitivityNmPerArcsec: plan.scanNmPerArcsecAtZero * Math.cos(phi), // scan.scanSensitivityNmPerArcsec
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
    );
  }

  return {
    kind: layout.kind,
    grooveSpacingNm: plan.spacingNm,
    illuminatedGrooves: grooveCount(grating.grooveDensityPerMm, grating.ruledWidthMm),
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
  return { points, design: summary, warnings: collectWarnings(points, summary, plan.order) };
}
