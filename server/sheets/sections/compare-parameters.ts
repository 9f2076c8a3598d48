import type { Design } from '../../../shared/design';
import { flattenDesign } from '../../../shared/design-diff';
import { describeDesignPath, describedFieldByPath, describedSections } from '../../../shared/design-fields';
import { editorFieldName, formatParamAt } from '../../../shared/design-values';
import type { CompareSheetContext } from '../context';
import type { CompareSheetSection } from '../section';
import type { TableRow } from '../writer';
import { sheetColors, textSize } from '../writer';

/** The word in the marker column: printed, not only tinted, so a grey printout still shows it. */
export const CHANGED = 'changed';

/** The stored value at `section.key`, or undefined when the section or field is absent. */
function valueAt(params: Design, path: string): unknown {
  const [section, key] = path.split('.') as [string, string];
  const inner = (params as unknown as Record<string, Record<string, unknown> | undefined>)[section];
  return inner?.[key];
}

function row(name: string, before: string, after: string, changed: boolean): TableRow {
  return { cells: [name, before, after, changed ? CHANGED : ''], marked: changed };
}

const isRequirementPath = (path: string) => path.startsWith('requirements.');

/** Every `requirements.…` leaf of a design, flattened as the diff names them (`requirements.maxFootprintMm.widthMm`). */
function requirementValues(params: Design): Record<string, unknown> {
  return Object.fromEntries(Object.entries(flattenDesign(params)).filter(([path]) => isRequirementPath(path)));
}

/**
 * The requirements of both versions under their own heading, in the first version's order and
 * then any only the second states; nothing when neither states any, so older notebooks print as
 * they always did.
 */
function requirementRows(sheet: CompareSheetContext, changed: ReadonlySet<string>): TableRow[] {
  const a = requirementValues(sheet.a.params);
  const b = requirementValues(sheet.b.params);
  const paths = [...new Set([...Object.keys(a), ...Object.keys(b)])];
  if (paths.length === 0) return [];
  return [
    { cells: ['Requirements', '', '', ''], bold: true },
    ...paths.map((path) => row(editorFieldName(path), formatParamAt(path, a[path]), formatParamAt(path, b[path]), changed.has(path))),
  ];
}

/**
 * Every parameter of both versions side by side, under the editor's section headings, a changed
 * row tinted and marked in words. What counts as changed is the compare answer's (the one design
 * diff), not a second comparison here.
 */
export function compareParameterRows(sheet: CompareSheetContext): TableRow[] {
  const changed = new Set(sheet.changes.map((change) => change.path));
  const rows: TableRow[] = [];
  for (const section of describedSections) {
    const present = (params: Design) => (params as Record<string, unknown>)[section.id] !== undefined;
    rows.push({ cells: [section.title, '', '', ''], bold: true });
    if (!present(sheet.a.params) && !present(sheet.b.params)) {
      rows.push(row('Not used in either version', '', '', false));
      continue;
    }
    for (const field of section.fields) {
      const before = valueAt(sheet.a.params, field.path);
      const after = valueAt(sheet.b.params, field.path);
      rows.push(row(editorFieldName(field.path), formatParamAt(field.path, before), formatParamAt(field.path, after), changed.has(field.path)));
    }
  }
  rows.push(...requirementRows(sheet, changed));
  // A difference at a path the editor does not describe (none today) is still listed, never dropped.
  const unknown = sheet.changes.filter((change) => !describedFieldByPath.has(change.path) && !isRequirementPath(change.path));
  if (unknown.length > 0) {
    rows.push({ cells: ['Other', '', '', ''], bold: true });
    for (const change of unknown) {
      rows.push(row(describeDesignPath(change.path, sheet.a.params, sheet.b.params), formatParamAt(change.path, change.before), formatParamAt(change.path, change.after), true));
    }
  }
  return rows;
}

export const compareParametersSection: CompareSheetSection = {
  id: 'compare-parameters',
  title: 'Parameters side by side',
  draw(writer, sheet) {
    writer.sectionHeading(this.title);
    const va = `v${sheet.a.version.number}`;
    const vb = `v${sheet.b.version.number}`;
    const count = sheet.changes.length;
    writer.paragraph(
      count === 0
        ? 'No parameter differs.'
        : `${count} ${count === 1 ? 'parameter differs' : 'parameters differ'}, tinted and marked “${CHANGED}”.`,
      { size: textSize.small, color: sheetColors.muted },
    );
    writer.table(
      [
        { header: 'Parameter', width: 0.46 },
        { header: va, width: 0.2, align: 'right' },
        { header: vb, width: 0.2, align: 'right' },
        { header: '', width: 0.14 },
      ],
      compareParameterRows(sheet),
    );
  },
};
