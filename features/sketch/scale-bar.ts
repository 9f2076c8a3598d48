/** A round scale-bar length (1, 2 or 5 × 10ⁿ mm) close to a fifth of `spanMm`. */
export function scaleBarLengthMm(spanMm: number): number {
  const target = Math.max(spanMm, 1e-9) / 5;
  const power = 10 ** Math.floor(Math.log10(target));
  const mantissa = target / power;
  return (mantissa < 1.5 ? 1 : mantissa < 3.5 ? 2 : mantissa < 7.5 ? 5 : 10) * power;
}
