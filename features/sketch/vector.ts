// Small vector algebra, local so the drawing has no dependency beyond the solver.

import type { PointMm, SegmentMm } from './sketch-types';

export function fromAngle(rad: number): PointMm {
  return { x: Math.cos(rad), y: Math.sin(rad) };
}
export function add(p: PointMm, q: PointMm): PointMm {
  return { x: p.x + q.x, y: p.y + q.y };
}
export function sub(p: PointMm, q: PointMm): PointMm {
  return { x: p.x - q.x, y: p.y - q.y };
}
export function scale(p: PointMm, k: number): PointMm {
  return { x: p.x * k, y: p.y * k };
}
export function dot(p: PointMm, q: PointMm): number {
  return p.x * q.x + p.y * q.y;
}
export function unit(p: PointMm): PointMm {
  const length = Math.hypot(p.x, p.y);
  return length > 0 ? scale(p, 1 / length) : { x: 0, y: 1 };
}
export function rotate(p: PointMm, rad: number): PointMm {
  const c = Math.cos(rad);
  const s = Math.sin(rad);
  return { x: c * p.x - s * p.y, y: s * p.x + c * p.y };
}
/** 90° counter-clockwise. */
export function perpendicular(p: PointMm): PointMm {
  return { x: -p.y, y: p.x };
}
/** Mirror image of direction `v` in a surface of unit normal `n`. */
export function reflect(v: PointMm, n: PointMm): PointMm {
  return sub(v, scale(n, 2 * dot(v, n)));
}
/** Where the ray from `origin` along `direction` meets the line through `point` with normal `n`, ahead of it. */
export function hitLine(origin: PointMm, direction: PointMm, point: PointMm, n: PointMm): PointMm | null {
  const denominator = dot(direction, n);
  if (Math.abs(denominator) < 1e-12) return null;
  const t = dot(sub(point, origin), n) / denominator;
  return t > 0 ? add(origin, scale(direction, t)) : null;
}
export function segmentAround(centre: PointMm, along: PointMm, lengthMm: number): SegmentMm {
  return { a: add(centre, scale(along, -lengthMm / 2)), b: add(centre, scale(along, lengthMm / 2)) };
}
