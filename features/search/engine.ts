/**
 * The candidate search: plan it, evaluate the candidates in steps (so a Web Worker can report
 * progress and stop between steps), then rank the ones that pass and confirm each returned one
 * with the ordinary requirement check. Pure, no React; the HTTP route, the command line and the
 * workbench's worker all run this one module.
 */

import type { Design } from '../../shared/design';
import { SEARCH_LIMITS, type Candidate, type NearMiss, type SearchAnswer, type SearchRequest } from '../../shared/search';
import type { FieldErrors } from '../../shared/validation';
import { checkRequirements, designFootprintMm } from '../requirements/index';
import {
  WIDTH_SETTING,
  allocateColumns,
  allocateScratch,
  columnarPlan,
  evaluateCandidates,
  failsOn,
  type ColumnarPlan,
  type Columns,
  type ExclusionKey,
  type FootprintOf,
} from './columnar';
import { resolveWeights, scoreParts, weightedScore } from './score';
import {
  COLLIMATOR_OFF_AXIS_DEG,
  DEFAULT_SLIT_WIDTH_UM,
  candidateDesign,
  candidateParams,
  enumerateCandidates,
  searchRequestIssues,
  searchSpace,
  type CandidateTable,
  type SearchSpace,
} from './space';

/** A request that cannot be searched (too many candidates, a value that makes no design…), by field path. */
export class SearchRequestError extends Error {
  constructor(readonly fields: FieldErrors) {
    super(`The search cannot run: ${Object.entries(fields).map(([path, why]) => `${path}: ${why}`).join('; ')}`);
    this.name = 'SearchRequestError';
  }
}

export interface SearchRun {
  /** Candidates to evaluate. */
  readonly total: number;
  /** Evaluates up to `count` more candidates; returns how many are done. */
  step(count: number): number;
  /** Ranks and confirms what is done (all of it after the last step, or a part when stopped early). */
  finish(): SearchAnswer;
}

/** Nearest misses shown when nothing passes. */
export const NEAREST_COUNT = 3;

/**
 * Most candidates confirmed with `checkRequirements` (about 0.1 ms each) while filling the top
 * list: the screen judges as the check does, so a drop is rare, and the bound keeps one search's
 * time bounded whatever happens.
 */
function confirmationLimit(top: number): number {
  return Math.max(10 * top, 100);
}

interface SearchState {
  readonly request: SearchRequest;
  readonly space: SearchSpace;
  readonly table: CandidateTable;
  readonly plan: ColumnarPlan;
  readonly columns: Columns;
}

/**
 * Sets a search up: the lists, every candidate's parameters and the columns they are evaluated
 * into. Throws a `SearchRequestError` for a request that cannot run (see `searchRequestIssues`).
 */
export function planSearch(request: SearchRequest): SearchRun {
  const issues = searchRequestIssues(request);
  if (Object.keys(issues).length > 0) throw new SearchRequestError(issues);
  const space = searchSpace(request);
  const table = enumerateCandidates(space);
  const plan = columnarPlan(request, space);
  const columns = allocateColumns(table.count);
  const scratch = allocateScratch(plan.wavelengthsNm.length);
  const footprintOf = request.requirements.maxFootprintMm ? footprints(request, space, table) : null;
  const state: SearchState = { request, space, table, plan, columns };
  let done = 0;
  return {
    total: table.count,
    step(count) {
      const to = Math.min(table.count, done + Math.max(0, Math.floor(count)));
      evaluateCandidates(plan, table, columns, scratch, done, to, footprintOf);
      done = to;
      return done;
    },
    finish: () => finishSearch(state, done),
  };
}

/**
 * The mount's outline of each candidate, through the sketch's geometry (about 45 µs each, most of
 * a search's time when the footprint is required). The blaze changes nothing the sketch places,
 * so candidates that differ only in blaze share one outline: the stock lists have ten blazes.
 */
function footprints(request: SearchRequest, space: SearchSpace, table: CandidateTable): FootprintOf {
  const known = new Map<string, ReturnType<FootprintOf>>();
  return (index, widthUm, cameraDeg) => {
    const key = `${table.grooveDensityPerMm[index]} ${table.order[index]} ${table.deviationAngleDeg[index]} ${table.focalLengthMm[index]} ${widthUm} ${cameraDeg}`;
    let footprint = known.get(key);
    if (footprint === undefined) {
      footprint = designFootprintMm(candidateDesign(request, space, candidateParams(table, index), widthUm, cameraDeg));
      known.set(key, footprint);
    }
    return footprint;
  };
}

/** `planSearch`, every step, `finish`. */
export function runSearch(request: SearchRequest): SearchAnswer {
  const run = planSearch(request);
  run.step(run.total);
  return run.finish();
}

/** The keys counted in `excludedBy`: each given requirement, then `range`. */
function countedKeys(plan: ColumnarPlan): ExclusionKey[] {
  return [...plan.given, 'range'];
}

function designOf(state: SearchState, index: number): Design {
  const width = state.columns.slitWidthUm[index] as number;
  const camera = state.columns.cameraOffAxisDeg[index] as number;
  // A candidate that cannot reach its range has no solved width or camera angle: show the defaults.
  return candidateDesign(
    state.request,
    state.space,
    candidateParams(state.table, index),
    Number.isFinite(width) ? width : DEFAULT_SLIT_WIDTH_UM,
    Number.isFinite(camera) ? camera : COLLIMATOR_OFF_AXIS_DEG,
  );
}

function finite(value: number): number | null {
  return Number.isFinite(value) ? value : null;
}

/** Smallest margin among `keys` (NaN entries, which do not apply, skipped); null when none applies. */
function smallestMargin(columns: Columns, index: number, keys: readonly ExclusionKey[]): number | null {
  let smallest: number | null = null;
  for (const key of keys) {
    const margin = columns.margins[key][index] as number;
    if (Number.isFinite(margin) && (smallest === null || margin < smallest)) smallest = margin;
  }
  return smallest;
}

function candidateOf(state: SearchState, index: number, score: number): Candidate {
  const { columns, table, plan } = state;
  const params = candidateParams(table, index);
  return {
    design: designOf(state, index),
    score,
    figures: {
      grooveDensityPerMm: params.grooveDensityPerMm,
      order: params.order,
      blazeWavelengthNm: params.blazeWavelengthNm,
      deviationAngleDeg: params.deviationAngleDeg,
      focalLengthMm: params.focalLengthMm,
      slitWidthUm: columns.slitWidthUm[index] as number,
      worstBandpassNm: finite(columns.worstBandpassNm[index] as number),
      worstResolvingPower: finite(columns.worstResolvingPower[index] as number),
      minBlazeEfficiency: finite(columns.minBlazeEfficiency[index] as number),
      reciprocalDispersionAtCentreNmPerMm: finite(columns.centreReciprocalDispersionNmPerMm[index] as number),
      fNumber: finite(columns.fNumber[index] as number),
      overlappedWavelengths: columns.overlappedWavelengths[index] as number,
      minMargin: smallestMargin(columns, index, plan.given),
    },
  };
}

function finishSearch(state: SearchState, done: number): SearchAnswer {
  const { request, plan, columns, table, space } = state;
  const weights = resolveWeights(request.search?.weights);
  const top = request.search?.top ?? SEARCH_LIMITS.maxTop;
  const keys = countedKeys(plan);
  const excludedBy: Record<string, number> = Object.fromEntries(keys.map((key) => [key, 0]));
  const passing: number[] = [];
  for (let i = 0; i < done; i++) {
    if (columns.failed[i] === 0) {
      passing.push(i);
      continue;
    }
    for (const key of keys) if (failsOn(columns, i, key)) excludedBy[key] = (excludedBy[key] ?? 0) + 1;
  }

  const longestFocalMm = Math.max(...space.focalLengthsMm);
  const unsolvedKeys = plan.given.filter((id) => !WIDTH_SETTING.includes(id));
  const scores = new Float64Array(table.count);
  for (const i of passing) {
    const parts = scoreParts({
      minMarginUnsolved: smallestMargin(columns, i, unsolvedKeys),
      minBlazeEfficiency: columns.minBlazeEfficiency[i] as number,
      focalLengthMm: table.focalLengthMm[i] as number,
      longestFocalMm,
      overlappedWavelengths: columns.overlappedWavelengths[i] as number,
      checkedWavelengths: plan.sweepPoints,
    });
    scores[i] = weightedScore(parts, weights);
  }
  // Highest score first; equal scores keep the enumeration order (a fixed key), so the answer is
  // the same for the same request.
  passing.sort((a, b) => (scores[b] as number) - (scores[a] as number) || a - b);

  // Every returned candidate is confirmed by the ordinary check at its own sweep.
  const candidates: Candidate[] = [];
  const dropped = new Map<number, Record<string, number>>();
  const limit = confirmationLimit(top);
  for (let k = 0; k < passing.length && candidates.length < top && k < limit; k++) {
    const index = passing[k] as number;
    const candidate = candidateOf(state, index, scores[index] as number);
    const failing = checkRequirements(candidate.design).checks.filter((check) => check.status === 'fail');
    if (failing.length === 0) {
      candidates.push(candidate);
      continue;
    }
    const misses: Record<string, number> = {};
    for (const check of failing) {
      excludedBy[check.id] = (excludedBy[check.id] ?? 0) + 1;
      misses[check.id] = check.margin ?? -Number.EPSILON;
    }
    dropped.set(index, misses);
  }

  return {
    candidates,
    considered: done,
    excludedBy,
    nearest: candidates.length > 0 ? [] : nearestMisses(state, done, keys, dropped),
    weights: { ...weights },
  };
}

/** The candidates whose worst margin is least negative, with each failed requirement's margin (as the screen or the confirming check found it). */
function nearestMisses(
  state: SearchState,
  done: number,
  keys: readonly ExclusionKey[],
  dropped: ReadonlyMap<number, Record<string, number>>,
): NearMiss[] {
  const { columns } = state;
  const worst = new Float64Array(done);
  const order: number[] = [];
  for (let i = 0; i < done; i++) {
    const misses = dropped.get(i);
    if (columns.failed[i] === 0 && misses === undefined) continue;
    worst[i] = misses ? Math.min(...Object.values(misses)) : (smallestMargin(columns, i, keys) ?? Number.NEGATIVE_INFINITY);
    order.push(i);
  }
  // A candidate that cannot reach its range was judged on nothing else, so its one miss says
  // little: those come after every candidate that was judged in full.
  const unjudged = (i: number) => (failsOn(columns, i, 'range') ? 1 : 0);
  order.sort((a, b) => unjudged(a) - unjudged(b) || (worst[b] as number) - (worst[a] as number) || a - b);
  return order.slice(0, NEAREST_COUNT).map((index) => {
    const screened: Record<string, number> = {};
    for (const key of keys) {
      if (failsOn(columns, index, key)) screened[key] = columns.margins[key][index] as number;
    }
    return { design: designOf(state, index), misses: dropped.get(index) ?? screened };
  });
}

