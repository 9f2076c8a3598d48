import { scaleLinear } from 'd3-scale';
import type { PointMm, SketchGeometry } from './sketch-types';
import type { SceneOptions } from './scene-types';

export const PAD = { top: 34, side: 14, bottom: 30 };
export const FOOTER_PX = 26;

/** The drawing's size in pixels and the millimetre → pixel mapping (screen y runs down). */
export interface SceneCanvas {
  widthPx: number;
  heightPx: number;
  pxPerMm: number;
  spanXMm: number;
  px: (p: PointMm) => [number, number];
  /** `x,y` in pixels, rounded for the path text. */
  pt: (p: PointMm) => string;
  polyline: (points: readonly PointMm[]) => string;
}

/** Fits the geometry's bounds into `widthPx` and at most `maxHeightPx`, at one scale for x and y. */
export function sceneCanvas(geometry: SketchGeometry, options: SceneOptions): SceneCanvas {
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
  return { widthPx, heightPx, pxPerMm: k, spanXMm: spanX, px, pt, polyline };
}

/** Pixels to one decimal: enough for a sharp line, short in the SVG text. */
export function r(value: number): number {
  return Math.round(value * 10) / 10;
}
