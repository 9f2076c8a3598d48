import { formatInteger, formatNumber, formatQuantity } from '../../../shared/format';
import type { SheetSection } from '../section';
import { sheetColors, textSize } from '../writer';

/** Shown when the sweep raised nothing, so an empty list is never mistaken for a missing one. */
export const NO_WARNINGS = 'None: the solver found nothing to warn about across the range.';

/**
 * The solver's warnings over the default sweep, in the words the workbench's warning list shows
 * (each names where it applies and the fix), on the workbench's warning stripe.
 */
export const warningsSection: SheetSection = {
  id: 'warnings',
  title: 'Warnings',
  draw(writer, sheet) {
    writer.sectionHeading(this.title);
    const { warnings, points } = sheet.evaluation;
    if (warnings.length === 0) {
      writer.paragraph(NO_WARNINGS, { color: sheetColors.ok });
      return;
    }
    const { startNm, endNm } = sheet.params.range;
    writer.paragraph(
      `${formatInteger(warnings.length)} from the solver’s sweep of ${formatInteger(points.length)} wavelengths from ` +
        `${formatNumber(startNm, 12)} to ${formatQuantity(endNm, 'nm', 12)}, as the workbench lists them.`,
      { size: textSize.small, color: sheetColors.muted },
    );
    const stripe = 3;
    const indent = 10;
    const width = writer.contentWidth - indent;
    for (const warning of warnings) {
      const height = writer.measure(warning.message, 'regular', textSize.body, width);
      writer.ensureSpace(height + 6);
      const y = writer.y;
      writer.doc.rect(writer.left, y - 1, stripe, height + 2).fill(sheetColors.warning);
      writer.use('regular', textSize.body).doc.fillColor(sheetColors.ink).text(warning.message, writer.left + indent, y, { width });
      writer.y = y + height + 6;
    }
  },
};
