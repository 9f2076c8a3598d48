/**
 * Étendue: the light-gathering power of the entrance slit and the instrument's acceptance,
 * `G = A_slit · Ω` (conserved through a lossless system; Palmer & Loewen, Diffraction Grating
 * Handbook; any radiometry text). The acceptance is the solid angle the collimator sees the
 * grating's projected aperture under: the grating, `W cos α` wide and `H` tall, is the stop.
 */

/**
 * Solid angle of a `width × height` rectangle seen face-on from `distance` on its axis:
 * `Ω = 4 arcsin(ab / √((a² + d²)(b² + d²)))`, a and b the half-sides (the exact form; it tends to
 * `width · height / d²` for a slow beam).
 */
export function rectangleSolidAngleSr(widthMm: number, heightMm: number, distanceMm: number): number {
  const a = widthMm / 2;
  const b = heightMm / 2;
  const d2 = distanceMm * distanceMm;
  return 4 * Math.asin(Math.min(1, (a * b) / Math.sqrt((a * a + d2) * (b * b + d2))));
}

/** Solid angle of a circular cone of half-angle θ: `Ω = 2π(1 − cos θ)`. */
export function coneSolidAngleSr(halfAngleRad: number): number {
  return 2 * Math.PI * (1 - Math.cos(halfAngleRad));
}

/** Half-angle of the cone of an f-number `N` beam: `tan θ = 1 / (2N)`. */
export function coneHalfAngleRad(fNumber: number): number {
  return Math.atan(1 / (2 * fNumber));
}

/**
 * The f-number of a circular cone holding the same solid angle as `Ω`: how the acceptance is
 * usually quoted. Inverts `Ω = 2π(1 − cos θ)` and `tan θ = 1/(2N)`.
 */
export function equivalentFNumber(solidAngleSr: number): number {
  const cosTheta = 1 - solidAngleSr / (2 * Math.PI);
  const theta = Math.acos(Math.max(-1, Math.min(1, cosTheta)));
  return 1 / (2 * Math.tan(theta));
}

/** A fibre's cone: `sin θ = NA` in air, so `f/# = 1 / (2 tan θ)` (≈ `1/(2 NA)` for a small NA; common practice). */
export function fibreFNumber(numericalAperture: number): number {
  const theta = Math.asin(Math.min(1, numericalAperture));
  return 1 / (2 * Math.tan(theta));
}

/** `G = A · Ω` in mm²·sr. */
export function etendueMm2Sr(areaMm2: number, solidAngleSr: number): number {
  return areaMm2 * solidAngleSr;
}
