import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import {
  blockedUpToAtSettingNm,
  blockedUpToNm,
  filtersTransmission,
  transmissionAtSetting,
  evaluateDesign,
  filterChangesNm,
  filtersInBeam,
  longPassTransmission,
  proposeOrderSortingPlan,
  unblockedOverlapCount,
} from '@/features/solver';
import { designSchema, type Design } from '@/shared/design';
import { orderSortingFilterSchema, type OrderSortingFilter } from '@/shared/filters';
import { makeDesign } from './fixtures';

const longPass = (cutOnNm: number, inFromNm: number, inToNm: number, edgeWidthNm = 10): OrderSortingFilter => ({
  kind: 'long-pass',
  cutOnNm,
  inFromNm,
  inToNm,
  edgeWidthNm,
});

/** Orders n ≠ |m| whose |m|λ/n lies in the source and above `blockedNm`, counted one by one. */
function bruteUnblocked(order: number, nm: number, min: number, max: number, blockedNm: number): number {
  const m = Math.abs(order);
  let count = 0;
  for (let n = 1; n <= Math.floor((m * nm) / min) + 1; n++) {
    const other = (m * nm) / n;
    if (n !== m && other >= min && other <= max && other > blockedNm) count++;
  }
  return count;
}

const withFilters = (design: Design, filters: OrderSortingFilter[]): Design => ({ ...design, filters });
const overlapWarning = (design: Design, points = 101) =>
  evaluateDesign(design, { points }).warnings.find((w) => w.code === 'order-overlap');

describe('a long-pass filter', () => {
  // The shared/filters.ts model: a straight ramp edgeWidthNm wide centred on the 50 % cut-on
  // (common practice quotes a long-pass by its 50 % point). Hand values for 400 nm, 10 nm edge:
  // 0 at ≤ 395, 0.5 at 400, 1 at ≥ 405.
  it.each([
    [390, 0],
    [395, 0],
    [397.5, 0.25],
    [400, 0.5],
    [405, 1],
    [900, 1],
  ] satisfies [number, number][])('passes %f nm as %f', (nm, expected) => {
    expect(longPassTransmission(longPass(400, 0, 1000), nm)).toBeCloseTo(expected, 12);
  });

  it('with no edge width blocks at and below the cut-on and passes above it', () => {
    const step = longPass(400, 0, 1000, 0);
    expect([longPassTransmission(step, 399.99), longPassTransmission(step, 400), longPassTransmission(step, 400.01)]).toEqual([
      0, 0, 1,
    ]);
  });

  it('is in the beam from inFromNm to inToNm, ends included', () => {
    const filters = [longPass(395, 400, 780), longPass(770, 780, 900)];
    expect(filtersInBeam(filters, 399)).toEqual([]);
    expect(filtersInBeam(filters, 400)).toEqual([filters[0]]);
    expect(filtersInBeam(filters, 780)).toEqual(filters);
    expect(filtersInBeam(filters, 800)).toEqual([filters[1]]);
    expect(blockedUpToNm(filters)).toBe(765);
    expect(blockedUpToNm([])).toBe(Number.NEGATIVE_INFINITY);
    expect(filterChangesNm(filters, 300, 900)).toEqual([400, 780]);
    for (const nm of [350, 400, 500, 780, 800, 900, 950]) {
      expect(blockedUpToAtSettingNm(filters, nm)).toBe(blockedUpToNm(filtersInBeam(filters, nm)));
      expect(transmissionAtSetting(filters, nm)).toBe(filtersTransmission(filtersInBeam(filters, nm), nm));
    }
  });
});

describe('counting the orders a filter leaves', () => {
  it('agrees with counting order by order (closed form against brute force)', () => {
    fc.assert(
      fc.property(
        fc.integer({ min: -4, max: 4 }).filter((m) => m !== 0),
        fc.double({ min: 50, max: 3000, noNaN: true }),
        fc.double({ min: 20, max: 800, noNaN: true }),
        fc.double({ min: 1.1, max: 20, noNaN: true }),
        fc.double({ min: -100, max: 3000, noNaN: true }),
        (m, nm, min, span, blocked) => {
          const max = min * span;
          expect(unblockedOverlapCount(m, nm, min, max, blocked)).toBe(bruteUnblocked(m, nm, min, max, blocked));
        },
      ),
      { numRuns: 500 },
    );
  });
});

describe('the proposed plan', () => {
  // The example design: 1200/mm in first order, 300–900 nm range, 200–1100 nm source. Order 2
  // brings λ/2 in from λ = 400 nm (Palmer & Loewen, Diffraction Grating Handbook, ch. 2).
  const example = makeDesign();

  it('switches a long-pass in where order 2 starts, and the next before the first one’s edge is reached', () => {
    // By hand with the plan's rules (features/solver/order-sorting.ts, common practice):
    // filter 1 in from 400 nm, edge 2.5 % × 400 = 10 nm, cut-on ⌊400 − 5⌋₅ = 395 nm, blocks ≤ 390 nm,
    //   so it holds while λ/2 ≤ 390: up to 780 nm;
    // filter 2 in from 780 nm, edge 19.5 nm, cut-on ⌊780 − 9.75⌋₅ = 770 nm, blocks ≤ 760.25 nm,
    //   holding up to 1520.5 nm, past the range end (900 nm).
    expect(proposeOrderSortingPlan(example)).toEqual([
      longPass(395, 400, 780, 10),
      longPass(770, 780, 900, 19.5),
    ]);
  });

  it('for a 200–1100 nm source on a 300–900 nm range leaves no unblocked overlap, and the warning goes', () => {
    const before = evaluateDesign(example);
    expect(before.orderSorting.unblockedOverlaps).toBeGreaterThan(0);
    expect(before.orderSorting.proposedUnblockedOverlaps).toBe(0);
    expect(overlapWarning(example)?.message).toMatch(/proposed order-sorting plan \(2 long-pass filters\)/);

    const filtered = withFilters(example, before.orderSorting.proposedFilters);
    expect(designSchema.safeParse(filtered).success).toBe(true);
    // Dense sweep: no sampled gap hides an overlap.
    const after = evaluateDesign(filtered, { points: 1000 });
    expect(after.orderSorting.unblockedOverlaps).toBe(0);
    expect(after.points.every((p) => p.unblockedOverlapCount === 0)).toBe(true);
    expect(after.points.filter((p) => p.overlapCount > 0).every((p) => p.overlaps.every((o) => o.blocked))).toBe(true);
    // Each filter passes the working wavelength in full while it is in the beam.
    expect(after.points.every((p) => p.filterTransmission === 1)).toBe(true);
    expect(after.warnings.map((w) => w.code)).not.toContain('order-overlap');
    expect(after.warnings.map((w) => w.code)).not.toContain('filter-attenuates');
    expect(after.orderSorting.filterChangesNm).toEqual([400, 780]);
  });

  it('with one filter removed brings the overlaps and the warning back', () => {
    const plan = proposeOrderSortingPlan(example);
    for (const dropped of plan.keys()) {
      const design = withFilters(example, plan.filter((_, i) => i !== dropped));
      const evaluation = evaluateDesign(design);
      expect(evaluation.orderSorting.unblockedOverlaps).toBeGreaterThan(0);
      expect(overlapWarning(design)?.message).toMatch(/no filter in the beam blocks it/);
    }
  });

  it('is empty for a range inside one octave of the source (common practice: < 2×)', () => {
    const design = makeDesign({ range: { startNm: 400, endNm: 700 }, source: { minNm: 380, maxNm: 750 } });
    const evaluation = evaluateDesign(design);
    expect(evaluation.orderSorting.proposedFilters).toEqual([]);
    expect(evaluation.orderSorting.unblockedOverlaps).toBe(0);
    expect(evaluation.warnings.map((w) => w.code)).not.toContain('order-overlap');
  });

  it('keeps a negative order’s overlaps blocked the same way', () => {
    const design = makeDesign({ grating: { order: -1 } });
    const filtered = withFilters(design, proposeOrderSortingPlan(design));
    expect(evaluateDesign(filtered, { points: 400 }).orderSorting.unblockedOverlaps).toBe(0);
  });

  it('in second order blocks the shorter orders but says a long-pass cannot block order 1', () => {
    // 600/mm in order 2 over 400–700 nm with a 250–1100 nm source: order 1 brings 2λ (800–1100 nm
    // for λ ≤ 550 nm), order 3 brings 2λ/3 (from λ = 375 nm). Palmer & Loewen, ch. 2.
    const design = makeDesign({
      grating: { grooveDensityPerMm: 600, order: 2 },
      range: { startNm: 400, endNm: 700 },
      source: { minNm: 250, maxNm: 1100 },
    });
    const plan = proposeOrderSortingPlan(design);
    const filtered = evaluateDesign(withFilters(design, plan));
    // Only order 1 is left, and only where 2λ ≤ 1100 nm.
    for (const p of filtered.points) {
      expect(p.unblockedOverlapCount).toBe(2 * p.wavelengthNm <= 1100 ? 1 : 0);
    }
    expect(filtered.orderSorting.proposedUnblockedOverlaps).toBeGreaterThan(0);
    expect(overlapWarning(design)?.message).toMatch(/short-pass or band-pass/);
  });

  it('warns when a filter in the beam cuts into the working wavelength', () => {
    // A 500 nm cut-on switched in at 400 nm passes nothing at 400–495 nm.
    const design = withFilters(example, [longPass(500, 400, 900)]);
    const warning = evaluateDesign(design).warnings.find((w) => w.code === 'filter-attenuates');
    expect(warning?.message).toMatch(/down to 0 % passed/);
    expect(warning?.wavelengthNm).toBe(402);
  });

  it('always proposes filters a design may store, each passing its own settings in full', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 150, max: 3000, noNaN: true }),
        fc.double({ min: 1.2, max: 8, noNaN: true }),
        fc.double({ min: 0.3, max: 1, noNaN: true }),
        fc.double({ min: 1.05, max: 10, noNaN: true }),
        (startNm, spanRatio, sourceLow, sourceSpan) => {
          const range = { startNm, endNm: startNm * spanRatio };
          const source = { minNm: startNm * sourceLow, maxNm: startNm * sourceLow * sourceSpan };
          // A coarse grating keeps every range reachable in first order.
          const design = makeDesign({ grating: { grooveDensityPerMm: 50, blazeWavelengthNm: 1000, ruledWidthMm: 50 }, range, source });
          const plan = proposeOrderSortingPlan(design);
          for (const filter of plan) {
            expect(orderSortingFilterSchema.safeParse(filter).success).toBe(true);
            expect(longPassTransmission(filter, filter.inFromNm)).toBe(1);
          }
          if (plan.length > 0 && plan.length < 12) {
            const evaluation = evaluateDesign(withFilters(design, plan), { points: 300 });
            expect(evaluation.orderSorting.unblockedOverlaps).toBe(0);
          }
        },
      ),
      { numRuns: 200 },
    );
  });
});
