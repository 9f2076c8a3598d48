/**
 * Blaze envelope. A scalar estimate (common practice): valid when the groove spacing is well above
 * λ; it ignores polarisation and the resonances of real gratings, so present it as an estimate.
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
