import type { Design } from '../../shared/design';
import { describedSections, layoutKindOptions, type DescribedField, type DescribedSection } from '../../shared/design-fields';
import { formatStoredValue } from '../../shared/design-values';
import { formatDay, formatInteger, formatNumber, formatQuantity, keepTogether } from '../../shared/format';
import type { Overlap, WavelengthPoint } from '../../features/solver/index';
import type { SheetContext } from './context';
import { sheetColors, type SheetFont, type SheetWriter, type TableColumn } from './writer';

/**
 * Words and a table shared by the sheet's title, parameter, performance and warning sections:
 * stored values as the editor shows them, where a design came from, and a table whose row may
 * give its remaining cells over to one sentence (an unreachable wavelength's reason).
 */

/** What an optional field or section the design leaves out reads as. */
export const NOT_SET = 'Not set';

/** A stored value as the editor shows it, in full with its unit ("0.0125 mm" stays itself); "Not set" when left out. */
export function storedValueText(field: DescribedField, value: unknown): string {
  return value === undefined || value === null ? NOT_SET : formatStoredValue(field.path, value);
}

export type ParameterGroup = {
  section: DescribedSection;
  /** False for an optional section the design leaves out (no source, no detector). */
  set: boolean;
  rows: { field: DescribedField; text: string }[];
};

/** The design's values in the editor's sections, order and words. */
export function parameterGroups(design: Design): ParameterGroup[] {
  return describedSections.map((section) => {
    const values = design[section.id] as Record<string, unknown> | undefined;
    return {
      section,
      set: values !== undefined,
      rows: values === undefined ? [] : section.fields.map((field) => ({ field, text: storedValueText(field, values[field.key]) })),
    };
  });
}

/** A calendar day read in UTC, so a sheet printed anywhere names the same day. */
export function dayText(when: string): string {
  return formatDay(when, 'UTC');
}

/**
 * Where the design came from, in the notebook screen's words: cloned (with the title the source
 * had then), imported from a file, or made here. A share link's holder is not told.
 */
export function provenanceText(sheet: Pick<SheetContext, 'audience' | 'design'>): string {
  if (sheet.audience === 'link') return 'Not shown through a share link';
  const { clonedFrom, importedAt } = sheet.design;
  if (clonedFrom) return `Cloned from “${clonedFrom.title}” v${clonedFrom.version}`;
  if (importedAt) return `Imported from a file on ${dayText(importedAt)}`;
  return 'Made here';
}

/** "1st", "2nd", "−3rd". */
export function ordinal(order: number): string {
  const n = Math.abs(order);
  const teen = n % 100 >= 11 && n % 100 <= 13;
  const suffix = teen ? 'th' : (['th', 'st', 'nd', 'rd'][n % 10] ?? 'th');
  return `${order < 0 ? '−' : ''}${formatInteger(n)}${suffix}`;
}

/**
 * The other orders leaving the grating at this wavelength's angle, as the workbench's read-out
 * words them ("m=2: 300 nm"): the `maxListed` nearest the working order `order` (the hardest to
 * filter out, as the solver ranks them), by increasing |n|, then "+N more", so a cut list never
 * reads as complete (the rule of features/workbench/overlaps.ts). "none" when there are none.
 */
export function overlapsText(point: Pick<WavelengthPoint, 'overlaps' | 'overlapCount'>, order: number, maxListed = 4): string {
  if (point.overlapCount === 0) return 'none';
  const distance = (o: Overlap) => Math.abs(Math.abs(o.order) - Math.abs(order));
  const listed = [...point.overlaps]
    .sort((a, b) => distance(a) - distance(b) || Math.abs(a.order) - Math.abs(b.order))
    .slice(0, maxListed)
    .sort((a, b) => Math.abs(a.order) - Math.abs(b.order));
  const parts = listed.map((o) => keepTogether(`m=${formatInteger(o.order)}: ${formatQuantity(o.wavelengthNm, 'nm')}`));
  const hidden = point.overlapCount - listed.length;
  if (hidden > 0) parts.push(keepTogether(`+${formatInteger(hidden)} more`));
  return parts.join(', ');
}

/**
 * What the instrument is, in one line a manager can read: the mount, the grating, the range and
 * the focal lengths, and the detector when there is one.
 */
export function instrumentLine(params: Design): string {
  const { grating, layout, range, detector } = params;
  const mount = layoutKindOptions.find((option) => option.value === layout.kind)?.label ?? layout.kind;
  const focal =
    layout.collimatorFocalMm === layout.cameraFocalMm
      ? `${formatQuantity(layout.collimatorFocalMm, 'mm')} focal length`
      : `focal lengths ${formatNumber(layout.collimatorFocalMm)} mm (collimator) and ${formatQuantity(layout.cameraFocalMm, 'mm')} (camera)`;
  const parts = [
    `${mount} mount`,
    `${formatNumber(grating.grooveDensityPerMm, 12)} grooves/mm grating in the ${ordinal(grating.order)} order`,
    `${formatNumber(range.startNm, 12)}–${formatQuantity(range.endNm, 'nm', 12)}`,
    focal,
    detector
      ? `line detector of ${formatInteger(detector.pixelCount)} pixels at ${formatQuantity(detector.pixelPitchUm, 'µm', 12)}`
      : 'exit slit (scanning monochromator)',
  ];
  return parts.join(' · ');
}

export type SpanTableRow = {
  cells: string[];
  /**
   * From this column on, the row holds one sentence across the remaining columns instead of
   * cells (`cells` then lists only the columns before it).
   */
  span?: { from: number; text: string; font?: SheetFont; color?: string };
  marked?: boolean;
  /** The first cell in semibold, as a heading for the row. */
  headed?: boolean;
};

export type SpanTableOptions = {
  size: number;
  /** Left edge and width of the table (default: the content column). */
  x?: number;
  width?: number;
};

/** The height `spanTable` will take for these rows (header included), before any page break. */
export function spanTableHeight(writer: SheetWriter, columns: readonly TableColumn[], rows: readonly SpanTableRow[], options: SpanTableOptions): number {
  const grid = tableGrid(writer, columns, options);
  return grid.headerHeight + rows.reduce((sum, row) => sum + grid.rowHeight(row), 0);
}

const PAD = 3;

function tableGrid(writer: SheetWriter, columns: readonly TableColumn[], { size, x = writer.left, width = writer.contentWidth }: SpanTableOptions) {
  const xs: number[] = [];
  let left = x;
  for (const column of columns) {
    xs.push(left);
    left += column.width * width;
  }
  const right = x + width;
  const cellWidth = (from: number, to = from + 1) => (xs[to] ?? right) - xs[from]! - 2 * PAD;
  const fontOf = (i: number, row?: SpanTableRow): SheetFont => (row?.headed && i === 0 ? 'semibold' : (columns[i]!.font ?? 'regular'));
  const headerHeight = Math.max(...columns.map((c, i) => writer.measure(c.header, 'semibold', size, cellWidth(i)))) + 2 * PAD;
  const rowHeight = (row: SpanTableRow) => {
    const heights = row.cells.map((cell, i) => writer.measure(cell, fontOf(i, row), size, cellWidth(i)));
    if (row.span) heights.push(writer.measure(row.span.text, row.span.font ?? 'regular', size, cellWidth(row.span.from, columns.length)));
    return Math.max(...heights) + 2 * PAD;
  };
  return { x, width, xs, right, cellWidth, fontOf, headerHeight, rowHeight };
}

/**
 * A table like `SheetWriter.table` (shaded header repeated on every page, a rule under each row,
 * marked rows tinted) whose rows may end in one sentence spanning the remaining columns, and
 * which may sit in part of the content column (`x`, `width`) so two can stand side by side.
 */
export function spanTable(writer: SheetWriter, columns: readonly TableColumn[], rows: readonly SpanTableRow[], options: SpanTableOptions): void {
  const { doc } = writer;
  const { size } = options;
  const { x, width, xs, right, cellWidth, fontOf, headerHeight, rowHeight } = tableGrid(writer, columns, options);
  const drawHeader = () => {
    const y = writer.y;
    doc.rect(x, y, width, headerHeight).fill(sheetColors.shade);
    columns.forEach((column, i) => {
      writer.use('semibold', size).doc.fillColor(sheetColors.muted).text(column.header, xs[i]! + PAD, y + PAD, { width: cellWidth(i), align: column.align ?? 'left' });
    });
    writer.y = y + headerHeight;
  };
  writer.ensureSpace(headerHeight + (rows[0] ? rowHeight(rows[0]) : 16));
  drawHeader();
  for (const row of rows) {
    const height = rowHeight(row);
    if (writer.y + height > writer.bottom) {
      writer.newPage();
      drawHeader();
    }
    const y = writer.y;
    if (row.marked) doc.rect(x, y, width, height).fill('#FFF2E6');
    row.cells.forEach((cell, i) => {
      writer.use(fontOf(i, row), size).doc.fillColor(sheetColors.ink).text(cell, xs[i]! + PAD, y + PAD, { width: cellWidth(i), align: columns[i]!.align ?? 'left' });
    });
    if (row.span) {
      const { from, text, font, color } = row.span;
      writer.use(font ?? 'regular', size).doc.fillColor(color ?? sheetColors.ink).text(text, xs[from]! + PAD, y + PAD, { width: cellWidth(from, columns.length) });
    }
    doc.moveTo(x, y + height).lineTo(right, y + height).lineWidth(0.4).strokeColor(sheetColors.line).stroke();
    writer.y = y + height;
  }
  doc.fillColor(sheetColors.ink);
}
