import { cautionsFor } from '../../../features/safety/cautions';
import type { SheetSection } from '../section';
import { sheetColors, textSize } from '../writer';

/**
 * The safety cautions that apply to the sheet's design (features/safety/cautions.ts decides which,
 * as the workbench's card does): each its title, what to be careful of, why it applies here, and
 * the closing line that hands the decision to local codes and the safety officer.
 */
export const cautionsSection: SheetSection = {
  id: 'cautions',
  title: 'Safety cautions',
  draw(writer, sheet) {
    writer.sectionHeading(this.title);
    const cautions = cautionsFor(sheet.params);
    if (cautions.length === 0) {
      writer.paragraph('None.', { color: sheetColors.muted });
      return;
    }
    for (const caution of cautions) {
      // The title is kept with the first lines of its text.
      writer.ensureSpace(30 + Math.min(writer.measure(caution.text, 'regular', textSize.body), 40));
      writer.subheading(caution.title);
      writer.paragraph(caution.text, { gapAfter: 2 });
      writer.paragraph(caution.why, { font: 'semibold', gapAfter: 2 });
      writer.paragraph(caution.closing, { color: sheetColors.muted, gapAfter: 8 });
    }
  },
};
