import { sketchGeometry } from '../../../features/sketch/geometry';
import { buildSketchScene } from '../../../features/sketch/sketch-scene';
import type { SheetSection } from '../section';
import { drawSketchFigure, sketchFigureHeight, sketchSceneOptions, sketchWords } from '../sketch-pdf';
import { sheetColors, textSize } from '../writer';

/**
 * The to-scale top view, drawn from the same scene the app's sketch and its saved SVG draw (the
 * scale bar and the wavelength legend are part of it), then its description and notes.
 */
export const sketchSection: SheetSection = {
  id: 'sketch',
  title: 'Ray sketch',
  draw(writer, sheet) {
    const geometry = sketchGeometry(sheet.params);
    const scene = buildSketchScene(geometry, sketchSceneOptions(writer));
    const { description, notes } = sketchWords(geometry, sheet.params);
    // The heading, the drawing and its description stay on one page.
    const keepWith = writer.measure(description, 'regular', textSize.body) + 6;
    writer.sectionHeading(this.title, sketchFigureHeight(writer, scene) + keepWith);
    drawSketchFigure(writer, scene, keepWith);
    writer.gap(5);
    writer.paragraph(description);
    for (const note of notes)
      writer.paragraph(note, { size: textSize.small, color: sheetColors.muted, gapAfter: 2 });
  },
};
