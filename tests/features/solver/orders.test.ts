import * as fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import {
  evaluateDesign,
  evaluatePoint,
  MAX_LISTED_OVERLAPS,
  overlapCount,
  overlappingOrders,
  prepareDesign,
} from '@/features/solver';
import { makeDesign } from './fixtures';

/** Every overlapping order by trying each n in turn: the slow, obvious reading of the definition. */
function allOverlapsByTrial(
  order: number,
  wavelengthNm: number,
  minNm: number,
  maxNm: number,
  upToOrder: number,
) {
  const absOrder = Math.abs(order);
  const sign = Math.sign(order);
  const found: { order: number; wavelengthNm: number; blocked: boolean }[] = [];
  for (let n = 1; n <= upToOrder; n++) {
    const other = (absOrder * wavelengthNm) / n;
    if (n !== absOrder && other >= minNm && other <= maxNm)
      found.push({ order: sign * n, wavelengthNm: other, blocked: false });
  }
  return found;
}

/** `{ order, wavelengthNm }` for the orders from `from` to `to` (skipping `skip`), `mλ/n` each. */
function run(sign: number, product: number, from: number, to: number, skip?: number) {
  const list: { order: number; wavelengthNm: number; blocked: boolean }[] = [];
  for (let n = from; n <= to; n++) if (n !== skip) list.push({ order: sign * n, wavelengthNm: product / n, blocked: false });
  return list;
}

describe('order overlap', () => {
  it('lists every other order n with mλ/n inside the source range', () => {
    // Palmer & Loewen, ch. 2: orders overlap where nλ' = mλ. 600 nm, first order, source 200–1100 nm.
    expect(overlappingOrders(1, 600, 200, 1100)).toEqual([
      { order: 2, wavelengthNm: 300, blocked: false },
      { order: 3, wavelengthNm: 200, blocked: false },
    ]);
  });

  it('includes longer wavelengths from lower orders when working in a high order', () => {
    // Order 2 at 400 nm shares its angle with 800 nm in first order.
    expect(overlappingOrders(2, 400, 350, 900)).toEqual([{ order: 1, wavelengthNm: 800, blocked: false }]);
  });

  it('keeps the sign of a negative working order', () => {
    expect(overlappingOrders(-1, 600, 250, 700)).toEqual([{ order: -2, wavelengthNm: 300, blocked: false }]);
  });

  it('finds nothing when the range stays within one octave of the source (common practice: < 2×)', () => {
    expect(overlappingOrders(1, 700, 400, 790)).toEqual([]);
  });

  it('warns with the fix when the source feeds other orders into the range', () => {
    const evaluation = evaluateDesign(makeDesign(), { points: 11 });
    const warning = evaluation.warnings.find((w) => w.code === 'order-overlap');
    expect(warning?.message).toMatch(/proposed order-sorting plan/);
    expect(warning?.message).toMatch(/2nd order \d+ nm lands on/);
  });

  it('uses the design range as the light when no source is given', () => {
    const design = makeDesign({ source: undefined, range: { startNm: 300, endNm: 900 } });
    const p = evaluateDesign(design, { wavelengthsNm: [800] }).points[0]!;
    expect(p.overlaps).toEqual([{ order: 2, wavelengthNm: 400, blocked: false }]);
  });
});

describe('a long list of overlapping orders', { timeout: 30_000 }, () => {
  it('is cut to the 20 orders nearest the working order, in increasing |n|, with the full count', () => {
    // Order 1000 at 1 nm with a source from 2^-5 to 2^13 nm (exact in binary, so the ends are
    // exact): n runs from ceil(1000/8192) = 1 to 1000 × 32 = 32000, less the working order.
    expect(overlapCount(1000, 1, 0.03125, 8192)).toBe(31_999);
    expect(overlappingOrders(1000, 1, 0.03125, 8192)).toEqual(run(1, 1000, 990, 1010, 1000));
    expect(MAX_LISTED_OVERLAPS).toBe(20);
  });

  it.each([
    // Only lower orders land: the nearest are the top of that run.
    {
      name: 'all below the working order',
      order: 1000,
      wavelengthNm: 1,
      minNm: 20,
      maxNm: 1000,
      count: 50,
      listed: [31, 50],
    },
    // The working wavelength lies outside the source: the orders nearest 1 are the lowest.
    {
      name: 'all above, the working wavelength unlit',
      order: 1,
      wavelengthNm: 100,
      minNm: 0.5,
      maxNm: 10,
      count: 191,
      listed: [10, 29],
    },
    // Four below (1–4), so the other 16 come from above (6–21).
    {
      name: 'few below',
      order: 5,
      wavelengthNm: 100,
      minNm: 0.125,
      maxNm: 1000,
      count: 3999,
      listed: [1, 21],
    },
  ] satisfies readonly {
    name: string;
    order: number;
    wavelengthNm: number;
    minNm: number;
    maxNm: number;
    count: number;
    listed: [number, number];
  }[])(
    'takes the rest from the other side when one side runs short: $name',
    ({ order, wavelengthNm, minNm, maxNm, count, listed }) => {
      expect(overlapCount(order, wavelengthNm, minNm, maxNm)).toBe(count);
      const list = overlappingOrders(order, wavelengthNm, minNm, maxNm);
      expect(list).toEqual(run(1, order * wavelengthNm, listed[0], listed[1], order));
      expect(list).toHaveLength(MAX_LISTED_OVERLAPS);
    },
  );

  it('keeps the sign of a negative working order when cut', () => {
    expect(overlapCount(-1000, 1, 0.03125, 8192)).toBe(31_999);
    expect(overlappingOrders(-1000, 1, 0.03125, 8192)).toEqual(run(-1, 1000, 990, 1010, 1000));
  });

  it('counts a source from 0.001 nm to 10 mm at order 1000 without listing a million orders', () => {
    // n from 1 to floor(1000 × 1 / 0.001) = 1e6, less the working order.
    expect(overlapCount(1000, 1, 0.001, 1e7)).toBe(999_999);
    expect(overlappingOrders(1000, 1, 0.001, 1e7)).toHaveLength(MAX_LISTED_OVERLAPS);
  });

  it('marks a point whose list was cut, and gives the full count', () => {
    const design = makeDesign({ grating: { order: 1000 }, source: { minNm: 0.001, maxNm: 1e7 } });
    const p = evaluateDesign(design, { wavelengthsNm: [1] }).points[0]!;
    expect(p.reachable).toBe(true);
    expect(p.overlapCount).toBe(999_999);
    expect(p.overlapsTruncated).toBe(true);
    expect(p.overlaps).toEqual(run(1, 1000, 990, 1010, 1000));
  });

  it('does not mark a complete list, and counts it exactly', () => {
    // 600 nm in first order with a 200–1100 nm source: orders 2 and 3 (as above).
    const p = evaluateDesign(makeDesign(), { wavelengthsNm: [600] }).points[0]!;
    expect(p.overlaps).toHaveLength(2);
    expect(p.overlapCount).toBe(2);
    expect(p.overlapsTruncated).toBe(false);
  });

  it('gives an unreachable wavelength no overlaps and a count of 0', () => {
    const p = evaluateDesign(makeDesign(), { wavelengthsNm: [2000] }).points[0]!;
    expect(p).toMatchObject({ reachable: false, overlaps: [], overlapCount: 0, overlapsTruncated: false });
  });

  it('agrees with trying every order, and evaluatePoint reports the same (fast-check)', () => {
    const plan = prepareDesign(makeDesign({ grating: { grooveDensityPerMm: 1 } }));
    fc.assert(
      fc.property(
        fc.integer({ min: -40, max: 40 }).filter((m) => m !== 0),
        fc.double({ min: 1, max: 2000, noNaN: true }),
        fc.double({ min: 2, max: 3000, noNaN: true }),
        fc.double({ min: 1.001, max: 1000, noNaN: true }),
        (order, wavelengthNm, minNm, ratio) => {
          const maxNm = minNm * ratio;
          const all = allOverlapsByTrial(
            order,
            wavelengthNm,
            minNm,
            maxNm,
            Math.ceil((Math.abs(order) * wavelengthNm) / minNm) + 1,
          );
          const listed = overlappingOrders(order, wavelengthNm, minNm, maxNm);
          expect(overlapCount(order, wavelengthNm, minNm, maxNm)).toBe(all.length);
          expect(listed).toHaveLength(Math.min(all.length, MAX_LISTED_OVERLAPS));
          // The listed orders are a run of the full list, nearest the working order.
          const distance = (o: { order: number }) => Math.abs(Math.abs(o.order) - Math.abs(order));
          const farthestListed = Math.max(0, ...listed.map(distance));
          const unlisted = all.filter((o) => !listed.some((l) => l.order === o.order));
          expect(unlisted.every((o) => distance(o) >= farthestListed)).toBe(true);
          expect(
            listed.every((l) => all.some((o) => o.order === l.order && o.wavelengthNm === l.wavelengthNm)),
          ).toBe(true);
          // evaluatePoint against the same source and order.
          const point = evaluatePoint(
            { ...plan, order, overlapMinNm: minNm, overlapMaxNm: maxNm },
            wavelengthNm,
          );
          if (point.reachable) {
            expect(point.overlapCount).toBe(all.length);
            expect(point.overlaps).toEqual(listed);
            expect(point.overlapsTruncated).toBe(all.length > MAX_LISTED_OVERLAPS);
          }
        },
      ),
      { numRuns: 500 },
    );
  });
});
