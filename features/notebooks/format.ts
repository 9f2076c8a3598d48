import { describeDesignPath, describedFieldByPath, describedSections, fieldTableName } from '@/shared/design-fields';
import { formatNumber } from '@/shared/format';
import type { VersionSummary } from '@/shared/notebooks';
import { formatFigure } from '@/shared/notebooks/figure-labels';

// Screens in this folder still import the dates from here; new code imports '@/shared/format'.
export { formatDay, formatWhen } from '@/shared/format';

// The key figures' words are shared with the compare sheet on the server.
export { changeTone, figureLabels, formatFigure, formatRelativeChange } from '@/shared/notebooks/figure-labels';

/** "380–780 nm". */
export function formatRange(summary: Pick<VersionSummary, 'rangeStartNm' | 'rangeEndNm'>): string {
  return `${formatNumber(summary.rangeStartNm)}–${formatNumber(summary.rangeEndNm)} nm`;
}

/** The history table's key figures, as short strings. */
export function summaryFigures(summary: VersionSummary) {
  return {
    range: formatRange(summary),
    bandpass: formatFigure('bandpassAtCentreNm', summary.bandpassAtCentreNm),
    resolvingPower: formatFigure('resolvingPowerAtCentre', summary.resolvingPowerAtCentre),
    fNumber: formatFigure('fNumber', summary.fNumber),
  };
}

/** "a reviewer", "an owner", "an editor": the indefinite article by the word's first letter (enough for role names). */
export function withArticle(word: string): string {
  return `${/^[aeiou]/i.test(word) ? 'an' : 'a'} ${word}`;
}

/** `slits.exitWidthUm` → "Slits: exit width (µm)"; a whole section → "Detector". */
export const describePath = describeDesignPath;

/** A parameter value as it reads in a table: numbers plainly, sections as "set" / "not set". */
export function formatParam(value: unknown): string {
  if (value === null || value === undefined) return 'not set';
  // A stored parameter is shown in full, not cut to the four figures of a derived one.
  if (typeof value === 'number') return formatNumber(value, 12);
  if (typeof value === 'string') return value;
  if (typeof value === 'object') {
    return Object.entries(value as Record<string, unknown>)
      .map(([key, inner]) => `${fieldTableName(key)} ${formatParam(inner)}`)
      .join(', ');
  }
  return String(value);
}

/**
 * A field path in the editor's own words, for tables a person compares by eye: the editor's
 * label with the unit its box shows ("Exit slit width (µm)", "Mount type"); a section path
 * gives the editor's heading ("Mount"). Unknown paths are shown as they are.
 */
export function editorFieldName(path: string): string {
  const field = describedFieldByPath.get(path);
  if (field) return field.kind === 'quantity' ? `${field.label} (${field.unitLabel})` : field.label;
  return describedSections.find((section) => section.id === path)?.title ?? path;
}

/** The editor's heading of the section a path is in ("Mount" for `layout.kind`). */
export function editorSectionTitle(path: string): string {
  const id = path.split('.')[0] ?? path;
  return describedSections.find((section) => section.id === id)?.title ?? id;
}

/** A stored value at a path as the editor shows it: a choice by its label ("Czerny–Turner"), the rest as `formatParam`. */
export function formatParamAt(path: string, value: unknown): string {
  const field = describedFieldByPath.get(path);
  if (field?.kind === 'choice' && typeof value === 'string') {
    return (field.options as Record<string, { label: string } | undefined>)[value]?.label ?? value;
  }
  return formatParam(value);
}
