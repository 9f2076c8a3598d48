import type { SheetSection } from '../section';

/** PLACEHOLDER until its owner fills it in: prints the heading only. */
export const titleSection: SheetSection = {
  id: 'title',
  title: 'Design sheet',
  draw(writer) {
    writer.sectionHeading(this.title);
  },
};
