import type { SheetSection } from '../section';

/** Placeholder while issue 16 builds it: left off every sheet until then. */
export const orderSortingSection: SheetSection = {
  id: 'order-sorting',
  title: 'Order sorting',
  appliesTo: () => false,
  draw(writer) {
    writer.sectionHeading(this.title);
  },
};
