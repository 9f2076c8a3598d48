import type { PointMm, SketchGeometry } from './sketch-types';

/** The box around everything drawn: optics, grating, slits, detector and every ray. */
export function sketchBounds(g: Omit<SketchGeometry, 'bounds'>): SketchGeometry['bounds'] {
  let minX = Infinity;
  let minY = Infinity;
  let maxX = -Infinity;
  let maxY = -Infinity;
  const take = (p: PointMm) => {
    if (p.x < minX) minX = p.x;
    if (p.y < minY) minY = p.y;
    if (p.x > maxX) maxX = p.x;
    if (p.y > maxY) maxY = p.y;
  };
  for (const optic of [g.collimator, g.camera, g.sharedMirror]) {
    if (!optic) continue;
    take(optic.a);
    take(optic.b);
    optic.controls.forEach(take);
  }
  take(g.grating.face.a);
  take(g.grating.face.b);
  g.grating.back.forEach(take);
  take(g.grating.normal.b);
  take(g.entranceSlit.centre);
  take(g.exitSlit.centre);
  if (g.detector) {
    take(g.detector.a);
    take(g.detector.b);
  }
  g.entrance.chief.forEach(take);
  g.entrance.edges[0].forEach(take);
  g.entrance.edges[1].forEach(take);
  for (const ray of g.rays) {
    ray.chief.forEach(take);
    ray.edges[0].forEach(take);
    ray.edges[1].forEach(take);
  }
  return { minX, minY, maxX, maxY };
}
