import { expect } from 'vitest';

/**
 * Float comparison with a relative tolerance (and an optional absolute floor for values near 0).
 * Fails loudly on null, NaN and Infinity, which the solver must never produce where a number is due.
 */
export function expectClose(
  actual: number | null | undefined,
  expected: number,
  relative = 1e-9,
  absolute = 0,
): void {
  expect(actual, 'a finite number').toBeTypeOf('number');
  expect(Number.isFinite(actual), `finite (got ${actual})`).toBe(true);
  const tolerance = Math.max(absolute, relative * Math.abs(expected));
  const diff = Math.abs((actual as number) - expected);
  expect(diff, `|${actual} − ${expected}| ≤ ${tolerance}`).toBeLessThanOrEqual(tolerance);
}

export const deg = (d: number) => (d * Math.PI) / 180;
export const toDeg = (r: number) => (r * 180) / Math.PI;
