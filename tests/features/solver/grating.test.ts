import { describe, expect, it } from 'vitest';
import {
  reachableMaxNm,
  solveGrating,
  unreachableReason,
} from '@/features/solver';
import { deg, expectClose, toDeg } from './close-to';
import { spacing } from './fixtures';

describe('grating equation in constant-deviation form', () => {
  // Palmer & Loewen, Diffraction Grating Handbook, ch. 2: mλ = d(sin α + sin β) = 2d cos K sin φ.
  // Expected angles are worked by hand from that equation (sin φ is a round number in each case).
  const cases = [
    // 1200 g/mm, Littrow, 500 nm: sin φ = 500 / (2 · 833.33) = 0.3.
    { name: 'Littrow, first order', grooves: 1200, order: 1, lambda: 500, deviationDeg: 0, sinPhi: 0.3 },
    // The same in order −1: the grating turns the other way.
    { name: 'Littrow, order −1', grooves: 1200, order: -1, lambda: 500, deviationDeg: 0, sinPhi: -0.3 },
    // Third order, 200 nm: sin φ = 600 / 1666.67 = 0.36.
    { name: 'Littrow, third order', grooves: 1200, order: 3, lambda: 200, deviationDeg: 0, sinPhi: 0.36 },
    // Echelle-like high order: 79 g/mm, order 40, 500 nm, 2K = 10°: sin φ = 40·500 / (2·12658.2·cos 5°).
    { name: 'order 40 on a coarse grating', grooves: 79, order: 40, lambda: 500, deviationDeg: 10, sinPhi: (40 * 500) / (2 * (1e6 / 79) * Math.cos(deg(5))) },
    // 2K = 60°, 600 nm, 1200 g/mm: sin φ = 600 / (1666.67 · cos 30°) = 0.41569.
    { name: 'wide deviation, 60°', grooves: 1200, order: 1, lambda: 600, deviationDeg: 60, sinPhi: 600 / (1666.6666666666667 * Math.cos(deg(30))) },
    { name: 'negative order with deviation', grooves: 600, order: -2, lambda: 400, deviationDeg: 24, sinPhi: (-2 * 400) / (2 * (1e6 / 600) * Math.cos(deg(12))) },
  ] satisfies readonly {
    name: string;
    grooves: number;
    order: number;
    lambda: number;
    deviationDeg: number;
    sinPhi: number;
  }[];

  it.each(cases)('$name: φ, α = φ + K and β = φ − K solve the equation', (c) => {
    const K = deg(c.deviationDeg / 2);
    const s = solveGrating(c.order, c.lambda, spacing(c.grooves), K);
    expect(s.reachable).toBe(true);
    if (!s.reachable) return;
    expectClose(s.rotationRad, Math.asin(c.sinPhi), 1e-12);
    expectClose(s.incidenceRad - s.diffractionRad, 2 * K, 1e-12, 1e-15);
    // The sum form, independently of the constant-deviation form.
    const sum = spacing(c.grooves) * (Math.sin(s.incidenceRad) + Math.sin(s.diffractionRad));
    expectClose(sum, c.order * c.lambda, 1e-12);
  });

  it('Littrow at 500 nm with 1200 g/mm sits at 17.4576° (asin 0.3, by hand)', () => {
    const s = solveGrating(1, 500, spacing(1200), 0);
    expect(s.reachable && toDeg(s.rotationRad)).toBeCloseTo(17.4576, 4);
  });

  it('a negative order mirrors the angles of the positive one', () => {
    const plus = solveGrating(2, 450, spacing(1200), deg(10));
    const minus = solveGrating(-2, 450, spacing(1200), deg(10));
    expect(plus.reachable && minus.reachable).toBe(true);
    if (!plus.reachable || !minus.reachable) return;
    expectClose(minus.rotationRad, -plus.rotationRad, 1e-14);
  });
});

describe('reachability', () => {
  const d = spacing(1200); // 833.33 nm
  const K = deg(60); // deviation 120°

  it('the longest wavelength is 2d cos²K / |m|, where incidence reaches grazing', () => {
    // 2 · 833.33 · cos²60° = 416.67 nm (by hand).
    expectClose(reachableMaxNm(1, d, K), 416.6666666666667, 1e-12);
    expectClose(reachableMaxNm(-2, d, K), 208.33333333333334, 1e-12);
    const justInside = solveGrating(1, 416.6, d, K);
    expect(justInside.reachable).toBe(true);
  });

  it('a wavelength beyond 2d cos K / |m| has no rotation at all', () => {
    // 2d cos K = 833.33 nm for K = 60°; 900 nm needs sin φ = 1.08.
    const s = solveGrating(1, 900, d, K);
    expect(s.reachable).toBe(false);
    if (!s.reachable) expect(s.reason).toMatch(/beyond the grating equation/);
  });

  it('a wavelength that solves the equation but needs |α| > 90° is unreachable', () => {
    // 600 nm: sin φ = 0.72 → φ = 46.05°, α = 106.05° (trap: the equation alone accepts it).
    expect(Math.abs((1 * 600) / (2 * d * Math.cos(K)))).toBeLessThan(1);
    const s = solveGrating(1, 600, d, K);
    expect(s.reachable).toBe(false);
    if (!s.reachable) {
      expect(s.reason).toMatch(/106\.1° from its normal/);
      expect(s.reason).toMatch(/at most 416\.7 nm/);
    }
  });

  it('the same trap holds in negative orders (|β| is the limit there)', () => {
    expect(solveGrating(-1, 600, d, K).reachable).toBe(false);
    expect(solveGrating(-1, 400, d, K).reachable).toBe(true);
  });

  it('non-positive and non-finite wavelengths are reasons, not exceptions', () => {
    expect(unreachableReason(1, 0, d, 0)).toBe('not a positive wavelength');
    expect(unreachableReason(1, Number.NaN, d, 0)).toBe('not a positive wavelength');
    expect(unreachableReason(1, 500, d, 0)).toBeNull();
  });
});
