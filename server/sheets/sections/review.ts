import type { SheetSection } from '../section';

/** PLACEHOLDER until its owner fills it in: prints the heading only. */
export const reviewSection: SheetSection = {
  id: 'review',
  title: 'Design review',
  draw(writer) {
    writer.sectionHeading(this.title);
  },
};
