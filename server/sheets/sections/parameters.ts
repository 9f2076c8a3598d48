import type { SheetSection } from '../section';
import { NOT_SET, parameterGroups, spanTable, spanTableHeight, type ParameterGroup, type SpanTableRow } from '../sheet-text';
import { margins, textSize, type TableColumn } from '../writer';

const columns: TableColumn[] = [
  { header: 'Parameter', width: 0.685 },
  { header: 'Value', width: 0.315 },
];

/** A group's heading row (the editor's section title) and its fields; "Not set" for a section left out. */
function groupRows({ section, set, rows }: ParameterGroup): SpanTableRow[] {
  const heading: SpanTableRow = { cells: [], span: { from: 0, text: section.title, font: 'semibold' } };
  if (!set) return [{ cells: [section.title, NOT_SET], headed: true }];
  return [heading, ...rows.map(({ field, text }) => ({ cells: [field.label, text] }))];
}

/** Splits the groups, in order, where the two halves come nearest in rows. */
function halves(groups: readonly SpanTableRow[][]): [SpanTableRow[], SpanTableRow[]] {
  const total = groups.reduce((sum, rows) => sum + rows.length, 0);
  let best = { at: groups.length, gap: Infinity };
  let left = 0;
  for (let at = 0; at <= groups.length; at += 1) {
    const gap = Math.abs(total - 2 * left);
    if (gap < best.gap) best = { at, gap };
    left += groups[at]?.length ?? 0;
  }
  return [groups.slice(0, best.at).flat(), groups.slice(best.at).flat()];
}

/**
 * Every parameter of the version as the editor groups and words it — the editor's section
 * headings and labels, each value with its unit and in full — in two columns of groups. An
 * optional section the design leaves out (source, detector) says "Not set" rather than vanishing.
 */
export const parametersSection: SheetSection = {
  id: 'parameters',
  title: 'Parameters',
  draw(writer, sheet) {
    const [left, right] = halves(parameterGroups(sheet.params).map(groupRows));
    const gutter = 12;
    const width = (writer.contentWidth - gutter) / 2;
    const size = textSize.body;
    const placed = [
      { rows: left, x: writer.left },
      { rows: right, x: writer.left + width + gutter },
    ];
    const height = Math.max(...placed.map(({ rows }) => spanTableHeight(writer, columns, rows, { size, width })));
    // Side by side only while both halves fit on one page (every design does; a guard, not a case).
    if (height > writer.bottom - margins.top - 60) {
      writer.sectionHeading(this.title);
      spanTable(writer, columns, [...left, ...right], { size });
      writer.gap(6);
      return;
    }
    writer.sectionHeading(this.title, height);
    const top = writer.y;
    let bottom = top;
    for (const { rows, x } of placed) {
      writer.y = top;
      spanTable(writer, columns, rows, { size, x, width });
      bottom = Math.max(bottom, writer.y);
    }
    writer.y = bottom;
    writer.gap(6);
  },
};
