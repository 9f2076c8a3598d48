import { colors } from '../ui/theme';
import { formatDeg } from './sketch-format';
import type { AngleArc, PointMm, SketchGeometry } from './sketch-types';
import { r, type SceneCanvas } from './scene-canvas';
import { SMALL_PX } from './scene-text';
import type { SceneLayer, SketchShape } from './scene-types';

/** Angle arcs, and their values just outside each arc's middle. */
export function angleArcLayer(geometry: SketchGeometry, canvas: SceneCanvas): SceneLayer {
  const shapes: SketchShape[] = [];
  const texts: SketchShape[] = [];
  for (const arc of geometry.arcs) {
    shapes.push({
      type: 'path',
      key: `arc-${arc.label}`,
      d: arcPath(arc, canvas.pt),
      stroke: colors.inkMuted,
      strokeWidth: 1,
    });
    texts.push(arcValue(arc, canvas));
  }
  return { shapes, texts };
}

function arcValue(arc: AngleArc, canvas: SceneCanvas): SketchShape {
  const middle = (arc.fromRad + arc.toRad) / 2;
  const at = {
    x: arc.centre.x + Math.cos(middle) * arc.radiusMm,
    y: arc.centre.y + Math.sin(middle) * arc.radiusMm,
  };
  const [ax, ay] = canvas.px(at);
  const dirX = Math.cos(middle);
  const dirY = -Math.sin(middle);
  return {
    type: 'text',
    key: `arc-label-${arc.label}`,
    x: r(ax + dirX * 6),
    y: r(ay + dirY * 6 + SMALL_PX * 0.35),
    text: `${arc.label} ${formatDeg(arc.valueDeg)}`,
    fontSize: SMALL_PX,
    anchor: dirX > 0.3 ? 'start' : dirX < -0.3 ? 'end' : 'middle',
    fill: colors.primary,
    weight: 'mono',
  };
}

function arcPath(arc: AngleArc, pt: (p: PointMm) => string): string {
  const steps = 20;
  const points: PointMm[] = [];
  for (let i = 0; i <= steps; i++) {
    const a = arc.fromRad + ((arc.toRad - arc.fromRad) * i) / steps;
    points.push({
      x: arc.centre.x + Math.cos(a) * arc.radiusMm,
      y: arc.centre.y + Math.sin(a) * arc.radiusMm,
    });
  }
  return `M${points.map(pt).join('L')}`;
}
