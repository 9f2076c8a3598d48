/**
 * The light budget of a design: the slit's étendue against the instrument's acceptance, how the
 * light input fills the grating, and the relative throughput of each element and their product
 * across the evaluated wavelengths (etendue.ts, input-fill.ts, throughput.ts hold the physics).
 */

import type { Design } from '../../shared/design';
import type { InputKind } from '../../shared/light-input';
import { etendueMm2Sr, equivalentFNumber, rectangleSolidAngleSr } from './etendue';
import { grooveSpacingNm, solveGrating } from './grating';
import { inputFill, type FillGeometry, type InputFill } from './input-fill';
import { UM_PER_MM } from './math';
import { halfDeviationRad } from './mount';
import type { WavelengthPoint } from './results';
import {
  signalShape,
  sourceCurve,
  throughputFactors,
  throughputProduct,
  type ThroughputFactor,
} from './throughput';

export interface LightBudget {
  /** The design's input kind; `none` when the design has no input block (taken as matched). */
  inputKind: InputKind | 'none';
  /** Entrance slit width × height, mm². */
  slitAreaMm2: number;
  /** Solid angle of the grating's projected aperture seen from the slit at the centre wavelength; null when unreachable. */
  acceptanceSolidAngleSr: number | null;
  /** The f-number of a circular cone holding that solid angle. */
  acceptanceFNumber: number | null;
  /** `G = A_slit · Ω`, mm²·sr. */
  etendueMm2Sr: number | null;
  /** How the input fills the instrument at the centre wavelength; null when unreachable. */
  fill: InputFill | null;
  /** Each element's share per evaluated wavelength (grating, collimator, camera, filter, detector, input). */
  factors: ThroughputFactor[];
  /** The product of the counted factors per wavelength; null where one is unknown. */
  throughput: (number | null)[];
  /** `source × throughput × bandpass`, largest value 1; the source is flat without a source curve. */
  signal: (number | null)[];
  sourceBasis: 'measured' | 'flat';
  /** The lowest known throughput and where; null when nothing is known. */
  lowest: { value: number; wavelengthNm: number } | null;
}

function fillGeometry(design: Design, incidenceRad: number): FillGeometry {
  return {
    collimatorFocalMm: design.layout.collimatorFocalMm,
    ruledWidthMm: design.grating.ruledWidthMm,
    ruledHeightMm: design.grating.ruledHeightMm,
    grooveDensityPerMm: design.grating.grooveDensityPerMm,
    order: design.grating.order,
    incidenceRad,
    entranceWidthMm: design.slits.entranceWidthUm / UM_PER_MM,
    slitHeightMm: design.slits.heightMm,
  };
}

export function lightBudget(design: Design, points: readonly WavelengthPoint[]): LightBudget {
  const slitAreaMm2 = (design.slits.entranceWidthUm / UM_PER_MM) * design.slits.heightMm;
  const centreNm = (design.range.startNm + design.range.endNm) / 2;
  const centre = solveGrating(
    design.grating.order,
    centreNm,
    grooveSpacingNm(design.grating.grooveDensityPerMm),
    halfDeviationRad(design.layout),
  );
  let acceptance: number | null = null;
  let fill: InputFill | null = null;
  if (centre.reachable) {
    acceptance = rectangleSolidAngleSr(
      design.grating.ruledWidthMm * Math.cos(centre.incidenceRad),
      design.grating.ruledHeightMm,
      design.layout.collimatorFocalMm,
    );
    fill = inputFill(design.input, fillGeometry(design, centre.incidenceRad));
  }

  const wavelengthsNm = points.map((p) => p.wavelengthNm);
  const inputCoupling = points.map((p) =>
    p.incidenceDeg === null ? null : inputFill(design.input, fillGeometry(design, (p.incidenceDeg * Math.PI) / 180)).coupling,
  );
  const factors = throughputFactors({
    design,
    wavelengthsNm,
    blazeEfficiency: points.map((p) => p.blazeEfficiency),
    inputCoupling,
    inputGiven: design.input !== undefined,
  });
  const throughput = throughputProduct(factors, points.length);
  const source = sourceCurve(design);
  const signal = signalShape(
    wavelengthsNm,
    throughput,
    points.map((p) => p.bandpassNm),
    source,
  );
  let lowest: LightBudget['lowest'] = null;
  throughput.forEach((value, i) => {
    if (value !== null && (lowest === null || value < lowest.value)) lowest = { value, wavelengthNm: wavelengthsNm[i] as number };
  });
  return {
    inputKind: design.input?.kind ?? 'none',
    slitAreaMm2,
    acceptanceSolidAngleSr: acceptance,
    acceptanceFNumber: acceptance === null ? null : equivalentFNumber(acceptance),
    etendueMm2Sr: acceptance === null ? null : etendueMm2Sr(slitAreaMm2, acceptance),
    fill,
    factors,
    throughput,
    signal,
    sourceBasis: source ? 'measured' : 'flat',
    lowest,
  };
}
