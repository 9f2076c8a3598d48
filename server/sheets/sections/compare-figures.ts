import type { CompareSheetSection } from '../section';

/** PLACEHOLDER until its owner fills it in: prints the heading only. */
export const compareFiguresSection: CompareSheetSection = {
  id: 'compare-figures',
  title: 'Figure changes',
  draw(writer) {
    writer.sectionHeading(this.title);
  },
};
