import { describe, expect, it } from 'vitest';
import { checkRequirements } from '@/features/requirements';
import {
  DEFAULT_WEIGHTS,
  MIN_SLIT_WIDTH_UM,
  SearchRequestError,
  explainAnswer,
  mostExcluding,
  planSearch,
  runSearch,
  searchRequestIssues,
} from '@/features/search';
import { designSchema } from '@/shared/design';
import { SEARCH_LIMITS, searchAnswerSchema, searchRequestSchema, type SearchRequest } from '@/shared/search';

const parse = (input: unknown): SearchRequest => searchRequestSchema.parse(input);

/** A visible-range monochromator brief: half a nanometre, a good blaze, a bench-sized instrument. */
const visible = parse({
  range: { startNm: 400, endNm: 700 },
  source: { minNm: 380, maxNm: 780 },
  detector: { pixelPitchUm: 14, pixelCount: 2048 },
  requirements: {
    maxBandpassNm: 0.5,
    minBlazeEfficiency: 0.4,
    maxFocalLengthMm: 500,
    maxFNumber: 12,
    minPixelsPerBandpass: 2,
    maxWavelengthErrorNm: 0.05,
    driveStepArcsec: 2,
    orderOverlap: 'forbidden',
  },
  search: {
    grooveDensitiesPerMm: [600, 1200, 1800],
    blazeWavelengthsNm: [300, 500, 750],
    maxOrder: 2,
    deviationAnglesDeg: [20, 30],
    focalLengthsMm: [150, 300, 500, 750],
  },
});

describe('runSearch', () => {
  const answer = runSearch(visible);

  it('answers in the shared answer shape, with candidates that pass and the weights it used', () => {
    expect(searchAnswerSchema.safeParse(answer).success).toBe(true);
    expect(answer.candidates.length).toBeGreaterThan(0);
    expect(answer.candidates.length).toBeLessThanOrEqual(SEARCH_LIMITS.maxTop);
    expect(answer.nearest).toEqual([]);
    expect(answer.weights).toEqual(DEFAULT_WEIGHTS);
    // 3 densities × 3 blazes × 4 orders × 2 deviations × 4 focal lengths, every blaze below 2d
    // (2d = 1111 nm at 1800/mm): 288.
    expect(answer.considered).toBe(288);
  });

  it('returns only candidates that pass every requirement when the ordinary check re-evaluates them', () => {
    for (const candidate of answer.candidates) {
      const design = designSchema.parse(candidate.design);
      const report = checkRequirements(design);
      expect(report.failed, JSON.stringify(report.checks.filter((c) => c.status !== 'pass'))).toBe(0);
      expect(report.unknown).toBe(0);
      expect(report.passed).toBe(report.checks.length);
      expect(report.checks.map((c) => c.id)).toEqual(expect.arrayContaining(['maxBandpassNm', 'orderOverlap']));
    }
  });

  it('copies the range, source, detector and requirements into every design, a Czerny–Turner with equal focal lengths', () => {
    for (const { design, figures } of answer.candidates) {
      expect(design.range).toEqual(visible.range);
      expect(design.source).toEqual(visible.source);
      expect(design.detector).toEqual(visible.detector);
      expect(design.requirements).toEqual(visible.requirements);
      expect(design.layout.kind).toBe('czerny-turner');
      expect(design.layout.cameraFocalMm).toBe(design.layout.collimatorFocalMm);
      expect(design.slits.entranceWidthUm).toBe(design.slits.exitWidthUm);
      expect(figures.focalLengthMm).toBeLessThanOrEqual(500);
      expect(figures.worstBandpassNm).toBeLessThanOrEqual(0.5);
    }
  });

  it('ranks by score, highest first', () => {
    const scores = answer.candidates.map((c) => c.score);
    expect(scores).toEqual([...scores].sort((a, b) => b - a));
    for (const score of scores) {
      expect(score).toBeGreaterThanOrEqual(0);
      expect(score).toBeLessThanOrEqual(1);
    }
  });

  it('gives the same answer for the same input', () => {
    expect(JSON.stringify(runSearch(visible))).toBe(JSON.stringify(answer));
    // The order a list is written in does not matter either.
    const shuffled = parse({ ...visible, search: { ...visible.search, focalLengthsMm: [750, 150, 500, 300] } });
    expect(JSON.stringify(runSearch(shuffled))).toBe(JSON.stringify(answer));
  });

  it('changes the order when the weights change', () => {
    const only = (part: keyof typeof DEFAULT_WEIGHTS) =>
      runSearch(parse({ ...visible, search: { ...visible.search, weights: { margin: 0, efficiency: 0, size: 0, overlap: 0, [part]: 1 } } }));
    const bySize = only('size');
    const byEfficiency = only('efficiency');
    expect(bySize.candidates.map((c) => c.figures)).not.toEqual(byEfficiency.candidates.map((c) => c.figures));
    // Size alone: the shortest focal length first. Efficiency alone: the best worst-case blaze first.
    const focal = bySize.candidates.map((c) => c.figures.focalLengthMm);
    expect(focal[0]).toBe(Math.min(...focal));
    const efficiency = byEfficiency.candidates.map((c) => c.figures.minBlazeEfficiency ?? 0);
    expect(efficiency[0]).toBe(Math.max(...efficiency));
    expect(bySize.weights).toEqual({ margin: 0, efficiency: 0, size: 1, overlap: 0 });
  });
});

describe('slit widths', () => {
  it('solves the widest equal slits for the bandpass at the named wavelength', () => {
    // 1200 g/mm (d = 833.33 nm), 2K = 20°, f = 300 mm, λ = 546.1 nm, bandpass ≤ 0.5 nm.
    // Grating equation (Palmer & Loewen, ch. 2): sin φ = mλ / (2d cos K) = 546.1 / 1641.35 = 0.33272,
    // φ = 19.434°, α = 29.434°, β = 9.434°; cos α = 0.87093, cos β = 0.98648.
    // Order +1: RLD = d cos β / f = 2.74021 nm/mm; entrance image 0.883 × w, so the exit slit sets
    // the bandpass (ch. 9): w = 0.5 / 2.74021 mm = 182.47 µm, rounded down to 182.4 µm.
    // Order −1 swaps α and β: RLD = d cos α / f = 2.41924 nm/mm but the image is 1.1327 × w, and
    // 2.41924 × 1.1327 = 2.74021 again, so the same width.
    const answer = runSearch(
      parse({
        range: { startNm: 500, endNm: 600 },
        requirements: { maxBandpassNm: 0.5, atWavelengthsNm: [546.1] },
        search: { grooveDensitiesPerMm: [1200], blazeWavelengthsNm: [500], maxOrder: 1, deviationAnglesDeg: [20], focalLengthsMm: [300] },
      }),
    );
    expect(answer.candidates.map((c) => c.figures.order).sort()).toEqual([-1, 1]);
    for (const { figures, design } of answer.candidates) {
      expect(figures.slitWidthUm).toBeCloseTo(182.4, 9);
      expect(design.slits.exitWidthUm).toBeCloseTo(182.4, 9);
      expect(figures.worstBandpassNm).toBeCloseTo(0.5 * (182.4 / 182.4677), 4);
    }
  });

  it('solves the widest equal slits for the resolving power, the diffraction limit taken in quadrature', () => {
    // Same mount and wavelength as above, R ≥ 2000 with N = 1200 × 50 = 60,000 grooves.
    // R = λ / √(bp² + (λ/|m|N)²) (resolving-power.ts, common practice), so bp ≤ √((λ/R)² − (λ/N)²)
    // = √(0.27305² − 0.0091017²) = 0.272898 nm, and w = 0.272898 / 2.74021 mm = 99.59 µm → 99.5 µm.
    const answer = runSearch(
      parse({
        range: { startNm: 500, endNm: 600 },
        requirements: { minResolvingPower: 2000, atWavelengthsNm: [546.1] },
        search: { grooveDensitiesPerMm: [1200], blazeWavelengthsNm: [500], maxOrder: 1, deviationAnglesDeg: [20], focalLengthsMm: [300] },
      }),
    );
    expect(answer.candidates).toHaveLength(2);
    for (const { figures } of answer.candidates) {
      expect(figures.slitWidthUm).toBeCloseTo(99.5, 9);
      expect(figures.worstResolvingPower).toBeGreaterThanOrEqual(2000);
      expect(figures.worstResolvingPower).toBeLessThan(2000 * 1.002);
    }
  });

  it('uses 50 µm without a bandpass or resolving-power requirement', () => {
    const answer = runSearch(
      parse({
        range: { startNm: 500, endNm: 600 },
        requirements: { maxFocalLengthMm: 300 },
        search: { grooveDensitiesPerMm: [1200], blazeWavelengthsNm: [500], maxOrder: 1, deviationAnglesDeg: [20], focalLengthsMm: [300] },
      }),
    );
    expect(answer.candidates.map((c) => c.design.slits.exitWidthUm)).toEqual([50, 50]);
  });
});

describe('when nothing passes', () => {
  // 0.0001 nm needs slits far below the narrowest real slit (5 µm) at 100 mm or less.
  const impossible = parse({
    range: { startNm: 400, endNm: 700 },
    requirements: { maxBandpassNm: 0.0001, maxFocalLengthMm: 100 },
    search: { focalLengthsMm: [50, 75, 100] },
  });
  const answer = runSearch(impossible);

  it('returns no candidates, names the requirement that excluded the most, and the nearest misses', () => {
    expect(answer.candidates).toEqual([]);
    expect(answer.considered).toBeGreaterThan(0);
    expect(answer.excludedBy.maxFocalLengthMm).toBe(0);
    // Every candidate that reaches its range is excluded by the bandpass.
    expect(answer.excludedBy.maxBandpassNm).toBe(answer.considered - (answer.excludedBy.range ?? 0));
    expect(mostExcluding(answer.excludedBy)?.key).toBe('maxBandpassNm');
    expect(answer.nearest).toHaveLength(3);
    for (const miss of answer.nearest) {
      expect(miss.misses.maxBandpassNm).toBeLessThan(0);
      expect(miss.design.slits.exitWidthUm).toBe(MIN_SLIT_WIDTH_UM);
      expect(designSchema.safeParse(miss.design).success).toBe(true);
    }
    // Least negative worst margin first.
    const worst = answer.nearest.map((m) => Math.min(...Object.values(m.misses)));
    expect(worst).toEqual([...worst].sort((a, b) => b - a));
    expect(explainAnswer(answer)).toMatch(/^No candidate meets every requirement\. "Bandpass at most" excluded the most/);
  });
});

describe('planSearch', () => {
  it('evaluates in steps, and finishing early ranks what is done', () => {
    const run = planSearch(visible);
    expect(run.total).toBe(288);
    expect(run.step(100)).toBe(100);
    expect(run.finish().considered).toBe(100);
    expect(run.step(1000)).toBe(288);
    expect(run.step(10)).toBe(288);
    expect(run.finish()).toEqual(runSearch(visible));
  });

  it('refuses more candidates than the cap, naming search, before any work', () => {
    const many = Array.from({ length: 40 }, (_, i) => 100 + i * 10);
    const request = parse({
      range: { startNm: 400, endNm: 700 },
      requirements: { maxBandpassNm: 1 },
      search: { focalLengthsMm: many, deviationAnglesDeg: Array.from({ length: 40 }, (_, i) => i) },
    });
    // 8 × 10 × 6 × 40 × 40 = 768,000 > 50,000.
    expect(searchRequestIssues(request).search).toMatch(/^would evaluate 768000 candidates .*at most 50000/);
    expect(() => planSearch(request)).toThrow(SearchRequestError);
  });

  it('refuses a searched value that makes no design, and a detector requirement without a detector', () => {
    const issues = searchRequestIssues(
      parse({
        range: { startNm: 400, endNm: 700 },
        requirements: { minPixelsPerBandpass: 2 },
        // f/0.5 over a 50 mm grating is 25 mm (the sine condition, shared/design.ts).
        search: { focalLengthsMm: [20, 100], blazeWavelengthsNm: [5000], grooveDensitiesPerMm: [1200] },
      }),
    );
    expect(issues['search.focalLengthsMm']).toMatch(/20 mm .*use at least 25 mm/);
    // 2d at 1200/mm is 1666.7 nm: no facet blazes at 5000 nm.
    expect(issues['search.blazeWavelengthsNm']).toMatch(/no blaze wavelength below twice the groove spacing/);
    expect(issues['requirements.minPixelsPerBandpass']).toMatch(/needs a detector/);
  });
});

describe('a search that allows filtered overlaps', () => {
  // 300–900 nm from a 200–1100 nm source: order 2 brings λ/2 in from 400 nm (Palmer & Loewen,
  // Diffraction Grating Handbook, ch. 2), so only a candidate with order-sorting filters can pass.
  const filtered = parse({
    range: { startNm: 300, endNm: 900 },
    source: { minNm: 200, maxNm: 1100 },
    requirements: { maxBandpassNm: 1, orderOverlap: 'filtered' },
    search: { grooveDensitiesPerMm: [300, 600, 1200], blazeWavelengthsNm: [500], maxOrder: 1, deviationAnglesDeg: [30], focalLengthsMm: [300] },
  });

  it('gives each candidate its order-sorting plan, and the ordinary check passes it', () => {
    const answer = runSearch(filtered);
    expect(answer.candidates.length).toBeGreaterThan(0);
    for (const candidate of answer.candidates) {
      const design = designSchema.parse(candidate.design);
      expect(design.filters?.length).toBeGreaterThan(0);
      const overlap = checkRequirements(design).checks.find((c) => c.id === 'orderOverlap');
      expect(overlap?.status).toBe('pass');
      // Without the plan the same candidate fails: the filters are what make it pass.
      const bare = { ...design };
      delete bare.filters;
      expect(checkRequirements(bare).checks.find((c) => c.id === 'orderOverlap')?.status).toBe('fail');
    }
  });
});
