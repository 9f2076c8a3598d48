/**
 * Solve for a value: from a requirement, what a parameter must be, offered as changes to apply.
 * Each value is found on the ordinary solver (bisection where the figure is not a closed form of
 * the parameter) and checked again with `checkRequirements` before it is offered, so applying it
 * makes its requirement pass.
 */

import type { Design } from '../../shared/design';
import { formatNumber } from '../../shared/format';
import type { RequirementId, Requirements } from '../../shared/requirements';
import {
  HALF_PI,
  GRAZING_MARGIN_RAD,
  UM_PER_MM,
  evaluateDesign,
  evaluatePoint,
  grooveSpacingNm,
  halfDeviationRad,
  prepareDesign,
  solveGrating,
  sweepWavelengthsNm,
} from '../solver';
import { REQUIREMENT_POINTS, checkRequirements, requirementFailsAt } from './check';
import { applyDesignChanges, type DesignChange } from './design-change';
import type { RequirementsReport } from './types';

export interface SolvedValue {
  /** Stable key for a list: `maxBandpassNm:slits`. */
  id: string;
  /** The requirement it meets; null for coma balance, which no requirement asks for. */
  requirement: RequirementId | null;
  changes: DesignChange[];
  /** "Exit and entrance slits 62 µm meet bandpass ≤ 0.5 nm (was 100 µm)". */
  text: string;
}

/** Smallest slit the design schema admits, µm. */
const MIN_SLIT_UM = 0.001;
const MAX_SLIT_UM = 1_000_000;
const MAX_PIXELS = 10_000_000;
/** Bisection on the slit scale stops within this fraction: far below the three figures offered. */
const SCALE_TOLERANCE = 1e-9;
/**
 * A passing design whose slits already open within this fraction of the widest that passes has
 * nothing worth offering: "6 µm (was 5.9 µm)" is rounding, not a design change.
 */
const WORTHWHILE_OPENING = 0.05;
const BISECTION_STEPS = 60;
/** A camera angle within this of the coma-free one is balanced already, degrees. */
const COMA_TOLERANCE_DEG = 0.01;

const um = (value: number) => `${formatNumber(value)}\u00A0µm`;
const mm = (value: number) => `${formatNumber(value)}\u00A0mm`;

/** `value` cut to `digits` significant figures toward `direction`, for a number a person can type. */
export function roundSignificant(value: number, digits: number, direction: 'down' | 'up'): number {
  if (!(value > 0) || !Number.isFinite(value)) return value;
  const scale = 10 ** (Math.floor(Math.log10(value)) - digits + 1);
  const rounded = (direction === 'down' ? Math.floor(value / scale) : Math.ceil(value / scale)) * scale;
  return Number(rounded.toPrecision(digits + 1));
}

/** The design judged against one requirement alone (with the wavelengths it applies at). */
function passesOnly(design: Design, requirement: RequirementId, requirements: Requirements): boolean {
  const only: Requirements = {
    [requirement]: requirements[requirement],
    ...(requirements.atWavelengthsNm ? { atWavelengthsNm: requirements.atWavelengthsNm } : {}),
    ...(requirements.driveStepArcsec ? { driveStepArcsec: requirements.driveStepArcsec } : {}),
    ...(requirements.bandpassBasis ? { bandpassBasis: requirements.bandpassBasis } : {}),
  };
  const report = checkRequirements({ ...design, requirements: only });
  return report.checks.length === 1 && report.checks[0]?.status === 'pass';
}

/** Offers `changes` only when they make `requirement` pass on the changed design. */
function verified(
  design: Design,
  requirement: RequirementId,
  requirements: Requirements,
  candidates: DesignChange[][],
): DesignChange[] | null {
  for (const changes of candidates) {
    if (passesOnly(applyDesignChanges(design, changes), requirement, requirements)) return changes;
  }
  return null;
}

function slitChanges(design: Design, scale: number, round: boolean): DesignChange[] {
  const { entranceWidthUm, exitWidthUm } = design.slits;
  const fit = (widthUm: number) => {
    const raw = Math.min(MAX_SLIT_UM, Math.max(MIN_SLIT_UM, widthUm * scale));
    return round ? roundSignificant(raw, 3, 'down') : raw;
  };
  return [
    { path: 'slits.entranceWidthUm', value: fit(entranceWidthUm) },
    { path: 'slits.exitWidthUm', value: fit(exitWidthUm) },
  ];
}

/**
 * The largest common scale of both slit widths (their ratio kept) at which `requirement` passes at
 * every wavelength it is checked at: bisection on the solver between a scale that passes and one
 * that fails. Both figures it serves (bandpass, resolving power) only worsen as the slits open.
 */
function largestSlitScale(design: Design, requirement: RequirementId, requirements: Requirements): number | null {
  // The same per-point judge the check uses, without its summary and warnings: this runs ~80 times.
  const wavelengthsNm =
    requirements.atWavelengthsNm ?? sweepWavelengthsNm(design.range.startNm, design.range.endNm, REQUIREMENT_POINTS);
  // A traced bandpass is bisected on the slit-limited one (a trace per step would cost ~80 traces);
  // the offer is then verified by the trace itself, so it is made only where the traced figure passes.
  const { bandpassBasis: _basis, ...guide } = requirements;
  void _basis;
  const passes = (scale: number) => {
    const changed = applyDesignChanges(design, slitChanges(design, scale, false));
    const plan = prepareDesign(changed);
    return wavelengthsNm.every(
      (nm) => !requirementFailsAt(guide, evaluatePoint(plan, nm), changed).includes(requirement),
    );
  };
  const minScale = MIN_SLIT_UM / Math.min(design.slits.entranceWidthUm, design.slits.exitWidthUm);
  const maxScale = MAX_SLIT_UM / Math.max(design.slits.entranceWidthUm, design.slits.exitWidthUm);
  let low = 1;
  let high = 1;
  if (passes(1)) {
    while (passes(high)) {
      low = high;
      if (high >= maxScale) return maxScale;
      high = Math.min(maxScale, high * 2);
    }
  } else {
    while (!passes(low)) {
      high = low;
      if (low <= minScale) return null;
      low = Math.max(minScale, low / 2);
    }
  }
  for (let i = 0; i < BISECTION_STEPS && high - low > SCALE_TOLERANCE * high; i++) {
    const mid = (low + high) / 2;
    if (passes(mid)) low = mid;
    else high = mid;
  }
  return low;
}

function solveSlits(
  design: Design,
  requirement: 'maxBandpassNm' | 'minResolvingPower',
  requirements: Requirements,
  limitText: string,
): SolvedValue | null {
  const scale = largestSlitScale(design, requirement, requirements);
  if (scale === null) return null;
  if (scale >= 1 && scale < 1 + WORTHWHILE_OPENING) return null;
  const changes = verified(design, requirement, requirements, [
    slitChanges(design, scale, true),
    slitChanges(design, scale, false),
  ]);
  if (!changes) return null;
  const [entrance, exit] = changes.map((c) => c.value) as [number, number];
  const { entranceWidthUm, exitWidthUm } = design.slits;
  if (entrance === entranceWidthUm && exit === exitWidthUm) return null;
  const text =
    entrance === exit && entranceWidthUm === exitWidthUm
      ? `Exit and entrance slits ${um(exit)} meet ${limitText} (was ${um(exitWidthUm)})`
      : `Entrance ${um(entrance)} and exit ${um(exit)} slits meet ${limitText} ` +
        `(were ${formatNumber(entranceWidthUm)} and ${um(exitWidthUm)})`;
  return { id: `${requirement}:slits`, requirement, changes, text };
}

/** Littrow's one lens and Ebert–Fastie's one mirror set both focal lengths at once. */
function focalChanges(design: Design, focalMm: number): DesignChange[] {
  const single = design.layout.kind === 'littrow' || design.layout.kind === 'ebert-fastie';
  return single
    ? [
        { path: 'layout.collimatorFocalMm', value: focalMm },
        { path: 'layout.cameraFocalMm', value: focalMm },
      ]
    : [{ path: 'layout.cameraFocalMm', value: focalMm }];
}

/**
 * RLD = d cos β / (|m| f_cam) (Palmer & Loewen, ch. 2), and β does not depend on f_cam, so the
 * focal length that brings the worst RLD to the limit is f_cam × worst / limit, exactly.
 */
function solveCameraFocal(design: Design, requirements: Requirements, report: RequirementsReport): SolvedValue | null {
  const limit = requirements.maxReciprocalDispersionNmPerMm;
  const check = report.checks.find((c) => c.id === 'maxReciprocalDispersionNmPerMm');
  if (limit === undefined || !check || check.worst === null || check.status === 'unknown') return null;
  const exact = (design.layout.cameraFocalMm * check.worst) / limit;
  const changes = verified(design, 'maxReciprocalDispersionNmPerMm', requirements, [
    focalChanges(design, roundSignificant(exact, 3, 'up')),
    focalChanges(design, exact),
  ]);
  if (!changes) return null;
  const focal = changes[changes.length - 1]!.value;
  if (focal === design.layout.cameraFocalMm) return null;
  const what = changes.length > 1 ? 'Focal length' : 'Camera focal length';
  return {
    id: 'maxReciprocalDispersionNmPerMm:cameraFocal',
    requirement: 'maxReciprocalDispersionNmPerMm',
    changes,
    text: `${what} ${mm(focal)} meets ${check.limitText} (was ${mm(design.layout.cameraFocalMm)})`,
  };
}

/** The solver's coma-free camera angle at the range centre (Shafer, Megill & Droppleman), when the design's differs. */
function solveComaBalance(design: Design): SolvedValue | null {
  const { layout } = design;
  if (layout.kind !== 'czerny-turner' || layout.collimatorOffAxisDeg === undefined) return null;
  const free = evaluateDesign(design, { wavelengthsNm: [] }).design.aberrations.comaFreeCameraOffAxisDeg;
  if (free === null || !(free > 0 && free < 90)) return null;
  const current = layout.cameraOffAxisDeg;
  if (current !== undefined && Math.abs(current - free) < COMA_TOLERANCE_DEG) return null;
  const value = Number(free.toFixed(2));
  const centreNm = (design.range.startNm + design.range.endNm) / 2;
  const was = current === undefined ? 'none given' : `was ${formatNumber(current)}°`;
  return {
    id: 'comaBalance:cameraOffAxis',
    requirement: null,
    changes: [{ path: 'layout.cameraOffAxisDeg', value }],
    text:
      `Camera off-axis ${formatNumber(value)}° cancels the collimator’s coma at ${formatNumber(centreNm)}\u00A0nm ` +
      `(${was})`,
  };
}

/**
 * Pixels for the whole range at the centre setting. With the grating fixed, λ reaches the flat
 * detector at `x = f_cam tan(sgn(m)(β(λ) − β_c))` (the solver's detector model, detector.ts), so
 * the detector must reach the farther of the range ends from its centre: exact, no linear
 * dispersion (which drifts across a wide detector).
 */
function solvePixelCount(design: Design, requirements: Requirements): SolvedValue | null {
  const { detector, range, layout, grating } = design;
  if (!detector || requirements.oneShotCoverage !== true) return null;
  const spacingNm = grooveSpacingNm(grating.grooveDensityPerMm);
  const K = halfDeviationRad(layout);
  const centre = solveGrating(grating.order, (range.startNm + range.endNm) / 2, spacingNm, K);
  if (!centre.reachable) return null;
  const reachMm = (wavelengthNm: number): number | null => {
    const sinBeta = (grating.order * wavelengthNm) / spacingNm - Math.sin(centre.incidenceRad);
    if (!(Math.abs(sinBeta) < 1)) return null;
    const beta = Math.asin(sinBeta);
    if (Math.abs(beta) >= HALF_PI - GRAZING_MARGIN_RAD) return null;
    const turn = Math.sign(grating.order) * (beta - centre.diffractionRad);
    if (Math.abs(turn) >= HALF_PI) return null;
    return Math.abs(layout.cameraFocalMm * Math.tan(turn));
  };
  const start = reachMm(range.startNm);
  const end = reachMm(range.endNm);
  if (start === null || end === null) return null;
  const pitchMm = detector.pixelPitchUm / UM_PER_MM;
  const exact = (2 * Math.max(start, end)) / pitchMm;
  const needed = Math.ceil(exact * (1 + 1e-12));
  if (needed > MAX_PIXELS) return null;
  const changes = verified(design, 'oneShotCoverage', requirements, [
    [{ path: 'detector.pixelCount', value: needed }],
    [{ path: 'detector.pixelCount', value: needed + 1 }],
  ]);
  if (!changes || changes[0]!.value === detector.pixelCount) return null;
  const count = changes[0]!.value;
  return {
    id: 'oneShotCoverage:pixelCount',
    requirement: 'oneShotCoverage',
    changes,
    text:
      `${formatNumber(count, 8)} pixels (${mm(count * pitchMm)} at ${um(detector.pixelPitchUm)}) record ` +
      `${formatNumber(range.startNm)}–${formatNumber(range.endNm)}\u00A0nm in one shot (was ${formatNumber(detector.pixelCount, 8)})`,
  };
}

/**
 * What the parameters must be for the design's requirements, where one parameter settles one:
 * slit widths for the bandpass and the resolving power, the camera focal length for the
 * reciprocal dispersion, the detector's pixel count for one-shot coverage, and the coma-free
 * camera angle (a balance, not a requirement). Values that would not change the design are left out.
 */
export function solveForValues(design: Design, report: RequirementsReport = checkRequirements(design)): SolvedValue[] {
  const requirements = design.requirements ?? {};
  const out: SolvedValue[] = [];
  const limitTextOf = (id: RequirementId) => report.checks.find((c) => c.id === id)?.limitText ?? id;
  if (requirements.maxBandpassNm !== undefined) {
    const value = solveSlits(design, 'maxBandpassNm', requirements, limitTextOf('maxBandpassNm'));
    if (value) out.push(value);
  }
  if (requirements.minResolvingPower !== undefined) {
    const value = solveSlits(design, 'minResolvingPower', requirements, limitTextOf('minResolvingPower'));
    if (value) out.push(value);
  }
  const camera = solveCameraFocal(design, requirements, report);
  if (camera) out.push(camera);
  const pixels = solvePixelCount(design, requirements);
  if (pixels) out.push(pixels);
  const coma = solveComaBalance(design);
  if (coma) out.push(coma);
  return out;
}
