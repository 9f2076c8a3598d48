import { formatQuantity } from '../../../shared/format';
import type { FigureChange } from '../../../shared/notebooks/index';
import {
  REQUIREMENTS_MET_LABEL,
  changeTone,
  figureLabels,
  formatFigure,
  formatRelativeChange,
  formatRequirementsMet,
  requirementsChange,
} from '../../../shared/notebooks/figure-labels';
import type { CompareSheetContext } from '../context';
import type { CompareSheetSection } from '../section';
import { sheetColors, textSize, type TableRow } from '../writer';

/** "better" / "worse" in words beside the change, as the compare screen's colours say it, so it survives a grey printer. */
const toneWords = { ok: 'better', danger: 'worse', muted: '' } as const;

/** A figure that moved: its value differs between the versions (or one side has none). */
const moved = (figure: FigureChange) => figure.before !== figure.after;

/**
 * Requirements met on each side and the change in words, as the compare screen's last figure row;
 * none when neither version states requirements, so older notebooks print as they always did.
 */
export function requirementsFigureRow(sheet: CompareSheetContext): TableRow | null {
  const before = sheet.a.version.summary.requirements;
  const after = sheet.b.version.summary.requirements;
  if (!before?.total && !after?.total) return null;
  const change = requirementsChange(before, after);
  return {
    // The change is already in words ("bandpass no longer fails"), so it needs no "better"/"worse".
    cells: [REQUIREMENTS_MET_LABEL, formatRequirementsMet(before), formatRequirementsMet(after), change.text],
    marked: change.text !== 'no change',
  };
}

/** The compare screen's derived figures, before and after, with their relative change ("−12 %"). */
export const compareFiguresSection: CompareSheetSection = {
  id: 'compare-figures',
  title: 'Figure changes',
  draw(writer, sheet) {
    writer.sectionHeading(this.title);
    const va = `v${sheet.a.version.number}`;
    const vb = `v${sheet.b.version.number}`;
    if (sheet.figures.length === 0) {
      writer.paragraph('None.');
      return;
    }
    const centreA = sheet.a.version.summary.centreWavelengthNm;
    const centreB = sheet.b.version.summary.centreWavelengthNm;
    const centres =
      centreA === centreB
        ? `at the range centre, ${formatQuantity(centreA, 'nm')}`
        : `each at its own range centre (${va} ${formatQuantity(centreA, 'nm')}, ${vb} ${formatQuantity(centreB, 'nm')})`;
    writer.paragraph(
      `Key figures ${centres}; the change is (${vb} − ${va}) / ${va}. Warnings count the default sweep of each range.`,
      { size: textSize.small, color: sheetColors.muted },
    );
    writer.table(
      [
        { header: 'Figure', width: 0.34 },
        { header: va, width: 0.2, align: 'right' },
        { header: vb, width: 0.2, align: 'right' },
        { header: 'Change', width: 0.14, align: 'right', font: 'semibold' },
        { header: '', width: 0.12 },
      ],
      sheet.figures.map((figure) => ({
        cells: [
          figureLabels[figure.key].label,
          formatFigure(figure.key, figure.before),
          formatFigure(figure.key, figure.after),
          formatRelativeChange(figure.relativeChange),
          toneWords[changeTone(figure.key, figure.relativeChange)],
        ],
        marked: moved(figure),
      })),
    );
    const requirements = requirementsFigureRow(sheet);
    if (requirements) {
      // A table of its own: its change is a phrase, wider than the percentages above.
      writer.gap(4);
      writer.table(
        [
          { header: 'Requirements', width: 0.28 },
          { header: va, width: 0.16, align: 'right' },
          { header: vb, width: 0.16, align: 'right' },
          { header: 'Change', width: 0.4, font: 'semibold' },
        ],
        [requirements],
      );
    }
  },
};
