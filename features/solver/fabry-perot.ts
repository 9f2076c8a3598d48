/**
 * Fabry–Pérot interference filter: a spacer of index n and thickness t between two mirrors of
 * reflectance R transmits where the round trip is a whole number of wavelengths,
 * `2 n t cos θ_t = k λ`. Sources: Hecht, Optics, §9.6; Born & Wolf, Principles of Optics, §7.6.
 *
 * Tilts are the angle of incidence in air; inside the spacer the ray runs at θ_t with
 * `sin θ_t = sin θ / n` (Snell), which is where every `cos θ` below comes from. With
 * `n_eff = n` the tilt-tuning formula and the thickness formula therefore agree exactly.
 */

import { formatInteger, formatNumber } from '../../shared/format';
import {
  SELECTOR_LIMITS,
  type InterferenceFilterAnswer,
  type InterferenceFilterInput,
  type SelectorWarning,
} from '../../shared/selectors';
import { degToRad } from './math';
import { freeSpectralRangeNm } from './resolving-power';

/**
 * How far a computed order number `2nt/λ` may sit from a whole number and still count as that
 * order, so a peak on a range end is inside (`t` is computed from the target, so `2nt/m` comes
 * back as the target only to rounding): a few ulps of the order number, and never less than 1e-9 —
 * far below the spacing of 1 between orders, so no order outside the range slips in.
 */
function orderRounding(orderNumber: number): number {
  return Math.max(1e-9, 8 * Number.EPSILON * orderNumber);
}

/** `cos θ_t` inside a layer of index n for an angle of incidence θ in air (0 past the critical angle). */
function internalCos(tiltRad: number, index: number): number {
  const s = Math.sin(tiltRad) / index;
  return Math.sqrt(Math.max(0, 1 - s * s));
}

/**
 * Physical spacer thickness `t = mλ / (2 n cos θ_t)`, nm, for peak order m at the target.
 * Source: Hecht, Optics, §9.6. At normal incidence the optical thickness n·t is mλ/2.
 */
export function spacerThicknessNm(targetNm: number, order: number, spacerIndex: number, tiltRad = 0): number {
  return (order * targetNm) / (2 * spacerIndex * internalCos(tiltRad, spacerIndex));
}

/**
 * The whole orders k whose peaks `λ_k = 2nt/k` lie in `[startNm, endNm]` (ends included to
 * rounding): `kMin = ⌈2nt/end⌉` (at least 1) to `kMax = ⌊2nt/start⌋`; null when the round trip
 * or the range cannot be used (a range reaching 0 nm holds infinitely many peaks).
 */
function peakOrderSpan(
  roundTripNm: number,
  startNm: number,
  endNm: number,
): { roundTripNm: number; kMin: number; kMax: number } | null {
  if (!(roundTripNm > 0) || !Number.isFinite(roundTripNm) || !(endNm >= startNm) || !(startNm > 0)) return null;
  // λ_k falls as k rises: the longest peak in range has the smallest k.
  const lowestOrder = roundTripNm / endNm;
  const highestOrder = roundTripNm / startNm;
  const kMin = Math.max(1, Math.ceil(lowestOrder - orderRounding(lowestOrder)));
  const kMax = Math.floor(highestOrder + orderRounding(highestOrder));
  if (!Number.isFinite(kMax)) return null;
  return { roundTripNm, kMin, kMax };
}

/**
 * Every transmission peak `λ_k = 2nt/k` (k = 1, 2, …) inside `[startNm, endNm]` at normal
 * incidence, ascending; `peakCount` is the whole count, in closed form, so a wide range in a high
 * order costs no more than a narrow one. When more than `maxListed` fall in the range, the listed
 * ones are consecutive orders centred on the peak nearest `aroundNm` (the target), or the longest
 * (lowest-order, widest-spaced) peaks without it. Source: Hecht, Optics, §9.6.
 */
export function fabryPerotPeaksNm(
  spacerThicknessNm: number,
  spacerIndex: number,
  startNm: number,
  endNm: number,
  maxListed: number = SELECTOR_LIMITS.maxListedPeaks,
  aroundNm?: number,
): { peaksNm: number[]; peakCount: number; truncated: boolean } {
  const span = peakOrderSpan(2 * spacerIndex * spacerThicknessNm, startNm, endNm);
  if (span === null) return { peaksNm: [], peakCount: 0, truncated: false };
  const { roundTripNm, kMin, kMax } = span;
  const peakCount = Math.max(0, kMax - kMin + 1);
  const listed = Math.max(0, Math.min(peakCount, Math.floor(maxListed)));
  const aroundK = aroundNm !== undefined && aroundNm > 0 ? Math.round(roundTripNm / aroundNm) : kMin;
  const centreK = Number.isFinite(aroundK) ? Math.min(Math.max(aroundK, kMin), kMax) : kMin;
  const lowK = Math.max(kMin, Math.min(centreK - Math.floor(listed / 2), kMax - listed + 1));
  const peaksNm: number[] = [];
  // Highest order first: the shortest wavelength first.
  for (let k = lowK + listed - 1; k >= lowK; k--) peaksNm.push(roundTripNm / k);
  return { peaksNm, peakCount, truncated: listed < peakCount };
}

/**
 * Reflecting finesse `π√R / (1 − R)`, the ratio of the free spectral range to the peak width for
 * lossless, flat mirrors. Source: Hecht, Optics, §9.6. Infinite for R ≥ 1 (no light gets in).
 */
export function reflectingFinesse(reflectance: number): number {
  const r = Math.max(0, reflectance);
  if (!(r < 1)) return Number.POSITIVE_INFINITY;
  return (Math.PI * Math.sqrt(r)) / (1 - r);
}

/** Peak FWHM ≈ FSR / finesse, nm (the high-finesse approximation). Source: Hecht, Optics, §9.6. */
export function fabryPerotFwhmNm(freeSpectralRangeNm: number, finesse: number): number {
  return freeSpectralRangeNm / finesse;
}

/**
 * Peak of a tilted filter, `λ(θ) = λ₀ √(1 − (sin θ / n_eff)²)`: tilting always shortens the peak.
 * n_eff folds the multilayer mirrors into one index (the spacer index for a bare cavity).
 * Source: Hecht, Optics, §9.6 (the `cos θ_t` of the peak condition); common practice for n_eff.
 */
export function tiltedPeakNm(peakAtNormalNm: number, tiltRad: number, effectiveIndex: number): number {
  return peakAtNormalNm * internalCos(tiltRad, effectiveIndex);
}

/**
 * Lossless Airy transmission `1 / (1 + F sin²(δ/2))`, `F = 4R/(1 − R)²`,
 * `δ = 4π n t cos θ_t / λ`. Source: Born & Wolf, §7.6; Hecht, §9.6. For plotting the curve;
 * 0 where the phase cannot be formed (a wavelength that is not positive and finite).
 */
export function airyTransmission(
  wavelengthNm: number,
  spacerThicknessNm: number,
  spacerIndex: number,
  reflectance: number,
  tiltRad = 0,
): number {
  if (!(wavelengthNm > 0) || !Number.isFinite(wavelengthNm)) return 0;
  const r = Math.min(Math.max(0, reflectance), 1);
  // δ/2 = π × (order number); reducing the order number to its distance from the nearest whole
  // order first keeps the sine exact at a peak even when the order number is in the millions.
  const orderNumber = (2 * spacerIndex * spacerThicknessNm * internalCos(tiltRad, spacerIndex)) / wavelengthNm;
  if (!Number.isFinite(orderNumber)) return 0;
  const sinHalf = Math.sin(Math.PI * (orderNumber - Math.round(orderNumber)));
  if (sinHalf === 0) return 1;
  if (r >= 1) return 0;
  const f = (4 * r) / ((1 - r) * (1 - r));
  const t = 1 / (1 + f * sinHalf * sinHalf);
  return Number.isFinite(t) ? t : 0;
}

/** The nearest shorter and longer peaks around order m: `λ m/(m+1)` and `λ m/(m−1)` (none for m = 1). */
export function neighbourPeaksNm(targetNm: number, order: number): { shorterNm: number; longerNm: number | null } {
  return {
    shorterNm: (targetNm * order) / (order + 1),
    longerNm: order > 1 ? (targetNm * order) / (order - 1) : null,
  };
}

/**
 * A Fabry–Pérot filter designed for `targetNm` in order m at normal incidence: spacer thickness,
 * every peak in the range, finesse, FSR = λ/m, FWHM and tilt tuning, with a warning (and the
 * blocking filter's numbers) when peaks other than the target fall in the range.
 */
export function designInterferenceFilter(input: InterferenceFilterInput): InterferenceFilterAnswer {
  const { targetNm, order, spacerIndex, mirrorReflectance, rangeNm } = input;
  const effectiveIndex = input.effectiveIndex ?? spacerIndex;
  const thicknessNm = spacerThicknessNm(targetNm, order, spacerIndex);
  const peaks = fabryPerotPeaksNm(
    thicknessNm,
    spacerIndex,
    rangeNm.startNm,
    rangeNm.endNm,
    SELECTOR_LIMITS.maxListedPeaks,
    targetNm,
  );
  const finesse = reflectingFinesse(mirrorReflectance);
  const fsrNm = freeSpectralRangeNm(targetNm, order);
  const tilt = (input.tiltsDeg ?? []).map((tiltDeg) => ({
    tiltDeg,
    peakNm: tiltedPeakNm(targetNm, degToRad(tiltDeg), effectiveIndex),
  }));
  return {
    kind: 'interference-filter',
    spacerThicknessNm: thicknessNm,
    peaksNm: peaks.peaksNm,
    peakCount: peaks.peakCount,
    peaksTruncated: peaks.truncated,
    finesse,
    freeSpectralRangeNm: fsrNm,
    fwhmNm: fabryPerotFwhmNm(fsrNm, finesse),
    tilt,
    warnings: interferenceWarnings(
      input,
      peakOrderSpan(2 * spacerIndex * thicknessNm, rangeNm.startNm, rangeNm.endNm),
      finesse,
    ),
  };
}

/**
 * Below this finesse FSR/finesse is more than about 1.7 % off the Airy function's true half-height
 * width (5 → 1.7 %, 2 → 15 %; Born & Wolf, §7.6, solved for T = ½), and the filter barely selects.
 */
export const LOW_FINESSE = 5;

const nm = (value: number) => `${formatNumber(value, 5)} nm`;

function interferenceWarnings(
  input: InterferenceFilterInput,
  span: ReturnType<typeof peakOrderSpan>,
  finesse: number,
): SelectorWarning[] {
  const { targetNm, order, rangeNm } = input;
  const warnings: SelectorWarning[] = [];
  // Judged by order number, exactly as the peak list is, so the target is never counted twice.
  const orderInRange = (k: number) => span !== null && k >= span.kMin && k <= span.kMax;
  const peakCount = span === null ? 0 : Math.max(0, span.kMax - span.kMin + 1);
  const targetInRange = orderInRange(order);
  if (!targetInRange) {
    warnings.push({
      code: 'target-outside-range',
      message: `The target ${nm(targetNm)} lies outside the range ${nm(rangeNm.startNm)}–${nm(rangeNm.endNm)}; widen the range to see it among the peaks.`,
    });
  }
  if (finesse < LOW_FINESSE) {
    warnings.push({
      code: 'low-finesse',
      message:
        `With R = ${formatNumber(input.mirrorReflectance, 4)} the finesse is only ${formatNumber(finesse, 3)}: the peaks are broad ` +
        'and FWHM ≈ FSR/finesse understates their width (below R ≈ 0.17 the transmission never falls to half between ' +
        'peaks). Use mirrors of higher reflectance for a narrow-band filter.',
    });
  }
  const others = peakCount - (targetInRange ? 1 : 0);
  if (others <= 0) return warnings;

  // Every other peak is an order k ≠ m of the same cavity: the shorter ones (k > m) all lie below
  // λ m/(m+1), the longer ones (k < m) all above λ m/(m−1). One edge between the target and its
  // nearest neighbour on each side therefore blocks a whole side.
  const { shorterNm, longerNm } = neighbourPeaksNm(targetNm, order);
  const shorterCount = span === null ? 0 : Math.max(0, span.kMax - Math.max(order + 1, span.kMin) + 1);
  const longerCount = Math.max(0, others - shorterCount);
  const blocks: string[] = [];
  if (shorterCount > 0) {
    blocks.push(
      `a long-pass whose edge lies between ${nm(shorterNm)} and ${nm(targetNm)} (cut-on near ${nm((shorterNm + targetNm) / 2)}) ` +
        `blocks the ${shorterCount === 1 ? 'shorter peak' : `${formatInteger(shorterCount)} shorter peaks`}`,
    );
  }
  if (longerCount > 0 && longerNm !== null) {
    blocks.push(
      `a short-pass whose edge lies between ${nm(targetNm)} and ${nm(longerNm)} (cut-off near ${nm((targetNm + longerNm) / 2)}) ` +
        `blocks the ${longerCount === 1 ? 'longer peak' : `${formatInteger(longerCount)} longer peaks`}`,
    );
  }
  const nearest = [
    ...(longerNm !== null && orderInRange(order - 1) ? [longerNm] : []),
    ...(orderInRange(order + 1) ? [shorterNm] : []),
  ].sort((a, b) => a - b);
  warnings.push({
    code: 'other-peaks',
    message:
      `${others === 1 ? 'One other transmission peak falls' : `${formatInteger(others)} other transmission peaks fall`} in ` +
      `${nm(rangeNm.startNm)}–${nm(rangeNm.endNm)}` +
      (nearest.length > 0 ? ` (nearest to the target: ${nearest.map(nm).join(' and ')})` : '') +
      `. Add a blocking filter: ${blocks.join('; ')}.`,
  });
  return warnings;
}
