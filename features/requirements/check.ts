/**
 * Checks a design against its own requirements with the ordinary solver: the same numbers the
 * workbench shows, so a pass here is a pass there. Per-wavelength requirements (bandpass,
 * resolving power, blaze efficiency, pixels per bandpass, reciprocal dispersion) are checked over
 * the range sweep or exactly at `atWavelengthsNm`; the drive's wavelength error and order overlap
 * over the range sweep; the rest from the design summary and the sketch's outline. A bandpass
 * limit with `bandpassBasis: 'traced'` is judged on the exact ray trace's FWHM instead, at a few
 * wavelengths (traced-bandpass.ts).
 */

import type { Design } from '../../shared/design';
import { formatNumber, formatPercent } from '../../shared/format';
import { REQUIREMENT_IDS, type RequirementId, type Requirements } from '../../shared/requirements';
import {
  DEFAULT_POINTS,
  UM_PER_MM,
  evaluateDesign,
  sweepWavelengthsNm,
  type DesignSummary,
  type WavelengthPoint,
} from '../solver';
import { designFootprintMm } from './footprint';
import { tracedBandpassesAt, tracedRequirementWavelengthsNm } from './traced-bandpass';
import type { RequirementCheck, RequirementsReport } from './types';

/** Wavelengths a range-wide requirement is checked at: the solver's default sweep, ends included. */
export const REQUIREMENT_POINTS = DEFAULT_POINTS;

export interface CheckOptions {
  /** Evenly spaced wavelengths over the range (default `REQUIREMENT_POINTS`). */
  points?: number;
}

type Limit = 'max' | 'min';

/** A requirement judged wavelength by wavelength from the solver's point. */
interface PointRule {
  id: RequirementId;
  kind: Limit;
  /** 'listed': at `atWavelengthsNm` when given, else the sweep; 'range': always the sweep. */
  scope: 'listed' | 'range';
  limit: (r: Requirements) => number | undefined;
  /** The figure at a reachable point; null where the design cannot say (no detector…). */
  value: (p: WavelengthPoint, design: Design, r: Requirements) => number | null;
  /** "bandpass 0.62 nm": the figure in words. */
  words: (valueText: string) => string;
  unit: string;
  fixPath: string;
  /** Why the design cannot be judged on this at all (no detector…), or null when it can. */
  missing?: (design: Design, r: Requirements) => string | null;
}

const withUnit = (unit: string) => (unit ? `\u00A0${unit}` : '');

const POINT_RULES: readonly PointRule[] = [
  {
    id: 'maxBandpassNm',
    kind: 'max',
    scope: 'listed',
    limit: (r) => r.maxBandpassNm,
    value: (p) => p.bandpassNm,
    words: (v) => `bandpass ${v}`,
    unit: 'nm',
    fixPath: 'slits.exitWidthUm',
  },
  {
    id: 'minResolvingPower',
    kind: 'min',
    scope: 'listed',
    limit: (r) => r.minResolvingPower,
    value: (p) => p.resolvingPower,
    words: (v) => `resolving power ${v}`,
    unit: '',
    fixPath: 'slits.exitWidthUm',
  },
  {
    id: 'minBlazeEfficiency',
    kind: 'min',
    scope: 'listed',
    limit: (r) => r.minBlazeEfficiency,
    value: (p) => p.blazeEfficiency,
    words: (v) => `blaze efficiency ${v}`,
    unit: '',
    fixPath: 'grating.blazeWavelengthNm',
    missing: (design) =>
      design.grating.blazeWavelengthNm === undefined
        ? 'no blaze wavelength: give the grating’s blaze to check its efficiency'
        : null,
  },
  {
    id: 'minRelativeThroughput',
    kind: 'min',
    scope: 'listed',
    limit: (r) => r.minRelativeThroughput,
    value: (p) => p.relativeThroughput,
    words: (v) => `relative throughput ${v}`,
    unit: '',
    fixPath: 'grating.blazeWavelengthNm',
    missing: (design) =>
      design.grating.blazeWavelengthNm === undefined && !(design.curves ?? []).some((c) => c.kind !== 'line-list' && c.kind !== 'source-spectrum') && !design.input
        ? 'nothing to count: give the grating’s blaze, a measured curve or the light input to check the throughput'
        : null,
  },
  {
    id: 'minPixelsPerBandpass',
    kind: 'min',
    scope: 'listed',
    limit: (r) => r.minPixelsPerBandpass,
    value: (p, design) => pixelsPerBandpass(p, design),
    words: (v) => `${v} pixels per bandpass`,
    unit: '',
    fixPath: 'detector.pixelPitchUm',
    missing: (design) => (design.detector ? null : 'no detector: add one to check pixels per bandpass'),
  },
  {
    id: 'maxReciprocalDispersionNmPerMm',
    kind: 'max',
    scope: 'listed',
    limit: (r) => r.maxReciprocalDispersionNmPerMm,
    value: (p) => p.reciprocalDispersionNmPerMm,
    words: (v) => `reciprocal dispersion ${v}`,
    unit: 'nm/mm',
    fixPath: 'layout.cameraFocalMm',
  },
  {
    id: 'maxWavelengthErrorNm',
    kind: 'max',
    scope: 'range',
    limit: (r) => r.maxWavelengthErrorNm,
    value: (p, _design, r) =>
      p.scanSensitivityNmPerArcsec === null || r.driveStepArcsec === undefined
        ? null
        : r.driveStepArcsec * Math.abs(p.scanSensitivityNmPerArcsec),
    words: (v) => `wavelength error ${v}`,
    unit: 'nm',
    fixPath: 'grating.grooveDensityPerMm',
    missing: (_design, r) =>
      r.driveStepArcsec === undefined ? 'no drive step: give driveStepArcsec to check the wavelength error' : null,
  },
];

/**
 * Detector pixels across one slit-limited bandpass, `bandpass × dx/dλ / pitch` (the wider of the
 * entrance image and the exit slit, in pixels); null without a detector or a reachable point.
 * Two is Nyquist sampling (common practice).
 */
export function pixelsPerBandpass(point: WavelengthPoint, design: Design): number | null {
  if (!design.detector || point.bandpassNm === null || point.linearDispersionMmPerNm === null) return null;
  return (point.bandpassNm * point.linearDispersionMmPerNm) / (design.detector.pixelPitchUm / UM_PER_MM);
}

function isLimitSet(requirements: Requirements, id: RequirementId): boolean {
  if (id === 'oneShotCoverage') return requirements.oneShotCoverage === true;
  if (id === 'orderOverlap') return requirements.orderOverlap !== undefined;
  return requirements[id] !== undefined;
}

/** The requirements present on `design`, in `REQUIREMENT_IDS` order. */
export function presentRequirements(design: Design): RequirementId[] {
  const requirements = design.requirements;
  if (!requirements) return [];
  return REQUIREMENT_IDS.filter((id) => isLimitSet(requirements, id));
}

/** Whether the design holds at least one limit (a wavelength list or drive step alone is none). */
export function hasRequirements(design: Design): boolean {
  return presentRequirements(design).length > 0;
}

/** Whether `maxBandpassNm` is judged on the traced FWHM rather than the slit-limited one. */
export function bandpassIsTraced(requirements: Requirements): boolean {
  return requirements.bandpassBasis === 'traced';
}

/** Relative match for "is this one of the listed wavelengths": a plot's sweep may carry rounding. */
const SAME_WAVELENGTH = 1e-9;

function appliesAt(rule: PointRule, requirements: Requirements, wavelengthNm: number): boolean {
  const listed = requirements.atWavelengthsNm;
  if (rule.scope === 'range' || listed === undefined) return true;
  return listed.some((nm) => Math.abs(nm - wavelengthNm) <= SAME_WAVELENGTH * nm);
}

/** Whether `rule` fails at `point`: unreachable, or its figure past the limit. Unknown figures never fail. */
function ruleFails(rule: PointRule, limit: number, point: WavelengthPoint, design: Design, r: Requirements): boolean {
  if (!point.reachable) return true;
  const value = rule.value(point, design, r);
  if (value === null) return false;
  return rule.kind === 'max' ? value > limit : value < limit;
}

/**
 * The requirements `point` breaks, for shading a plot with its own sweep. Requirements limited to
 * `atWavelengthsNm` are judged only at those wavelengths; an unreachable point fails every
 * wavelength requirement that applies there (and that the design can be judged on: pixels per
 * bandpass needs a detector, blaze efficiency a blaze wavelength); `orderOverlap: 'forbidden'` fails where another
 * order lands. A traced bandpass limit is left out: the sweep's points carry no traced figure
 * (tracing every point would cost the edit its frame), so only `checkRequirements` judges it.
 */
export function requirementFailsAt(
  requirements: Requirements,
  point: WavelengthPoint,
  design: Design,
): RequirementId[] {
  const failing = new Set<RequirementId>();
  for (const rule of POINT_RULES) {
    const limit = rule.limit(requirements);
    if (limit === undefined || !appliesAt(rule, requirements, point.wavelengthNm)) continue;
    if (rule.id === 'maxBandpassNm' && bandpassIsTraced(requirements)) continue;
    if (rule.missing?.(design, requirements)) continue;
    if (ruleFails(rule, limit, point, design, requirements)) failing.add(rule.id);
  }
  if (requirements.orderOverlap === 'forbidden' && point.overlapCount > 0) failing.add('orderOverlap');
  if (requirements.orderOverlap === 'filtered' && point.unblockedOverlapCount > 0) failing.add('orderOverlap');
  return REQUIREMENT_IDS.filter((id) => failing.has(id));
}

// Words ------------------------------------------------------------------------------------------

function valueText(value: number, unit: string): string {
  return `${formatNumber(value)}${withUnit(unit)}`;
}

/** "24 %", with a decimal or two when the figure is small, so a near miss never reads "0 % over". */
function percentText(fraction: number): string {
  const abs = Math.abs(fraction);
  const digits = abs >= 0.1 ? 0 : abs >= 0.01 ? 1 : 2;
  return formatPercent(abs, { maximumFractionDigits: digits });
}

function marginWords(margin: number, kind: Limit): string {
  if (margin >= 0) return `${percentText(margin)} to spare`;
  return `${percentText(margin)} ${kind === 'max' ? 'over' : 'short'}`;
}

function limitText(words: (v: string) => string, kind: Limit, limit: number, unit: string): string {
  const noun = words('').trim();
  return `${noun} ${kind === 'max' ? '≤' : '≥'} ${valueText(limit, unit)}`;
}

/** Signed fraction of the limit, positive = headroom. */
export function requirementMargin(kind: Limit, worst: number, limit: number): number {
  return kind === 'max' ? (limit - worst) / limit : (worst - limit) / limit;
}

/** "950 nm" or "950–1000 nm". */
function spanText([from, to]: readonly [number, number]): string {
  return from === to ? valueText(from, 'nm') : `${formatNumber(from)}–${valueText(to, 'nm')}`;
}

function spansText(spans: readonly (readonly [number, number])[]): string {
  const shown = spans.slice(0, 3).map(spanText).join(', ');
  return spans.length > 3 ? `${shown} and ${spans.length - 3} more` : shown;
}

/** Contiguous runs of failing points, in the order given (sorted by wavelength). */
export function failingSpans<T extends { wavelengthNm: number }>(points: readonly T[], fails: (p: T) => boolean): [number, number][] {
  const spans: [number, number][] = [];
  let open: [number, number] | null = null;
  for (const point of points) {
    if (fails(point)) {
      if (open) open[1] = point.wavelengthNm;
      else open = [point.wavelengthNm, point.wavelengthNm];
    } else if (open) {
      spans.push(open);
      open = null;
    }
  }
  if (open) spans.push(open);
  return spans;
}

// Checks -----------------------------------------------------------------------------------------

function unknownCheck(
  id: RequirementId,
  text: string,
  limit: number | null,
  message: string,
  fixPath: string | null,
): RequirementCheck {
  return {
    id,
    status: 'unknown',
    limitText: text,
    worst: null,
    limit,
    worstWavelengthNm: null,
    margin: null,
    message,
    failingSpansNm: [],
    fixPath,
  };
}

/** An Ebert–Fastie's camera is its collimator mirror: its editor hides the camera fields, so a fix opens the one mirror's. */
function fixPathIn(design: Design, path: string): string {
  return design.layout.kind === 'ebert-fastie' && path === 'layout.cameraFocalMm' ? 'layout.collimatorFocalMm' : path;
}

function pointCheck(
  rule: PointRule,
  limit: number,
  points: readonly WavelengthPoint[],
  design: Design,
  r: Requirements,
): RequirementCheck {
  const text = limitText(rule.words, rule.kind, limit, rule.unit);
  const fixPath = fixPathIn(design, rule.fixPath);
  const missing = rule.missing?.(design, r);
  if (missing) return unknownCheck(rule.id, text, limit, missing, fixPath);
  const spans = failingSpans(points, (p) => ruleFails(rule, limit, p, design, r));
  const unreachable = points.filter((p) => !p.reachable);
  let worst: number | null = null;
  let worstNm: number | null = null;
  for (const point of points) {
    const value = point.reachable ? rule.value(point, design, r) : null;
    if (value === null) continue;
    if (worst === null || (rule.kind === 'max' ? value > worst : value < worst)) {
      worst = value;
      worstNm = point.wavelengthNm;
    }
  }
  const base = { id: rule.id, limitText: text, limit, failingSpansNm: spans, fixPath };
  if (unreachable.length > 0) {
    const where = spansText(failingSpans(points, (p) => !p.reachable));
    const elsewhere =
      worst === null || worstNm === null
        ? ''
        : ` (${rule.words(valueText(worst, rule.unit))} at worst where reachable, at ${valueText(worstNm, 'nm')})`;
    return {
      ...base,
      status: 'fail',
      worst: null,
      worstWavelengthNm: unreachable[0]!.wavelengthNm,
      margin: null,
      message: `${rule.words('').trim()} unreachable at ${where}${elsewhere}`,
    };
  }
  if (worst === null || worstNm === null) {
    return unknownCheck(rule.id, text, limit, `${rule.words('').trim()}: no value to check`, fixPath);
  }
  const margin = requirementMargin(rule.kind, worst, limit);
  const passes = spans.length === 0;
  const figure = rule.words(valueText(worst, rule.unit));
  const place = passes ? `at worst (${valueText(worstNm, 'nm')})` : `at ${valueText(worstNm, 'nm')}`;
  return {
    ...base,
    status: passes ? 'pass' : 'fail',
    worst,
    worstWavelengthNm: worstNm,
    margin,
    message: `${figure} ${place}, ${marginWords(margin, rule.kind)}`,
  };
}

/** A design-wide figure against a limit. */
function scalarCheck(
  id: RequirementId,
  kind: Limit,
  worst: number,
  limit: number,
  text: string,
  figure: string,
  fixPath: string,
): RequirementCheck {
  const margin = requirementMargin(kind, worst, limit);
  const passes = kind === 'max' ? worst <= limit : worst >= limit;
  return {
    id,
    status: passes ? 'pass' : 'fail',
    limitText: text,
    worst,
    limit,
    worstWavelengthNm: null,
    margin,
    message: `${figure}, ${marginWords(margin, kind)}`,
    failingSpansNm: [],
    fixPath,
  };
}

function fNumberCheck(limit: number, summary: DesignSummary): RequirementCheck {
  const text = `f-number ≤ ${formatNumber(limit)}`;
  const fix = 'layout.collimatorFocalMm';
  if (summary.fNumberProjectedWidth === null) {
    return unknownCheck(
      'maxFNumber',
      text,
      limit,
      'the range centre is unreachable, so the beam width across the grating is unknown',
      fix,
    );
  }
  const acrossIsSlower = summary.fNumberProjectedWidth >= summary.fNumberHeight;
  const worst = acrossIsSlower ? summary.fNumberProjectedWidth : summary.fNumberHeight;
  const which = acrossIsSlower ? 'across the grating' : 'along the slit';
  return scalarCheck('maxFNumber', 'max', worst, limit, text, `collimator f/${formatNumber(worst, 3)} ${which}`, fix);
}

function focalCheck(limit: number, design: Design): RequirementCheck {
  const { collimatorFocalMm, cameraFocalMm } = design.layout;
  const cameraLonger = cameraFocalMm > collimatorFocalMm;
  const worst = cameraLonger ? cameraFocalMm : collimatorFocalMm;
  const which = collimatorFocalMm === cameraFocalMm ? 'both' : cameraLonger ? 'camera' : 'collimator';
  return scalarCheck(
    'maxFocalLengthMm',
    'max',
    worst,
    limit,
    `focal length ≤ ${valueText(limit, 'mm')}`,
    `focal length ${valueText(worst, 'mm')} (${which})`,
    'layout.collimatorFocalMm',
  );
}

function footprintCheck(limit: NonNullable<Requirements['maxFootprintMm']>, design: Design): RequirementCheck {
  const footprint = designFootprintMm(design);
  const widthMargin = requirementMargin('max', footprint.widthMm, limit.widthMm);
  const depthMargin = requirementMargin('max', footprint.depthMm, limit.depthMm);
  const widthWorse = widthMargin <= depthMargin;
  const passes = footprint.widthMm <= limit.widthMm && footprint.depthMm <= limit.depthMm;
  const margin = widthWorse ? widthMargin : depthMargin;
  const [worseName, worseValue, otherName, otherValue, otherMargin] = widthWorse
    ? (['width', footprint.widthMm, 'depth', footprint.depthMm, depthMargin] as const)
    : (['depth', footprint.depthMm, 'width', footprint.widthMm, widthMargin] as const);
  const other = `${otherName} ${valueText(otherValue, 'mm')} ${otherMargin >= 0 ? 'fits' : 'over too'}`;
  return {
    id: 'maxFootprintMm',
    status: passes ? 'pass' : 'fail',
    limitText: `footprint ≤ ${formatNumber(limit.widthMm)} × ${valueText(limit.depthMm, 'mm')} (width × depth)`,
    worst: worseValue,
    limit: widthWorse ? limit.widthMm : limit.depthMm,
    worstWavelengthNm: null,
    margin,
    message: `footprint ${worseName} ${valueText(worseValue, 'mm')}, ${marginWords(margin, 'max')} (${other})`,
    failingSpansNm: [],
    fixPath: 'layout.collimatorFocalMm',
  };
}

function coverageCheck(design: Design, summary: DesignSummary): RequirementCheck {
  const text = 'whole range on the detector at one setting';
  const fix = 'detector.pixelCount';
  if (!design.detector) {
    return unknownCheck('oneShotCoverage', text, null, 'no detector: add one to check one-shot coverage', fix);
  }
  const { startNm, endNm } = design.range;
  const coverage = summary.detector;
  const base = {
    id: 'oneShotCoverage' as const,
    limitText: text,
    worst: null,
    limit: null,
    worstWavelengthNm: null,
    margin: null,
    fixPath: fix,
  };
  if (!coverage) {
    return {
      ...base,
      status: 'fail',
      message: 'the range centre is unreachable, so the grating cannot be set for the detector',
      failingSpansNm: [[startNm, endNm]],
    };
  }
  const seen = `detector sees ${formatNumber(coverage.startNm)}–${valueText(coverage.endNm ?? NaN, 'nm')}`;
  if (coverage.coversRange) {
    return { ...base, status: 'pass', message: `${seen}, the whole range`, failingSpansNm: [] };
  }
  const missing: [number, number][] = [];
  if (coverage.startNm === null || coverage.startNm > startNm) {
    missing.push([startNm, coverage.startNm === null ? (startNm + endNm) / 2 : Math.min(coverage.startNm, endNm)]);
  }
  if (coverage.endNm === null || coverage.endNm < endNm) {
    missing.push([coverage.endNm === null ? (startNm + endNm) / 2 : Math.max(coverage.endNm, startNm), endNm]);
  }
  return {
    ...base,
    status: 'fail',
    message: `${seen}; it misses ${missing.map(spanText).join(' and ')}`,
    failingSpansNm: missing,
  };
}

function overlapCheck(policy: NonNullable<Requirements['orderOverlap']>, points: readonly WavelengthPoint[]): RequirementCheck {
  const base = {
    id: 'orderOverlap' as const,
    limitText: `order overlap ${policy}`,
    worst: null,
    limit: null,
    worstWavelengthNm: null,
    margin: null,
    // The fix is a filter plan (the order-sorting card), not one field.
    fixPath: null,
  };
  if (policy === 'allowed') {
    return { ...base, status: 'pass', message: 'other orders are allowed', failingSpansNm: [] };
  }
  if (policy === 'filtered') {
    const spans = failingSpans(points, (p) => p.unblockedOverlapCount > 0);
    if (spans.length === 0) {
      return {
        ...base,
        status: 'pass',
        message: points.some((p) => p.overlapCount > 0)
          ? 'the order-sorting filters block every other order'
          : 'no other order lands in the range',
        failingSpansNm: [],
      };
    }
    let worst = points[0]!;
    for (const point of points) if (point.unblockedOverlapCount > worst.unblockedOverlapCount) worst = point;
    return {
      ...base,
      status: 'fail',
      worst: worst.unblockedOverlapCount,
      worstWavelengthNm: worst.wavelengthNm,
      message:
        `no filter blocks the other orders landing on ${spansText(spans)} ` +
        `(${worst.unblockedOverlapCount} at ${valueText(worst.wavelengthNm, 'nm')}): use the proposed order-sorting plan`,
      failingSpansNm: spans,
    };
  }
  const spans = failingSpans(points, (p) => p.overlapCount > 0);
  if (spans.length === 0) {
    return { ...base, status: 'pass', message: 'no other order lands in the range', failingSpansNm: [] };
  }
  let worst = points[0]!;
  for (const point of points) if (point.overlapCount > worst.overlapCount) worst = point;
  return {
    ...base,
    status: 'fail',
    worst: worst.overlapCount,
    worstWavelengthNm: worst.wavelengthNm,
    message: `other orders land on ${spansText(spans)} (${worst.overlapCount} at ${valueText(worst.wavelengthNm, 'nm')})`,
    failingSpansNm: spans,
  };
}

/**
 * `maxBandpassNm` against the exact trace's FWHM at the listed wavelengths, or at the range's
 * start, quarter points, centre and end. A wavelength the trace cannot send through, or whose
 * traced line shape has no half-maximum width, fails with the reason: it never passes unseen.
 */
function tracedBandpassCheck(limit: number, design: Design, r: Requirements): RequirementCheck {
  const text = `traced bandpass ≤ ${valueText(limit, 'nm')}`;
  const fixPath = 'slits.exitWidthUm';
  const wavelengthsNm = r.atWavelengthsNm
    ? [...r.atWavelengthsNm].sort((a, b) => a - b)
    : tracedRequirementWavelengthsNm(design);
  const traced = tracedBandpassesAt(design, wavelengthsNm);
  if (!traced.ok) return unknownCheck('maxBandpassNm', text, limit, `the ray trace could not run: ${traced.reason}`, fixPath);
  const { points } = traced;
  const fails = (p: (typeof points)[number]) => !p.reachable || p.fwhmNm === null || p.fwhmNm > limit;
  const spans = failingSpans(points, fails);
  let worst: (typeof points)[number] | null = null;
  for (const point of points) {
    if (point.fwhmNm !== null && (worst === null || point.fwhmNm > worst.fwhmNm!)) worst = point;
  }
  const base = { id: 'maxBandpassNm' as const, limitText: text, limit, failingSpansNm: spans, fixPath };
  const atWorst =
    worst === null
      ? ''
      : ` (traced bandpass ${valueText(worst.fwhmNm!, 'nm')} at worst where traced, at ${valueText(worst.wavelengthNm, 'nm')})`;
  // Wavelengths with no traced figure fail, named, never pass: first the unreachable, then the unmeasured.
  const listed = (list: typeof points) => list.map((p) => valueText(p.wavelengthNm, 'nm')).join(', ');
  const failAt = (list: typeof points, message: string): RequirementCheck => ({
    ...base,
    status: 'fail',
    worst: null,
    worstWavelengthNm: list[0]!.wavelengthNm,
    margin: null,
    message,
  });
  const unreachable = points.filter((p) => !p.reachable);
  if (unreachable.length > 0) return failAt(unreachable, `traced bandpass unreachable at ${listed(unreachable)}${atWorst}`);
  const unmeasured = points.filter((p) => p.fwhmNm === null);
  if (unmeasured.length > 0) {
    return failAt(
      unmeasured,
      `the traced line shape has no half-maximum width at ${listed(unmeasured)} ` +
        `(too little light reaches the exit slit to measure it)${atWorst}`,
    );
  }
  const found = worst!;
  const margin = requirementMargin('max', found.fwhmNm!, limit);
  const passes = spans.length === 0;
  const place = passes ? `at worst (${valueText(found.wavelengthNm, 'nm')})` : `at ${valueText(found.wavelengthNm, 'nm')}`;
  const slitLimited = found.slitLimitedNm === null ? '' : `; slit-limited ${valueText(found.slitLimitedNm, 'nm')}`;
  return {
    ...base,
    status: passes ? 'pass' : 'fail',
    worst: found.fwhmNm,
    worstWavelengthNm: found.wavelengthNm,
    margin,
    message: `traced bandpass ${valueText(found.fwhmNm!, 'nm')} ${place}, ${marginWords(margin, 'max')}${slitLimited}`,
  };
}

function tally(checks: RequirementCheck[]): RequirementsReport {
  return {
    checks,
    passed: checks.filter((c) => c.status === 'pass').length,
    failed: checks.filter((c) => c.status === 'fail').length,
    unknown: checks.filter((c) => c.status === 'unknown').length,
  };
}

/**
 * Every requirement on `design` against the design itself: one check per requirement present, in
 * `REQUIREMENT_IDS` order. The design is evaluated once, over `points` evenly spaced wavelengths of
 * its range plus any `atWavelengthsNm`, with `evaluateDesign`.
 */
export function checkRequirements(design: Design, options: CheckOptions = {}): RequirementsReport {
  const requirements = design.requirements;
  const present = presentRequirements(design);
  if (!requirements || present.length === 0) return tally([]);

  const sweepNm = sweepWavelengthsNm(design.range.startNm, design.range.endNm, options.points ?? REQUIREMENT_POINTS);
  const listedNm = requirements.atWavelengthsNm ? [...requirements.atWavelengthsNm].sort((a, b) => a - b) : [];
  const evaluation = evaluateDesign(design, { wavelengthsNm: [...sweepNm, ...listedNm] });
  const sweep = evaluation.points.slice(0, sweepNm.length);
  const listed = listedNm.length > 0 ? evaluation.points.slice(sweepNm.length) : sweep;
  const summary = evaluation.design;

  const checks: RequirementCheck[] = [];
  for (const id of present) {
    const rule = POINT_RULES.find((candidate) => candidate.id === id);
    const limit = rule?.limit(requirements);
    if (id === 'maxBandpassNm' && limit !== undefined && bandpassIsTraced(requirements)) {
      checks.push(tracedBandpassCheck(limit, design, requirements));
    } else if (rule && limit !== undefined) {
      checks.push(pointCheck(rule, limit, rule.scope === 'listed' ? listed : sweep, design, requirements));
    } else if (id === 'maxFNumber' && requirements.maxFNumber !== undefined) {
      checks.push(fNumberCheck(requirements.maxFNumber, summary));
    } else if (id === 'maxFocalLengthMm' && requirements.maxFocalLengthMm !== undefined) {
      checks.push(focalCheck(requirements.maxFocalLengthMm, design));
    } else if (id === 'maxFootprintMm' && requirements.maxFootprintMm !== undefined) {
      checks.push(footprintCheck(requirements.maxFootprintMm, design));
    } else if (id === 'oneShotCoverage') {
      checks.push(coverageCheck(design, summary));
    } else if (id === 'orderOverlap' && requirements.orderOverlap !== undefined) {
      checks.push(overlapCheck(requirements.orderOverlap, sweep));
    }
  }
  return tally(checks);
}
