/** Off-axis mirror aberrations of the two-mirror mounts. */

/**
 * Camera off-axis angle θ₂ that cancels the collimator's coma at one wavelength
 * (Shafer, Megill & Droppleman, J. Opt. Soc. Am. 54, 879, 1964):
 *
 *   sin θ₂ / sin θ₁ = (R₂/R₁)² · (cos θ₂ / cos θ₁)³ · (cos α / cos β)³,   R = 2f.
 *
 * Valid with the entrance slit at the collimator's tangential focus `f₁ cos θ₁`. Writing
 * `t = tan θ₂`, `sin θ / cos³ θ = t(1 + t²)`, so the condition is the monotonic cubic
 * `t + t³ = C`, solved by Newton from an upper bound (convex for t > 0, so it converges
 * monotonically); one real root always exists, so every input gives an angle.
 */
export function comaFreeCameraAngleRad(
  collimatorOffAxisRad: number,
  collimatorFocalMm: number,
  cameraFocalMm: number,
  cosIncidence: number,
  cosDiffraction: number,
): number {
  const focalRatio = cameraFocalMm / collimatorFocalMm;
  const anamorphic = cosIncidence / cosDiffraction;
  const cosT1 = Math.cos(collimatorOffAxisRad);
  const target =
    focalRatio * focalRatio * anamorphic ** 3 * (Math.sin(collimatorOffAxisRad) / cosT1 ** 3);
  return Math.atan(solveTPlusTCubed(target));
}

/** Real root of `t + t³ = c`. */
export function solveTPlusTCubed(c: number): number {
  if (c === 0 || !Number.isFinite(c)) return c === 0 ? 0 : Math.sign(c) * Number.MAX_VALUE;
  const target = Math.abs(c);
  // Both c and ∛c bound the root from above; the smaller is the closer start.
  let t = Math.min(target, Math.cbrt(target));
  for (let i = 0; i < 60; i++) {
    const step = (t + t * t * t - target) / (1 + 3 * t * t);
    t -= step;
    if (Math.abs(step) <= 1e-15 * Math.max(1, t)) break;
  }
  return Math.sign(c) * t;
}

/**
 * Coddington: an off-axis spherical mirror focuses the tangential fan at `f cos θ` and the
 * sagittal fan at `f / cos θ`; their separation `f / cos θ − f cos θ`, in mm, is the astigmatic
 * focal difference. Source: Coddington's equations for a mirror.
 */
export function astigmaticFocalDifferenceMm(focalMm: number, offAxisRad: number): number {
  const c = Math.cos(offAxisRad);
  return focalMm / c - focalMm * c;
}
