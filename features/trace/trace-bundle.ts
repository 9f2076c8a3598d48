/**
 * The sequential trace of one bundle of rays: collimator sphere → plane grating → camera sphere →
 * image plane. Structure of arrays (one Float64Array per coordinate) and scalar arithmetic in one
 * loop, so 100,000 rays take a few milliseconds (`npm run bench:trace`).
 *
 * - Spheres: the ray meets |o + t·d − c|² = R² at the far root `t = −b + √(b² − c)` (every source
 *   lies inside the sphere, on its concave side) and reflects about the surface normal there.
 * - The grating: the vector form of the grating equation (Spencer & Murty, J. Opt. Soc. Am. 52,
 *   672, 1962): across the grooves the direction's component gains `mλ/d`, along the grooves it is
 *   kept, and the normal component follows from the unit length; so a ray that meets the grating
 *   out of the dispersion plane leaves on the cone of conical diffraction. No real root means the
 *   order is evanescent for that ray.
 * - A ray is vignetted (and counted, with the surface that stopped it) when it misses a mirror's
 *   aperture or the ruled area, meets no surface ahead, or has no propagating order.
 */

import { dot3, scale3, sub3, v3, type GratingSurface, type ImagePlane, type Mirror, type Mount, type Vec3 } from './optical-system';

/** Why a ray stopped: 0 it reached the image plane. */
export const FATE = {
  arrived: 0,
  collimator: 1,
  grating: 2,
  evanescent: 3,
  camera: 4,
  image: 5,
} as const;

export interface RayBundle {
  count: number;
  /** Start points; after the trace, where each arrived ray left the camera. */
  ox: Float64Array;
  oy: Float64Array;
  oz: Float64Array;
  /** Unit directions; after the trace, each arrived ray's direction off the camera. */
  dx: Float64Array;
  dy: Float64Array;
  dz: Float64Array;
  /** Results: image-plane x and y (mm) and the slopes dx/dw, dy/dw along the plane's normal. */
  x: Float64Array;
  y: Float64Array;
  slopeX: Float64Array;
  slopeY: Float64Array;
  fate: Uint8Array;
}

export function allocateBundle(count: number): RayBundle {
  return {
    count,
    ox: new Float64Array(count),
    oy: new Float64Array(count),
    oz: new Float64Array(count),
    dx: new Float64Array(count),
    dy: new Float64Array(count),
    dz: new Float64Array(count),
    x: new Float64Array(count),
    y: new Float64Array(count),
    slopeX: new Float64Array(count),
    slopeY: new Float64Array(count),
    fate: new Uint8Array(count),
  };
}

/** Points each ray (already at its start) toward its target, as unit directions. */
export function aimBundle(bundle: RayBundle, targetX: Float64Array, targetY: Float64Array, targetZ: Float64Array): void {
  const { ox, oy, oz, dx, dy, dz } = bundle;
  for (let i = 0; i < bundle.count; i++) {
    const ex = targetX[i]! - ox[i]!;
    const ey = targetY[i]! - oy[i]!;
    const ez = targetZ[i]! - oz[i]!;
    const k = 1 / Math.sqrt(ex * ex + ey * ey + ez * ez);
    dx[i] = ex * k;
    dy[i] = ey * k;
    dz[i] = ez * k;
  }
}

/** Mirror parameters as scalars for the loop. */
interface MirrorScalars {
  cx: number;
  cy: number;
  cz: number;
  r2: number;
  radius: number;
  vx: number;
  vy: number;
  vz: number;
  ax: number;
  ay: number;
  az: number;
  ap2: number;
}

function scalars(m: Mirror): MirrorScalars {
  return {
    cx: m.centre.x,
    cy: m.centre.y,
    cz: m.centre.z,
    r2: m.radiusMm * m.radiusMm,
    radius: m.radiusMm,
    vx: m.vertex.x,
    vy: m.vertex.y,
    vz: m.vertex.z,
    ax: m.axis.x,
    ay: m.axis.y,
    az: m.axis.z,
    ap2: m.apertureRadiusMm * m.apertureRadiusMm,
  };
}

/**
 * Traces every ray of `bundle` at `wavelengthNm` through `mount` with the grating as `grating`
 * sets it, to `image`. Fills x, y, slopes and fate; returns how many arrived.
 */
export function traceBundle(mount: Mount, grating: GratingSurface, image: ImagePlane, wavelengthNm: number, bundle: RayBundle): number {
  const col = scalars(mount.collimator);
  const cam = scalars(mount.camera);
  const gnx = grating.normal.x;
  const gny = grating.normal.y;
  const gtx = grating.tangent.x;
  const gty = grating.tangent.y;
  const halfW = grating.halfWidthMm;
  const halfH = grating.halfHeightMm;
  const kick = (grating.order * wavelengthNm) / grating.spacingNm;
  const { point: P, normal: W, xAxis: U, yAxis: V } = image;
  const { ox, oy, oz, dx, dy, dz, x, y, slopeX, slopeY, fate } = bundle;
  let arrived = 0;

  for (let i = 0; i < bundle.count; i++) {
    let px = ox[i]!;
    let py = oy[i]!;
    let pz = oz[i]!;
    let ux = dx[i]!;
    let uy = dy[i]!;
    let uz = dz[i]!;

    // Collimator.
    let qx = px - col.cx;
    let qy = py - col.cy;
    let qz = pz - col.cz;
    let b = qx * ux + qy * uy + qz * uz;
    let disc = b * b - (qx * qx + qy * qy + qz * qz - col.r2);
    if (disc < 0) {
      fate[i] = FATE.collimator;
      continue;
    }
    let t = -b + Math.sqrt(disc);
    px += t * ux;
    py += t * uy;
    pz += t * uz;
    // Distance from the mirror's axis line, against its aperture.
    let rx = px - col.vx;
    let ry = py - col.vy;
    let rz = pz - col.vz;
    let along = rx * col.ax + ry * col.ay + rz * col.az;
    rx -= along * col.ax;
    ry -= along * col.ay;
    rz -= along * col.az;
    if (rx * rx + ry * ry + rz * rz > col.ap2) {
      fate[i] = FATE.collimator;
      continue;
    }
    // Reflect about the normal (toward the centre of curvature).
    let nx = (col.cx - px) / col.radius;
    let ny = (col.cy - py) / col.radius;
    let nz = (col.cz - pz) / col.radius;
    let dn = ux * nx + uy * ny + uz * nz;
    ux -= 2 * dn * nx;
    uy -= 2 * dn * ny;
    uz -= 2 * dn * nz;

    // Grating plane through the origin, normal (gnx, gny, 0).
    const approach = ux * gnx + uy * gny;
    if (approach >= 0) {
      fate[i] = FATE.grating;
      continue;
    }
    t = -(px * gnx + py * gny) / approach;
    if (t <= 0) {
      fate[i] = FATE.grating;
      continue;
    }
    px += t * ux;
    py += t * uy;
    pz += t * uz;
    const across = px * gtx + py * gty;
    if (across > halfW || across < -halfW || pz > halfH || pz < -halfH) {
      fate[i] = FATE.grating;
      continue;
    }
    // Vector grating equation: tangential component gains mλ/d, the groove component is kept.
    const dt = ux * gtx + uy * gty + kick;
    const dg = uz;
    const rest = 1 - dt * dt - dg * dg;
    if (rest <= 0) {
      fate[i] = FATE.evanescent;
      continue;
    }
    const dnOut = Math.sqrt(rest);
    ux = dt * gtx + dnOut * gnx;
    uy = dt * gty + dnOut * gny;
    uz = dg;

    // Camera.
    qx = px - cam.cx;
    qy = py - cam.cy;
    qz = pz - cam.cz;
    b = qx * ux + qy * uy + qz * uz;
    disc = b * b - (qx * qx + qy * qy + qz * qz - cam.r2);
    if (disc < 0) {
      fate[i] = FATE.camera;
      continue;
    }
    t = -b + Math.sqrt(disc);
    px += t * ux;
    py += t * uy;
    pz += t * uz;
    rx = px - cam.vx;
    ry = py - cam.vy;
    rz = pz - cam.vz;
    along = rx * cam.ax + ry * cam.ay + rz * cam.az;
    rx -= along * cam.ax;
    ry -= along * cam.ay;
    rz -= along * cam.az;
    if (rx * rx + ry * ry + rz * rz > cam.ap2) {
      fate[i] = FATE.camera;
      continue;
    }
    nx = (cam.cx - px) / cam.radius;
    ny = (cam.cy - py) / cam.radius;
    nz = (cam.cz - pz) / cam.radius;
    dn = ux * nx + uy * ny + uz * nz;
    ux -= 2 * dn * nx;
    uy -= 2 * dn * ny;
    uz -= 2 * dn * nz;

    // Image plane (the camera hit and the direction off it are kept for the chief ray's use).
    ox[i] = px;
    oy[i] = py;
    oz[i] = pz;
    dx[i] = ux;
    dy[i] = uy;
    dz[i] = uz;
    const dw = ux * W.x + uy * W.y + uz * W.z;
    if (dw <= 1e-12) {
      fate[i] = FATE.image;
      continue;
    }
    t = ((P.x - px) * W.x + (P.y - py) * W.y + (P.z - pz) * W.z) / dw;
    px += t * ux - P.x;
    py += t * uy - P.y;
    pz += t * uz - P.z;
    x[i] = px * U.x + py * U.y + pz * U.z;
    y[i] = px * V.x + py * V.y + pz * V.z;
    slopeX[i] = (ux * U.x + uy * U.y + uz * U.z) / dw;
    slopeY[i] = (ux * V.x + uy * V.y + uz * V.z) / dw;
    fate[i] = FATE.arrived;
    arrived++;
  }
  return arrived;
}

/**
 * The chief ray from `start` toward `target`, traced by the same loop: where it leaves the camera,
 * its direction then, and its angle of incidence there. Null when it does not get that far.
 */
export function traceChief(
  mount: Mount,
  grating: GratingSurface,
  wavelengthNm: number,
  start: Vec3,
  target: Vec3,
): { cameraHit: Vec3; direction: Vec3; cameraIncidenceRad: number } | null {
  const bundle = allocateBundle(1);
  bundle.ox[0] = start.x;
  bundle.oy[0] = start.y;
  bundle.oz[0] = start.z;
  aimBundle(bundle, Float64Array.of(target.x), Float64Array.of(target.y), Float64Array.of(target.z));
  // Any plane the reflected ray crosses forwards will do: one through the camera's centre of
  // curvature, normal to its axis (the reflected chief ray heads across it toward the focus).
  const cam = mount.camera;
  const plane: ImagePlane = { point: cam.centre, normal: cam.axis, xAxis: v3(1, 0, 0), yAxis: v3(0, 1, 0) };
  if (traceBundle(mount, grating, plane, wavelengthNm, bundle) !== 1) return null;
  const cameraHit = v3(bundle.ox[0]!, bundle.oy[0]!, bundle.oz[0]!);
  const direction = v3(bundle.dx[0]!, bundle.dy[0]!, bundle.dz[0]!);
  const normal = scale3(sub3(cam.centre, cameraHit), 1 / cam.radiusMm);
  return { cameraHit, direction, cameraIncidenceRad: Math.acos(Math.min(1, Math.abs(dot3(direction, normal)))) };
}
