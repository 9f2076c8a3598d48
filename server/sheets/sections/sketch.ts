import type { SheetSection } from '../section';

/** PLACEHOLDER until its owner fills it in: prints the heading only. */
export const sketchSection: SheetSection = {
  id: 'sketch',
  title: 'Ray sketch',
  draw(writer) {
    writer.sectionHeading(this.title);
  },
};
