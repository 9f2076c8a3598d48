/**
 * Refractive index of standard air, and the conversion between vacuum and air wavelengths.
 *
 * Formula: E. R. Peck and K. Reeder, "Dispersion of air", J. Opt. Soc. Am. 62, 958 (1972), for
 * dry air at 15 °C and 101 325 Pa with about 0.03 % CO₂ (standard air), σ the vacuum wavenumber
 * in µm⁻¹:
 *
 *   (n − 1) × 10⁸ = 8060.51 + 2 480 990 / (132.274 − σ²) + 17 455.7 / (39.32957 − σ²)
 *
 * It is the formula the NIST Atomic Spectra Database uses for the air wavelengths it lists between
 * 200 nm and 2000 nm (from memory), so lines converted here sit on the same scale as the built-in
 * list (shared/lamp-lines.ts). Edlén's 1966 formula is kept beside it as an independent check:
 * the two agree within 5 × 10⁻⁹ in n from 250 nm to 1.6 µm (under 0.01 pm in wavelength).
 *
 * Below 200 nm air absorbs (the O₂ Schumann–Runge bands), instruments are purged or evacuated and
 * lines are quoted in vacuum; the formulas also have poles near 87 nm and 160 nm. There the index
 * is taken as 1, so conversion leaves the wavelength as it is.
 */

/** Shortest vacuum wavelength converted, nm (NIST ASD's boundary between vacuum and air lists). */
export const AIR_WAVELENGTHS_FROM_NM = 200;

/** σ² in µm⁻² for a vacuum wavelength in nm. */
function wavenumberSquaredPerUm2(vacuumWavelengthNm: number): number {
  const sigma = 1000 / vacuumWavelengthNm;
  return sigma * sigma;
}

/**
 * `n − 1` of standard air by Peck & Reeder (1972), at a vacuum wavelength in nm (≥ 200 nm).
 * At 500 nm (σ = 2 µm⁻¹): 8060.51 + 19341.33 + 494.08 = 27895.92 → 2.78959 × 10⁻⁴.
 */
export function peckReederRefractivity(vacuumWavelengthNm: number): number {
  const s2 = wavenumberSquaredPerUm2(vacuumWavelengthNm);
  return (8060.51 + 2_480_990 / (132.274 - s2) + 17_455.7 / (39.32957 - s2)) * 1e-8;
}

/**
 * `n − 1` of standard air by B. Edlén, "The refractive index of air", Metrologia 2, 71 (1966),
 * at a vacuum wavelength in nm (≥ 200 nm): `(n − 1) × 10⁸ = 8342.13 + 2 406 030/(130 − σ²)
 * + 15 997/(38.9 − σ²)`. Kept as a cross-check of `peckReederRefractivity`.
 */
export function edlen1966Refractivity(vacuumWavelengthNm: number): number {
  const s2 = wavenumberSquaredPerUm2(vacuumWavelengthNm);
  return (8342.13 + 2_406_030 / (130 - s2) + 15_997 / (38.9 - s2)) * 1e-8;
}

/**
 * Refractive index of standard air at `vacuumWavelengthNm` (Peck & Reeder 1972); 1 below 200 nm
 * and for a wavelength that is not a positive finite number, so conversions pass those through.
 */
export function airIndex(vacuumWavelengthNm: number): number {
  if (!(vacuumWavelengthNm >= AIR_WAVELENGTHS_FROM_NM) || !Number.isFinite(vacuumWavelengthNm)) return 1;
  return 1 + peckReederRefractivity(vacuumWavelengthNm);
}

/** `λ_air = λ_vac / n(λ_vac)`. */
export function vacuumToAirNm(vacuumWavelengthNm: number): number {
  return vacuumWavelengthNm / airIndex(vacuumWavelengthNm);
}

/** Iterations of `airToVacuumNm`; each gains about five digits (n changes slowly with λ). */
const MAX_ITERATIONS = 8;
const CONVERGED_NM = 1e-12;

/**
 * `λ_vac = λ_air · n(λ_vac)`, solved by fixed-point iteration from `λ_air · n(λ_air)`. The step
 * contracts by `λ·|dn/dλ|` (about 10⁻⁵ in the visible), so three rounds reach double precision.
 * Within 0.07 nm above 200 nm (where the index switches on) the two directions need not agree.
 */
export function airToVacuumNm(airWavelengthNm: number): number {
  if (!(airWavelengthNm >= AIR_WAVELENGTHS_FROM_NM) || !Number.isFinite(airWavelengthNm)) return airWavelengthNm;
  let vacuumNm = airWavelengthNm * airIndex(airWavelengthNm);
  for (let i = 0; i < MAX_ITERATIONS; i++) {
    const next = airWavelengthNm * airIndex(vacuumNm);
    const step = Math.abs(next - vacuumNm);
    vacuumNm = next;
    if (step < CONVERGED_NM) break;
  }
  return vacuumNm;
}
