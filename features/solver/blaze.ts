/**
 * Blaze envelope: the scalar (Kirchhoff) blaze function of a grating with flat facets, in its
 * small-angle form `sinc²(π(|m| − λ_B cos K / λ))` (common practice). It is the groove-facet
 * model of scalar theory (Schroeder & Hilliard, "Echelle efficiencies: theory and experiment",
 * Appl. Opt. 19, 2833 (1980); from memory) with the facet's cosine factors set to 1, so it drifts
 * from that model as the blaze angle grows (about 0.1–0.2 at 25–30°, see the tests). Like every
 * scalar model it holds only while λ/d stays below about 0.2 (Palmer & Loewen, Diffraction
 * Grating Handbook, ch. 9); beyond, efficiency depends on polarisation and the groove profile and
 * the solver warns (`beyond-scalar-blaze`). Present it as an estimate.
 *
 * The grating is assumed mounted with its blaze facing the working order, whichever sign that
 * order carries, so only |m| enters.
 */

import { sinc } from './math';

/**
 * Wavelength of peak efficiency in this mount and order: `λ_B cos K / |m|`, λ_B the first-order
 * Littrow blaze wavelength. Source: Palmer & Loewen, Diffraction Grating Handbook, ch. 9.
 */
export function blazeWavelengthInMountNm(
  blazeWavelengthNm: number,
  halfDeviationRad: number,
  order: number,
): number {
  return (blazeWavelengthNm * Math.cos(halfDeviationRad)) / Math.abs(order);
}

/**
 * `η(λ) ≈ sinc²(π(|m| − λ_B cos K / λ))`, relative to its peak of 1 (common practice, scalar
 * theory). Falls to about 40 % at 2/3 and 2× the blaze wavelength in first order.
 */
export function blazeEfficiency(
  wavelengthNm: number,
  order: number,
  blazeWavelengthNm: number,
  halfDeviationRad: number,
): number {
  const blazeInMountNm = blazeWavelengthNm * Math.cos(halfDeviationRad);
  const s = sinc(Math.PI * (Math.abs(order) - blazeInMountNm / wavelengthNm));
  return s * s;
}
