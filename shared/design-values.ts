import { CURVE_KIND_WORDS } from './curves';
import {
  CURVE_POINTS_KEY,
  CURVES_TITLE,
  INPUT_TITLE,
  NO_INPUT_TEXT,
  curvePathParts,
  describeCurvePath,
  describeFilterPath,
  describeInputPath,
  describedFieldByPath,
  describedSections,
  fieldTableName,
  filterPathParts,
  inputFieldWords,
  inputKindLabels,
  inputPathKey,
} from './design-fields';
import { curvePointsOf, type CurvePoints } from './design-diff';
import { UNIT_SPACE, formatInteger, formatNumber, formatQuantity } from './format';
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

/** Lists longer than this (a curve's thousands of points) are summarised, never printed whole. */
export const MAX_LISTED_ITEMS = 12;

/** "412 numbers, 300–900": a long list of numbers by its length and span. */
function briefList(values: readonly unknown[]): string {
  const numbers = values.filter((v): v is number => typeof v === 'number' && Number.isFinite(v));
  const count = `${formatInteger(values.length)} ${numbers.length === values.length ? 'numbers' : 'items'}`;
  if (numbers.length === 0) return count;
  let low = numbers[0]!;
  let high = numbers[0]!;
  for (const n of numbers) {
    if (n < low) low = n;
    if (n > high) high = n;
  }
  return `${count}, ${formatNumber(low)}–${formatNumber(high)}`;
}

/** "412 points, 300–900 nm": a curve's points by their count and wavelength span. */
export function curvePointsText(points: CurvePoints): string {
  const { wavelengthsNm } = points;
  const count = `${formatInteger(wavelengthsNm.length)} ${wavelengthsNm.length === 1 ? 'point' : 'points'}`;
  if (wavelengthsNm.length === 0) return count;
  return `${count}, ${formatNumber(wavelengthsNm[0])}–${formatQuantity(wavelengthsNm[wavelengthsNm.length - 1], 'nm')}`;
}

/** A parameter value as it reads in a table: numbers plainly, sections as "set" / "not set". */
export function formatParam(value: unknown): string {
  if (value === null || value === undefined) return 'not set';
  // A stored parameter is shown in full, not cut to the four figures of a derived one.
  if (typeof value === 'number') return formatNumber(value, 12);
  if (typeof value === 'string') return value;
  if (typeof value === 'boolean') return value ? 'yes' : 'no';
  if (Array.isArray(value)) {
    if (value.length === 0) return 'none';
    // A curve's arrays (up to 5,000 numbers) read as their length and span.
    if (value.length > MAX_LISTED_ITEMS) return briefList(value);
    // A short list (the requirements' wavelengths) reads as its items, in order.
    return value.map((item) => formatParam(item)).join(', ');
  }
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
export function editorFieldName(path: string, ...designs: unknown[]): string {
  // "Light input: numerical aperture", "Curve 2 (grating efficiency): name" (the kind when the
  // designs compared are given), as the tables of filters name theirs.
  const light = describeInputPath(path) ?? describeCurvePath(path, designs);
  if (light) return light;
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
  if (id === 'input') return INPUT_TITLE;
  if (id === 'curves') return CURVES_TITLE;
  return describedSections.find((section) => section.id === id)?.title ?? id;
}

const POLARISATION_WORDS: Readonly<Record<string, string>> = { unpolarised: 'unpolarised', te: 'TE', tm: 'TM' };
const MEDIUM_WORDS: Readonly<Record<string, string>> = { air: 'air', vacuum: 'vacuum', unstated: 'not stated' };

/**
 * A light input or curve value in the editor's words, or undefined for other paths: a kind by its
 * label, a curve's points by their count and span, a checksum by its first digits, and an absent
 * input as taken as matched.
 */
function lightValueText(path: string, value: unknown, withUnit: boolean): string | undefined {
  const input = inputPathKey(path);
  if (input) {
    if (value === null || value === undefined) return path === 'input' || input.key === 'kind' ? NO_INPUT_TEXT : 'not set';
    if (input.key === 'kind' && typeof value === 'string') return (inputKindLabels as Record<string, string>)[value] ?? value;
    if (input.key === null && typeof value === 'object' && !Array.isArray(value)) {
      // The whole block (a side without one): its kind, then its values.
      return Object.entries(value as Record<string, unknown>)
        .map(([key, inner]) => (key === 'kind' ? formatParamAt('input.kind', inner) : `${inputFieldWords[key as keyof typeof inputFieldWords]?.short ?? key} ${formatStoredValue(`input.${key}`, inner)}`))
        .join(', ');
    }
    if (typeof value === 'number') {
      const unit = input.key === null ? '' : inputFieldWords[input.key].unitLabel;
      return withUnit && unit ? formatQuantity(value, unit, 12) : formatNumber(value, 12);
    }
    return undefined;
  }
  const curve = curvePathParts(path);
  if (!curve || curve.index === null) return undefined;
  if (value === null || value === undefined) return 'not set';
  if (curve.key === CURVE_POINTS_KEY) {
    const points = curvePointsOf(value);
    return points ? curvePointsText(points) : undefined;
  }
  if (typeof value === 'string') {
    if (curve.key === 'kind') return (CURVE_KIND_WORDS as Record<string, string>)[value] ?? value;
    if (curve.key === 'polarisation') return POLARISATION_WORDS[value] ?? value;
    if (curve.key === 'medium') return MEDIUM_WORDS[value] ?? value;
    // 64 hex digits say nothing more to a reader than their first twelve.
    if (curve.key === 'checksum') return value.length > 12 ? `${value.slice(0, 12)}…` : value;
  }
  return undefined;
}

/** A stored value at a path as the editor shows it: a choice by its label ("Czerny–Turner"), the rest as `formatParam`. */
export function formatParamAt(path: string, value: unknown): string {
  const light = lightValueText(path, value, false);
  if (light !== undefined) return light;
  const field = describedFieldByPath.get(path);
  if (field?.kind === 'choice' && typeof value === 'string') {
    return (field.options as Record<string, { label: string } | undefined>)[value]?.label ?? value;
  }
  return formatParam(value);
}

/** A stored field value as the editor shows it: with its unit ("100 µm"), a choice by its label. */
export function formatStoredValue(path: string, value: unknown): string {
  const light = lightValueText(path, value, true);
  if (light !== undefined) return light;
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

/**
 * One change in a line: "0.22 → 0.12"; a curve's points as "points changed: 412 → 415 points,
 * 300–900 nm" (or both spans when they differ), never the numbers themselves.
 */
export function formatChangeAt(path: string, before: unknown, after: unknown): string {
  if (curvePathParts(path)?.key === CURVE_POINTS_KEY) {
    const a = curvePointsOf(before);
    const b = curvePointsOf(after);
    if (a && b) {
      const span = (p: CurvePoints) => curvePointsText(p).replace(/^[^,]*, /, '');
      const count = (p: CurvePoints) => formatInteger(p.wavelengthsNm.length);
      return span(a) === span(b)
        ? `points changed: ${count(a)} → ${count(b)} points, ${span(a)}`
        : `points changed: ${curvePointsText(a)} → ${curvePointsText(b)}`;
    }
  }
  return `${formatParamAt(path, before)} → ${formatParamAt(path, after)}`;
}
