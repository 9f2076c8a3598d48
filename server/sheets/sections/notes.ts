import type { SheetSection } from '../section';

/** PLACEHOLDER until its owner fills it in: prints the heading only. */
export const notesSection: SheetSection = {
  id: 'notes',
  title: 'Version notes',
  draw(writer) {
    writer.sectionHeading(this.title);
  },
};
