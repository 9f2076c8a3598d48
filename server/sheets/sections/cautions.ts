import type { SheetSection } from '../section';

/** PLACEHOLDER until its owner fills it in: prints the heading only. */
export const cautionsSection: SheetSection = {
  id: 'cautions',
  title: 'Safety cautions',
  draw(writer) {
    writer.sectionHeading(this.title);
  },
};
