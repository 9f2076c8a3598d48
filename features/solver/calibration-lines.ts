/**
 * Calibration lines against a design: which lamp lines fall in its range and at what bandpass,
 * where each lands on the detector, which neighbours it resolves, which lines reach the range
 * through another order (ghosts), and whether a cubic wavelength(pixel) calibration is good enough
 * for its dispersion.
 *
 * Everything here reuses the solver's one-concept functions: `evaluatePoint` for the bandpass,
 * the detector's exact geometry (detector.ts: a flat detector normal to the central ray, the
 * grating fixed at the range centre), and the order-sorting filters (order-sorting.ts). Line
 * wavelengths are in air, as the instrument sees them and as the built-in list gives them
 * (shared/lamp-lines.ts); vacuum lists are converted with air-index.ts.
 */

import type { Design } from '../../shared/design';
import { LAMP_LINES, type LampElement, type LineStrength } from '../../shared/lamp-lines';
import { vacuumToAirNm } from './air-index';
import { wavelengthAtDetectorNm, type DetectorGeometry } from './detector';
import { evaluatePoint, prepareDesign, type PreparedDesign } from './evaluate';
import { solveGrating } from './grating';
import { GRAZING_MARGIN_RAD, HALF_PI, UM_PER_MM } from './math';
import { blockedUpToAtSettingNm, filtersInBeam, filtersTransmission } from './order-sorting';
import { evaluatePolynomialFit, fitPolynomial } from './polynomial-fit';

/** Longest list of lines, pairs or ghosts one report carries; counts say how many there are. */
export const MAX_LISTED_CALIBRATION_ITEMS = 200;
/** A cubic has four coefficients: fewer lines than this cannot fix it (common practice). */
export const CUBIC_MIN_LINES = 4;
/** Positions across the detector where the exact dispersion is sampled for the cubic fit. */
export const DISPERSION_FIT_SAMPLES = 129;

/**
 * Two lines count as resolved when their separation is at least the bandpass (the FWHM of the
 * slit function): common practice, a little stricter than Rayleigh's dip for a triangular profile.
 */
export function isPairResolved(separationNm: number, bandpassNm: number): boolean {
  return separationNm >= bandpassNm;
}

export const RESOLUTION_CRITERION =
  'two lines are resolved when their separation is at least the bandpass (FWHM of the slit function; common practice)';

/** One line a design is checked against. */
export interface CalibrationLine {
  /** In air, nm. */
  wavelengthNm: number;
  /** The lamp's element for a built-in line, null for the user's own. */
  element: LampElement | null;
  strength: LineStrength | null;
  /** The user's name for the line, or the built-in note. */
  label: string | null;
  origin: 'built-in' | 'user';
  /** The vacuum wavelength the user gave, when the line was converted to air; else null. */
  vacuumWavelengthNm: number | null;
}

/** A line the user brings, as a parsed line list gives it. */
export interface UserLine {
  wavelengthNm: number;
  label?: string;
}

/**
 * The built-in lines of `elements` and the user's own, in air, sorted by wavelength. Lines stated
 * in vacuum are converted (air-index.ts); 'unstated' is taken as air, as lamp tables above 200 nm
 * are. Wavelengths that are not positive finite numbers are left out.
 */
export function calibrationLineList(
  elements: readonly LampElement[],
  userLines: readonly UserLine[] = [],
  userMedium: 'air' | 'vacuum' | 'unstated' = 'air',
): CalibrationLine[] {
  const list: CalibrationLine[] = [];
  for (const element of new Set(elements)) {
    for (const lamp of LAMP_LINES[element] ?? []) {
      list.push({
        wavelengthNm: lamp.wavelengthNm,
        element,
        strength: lamp.strength,
        label: lamp.note ?? null,
        origin: 'built-in',
        vacuumWavelengthNm: null,
      });
    }
  }
  for (const user of userLines) {
    if (!isUsableWavelength(user.wavelengthNm)) continue;
    const vacuum = userMedium === 'vacuum';
    list.push({
      wavelengthNm: vacuum ? vacuumToAirNm(user.wavelengthNm) : user.wavelengthNm,
      element: null,
      strength: null,
      label: user.label ?? null,
      origin: 'user',
      vacuumWavelengthNm: vacuum ? user.wavelengthNm : null,
    });
  }
  return list.sort((a, b) => a.wavelengthNm - b.wavelengthNm);
}

function isUsableWavelength(nm: number): boolean {
  return typeof nm === 'number' && Number.isFinite(nm) && nm > 0;
}

/** Where a wavelength meets the detector, or why it does not. */
export type DetectorPlacement = 'on-detector' | 'short-of-detector' | 'past-detector' | 'misses-camera';

export interface DetectorLanding {
  placement: DetectorPlacement;
  /**
   * Pixel coordinate, fractional: 0 at the centre of the first (shortest-wavelength) pixel,
   * `pixelCount − 1` at the last; on the detector from −0.5 to `pixelCount − 0.5`. Null when the
   * light misses the camera.
   */
  pixel: number | null;
  /** Distance from the detector's centre in the dispersion direction, mm (null as `pixel`). */
  positionMm: number | null;
}

/** A line inside the design range and what the design makes of it. */
export interface LineInRange {
  line: CalibrationLine;
  reachable: boolean;
  /** Why the mount cannot deliver it, when it cannot. */
  reason: string | null;
  /** Bandpass at the line (monochromator: entrance image and exit slit), nm. */
  bandpassNm: number | null;
  /** Spectrograph mode, grating at the range centre; null without a detector. */
  detector: DetectorLanding | null;
}

/** Two lines next to each other in wavelength inside the range. */
export interface LinePair {
  shorter: CalibrationLine;
  longer: CalibrationLine;
  separationNm: number;
  /** Bandpass at the pair's mid-point, nm; null when the mount cannot reach it. */
  bandpassNm: number | null;
  /** `isPairResolved(separation, bandpass)`; null without a bandpass. */
  resolved: boolean | null;
}

/** A source line that reaches a setting inside the range through another order. */
export interface Ghost {
  line: CalibrationLine;
  /** The order it arrives in (same sign as the design's). */
  order: number;
  /** The setting, in the design's order, where it appears: `|m'| λ_line / |m|`, nm. */
  apparentWavelengthNm: number;
  /** Whether the mount reaches that setting at all. */
  reachable: boolean;
  /** True when a long-pass filter in the beam at that setting blocks the line (order-sorting.ts). */
  blocked: boolean;
  /** What the filters in the beam at that setting pass of the line (1 with none). */
  filterTransmission: number;
  /** Where it lands in spectrograph mode (grating at the range centre); null without a detector. */
  detector: DetectorLanding | null;
}

/** The residual of a cubic wavelength(pixel) fitted to the design's exact dispersion. */
export interface DispersionFit {
  /** Positions sampled across the detector where light arrives (fitted on every other one). */
  samples: number;
  /** Fraction of the detector's width that light reaches (1 unless an edge is past grazing). */
  litFraction: number;
  maxResidualNm: number;
  rmsResidualNm: number;
  /** Largest residual over the bandpass at the range centre. */
  maxResidualPerBandpass: number;
  /** Largest residual over one pixel's spectral width at the range centre. */
  maxResidualPerPixel: number;
}

export interface CalibrationCoverage {
  pixelCount: number;
  /** Lines of the list (any wavelength, not only the range) landing on the detector. */
  linesOnDetector: number;
  firstLinePixel: number | null;
  lastLinePixel: number | null;
  /** Pixels between the outermost lines on the detector. */
  spanPixels: number;
  /** That span over the detector's length (0…1). */
  spanFraction: number;
  /** At least `CUBIC_MIN_LINES` lines on the detector. */
  enoughLinesForCubic: boolean;
  /** Null when too little of the detector sees light to fit. */
  fit: DispersionFit | null;
  /** Plain words for the designer when the lines or the fit fall short; null when all is well. */
  note: string | null;
}

export interface CalibrationReport {
  /** Usable lines the design was checked against. */
  lineCount: number;
  linesInRange: LineInRange[];
  linesInRangeCount: number;
  linesInRangeTruncated: boolean;
  pairs: LinePair[];
  pairCount: number;
  /** Over every pair, listed or not. */
  unresolvedPairCount: number;
  pairsTruncated: boolean;
  /** Listed ghosts in increasing apparent wavelength. */
  ghosts: Ghost[];
  /** Every (line, order) that reaches the range, listed or not. */
  ghostCount: number;
  ghostsTruncated: boolean;
  /** Null without a detector, or when the mount cannot reach the range centre. */
  coverage: CalibrationCoverage | null;
}

/** The fixed-grating geometry of spectrograph mode, as `summarizeDesign` builds it. */
export interface DetectorFrame {
  geometry: DetectorGeometry;
  pitchMm: number;
  pixelCount: number;
  widthMm: number;
  centreNm: number;
}

/** Spectrograph mode: the grating fixed at the range centre; null without a detector or when unreachable. */
export function detectorFrame(design: Design, plan: PreparedDesign = prepareDesign(design)): DetectorFrame | null {
  const { detector, range, layout } = design;
  if (!detector) return null;
  const centreNm = (range.startNm + range.endNm) / 2;
  const centre = solveGrating(plan.order, centreNm, plan.spacingNm, plan.halfDeviationRad);
  if (!centre.reachable) return null;
  const pitchMm = detector.pixelPitchUm / UM_PER_MM;
  return {
    geometry: {
      order: plan.order,
      spacingNm: plan.spacingNm,
      incidenceRad: centre.incidenceRad,
      centreDiffractionRad: centre.diffractionRad,
      cameraFocalMm: layout.cameraFocalMm,
    },
    pitchMm,
    pixelCount: detector.pixelCount,
    widthMm: pitchMm * detector.pixelCount,
    centreNm,
  };
}

/**
 * Where `wavelengthNm` lands: β from the grating equation at the fixed incidence (Palmer &
 * Loewen, ch. 2), then `x = f_cam tan(sgn(m)(β − β_c))`, the inverse of `wavelengthAtDetectorNm`.
 */
export function detectorLanding(frame: DetectorFrame, wavelengthNm: number): DetectorLanding {
  const { order, spacingNm, incidenceRad, centreDiffractionRad, cameraFocalMm } = frame.geometry;
  const missed: DetectorLanding = { placement: 'misses-camera', pixel: null, positionMm: null };
  const sinBeta = (order * wavelengthNm) / spacingNm - Math.sin(incidenceRad);
  if (!(Math.abs(sinBeta) < 1)) return missed;
  const beta = Math.asin(sinBeta);
  if (Math.abs(beta) >= HALF_PI - GRAZING_MARGIN_RAD) return missed;
  const offAxisRad = Math.sign(order) * (beta - centreDiffractionRad);
  // A ray at 90° or more from the camera's axis never meets its focal plane.
  if (Math.abs(offAxisRad) >= HALF_PI - GRAZING_MARGIN_RAD) return missed;
  const positionMm = cameraFocalMm * Math.tan(offAxisRad);
  const pixel = positionMm / frame.pitchMm + (frame.pixelCount - 1) / 2;
  const half = frame.widthMm / 2;
  const placement: DetectorPlacement =
    positionMm < -half ? 'short-of-detector' : positionMm > half ? 'past-detector' : 'on-detector';
  return { placement, pixel, positionMm };
}

function lineInRange(plan: PreparedDesign, frame: DetectorFrame | null, line: CalibrationLine): LineInRange {
  const point = evaluatePoint(plan, line.wavelengthNm);
  return {
    line,
    reachable: point.reachable,
    reason: point.reason,
    bandpassNm: point.bandpassNm,
    detector: frame ? detectorLanding(frame, line.wavelengthNm) : null,
  };
}

function linePairs(plan: PreparedDesign, inRange: readonly CalibrationLine[]) {
  const pairs: LinePair[] = [];
  let unresolved = 0;
  for (let i = 1; i < inRange.length; i++) {
    const shorter = inRange[i - 1] as CalibrationLine;
    const longer = inRange[i] as CalibrationLine;
    const separationNm = longer.wavelengthNm - shorter.wavelengthNm;
    const bandpass = evaluatePoint(plan, (shorter.wavelengthNm + longer.wavelengthNm) / 2).bandpassNm;
    const resolved = bandpass === null ? null : isPairResolved(separationNm, bandpass);
    if (resolved === false) unresolved++;
    if (pairs.length < MAX_LISTED_CALIBRATION_ITEMS) {
      pairs.push({ shorter, longer, separationNm, bandpassNm: bandpass, resolved });
    }
  }
  return { pairs, pairCount: Math.max(0, inRange.length - 1), unresolved };
}

/**
 * Source lines that appear inside the range through another order: grating set for λ in order m
 * also passes `mλ/m'` in order m' (orders.ts; Palmer & Loewen, ch. 2), so a line λ_L shows at the
 * setting `|m'| λ_L / |m|`. Blocked as the solver marks overlaps: the line at or below the ramp
 * foot of the filters in the beam at that setting. Listed lowest orders first per line, at most
 * `MAX_LISTED_CALIBRATION_ITEMS` in all; the count is closed-form.
 */
function ghosts(design: Design, plan: PreparedDesign, frame: DetectorFrame | null, lines: readonly CalibrationLine[]) {
  const { startNm, endNm } = design.range;
  const absOrder = Math.abs(plan.order);
  const sign = plan.order < 0 ? -1 : 1;
  const listed: Ghost[] = [];
  let count = 0;
  for (const line of lines) {
    const lineNm = line.wavelengthNm;
    if (lineNm < plan.overlapMinNm || lineNm > plan.overlapMaxNm) continue;
    const lo = Math.max(1, Math.ceil((absOrder * startNm) / lineNm));
    const hi = Math.floor((absOrder * endNm) / lineNm);
    if (!(hi >= lo)) continue;
    count += hi - lo + 1 - (lo <= absOrder && absOrder <= hi ? 1 : 0);
    for (let n = lo; n <= hi && listed.length < MAX_LISTED_CALIBRATION_ITEMS; n++) {
      if (n === absOrder) continue;
      const settingNm = (n * lineNm) / absOrder;
      const reachable = solveGrating(plan.order, settingNm, plan.spacingNm, plan.halfDeviationRad).reachable;
      listed.push({
        line,
        order: sign * n,
        apparentWavelengthNm: settingNm,
        reachable,
        blocked: lineNm <= blockedUpToAtSettingNm(plan.filters, settingNm),
        filterTransmission: filtersTransmission(filtersInBeam(plan.filters, settingNm), lineNm),
        detector: frame ? detectorLanding(frame, settingNm) : null,
      });
    }
  }
  listed.sort((a, b) => a.apparentWavelengthNm - b.apparentWavelengthNm);
  return { listed, count };
}

/**
 * Fits λ(pixel) with a least-squares cubic to the exact mapping (`wavelengthAtDetectorNm`) at
 * every other one of `DISPERSION_FIT_SAMPLES` positions edge to edge, and measures the residual
 * at all of them (the in-between ones show what the fit does away from its own points).
 */
function dispersionFit(frame: DetectorFrame, bandpassNm: number, nmPerPixel: number): DispersionFit | null {
  const total = DISPERSION_FIT_SAMPLES;
  const pixels: number[] = [];
  const wavelengths: number[] = [];
  const fitted: boolean[] = [];
  for (let i = 0; i < total; i++) {
    const positionMm = -frame.widthMm / 2 + (frame.widthMm * i) / (total - 1);
    const nm = wavelengthAtDetectorNm(frame.geometry, positionMm);
    if (nm === null) continue;
    pixels.push(positionMm / frame.pitchMm + (frame.pixelCount - 1) / 2);
    wavelengths.push(nm);
    fitted.push(i % 2 === 0);
  }
  const fitX = pixels.filter((_, i) => fitted[i]);
  const fitY = wavelengths.filter((_, i) => fitted[i]);
  // Well over the four coefficients, so the residual says something about the shape.
  if (fitX.length < 2 * CUBIC_MIN_LINES) return null;
  const cubic = fitPolynomial(fitX, fitY, 3);
  if (!cubic) return null;
  let max = 0;
  let sumSquares = 0;
  for (let i = 0; i < pixels.length; i++) {
    const r = Math.abs(evaluatePolynomialFit(cubic, pixels[i] as number) - (wavelengths[i] as number));
    max = Math.max(max, r);
    sumSquares += r * r;
  }
  return {
    samples: pixels.length,
    litFraction: pixels.length / total,
    maxResidualNm: max,
    rmsResidualNm: Math.sqrt(sumSquares / pixels.length),
    maxResidualPerBandpass: bandpassNm > 0 ? max / bandpassNm : 0,
    maxResidualPerPixel: nmPerPixel > 0 ? max / nmPerPixel : 0,
  };
}

function coverage(plan: PreparedDesign, frame: DetectorFrame, lines: readonly CalibrationLine[]): CalibrationCoverage {
  const onDetector: number[] = [];
  for (const line of lines) {
    const landing = detectorLanding(frame, line.wavelengthNm);
    if (landing.placement === 'on-detector') onDetector.push(landing.pixel as number);
  }
  const first = onDetector.length > 0 ? Math.min(...onDetector) : null;
  const last = onDetector.length > 0 ? Math.max(...onDetector) : null;
  const spanPixels = first === null || last === null ? 0 : last - first;
  const centre = evaluatePoint(plan, frame.centreNm);
  const nmPerPixel = (centre.reciprocalDispersionNmPerMm ?? 0) * frame.pitchMm;
  const fit = dispersionFit(frame, centre.bandpassNm ?? 0, nmPerPixel);
  const enough = onDetector.length >= CUBIC_MIN_LINES;
  const notes: string[] = [];
  if (!enough) {
    notes.push(
      `only ${onDetector.length} line${onDetector.length === 1 ? '' : 's'} land on the detector: ` +
        `a cubic calibration needs at least ${CUBIC_MIN_LINES}`,
    );
  }
  if (!fit) notes.push('too little of the detector sees light to fit a cubic to its dispersion');
  return {
    pixelCount: frame.pixelCount,
    linesOnDetector: onDetector.length,
    firstLinePixel: first,
    lastLinePixel: last,
    spanPixels,
    spanFraction: frame.pixelCount > 1 ? Math.min(1, spanPixels / (frame.pixelCount - 1)) : 0,
    enoughLinesForCubic: enough,
    fit,
    note: notes.length > 0 ? notes.join('; ') : null,
  };
}

/**
 * The calibration-line report for a schema-valid design and a line list (`calibrationLineList`).
 * Never throws; every number is finite; lists are capped at `MAX_LISTED_CALIBRATION_ITEMS` with
 * counts beside them. Pairs are resolved by `isPairResolved` at the monochromator bandpass.
 */
export function calibrationReport(design: Design, lines: readonly CalibrationLine[]): CalibrationReport {
  const plan = prepareDesign(design);
  const usable = lines
    .filter((line) => isUsableWavelength(line.wavelengthNm))
    .sort((a, b) => a.wavelengthNm - b.wavelengthNm);
  const frame = detectorFrame(design, plan);
  const { startNm, endNm } = design.range;
  const inRange = usable.filter((line) => line.wavelengthNm >= startNm && line.wavelengthNm <= endNm);
  const { pairs, pairCount, unresolved } = linePairs(plan, inRange);
  const ghostList = ghosts(design, plan, frame, usable);
  return {
    lineCount: usable.length,
    linesInRange: inRange.slice(0, MAX_LISTED_CALIBRATION_ITEMS).map((line) => lineInRange(plan, frame, line)),
    linesInRangeCount: inRange.length,
    linesInRangeTruncated: inRange.length > MAX_LISTED_CALIBRATION_ITEMS,
    pairs,
    pairCount,
    unresolvedPairCount: unresolved,
    pairsTruncated: pairCount > pairs.length,
    ghosts: ghostList.listed,
    ghostCount: ghostList.count,
    ghostsTruncated: ghostList.count > ghostList.listed.length,
    coverage: frame ? coverage(plan, frame, usable) : null,
  };
}
