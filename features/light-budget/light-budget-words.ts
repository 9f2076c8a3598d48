/**
 * The light budget in words and rows for the workbench card (and anything else that shows it):
 * what the input does to the grating, what each throughput factor rests on, and its value at the
 * range's start, centre and end. Pure: no React.
 */

import { FACTOR_WORDS, type InputFill, type LightBudget, type ThroughputFactor } from '../solver';
import { CURVE_KIND_WORDS, type DesignCurve } from '../../shared/curves';
import { formatNumber, formatPercent } from '../../shared/format';

const percent = (fraction: number) => formatPercent(fraction, { maximumFractionDigits: fraction < 0.1 ? 1 : 0 });

export const FILL_STATE_WORDS: Readonly<Record<InputFill['state'], string>> = {
  matched: 'Matched',
  overfilled: 'Over-filled',
  underfilled: 'Under-filled',
  'assumed-matched': 'Taken as matched',
};

/** One sentence on how the input fills the grating. */
export function fillSentence(fill: InputFill | null, acceptanceFNumber: number | null): string {
  if (!fill) return 'The range centre is unreachable, so the fill is not known.';
  const accepts = acceptanceFNumber === null ? '' : ` The instrument accepts about f/${formatNumber(acceptanceFNumber, 3)}.`;
  if (fill.state === 'assumed-matched') {
    return `No input cone given: the light is taken to fill the grating exactly, and the input coupling is not counted.${accepts}`;
  }
  const cone = `The input cone is f/${formatNumber(fill.inputFNumber ?? 0, 3)}.${accepts}`;
  const lands = ` ${percent(fill.pupilFraction)} of it lands on the grating, lighting ${percent(fill.litWidthFraction)} of its width (${formatNumber(fill.litGrooves, 3)} grooves, R up to ${formatNumber(fill.litResolvingPower, 3)}).`;
  const slit = fill.slitFraction < 1 ? ` The slit passes ${percent(fill.slitFraction)} of the fibre core's light.` : '';
  return cone + lands + slit;
}

export const BASIS_WORDS: Readonly<Record<ThroughputFactor['basis'], string>> = {
  measured: 'measured',
  estimate: 'scalar blaze estimate',
  model: 'computed from the design',
  'not-counted': 'not counted',
};

/** What a factor rests on: "measured (Batch 7 efficiency)", "not counted: attach a curve". */
export function basisText(factor: ThroughputFactor): string {
  if (factor.basis === 'measured') return `measured (${factor.curveNames.join(', ')})`;
  if (factor.basis === 'not-counted') {
    return factor.id === 'input' ? 'not counted: give the light input' : factor.id === 'grating' ? 'not counted: give the blaze or attach a curve' : 'not counted: attach a curve';
  }
  if (factor.id === 'filter') return 'the filters’ edges (straight ramps)';
  if (factor.id === 'input') return 'computed from the input and the grating';
  return BASIS_WORDS[factor.basis];
}

/** The three places a row shows: the range's start, centre and end (nearest evaluated points). */
export function threePlaces(wavelengthsNm: readonly number[]): { label: string; index: number; nm: number }[] {
  const n = wavelengthsNm.length;
  if (n === 0) return [];
  const indices = [0, Math.floor((n - 1) / 2), n - 1];
  return indices.map((index, i) => ({ label: ['Start', 'Centre', 'End'][i] as string, index, nm: wavelengthsNm[index] as number }));
}

export function valueText(value: number | null | undefined): string {
  return value === null || value === undefined ? 'no data' : percent(value);
}

export interface FactorRow {
  id: ThroughputFactor['id'];
  name: string;
  basis: string;
  values: string[];
  counted: boolean;
  gaps: string | null;
}

export function factorRows(light: LightBudget, wavelengthsNm: readonly number[]): FactorRow[] {
  const places = threePlaces(wavelengthsNm);
  return light.factors.map((f) => ({
    id: f.id,
    name: FACTOR_WORDS[f.id].charAt(0).toUpperCase() + FACTOR_WORDS[f.id].slice(1),
    basis: basisText(f),
    values: places.map((p) => (f.basis === 'not-counted' ? '—' : valueText(f.values[p.index]))),
    counted: f.basis !== 'not-counted',
    gaps:
      f.gapsNm.length === 0
        ? null
        : `No data at ${f.gapsNm.map((g) => (g.fromNm === g.toNm ? `${formatNumber(g.fromNm)} nm` : `${formatNumber(g.fromNm)}–${formatNumber(g.toNm)} nm`)).join(', ')}`,
  }));
}

/** "Grating efficiency, 412 points, 300–900 nm, order 1, TE". */
export function curveLine(curve: DesignCurve): string {
  const n = curve.wavelengthsNm.length;
  const span = `${formatNumber(curve.wavelengthsNm[0] ?? 0)}–${formatNumber(curve.wavelengthsNm[n - 1] ?? 0)} nm`;
  const extras = [
    curve.order === undefined ? null : `order ${curve.order}`,
    curve.polarisation === undefined || curve.polarisation === 'unpolarised' ? null : curve.polarisation.toUpperCase(),
    curve.mirror === undefined ? null : `${curve.mirror === 'both' ? 'both mirrors' : `${curve.mirror} mirror`}`,
    curve.filterNumber === undefined ? null : `filter ${curve.filterNumber}`,
    curve.medium === 'vacuum' ? 'vacuum wavelengths' : null,
  ].filter((x): x is string => x !== null);
  const kind = CURVE_KIND_WORDS[curve.kind];
  return [`${kind.charAt(0).toUpperCase()}${kind.slice(1)}`, `${n} points`, span, ...extras].join(', ');
}
