import { colors } from '../ui/theme';
import { scaleBarLengthMm } from './scale-bar';
import { formatNm } from './sketch-format';
import type { SketchGeometry } from './sketch-types';
import { PAD, r, type SceneCanvas } from './scene-canvas';
import { SMALL_PX, mmLabel, textWidthPx } from './scene-text';
import type { SceneLayer, SketchShape } from './scene-types';
import { wavelengthStroke } from './wavelength-colour';

/** Footer: a scale bar, then the legend of drawn wavelengths, shortest first (wrapping up a line at the edge). */
export function footerLayer(
  geometry: SketchGeometry,
  canvas: SceneCanvas,
): SceneLayer & { scaleBarMm: number } {
  const { widthPx, heightPx, pxPerMm } = canvas;
  const scaleBarMm = scaleBarLengthMm(canvas.spanXMm);
  const barPx = scaleBarMm * pxPerMm;
  const footerY = heightPx - 14;
  const barX = PAD.side;
  const barText = mmLabel(scaleBarMm);
  const shapes: SketchShape[] = [
    {
      type: 'path',
      key: 'scale-bar',
      d: `M${r(barX)},${r(footerY - 4)}V${r(footerY)}H${r(barX + barPx)}V${r(footerY - 4)}`,
      stroke: colors.ink,
      strokeWidth: 1.2,
      testID: 'sketch-scale-bar',
      data: { 'length-mm': String(scaleBarMm) },
    },
  ];
  const texts: SketchShape[] = [footText('scale-bar-label', barX + barPx + 6, footerY + 3, barText)];
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
    texts.push(footText(`legend-label-${ray.role}`, legendX + 22, legendY + 3, text));
    legendX += entryWidth;
  }
  return { shapes, texts, scaleBarMm };
}

function footText(key: string, x: number, y: number, text: string): SketchShape {
  return {
    type: 'text',
    key,
    x: r(x),
    y: r(y),
    text,
    fontSize: SMALL_PX,
    anchor: 'start',
    fill: colors.ink,
    weight: 'mono',
  };
}
