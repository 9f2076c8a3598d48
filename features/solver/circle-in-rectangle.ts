/**
 * How much of a uniformly lit disc falls inside a rectangle centred on it: the overlap that sets
 * both how much of a fibre core passes the slit and how much of an input cone the grating accepts.
 * Exact plane geometry, no sampling.
 */

/** `∫₀ˣ √(r² − t²) dt`, the area under a quarter circle of radius `r` up to `x` (0 ≤ x ≤ r). */
function quarterCircleArea(r: number, x: number): number {
  const ratio = Math.min(1, Math.max(-1, x / r));
  return (x * Math.sqrt(Math.max(0, r * r - x * x)) + r * r * Math.asin(ratio)) / 2;
}

/**
 * Area of the disc of radius `r` inside the rectangle `[−halfWidth, halfWidth] × [−halfHeight,
 * halfHeight]`, both centred at the origin: `4 ∫₀^{min(a,r)} min(b, √(r² − x²)) dx`.
 */
export function circleRectangleOverlapArea(r: number, halfWidth: number, halfHeight: number): number {
  if (!(r > 0) || !(halfWidth > 0) || !(halfHeight > 0)) return 0;
  const x = Math.min(halfWidth, r);
  // Past `xb` the circle's edge is lower than the rectangle's top; before it the top clips.
  const xb = Math.sqrt(Math.max(0, r * r - halfHeight * halfHeight));
  if (x <= xb) return 4 * halfHeight * x;
  return 4 * (halfHeight * xb + quarterCircleArea(r, x) - quarterCircleArea(r, xb));
}

/** The fraction (0…1) of a uniformly lit disc of radius `r` that falls inside the centred rectangle. */
export function circleFractionInRectangle(r: number, halfWidth: number, halfHeight: number): number {
  if (!(r > 0)) return 0;
  return Math.min(1, circleRectangleOverlapArea(r, halfWidth, halfHeight) / (Math.PI * r * r));
}
