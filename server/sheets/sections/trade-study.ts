import { formatNumber, formatQuantity } from '../../../shared/format';
import { designFootprintMm } from '../../../features/requirements/index';
import { TRADE_VERDICT_WORDS, tradeStudy, type TradeStudy, type TradeVerdict } from '../../../features/solver/index';
import { tradeFigureRows } from '../../../features/selectors/trade-study-table';
import type { SheetContext } from '../context';
import type { SheetSection } from '../section';
import { sheetColors, textSize, type TableColumn, type TableRow } from '../writer';

/** "Fail: bandpass 12.6 nm at 780 nm, 531 % over": the word first, so grey print and screen readers both get it. */
export function verdictCell(verdict: TradeVerdict): string {
  return `${TRADE_VERDICT_WORDS[verdict.status]}: ${verdict.message}`;
}

/** The study a sheet prints: the app's defaults, with the grating's outline from the sketch when a footprint is asked for. */
export function sheetTradeStudy(sheet: Pick<SheetContext, 'params'>): TradeStudy {
  const { params } = sheet;
  return tradeStudy(params, { gratingFootprintMm: params.requirements?.maxFootprintMm ? designFootprintMm(params) : null });
}

/**
 * This design's grating beside a prism monochromator, an interference filter and a coloured glass
 * over the same range: the figures side by side, a verdict per comparable requirement (or a line
 * saying none are set), how each selector was modelled and the defaults used. Printed for every
 * design: the range alone is enough to compare them.
 */
export const tradeStudySection: SheetSection = {
  id: 'trade-study',
  title: 'Other wavelength selectors',
  draw(writer, sheet) {
    const study = sheetTradeStudy(sheet);
    const size = textSize.small;
    const selectorShare = 0.19;
    const columns = (first: string): TableColumn[] => [
      { header: first, width: 1 - selectorShare * study.selectors.length },
      ...study.selectors.map((s) => ({ header: s.label, width: selectorShare })),
    ];
    const figureRows: TableRow[] = tradeFigureRows(study).map((row) => ({
      cells: [row.label, ...study.selectors.map((s) => row.cells[s.id])],
    }));
    const { startNm, endNm } = sheet.params.range;
    writer.sectionHeading(this.title, 120);
    writer.paragraph(
      `This design’s grating beside a prism monochromator, an interference filter and coloured glass over ` +
        `${formatNumber(startNm, 12)}–${formatQuantity(endNm, 'nm', 12)}. Peak transmissions are scalar estimates of the selector alone; ` +
        'each one’s basis is given below.',
      { size },
    );
    writer.table(columns('Figure'), figureRows, { size });

    writer.subheading('Against the requirements');
    if (study.verdicts.length > 0) {
      const verdictRows: TableRow[] = study.verdicts.map((row) => ({
        cells: [`${row.title} (${row.limitText})`, ...study.selectors.map((s) => verdictCell(row.verdicts[s.id]))],
      }));
      writer.table(columns('Requirement'), verdictRows, { size });
    }
    writer.paragraph(study.verdictNote, { size, color: sheetColors.muted });

    writer.subheading('How each was modelled');
    for (const s of study.selectors) {
      writer.paragraph(
        [`${s.label}. ${s.setup}`, s.tunability, s.overlappingOrders, `Peak transmission: ${s.peakTransmissionBasis}`, `Size: ${s.size}`, ...s.notes].join(' '),
        { size },
      );
    }
    writer.paragraph(`Defaults used. ${study.assumptions.join(' ')}`, { size, color: sheetColors.muted });
  },
};
