import type { CompareSheetSection } from '../section';

/** PLACEHOLDER until its owner fills it in: prints the heading only. */
export const compareParametersSection: CompareSheetSection = {
  id: 'compare-parameters',
  title: 'Parameters side by side',
  draw(writer) {
    writer.sectionHeading(this.title);
  },
};
