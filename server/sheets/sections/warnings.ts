import type { SheetSection } from '../section';

/** PLACEHOLDER until its owner fills it in: prints the heading only. */
export const warningsSection: SheetSection = {
  id: 'warnings',
  title: 'Warnings',
  draw(writer) {
    writer.sectionHeading(this.title);
  },
};
