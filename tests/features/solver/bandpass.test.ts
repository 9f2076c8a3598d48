import { describe, expect, it } from 'vitest';
import { bandpassNm, evaluateDesign, slitFunction, type SlitFunction } from '@/features/solver';
import { expectClose } from './close-to';
import { makeDesign } from './fixtures';

/**
 * Numerical convolution of two centred rectangles (widths in nm), sampled on a fine grid: the
 * instrument function built from first principles, independent of the solver's trapezoid.
 */
function convolvedRects(aNm: number, bNm: number, samples = 4001) {
  const span = (aNm + bNm) * 0.75;
  const step = (2 * span) / (samples - 1);
  const xs = Array.from({ length: samples }, (_, i) => -span + i * step);
  const inA = (x: number) => (Math.abs(x) <= aNm / 2 ? 1 : 0);
  const inB = (x: number) => (Math.abs(x) <= bNm / 2 ? 1 : 0);
  const ys = xs.map((x) => {
    let s = 0;
    for (const u of xs) s += inA(u) * inB(x - u);
    return s * step;
  });
  return { xs, ys, step };
}

/** Relative height (0…1) of the reported trapezoid at `offsetNm` from its centre. */
function trapezoidHeight(profile: SlitFunction, offsetNm: number): number {
  const x = Math.abs(offsetNm);
  const halfTop = profile.topNm / 2;
  const halfBase = profile.baseNm / 2;
  if (x <= halfTop) return 1;
  if (x >= halfBase) return 0;
  return (halfBase - x) / (halfBase - halfTop);
}

function fwhm(xs: number[], ys: number[]): number {
  const peak = Math.max(...ys);
  const above = xs.filter((_, i) => ys[i]! >= peak / 2);
  return above[above.length - 1]! - above[0]!;
}

describe('slit function and bandpass', () => {
  it('bandpass is set by the exit slit when the entrance image is narrower', () => {
    // Palmer & Loewen, ch. 9: bandpass = RLD × slit width.
    expectClose(bandpassNm(2.7, 0.08, 0.1), 0.27, 1e-12);
  });

  it('bandpass is set by the entrance image when the exit slit is narrower', () => {
    expectClose(bandpassNm(2.7, 0.15, 0.1), 0.405, 1e-12);
  });

  it('equal widths give a triangle with base twice the bandpass', () => {
    const f = slitFunction(2, 0.1, 0.1);
    expect(f.shape).toBe('triangle');
    expectClose(f.baseNm, 0.4, 1e-12);
    expect(f.topNm).toBe(0);
  });

  it('unequal widths give a trapezoid: base the sum, top the difference', () => {
    const f = slitFunction(2, 0.05, 0.2);
    expect(f.shape).toBe('trapezoid');
    expectClose(f.baseNm, 0.5, 1e-12);
    expectClose(f.topNm, 0.3, 1e-12);
  });

  it.each([
    { a: 0.2, b: 0.2 },
    { a: 0.1, b: 0.3 },
    { a: 0.45, b: 0.05 },
  ] satisfies readonly { a: number; b: number }[])(
    'a numerical convolution of rect($a nm) and rect($b nm) has the FWHM and shape the solver reports',
    ({ a, b }) => {
      const { xs, ys, step } = convolvedRects(a, b);
      // RLD 1 nm/mm makes widths in mm equal widths in nm.
      expectClose(fwhm(xs, ys), bandpassNm(1, a, b), 0, 3 * step);
      const profile = slitFunction(1, a, b);
      const peak = Math.max(...ys);
      for (let i = 0; i < xs.length; i += 97) {
        expect(Math.abs(ys[i]! / peak - trapezoidHeight(profile, xs[i]!))).toBeLessThan(0.01);
      }
    },
  );
});

describe('sodium D doublet (NIST ASD, 588.995 and 589.592 nm in air, from memory)', () => {
  const D1 = 589.592;
  const D2 = 588.995;
  const separation = D1 - D2; // 0.597 nm

  /** Sum of two copies of the instrument function centred on the lines: is there a dip between? */
  function resolves(profile: { baseNm: number; topNm: number; shape: 'triangle' | 'trapezoid' }): boolean {
    // Built from the convolution of rectangles, not from the solver's own profile evaluator.
    const imageNm = (profile.baseNm + profile.topNm) / 2;
    const exitNm = (profile.baseNm - profile.topNm) / 2;
    const { xs, ys } = convolvedRects(imageNm, exitNm, 1601);
    const at = (x: number) => {
      const i = Math.round(((x - xs[0]!) / (xs[xs.length - 1]! - xs[0]!)) * (xs.length - 1));
      return i >= 0 && i < ys.length ? ys[i]! : 0;
    };
    const total = (x: number) => at(x - D1) + at(x - D2);
    const mid = total((D1 + D2) / 2);
    const peak = Math.max(total(D1), total(D2));
    return mid < 0.98 * peak;
  }

  // 1200 g/mm, 0.3 m Czerny–Turner: RLD ≈ 2.76 nm/mm near 589 nm.
  const cases = [
    { name: '50 µm slits', widthUm: 50 },
    { name: '150 µm slits', widthUm: 150 },
    { name: '200 µm slits', widthUm: 200 },
    { name: '300 µm slits', widthUm: 300 },
    { name: '400 µm slits', widthUm: 400 },
  ] satisfies readonly { name: string; widthUm: number }[];

  it.each(cases)('$name: the pair is resolved exactly when the bandpass is under 0.597 nm', ({ widthUm }) => {
    const design = makeDesign({
      slits: { entranceWidthUm: widthUm, exitWidthUm: widthUm },
      range: { startNm: 580, endNm: 600 },
    });
    const point = evaluateDesign(design, { wavelengthsNm: [(D1 + D2) / 2] }).points[0]!;
    const bandpass = point.bandpassNm ?? NaN;
    expect(Math.abs(bandpass - separation)).toBeGreaterThan(0.02); // each case clearly on one side
    expect(resolves(point.slitFunction!)).toBe(bandpass < separation);
    // The delivered resolving power says the same: R ≈ 1,000 is needed (NIST-derived, from memory).
    expect((point.resolvingPower ?? 0) > 589.3 / separation).toBe(bandpass < separation);
  });
});
