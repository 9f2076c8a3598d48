import type { CompareSheetSection } from '../section';

/** PLACEHOLDER until its owner fills it in: prints the heading only. */
export const compareTitleSection: CompareSheetSection = {
  id: 'compare-title',
  title: 'Compare sheet',
  draw(writer) {
    writer.sectionHeading(this.title);
  },
};
