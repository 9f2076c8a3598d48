/**
 * Coloured-glass absorption filters and stacks of them. Each filter is a parametric edge at a
 * reference thickness; its internal transmittance scales with thickness by Beer–Lambert,
 * `T(t) = T_ref^(t/t_ref)`, and each of its two surfaces loses the normal-incidence Fresnel
 * reflectance `((n − 1)/(n + 1))²` (Hecht, Optics, §4.6). A stack transmits the product.
 *
 * Because every factor multiplies, a thicker filter or a second copy raises the whole curve to a
 * power: the edge steepens (relative to its own plateau) and the plateau drops — the trade-off
 * these filters are chosen by.
 */

import { formatNumber } from '../../shared/format';
import type {
  AbsorptionFilter,
  AbsorptionStackAnswer,
  AbsorptionStackInput,
  SelectorWarning,
} from '../../shared/selectors';

/** A stack whose best transmission is below this passes too little to be worth its edge (common practice). */
export const LOW_STACK_PEAK = 0.1;

/** `ln 9`: a logistic goes from 10 % to 90 % over `2 ln 9` scale lengths. */
const LN9 = Math.log(9);

/** Clamp to [0, 1], mapping NaN to 0: a transmittance is never anything else. */
function unitInterval(value: number): number {
  return value > 0 ? Math.min(value, 1) : 0;
}

/**
 * Logistic rising edge with its 50 % point at `edgeNm` and a 10–90 % width `edgeWidthNm`
 * (scale `s = w / (2 ln 9)`); a step where the width is not positive.
 */
export function logisticRisingEdge(wavelengthNm: number, edgeNm: number, edgeWidthNm: number): number {
  const scaleNm = edgeWidthNm / (2 * LN9);
  if (!(scaleNm > 0)) return wavelengthNm >= edgeNm ? 1 : 0;
  // exp overflows to Infinity far below the edge, giving 1/(1 + ∞) = 0 — the right limit, not NaN.
  return unitInterval(1 / (1 + Math.exp(-(wavelengthNm - edgeNm) / scaleNm)));
}

/**
 * Internal transmittance at the filter's REFERENCE thickness: the plateau times a logistic rising
 * edge at `edgeNm` (its 50 % point relative to the plateau), and for a band-pass a falling edge of
 * the same width at `upperEdgeNm`. A parametric model of a coloured-glass curve (common practice).
 */
export function colouredGlassInternalTransmission(filter: AbsorptionFilter, wavelengthNm: number): number {
  let t = filter.peakInternalTransmission * logisticRisingEdge(wavelengthNm, filter.edgeNm, filter.edgeWidthNm);
  if (filter.shape === 'band-pass' && filter.upperEdgeNm !== undefined) {
    t *= 1 - logisticRisingEdge(wavelengthNm, filter.upperEdgeNm, filter.edgeWidthNm);
  }
  return unitInterval(t);
}

/** Beer–Lambert thickness scaling of internal transmittance, `T_ref^(t/t_ref)`. */
export function scaleInternalTransmission(
  referenceTransmission: number,
  thicknessMm: number,
  referenceThicknessMm: number,
): number {
  const t = unitInterval(referenceTransmission);
  const ratio = thicknessMm / referenceThicknessMm;
  if (!(ratio >= 0) || !Number.isFinite(ratio)) return t === 1 ? 1 : 0;
  return unitInterval(Math.pow(t, ratio));
}

/** Normal-incidence Fresnel reflectance of one air–glass surface, `((n − 1)/(n + 1))²` (Hecht, Optics, §4.6). */
export function surfaceReflectance(refractiveIndex: number): number {
  const rho = ((refractiveIndex - 1) / (refractiveIndex + 1)) ** 2;
  return unitInterval(rho);
}

/**
 * External transmittance of one filter at its thickness: internal transmittance × `(1 − ρ)²` for
 * its two surfaces. Multiple reflections between the surfaces are neglected (they add under 0.2 %
 * for n = 1.5, since ρ² ≈ 0.0016).
 */
export function absorptionFilterTransmission(filter: AbsorptionFilter, wavelengthNm: number): number {
  const internal = scaleInternalTransmission(
    colouredGlassInternalTransmission(filter, wavelengthNm),
    filter.thicknessMm,
    filter.referenceThicknessMm,
  );
  const surface = 1 - surfaceReflectance(filter.refractiveIndex);
  return unitInterval(internal * surface * surface);
}

/** Transmittance of a stack: the product of its filters' (1 for an empty stack). */
export function stackTransmission(filters: readonly AbsorptionFilter[], wavelengthNm: number): number {
  let t = 1;
  for (const filter of filters) t *= absorptionFilterTransmission(filter, wavelengthNm);
  return unitInterval(t);
}

/** The stack's transmission at each wavelength, its best value, and warnings in plain words. */
export function absorptionStack(input: AbsorptionStackInput): AbsorptionStackAnswer {
  const points = input.wavelengthsNm.map((wavelengthNm) => ({
    wavelengthNm,
    transmission: stackTransmission(input.filters, wavelengthNm),
  }));
  let peak = points[0] ?? { wavelengthNm: 0, transmission: 0 };
  for (const point of points) if (point.transmission > peak.transmission) peak = point;
  const warnings: SelectorWarning[] = [];
  if (points.length > 0 && peak.transmission < LOW_STACK_PEAK) {
    warnings.push({
      code: 'low-peak',
      message:
        `The stack passes at most ${formatNumber(100 * peak.transmission, 3)} % ` +
        `(at ${formatNumber(peak.wavelengthNm, 5)} nm) of the wavelengths given; ` +
        'use thinner filters or fewer of them, or check that the band you want lies between the edges.',
    });
  }
  return { kind: 'absorption-stack', points, peakTransmission: peak.transmission, warnings };
}
