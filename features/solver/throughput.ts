/**
 * Relative throughput against wavelength: the product of what each element passes,
 * `grating efficiency × collimator × camera × order-sorting filter × detector response × input
 * coupling`, on the solver's own wavelengths. Measured curves are read with straight lines between
 * their points and never past their ends; where a measured curve has no data the factor (and so
 * the product) is unknown there, never guessed. A factor with nothing to go on is "not counted"
 * and left out of the product, and says so.
 */

import type { Design } from '../../shared/design';
import type { DesignCurve } from '../../shared/curves';
import type { OrderSortingFilter } from '../../shared/filters';
import { interpolateCurve } from './curve-interpolation';
import { longPassTransmission } from './order-sorting';

export const THROUGHPUT_FACTOR_IDS = ['grating', 'collimator', 'camera', 'filter', 'detector', 'input'] as const;
export type ThroughputFactorId = (typeof THROUGHPUT_FACTOR_IDS)[number];

/**
 * - `measured`: from an attached curve;
 * - `estimate`: the scalar blaze envelope (grating without a measured curve);
 * - `model`: computed from the design (the filters' edges, the input geometry);
 * - `not-counted`: nothing to go on; left out of the product (values all null).
 */
export type FactorBasis = 'measured' | 'estimate' | 'model' | 'not-counted';

export interface ThroughputFactor {
  id: ThroughputFactorId;
  basis: FactorBasis;
  /** Names of the curves used, in the order applied. */
  curveNames: string[];
  /** One value (0…1) per solver wavelength; null where unknown (outside a curve, unreachable). */
  values: (number | null)[];
  /** Where the factor's measured curves leave part of the range without data, nm. */
  gapsNm: { fromNm: number; toNm: number }[];
}

export interface ThroughputInput {
  design: Design;
  wavelengthsNm: readonly number[];
  /** The scalar blaze envelope per wavelength (null without a blaze or unreachable). */
  blazeEfficiency: readonly (number | null)[];
  /** Input coupling per wavelength (input-fill.ts); null where unreachable. */
  inputCoupling: readonly (number | null)[];
  /** Whether the input coupling is computed from a given input (`model`) or assumed matched. */
  inputGiven: boolean;
}

/** Reads `curve` at λ (unknown outside it). */
function read(curve: DesignCurve, wavelengthNm: number): number | null {
  return interpolateCurve(curve.wavelengthsNm, curve.values, wavelengthNm);
}

/** Spans of `wavelengthsNm` where `values` is null, as `{fromNm, toNm}` between the outermost null points. */
function gaps(wavelengthsNm: readonly number[], values: readonly (number | null)[]): { fromNm: number; toNm: number }[] {
  const out: { fromNm: number; toNm: number }[] = [];
  let start: number | null = null;
  for (let i = 0; i < values.length; i++) {
    const missing = values[i] === null;
    if (missing && start === null) start = i;
    if (!missing && start !== null) {
      out.push({ fromNm: wavelengthsNm[start] as number, toNm: wavelengthsNm[i - 1] as number });
      start = null;
    }
  }
  if (start !== null) out.push({ fromNm: wavelengthsNm[start] as number, toNm: wavelengthsNm[values.length - 1] as number });
  return out;
}

function curvesOf(design: Design, kind: DesignCurve['kind']): DesignCurve[] {
  return (design.curves ?? []).filter((c) => c.kind === kind);
}

/**
 * The grating's measured curves for the design's order: unpolarised when given, else the mean of
 * TE and TM (unpolarised light is half of each; Palmer & Loewen ch. 9), else the one polarisation
 * given (named in the curve list).
 */
export function gratingCurves(design: Design): DesignCurve[] {
  const mine = curvesOf(design, 'grating-efficiency').filter((c) => (c.order ?? design.grating.order) === design.grating.order);
  const unpolarised = mine.filter((c) => (c.polarisation ?? 'unpolarised') === 'unpolarised');
  if (unpolarised.length > 0) return unpolarised.slice(0, 1);
  const te = mine.find((c) => c.polarisation === 'te');
  const tm = mine.find((c) => c.polarisation === 'tm');
  return [te, tm].filter((c): c is DesignCurve => c !== undefined);
}

function gratingFactor(t: ThroughputInput): ThroughputFactor {
  const curves = gratingCurves(t.design);
  if (curves.length > 0) {
    const values = t.wavelengthsNm.map((nm) => {
      let sum = 0;
      for (const c of curves) {
        const v = read(c, nm);
        if (v === null) return null;
        sum += v;
      }
      return sum / curves.length;
    });
    return { id: 'grating', basis: 'measured', curveNames: curves.map((c) => c.name), values, gapsNm: gaps(t.wavelengthsNm, values) };
  }
  if (t.design.grating.blazeWavelengthNm !== undefined) {
    const values = [...t.blazeEfficiency];
    return { id: 'grating', basis: 'estimate', curveNames: [], values, gapsNm: [] };
  }
  return notCounted('grating', t.wavelengthsNm.length);
}

function notCounted(id: ThroughputFactorId, n: number): ThroughputFactor {
  return { id, basis: 'not-counted', curveNames: [], values: new Array<number | null>(n).fill(null), gapsNm: [] };
}

/**
 * One mirror's reflectance. Littrow and Ebert–Fastie layouts reflect twice off one mirror, so
 * there the camera pass reads the collimator's curve when no camera curve is attached.
 */
function mirrorFactor(t: ThroughputInput, which: 'collimator' | 'camera'): ThroughputFactor {
  const all = curvesOf(t.design, 'mirror-reflectance');
  let curve = all.find((c) => (c.mirror ?? 'both') === which) ?? all.find((c) => (c.mirror ?? 'both') === 'both');
  if (!curve && which === 'camera' && t.design.layout.kind !== 'czerny-turner') {
    curve = all.find((c) => c.mirror === 'collimator');
  }
  if (!curve) return notCounted(which, t.wavelengthsNm.length);
  const c = curve;
  const values = t.wavelengthsNm.map((nm) => read(c, nm));
  return { id: which, basis: 'measured', curveNames: [c.name], values, gapsNm: gaps(t.wavelengthsNm, values) };
}

/**
 * What the filters in the beam at each setting pass of the working wavelength. A filter with a
 * measured curve (`filterNumber`, counting from 1) uses it while it is in the beam, in place of its
 * straight-ramp edge; a measured filter curve without a number is a fixed filter always in the beam.
 */
function filterFactor(t: ThroughputInput): ThroughputFactor {
  const filters: readonly OrderSortingFilter[] = t.design.filters ?? [];
  const curves = curvesOf(t.design, 'filter-transmission');
  if (filters.length === 0 && curves.length === 0) return notCounted('filter', t.wavelengthsNm.length);
  const byNumber = new Map<number, DesignCurve>();
  const fixed: DesignCurve[] = [];
  for (const c of curves) {
    if (c.filterNumber === undefined) fixed.push(c);
    else if (!byNumber.has(c.filterNumber)) byNumber.set(c.filterNumber, c);
  }
  const values = t.wavelengthsNm.map((nm) => {
    let product = 1;
    for (let i = 0; i < filters.length; i++) {
      const f = filters[i] as OrderSortingFilter;
      if (!(f.inFromNm <= nm && nm <= f.inToNm)) continue;
      const measured = byNumber.get(i + 1);
      const v = measured ? read(measured, nm) : longPassTransmission(f, nm);
      if (v === null) return null;
      product *= v;
    }
    for (const c of fixed) {
      const v = read(c, nm);
      if (v === null) return null;
      product *= v;
    }
    return product;
  });
  return {
    id: 'filter',
    basis: curves.length > 0 ? 'measured' : 'model',
    curveNames: curves.map((c) => c.name),
    values,
    gapsNm: gaps(t.wavelengthsNm, values),
  };
}

function detectorFactor(t: ThroughputInput): ThroughputFactor {
  const curve = curvesOf(t.design, 'detector-response')[0];
  if (!curve) return notCounted('detector', t.wavelengthsNm.length);
  const values = t.wavelengthsNm.map((nm) => read(curve, nm));
  return { id: 'detector', basis: 'measured', curveNames: [curve.name], values, gapsNm: gaps(t.wavelengthsNm, values) };
}

function inputFactor(t: ThroughputInput): ThroughputFactor {
  return {
    id: 'input',
    basis: t.inputGiven ? 'model' : 'not-counted',
    curveNames: [],
    values: t.inputGiven ? [...t.inputCoupling] : new Array<number | null>(t.wavelengthsNm.length).fill(null),
    gapsNm: [],
  };
}

export function throughputFactors(t: ThroughputInput): ThroughputFactor[] {
  return [
    gratingFactor(t),
    mirrorFactor(t, 'collimator'),
    mirrorFactor(t, 'camera'),
    filterFactor(t),
    detectorFactor(t),
    inputFactor(t),
  ];
}

/**
 * The product of the counted factors per wavelength: null where any counted factor is unknown,
 * and null everywhere when nothing is counted (a product of nothing would claim 100 %).
 */
export function throughputProduct(factors: readonly ThroughputFactor[], n: number): (number | null)[] {
  const counted = factors.filter((f) => f.basis !== 'not-counted');
  const out = new Array<number | null>(n);
  for (let i = 0; i < n; i++) {
    if (counted.length === 0) {
      out[i] = null;
      continue;
    }
    let p: number | null = 1;
    for (const f of counted) {
      const v = f.values[i];
      if (v === null || v === undefined) {
        p = null;
        break;
      }
      p *= v;
    }
    out[i] = p;
  }
  return out;
}

/**
 * The expected signal's shape: `source × throughput × bandpass`, scaled so its largest value is 1
 * (a shape, not a count: the source curve's units are arbitrary). Without a source curve the
 * source is taken as flat. Null where any part is unknown; all null when nothing is known.
 */
export function signalShape(
  wavelengthsNm: readonly number[],
  throughput: readonly (number | null)[],
  bandpassNm: readonly (number | null)[],
  source: DesignCurve | undefined,
): (number | null)[] {
  const raw = wavelengthsNm.map((nm, i) => {
    const t = throughput[i];
    const b = bandpassNm[i];
    if (t === null || t === undefined || b === null || b === undefined) return null;
    const s = source ? read(source, nm) : 1;
    return s === null ? null : s * t * b;
  });
  let max = 0;
  for (const v of raw) if (v !== null && v > max) max = v;
  return max > 0 ? raw.map((v) => (v === null ? null : v / max)) : raw.map(() => null);
}

export function sourceCurve(design: Design): DesignCurve | undefined {
  return curvesOf(design, 'source-spectrum')[0];
}

