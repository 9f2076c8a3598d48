/**
 * The columnar path of the candidate search: each candidate is evaluated at the checked
 * wavelengths into scratch typed arrays, reduced into one column per figure (a Float64Array over
 * all candidates), and every requirement's predicate is applied there. No object is made per
 * wavelength or per candidate; the figures come from the solver's one-concept functions (the
 * per-point `WavelengthPoint` objects stay for the workbench).
 */

import { REQUIREMENT_IDS, type RequirementId, type Requirements } from '../../shared/requirements';
import type { SearchRequest } from '../../shared/search';
import { comaFreeCameraAngleRad as comaFreeCameraAngleRadImported } from '../solver/aberrations';
import { bandpassNm as bandpassNmImported, entranceImageWidthMm as entranceImageWidthMmImported } from '../solver/bandpass';
import { blazeEfficiency as blazeEfficiencyImported } from '../solver/blaze';
import { wavelengthAtDetectorNm as wavelengthAtDetectorNmImported } from '../solver/detector';
import { reciprocalDispersionNmPerMm as reciprocalDispersionNmPerMmImported } from '../solver/dispersion';
import { sweepWavelengthsNm } from '../solver/evaluate';
import { anglesClearOfGrazing as anglesClearOfGrazingImported, grooveSpacingNm as grooveSpacingNmImported, reachableMaxNm as reachableMaxNmImported, rotationSine as rotationSineImported } from '../solver/grating';
import { RAD_PER_DEG, UM_PER_MM, degToRad, radToDeg as radToDegImported } from '../solver/math';
import { anamorphicMagnification as anamorphicMagnificationImported, diffractionRad as diffractionRadImported, fNumberHeight as fNumberHeightImported, fNumberProjectedWidth as fNumberProjectedWidthImported, incidenceRad as incidenceRadImported } from '../solver/mount';
import { overlapCount as overlapCountImported } from '../solver/orders';
import { diffractionLimitNm as diffractionLimitNmImported, grooveCount as grooveCountImported, resolvingPower as resolvingPowerImported } from '../solver/resolving-power';
import { scanSensitivityNmPerArcsec as scanSensitivityNmPerArcsecImported } from '../solver/scan';
import {
  COLLIMATOR_OFF_AXIS_DEG,
  DEFAULT_SLIT_WIDTH_UM,
  MAX_SLIT_WIDTH_UM,
  MIN_SLIT_WIDTH_UM,
  SLIT_WIDTH_STEP_UM,
  type CandidateTable,
  type SearchSpace,
} from './space';

/*
 * The solver's functions held in this module's own bindings. Run through tsx (the command line,
 * the HTTP server, the benchmark) an imported function is read through a getter on every call,
 * which cost as much as the physics: 14,256 candidates × 50 wavelengths took a median 307 ms
 * called through the imports and 147 ms through these bindings, in one run. Same functions, no copy.
 */
const comaFreeCameraAngleRad = comaFreeCameraAngleRadImported;
const bandpassNm = bandpassNmImported;
const entranceImageWidthMm = entranceImageWidthMmImported;
const blazeEfficiency = blazeEfficiencyImported;
const wavelengthAtDetectorNm = wavelengthAtDetectorNmImported;
const reciprocalDispersionNmPerMm = reciprocalDispersionNmPerMmImported;
const anglesClearOfGrazing = anglesClearOfGrazingImported;
const grooveSpacingNm = grooveSpacingNmImported;
const reachableMaxNm = reachableMaxNmImported;
const rotationSine = rotationSineImported;
const radToDeg = radToDegImported;
const anamorphicMagnification = anamorphicMagnificationImported;
const diffractionRad = diffractionRadImported;
const fNumberHeight = fNumberHeightImported;
const fNumberProjectedWidth = fNumberProjectedWidthImported;
const incidenceRad = incidenceRadImported;
const overlapCount = overlapCountImported;
const diffractionLimitNm = diffractionLimitNmImported;
const grooveCount = grooveCountImported;
const resolvingPower = resolvingPowerImported;
const scanSensitivityNmPerArcsec = scanSensitivityNmPerArcsecImported;

/** Wavelengths each candidate is evaluated at when the requirements name none. */
export const CHECKED_POINTS = 50;

/**
 * Why a candidate is excluded: a requirement, or `range` when the design range (or a named
 * wavelength) is beyond what the candidate's order and mount reach — not a requirement, but no
 * design that cannot reach its own range is offered.
 */
export type ExclusionKey = RequirementId | 'range';
export const EXCLUSION_KEYS: readonly ExclusionKey[] = [...REQUIREMENT_IDS, 'range'];
const BIT: Readonly<Record<ExclusionKey, number>> = Object.fromEntries(
  EXCLUSION_KEYS.map((key, i) => [key, 1 << i]),
) as Record<ExclusionKey, number>;

/** Requirements the slit width is solved for: they pass by construction, with the headroom the width step leaves. */
export const WIDTH_SETTING: readonly RequirementId[] = ['maxBandpassNm', 'minResolvingPower'];

/** The request's requirements in the form the loop reads, worked out once per search. */
export interface ColumnarPlan {
  /**
   * The range sweep (`CHECKED_POINTS` evenly spaced, ends included), then the named
   * `atWavelengthsNm` if any, as `checkRequirements` reads them: bandpass, resolving power,
   * efficiency, pixels per bandpass and reciprocal dispersion at the named wavelengths when there
   * are some (else the sweep); the drive's wavelength error and order overlap over the sweep.
   */
  readonly wavelengthsNm: Float64Array;
  readonly sweepPoints: number;
  /** Where the wavelength-by-wavelength requirements are judged: `[listedFrom, listedTo)`. */
  readonly listedFrom: number;
  readonly listedTo: number;
  readonly rangeStartNm: number;
  readonly rangeEndNm: number;
  readonly centreNm: number;
  /** The longest wavelength the candidate must reach: the range end or a longer named one. */
  readonly longestNeededNm: number;
  readonly overlapMinNm: number;
  readonly overlapMaxNm: number;
  readonly requirements: Requirements;
  /** The requirements that were given (and so are checked and counted in `excludedBy`). */
  readonly given: readonly RequirementId[];
  readonly pixelPitchMm: number | null;
  readonly detectorWidthMm: number | null;
  readonly gratingSizeMm: number;
  readonly collimatorOffAxisRad: number;
}

export function columnarPlan(request: SearchRequest, space: SearchSpace): ColumnarPlan {
  const { range, source, detector, requirements } = request;
  const at = requirements.atWavelengthsNm;
  const sweep = sweepWavelengthsNm(range.startNm, range.endNm, CHECKED_POINTS);
  const listed = at ? [...at].sort((a, b) => a - b) : [];
  const given = REQUIREMENT_IDS.filter((id) =>
    id === 'oneShotCoverage' ? requirements.oneShotCoverage === true : requirements[id] !== undefined,
  );
  return {
    wavelengthsNm: Float64Array.from([...sweep, ...listed]),
    sweepPoints: sweep.length,
    listedFrom: listed.length > 0 ? sweep.length : 0,
    listedTo: sweep.length + listed.length,
    rangeStartNm: range.startNm,
    rangeEndNm: range.endNm,
    centreNm: (range.startNm + range.endNm) / 2,
    longestNeededNm: Math.max(range.endNm, ...(at ?? [])),
    // As the solver does: without a declared source, at least the design range is lit.
    overlapMinNm: source?.minNm ?? range.startNm,
    overlapMaxNm: source?.maxNm ?? range.endNm,
    requirements,
    given,
    pixelPitchMm: detector ? detector.pixelPitchUm / UM_PER_MM : null,
    detectorWidthMm: detector ? (detector.pixelPitchUm * detector.pixelCount) / UM_PER_MM : null,
    gratingSizeMm: space.gratingSizeMm,
    collimatorOffAxisRad: degToRad(COLLIMATOR_OFF_AXIS_DEG),
  };
}

/** One Float64Array per figure, one entry per candidate (NaN where a figure does not apply). */
export interface Columns {
  readonly slitWidthUm: Float64Array;
  readonly cameraOffAxisDeg: Float64Array;
  readonly worstBandpassNm: Float64Array;
  readonly worstResolvingPower: Float64Array;
  readonly minBlazeEfficiency: Float64Array;
  readonly centreReciprocalDispersionNmPerMm: Float64Array;
  readonly fNumber: Float64Array;
  readonly overlappedWavelengths: Float64Array;
  /**
   * Signed margin of each requirement (a fraction of its limit: positive headroom, negative how
   * far it misses). Yes/no requirements hold a miss fraction when they fail and NaN when they pass.
   */
  readonly margins: Readonly<Record<ExclusionKey, Float64Array>>;
  /** Bit `1 << EXCLUSION_KEYS.indexOf(key)` set for each key that excludes the candidate. */
  readonly failed: Uint16Array;
}

export function allocateColumns(count: number): Columns {
  const column = () => new Float64Array(count).fill(Number.NaN);
  return {
    slitWidthUm: column(),
    cameraOffAxisDeg: column(),
    worstBandpassNm: column(),
    worstResolvingPower: column(),
    minBlazeEfficiency: column(),
    centreReciprocalDispersionNmPerMm: column(),
    fNumber: column(),
    overlappedWavelengths: column(),
    margins: Object.fromEntries(EXCLUSION_KEYS.map((key) => [key, column()])) as Record<ExclusionKey, Float64Array>,
    failed: new Uint16Array(count),
  };
}

export function failsOn(columns: Columns, index: number, key: ExclusionKey): boolean {
  return ((columns.failed[index] as number) & BIT[key]) !== 0;
}

/** Per-wavelength scratch, reused for every candidate of one search. */
export interface Scratch {
  readonly rotationRad: Float64Array;
  readonly reciprocalDispersionNmPerMm: Float64Array;
  readonly magnification: Float64Array;
  readonly bandpassNm: Float64Array;
  readonly resolvingPower: Float64Array;
  readonly blazeEfficiency: Float64Array;
  readonly overlapCount: Float64Array;
  readonly scanNmPerArcsec: Float64Array;
}

export function allocateScratch(points: number): Scratch {
  return {
    rotationRad: new Float64Array(points),
    reciprocalDispersionNmPerMm: new Float64Array(points),
    magnification: new Float64Array(points),
    bandpassNm: new Float64Array(points),
    resolvingPower: new Float64Array(points),
    blazeEfficiency: new Float64Array(points),
    overlapCount: new Float64Array(points),
    scanNmPerArcsec: new Float64Array(points),
  };
}

/** `(limit − value) / limit`: headroom under a maximum. */
function underMax(value: number, limit: number): number {
  return (limit - value) / limit;
}
/** `(value − limit) / limit`: headroom over a minimum. */
function overMin(value: number, limit: number): number {
  return (value - limit) / limit;
}

function mark(columns: Columns, index: number, key: ExclusionKey, margin: number): void {
  columns.margins[key][index] = margin;
  if (margin < 0) columns.failed[index] = (columns.failed[index] as number) | BIT[key];
}

/** Whether the wavelength-by-wavelength requirements are judged over the range sweep (no named wavelengths). */
function judgedOverSweep(plan: ColumnarPlan): boolean {
  return plan.listedFrom === 0;
}

/**
 * `d sin 2K / |m|`, the wavelength where |φ| = K (one of α, β is 0), when the range holds it, else
 * null. There `d·max(cos α, cos β)` peaks, so the bandpass of equal slits and (in positive orders)
 * the reciprocal dispersion are largest inside the range rather than at an end: a sweep could
 * step over it, so it is checked by itself.
 */
function peakWavelengthNm(plan: ColumnarPlan, order: number, spacingNm: number, halfDevRad: number): number | null {
  const peakNm = (spacingNm * Math.sin(2 * halfDevRad)) / Math.abs(order);
  return peakNm >= plan.rangeStartNm && peakNm <= plan.rangeEndNm ? peakNm : null;
}

/**
 * The widest equal entrance and exit slit, µm, that keeps the bandpass (and the resolving power)
 * within the requirements at every judged wavelength, or null when none sets a width.
 *
 * With equal slits `w` and equal focal lengths the bandpass is `RLD × w × max(1, cos α / cos β)`
 * (the wider of the entrance image and the exit slit, Palmer & Loewen ch. 9, with the anamorphic
 * magnification of ch. 2), so each wavelength bounds `w` by `limit / (RLD · max(1, M))`. That is
 * `d·max(cos α, cos β) / (|m| f)`, largest at `peakWavelengthNm`: over a sweep that wavelength is
 * bounded too, so the width holds across the whole range, not only at the sampled points.
 * Resolving power `λ / √(bp² + (λ/|m|N)²) ≥ R` asks for `bp ≤ √((λ/R)² − (λ/|m|N)²)`; no width
 * does when `|m|N ≤ R`.
 */
function solveSlitWidthUm(
  plan: ColumnarPlan,
  scratch: Scratch,
  order: number,
  spacingNm: number,
  halfDevRad: number,
  focalMm: number,
  grooves: number,
): number | null {
  const { maxBandpassNm: maxBp, minResolvingPower: minR } = plan.requirements;
  if (maxBp === undefined && minR === undefined) return null;
  const wavelengths = plan.wavelengthsNm;
  let widestMm = Number.POSITIVE_INFINITY;
  for (let i = plan.listedFrom; i < plan.listedTo; i++) {
    const nmPerMmOfWidth =
      (scratch.reciprocalDispersionNmPerMm[i] as number) * Math.max(1, scratch.magnification[i] as number);
    if (maxBp !== undefined) widestMm = Math.min(widestMm, maxBp / nmPerMmOfWidth);
    if (minR !== undefined) {
      const lambda = wavelengths[i] as number;
      const allowed = (lambda / minR) ** 2 - diffractionLimitNm(lambda, order, grooves) ** 2;
      widestMm = Math.min(widestMm, allowed > 0 ? Math.sqrt(allowed) / nmPerMmOfWidth : 0);
    }
  }
  if (maxBp !== undefined && judgedOverSweep(plan) && peakWavelengthNm(plan, order, spacingNm, halfDevRad) !== null) {
    widestMm = Math.min(widestMm, maxBp / reciprocalDispersionNmPerMm(order, spacingNm, 1, focalMm));
  }
  // Rounded down to the step (and a hair below an exact step) so the width stays inside its limit.
  const steps = Math.floor(((widestMm * UM_PER_MM) / SLIT_WIDTH_STEP_UM) * (1 - 1e-12));
  return Math.min(MAX_SLIT_WIDTH_UM, Math.max(MIN_SLIT_WIDTH_UM, steps * SLIT_WIDTH_STEP_UM));
}

/**
 * The mount's outline for one candidate, when the footprint is required (it needs the whole
 * design, so the engine supplies it); null otherwise.
 */
export type FootprintOf = (index: number, slitWidthUm: number, cameraOffAxisDeg: number) => { widthMm: number; depthMm: number };

/**
 * Evaluates candidates `[from, to)` into `columns`: figures, the slit width and camera angle, and
 * each given requirement's margin and pass or fail, as `checkRequirements` judges them.
 */
export function evaluateCandidates(
  plan: ColumnarPlan,
  table: CandidateTable,
  columns: Columns,
  scratch: Scratch,
  from: number,
  to: number,
  footprintOf: FootprintOf | null = null,
): void {
  const { requirements: req, wavelengthsNm, sweepPoints, listedFrom, listedTo } = plan;
  const points = wavelengthsNm.length;
  const size = plan.gratingSizeMm;
  for (let c = from; c < to; c++) {
    const order = table.order[c] as number;
    const density = table.grooveDensityPerMm[c] as number;
    const spacingNm = grooveSpacingNm(density);
    const halfDevRad = ((table.deviationAngleDeg[c] as number) * RAD_PER_DEG) / 2;
    const focalMm = table.focalLengthMm[c] as number;
    const blazeNm = table.blazeWavelengthNm[c] as number;
    const grooves = grooveCount(density, size);

    // Design-wide requirements hold whether or not the range is reachable.
    if (req.maxFocalLengthMm !== undefined) mark(columns, c, 'maxFocalLengthMm', underMax(focalMm, req.maxFocalLengthMm));

    const reachNm = reachableMaxNm(order, spacingNm, halfDevRad);
    let reachable = plan.longestNeededNm < reachNm;
    for (let i = 0; reachable && i < points; i++) {
      const sinPhi = rotationSine(order, wavelengthsNm[i] as number, spacingNm, halfDevRad);
      const phi = Math.asin(sinPhi);
      if (!(Math.abs(sinPhi) <= 1) || !anglesClearOfGrazing(phi, halfDevRad)) {
        reachable = false;
        break;
      }
      const cosA = Math.cos(incidenceRad(phi, halfDevRad));
      const cosB = Math.cos(diffractionRad(phi, halfDevRad));
      scratch.rotationRad[i] = phi;
      scratch.reciprocalDispersionNmPerMm[i] = reciprocalDispersionNmPerMm(order, spacingNm, cosB, focalMm);
      scratch.magnification[i] = anamorphicMagnification(cosA, cosB, focalMm, focalMm);
    }
    // How far the reach clears (or falls short of) the longest wavelength needed, as a share of it.
    const rangeMargin = overMin(reachNm, plan.longestNeededNm);
    if (!reachable) {
      mark(columns, c, 'range', Math.min(-Number.EPSILON, rangeMargin));
      continue;
    }
    mark(columns, c, 'range', rangeMargin);

    // The centre wavelength: f-number, reciprocal dispersion, the coma-free camera angle, the detector.
    const centrePhi = Math.asin(rotationSine(order, plan.centreNm, spacingNm, halfDevRad));
    const centreAlpha = incidenceRad(centrePhi, halfDevRad);
    const centreBeta = diffractionRad(centrePhi, halfDevRad);
    const fNumber = Math.max(fNumberProjectedWidth(focalMm, size, centreAlpha), fNumberHeight(focalMm, size));
    columns.fNumber[c] = fNumber;
    columns.centreReciprocalDispersionNmPerMm[c] = reciprocalDispersionNmPerMm(order, spacingNm, Math.cos(centreBeta), focalMm);
    const cameraRad = comaFreeCameraAngleRad(
      plan.collimatorOffAxisRad,
      focalMm,
      focalMm,
      Math.cos(centreAlpha),
      Math.cos(centreBeta),
    );
    const cameraOffAxisDeg = Math.round(radToDeg(cameraRad) * 100) / 100;
    columns.cameraOffAxisDeg[c] = cameraOffAxisDeg;
    if (req.maxFNumber !== undefined) mark(columns, c, 'maxFNumber', underMax(fNumber, req.maxFNumber));
    if (req.oneShotCoverage === true && plan.detectorWidthMm !== null) {
      const geometry = { order, spacingNm, incidenceRad: centreAlpha, centreDiffractionRad: centreBeta, cameraFocalMm: focalMm };
      const startNm = wavelengthAtDetectorNm(geometry, -plan.detectorWidthMm / 2);
      const endNm = wavelengthAtDetectorNm(geometry, plan.detectorWidthMm / 2);
      const covers = startNm !== null && endNm !== null && startNm <= plan.rangeStartNm && endNm >= plan.rangeEndNm;
      // A miss is the share of the range off the detector.
      const covered =
        startNm === null || endNm === null
          ? 0
          : Math.max(0, Math.min(endNm, plan.rangeEndNm) - Math.max(startNm, plan.rangeStartNm)) /
            (plan.rangeEndNm - plan.rangeStartNm);
      mark(columns, c, 'oneShotCoverage', covers ? Number.NaN : Math.min(-Number.EPSILON, covered - 1));
    }

    const widthUm = solveSlitWidthUm(plan, scratch, order, spacingNm, halfDevRad, focalMm, grooves) ?? DEFAULT_SLIT_WIDTH_UM;
    columns.slitWidthUm[c] = widthUm;
    const widthMm = widthUm / UM_PER_MM;

    for (let i = 0; i < points; i++) {
      const lambda = wavelengthsNm[i] as number;
      const bp = bandpassNm(
        scratch.reciprocalDispersionNmPerMm[i] as number,
        entranceImageWidthMm(widthMm, scratch.magnification[i] as number),
        widthMm,
      );
      scratch.bandpassNm[i] = bp;
      scratch.resolvingPower[i] = resolvingPower(lambda, bp, diffractionLimitNm(lambda, order, grooves));
      scratch.blazeEfficiency[i] = blazeEfficiency(lambda, order, blazeNm, halfDevRad);
      scratch.overlapCount[i] = overlapCount(order, lambda, plan.overlapMinNm, plan.overlapMaxNm);
      scratch.scanNmPerArcsec[i] = scanSensitivityNmPerArcsec(order, spacingNm, halfDevRad, scratch.rotationRad[i] as number);
    }

    // Judged where checkRequirements judges them: named wavelengths when given, else the sweep.
    let worstBp = 0;
    let worstR = Number.POSITIVE_INFINITY;
    let minEff = Number.POSITIVE_INFINITY;
    let worstRld = 0;
    let fewestPixels = Number.POSITIVE_INFINITY;
    for (let i = listedFrom; i < listedTo; i++) {
      const bp = scratch.bandpassNm[i] as number;
      const rld = scratch.reciprocalDispersionNmPerMm[i] as number;
      worstBp = Math.max(worstBp, bp);
      worstR = Math.min(worstR, scratch.resolvingPower[i] as number);
      minEff = Math.min(minEff, scratch.blazeEfficiency[i] as number);
      worstRld = Math.max(worstRld, rld);
      // Pixels across one bandpass: the wider of entrance image and exit slit over the pitch.
      if (plan.pixelPitchMm !== null) fewestPixels = Math.min(fewestPixels, bp / (rld * plan.pixelPitchMm));
    }
    const peakNm = judgedOverSweep(plan) ? peakWavelengthNm(plan, order, spacingNm, halfDevRad) : null;
    if (peakNm !== null) {
      const peakPhi = Math.asin(rotationSine(order, peakNm, spacingNm, halfDevRad));
      const peakRld = reciprocalDispersionNmPerMm(order, spacingNm, Math.cos(diffractionRad(peakPhi, halfDevRad)), focalMm);
      worstRld = Math.max(worstRld, peakRld);
    }
    // Over the sweep, always: the drive's wavelength error and other orders.
    let worstScan = 0;
    let overlapped = 0;
    for (let i = 0; i < sweepPoints; i++) {
      worstScan = Math.max(worstScan, scratch.scanNmPerArcsec[i] as number);
      if ((scratch.overlapCount[i] as number) > 0) overlapped++;
    }
    columns.worstBandpassNm[c] = worstBp;
    columns.worstResolvingPower[c] = worstR;
    columns.minBlazeEfficiency[c] = minEff;
    columns.overlappedWavelengths[c] = overlapped;

    if (req.maxBandpassNm !== undefined) mark(columns, c, 'maxBandpassNm', underMax(worstBp, req.maxBandpassNm));
    if (req.minResolvingPower !== undefined) mark(columns, c, 'minResolvingPower', overMin(worstR, req.minResolvingPower));
    if (req.minBlazeEfficiency !== undefined) mark(columns, c, 'minBlazeEfficiency', overMin(minEff, req.minBlazeEfficiency));
    if (req.maxReciprocalDispersionNmPerMm !== undefined) {
      mark(columns, c, 'maxReciprocalDispersionNmPerMm', underMax(worstRld, req.maxReciprocalDispersionNmPerMm));
    }
    if (req.maxWavelengthErrorNm !== undefined && req.driveStepArcsec !== undefined) {
      mark(columns, c, 'maxWavelengthErrorNm', underMax(worstScan * req.driveStepArcsec, req.maxWavelengthErrorNm));
    }
    if (req.minPixelsPerBandpass !== undefined && plan.pixelPitchMm !== null) {
      mark(columns, c, 'minPixelsPerBandpass', overMin(fewestPixels, req.minPixelsPerBandpass));
    }
    if (req.orderOverlap === 'forbidden') {
      mark(columns, c, 'orderOverlap', overlapped === 0 ? Number.NaN : -overlapped / sweepPoints);
    }
    if (req.maxFootprintMm !== undefined && footprintOf !== null) {
      const footprint = footprintOf(c, widthUm, cameraOffAxisDeg);
      mark(
        columns,
        c,
        'maxFootprintMm',
        Math.min(underMax(footprint.widthMm, req.maxFootprintMm.widthMm), underMax(footprint.depthMm, req.maxFootprintMm.depthMm)),
      );
    }
  }
}
