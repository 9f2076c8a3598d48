/**
 * Ray-trace benchmark: 100,000 rays through a Czerny–Turner (collimator sphere, plane grating,
 * camera sphere, image plane) with the product's `traceBundle`, beside a bare structure-of-arrays
 * loop doing the same vector maths without apertures, bookkeeping or results; then one whole
 * `traceDesign` at the workbench's default ray count, which is what an edit waits for.
 * Prints figures only; run with `npm run bench:trace`.
 */

import { traceDesign } from '../features/trace';
import { buildMount, gratingAt } from '../features/trace/optical-system';
import { allocateBundle, traceBundle, type RayBundle } from '../features/trace/trace-bundle';
import { exampleDesign } from '../shared/design';
import { writeFigures } from './figures';

const RAYS = 100_000;
const WARMUP_RUNS = 20;
const TIMED_RUNS = 60;

function median(values: number[]): number {
  const sorted = [...values].sort((a, b) => a - b);
  const mid = sorted.length >> 1;
  return sorted.length % 2 ? sorted[mid]! : (sorted[mid - 1]! + sorted[mid]!) / 2;
}

const design = { ...exampleDesign, detector: undefined };
const mount = buildMount(design);
const centreNm = (design.range.startNm + design.range.endNm) / 2;
const grating = gratingAt(design, centreNm)!;
const report = traceDesign(design, { rays: 1000 });
void report;
// The image plane as the product sets it: recover it by tracing once (traceDesign keeps it private);
// a plane normal to the camera's axis through its centre of curvature stands in, as the same maths.
const image = { point: mount.camera.centre, normal: mount.camera.axis, xAxis: { x: 1, y: 0, z: 0 }, yAxis: { x: 0, y: 1, z: 0 } };

/** Rays from across the slit toward the collimator's aperture (a fixed pseudo-random fan). */
function fill(bundle: RayBundle): void {
  const { slitCentre, slitAcross, pupilCentre, pupilAcross } = mount.launch;
  let seed = 12345;
  const rand = () => ((seed = (seed * 1103515245 + 12345) & 0x7fffffff) / 0x7fffffff) - 0.5;
  for (let i = 0; i < bundle.count; i++) {
    const s = rand() * 0.1;
    const t = rand() * design.slits.heightMm;
    const a = rand() * design.grating.ruledWidthMm * 0.8;
    const b = rand() * design.grating.ruledHeightMm * 0.9;
    const ox = slitCentre.x + s * slitAcross.x;
    const oy = slitCentre.y + s * slitAcross.y;
    const oz = t;
    const ex = pupilCentre.x + a * pupilAcross.x - ox;
    const ey = pupilCentre.y + a * pupilAcross.y - oy;
    const ez = b - oz;
    const k = 1 / Math.hypot(ex, ey, ez);
    bundle.ox[i] = ox;
    bundle.oy[i] = oy;
    bundle.oz[i] = oz;
    bundle.dx[i] = ex * k;
    bundle.dy[i] = ey * k;
    bundle.dz[i] = ez * k;
  }
}

/**
 * The floor: the same intersections, reflections and grating kick on the same arrays, with no
 * aperture checks, fates or image-plane axes. Not checked against the trace; it is here because
 * this machine's speed drifts, so `trace / floor` is the figure to compare between runs.
 */
function bareLoop(ox: Float64Array, oy: Float64Array, oz: Float64Array, dx: Float64Array, dy: Float64Array, dz: Float64Array): number {
  const c1 = mount.collimator.centre;
  const r1 = mount.collimator.radiusMm;
  const c2 = mount.camera.centre;
  const r2 = mount.camera.radiusMm;
  const n = grating.normal;
  const tg = grating.tangent;
  const kick = (grating.order * centreNm) / grating.spacingNm;
  let sum = 0;
  for (let i = 0; i < ox.length; i++) {
    let px = ox[i]!, py = oy[i]!, pz = oz[i]!, ux = dx[i]!, uy = dy[i]!, uz = dz[i]!;
    for (const [c, r, grate] of [[c1, r1, true], [c2, r2, false]] as const) {
      const qx = px - c.x, qy = py - c.y, qz = pz - c.z;
      const b = qx * ux + qy * uy + qz * uz;
      const t = -b + Math.sqrt(b * b - (qx * qx + qy * qy + qz * qz - r * r));
      px += t * ux; py += t * uy; pz += t * uz;
      const nx = (c.x - px) / r, ny = (c.y - py) / r, nz = (c.z - pz) / r;
      const dn = ux * nx + uy * ny + uz * nz;
      ux -= 2 * dn * nx; uy -= 2 * dn * ny; uz -= 2 * dn * nz;
      if (grate) {
        const t2 = -(px * n.x + py * n.y) / (ux * n.x + uy * n.y);
        px += t2 * ux; py += t2 * uy; pz += t2 * uz;
        const dt = ux * tg.x + uy * tg.y + kick;
        const dnOut = Math.sqrt(Math.max(0, 1 - dt * dt - uz * uz));
        ux = dt * tg.x + dnOut * n.x; uy = dt * tg.y + dnOut * n.y;
      }
    }
    const w = image.normal;
    const t3 = ((image.point.x - px) * w.x + (image.point.y - py) * w.y + (image.point.z - pz) * w.z) / (ux * w.x + uy * w.y + uz * w.z);
    sum += px + t3 * ux + py + t3 * uy;
  }
  return sum;
}

const bundle = allocateBundle(RAYS);
const template = allocateBundle(RAYS);
fill(template);
const reset = () => {
  bundle.ox.set(template.ox);
  bundle.oy.set(template.oy);
  bundle.oz.set(template.oz);
  bundle.dx.set(template.dx);
  bundle.dy.set(template.dy);
  bundle.dz.set(template.dz);
};

let sink = 0;
const traceTimes: number[] = [];
const bareTimes: number[] = [];
for (let run = 0; run < WARMUP_RUNS + TIMED_RUNS; run++) {
  reset();
  let t0 = performance.now();
  sink += traceBundle(mount, grating, image, centreNm, bundle);
  let t1 = performance.now();
  if (run >= WARMUP_RUNS) traceTimes.push(t1 - t0);
  t0 = performance.now();
  sink += bareLoop(template.ox, template.oy, template.oz, template.dx, template.dy, template.dz);
  t1 = performance.now();
  if (run >= WARMUP_RUNS) bareTimes.push(t1 - t0);
}
reset();
const arrived = traceBundle(mount, grating, image, centreNm, bundle);

const wholeTimes: number[] = [];
for (let run = 0; run < 40; run++) {
  const t0 = performance.now();
  const r = traceDesign(exampleDesign);
  const t1 = performance.now();
  sink += r.wavelengths.length;
  if (run >= 10) wholeTimes.push(t1 - t0);
}

const trace = median(traceTimes);
const bare = median(bareTimes);
console.log(`trace ${RAYS.toLocaleString('en')} rays (Czerny–Turner, 3 surfaces + image plane): median ${trace.toFixed(2)} ms (${arrived} arrived)`);
console.log(`bare structure-of-arrays loop, same maths:              median ${bare.toFixed(2)} ms`);
console.log(`trace / bare: ${(trace / bare).toFixed(2)}×   (targets: ≤ 15 ms, ≤ 2×)`);
console.log(`whole traceDesign (3 wavelengths × ${'default'} rays, spots, line shape, foci): median ${median(wholeTimes).toFixed(1)} ms`);
writeFigures('trace', { rays: RAYS, arrived, traceMs: trace, bareMs: bare, ratio: trace / bare, traceDesignMs: median(wholeTimes) });
if (sink === 42) console.log('');
