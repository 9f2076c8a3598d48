import type { CompareSheetSection } from '../section';

/** PLACEHOLDER until its owner fills it in: prints the heading only. */
export const compareSketchSection: CompareSheetSection = {
  id: 'compare-sketch',
  title: 'Sketches at one scale',
  draw(writer) {
    writer.sectionHeading(this.title);
  },
};
