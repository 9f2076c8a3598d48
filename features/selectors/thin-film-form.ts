/**
 * The thin-film (Fabry–Pérot) filter calculator's fields, its defaults and the checked input
 * they make, plus the transmission curve to draw. Pure: no React.
 */

import { airyTransmission, reflectingFinesse } from '@/features/solver';
import {
  interferenceFilterInputSchema,
  type InterferenceFilterAnswer,
  type InterferenceFilterInput,
} from '@/shared/selectors';
import { evenlySpaced, rangeErrors, readFields, schemaErrors, type FormCheck } from './form-check';
import type { CalculatorField } from './field-reading';

export type ThinFilmKey =
  | 'targetNm'
  | 'order'
  | 'spacerIndex'
  | 'mirrorReflectance'
  | 'effectiveIndex'
  | 'startNm'
  | 'endNm'
  | 'tiltFromDeg'
  | 'tiltToDeg';

export type ThinFilmText = Record<ThinFilmKey, string>;

export const THIN_FILM_FIELDS: readonly CalculatorField<ThinFilmKey>[] = [
  { key: 'targetNm', label: 'Target wavelength', reading: 'nm', unitLabel: 'nm', help: 'Peak at normal incidence, e.g. 550 nm or 0.55 µm' },
  { key: 'order', label: 'Order', reading: 'integer', help: 'Interference order m of the spacer, a whole number from 1 to 1000' },
  { key: 'spacerIndex', label: 'Spacer index', reading: 'number', help: 'Refractive index n of the spacer layer, e.g. 1.45' },
  { key: 'mirrorReflectance', label: 'Mirror reflectance', reading: 'fraction', help: 'Reflectance R of each mirror: 0.9 or 90 %' },
  {
    key: 'effectiveIndex',
    label: 'Effective index',
    reading: 'number',
    help: 'n_eff for tilt tuning (folds the mirror layers in); blank uses the spacer index',
    optional: true,
  },
  { key: 'startNm', label: 'Range start', reading: 'nm', unitLabel: 'nm', help: 'Shortest wavelength to look at' },
  { key: 'endNm', label: 'Range end', reading: 'nm', unitLabel: 'nm', help: 'Longest wavelength to look at' },
  { key: 'tiltFromDeg', label: 'Tilt from', reading: 'deg', unitLabel: '°', help: 'Smallest tilt from the normal, 0 to 89°' },
  { key: 'tiltToDeg', label: 'Tilt to', reading: 'deg', unitLabel: '°', help: 'Largest tilt from the normal, 0 to 89°' },
];

const FIELD = Object.fromEntries(THIN_FILM_FIELDS.map((f) => [f.key, f])) as Record<ThinFilmKey, CalculatorField<ThinFilmKey>>;

/** A green line filter in second order: the default shows a blocking warning at once (a shorter peak in range). */
export const THIN_FILM_DEFAULTS: ThinFilmText = {
  targetNm: '550',
  order: '2',
  spacerIndex: '1.45',
  mirrorReflectance: '0.9',
  effectiveIndex: '1.8',
  startNm: '350',
  endNm: '800',
  tiltFromDeg: '0',
  tiltToDeg: '30',
};

/** Tilt angles evaluated between the two typed ends. */
export const TILT_STEPS = 31;

const SPOKEN: Record<string, string> = { startNm: 'the range start', endNm: 'the range end' };

function fieldForPath(path: readonly PropertyKey[], tiltCount: number): CalculatorField | null {
  const [head, sub] = path;
  if (head === 'rangeNm') return sub === 'endNm' ? FIELD.endNm : FIELD.startNm;
  if (head === 'tiltsDeg') return sub === 0 && tiltCount > 1 ? FIELD.tiltFromDeg : FIELD.tiltToDeg;
  return (FIELD as Record<string, CalculatorField>)[String(head)] ?? null;
}

/** The typed text as the API's input, or every field's message. */
export function checkThinFilm(text: ThinFilmText): FormCheck<InterferenceFilterInput> {
  const read = readFields(THIN_FILM_FIELDS, text);
  const v = read.values as Partial<Record<ThinFilmKey, number>>;
  const errors = { ...read.errors, ...rangeErrors(FIELD.startNm, FIELD.endNm, v.startNm, v.endNm) };
  if (v.tiltFromDeg !== undefined && v.tiltToDeg !== undefined && v.tiltToDeg < v.tiltFromDeg && !errors.tiltToDeg) {
    errors.tiltToDeg = `${FIELD.tiltToDeg.label} must be at least the tilt from (${v.tiltFromDeg}°)`;
  }
  if (Object.keys(errors).length > 0) return { ok: false, errors, pending: read.pending };
  const tiltsDeg = evenlySpaced(v.tiltFromDeg!, v.tiltToDeg!, TILT_STEPS);
  const candidate = {
    kind: 'interference-filter' as const,
    targetNm: v.targetNm,
    order: v.order,
    spacerIndex: v.spacerIndex,
    mirrorReflectance: v.mirrorReflectance,
    ...(v.effectiveIndex !== undefined ? { effectiveIndex: v.effectiveIndex } : {}),
    tiltsDeg,
    rangeNm: { startNm: v.startNm, endNm: v.endNm },
  };
  const parsed = interferenceFilterInputSchema.safeParse(candidate);
  if (!parsed.success) {
    return { ok: false, errors: schemaErrors(parsed.error, (path) => fieldForPath(path, tiltsDeg.length), SPOKEN), pending: false };
  }
  return { ok: true, input: parsed.data };
}

/** Evenly spaced samples across the range before the points around each peak are added. */
export const CURVE_BASE_POINTS = 600;
/** Points added around each listed peak, at quarter-width steps, so a narrow peak is drawn at its true height. */
const PEAK_HALF_SPAN = 8;

export interface Curve {
  xs: number[];
  ys: number[];
}

/**
 * The lossless Airy transmission across the range at normal incidence: an even grid plus
 * samples every quarter FWHM around each listed peak (`λ_k / (k F)`, the peak's own width), so
 * peaks far narrower than the grid step still reach 1.
 */
export function thinFilmCurve(input: InterferenceFilterInput, answer: InterferenceFilterAnswer): Curve {
  const { startNm, endNm } = input.rangeNm;
  const xs = evenlySpaced(startNm, endNm, CURVE_BASE_POINTS);
  const finesse = reflectingFinesse(input.mirrorReflectance);
  const roundTripNm = 2 * input.spacerIndex * answer.spacerThicknessNm;
  for (const peakNm of answer.peaksNm) {
    const k = Math.max(1, Math.round(roundTripNm / peakNm));
    const quarterNm = peakNm / (k * finesse) / 4;
    for (let j = -PEAK_HALF_SPAN; j <= PEAK_HALF_SPAN; j++) {
      const x = peakNm + j * quarterNm;
      if (x >= startNm && x <= endNm) xs.push(x);
    }
  }
  xs.sort((a, b) => a - b);
  const unique = xs.filter((x, i) => i === 0 || x - xs[i - 1]! > 1e-9 * x);
  return {
    xs: unique,
    ys: unique.map((x) => airyTransmission(x, answer.spacerThicknessNm, input.spacerIndex, input.mirrorReflectance)),
  };
}

