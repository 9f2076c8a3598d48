import { describe, expect, it } from 'vitest';
import { checkRequirements, designFootprintMm } from '@/features/requirements';
import {
  CHECKED_POINTS,
  EXCLUSION_KEYS,
  allocateColumns,
  allocateScratch,
  candidateDesign,
  candidateParams,
  columnarPlan,
  enumerateCandidates,
  evaluateCandidates,
  failsOn,
  searchSpace,
} from '@/features/search';
import { evaluateDesign } from '@/features/solver';
import { searchRequestSchema, type SearchRequest } from '@/shared/search';

function screen(request: SearchRequest) {
  const space = searchSpace(request);
  const table = enumerateCandidates(space);
  const plan = columnarPlan(request, space);
  const columns = allocateColumns(table.count);
  const footprint = (i: number, w: number, cam: number) =>
    designFootprintMm(candidateDesign(request, space, candidateParams(table, i), w, cam));
  evaluateCandidates(plan, table, columns, allocateScratch(plan.wavelengthsNm.length), 0, table.count, footprint);
  const design = (i: number) =>
    candidateDesign(request, space, candidateParams(table, i), columns.slitWidthUm[i]!, columns.cameraOffAxisDeg[i]!);
  return { table, plan, columns, design };
}

const brief = searchRequestSchema.parse({
  range: { startNm: 400, endNm: 750 },
  // Below twice the range start: no second-order light lands on first-order wavelengths.
  source: { minNm: 380, maxNm: 780 },
  detector: { pixelPitchUm: 13.5, pixelCount: 1024 },
  requirements: {
    maxBandpassNm: 0.8,
    minResolvingPower: 800,
    minBlazeEfficiency: 0.3,
    maxFNumber: 9,
    maxFocalLengthMm: 400,
    maxFootprintMm: { widthMm: 420, depthMm: 450 },
    minPixelsPerBandpass: 3,
    maxWavelengthErrorNm: 0.03,
    driveStepArcsec: 1,
    maxReciprocalDispersionNmPerMm: 6,
    orderOverlap: 'forbidden',
  },
  search: {
    grooveDensitiesPerMm: [600, 1200, 2400],
    blazeWavelengthsNm: [300, 500],
    maxOrder: 2,
    deviationAnglesDeg: [10, 30],
    focalLengthsMm: [150, 250, 400, 600],
  },
});

describe('the columnar screen', () => {
  it('evaluates at 50 wavelengths over the range, ends included, then the named ones', () => {
    const { plan } = screen(brief);
    expect(plan.wavelengthsNm).toHaveLength(CHECKED_POINTS);
    expect(plan.wavelengthsNm[0]).toBe(400);
    expect(plan.wavelengthsNm[49]).toBe(750);
    const named = screen(searchRequestSchema.parse({ ...brief, requirements: { ...brief.requirements, atWavelengthsNm: [700, 404.7] } }));
    expect(Array.from(named.plan.wavelengthsNm.slice(CHECKED_POINTS))).toEqual([404.7, 700]);
  });

  it('judges each requirement of each candidate as the ordinary requirement check does', () => {
    const { table, columns, design } = screen(brief);
    let passing = 0;
    let compared = 0;
    for (let i = 0; i < table.count; i++) {
      if (failsOn(columns, i, 'range')) continue;
      const report = checkRequirements(design(i));
      for (const check of report.checks) {
        expect(failsOn(columns, i, check.id), `candidate ${i} ${check.id}: ${check.message}`).toBe(check.status === 'fail');
        compared++;
      }
      if (report.failed === 0) passing++;
    }
    // The case is not vacuous: many checks, some candidates pass and some fail.
    expect(compared).toBeGreaterThan(1000);
    expect(passing).toBeGreaterThan(0);
    expect(passing).toBeLessThan(table.count);
  });

  it('agrees with the solver’s own figures for a candidate', () => {
    const { table, columns, design } = screen(brief);
    const i = Array.from({ length: table.count }, (_, k) => k).find((k) => !failsOn(columns, k, 'range'))!;
    const evaluation = evaluateDesign(design(i), { points: CHECKED_POINTS });
    const max = (f: (p: (typeof evaluation.points)[number]) => number | null) => Math.max(...evaluation.points.map((p) => f(p) ?? -Infinity));
    const min = (f: (p: (typeof evaluation.points)[number]) => number | null) => Math.min(...evaluation.points.map((p) => f(p) ?? Infinity));
    expect(columns.worstBandpassNm[i]).toBeCloseTo(max((p) => p.bandpassNm), 12);
    expect(columns.worstResolvingPower[i]).toBeCloseTo(min((p) => p.resolvingPower), 8);
    expect(columns.minBlazeEfficiency[i]).toBeCloseTo(min((p) => p.blazeEfficiency), 12);
    expect(columns.overlappedWavelengths[i]).toBe(evaluation.points.filter((p) => p.overlapCount > 0).length);
  });

  it('names a candidate that cannot reach its range under range alone, with how far it falls short', () => {
    // 2400/mm in order 2: 2d cos²K / |m| is at most 416.7 nm, short of 750 nm.
    const { table, columns } = screen(brief);
    const i = Array.from({ length: table.count }, (_, k) => k).find(
      (k) => table.grooveDensityPerMm[k] === 2400 && table.order[k] === 2 && table.deviationAngleDeg[k] === 10,
    )!;
    expect(failsOn(columns, i, 'range')).toBe(true);
    // K = 5°: reach = 2 × 416.67 × cos²5° / 2 = 413.50 nm; margin (413.50 − 750) / 750 = −0.4487.
    expect(columns.margins.range[i]).toBeCloseTo(-0.4487, 3);
    expect(EXCLUSION_KEYS.filter((key) => failsOn(columns, i, key))).toEqual(['range']);
  });
});
