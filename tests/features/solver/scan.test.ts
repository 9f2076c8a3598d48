import { describe, it } from 'vitest';
import { scanSensitivityNmPerArcsec, solveGrating } from '@/features/solver';
import { deg, expectClose } from './close-to';
import { spacing } from './fixtures';

describe('scan sensitivity', () => {
  it.each([
    { order: 1, lambda: 500, deviationDeg: 30 },
    { order: -2, lambda: 300, deviationDeg: 20 },
    { order: 3, lambda: 250, deviationDeg: 0 },
  ] satisfies readonly { order: number; lambda: number; deviationDeg: number }[])(
    'order $order at $lambda nm matches a numerical dλ/dφ of the grating equation',
    ({ order, lambda, deviationDeg }) => {
      // Differentiating mλ = 2d cos K sin φ numerically (Palmer & Loewen, ch. 2).
      const d = spacing(1200);
      const K = deg(deviationDeg / 2);
      const s = solveGrating(order, lambda, d, K);
      if (!s.reachable) throw new Error('reachable');
      const arcsec = Math.PI / 648000;
      const lambdaAt = (phi: number) => (2 * d * Math.cos(K) * Math.sin(phi)) / order;
      const numeric = Math.abs(lambdaAt(s.rotationRad + arcsec) - lambdaAt(s.rotationRad - arcsec)) / 2;
      expectClose(scanSensitivityNmPerArcsec(order, d, K, s.rotationRad), numeric, 1e-6);
    },
  );

  it('a 1200 g/mm Littrow at 0° moves about 8 pm per arc-second', () => {
    // By hand: 2 · 833.33 nm · 4.848e-6 rad = 8.08e-3 nm.
    expectClose(scanSensitivityNmPerArcsec(1, spacing(1200), 0, 0), 8.0806e-3, 1e-4);
  });
});
