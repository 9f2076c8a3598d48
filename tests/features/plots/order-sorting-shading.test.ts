import { describe, expect, it } from 'vitest';
import { filterChangeMarks, marksSummary, overlapSummary } from '../../../features/plots/filter-marks';
import { performanceSeries } from '../../../features/plots/series';
import { evaluateDesign } from '../../../features/solver/index';
import { exampleDesign, type Design } from '../../../shared/design';
import type { OrderSortingFilter } from '../../../shared/filters';

/**
 * The efficiency plot shades only overlaps no filter blocks. The example design's source spans
 * 200–1100 nm and its range 300–900 nm in first order: the second order brings in λ/2, which is
 * source light from λ = 400 nm on (2 × 200; the grating equation, Palmer & Loewen ch. 2). A
 * long-pass with its edge foot at 390 nm (cut-on 395 nm, 10 nm edge) in the beam from 400 nm
 * removes λ/2 ≤ 390 nm, i.e. up to λ = 780 nm; a second with its foot at 760 nm covers the rest,
 * since λ/2 ≤ 450 nm at 900 nm. Hand-worked, not read from the solver's plan.
 */
const twoFilters: OrderSortingFilter[] = [
  { kind: 'long-pass', cutOnNm: 395, inFromNm: 400, inToNm: 780, edgeWidthNm: 10 },
  { kind: 'long-pass', cutOnNm: 770, inFromNm: 780, inToNm: 900, edgeWidthNm: 20 },
];
const filtered: Design = { ...structuredClone(exampleDesign), filters: twoFilters };

describe('the overlap shading and the scan curve’s filter marks', () => {
  it('shades from where the second order first brings in source light, about 400 nm, without filters', () => {
    const data = performanceSeries(evaluateDesign(exampleDesign, { points: 200 }).points);
    expect(data.anyOverlap).toBe(true);
    const first = data.overlapIntervals[0]!;
    // Samples are 3 nm apart; the shading's edge sits half-way between samples.
    expect(Math.abs(first.startNm - 400)).toBeLessThan(3.1);
    expect(data.overlapIntervals[data.overlapIntervals.length - 1]!.endNm).toBe(900);
  });

  it('shades nothing once two long-pass filters block the second order across the range', () => {
    const data = performanceSeries(evaluateDesign(filtered, { points: 200 }).points);
    expect(data.overlapIntervals).toEqual([]);
    expect(data.anyOverlap).toBe(true);
    expect(overlapSummary(data.overlapIntervals, data.anyOverlap)).toMatch(/no overlapping order is left unblocked/);
  });

  it('shades again past 780 nm when the second filter is removed', () => {
    const one: Design = { ...filtered, filters: [twoFilters[0]!] };
    const data = performanceSeries(evaluateDesign(one, { points: 200 }).points);
    expect(data.overlapIntervals.length).toBe(1);
    expect(Math.abs(data.overlapIntervals[0]!.startNm - 780)).toBeLessThan(3.1);
    expect(overlapSummary(data.overlapIntervals, true)).toMatch(/^shaded where other orders reach the exit slit unblocked: 78\d(\.\d)?–900\u00A0nm$/);
  });

  it('labels each filter change with the filter going in, counting from 1', () => {
    const marks = filterChangeMarks([400, 780], twoFilters);
    expect(marks).toEqual([
      { nm: 400, label: 'filter 1 in' },
      { nm: 780, label: 'filter 2 in' },
    ]);
    expect(filterChangeMarks([780], [twoFilters[0]!])).toEqual([{ nm: 780, label: 'filter 1 out' }]);
    expect(marksSummary(marks)).toBe('filter 1 in at 400\u00A0nm, filter 2 in at 780\u00A0nm');
  });
});
