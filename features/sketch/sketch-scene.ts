/**
 * The sketch as a flat list of drawing primitives in pixels: one list that both the on-screen
 * component (react-native-svg) and the saved SVG file draw, so they cannot drift apart. Pure: no
 * React, relative imports only.
 */

import { scaleLinear } from 'd3-scale';
// The theme file is plain constants; the ui index would pull React components into the server.
import { colors } from '../ui/theme';
import {
  formatDeg,
  formatNm,
  scaleBarLengthMm,
  type AngleArc,
  type PointMm,
  type SketchGeometry,
  type SketchOptic,
  type SketchSlit,
} from './geometry';
import { wavelengthStroke } from './wavelength-colour';

export type TextWeight = 'regular' | 'semibold' | 'mono';

export type SketchShape =
  | {
      type: 'path';
      key: string;
      d: string;
      stroke: string;
      strokeWidth: number;
      dash?: string | null;
      fill?: string;
      opacity?: number;
      linecap?: 'round' | 'butt';
      testID?: string;
      /** Extra attributes for tests and tools (`data-<name>` on the web). */
      data?: Record<string, string>;
    }
  | {
      type: 'text';
      key: string;
      x: number;
      y: number;
      text: string;
      fontSize: number;
      anchor: 'start' | 'middle' | 'end';
      fill: string;
      weight: TextWeight;
    };

export interface SketchScene {
  widthPx: number;
  heightPx: number;
  pxPerMm: number;
  scaleBarMm: number;
  shapes: SketchShape[];
}

export interface SceneOptions {
  widthPx: number;
  /** Upper bound on the height; the drawing shrinks to fit (default: 1.1 × width, at most 560). */
  maxHeightPx?: number;
}

const PAD = { top: 34, side: 14, bottom: 30 };
const FOOTER_PX = 26;
const LABEL_PX = 11;
const SMALL_PX = 10;
const LABEL_GAP_PX = 8;
const JAW_PX = 9;

/** Lays the geometry out in `widthPx` and lists what to draw, back to front. */
export function buildSketchScene(geometry: SketchGeometry, options: SceneOptions): SketchScene {
  const widthPx = Math.max(160, options.widthPx);
  const maxHeightPx = options.maxHeightPx ?? Math.min(560, Math.round(widthPx * 1.1));
  const { minX, minY, maxX, maxY } = geometry.bounds;
  const spanX = Math.max(maxX - minX, 1e-6);
  const spanY = Math.max(maxY - minY, 1e-6);
  const innerW = widthPx - 2 * PAD.side;
  const innerH = Math.max(60, maxHeightPx - PAD.top - PAD.bottom - FOOTER_PX);
  const k = Math.min(innerW / spanX, innerH / spanY);
  const heightPx = Math.round(spanY * k + PAD.top + PAD.bottom + FOOTER_PX);
  const left = (widthPx - spanX * k) / 2;
  const x = scaleLinear()
    .domain([minX, maxX])
    .range([left, left + spanX * k]);
  const y = scaleLinear()
    .domain([minY, maxY])
    .range([PAD.top + spanY * k, PAD.top]);
  const px = (p: PointMm): [number, number] => [x(p.x), y(p.y)];
  const pt = (p: PointMm) => {
    const [a, b] = px(p);
    return `${r(a)},${r(b)}`;
  };
  const polyline = (points: readonly PointMm[]) => `M${points.map(pt).join('L')}`;

  const shapes: SketchShape[] = [];
  const texts: SketchShape[] = [];

  /** Lines of text beside `outline` (which `anchorMm` is the middle of), clear of it along `directionMm`. */
  const label = (
    key: string,
    anchorMm: PointMm,
    directionMm: PointMm,
    lines: [string, TextWeight][],
    outline: readonly PointMm[] = [],
  ) => {
    let reach = 0;
    for (const p of outline)
      reach = Math.max(reach, (p.x - anchorMm.x) * directionMm.x + (p.y - anchorMm.y) * directionMm.y);
    const [ax, ay] = px({ x: anchorMm.x + directionMm.x * reach, y: anchorMm.y + directionMm.y * reach });
    const dx = directionMm.x;
    const dy = -directionMm.y; // screen y runs down
    const anchor: 'start' | 'middle' | 'end' = dx > 0.45 ? 'start' : dx < -0.45 ? 'end' : 'middle';
    const lineHeight = LABEL_PX + 2;
    const blockHeight = lineHeight * lines.length;
    let tx = ax + dx * LABEL_GAP_PX;
    // Place the block's near edge LABEL_GAP_PX from the anchor, whichever way it points.
    let top =
      dy > 0.45 ? ay + LABEL_GAP_PX : dy < -0.45 ? ay - LABEL_GAP_PX - blockHeight : ay - blockHeight / 2;
    top = Math.min(Math.max(top, 2), heightPx - FOOTER_PX - blockHeight);
    const widest = Math.max(...lines.map(([text, weight]) => textWidthPx(text, LABEL_PX, weight)));
    const leftEdge = anchor === 'start' ? tx : anchor === 'end' ? tx - widest : tx - widest / 2;
    const shift = Math.max(0, 3 - leftEdge) - Math.max(0, leftEdge + widest - (widthPx - 3));
    tx += shift;
    lines.forEach(([text, weight], i) => {
      texts.push({
        type: 'text',
        key: `${key}-${i}`,
        x: r(tx),
        y: r(top + lineHeight * i + LABEL_PX * 0.85),
        text,
        fontSize: weight === 'mono' ? SMALL_PX : LABEL_PX,
        anchor,
        fill: weight === 'mono' ? colors.inkMuted : colors.ink,
        weight,
      });
    });
  };

  // Reference lines first: the bisector (K is measured from it) and the grating normal.
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

  // The arriving light holds every wavelength: one neutral beam up to the grating.
  const entrance = geometry.entrance;
  shapes.push({
    type: 'path',
    key: 'entrance-edges',
    d: `${polyline(entrance.edges[0])}${polyline(entrance.edges[1])}`,
    stroke: colors.inkMuted,
    strokeWidth: 0.9,
    opacity: 0.75,
  });
  shapes.push({
    type: 'path',
    key: 'entrance-chief',
    d: polyline(entrance.chief),
    stroke: colors.inkMuted,
    strokeWidth: 1.5,
    testID: 'sketch-entrance-beam',
  });

  // Diffracted rays from the grating on: edges under chiefs, the set wavelength on top.
  const rays = [...geometry.rays].sort((a, b) => order(a.role) - order(b.role));
  const fromGrating = (points: readonly PointMm[]) => points.slice(entrance.chief.length - 1);
  for (const ray of rays) {
    const { stroke, dash } = wavelengthStroke(ray.wavelengthNm);
    shapes.push({
      type: 'path',
      key: `edges-${ray.role}`,
      d: `${polyline(fromGrating(ray.edges[0]))}${polyline(fromGrating(ray.edges[1]))}`,
      stroke,
      strokeWidth: 0.9,
      dash,
      opacity: 0.75,
    });
  }
  for (const ray of rays) {
    const { stroke, dash } = wavelengthStroke(ray.wavelengthNm);
    shapes.push({
      type: 'path',
      key: `chief-${ray.role}`,
      d: polyline(fromGrating(ray.chief)),
      stroke,
      strokeWidth: 1.7,
      dash,
      testID: `sketch-ray-${ray.role}`,
      data: { 'wavelength-nm': String(ray.wavelengthNm), 'exit-offset-mm': ray.exitOffsetMm.toFixed(3) },
    });
  }

  // Angle arcs and their values.
  for (const arc of geometry.arcs) {
    shapes.push({
      type: 'path',
      key: `arc-${arc.label}`,
      d: arcPath(arc, pt),
      stroke: colors.inkMuted,
      strokeWidth: 1,
    });
    const middle = (arc.fromRad + arc.toRad) / 2;
    const at = {
      x: arc.centre.x + Math.cos(middle) * arc.radiusMm,
      y: arc.centre.y + Math.sin(middle) * arc.radiusMm,
    };
    const [ax, ay] = px(at);
    const dirX = Math.cos(middle);
    const dirY = -Math.sin(middle);
    texts.push({
      type: 'text',
      key: `arc-label-${arc.label}`,
      x: r(ax + dirX * 6),
      y: r(ay + dirY * 6 + SMALL_PX * 0.35),
      text: `${arc.label} ${formatDeg(arc.valueDeg)}`,
      fontSize: SMALL_PX,
      anchor: dirX > 0.3 ? 'start' : dirX < -0.3 ? 'end' : 'middle',
      fill: colors.primary,
      weight: 'mono',
    });
  }

  // Optics.
  const optics: [string, SketchOptic, [string, TextWeight][]][] = [];
  if (geometry.sharedMirror) {
    optics.push([
      'mirror',
      geometry.sharedMirror,
      [
        ['Mirror, used twice', 'semibold'],
        [`f ${mm(geometry.sharedMirror.focalMm)}`, 'mono'],
      ],
    ]);
  } else if (geometry.collimator === geometry.camera) {
    optics.push([
      'lens',
      geometry.collimator,
      [
        ['Lens', 'semibold'],
        [`f ${mm(geometry.collimator.focalMm)}`, 'mono'],
      ],
    ]);
  } else {
    optics.push([
      'collimator',
      geometry.collimator,
      [
        ['Collimator', 'semibold'],
        [`f ${mm(geometry.collimator.focalMm)}`, 'mono'],
      ],
    ]);
    optics.push([
      'camera',
      geometry.camera,
      [
        ['Camera', 'semibold'],
        [`f ${mm(geometry.camera.focalMm)}`, 'mono'],
      ],
    ]);
  }
  for (const [key, optic, lines] of optics) {
    shapes.push(opticShape(key, optic, pt));
    label(key, optic.centre, optic.labelDirection, lines, [optic.a, optic.b, ...optic.controls]);
  }

  // Grating: substrate block, ruled face, and its rotation as data for tests.
  const g = geometry.grating;
  shapes.push({
    type: 'path',
    key: 'grating',
    d: `${polyline([g.face.a, g.face.b, g.back[0], g.back[1]])}Z`,
    stroke: colors.ink,
    strokeWidth: 1,
    fill: colors.surfaceSunken,
    testID: 'sketch-grating',
    data: { 'rotation-deg': geometry.rotationDeg.toFixed(4), 'setting-nm': String(geometry.settingNm) },
  });
  shapes.push({
    type: 'path',
    key: 'grating-face',
    d: polyline([g.face.a, g.face.b]),
    stroke: colors.primary,
    strokeWidth: 2.5,
    linecap: 'butt',
  });
  label(
    'grating',
    { x: 0, y: 0 },
    g.labelDirection,
    [
      ['Grating', 'semibold'],
      [geometry.settingReachable ? `φ ${formatDeg(geometry.rotationDeg)}` : 'no setting', 'mono'],
    ],
    [g.face.a, g.face.b, ...g.back],
  );

  // The exit plane, faint, through the exit slit and every image on it.
  const plane = geometry.exitPlane;
  let lo = 0;
  let hi = 0;
  for (const ray of geometry.rays) {
    lo = Math.min(lo, ray.exitOffsetMm);
    hi = Math.max(hi, ray.exitOffsetMm);
  }
  if (hi - lo > 0) {
    const reach = (s: number) => ({
      x: plane.centre.x + plane.along.x * s,
      y: plane.centre.y + plane.along.y * s,
    });
    const extra = (hi - lo) * 0.05;
    shapes.push({
      type: 'path',
      key: 'exit-plane',
      d: polyline([reach(lo - extra), reach(hi + extra)]),
      stroke: colors.inkFaint,
      strokeWidth: 1,
      dash: '4 3',
      testID: 'sketch-exit-plane',
    });
  }

  // Slits (jaws a visible gap apart, never narrower than 3 px) and the detector.
  shapes.push(slitShape('entrance-slit', geometry.entranceSlit, px, k));
  label('entrance-slit', geometry.entranceSlit.centre, geometry.entranceSlit.labelDirection, [
    ['Entrance slit', 'semibold'],
  ]);
  if (geometry.detector) {
    shapes.push({
      type: 'path',
      key: 'detector',
      d: polyline([geometry.detector.a, geometry.detector.b]),
      stroke: colors.primary,
      strokeWidth: 5,
      linecap: 'butt',
      testID: 'sketch-detector',
    });
    label('detector', geometry.exitSlit.centre, geometry.exitSlit.labelDirection, [['Detector', 'semibold']]);
  } else {
    shapes.push(slitShape('exit-slit', geometry.exitSlit, px, k));
    label('exit-slit', geometry.exitSlit.centre, geometry.exitSlit.labelDirection, [
      ['Exit slit', 'semibold'],
    ]);
  }

  // Footer: scale bar, then the legend of drawn wavelengths.
  const scaleBarMm = scaleBarLengthMm(spanX);
  const barPx = scaleBarMm * k;
  const footerY = heightPx - 14;
  const barX = PAD.side;
  shapes.push({
    type: 'path',
    key: 'scale-bar',
    d: `M${r(barX)},${r(footerY - 4)}V${r(footerY)}H${r(barX + barPx)}V${r(footerY - 4)}`,
    stroke: colors.ink,
    strokeWidth: 1.2,
    testID: 'sketch-scale-bar',
    data: { 'length-mm': String(scaleBarMm) },
  });
  const barText = mm(scaleBarMm);
  texts.push({
    type: 'text',
    key: 'scale-bar-label',
    x: r(barX + barPx + 6),
    y: r(footerY + 3),
    text: barText,
    fontSize: SMALL_PX,
    anchor: 'start',
    fill: colors.ink,
    weight: 'mono',
  });
  let legendX = barX + barPx + 6 + textWidthPx(barText, SMALL_PX, 'mono') + 16;
  let legendY = footerY;
  for (const ray of [...geometry.rays].sort((a, b) => a.wavelengthNm - b.wavelengthNm)) {
    const { stroke, dash } = wavelengthStroke(ray.wavelengthNm);
    const text = formatNm(ray.wavelengthNm);
    const entryWidth = 22 + textWidthPx(text, SMALL_PX, 'mono') + 12;
    if (legendX + entryWidth > widthPx - 4) {
      legendX = widthPx - 4 - entryWidth;
      legendY -= 14;
    }
    shapes.push({
      type: 'path',
      key: `legend-${ray.role}`,
      d: `M${r(legendX)},${r(legendY - 1)}H${r(legendX + 18)}`,
      stroke,
      strokeWidth: 2,
      dash,
    });
    texts.push({
      type: 'text',
      key: `legend-label-${ray.role}`,
      x: r(legendX + 22),
      y: r(legendY + 3),
      text,
      fontSize: SMALL_PX,
      anchor: 'start',
      fill: colors.ink,
      weight: 'mono',
    });
    legendX += entryWidth;
  }

  return { widthPx, heightPx, pxPerMm: k, scaleBarMm, shapes: [...shapes, ...texts] };
}

/** Rough advance width of a label, px: enough to keep labels inside the drawing. */
export function textWidthPx(text: string, fontSize: number, weight: TextWeight): number {
  return text.length * fontSize * (weight === 'mono' ? 0.6 : weight === 'semibold' ? 0.58 : 0.55);
}

function order(role: string): number {
  return role === 'centre' ? 2 : role === 'start' ? 0 : 1;
}

function r(value: number): number {
  return Math.round(value * 10) / 10;
}

function mm(valueMm: number): string {
  const rounded = valueMm >= 100 ? Math.round(valueMm) : Number(valueMm.toPrecision(3));
  return `${rounded} mm`;
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

function opticShape(key: string, optic: SketchOptic, pt: (p: PointMm) => string): SketchShape {
  const [c0, c1] = optic.controls as [PointMm, PointMm | undefined];
  if (optic.kind === 'lens' && c1) {
    return {
      type: 'path',
      key,
      d: `M${pt(optic.a)}Q${pt(c0)} ${pt(optic.b)}Q${pt(c1)} ${pt(optic.a)}Z`,
      stroke: colors.primary,
      strokeWidth: 1.4,
      fill: '#DCE7EA',
      testID: `sketch-${key}`,
    };
  }
  return {
    type: 'path',
    key,
    d: `M${pt(optic.a)}Q${pt(c0)} ${pt(optic.b)}`,
    stroke: colors.ink,
    strokeWidth: 3.5,
    linecap: 'round',
    testID: `sketch-${key}`,
  };
}

function slitShape(
  key: string,
  slit: SketchSlit,
  px: (p: PointMm) => [number, number],
  k: number,
): SketchShape {
  const [cx, cy] = px(slit.centre);
  const ux = slit.along.x;
  const uy = -slit.along.y;
  const half = Math.max(slit.widthMm * k, 3) / 2;
  const jaw = (from: number, to: number) =>
    `M${r(cx + ux * from)},${r(cy + uy * from)}L${r(cx + ux * to)},${r(cy + uy * to)}`;
  return {
    type: 'path',
    key,
    d: `${jaw(half, half + JAW_PX)}${jaw(-half, -half - JAW_PX)}`,
    stroke: colors.ink,
    strokeWidth: 2.5,
    linecap: 'butt',
    testID: `sketch-${key}`,
  };
}
