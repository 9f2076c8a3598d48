/** Shared constants and tiny numeric helpers for the solver. Pure, no state. */

export const RAD_PER_DEG = Math.PI / 180;
export const DEG_PER_RAD = 180 / Math.PI;
/** 1 arc-second in radians (π / 648 000). */
export const RAD_PER_ARCSEC = Math.PI / 648_000;
export const NM_PER_MM = 1e6;
export const UM_PER_MM = 1e3;
export const HALF_PI = Math.PI / 2;

/**
 * How close to 90° an angle on the grating may come and still count as reachable. Exactly 90° is
 * grazing (no light), and just short of it cos β ≈ 0 makes dispersion explode; this margin keeps
 * every reported number finite while being far below any angle a real design uses.
 */
export const GRAZING_MARGIN_RAD = 1e-9;

export function degToRad(deg: number): number {
  return deg * RAD_PER_DEG;
}

export function radToDeg(rad: number): number {
  return rad * DEG_PER_RAD;
}

/** Unnormalised sinc, `sin x / x`, with its limit 1 at 0. */
export function sinc(x: number): number {
  // Below 1e-8 the first Taylor term x²/6 is under double precision; returning 1 avoids 0/0.
  return Math.abs(x) < 1e-8 ? 1 : Math.sin(x) / x;
}
