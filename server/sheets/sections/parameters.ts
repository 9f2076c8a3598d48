import type { SheetSection } from '../section';

/** PLACEHOLDER until its owner fills it in: prints the heading only. */
export const parametersSection: SheetSection = {
  id: 'parameters',
  title: 'Parameters',
  draw(writer) {
    writer.sectionHeading(this.title);
  },
};
