import { describe, expect, it } from 'vitest';
import { evaluateDesign, overlappingOrders } from '@/features/solver';
import { makeDesign } from './fixtures';

describe('order overlap', () => {
  it('lists every other order n with mλ/n inside the source range', () => {
    // Palmer & Loewen, ch. 2: orders overlap where nλ' = mλ. 600 nm, first order, source 200–1100 nm.
    expect(overlappingOrders(1, 600, 200, 1100)).toEqual([
      { order: 2, wavelengthNm: 300 },
      { order: 3, wavelengthNm: 200 },
    ]);
  });

  it('includes longer wavelengths from lower orders when working in a high order', () => {
    // Order 2 at 400 nm shares its angle with 800 nm in first order.
    expect(overlappingOrders(2, 400, 350, 900)).toEqual([{ order: 1, wavelengthNm: 800 }]);
  });

  it('keeps the sign of a negative working order', () => {
    expect(overlappingOrders(-1, 600, 250, 700)).toEqual([{ order: -2, wavelengthNm: 300 }]);
  });

  it('finds nothing when the range stays within one octave of the source (common practice: < 2×)', () => {
    expect(overlappingOrders(1, 700, 400, 790)).toEqual([]);
  });

  it('warns with the fix when the source feeds other orders into the range', () => {
    const evaluation = evaluateDesign(makeDesign(), { points: 11 });
    const warning = evaluation.warnings.find((w) => w.code === 'order-overlap');
    expect(warning?.message).toMatch(/order-sorting filter/);
    expect(warning?.message).toMatch(/2nd order \d+ nm lands on/);
  });

  it('uses the design range as the light when no source is given', () => {
    const design = makeDesign({ source: undefined, range: { startNm: 300, endNm: 900 } });
    const p = evaluateDesign(design, { wavelengthsNm: [800] }).points[0]!;
    expect(p.overlaps).toEqual([{ order: 2, wavelengthNm: 400 }]);
  });
});
