/**
 * Design warnings, each in plain words with the fix. Per-wavelength conditions are folded into
 * one warning per kind (with the first offending wavelength), so a 1,000-point sweep gives a
 * readable list rather than a thousand lines.
 */

import type { LightBudget } from './light-budget';
import { lightBudgetWarnings } from './light-budget-warnings';
import { formatNumber } from '../../shared/format';
import { ORDER_SORTING_RULES } from './order-sorting';
import type { DesignSummary, OrderSortingSummary, Warning, WavelengthPoint } from './results';

/** Beyond this angle from the grating normal, efficiency and imaging degrade fast (common practice). */
export const NEAR_GRAZING_DEG = 80;
/**
 * Fewer detector pixels across one resolution element than this undersample the line shape
 * (Nyquist: two samples per resolution element; common practice asks 2–3).
 */
export const MIN_PIXELS_PER_ELEMENT = 2;
/**
 * Above this λ/d the efficiency of a real grating depends on polarisation and groove profile
 * (the resonance domain) and no scalar estimate holds: Palmer & Loewen, Diffraction Grating
 * Handbook, ch. 9 (scalar region λ/d < 0.2; from memory).
 */
export const SCALAR_LIMIT_LAMBDA_OVER_D = 0.2;
/**
 * Below this many illuminated grooves the closed forms built on many grooves (|m|N, λ/(|m|N), the
 * sinc² blaze envelope, a sharp principal maximum) grow rough (from memory).
 */
export const FEW_GROOVES = 100;
/**
 * Faster than this f-number the paraxial closed forms (focal lengths, anamorphic magnification,
 * Coddington astigmatism) lose their accuracy and aberrations dominate (common practice).
 */
export const TRUSTED_F_NUMBER = 1;

const POSITION_WORDS = { start: 'range start', centre: 'centre', end: 'range end' } as const;

const listFormat = new Intl.ListFormat('en', { style: 'long', type: 'conjunction' });
/** Blaze efficiency, relative to its peak, below which a wavelength is flagged. */
export const LOW_EFFICIENCY = 0.2;

interface Tally {
  count: number;
  first: WavelengthPoint | null;
  minNm: number;
  maxNm: number;
}

function tally(): Tally {
  return { count: 0, first: null, minNm: Infinity, maxNm: -Infinity };
}

function add(t: Tally, point: WavelengthPoint): void {
  t.count++;
  if (t.first === null) t.first = point;
  if (point.wavelengthNm < t.minNm) t.minNm = point.wavelengthNm;
  if (point.wavelengthNm > t.maxNm) t.maxNm = point.wavelengthNm;
}

function where(t: Tally, total: number): string {
  const span =
    t.minNm === t.maxNm
      ? `at ${formatNumber(t.minNm)} nm`
      : `between ${formatNumber(t.minNm)} and ${formatNumber(t.maxNm)} nm`;
  return t.count === total ? `Everywhere evaluated (${span})` : `At ${t.count} of ${total} wavelengths ${span}`;
}

function ordinal(order: number): string {
  const n = Math.abs(order);
  const teen = n % 100 >= 11 && n % 100 <= 13;
  const suffix = teen ? 'th' : (['th', 'st', 'nd', 'rd'][n % 10] ?? 'th');
  return `${order < 0 ? '−' : ''}${n}${suffix}`;
}

/** Folds per-wavelength conditions and design-wide checks into warnings. */
export function collectWarnings(
  points: readonly WavelengthPoint[],
  summary: DesignSummary,
  order: number,
  orderSorting: OrderSortingSummary | null = null,
  light: LightBudget | null = null,
): Warning[] {
  const unreachable = tally();
  const grazing = tally();
  const belowLimit = tally();
  const overlap = tally();
  const attenuated = tally();
  let lowestFilterTransmission = 1;
  const lowEfficiency = tally();
  const beyondScalar = tally();
  let largestLambdaOverD = 0;

  for (const p of points) {
    if (!p.reachable) {
      add(unreachable, p);
      continue;
    }
    if (Math.abs(p.incidenceDeg ?? 0) > NEAR_GRAZING_DEG || Math.abs(p.diffractionDeg ?? 0) > NEAR_GRAZING_DEG) {
      add(grazing, p);
    }
    if (p.bandpassNm !== null && p.bandpassNm < p.diffractionLimitNm) add(belowLimit, p);
    if (p.unblockedOverlapCount > 0) add(overlap, p);
    if (p.filterTransmission < ORDER_SORTING_RULES.attenuationWarning) {
      add(attenuated, p);
      lowestFilterTransmission = Math.min(lowestFilterTransmission, p.filterTransmission);
    }
    if (p.blazeEfficiency !== null && p.blazeEfficiency < LOW_EFFICIENCY) add(lowEfficiency, p);
    const lambdaOverD = p.wavelengthNm / summary.grooveSpacingNm;
    if (p.blazeEfficiency !== null && lambdaOverD > SCALAR_LIMIT_LAMBDA_OVER_D) {
      add(beyondScalar, p);
      largestLambdaOverD = Math.max(largestLambdaOverD, lambdaOverD);
    }
  }

  const total = points.length;
  const warnings: Warning[] = [];

  if (unreachable.first) {
    warnings.push({
      code: 'unreachable',
      wavelengthNm: unreachable.first.wavelengthNm,
      message:
        `${where(unreachable, total)} no grating angle delivers the light: ` +
        `${unreachable.first.reason ?? 'unreachable'}. ` +
        'Use a coarser grating, a lower order or a smaller deviation angle, or shorten the range.',
    });
  }
  if (grazing.first) {
    warnings.push({
      code: 'near-grazing',
      wavelengthNm: grazing.first.wavelengthNm,
      message:
        `${where(grazing, total)} the light meets or leaves the grating more than ` +
        `${NEAR_GRAZING_DEG}° from its normal, where efficiency and image quality fall off. ` +
        'Use a coarser grating, a lower order or a smaller deviation angle.',
    });
  }
  if (belowLimit.first) {
    const p = belowLimit.first;
    const bandpass = p.bandpassNm ?? 0;
    // Exit width whose bandpass equals the diffraction limit.
    const neededUm = p.reciprocalDispersionNmPerMm
      ? (p.diffractionLimitNm / p.reciprocalDispersionNmPerMm) * 1000
      : null;
    warnings.push({
      code: 'below-diffraction-limit',
      wavelengthNm: p.wavelengthNm,
      message:
        `${where(belowLimit, total)} the slits are narrower than the diffraction limit ` +
        `(slit bandpass ${formatNumber(bandpass)} nm, diffraction limit ` +
        `${formatNumber(p.diffractionLimitNm)} nm at ${formatNumber(p.wavelengthNm)} nm), so the ` +
        'grating, not the slits, sets the resolution and the narrower slits only cost light. ' +
        (neededUm !== null
          ? `Widen the slits to about ${formatNumber(neededUm, 3)} µm at the exit, or illuminate more grooves.`
          : 'Widen the slits or illuminate more grooves.'),
    });
  }
  if (overlap.first) {
    const p = overlap.first;
    const example = p.overlaps.find((o) => !o.blocked) ?? p.overlaps[0];
    const filtered = (orderSorting?.filterChangesNm.length ?? 0) > 0 || p.filterTransmission < 1;
    const plan = orderSorting?.proposedFilters ?? [];
    const planBlocksAll = plan.length > 0 && orderSorting?.proposedUnblockedOverlaps === 0;
    const fix = planBlocksAll
      ? ` Use the proposed order-sorting plan (${plan.length} long-pass filter${plan.length === 1 ? '' : 's'}), or narrow the source range.`
      : Math.abs(order) > 1
        ? ' Long-pass filters block only the shorter orders: block the lower ones with a short-pass or band-pass filter or a cross-disperser, or narrow the source range.'
        : ' Add an order-sorting filter or narrow the source range.';
    warnings.push({
      code: 'order-overlap',
      wavelengthNm: p.wavelengthNm,
      message:
        `${where(overlap, total)} light the source emits in other orders leaves the grating at ` +
        'the same angle' +
        (filtered ? ' and no filter in the beam blocks it' : '') +
        (example
          ? ` (for example ${ordinal(example.order)} order ${formatNumber(example.wavelengthNm)} nm lands on ` +
            `${formatNumber(p.wavelengthNm)} nm in order ${order})`
          : '') +
        '.' +
        fix,
    });
  }
  if (attenuated.first) {
    warnings.push({
      code: 'filter-attenuates',
      wavelengthNm: attenuated.first.wavelengthNm,
      message:
        `${where(attenuated, total)} an order-sorting filter in the beam cuts into the working wavelength ` +
        `(down to ${formatNumber(lowestFilterTransmission * 100, 3)} % passed). ` +
        'Switch it in at a longer wavelength or choose a shorter cut-on.',
    });
  }
  if (lowEfficiency.first) {
    const blaze = summary.blazeWavelengthInMountNm;
    warnings.push({
      code: 'low-efficiency',
      wavelengthNm: lowEfficiency.first.wavelengthNm,
      message:
        `${where(lowEfficiency, total)} the scalar blaze estimate falls below ` +
        `${LOW_EFFICIENCY * 100} % of its peak` +
        (blaze !== null ? ` (the peak is at ${formatNumber(blaze)} nm in this mount and order)` : '') +
        '. Choose a grating blazed nearer the range, or split the range.',
    });
  }
  if (beyondScalar.first) {
    warnings.push({
      code: 'beyond-scalar-blaze',
      wavelengthNm: beyondScalar.first.wavelengthNm,
      message:
        `${where(beyondScalar, total)} λ/d exceeds ${SCALAR_LIMIT_LAMBDA_OVER_D} (up to ` +
        `${formatNumber(largestLambdaOverD, 3)}), where a real grating's efficiency depends on polarisation ` +
        'and groove profile and the scalar blaze estimate can be off by tens of per cent (Palmer & Loewen, ' +
        'Diffraction Grating Handbook, ch. 9). Read the efficiency curve as a rough guide there and take ' +
        "throughput from the grating maker's measured curves.",
    });
  }
  if (summary.illuminatedGrooves < FEW_GROOVES) {
    warnings.push({
      code: 'few-grooves',
      message:
        `Only ${formatNumber(summary.illuminatedGrooves, 3)} grooves are illuminated. The resolving power ` +
        `|m|N, the diffraction limit and the blaze envelope assume many grooves; below about ${FEW_GROOVES} ` +
        'the lines are broad with strong side lobes and these figures are rough. Use a finer grating or a ' +
        'wider ruled width.',
    });
  }
  const fNumbers: [string, number | null][] = [
    ['collimator, across the grating', summary.fNumberProjectedWidth],
    ['collimator, along the slit', summary.fNumberHeight],
    ['camera, across the grating', summary.cameraFNumberProjectedWidth],
    ['camera, along the slit', summary.cameraFNumberHeight],
  ];
  const fast = fNumbers.flatMap(([beam, f]) => (f !== null && f < TRUSTED_F_NUMBER ? [{ beam, f }] : []));
  if (fast.length > 0) {
    const fastest = fast.reduce((a, b) => (b.f < a.f ? b : a));
    warnings.push({
      code: 'fast-optics',
      message:
        `The beam is faster than f/${TRUSTED_F_NUMBER}: ` +
        `${listFormat.format(fast.map(({ beam, f }) => `f/${formatNumber(f, 3)} (${beam})`))}. Below ` +
        `f/${TRUSTED_F_NUMBER} the paraxial closed forms used here (dispersion at the focal length, ` +
        'anamorphic magnification, astigmatism) lose their accuracy, and below f/0.5 no mirror or lens can ' +
        'deliver the beam at all' +
        (fastest.f < 0.5 ? ` (the ${fastest.beam} is f/${formatNumber(fastest.f, 3)})` : '') +
        '. Use longer focal lengths or a smaller grating.',
    });
  }
  if (summary.kind !== 'littrow' && summary.halfDeviationDeg === 0) {
    const mirrors =
      summary.kind === 'ebert-fastie'
        ? 'the two zones of the Ebert–Fastie mirror fall on the same place'
        : 'the Czerny–Turner collimator and camera mirrors sit in the same place';
    warnings.push({
      code: 'degenerate-mount',
      message:
        `At a deviation angle of 0° the light leaves the grating along the way it came, so ${mirrors} ` +
        'in the plane of dispersion (only a mount that separates them out of that plane works). Give the ' +
        'angle between the incoming and outgoing beams (a few tens of degrees is usual), or choose Littrow ' +
        'if one element is meant to do both.',
    });
  }
  const detector = summary.detector;
  const undersampled = detector?.samples.filter((x) => x.pixelsPerResolutionElement < MIN_PIXELS_PER_ELEMENT) ?? [];
  if (undersampled.length > 0) {
    const worst = undersampled.reduce((a, b) => (b.pixelsPerResolutionElement < a.pixelsPerResolutionElement ? b : a));
    const at = undersampled.map((x) => `${formatNumber(x.wavelengthNm)} nm (${POSITION_WORDS[x.position]})`);
    warnings.push({
      code: 'undersampled',
      wavelengthNm: worst.wavelengthNm,
      message:
        `At ${listFormat.format(at)} a resolution element spans fewer than ${MIN_PIXELS_PER_ELEMENT} detector pixels: ` +
        `only ${formatNumber(worst.pixelsPerResolutionElement, 3)} at ${formatNumber(worst.wavelengthNm)} nm ` +
        `(entrance-slit image ${formatNumber(worst.entranceImageUm, 3)} µm, diffraction-limited line ` +
        `${formatNumber(worst.diffractionSpotUm, 3)} µm on the detector; the exit slit plays no part in a ` +
        `spectrograph). Sample it with at least ${MIN_PIXELS_PER_ELEMENT} pixels (Nyquist, common practice): ` +
        'use smaller pixels, a longer camera focal length or a wider entrance slit.',
    });
  }
  if (light) warnings.push(...lightBudgetWarnings(light));
  return warnings;
}
