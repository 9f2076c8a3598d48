import { describe, expect, it } from 'vitest';
import { evaluatePolynomialFit, fitPolynomial } from '@/features/solver/polynomial-fit';

const range = (n: number, step = 1) => Array.from({ length: n }, (_, i) => i * step);

describe('least-squares polynomial fit', () => {
  it('reproduces an exact cubic over 1024 pixels to under 10⁻⁹ nm', () => {
    // λ(p) = 380 + 0.15 p − 2×10⁻⁵ p² + 3×10⁻⁹ p³: a made-up but spectrograph-like dispersion.
    const exact = (p: number) => 380 + 0.15 * p - 2e-5 * p * p + 3e-9 * p * p * p;
    const xs = range(1024);
    const fit = fitPolynomial(xs, xs.map(exact), 3)!;
    expect(fit).not.toBeNull();
    for (const p of [0, 0.5, 137.25, 511.5, 1023]) {
      expect(Math.abs(evaluatePolynomialFit(fit, p) - exact(p))).toBeLessThan(1e-9);
    }
  });

  it('gives the least-squares line through points that are not on one (hand computation)', () => {
    // Points (0,0), (1,1), (2,1), (3,3): slope = Σ(x−x̄)(y−ȳ)/Σ(x−x̄)² = 4.5/5 = 0.9,
    // intercept = ȳ − 0.9·x̄ = 1.25 − 1.35 = −0.1 (ordinary least squares by hand).
    const fit = fitPolynomial([0, 1, 2, 3], [0, 1, 1, 3], 1)!;
    expect(Math.abs(evaluatePolynomialFit(fit, 0) - -0.1)).toBeLessThan(1e-12);
    expect(Math.abs(evaluatePolynomialFit(fit, 10) - 8.9)).toBeLessThan(1e-12);
  });

  it('leaves a residual when the data are not a cubic: x⁴ on [−1, 1]', () => {
    // The best cubic to t⁴ is even, a + b t², and cannot follow it exactly.
    const xs = range(41, 0.05).map((x) => x - 1);
    const fit = fitPolynomial(xs, xs.map((x) => x ** 4), 3)!;
    const worst = Math.max(...xs.map((x) => Math.abs(evaluatePolynomialFit(fit, x) - x ** 4)));
    expect(worst).toBeGreaterThan(0.01);
  });

  it('refuses what does not fix the coefficients', () => {
    expect(fitPolynomial([1, 2, 3], [1, 2, 3], 3)).toBeNull(); // 3 points, 4 coefficients
    expect(fitPolynomial([1, 1, 1, 1, 1], [1, 2, 3, 4, 5], 3)).toBeNull(); // one distinct x
    expect(fitPolynomial([1, 2], [1], 0)).toBeNull(); // lengths differ
    expect(fitPolynomial([1, 2, Number.NaN, 4], [1, 2, 3, 4], 1)).toBeNull();
    expect(fitPolynomial([1, 2, 3], [1, 2, 3], -1)).toBeNull();
  });
});
