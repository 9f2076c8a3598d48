/**
 * The sketch as a standalone SVG document (the same primitives the screen draws), for saving and
 * for the design sheet. Pure: relative imports only, no platform code.
 */

import type { Design } from '../../shared/design';
import { colors } from '../ui/theme';
import { describeSketch, sketchGeometry, type SketchGeometry, type SketchOptions } from './geometry';
import { buildSketchScene, type SketchShape, type TextWeight } from './sketch-scene';

export const SKETCH_FILE_NAME = 'blazebook-sketch.svg';

const FONT_FAMILY: Record<TextWeight, string> = {
  regular: "Inter, 'Helvetica Neue', Arial, sans-serif",
  semibold: "Inter, 'Helvetica Neue', Arial, sans-serif",
  mono: "'IBM Plex Mono', Menlo, Consolas, monospace",
};

export interface SvgFileOptions extends SketchOptions {
  /** Drawing width in px (user units); the height follows the mount's shape. Default 900. */
  widthPx?: number;
  /** Already computed geometry for this design, to skip recomputing it. */
  geometry?: SketchGeometry;
}

/** A complete SVG 1.1 document of the to-scale sketch of `design`, on the paper colour. */
export function sketchSvgDocument(design: Design, options: SvgFileOptions = {}): string {
  const geometry = options.geometry ?? sketchGeometry(design, options);
  const widthPx = options.widthPx ?? 900;
  const scene = buildSketchScene(geometry, { widthPx, maxHeightPx: Math.round(widthPx * 1.2) });
  const title = describeSketch(geometry, design);
  const body = scene.shapes.map(shapeToSvg).join('\n  ');
  const notes = [
    ...geometry.notes,
    ...geometry.unreachable.map((u) => `Not drawn: ${u.wavelengthNm} nm, ${u.reason}.`),
  ];
  return [
    '<?xml version="1.0" encoding="UTF-8"?>',
    `<svg xmlns="http://www.w3.org/2000/svg" version="1.1" width="${scene.widthPx}" height="${scene.heightPx}" viewBox="0 0 ${scene.widthPx} ${scene.heightPx}" role="img" aria-label="${escapeXml(title)}">`,
    `  <title>${escapeXml(title)}</title>`,
    notes.length > 0 ? `  <desc>${escapeXml(notes.join(' '))}</desc>` : null,
    `  <rect x="0" y="0" width="${scene.widthPx}" height="${scene.heightPx}" fill="${colors.paper}"/>`,
    `  ${body}`,
    '</svg>',
    '',
  ]
    .filter((line) => line !== null)
    .join('\n');
}

function shapeToSvg(shape: SketchShape): string {
  if (shape.type === 'text') {
    const weight = shape.weight === 'semibold' ? ' font-weight="600"' : '';
    return `<text x="${shape.x}" y="${shape.y}" font-size="${shape.fontSize}" font-family="${escapeXml(FONT_FAMILY[shape.weight])}"${weight} text-anchor="${shape.anchor}" fill="${shape.fill}">${escapeXml(shape.text)}</text>`;
  }
  const attributes = [
    `d="${shape.d}"`,
    `fill="${shape.fill ?? 'none'}"`,
    `stroke="${shape.stroke}"`,
    `stroke-width="${shape.strokeWidth}"`,
    shape.dash ? `stroke-dasharray="${shape.dash}"` : null,
    shape.opacity !== undefined ? `stroke-opacity="${shape.opacity}"` : null,
    shape.linecap ? `stroke-linecap="${shape.linecap}"` : null,
    'stroke-linejoin="round"',
    shape.testID ? `id="${shape.testID}"` : null,
    ...Object.entries(shape.data ?? {}).map(([name, value]) => `data-${name}="${escapeXml(value)}"`),
  ].filter((a) => a !== null);
  return `<path ${attributes.join(' ')}/>`;
}

export function escapeXml(text: string): string {
  return text.replace(/[&<>"']/g, (c) =>
    c === '&' ? '&amp;' : c === '<' ? '&lt;' : c === '>' ? '&gt;' : c === '"' ? '&quot;' : '&apos;',
  );
}
