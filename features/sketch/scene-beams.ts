import { colors } from '../ui/theme';
import type { PointMm, RayRole, SketchGeometry } from './sketch-types';
import type { SceneCanvas } from './scene-canvas';
import type { SketchShape } from './scene-types';
import { wavelengthStroke } from './wavelength-colour';

/** Reference lines first: the bisector (K is measured from it) and the grating normal. */
export function referenceLines(geometry: SketchGeometry, { polyline }: SceneCanvas): SketchShape[] {
  const shapes: SketchShape[] = [];
  if (geometry.halfDeviationDeg > 0) {
    shapes.push({
      type: 'path',
      key: 'bisector',
      d: polyline([geometry.bisector.a, geometry.bisector.b]),
      stroke: colors.inkFaint,
      strokeWidth: 0.8,
      dash: '1 4',
    });
  }
  shapes.push({
    type: 'path',
    key: 'normal',
    d: polyline([geometry.grating.normal.a, geometry.grating.normal.b]),
    stroke: colors.inkMuted,
    strokeWidth: 1,
    dash: '2 3',
    testID: 'sketch-normal',
  });
  return shapes;
}

/** The arriving light holds every wavelength: one neutral beam up to the grating. */
export function entranceBeam({ entrance }: SketchGeometry, { polyline }: SceneCanvas): SketchShape[] {
  return [
    {
      type: 'path',
      key: 'entrance-edges',
      d: `${polyline(entrance.edges[0])}${polyline(entrance.edges[1])}`,
      stroke: colors.inkMuted,
      strokeWidth: 0.9,
      opacity: 0.75,
    },
    {
      type: 'path',
      key: 'entrance-chief',
      d: polyline(entrance.chief),
      stroke: colors.inkMuted,
      strokeWidth: 1.5,
      testID: 'sketch-entrance-beam',
    },
  ];
}

/** Diffracted rays from the grating on, in their wavelength's colour: edges under chiefs, the set wavelength on top. */
export function diffractedRays(geometry: SketchGeometry, { polyline }: SceneCanvas): SketchShape[] {
  const rays = [...geometry.rays].sort((a, b) => drawOrder(a.role) - drawOrder(b.role));
  const fromGrating = (points: readonly PointMm[]) => points.slice(geometry.entrance.chief.length - 1);
  const edges = rays.map((ray): SketchShape => {
    const { stroke, dash } = wavelengthStroke(ray.wavelengthNm);
    return {
      type: 'path',
      key: `edges-${ray.role}`,
      d: `${polyline(fromGrating(ray.edges[0]))}${polyline(fromGrating(ray.edges[1]))}`,
      stroke,
      strokeWidth: 0.9,
      dash,
      opacity: 0.75,
    };
  });
  const chiefs = rays.map((ray): SketchShape => {
    const { stroke, dash } = wavelengthStroke(ray.wavelengthNm);
    return {
      type: 'path',
      key: `chief-${ray.role}`,
      d: polyline(fromGrating(ray.chief)),
      stroke,
      strokeWidth: 1.7,
      dash,
      testID: `sketch-ray-${ray.role}`,
      data: { 'wavelength-nm': String(ray.wavelengthNm), 'exit-offset-mm': ray.exitOffsetMm.toFixed(3) },
    };
  });
  return [...edges, ...chiefs];
}

function drawOrder(role: RayRole): number {
  return role === 'centre' ? 2 : role === 'start' ? 0 : 1;
}
