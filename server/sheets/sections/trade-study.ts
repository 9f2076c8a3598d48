import type { SheetSection } from '../section';

/** Placeholder while issue 16 builds it: left off every sheet until then. */
export const tradeStudySection: SheetSection = {
  id: 'trade-study',
  title: 'Other wavelength selectors',
  appliesTo: () => false,
  draw(writer) {
    writer.sectionHeading(this.title);
  },
};
