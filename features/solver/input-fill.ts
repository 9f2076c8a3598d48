/**
 * How the light input fills the instrument: what share of the input cone the grating accepts
 * (over-filling spills the rest as stray light), how much of the grating width it lights
 * (under-filling lights fewer grooves, so the diffraction limit on resolving power drops), and,
 * for a fibre, what share of its core passes the slit. Paraxial geometry with a uniformly lit
 * circular cone and core (a top-hat fibre output; common practice for a first estimate).
 */

import type { LightInput } from '../../shared/light-input';
import { circleFractionInRectangle } from './circle-in-rectangle';
import { coneHalfAngleRad, fibreFNumber } from './etendue';

/** Below this share of the input cone accepted, the design is called over-filled (our threshold). */
export const OVERFILL_BELOW = 0.95;
/** Below this share of the grating width lit, the design is called under-filled (our threshold). */
export const UNDERFILL_BELOW = 0.8;

export type FillState = 'matched' | 'overfilled' | 'underfilled' | 'assumed-matched';

export interface InputFill {
  /** The input cone's f-number; null when the input is taken as matched (no cone given). */
  inputFNumber: number | null;
  /** Share of the input cone landing on the grating's projected aperture (1 when assumed matched). */
  pupilFraction: number;
  /** Share of a fibre core's light passing the slit (1 for other inputs: an extended source fills it). */
  slitFraction: number;
  /** `pupilFraction × slitFraction`: the input coupling factor of the throughput. */
  coupling: number;
  /** Share of the ruled width the input cone lights (1 when assumed matched). */
  litWidthFraction: number;
  /** Grooves lit: the ruled width lit × groove density. */
  litGrooves: number;
  /** `|m| · N_lit`: the diffraction limit on resolving power with the grooves actually lit. */
  litResolvingPower: number;
  state: FillState;
}

export interface FillGeometry {
  collimatorFocalMm: number;
  ruledWidthMm: number;
  ruledHeightMm: number;
  grooveDensityPerMm: number;
  order: number;
  /** Angle of incidence on the grating at the setting considered. */
  incidenceRad: number;
  entranceWidthMm: number;
  slitHeightMm: number;
}

/** The input's cone as an f-number, or null when none is given (free space without one). */
export function inputFNumber(input: LightInput | undefined): number | null {
  if (!input) return null;
  if (input.kind === 'fibre') return fibreFNumber(input.numericalAperture);
  return input.fNumber ?? null;
}

/** Half-angle of the input cone, from the fibre's NA directly or the f-number. */
function inputHalfAngleRad(input: LightInput): number | null {
  if (input.kind === 'fibre') return Math.asin(Math.min(1, input.numericalAperture));
  return input.fNumber === undefined ? null : coneHalfAngleRad(input.fNumber);
}

export function inputFill(input: LightInput | undefined, g: FillGeometry): InputFill {
  const fullGrooves = g.grooveDensityPerMm * g.ruledWidthMm;
  const slitFraction =
    input?.kind === 'fibre'
      ? circleFractionInRectangle(input.coreDiameterUm / 2000, g.entranceWidthMm / 2, g.slitHeightMm / 2)
      : 1;
  const halfAngle = input ? inputHalfAngleRad(input) : null;
  if (halfAngle === null) {
    return {
      inputFNumber: null,
      pupilFraction: 1,
      slitFraction,
      coupling: slitFraction,
      litWidthFraction: 1,
      litGrooves: fullGrooves,
      litResolvingPower: Math.abs(g.order) * fullGrooves,
      state: 'assumed-matched',
    };
  }
  // The cone's footprint at the collimator, a distance f from the slit, is 2 f tan θ across; the
  // collimator sends it to the grating as a parallel beam of the same diameter.
  const beamDiameterMm = 2 * g.collimatorFocalMm * Math.tan(halfAngle);
  const projectedWidthMm = g.ruledWidthMm * Math.cos(g.incidenceRad);
  const pupilFraction = circleFractionInRectangle(beamDiameterMm / 2, projectedWidthMm / 2, g.ruledHeightMm / 2);
  const litWidthFraction = Math.min(1, beamDiameterMm / projectedWidthMm);
  const litGrooves = fullGrooves * litWidthFraction;
  const state: FillState =
    pupilFraction < OVERFILL_BELOW ? 'overfilled' : litWidthFraction < UNDERFILL_BELOW ? 'underfilled' : 'matched';
  return {
    inputFNumber: inputFNumber(input),
    pupilFraction,
    slitFraction,
    coupling: pupilFraction * slitFraction,
    litWidthFraction,
    litGrooves,
    litResolvingPower: Math.abs(g.order) * litGrooves,
    state,
  };
}
