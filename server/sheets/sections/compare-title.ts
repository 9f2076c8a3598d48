import { formatWhen } from '../../../shared/format';
import type { Version } from '../../../shared/notebooks/index';
import type { CompareSheetSection } from '../section';
import { sheetColors, textSize } from '../writer';

/** "Narrower exit slit — Mira Okafor, 28 Nov 2026, 09:30 UTC". */
function versionLine(version: Version): string {
  const who = version.author?.displayName ?? 'Unknown author';
  const message = version.message.trim() || 'No message';
  return `${message} — ${who}, ${formatWhen(version.createdAt, 'UTC')} UTC`;
}

/** What is compared with what, by whom and when, for the review meeting's table. */
export const compareTitleSection: CompareSheetSection = {
  id: 'compare-title',
  title: 'Compare sheet',
  draw(writer, sheet) {
    writer.sectionHeading(this.title);
    const { a, b, design } = sheet;
    writer.paragraph(design.title, { font: 'bold', size: textSize.title, gapAfter: 2 });
    writer.paragraph(`v${a.version.number} → v${b.version.number}`, { font: 'semibold', size: textSize.subheading, color: sheetColors.primary, gapAfter: 6 });
    writer.keyValues(
      [
        [`v${a.version.number} (before)`, versionLine(a.version)],
        [`v${b.version.number} (after)`, versionLine(b.version)],
        ['Team', design.teamName ?? '—'],
      ],
      0.22,
    );
    writer.paragraph(
      `Changes read from v${a.version.number} (before) to v${b.version.number} (after). Generated ${formatWhen(sheet.generatedAt, 'UTC')} UTC.`,
      { size: textSize.small, color: sheetColors.muted },
    );
  },
};
