import { describeFilterPath, describedFieldByPath, describedSections, fieldTableName, filterPathParts } from './design-fields';
import { UNIT_SPACE, formatNumber, formatQuantity } from './format';
import { requirementWords } from './requirements';

/**
 * Stored design values and field paths in the editor's own words, for every place that shows a
 * saved design to a person: the compare screen and conflict card, review threads' carry lines,
 * and the design sheet on the server.
 */

const REQUIREMENTS = 'requirements';

/** The words for a `requirements.…` path (`requirements.maxFootprintMm.widthMm` included); null for other paths. */
function requirementWordsAt(path: string): { label: string; short: string } | null {
  if (!path.startsWith(`${REQUIREMENTS}.`)) return null;
  return requirementWords[path.slice(REQUIREMENTS.length + 1) as keyof typeof requirementWords] ?? null;
}

/** The unit a requirement's name carries in brackets ("max bandpass (nm)" → "nm"); empty for counts and choices. */
function requirementUnit(path: string): string {
  return /\(([^)]+)\)$/.exec(requirementWordsAt(path)?.short ?? '')?.[1] ?? '';
}

/** A parameter value as it reads in a table: numbers plainly, sections as "set" / "not set". */
export function formatParam(value: unknown): string {
  if (value === null || value === undefined) return 'not set';
  // A stored parameter is shown in full, not cut to the four figures of a derived one.
  if (typeof value === 'number') return formatNumber(value, 12);
  if (typeof value === 'string') return value;
  if (typeof value === 'boolean') return value ? 'yes' : 'no';
  // A list (the requirements' wavelengths) reads as its items, in order.
  if (Array.isArray(value)) return value.map((item) => formatParam(item)).join(', ');
  if (typeof value === 'object') {
    return Object.entries(value as Record<string, unknown>)
      .map(([key, inner]) => `${fieldTableName(key)} ${formatParam(inner)}`)
      .join(', ');
  }
  if (typeof value === 'boolean' || Array.isArray(value)) return formatParam(value);
  return String(value);
}

/**
 * A field path in the editor's own words, for tables a person compares by eye: the editor's
 * label with the unit its box shows ("Exit slit width (µm)", "Mount type"); a section path
 * gives the editor's heading ("Mount"). Unknown paths are shown as they are.
 */
export function editorFieldName(path: string): string {
  const requirement = requirementWordsAt(path);
  // Requirements are named by their limit, unit in brackets: "Max bandpass (nm)".
  if (requirement) return requirement.short.charAt(0).toUpperCase() + requirement.short.slice(1);
  if (path === REQUIREMENTS) return 'Requirements';
  // "Filter 2: cut-on (nm)": filters count from 1, as the filter card lists them.
  const filter = describeFilterPath(path);
  if (filter) return filter;
  const field = describedFieldByPath.get(path);
  if (field) return field.kind === 'quantity' ? `${field.label} (${field.unitLabel})` : field.label;
  return describedSections.find((section) => section.id === path)?.title ?? path;
}

/** The editor's heading of the section a path is in ("Mount" for `layout.kind`). */
export function editorSectionTitle(path: string): string {
  const id = path.split('.')[0] ?? path;
  if (id === REQUIREMENTS) return 'Requirements';
  if (id === 'filters') return 'Order-sorting filters';
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

/** A stored field value as the editor shows it: with its unit ("100 µm"), a choice by its label. */
export function formatStoredValue(path: string, value: unknown): string {
  if (value === null || value === undefined) return 'not set';
  if (requirementWordsAt(path)) {
    const unit = requirementUnit(path);
    // "404.7, 546.1 nm": the list's unit once, kept with its last item; the list itself may wrap.
    if (typeof value === 'number' || Array.isArray(value)) return unit ? `${formatParam(value)}${UNIT_SPACE}${unit}` : formatParam(value);
    return formatParam(value);
  }
  const field = describedFieldByPath.get(path);
  // A filter's wavelengths are stored in nm and shown in full.
  if (typeof value === 'number' && filterPathParts(path)?.key) return formatQuantity(value, 'nm', 12);
  if (typeof value === 'number') {
    // Stored values are shown in full, not cut to the four figures of a derived one.
    return field?.kind === 'quantity' ? formatQuantity(value, field.unitLabel, 12) : formatNumber(value, 12);
  }
  if (typeof value === 'string' && field?.kind === 'choice') {
    return (field.options as Record<string, { label: string } | undefined>)[value]?.label ?? value;
  }
  if (typeof value === 'boolean' || Array.isArray(value)) return formatParam(value);
  return String(value);
}
