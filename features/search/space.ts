/**
 * The search space: the stock lists searched over, what a request may search, and the candidate
 * enumeration. Pure, no React. A candidate is an index into the product of the lists; its
 * parameters are read back from that index, so no per-candidate object exists until one is kept.
 */

import type { Design } from '../../shared/design';
import { PHYSICAL_LIMITS } from '../../shared/design';
import { SEARCH_LIMITS, type SearchRequest } from '../../shared/search';
import type { FieldErrors } from '../../shared/validation';
import { grooveSpacingNm } from '../solver/grating';
import { proposeOrderSortingPlan } from '../solver/order-sorting';

/**
 * Stock groove densities, grooves/mm: the ruled and holographic densities gratings are sold in
 * (common practice; from memory of makers' catalogues).
 */
export const STOCK_GROOVE_DENSITIES_PER_MM = [150, 300, 600, 900, 1200, 1800, 2400, 3600] as const;
/** Stock first-order Littrow blaze wavelengths, nm (common practice; from memory of catalogues). */
export const STOCK_BLAZE_WAVELENGTHS_NM = [250, 300, 400, 500, 600, 750, 1000, 1250, 1600, 2000] as const;
/** Deviation angles 2K tried, degrees: the usual spread of Czerny–Turner mounts (common practice). */
export const STOCK_DEVIATION_ANGLES_DEG = [10, 20, 30, 40] as const;
/** Collimator and camera focal lengths tried (equal), mm: stock mirror focal lengths (common practice). */
export const STOCK_FOCAL_LENGTHS_MM = [100, 150, 200, 250, 300, 400, 500, 750, 1000] as const;
/** Orders ±1…±this are tried. */
export const DEFAULT_MAX_ORDER = 3;
/** Ruled width and height, mm: a common stock grating (common practice). */
export const DEFAULT_GRATING_SIZE_MM = 50;
/** Slit height, mm: a usual fixed slit length (common practice). */
export const SLIT_HEIGHT_MM = 10;
/**
 * Collimator off-axis angle, degrees. Czerny–Turner collimators are used a few degrees off axis
 * (about 5–10°, common practice; from memory); 8° keeps the entrance slit clear of the beam to the
 * grating while the camera angle that cancels its coma (Shafer, Megill & Droppleman 1964) stays
 * small.
 */
export const COLLIMATOR_OFF_AXIS_DEG = 8;

/**
 * Slit widths solved from a bandpass or resolving-power requirement are kept within what real
 * slits do: narrower than about 5 µm a slit diffracts and passes too little light to use, and
 * adjustable slits rarely open past 3 mm (common practice; from memory). A candidate whose solved
 * width falls below the narrowest is evaluated at the narrowest, so it fails the requirement that
 * asked for less, by a margin the nearest-miss list can show.
 */
export const MIN_SLIT_WIDTH_UM = 5;
export const MAX_SLIT_WIDTH_UM = 3000;
/** Slit width used when no requirement sets one, µm (a usual general-purpose width, common practice). */
export const DEFAULT_SLIT_WIDTH_UM = 50;
/** Solved widths are rounded down to this step, µm, so a design reads cleanly and stays inside its limit. */
export const SLIT_WIDTH_STEP_UM = 0.1;

/** The lists one search runs over: sorted, without repeats. */
export interface SearchSpace {
  readonly grooveDensitiesPerMm: readonly number[];
  readonly blazeWavelengthsNm: readonly number[];
  /** +1, −1, +2, −2, … */
  readonly orders: readonly number[];
  readonly deviationAnglesDeg: readonly number[];
  readonly focalLengthsMm: readonly number[];
  readonly gratingSizeMm: number;
}

/** One candidate's searched parameters. */
export interface CandidateParams {
  grooveDensityPerMm: number;
  blazeWavelengthNm: number;
  order: number;
  deviationAngleDeg: number;
  focalLengthMm: number;
}

function sortedUnique(values: readonly number[]): number[] {
  return [...new Set(values)].sort((a, b) => a - b);
}

/** The request's lists, or the stock ones, sorted and without repeats (so the order of a list never matters). */
export function searchSpace(request: SearchRequest): SearchSpace {
  const limits = request.search ?? {};
  const maxOrder = limits.maxOrder ?? DEFAULT_MAX_ORDER;
  const orders: number[] = [];
  for (let m = 1; m <= maxOrder; m++) orders.push(m, -m);
  return {
    grooveDensitiesPerMm: sortedUnique(limits.grooveDensitiesPerMm ?? STOCK_GROOVE_DENSITIES_PER_MM),
    blazeWavelengthsNm: sortedUnique(limits.blazeWavelengthsNm ?? STOCK_BLAZE_WAVELENGTHS_NM),
    orders,
    deviationAnglesDeg: sortedUnique(limits.deviationAnglesDeg ?? STOCK_DEVIATION_ANGLES_DEG),
    focalLengthsMm: sortedUnique(limits.focalLengthsMm ?? STOCK_FOCAL_LENGTHS_MM),
    gratingSizeMm: limits.gratingSizeMm ?? DEFAULT_GRATING_SIZE_MM,
  };
}

/** The product of the lists' lengths: what the candidate cap is checked against, before any work. */
export function listProduct(space: SearchSpace): number {
  return (
    space.grooveDensitiesPerMm.length *
    space.blazeWavelengthsNm.length *
    space.orders.length *
    space.deviationAnglesDeg.length *
    space.focalLengthsMm.length
  );
}

/**
 * Whether a blaze wavelength can be ruled at a groove density: a first-order Littrow blaze is
 * `2d sin θ_B`, so it must stay below 2d (Palmer & Loewen, Diffraction Grating Handbook, ch. 9).
 */
export function blazeFits(blazeWavelengthNm: number, grooveDensityPerMm: number): boolean {
  return blazeWavelengthNm < 2 * grooveSpacingNm(grooveDensityPerMm);
}

/**
 * What makes a request unsearchable, by field path (empty when it can run). Checked by the HTTP
 * route and the command line before any work starts, and by `planSearch`:
 * - more candidates than `SEARCH_LIMITS.maxCandidates` (the product of the lists' lengths);
 * - a searched value that makes no valid design (too few grooves, a beam faster than f/0.5, no
 *   blaze below twice the groove spacing of any density);
 * - a detector requirement without a detector (the detector is copied, never searched).
 */
export function searchRequestIssues(request: SearchRequest): FieldErrors {
  const issues: FieldErrors = {};
  const space = searchSpace(request);
  const product = listProduct(space);
  if (product > SEARCH_LIMITS.maxCandidates) {
    issues.search =
      `would evaluate ${product} candidates (the product of the lists' lengths): at most ` +
      `${SEARCH_LIMITS.maxCandidates}; shorten a list or lower maxOrder`;
  }
  const size = space.gratingSizeMm;
  const given = request.search ?? {};
  const densitiesPath = given.grooveDensitiesPerMm ? 'search.grooveDensitiesPerMm' : 'search.gratingSizeMm';
  const tooFew = space.grooveDensitiesPerMm.find((density) => density * size < PHYSICAL_LIMITS.minGrooves);
  if (tooFew !== undefined) {
    issues[densitiesPath] =
      `${tooFew} grooves/mm puts fewer than ${PHYSICAL_LIMITS.minGrooves} grooves across a ${size} mm grating`;
  }
  const focalPath = given.focalLengthsMm ? 'search.focalLengthsMm' : 'search.gratingSizeMm';
  const tooFast = space.focalLengthsMm.find((focalMm) => focalMm / size < PHYSICAL_LIMITS.minFNumber);
  if (tooFast !== undefined) {
    issues[focalPath] =
      `${tooFast} mm over a ${size} mm grating is faster than f/${PHYSICAL_LIMITS.minFNumber}: ` +
      `use at least ${PHYSICAL_LIMITS.minFNumber * size} mm`;
  }
  const anyBlaze = space.grooveDensitiesPerMm.some((density) =>
    space.blazeWavelengthsNm.some((blaze) => blazeFits(blaze, density)),
  );
  if (!anyBlaze) {
    issues['search.blazeWavelengthsNm'] =
      'has no blaze wavelength below twice the groove spacing of any searched groove density';
  }
  const { requirements, detector } = request;
  if (!detector) {
    if (requirements.minPixelsPerBandpass !== undefined) {
      issues['requirements.minPixelsPerBandpass'] = 'needs a detector (detector.pixelPitchUm and detector.pixelCount)';
    }
    if (requirements.oneShotCoverage === true) {
      issues['requirements.oneShotCoverage'] = 'needs a detector (detector.pixelPitchUm and detector.pixelCount)';
    }
  }
  return issues;
}

/**
 * Every candidate as a flat table: the parameters of candidate `i` are `params(i)`. Blaze
 * wavelengths that no facet of a density can reach (at or beyond 2d) are left out of that density.
 */
export interface CandidateTable {
  readonly count: number;
  readonly grooveDensityPerMm: Float64Array;
  readonly blazeWavelengthNm: Float64Array;
  readonly order: Float64Array;
  readonly deviationAngleDeg: Float64Array;
  readonly focalLengthMm: Float64Array;
}

/** Enumerates the candidates in a fixed order (density, blaze, order, deviation, focal), which is also the tie-break. */
export function enumerateCandidates(space: SearchSpace): CandidateTable {
  const capacity = listProduct(space);
  const table = {
    grooveDensityPerMm: new Float64Array(capacity),
    blazeWavelengthNm: new Float64Array(capacity),
    order: new Float64Array(capacity),
    deviationAngleDeg: new Float64Array(capacity),
    focalLengthMm: new Float64Array(capacity),
  };
  let n = 0;
  for (const density of space.grooveDensitiesPerMm) {
    for (const blaze of space.blazeWavelengthsNm) {
      if (!blazeFits(blaze, density)) continue;
      for (const order of space.orders) {
        for (const deviation of space.deviationAnglesDeg) {
          for (const focal of space.focalLengthsMm) {
            table.grooveDensityPerMm[n] = density;
            table.blazeWavelengthNm[n] = blaze;
            table.order[n] = order;
            table.deviationAngleDeg[n] = deviation;
            table.focalLengthMm[n] = focal;
            n++;
          }
        }
      }
    }
  }
  return {
    count: n,
    grooveDensityPerMm: table.grooveDensityPerMm.subarray(0, n),
    blazeWavelengthNm: table.blazeWavelengthNm.subarray(0, n),
    order: table.order.subarray(0, n),
    deviationAngleDeg: table.deviationAngleDeg.subarray(0, n),
    focalLengthMm: table.focalLengthMm.subarray(0, n),
  };
}

export function candidateParams(table: CandidateTable, index: number): CandidateParams {
  return {
    grooveDensityPerMm: table.grooveDensityPerMm[index] as number,
    blazeWavelengthNm: table.blazeWavelengthNm[index] as number,
    order: table.order[index] as number,
    deviationAngleDeg: table.deviationAngleDeg[index] as number,
    focalLengthMm: table.focalLengthMm[index] as number,
  };
}

/**
 * The complete design of one candidate: a Czerny–Turner with equal focal lengths, the collimator
 * `COLLIMATOR_OFF_AXIS_DEG` off axis and the camera at `cameraOffAxisDeg` (its coma-free angle),
 * equal slits, and the request's range, source, detector and requirements copied in, so
 * `npm run solve` takes it unchanged.
 */
export function candidateDesign(
  request: SearchRequest,
  space: SearchSpace,
  params: CandidateParams,
  slitWidthUm: number,
  cameraOffAxisDeg: number,
): Design {
  const design: Design = {
    grating: {
      grooveDensityPerMm: params.grooveDensityPerMm,
      order: params.order,
      blazeWavelengthNm: params.blazeWavelengthNm,
      ruledWidthMm: space.gratingSizeMm,
      ruledHeightMm: space.gratingSizeMm,
    },
    layout: {
      kind: 'czerny-turner',
      deviationAngleDeg: params.deviationAngleDeg,
      collimatorFocalMm: params.focalLengthMm,
      cameraFocalMm: params.focalLengthMm,
      collimatorOffAxisDeg: COLLIMATOR_OFF_AXIS_DEG,
      cameraOffAxisDeg,
    },
    slits: { entranceWidthUm: slitWidthUm, exitWidthUm: slitWidthUm, heightMm: SLIT_HEIGHT_MM },
    range: { ...request.range },
    ...(request.source ? { source: { ...request.source } } : {}),
    ...(request.detector ? { detector: { ...request.detector } } : {}),
    requirements: structuredClone(request.requirements),
  };
  // Overlaps are allowed where a filter blocks them: the candidate comes with its filter plan.
  if (request.requirements.orderOverlap === 'filtered') {
    const filters = proposeOrderSortingPlan(design);
    if (filters.length > 0) design.filters = filters;
  }
  return design;
}
