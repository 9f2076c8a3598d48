import type { SheetSection } from '../section';

/** PLACEHOLDER until its owner fills it in: prints the heading only. */
export const plotsSection: SheetSection = {
  id: 'plots',
  title: 'Plots',
  draw(writer) {
    writer.sectionHeading(this.title);
  },
};
