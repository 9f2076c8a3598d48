/**
 * The exact trace of a design at a few wavelengths: spot diagrams from three points of the
 * entrance slit, the whole slit's image scanned by the exit slit (the traced line shape and its
 * FWHM), the slit image's bow, the foci, coma, the dispersion as traced, and for a spectrograph
 * the detector tilt that follows the foci.
 *
 * Monochromator (no detector): the grating is turned to each traced wavelength, which then lands
 * on the exit slit. Spectrograph (a detector): the grating stays at the range centre and the
 * wavelengths spread across the detector.
 *
 * Rays are spread by a Halton sequence (bases 2, 3, 5, 7: slit across, slit along, pupil across,
 * pupil along), so a trace is repeatable and smooth with few rays; the pupil is the grating's
 * ruled area as the collimator sees it (`W cos α` across, `H` along), filled to 98 %.
 */

import type { Design } from '../../shared/design';
import { TRACE_LIMITS, type TraceOptions } from '../../shared/trace';
import { UM_PER_MM, evaluatePoint, prepareDesign, summarizeDesign, type SlitFunction } from '../solver';
import { tracedLineShape } from './line-shape';
import {
  add3,
  buildMount,
  cross3,
  gratingAt,
  norm3,
  scale3,
  sub3,
  unit3,
  v3,
  type GratingSurface,
  type ImagePlane,
  type Mount,
} from './optical-system';
import { rmsWidthAt, spotMoments } from './spot-statistics';
import { FATE, allocateBundle, traceBundle, traceChief, type RayBundle } from './trace-bundle';
import type { DetectorTilt, SlitHeightRole, Spot, TraceReport, TracedWavelength } from './types';

/** Share of the grating's projected area the launched pupil covers, per side. */
const PUPIL_FILL = 0.98;
/** Through-focus samples. */
const FOCUS_SAMPLES = 21;
/** A bow below this (mm) needs no curved slit. */
const STRAIGHT_ENOUGH_MM = 1e-6;

function radicalInverse(index: number, base: number): number {
  let f = 1;
  let r = 0;
  let i = index;
  while (i > 0) {
    f /= base;
    r += f * (i % base);
    i = Math.floor(i / base);
  }
  return r;
}

/** The first `count` Halton points in `base`, centred on 0 (−½ … ½); kept, since every wavelength reuses them. */
const haltonTables = new Map<string, Float64Array>();
function halton(count: number, base: number): Float64Array {
  const key = `${base}:${count}`;
  let table = haltonTables.get(key);
  if (!table) {
    table = new Float64Array(count);
    for (let i = 0; i < count; i++) table[i] = radicalInverse(i + 1, base) - 0.5;
    if (haltonTables.size > 32) haltonTables.clear();
    haltonTables.set(key, table);
  }
  return table;
}

/**
 * Where a bundle's rays start and aim: across the slit `s` and along it `t` (mm; a number is the
 * same for every ray), and across `a` and along `b` the pupil (−½ … ½ of it).
 */
interface LaunchPoints {
  s: Float64Array | number;
  t: Float64Array | number;
  a: Float64Array;
  b: Float64Array;
}

/** How the trace is set up for one grating setting. */
interface Setting {
  mount: Mount;
  grating: GratingSurface;
  image: ImagePlane;
  /** Entrance-slit offset across the slit at height t (the curved slit), mm. */
  curve: (heightMm: number) => number;
}

/** Rays from points on the entrance slit toward points on the pupil, as a bundle. */
function launch(setting: Setting, count: number, points: LaunchPoints): RayBundle {
  const { launch: L } = setting.mount;
  const bundle = allocateBundle(count);
  const cosAlpha = Math.cos(setting.grating.incidenceRad);
  const pupilWidth = setting.mount.ruledWidthMm * cosAlpha * PUPIL_FILL;
  const pupilHeight = setting.mount.ruledHeightMm * PUPIL_FILL;
  const { s: sAt, t: tAt, a: aAt, b: bAt } = points;
  for (let i = 0; i < count; i++) {
    const t = typeof tAt === 'number' ? tAt : tAt[i]!;
    const across = (typeof sAt === 'number' ? sAt : sAt[i]!) + setting.curve(t);
    const a = aAt[i]! * pupilWidth;
    const ox = L.slitCentre.x + across * L.slitAcross.x + t * L.slitAlong.x;
    const oy = L.slitCentre.y + across * L.slitAcross.y + t * L.slitAlong.y;
    const oz = L.slitCentre.z + across * L.slitAcross.z + t * L.slitAlong.z;
    const ex = L.pupilCentre.x + a * L.pupilAcross.x - ox;
    const ey = L.pupilCentre.y + a * L.pupilAcross.y - oy;
    const ez = L.pupilCentre.z + a * L.pupilAcross.z + bAt[i]! * pupilHeight - oz;
    const k = 1 / Math.sqrt(ex * ex + ey * ey + ez * ez);
    bundle.ox[i] = ox;
    bundle.oy[i] = oy;
    bundle.oz[i] = oz;
    bundle.dx[i] = ex * k;
    bundle.dy[i] = ey * k;
    bundle.dz[i] = ez * k;
  }
  return bundle;
}

/** A point source at (s, t) on the slit, filling the pupil. */
const pointSource = (count: number, s: number, t: number): LaunchPoints => ({ s, t, a: halton(count, 2), b: halton(count, 3) });

/** One ray from the slit point (s, t) through the pupil's centre, to the image plane: its x and y, or null. */
function chiefXY(setting: Setting, wavelengthNm: number, s: number, t: number): { x: number; y: number; distanceMm: number } | null {
  const bundle = launch(setting, 1, { s, t, a: Float64Array.of(0), b: Float64Array.of(0) });
  if (traceBundle(setting.mount, setting.grating, setting.image, wavelengthNm, bundle) !== 1) return null;
  const { point, xAxis, yAxis } = setting.image;
  const crossing = add3(point, add3(scale3(xAxis, bundle.x[0]!), scale3(yAxis, bundle.y[0]!)));
  const distanceMm = norm3(sub3(crossing, v3(bundle.ox[0]!, bundle.oy[0]!, bundle.oz[0]!)));
  return { x: bundle.x[0]!, y: bundle.y[0]!, distanceMm };
}

/**
 * The image plane: normal to the centre wavelength's chief ray off the camera, at the camera's
 * tangential focus `(R/2) cos θ₂` from it; x toward longer wavelengths, y toward the image of the
 * slit's top. Null when the centre wavelength cannot be traced.
 */
function imagePlaneOf(mount: Mount, grating: GratingSurface, centreNm: number): ImagePlane | null {
  const { slitCentre, pupilCentre } = mount.launch;
  const chief = traceChief(mount, grating, centreNm, slitCentre, pupilCentre);
  if (!chief) return null;
  const normal = unit3(chief.direction);
  const distance = (mount.camera.radiusMm / 2) * Math.cos(chief.cameraIncidenceRad);
  const point = add3(chief.cameraHit, scale3(normal, distance));
  let xAxis = unit3(cross3(v3(0, 0, 1), normal));
  let yAxis = cross3(normal, xAxis);
  const plane = (): ImagePlane => ({ point, normal, xAxis, yAxis });
  const probe: Setting = { mount, grating, image: plane(), curve: () => 0 };
  const dλ = centreNm * 1e-4;
  const longer = chiefXY(probe, centreNm + dλ, 0, 0);
  const shorter = chiefXY(probe, centreNm - dλ, 0, 0);
  if (longer && shorter && longer.x < shorter.x) xAxis = scale3(xAxis, -1);
  yAxis = cross3(normal, xAxis);
  const top = chiefXY({ ...probe, image: plane() }, centreNm, 0, mount.launch.slitHeightMm / 2);
  if (top && top.y < 0) yAxis = scale3(yAxis, -1);
  return plane();
}

function spotOf(bundle: RayBundle, role: SlitHeightRole, slitHeightMm: number): Spot {
  const m = spotMoments(bundle);
  const n = m.n;
  const x = new Float64Array(n);
  const y = new Float64Array(n);
  let k = 0;
  for (let i = 0; i < bundle.count; i++) {
    if (bundle.fate[i] !== FATE.arrived) continue;
    x[k] = bundle.x[i]!;
    y[k] = bundle.y[i]!;
    k++;
  }
  return {
    role,
    slitHeightMm,
    x,
    y,
    centroidMm: { x: m.meanX, y: m.meanY },
    rmsWidthMm: m.rmsX,
    rmsHeightMm: m.rmsY,
    comaSkew: m.rmsXAtFocus > 0 ? m.thirdX / m.rmsXAtFocus ** 3 : 0,
    comaMm: Math.cbrt(m.thirdX),
    raysLaunched: bundle.count,
    raysVignetted: bundle.count - n,
  };
}

/** A wavelength that cannot be traced: marked, with nothing measured. */
function unreachable(wavelengthNm: number, role: TracedWavelength['role'], slitLimitedFwhmNm: number): TracedWavelength {
  const empty = new Float64Array(0);
  return {
    wavelengthNm,
    role,
    reachable: false,
    spots: [],
    raysLaunched: 0,
    raysTraced: 0,
    raysVignetted: 0,
    centroidMm: { x: 0, y: 0 },
    rmsWidthMm: 0,
    rmsHeightMm: 0,
    lineShape: { offsetNm: empty, traced: empty, closedForm: empty },
    tracedFwhmNm: null,
    slitLimitedFwhmNm,
    curvatureSagittaMm: 0,
    tracedLinearDispersionMmPerNm: 0,
    cameraToImageMm: 0,
    bestFocusShiftMm: 0,
    tangentialFocusShiftMm: 0,
    sagittalFocusShiftMm: 0,
    astigmatismMm: 0,
    throughFocus: { shiftMm: empty, rmsWidthMm: empty },
  };
}

/**
 * The whole entrance slit (width × height, Halton-spread) traced at one wavelength, the traced
 * dispersion from chief rays at λ ± 10⁻⁵λ through the same setting, and the traced line shape
 * with its FWHM against the solver's trapezoid.
 */
function wholeSlit(design: Design, setting: Setting, wavelengthNm: number, rays: number, closedForm: SlitFunction) {
  const w = setting.mount.launch.slitWidthMm;
  const h = setting.mount.launch.slitHeightMm;
  const whole = launch(setting, rays, {
    s: halton(rays, 5).map((u) => u * w),
    t: halton(rays, 7).map((u) => u * h),
    a: halton(rays, 2),
    b: halton(rays, 3),
  });
  const arrived = traceBundle(setting.mount, setting.grating, setting.image, wavelengthNm, whole);
  const xs = new Float64Array(arrived);
  for (let i = 0, k = 0; i < whole.count; i++) if (whole.fate[i] === FATE.arrived) xs[k++] = whole.x[i]!;
  const dλ = wavelengthNm * 1e-5;
  const up = chiefXY(setting, wavelengthNm + dλ, 0, 0);
  const down = chiefXY(setting, wavelengthNm - dλ, 0, 0);
  const dispersion = up && down ? (up.x - down.x) / (2 * dλ) : 0;
  const exitWidthMm = design.slits.exitWidthUm / UM_PER_MM;
  const empty = new Float64Array(0);
  const { lineShape, fwhmNm } =
    dispersion !== 0 && arrived > 0
      ? tracedLineShape(xs, exitWidthMm, dispersion, closedForm)
      : { lineShape: { offsetNm: empty, traced: empty, closedForm: empty }, fwhmNm: null };
  return { whole, arrived, dispersion, lineShape, fwhmNm };
}

function traceWavelength(
  design: Design,
  setting: Setting,
  wavelengthNm: number,
  role: TracedWavelength['role'],
  rays: number,
): TracedWavelength {
  const point = evaluatePoint(prepareDesign(design), wavelengthNm);
  const slitLimitedFwhmNm = point.bandpassNm ?? 0;
  const chief = chiefXY(setting, wavelengthNm, 0, 0);
  if (!chief || !point.slitFunction) return unreachable(wavelengthNm, role, slitLimitedFwhmNm);

  // Spots: a point at the slit's centre line, at its middle and both ends.
  const h = setting.mount.launch.slitHeightMm;
  const spotRays = Math.max(50, Math.round(rays / 4));
  const heights: [SlitHeightRole, number][] = [
    ['centre', 0],
    ['top', h / 2],
    ['bottom', -h / 2],
  ];
  let centreMoments: ReturnType<typeof spotMoments> | null = null;
  const spots = heights.map(([spotRole, t]) => {
    const bundle = launch(setting, spotRays, pointSource(spotRays, 0, t));
    traceBundle(setting.mount, setting.grating, setting.image, wavelengthNm, bundle);
    if (spotRole === 'centre') centreMoments = spotMoments(bundle);
    return spotOf(bundle, spotRole, t);
  });
  const centre = centreMoments as ReturnType<typeof spotMoments> | null;

  const { whole, arrived, dispersion, lineShape, fwhmNm } = wholeSlit(design, setting, wavelengthNm, rays, point.slitFunction);
  const wholeMoments = spotMoments(whole);

  const [mid, top, bottom] = spots as [Spot, Spot, Spot];
  const sagitta = top.raysLaunched > top.raysVignetted && bottom.raysLaunched > bottom.raysVignetted
    ? (top.centroidMm.x + bottom.centroidMm.x) / 2 - mid.centroidMm.x
    : 0;
  const tangential = centre?.focusShiftX ?? 0;
  const sagittal = centre?.focusShiftY ?? 0;
  // Through focus about the tangential focus, out to where the width has grown to twice its least
  // (|s − s*| = √3 · r₀ / σ(x′), r₀ the least width, σ(x′) the spread of slopes) three times over,
  // and always reaching the image plane itself (shift 0).
  const grow = centre && centre.varSlopeX > 0 ? (3 * Math.sqrt(3) * centre.rmsXAtFocus) / Math.sqrt(centre.varSlopeX) : 0;
  const reach = Math.max(grow, 1e-4 * setting.mount.camera.radiusMm);
  const from = Math.min(0, tangential - reach);
  const to = Math.max(0, tangential + reach);
  const shiftMm = new Float64Array(FOCUS_SAMPLES);
  const rmsWidthMm = new Float64Array(FOCUS_SAMPLES);
  for (let k = 0; k < FOCUS_SAMPLES; k++) {
    shiftMm[k] = from + ((to - from) * k) / (FOCUS_SAMPLES - 1);
    rmsWidthMm[k] = centre ? rmsWidthAt(centre, shiftMm[k]!) : 0;
  }
  return {
    wavelengthNm,
    role,
    reachable: true,
    spots,
    raysLaunched: whole.count,
    raysTraced: arrived,
    raysVignetted: whole.count - arrived,
    centroidMm: { x: wholeMoments.meanX, y: wholeMoments.meanY },
    rmsWidthMm: mid.rmsWidthMm,
    rmsHeightMm: mid.rmsHeightMm,
    lineShape,
    tracedFwhmNm: fwhmNm,
    slitLimitedFwhmNm,
    curvatureSagittaMm: sagitta,
    tracedLinearDispersionMmPerNm: dispersion,
    cameraToImageMm: chief.distanceMm,
    bestFocusShiftMm: tangential,
    tangentialFocusShiftMm: tangential,
    sagittalFocusShiftMm: sagittal,
    astigmatismMm: sagittal - tangential,
    throughFocus: { shiftMm, rmsWidthMm },
  };
}

/** The wavelengths to trace: the range's start, centre and end, then those asked for, in order, no repeats. */
export function traceWavelengths(design: Design, atNm: readonly number[] = []): { wavelengthNm: number; role: TracedWavelength['role'] }[] {
  const { startNm, endNm } = design.range;
  const list: { wavelengthNm: number; role: TracedWavelength['role'] }[] = [
    { wavelengthNm: startNm, role: 'start' },
    { wavelengthNm: (startNm + endNm) / 2, role: 'centre' },
    { wavelengthNm: endNm, role: 'end' },
  ];
  for (const nm of atNm.slice(0, TRACE_LIMITS.maxWavelengths)) {
    if (!list.some((w) => Math.abs(w.wavelengthNm - nm) < 1e-9)) list.push({ wavelengthNm: nm, role: 'asked' });
  }
  return list.sort((a, b) => a.wavelengthNm - b.wavelengthNm);
}

/**
 * The straightening curve: the entrance slit bent so its image's bow at the centre wavelength is
 * undone. The image bows by `c (2t/h)²` at slit height t; a slit point moved across by `u` moves
 * its image by `M u` (M the traced width magnification, signed), so each point moves by
 * `−c (2t/h)² / M`: a parabola of radius `(h/2)² M / (2c)` in magnitude.
 */
function straightening(setting: Setting, centreNm: number, sagittaMm: number): { radiusMm: number | null; curve: (t: number) => number } {
  const h = setting.mount.launch.slitHeightMm;
  const eps = Math.max(1e-4, setting.mount.launch.slitWidthMm / 4);
  const plus = chiefXY(setting, centreNm, eps, 0);
  const minus = chiefXY(setting, centreNm, -eps, 0);
  const magnification = plus && minus ? (plus.x - minus.x) / (2 * eps) : 0;
  if (Math.abs(sagittaMm) < STRAIGHT_ENOUGH_MM || magnification === 0 || h <= 0) return { radiusMm: null, curve: () => 0 };
  const k = -sagittaMm / magnification;
  return {
    radiusMm: ((h / 2) ** 2) / (2 * Math.abs(k)),
    curve: (t: number) => k * ((2 * t) / h) ** 2,
  };
}

/** Wavelengths spread over the detector at the centre setting (inside the range) for its tilt. */
const TILT_SAMPLES = 5;

/**
 * The flat detector's best tilt: the grating at the range centre, point sources at the slit's
 * centre at five wavelengths spread over the detector (inside the range), and the least-squares
 * line through their tangential foci against their x.
 */
function detectorTiltOf(design: Design, coverage: Prepared['detector'], setting: Setting, rays: number): DetectorTilt | null {
  if (!coverage) return null;
  const lo = Math.max(design.range.startNm, coverage.startNm ?? design.range.startNm);
  const hi = Math.min(design.range.endNm, coverage.endNm ?? design.range.endNm);
  if (!(hi > lo)) return null;
  const spotRays = Math.max(50, Math.round(rays / 4));
  const pts: { x: number; moments: ReturnType<typeof spotMoments> }[] = [];
  for (let k = 0; k < TILT_SAMPLES; k++) {
    const nm = lo + ((hi - lo) * (k + 0.5)) / TILT_SAMPLES;
    const bundle = launch(setting, spotRays, pointSource(spotRays, 0, 0));
    traceBundle(setting.mount, setting.grating, setting.image, nm, bundle);
    const moments = spotMoments(bundle);
    if (moments.n > 0) pts.push({ x: moments.meanX, moments });
  }
  if (pts.length < 2) return null;
  const xs = pts.map((p) => p.x);
  const zs = pts.map((p) => p.moments.focusShiftX);
  const n = xs.length;
  const mx = xs.reduce((a, b) => a + b, 0) / n;
  const mz = zs.reduce((a, b) => a + b, 0) / n;
  let sxx = 0;
  let sxz = 0;
  for (let i = 0; i < n; i++) {
    sxx += (xs[i]! - mx) ** 2;
    sxz += (xs[i]! - mx) * (zs[i]! - mz);
  }
  if (sxx === 0) return null;
  const slope = sxz / sxx;
  const flat = pts.reduce((sum, p) => sum + rmsWidthAt(p.moments, 0), 0) / n;
  const tilted = pts.reduce((sum, p, i) => sum + rmsWidthAt(p.moments, mz + slope * (xs[i]! - mx)), 0) / n;
  return {
    bestTiltDeg: (Math.atan(slope) * 180) / Math.PI,
    rmsWidthFlatMm: flat,
    rmsWidthTiltedMm: tilted,
    gain: flat > 0 ? 1 - tilted / flat : 0,
  };
}

/** What every trace of one design shares: its mount, mode, the grating at the centre and the image plane. */
interface Prepared {
  mount: Mount;
  mode: TraceReport['mode'];
  centreNm: number;
  /** Null when the centre wavelength cannot be traced (then nothing can be). */
  straight: Setting | null;
  detector: ReturnType<typeof summarizeDesign>['detector'];
}

function prepare(design: Design): Prepared {
  const mount = buildMount(design);
  const centreNm = (design.range.startNm + design.range.endNm) / 2;
  const detector = summarizeDesign(design).detector;
  // A detector that holds the whole range at one setting makes a spectrograph: the grating stays
  // at the range centre. Otherwise the grating turns to each wavelength, as a scanning instrument's does.
  const mode: TraceReport['mode'] = detector?.coversRange ? 'spectrograph' : 'monochromator';
  const centreGrating = gratingAt(design, centreNm);
  const image = centreGrating ? imagePlaneOf(mount, centreGrating, centreNm) : null;
  const straight = centreGrating && image ? { mount, grating: centreGrating, image, curve: () => 0 } : null;
  return { mount, mode, centreNm, straight, detector };
}

/** The setting a wavelength is traced with: the grating turned to it (monochromator) or at the centre. */
function settingFor(design: Design, prepared: Prepared, straight: Setting, wavelengthNm: number, curve: (t: number) => number): Setting | null {
  const grating = prepared.mode === 'monochromator' ? gratingAt(design, wavelengthNm) : straight.grating;
  return grating ? { ...straight, grating, curve } : null;
}

/**
 * Only the traced FWHM at each of `wavelengthsNm` (with the slit-limited one beside it), for a
 * requirement judged on the traced bandpass: the same whole-slit rays as `traceDesign` at the same
 * ray count (so the same figure the card shows), without the spots, foci or detector tilt.
 */
export function tracedBandpasses(
  design: Design,
  wavelengthsNm: readonly number[],
  rays: number = TRACE_LIMITS.defaultRays,
): { wavelengthNm: number; reachable: boolean; fwhmNm: number | null; slitLimitedNm: number | null }[] {
  const count = clampRays(rays);
  const prepared = prepare(design);
  const plan = prepareDesign(design);
  return wavelengthsNm.map((wavelengthNm) => {
    const point = evaluatePoint(plan, wavelengthNm);
    const slitLimitedNm = point.bandpassNm;
    const setting = prepared.straight && settingFor(design, prepared, prepared.straight, wavelengthNm, () => 0);
    if (!setting || !point.slitFunction || !chiefXY(setting, wavelengthNm, 0, 0)) {
      return { wavelengthNm, reachable: false, fwhmNm: null, slitLimitedNm };
    }
    const { fwhmNm } = wholeSlit(design, setting, wavelengthNm, count, point.slitFunction);
    return { wavelengthNm, reachable: true, fwhmNm, slitLimitedNm };
  });
}

function clampRays(rays: number | undefined): number {
  return Math.min(TRACE_LIMITS.maxRays, Math.max(TRACE_LIMITS.minRays, Math.round(rays ?? TRACE_LIMITS.defaultRays)));
}

/**
 * Traces `design` at its range's start, centre and end and at `options.atNm`. Never throws on a
 * schema-valid design: a wavelength that cannot be traced is marked unreachable.
 */
export function traceDesign(design: Design, options: TraceOptions = {}): TraceReport {
  const rays = clampRays(options.rays);
  const prepared = prepare(design);
  const { mount, mode, centreNm, straight } = prepared;
  const wanted = traceWavelengths(design, options.atNm);
  const exitSlit = { widthMm: design.slits.exitWidthUm / UM_PER_MM, heightMm: design.slits.heightMm };
  const pixel = design.detector ? { widthMm: design.detector.pixelPitchUm / UM_PER_MM } : null;
  const base = {
    imagePlane:
      mount.kind === 'littrow'
        ? 'normal to the centre wavelength’s chief ray, at the mirror’s tangential focus (R/2)·cos θ below the grating'
        : 'normal to the centre wavelength’s chief ray, at the camera’s tangential focus f₂·cos θ₂',
    mode,
    raysPerWavelength: rays,
    exitSlit,
    pixel,
  };
  const plan = prepareDesign(design);
  const slitLimited = (nm: number) => evaluatePoint(plan, nm).bandpassNm ?? 0;
  if (!straight) {
    return {
      ...base,
      wavelengths: wanted.map((w) => unreachable(w.wavelengthNm, w.role, slitLimited(w.wavelengthNm))),
      straighteningRadiusMm: null,
      curvedEntrance: false,
      detectorTilt: null,
    };
  }
  // The centre's bow, from two point sources at the slit's ends, sets the straightening curve.
  const h = mount.launch.slitHeightMm;
  const topX = chiefXY(straight, centreNm, 0, h / 2);
  const bottomX = chiefXY(straight, centreNm, 0, -h / 2);
  const midX = chiefXY(straight, centreNm, 0, 0);
  const chiefSagitta = topX && bottomX && midX ? (topX.x + bottomX.x) / 2 - midX.x : 0;
  const { radiusMm, curve } = straightening(straight, centreNm, chiefSagitta);
  const curvedEntrance = options.curvedEntrance === true && radiusMm !== null;

  const traced = wanted.map(({ wavelengthNm, role }) => {
    const setting = settingFor(design, prepared, straight, wavelengthNm, curvedEntrance ? curve : () => 0);
    return setting ? traceWavelength(design, setting, wavelengthNm, role, rays) : unreachable(wavelengthNm, role, slitLimited(wavelengthNm));
  });
  return {
    ...base,
    wavelengths: traced,
    straighteningRadiusMm: radiusMm,
    curvedEntrance,
    detectorTilt: design.detector ? detectorTiltOf(design, prepared.detector, straight, rays) : null,
  };
}
