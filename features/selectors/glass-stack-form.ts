/**
 * The glass-stack calculator's fields (a list of coloured-glass filters and the range to plot),
 * its defaults and the checked input they make. Pure: no React.
 */

import { absorptionStackInputSchema, SELECTOR_LIMITS, type AbsorptionStackInput } from '@/shared/selectors';
import { evenlySpaced, rangeErrors, readFields, schemaErrors, type FieldErrors, type FormCheck } from './form-check';
import type { CalculatorField } from './field-reading';

export type GlassShape = 'long-pass' | 'band-pass';

export type GlassFilterKey =
  | 'edgeNm'
  | 'upperEdgeNm'
  | 'edgeWidthNm'
  | 'peakInternalTransmission'
  | 'referenceThicknessMm'
  | 'thicknessMm'
  | 'refractiveIndex';

export type GlassFilterText = { id: string; shape: GlassShape } & Record<GlassFilterKey, string>;

export interface GlassStackText {
  filters: GlassFilterText[];
  startNm: string;
  endNm: string;
}

export const GLASS_FILTER_FIELDS: readonly CalculatorField<GlassFilterKey>[] = [
  { key: 'edgeNm', label: 'Edge', reading: 'nm', unitLabel: 'nm', help: '50 % point of the rising edge at the reference thickness' },
  { key: 'upperEdgeNm', label: 'Upper edge', reading: 'nm', unitLabel: 'nm', help: 'Band-pass only: 50 % point of the falling edge' },
  { key: 'edgeWidthNm', label: 'Edge width', reading: 'nm', unitLabel: 'nm', help: '10 %–90 % width of each edge at the reference thickness' },
  {
    key: 'peakInternalTransmission',
    label: 'Peak internal transmission',
    reading: 'fraction',
    help: 'Plateau transmission inside the glass at the reference thickness: 0.95 or 95 %',
  },
  { key: 'referenceThicknessMm', label: 'Reference thickness', reading: 'mm', unitLabel: 'mm', help: 'Thickness the curve is given for' },
  { key: 'thicknessMm', label: 'Thickness', reading: 'mm', unitLabel: 'mm', help: 'Thickness used in the stack' },
  { key: 'refractiveIndex', label: 'Refractive index', reading: 'number', help: 'For the surface reflection loss, e.g. 1.52' },
];

export const RANGE_FIELDS: readonly CalculatorField<'startNm' | 'endNm'>[] = [
  { key: 'startNm', label: 'Range start', reading: 'nm', unitLabel: 'nm', help: 'Shortest wavelength to plot' },
  { key: 'endNm', label: 'Range end', reading: 'nm', unitLabel: 'nm', help: 'Longest wavelength to plot' },
];

/** The fields a filter of this shape shows (a long-pass has no upper edge). */
export function glassFieldsFor(shape: GlassShape): readonly CalculatorField<GlassFilterKey>[] {
  return shape === 'band-pass' ? GLASS_FILTER_FIELDS : GLASS_FILTER_FIELDS.filter((f) => f.key !== 'upperEdgeNm');
}

/** A yellow long-pass glass of the usual 3 mm catalogue thickness (demo values). */
export function defaultGlassFilter(id: string): GlassFilterText {
  return {
    id,
    shape: 'long-pass',
    edgeNm: '495',
    upperEdgeNm: '',
    edgeWidthNm: '30',
    peakInternalTransmission: '0.95',
    referenceThicknessMm: '3',
    thicknessMm: '3',
    refractiveIndex: '1.52',
  };
}

export const GLASS_STACK_DEFAULTS: GlassStackText = {
  filters: [defaultGlassFilter('f1')],
  startNm: '350',
  endNm: '800',
};

export const MAX_GLASS_FILTERS = SELECTOR_LIMITS.maxStackFilters;

/** Wavelengths the stack is evaluated and drawn at. */
export const STACK_POINTS = 401;

/** Error key of one filter's field: `filters.<index>.<key>` (the API's path). */
export function glassErrorKey(index: number, key: string): string {
  return `filters.${index}.${key}`;
}

/** A filter's field named with its place in the stack, so a message is clear away from the field too. */
export function filterFieldLabel(index: number, label: string): string {
  return `Filter ${index + 1} ${label.toLowerCase()}`;
}

const SPOKEN: Record<string, string> = { edgeNm: 'the edge', upperEdgeNm: 'the upper edge' };

/** The typed stack as the API's input, or every field's message (filter fields keyed `filters.<i>.<key>`). */
export function checkGlassStack(text: GlassStackText): FormCheck<AbsorptionStackInput> {
  const errors: FieldErrors = {};
  let pending = false;
  const range = readFields(RANGE_FIELDS, text as unknown as Record<string, string>);
  Object.assign(errors, range.errors);
  pending ||= range.pending;
  const startNm = range.values.startNm as number | undefined;
  const endNm = range.values.endNm as number | undefined;
  Object.assign(errors, rangeErrors(RANGE_FIELDS[0]!, RANGE_FIELDS[1]!, startNm, endNm));

  const filters = text.filters.map((filter, index) => {
    const read = readFields(
      glassFieldsFor(filter.shape).map((field) => ({ ...field, label: filterFieldLabel(index, field.label) })),
      filter,
      `filters.${index}.`,
    );
    Object.assign(errors, read.errors);
    pending ||= read.pending;
    return { shape: filter.shape, ...read.values };
  });
  if (Object.keys(errors).length > 0) return { ok: false, errors, pending };

  const candidate = {
    kind: 'absorption-stack' as const,
    filters,
    wavelengthsNm: evenlySpaced(startNm!, endNm!, STACK_POINTS),
  };
  const parsed = absorptionStackInputSchema.safeParse(candidate);
  if (!parsed.success) {
    const fieldFor = (path: readonly PropertyKey[]) => {
      const [head, index, key] = path;
      if (head === 'wavelengthsNm') {
        return index === 0 ? RANGE_FIELDS[0]! : RANGE_FIELDS[1]!;
      }
      if (head === 'filters' && typeof index === 'number' && typeof key === 'string') {
        const field = GLASS_FILTER_FIELDS.find((f) => f.key === key);
        if (field) return { key: glassErrorKey(index, key), label: filterFieldLabel(index, field.label) };
      }
      return { key: 'filters', label: 'The stack' };
    };
    return { ok: false, errors: schemaErrors(parsed.error, fieldFor, SPOKEN), pending: false };
  }
  return { ok: true, input: parsed.data };
}
