/**
 * Refractive index from a Sellmeier formula, `n² − 1 = Σ B_i λ² / (λ² − C_i²)`, λ and the
 * resonance wavelengths C_i in µm (as Malitson writes it), and the built-in prism materials with
 * their sources.
 */

import type { PrismMaterial, PrismMaterialId, SellmeierFormula } from '../../shared/selectors';

export interface PrismMaterialEntry {
  id: PrismMaterialId;
  label: string;
  /** Where the coefficients come from. */
  source: string;
  sellmeier: SellmeierFormula;
  /** The wavelengths the coefficients were fitted over, nm; outside them the formula is extrapolated. */
  validFromNm: number;
  validToNm: number;
}

const NM_PER_UM = 1000;

/**
 * Within this relative distance of a resonance (`|λ² − C²| ≤ this × λ²`) the formula's index is
 * meaningless (a real material absorbs there) and its value is rounding noise: no index.
 */
const NEAR_POLE = 1e-9;

export const PRISM_MATERIALS: Record<PrismMaterialId, PrismMaterialEntry> = {
  'fused-silica': {
    id: 'fused-silica',
    label: 'Fused silica',
    source:
      'I. H. Malitson, "Interspecimen comparison of the refractive index of fused silica", ' +
      'J. Opt. Soc. Am. 55, 1205 (1965)',
    sellmeier: { B: [0.6961663, 0.4079426, 0.8974794], C: [0.0684043, 0.1162414, 9.896161] },
    validFromNm: 210,
    validToNm: 3710,
  },
  'calcium-fluoride': {
    id: 'calcium-fluoride',
    label: 'Calcium fluoride',
    source:
      'I. H. Malitson, "A redetermination of some optical properties of calcium fluoride", ' +
      'Appl. Opt. 2, 1103 (1963)',
    sellmeier: { B: [0.5675888, 0.4710914, 3.8484723], C: [0.050263605, 0.1003909, 34.64904] },
    validFromNm: 230,
    validToNm: 9700,
  },
  'borosilicate-crown': {
    id: 'borosilicate-crown',
    label: 'Borosilicate crown (517642)',
    source:
      "Glass maker's published catalogue Sellmeier coefficients for glass type 517642 " +
      '(n_d = 1.517, V_d = 64.2); the catalogue lists C² in µm², stored here as C',
    // The catalogue gives C_i² in µm²; the formula here takes the resonance wavelength C_i.
    sellmeier: {
      B: [1.03961212, 0.231792344, 1.01046945],
      C: [Math.sqrt(0.00600069867), Math.sqrt(0.0200179144), Math.sqrt(103.560653)],
    },
    validFromNm: 300,
    validToNm: 2500,
  },
};

/** `n²` and `d(n²)/dλ` (per µm) at λ in µm, or null where the formula has no usable value. */
function indexSquared(formula: SellmeierFormula, wavelengthUm: number): { n2: number; dn2PerUm: number } | null {
  if (!(wavelengthUm > 0) || !Number.isFinite(wavelengthUm)) return null;
  const l2 = wavelengthUm * wavelengthUm;
  let n2 = 1;
  let dn2PerUm = 0;
  const terms = Math.min(formula.B.length, formula.C.length);
  for (let i = 0; i < terms; i++) {
    const b = formula.B[i]!;
    const c2 = formula.C[i]! * formula.C[i]!;
    const denominator = l2 - c2;
    if (!(Math.abs(denominator) > NEAR_POLE * l2)) return null;
    n2 += (b * l2) / denominator;
    // d/dλ [B λ² / (λ² − C²)] = −2 B λ C² / (λ² − C²)²
    dn2PerUm += (-2 * b * wavelengthUm * c2) / (denominator * denominator);
  }
  if (!(n2 > 0) || !Number.isFinite(n2) || !Number.isFinite(dn2PerUm)) return null;
  return { n2, dn2PerUm };
}

/**
 * Refractive index from the Sellmeier formula at a wavelength in nm; null where `n² ≤ 0`, at or
 * within rounding of a resonance, or where the value is not finite.
 */
export function sellmeierIndex(formula: SellmeierFormula, wavelengthNm: number): number | null {
  const value = indexSquared(formula, wavelengthNm / NM_PER_UM);
  return value === null ? null : Math.sqrt(value.n2);
}

/**
 * `dn/dλ` per nm, analytic: `dn/dλ = (1 / 2n) d(n²)/dλ`, with
 * `d(n²)/dλ = Σ −2 B_i λ C_i² / (λ² − C_i²)²` (λ in µm, then ÷ 1000 for per nm). Null where the
 * index is.
 */
export function sellmeierDnDlambdaPerNm(formula: SellmeierFormula, wavelengthNm: number): number | null {
  const value = indexSquared(formula, wavelengthNm / NM_PER_UM);
  if (value === null) return null;
  return value.dn2PerUm / (2 * Math.sqrt(value.n2)) / NM_PER_UM;
}

/** A built-in material by id, or a user-entered formula labelled as such (no valid range known). */
export function resolvePrismMaterial(material: PrismMaterial): {
  id: PrismMaterialId | 'custom';
  label: string;
  source: string;
  sellmeier: SellmeierFormula;
  validFromNm: number | null;
  validToNm: number | null;
} {
  if (typeof material === 'string') return { ...PRISM_MATERIALS[material] };
  return {
    id: 'custom',
    label: 'User-entered Sellmeier formula',
    source: 'entered by the user',
    sellmeier: material.sellmeier,
    validFromNm: null,
    validToNm: null,
  };
}
