import { formatNumber, formatQuantity } from '../../../shared/format';
import { colors } from '../../../features/ui/theme';
import type { SketchScene } from '../../../features/sketch/sketch-scene';
import { compareSketchScene, printedReduction } from '../compare-scene';
import type { CompareSheetSection } from '../section';
import { drawSketchFigure, sketchFigureHeight, sketchSceneOptions } from '../sketch-pdf';
import { sheetColors, textSize, type SheetWriter } from '../writer';

/** One legend entry: a short line drawn as the overlay draws that version, then its words. */
function legendEntry(writer: SheetWriter, line: { color: string; width: number; dash?: number[] }, text: string): void {
  const { doc } = writer;
  const height = writer.measure(text, 'regular', textSize.body, writer.contentWidth - 36);
  writer.ensureSpace(height + 2);
  const y = writer.y;
  doc.save();
  doc.moveTo(writer.left, y + 5.5).lineTo(writer.left + 26, y + 5.5).lineWidth(line.width).strokeColor(line.color);
  // pdfkit takes the whole pattern as an array (its types say one number).
  if (line.dash) doc.dash(line.dash as unknown as number, {});
  doc.stroke();
  doc.undash();
  doc.restore();
  writer.use('regular', textSize.body).doc.fillColor(sheetColors.ink).text(text, writer.left + 34, y, { width: writer.contentWidth - 36 });
  writer.y = y + height + 2;
}

/**
 * Points per scene pixel where drawSketchFigure prints `scene`: the framed figure grows by that
 * much for every pixel of the scene's height (its frame and padding are the same at any height).
 */
function figurePtPerPx(writer: SheetWriter, scene: SketchScene): number {
  return (sketchFigureHeight(writer, scene) - sketchFigureHeight(writer, { widthPx: scene.widthPx, heightPx: 0 })) / scene.heightPx;
}

/** Both versions' ray sketches on one drawing at one scale, the earlier beneath the later, as on the compare screen. */
export const compareSketchSection: CompareSheetSection = {
  id: 'compare-sketch',
  title: 'Sketches at one scale',
  draw(writer, sheet) {
    const { a, b } = sheet;
    const options = sketchSceneOptions(writer);
    const scene = compareSketchScene(a.params, b.params, options);
    const legend = [
      `v${a.version.number} (before): dashed grey, beneath, without labels — ${a.version.message}`,
      `v${b.version.number} (after): on top, in colour, with its labels — ${b.version.message}`,
    ];
    const legendHeight = legend.reduce((sum, text) => sum + writer.measure(text, 'regular', textSize.body, writer.contentWidth - 36) + 2, 0);
    // The heading, the legend and the drawing stay on one page.
    writer.sectionHeading(this.title, legendHeight + 6 + sketchFigureHeight(writer, scene));
    legendEntry(writer, { color: colors.inkFaint, width: 1.5, dash: [5, 4] }, legend[0]!);
    legendEntry(writer, { color: colors.ink, width: 1.5 }, legend[1]!);
    writer.gap(4);
    drawSketchFigure(writer, scene, 30);
    const reduction = printedReduction(scene, figurePtPerPx(writer, scene));
    writer.gap(5);
    writer.paragraph(
      `One scale for both: 1 : ${formatNumber(reduction, 3)} as printed (1 mm on paper is ${formatNumber(reduction, 3)} mm of the instrument); ` +
        `the bar in the drawing's corner is ${formatQuantity(scene.scaleBarMm, 'mm')}. Each grating is turned to the centre of its own range.`,
      { size: textSize.small, color: sheetColors.muted },
    );
  },
};
