import type { Design } from '../../../shared/design';
import type { OrderSortingFilter } from '../../../shared/filters';
import { formatInteger, formatNumber, formatPercent, formatQuantity } from '../../../shared/format';
import {
  CUTS_IN_BELOW,
  filterFacts,
  noFilterNeededText,
  overlapPossible,
  unblockedSpanNm,
  unblockedWords,
} from '../../../features/order-sorting/filter-plan';
import type { SheetContext } from '../context';
import type { SheetSection } from '../section';
import { sheetColors, textSize, type TableColumn, type TableRow } from '../writer';

const numeric = { align: 'right' as const };

/** The filter table's columns: as the card lists a filter, numbers right-aligned under their headers. */
export const FILTER_COLUMNS: readonly TableColumn[] = [
  { header: 'Filter', width: 0.1 },
  { header: 'Kind', width: 0.14 },
  { header: 'Cut-on', width: 0.14, ...numeric },
  { header: 'In the beam', width: 0.24, ...numeric },
  { header: 'Edge width', width: 0.16, ...numeric },
  { header: 'Least passed', width: 0.22, ...numeric },
];

/**
 * One row per filter, its stored values in full (a filter is a stored parameter), and the least
 * share of the working wavelength it passes while in the beam — the row is marked when that cuts
 * into the signal.
 */
export function filterRows(filters: readonly OrderSortingFilter[], range: Design['range']): TableRow[] {
  return filters.map((filter, index) => {
    const facts = filterFacts(filter, range);
    const least = facts.leastAtNm === null ? 'never in range' : `${formatPercent(facts.leastPassed)} at ${formatQuantity(facts.leastAtNm, 'nm', 6)}`;
    return {
      cells: [
        String(index + 1),
        filter.kind,
        formatQuantity(filter.cutOnNm, 'nm', 12),
        `${formatNumber(filter.inFromNm, 12)}–${formatQuantity(filter.inToNm, 'nm', 12)}`,
        formatQuantity(filter.edgeWidthNm, 'nm', 12),
        least,
      ],
      marked: facts.leastPassed < CUTS_IN_BELOW,
    };
  });
}

/** "412 unblocked overlaps (…) between 402 and 900 nm.", or that none is left. */
export function overlapLine(sheet: SheetContext): string {
  const { orderSorting, points } = sheet.evaluation;
  const span = unblockedSpanNm(sheet.evaluation);
  const over = `wavelength × order pairs over the ${formatInteger(points.length)} swept wavelengths`;
  if (orderSorting.unblockedOverlaps > 0 && span) {
    const words = unblockedWords(orderSorting.unblockedOverlaps);
    return (
      `${words.charAt(0).toUpperCase()}${words.slice(1)} (${over}): other orders of the source reach the exit slit ` +
      `unblocked between ${formatNumber(span.fromNm)} and ${formatQuantity(span.toNm, 'nm')}.`
    );
  }
  return `Unblocked overlaps: none left (${over}).`;
}

/** Designs whose source puts another order on the range, or that carry filters. */
export function orderSortingApplies(sheet: SheetContext): boolean {
  return sheet.params.filters !== undefined || overlapPossible(sheet.evaluation);
}

/**
 * The order-sorting filters: the design's own as a table (kind, cut-on, where each is in the
 * beam, edge width, and how much of the working wavelength it passes there), how many overlaps
 * they leave unblocked, and the solver's proposed plan when they leave any. Printed only for a
 * design whose source reaches another order inside the range or that carries filters, so other
 * sheets read as before.
 */
export const orderSortingSection: SheetSection & Required<Pick<SheetSection, 'appliesTo'>> = {
  id: 'order-sorting',
  title: 'Order sorting',
  appliesTo: orderSortingApplies,
  draw(writer, sheet) {
    const filters = sheet.params.filters ?? [];
    const { orderSorting } = sheet.evaluation;
    writer.sectionHeading(this.title, 80);
    if (!overlapPossible(sheet.evaluation)) {
      writer.paragraph(noFilterNeededText(sheet.params), { color: sheetColors.ok });
    } else {
      writer.paragraph(overlapLine(sheet), {
        font: 'semibold',
        color: orderSorting.unblockedOverlaps > 0 ? sheetColors.danger : sheetColors.ok,
      });
    }
    const size = textSize.small;
    if (filters.length > 0) {
      writer.table(FILTER_COLUMNS, filterRows(filters, sheet.params.range), { size });
      writer.gap(4);
      writer.paragraph(
        'A long-pass edge is a straight ramp of its edge width centred on the cut-on (the 50 % point). Least passed: ' +
          'the share of the working wavelength the filter passes at the short end of its span; a tinted row cuts into it.',
        { size, color: sheetColors.muted },
      );
    } else {
      writer.paragraph('Filters: none in the design.', { size });
    }
    const plan = orderSorting.proposedFilters;
    if (orderSorting.unblockedOverlaps > 0 && plan.length > 0) {
      writer.subheading(`Proposed plan: ${plan.length} long-pass filter${plan.length === 1 ? '' : 's'}, ${unblockedWords(orderSorting.proposedUnblockedOverlaps)}`);
      writer.table(FILTER_COLUMNS, filterRows(plan, sheet.params.range), { size });
      writer.gap(4);
      writer.paragraph(
        'Each cut-on lies above the shortest wavelength the next order could bring in, and each filter goes in before its ' +
          'overlap starts (common practice; Palmer & Loewen, Diffraction Grating Handbook, on order sorting).',
        { size, color: sheetColors.muted },
      );
    }
  },
};
