import type { SheetSection } from '../section';

/** PLACEHOLDER until its owner fills it in: prints the heading only. */
export const performanceSection: SheetSection = {
  id: 'performance',
  title: 'Performance across the range',
  draw(writer) {
    writer.sectionHeading(this.title);
  },
};
