/**
 * Figures of a traced spot from its rays' image-plane positions and slopes: centroid, RMS sizes,
 * the best foci in x and y, the third moment in x (coma's signature) and RMS width through focus.
 * Moving the plane a distance s along its normal moves a ray by s × its slope, so every through-
 * focus figure is exact for the traced rays and needs no second trace.
 */

import { FATE, type RayBundle } from './trace-bundle';

export interface Moments {
  n: number;
  meanX: number;
  meanY: number;
  rmsX: number;
  rmsY: number;
  /** Shift along the normal that makes the x (y) spread smallest: the tangential (sagittal) focus. */
  focusShiftX: number;
  focusShiftY: number;
  /** Third central moment of x at the tangential focus, mm³. */
  thirdX: number;
  /** RMS x at the tangential focus. */
  rmsXAtFocus: number;
}

/** Spread of x at shift s: Var(x + s·sx) = Var x + 2s Cov(x, sx) + s² Var sx. */
export function rmsWidthAt(m: SpreadTerms, shiftMm: number): number {
  return Math.sqrt(Math.max(0, m.varX + 2 * shiftMm * m.covX + shiftMm * shiftMm * m.varSlopeX));
}

export interface SpreadTerms {
  varX: number;
  covX: number;
  varSlopeX: number;
}

/** Moments over the arrived rays of `bundle` (its rays from `from` to `to`). */
export function spotMoments(bundle: RayBundle, from = 0, to = bundle.count): Moments & SpreadTerms {
  const { x, y, slopeX, slopeY, fate } = bundle;
  let n = 0;
  let sx = 0;
  let sy = 0;
  let ssx = 0;
  let ssy = 0;
  for (let i = from; i < to; i++) {
    if (fate[i] !== FATE.arrived) continue;
    n++;
    sx += x[i]!;
    sy += y[i]!;
    ssx += slopeX[i]!;
    ssy += slopeY[i]!;
  }
  if (n === 0) {
    return { n, meanX: 0, meanY: 0, rmsX: 0, rmsY: 0, focusShiftX: 0, focusShiftY: 0, thirdX: 0, rmsXAtFocus: 0, varX: 0, covX: 0, varSlopeX: 0 };
  }
  const mx = sx / n;
  const my = sy / n;
  const msx = ssx / n;
  const msy = ssy / n;
  let vx = 0;
  let vy = 0;
  let cx = 0;
  let cy = 0;
  let vsx = 0;
  let vsy = 0;
  for (let i = from; i < to; i++) {
    if (fate[i] !== FATE.arrived) continue;
    const ex = x[i]! - mx;
    const ey = y[i]! - my;
    const esx = slopeX[i]! - msx;
    const esy = slopeY[i]! - msy;
    vx += ex * ex;
    vy += ey * ey;
    cx += ex * esx;
    cy += ey * esy;
    vsx += esx * esx;
    vsy += esy * esy;
  }
  vx /= n;
  vy /= n;
  cx /= n;
  cy /= n;
  vsx /= n;
  vsy /= n;
  const focusShiftX = vsx > 0 ? -cx / vsx : 0;
  const focusShiftY = vsy > 0 ? -cy / vsy : 0;
  // The third moment at the tangential focus: defocus alone is symmetric, so what is left is coma.
  let m3 = 0;
  let mFocus = 0;
  for (let i = from; i < to; i++) {
    if (fate[i] !== FATE.arrived) continue;
    mFocus += x[i]! + focusShiftX * slopeX[i]!;
  }
  mFocus /= n;
  let v2 = 0;
  for (let i = from; i < to; i++) {
    if (fate[i] !== FATE.arrived) continue;
    const e = x[i]! + focusShiftX * slopeX[i]! - mFocus;
    v2 += e * e;
    m3 += e * e * e;
  }
  return {
    n,
    meanX: mx,
    meanY: my,
    rmsX: Math.sqrt(vx),
    rmsY: Math.sqrt(vy),
    focusShiftX,
    focusShiftY,
    thirdX: m3 / n,
    rmsXAtFocus: Math.sqrt(v2 / n),
    varX: vx,
    covX: cx,
    varSlopeX: vsx,
  };
}
