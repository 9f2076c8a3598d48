/**
 * An independent 2-D ray trace of a Czerny–Turner type mount, written from first principles for
 * the tests (it shares no code with the solver): real spherical mirrors (circle intersections and
 * mirror reflection) and a plane grating applying the vector grating equation, the tangential
 * component of the ray direction gaining `mλ/d`.
 *
 * Layout: the entrance slit at the origin sends its chief ray along +x to the collimator, which
 * sits at the collimator's tangential focal distance `f₁ cos θ₁` (the beam is then collimated in
 * the dispersion plane); the grating faces the collimated beam at incidence α; the camera mirror
 * meets the diffracted chief ray at off-axis angle θ₂; the exit plane is normal to the final chief
 * ray at the camera's tangential focus `f₂ cos θ₂`.
 */

export type Vec = { x: number; y: number };

const add = (a: Vec, b: Vec): Vec => ({ x: a.x + b.x, y: a.y + b.y });
const sub = (a: Vec, b: Vec): Vec => ({ x: a.x - b.x, y: a.y - b.y });
const scale = (a: Vec, k: number): Vec => ({ x: a.x * k, y: a.y * k });
const dot = (a: Vec, b: Vec): number => a.x * b.x + a.y * b.y;
const cross = (a: Vec, b: Vec): number => a.x * b.y - a.y * b.x;
export const rotate = (a: Vec, angleRad: number): Vec => ({
  x: a.x * Math.cos(angleRad) - a.y * Math.sin(angleRad),
  y: a.x * Math.sin(angleRad) + a.y * Math.cos(angleRad),
});
const reflect = (d: Vec, n: Vec): Vec => sub(d, scale(n, 2 * dot(d, n)));

export interface Ray {
  origin: Vec;
  direction: Vec;
}

interface SphericalMirror {
  vertex: Vec;
  centre: Vec;
  radius: number;
}

interface PlaneGrating {
  point: Vec;
  /** Unit normal pointing back toward the incoming light. */
  normal: Vec;
  /** Unit tangent chosen so the incoming chief ray has `d·t = −sin α`. */
  tangent: Vec;
}

function hitMirror(ray: Ray, mirror: SphericalMirror): Ray {
  // |o + t d − c|² = R², the root whose hit point is nearest the vertex.
  const oc = sub(ray.origin, mirror.centre);
  const b = dot(oc, ray.direction);
  const c = dot(oc, oc) - mirror.radius * mirror.radius;
  const disc = Math.sqrt(b * b - c);
  const candidates = [-b - disc, -b + disc].filter((t) => t > 1e-9);
  let best = candidates[0]!;
  let bestDistance = Infinity;
  for (const t of candidates) {
    const p = add(ray.origin, scale(ray.direction, t));
    const distance = Math.hypot(p.x - mirror.vertex.x, p.y - mirror.vertex.y);
    if (distance < bestDistance) {
      bestDistance = distance;
      best = t;
    }
  }
  const point = add(ray.origin, scale(ray.direction, best));
  const normal = scale(sub(mirror.centre, point), 1 / mirror.radius);
  return { origin: point, direction: reflect(ray.direction, normal) };
}

function hitGrating(ray: Ray, grating: PlaneGrating, orderTimesWavelengthOverSpacing: number): Ray {
  const t = dot(sub(grating.point, ray.origin), grating.normal) / dot(ray.direction, grating.normal);
  const point = add(ray.origin, scale(ray.direction, t));
  // Vector grating equation: the tangential component gains mλ/d; the ray stays on the incident side.
  const tangential = dot(ray.direction, grating.tangent) + orderTimesWavelengthOverSpacing;
  if (Math.abs(tangential) >= 1) throw new Error('evanescent order');
  const normalPart = Math.sqrt(1 - tangential * tangential);
  return {
    origin: point,
    direction: add(scale(grating.tangent, tangential), scale(grating.normal, normalPart)),
  };
}

export interface MountGeometry {
  collimatorFocalMm: number;
  cameraFocalMm: number;
  collimatorOffAxisRad: number;
  /** Signed: the sign picks which way the camera folds the beam. */
  cameraOffAxisRad: number;
  incidenceRad: number;
  order: number;
  spacingNm: number;
  /** Distance grating–mirrors along the chief rays; irrelevant to first order, kept realistic. */
  armMm?: number;
}

export interface TracedMount {
  /** Traces a ray leaving the slit at `angleRad` from the chief ray, at `wavelengthNm`. */
  trace(angleRad: number, wavelengthNm: number): Ray;
  /** Where a traced ray crosses the exit plane, mm along the plane from its centre. */
  exitPositionMm(ray: Ray): number;
  /** Diffraction angle of the chief ray at the design wavelength, measured on the grating. */
  chiefDiffractionRad(wavelengthNm: number): number;
  exitPlane: { point: Vec; normal: Vec; along: Vec };
}

export function buildMount(g: MountGeometry, designWavelengthNm: number): TracedMount {
  const arm = g.armMm ?? 0.7 * g.collimatorFocalMm;
  const slit: Vec = { x: 0, y: 0 };
  const u0: Vec = { x: 1, y: 0 };

  const v1 = add(slit, scale(u0, g.collimatorFocalMm * Math.cos(g.collimatorOffAxisRad)));
  const n1 = rotate(scale(u0, -1), g.collimatorOffAxisRad);
  const collimator: SphericalMirror = { vertex: v1, centre: add(v1, scale(n1, 2 * g.collimatorFocalMm)), radius: 2 * g.collimatorFocalMm };
  const u1 = reflect(u0, n1);

  const gPoint = add(v1, scale(u1, arm));
  const gNormal = rotate(scale(u1, -1), g.incidenceRad);
  const gTangent = rotate(gNormal, -Math.PI / 2);
  const grating: PlaneGrating = { point: gPoint, normal: gNormal, tangent: gTangent };

  const mOverD = (wavelengthNm: number) => (g.order * wavelengthNm) / g.spacingNm;
  const u2 = hitGrating({ origin: v1, direction: u1 }, grating, mOverD(designWavelengthNm)).direction;

  const v2 = add(gPoint, scale(u2, arm));
  const n2 = rotate(scale(u2, -1), g.cameraOffAxisRad);
  const camera: SphericalMirror = { vertex: v2, centre: add(v2, scale(n2, 2 * g.cameraFocalMm)), radius: 2 * g.cameraFocalMm };
  const u3 = reflect(u2, n2);

  const exitPoint = add(v2, scale(u3, g.cameraFocalMm * Math.cos(g.cameraOffAxisRad)));
  const along = rotate(u3, Math.PI / 2);

  const trace = (angleRad: number, wavelengthNm: number): Ray => {
    let ray: Ray = { origin: slit, direction: rotate(u0, angleRad) };
    ray = hitMirror(ray, collimator);
    ray = hitGrating(ray, grating, mOverD(wavelengthNm));
    return hitMirror(ray, camera);
  };

  return {
    trace,
    exitPositionMm(ray) {
      const t = dot(sub(exitPoint, ray.origin), u3) / dot(ray.direction, u3);
      return dot(sub(add(ray.origin, scale(ray.direction, t)), exitPoint), along);
    },
    chiefDiffractionRad(wavelengthNm) {
      const out = hitGrating({ origin: v1, direction: u1 }, grating, mOverD(wavelengthNm)).direction;
      return Math.asin(dot(out, gTangent));
    },
    exitPlane: { point: exitPoint, normal: u3, along },
  };
}

/**
 * Tangential coma of the whole mount at one wavelength: trace a ±ε fan from the slit, intersect
 * the two outgoing rays, and measure how far that crossing lies from the outgoing chief ray
 * (the even part of the transverse aberration of a ±h pupil pair). Zero when coma cancels.
 */
export function tangentialComaMm(mount: TracedMount, fanAngleRad: number, wavelengthNm: number): number {
  const chief = mount.trace(0, wavelengthNm);
  const upper = mount.trace(fanAngleRad, wavelengthNm);
  const lower = mount.trace(-fanAngleRad, wavelengthNm);
  const denom = cross(upper.direction, lower.direction);
  const s = cross(sub(lower.origin, upper.origin), lower.direction) / denom;
  const crossing = add(upper.origin, scale(upper.direction, s));
  return cross(chief.direction, sub(crossing, chief.origin));
}

/** Bisection for a sign change of `f` on [lo, hi]. */
export function bisect(f: (x: number) => number, lo: number, hi: number, iterations = 200): number {
  let flo = f(lo);
  for (let i = 0; i < iterations; i++) {
    const mid = (lo + hi) / 2;
    const fmid = f(mid);
    if (fmid === 0) return mid;
    if (Math.sign(fmid) === Math.sign(flo)) {
      lo = mid;
      flo = fmid;
    } else hi = mid;
  }
  return (lo + hi) / 2;
}
