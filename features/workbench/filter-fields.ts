import { z } from 'zod';
import { parseQuantity } from '@/features/solver';
import { filterFieldWords } from '@/shared/design-fields';
import { FILTER_KINDS, MAX_DESIGN_FILTERS, type FilterKind, type OrderSortingFilter } from '@/shared/filters';
import type { FieldErrors } from '@/shared/validation';

/**
 * The design's order-sorting filters as the editor holds them: one row of typed text per filter,
 * like the design's own fields, so a half-typed "0.39 µm" or a refused value survives a reload
 * with its message. `null` when the design states no `filters` list at all, which is kept apart
 * from an empty list so a stored design reads back exactly as it was saved.
 */
export type FilterRowText = {
  kind: FilterKind;
  cutOnNm: string;
  inFromNm: string;
  inToNm: string;
  edgeWidthNm: string;
};

export type FiltersText = FilterRowText[] | null;

/** The typed fields of a row, in the order the card shows them. */
export const FILTER_TEXT_KEYS = ['cutOnNm', 'inFromNm', 'inToNm', 'edgeWidthNm'] as const;
export type FilterTextKey = (typeof FILTER_TEXT_KEYS)[number];

/** What each field wants, shown while it has the focus. */
export const filterFieldHelp: Readonly<Record<FilterTextKey, string>> = {
  cutOnNm: 'Where the edge passes half the light, e.g. 390 nm or 0.39 µm.',
  inFromNm: 'The filter goes into the beam when the instrument is set here…',
  inToNm: '…and comes out here.',
  edgeWidthNm: 'From blocking to full transmission, e.g. 10 nm (a few per cent of the cut-on for coloured glass).',
};

const text = z.string().max(200);

/** One row as a draft stores it. */
export const filterRowTextSchema = z.object({
  kind: z.enum(FILTER_KINDS),
  cutOnNm: text,
  inFromNm: text,
  inToNm: text,
  edgeWidthNm: text,
});

/** The rows as a draft stores them; drafts saved before filters existed read as none. */
export const filtersTextSchema = z.array(filterRowTextSchema).max(MAX_DESIGN_FILTERS).nullable().default(null);

/**
 * A stored number as text that reads back as the very same number: the shortest round-trip
 * form, not the 12 significant figures of the other fields, so a saved filter survives an edit
 * of something else byte for byte.
 */
function exactText(value: number): string {
  return String(value);
}

export function filterToText(filter: OrderSortingFilter): FilterRowText {
  return {
    kind: filter.kind,
    cutOnNm: exactText(filter.cutOnNm),
    inFromNm: exactText(filter.inFromNm),
    inToNm: exactText(filter.inToNm),
    edgeWidthNm: exactText(filter.edgeWidthNm),
  };
}

/** The editor's rows for a stored list; `null` for a design without one. */
export function filtersToText(filters: readonly OrderSortingFilter[] | undefined): FiltersText {
  return filters === undefined ? null : filters.map(filterToText);
}

/** mathjs reads "angstrom" but not the Å sign (as the requirements' fields). */
export function readFilterText(typed: string): { ok: true; value: number } | { ok: false; message: string; pending?: boolean } {
  const trimmed = typed.trim();
  if (trimmed === '') return { ok: false, message: 'is required' };
  return parseQuantity(trimmed.replace(/\s*[ÅÅ]/g, ' angstrom'), 'nm');
}

/**
 * The filters the typed rows make, with a plain-words reason per field it cannot read (the
 * shared schema checks the numbers afterwards). `undefined` when the design states no list.
 */
export function filtersFromText(rows: FiltersText | undefined): {
  filters: Record<string, unknown>[] | undefined;
  errors: FieldErrors;
} {
  const errors: FieldErrors = {};
  if (rows === null || rows === undefined) return { filters: undefined, errors };
  const filters = rows.map((row, index) => {
    const out: Record<string, unknown> = { kind: row.kind };
    for (const key of FILTER_TEXT_KEYS) {
      const read = readFilterText(row[key] ?? '');
      if (read.ok) out[key] = read.value;
      else errors[`filters.${index}.${key}`] = read.message;
    }
    return out;
  });
  return { filters, errors };
}

/** "Filter 2 cut-on": a row's field as the card labels it, counting from 1. */
export function filterFieldLabel(index: number, key: FilterTextKey): string {
  return `Filter ${index + 1} ${filterFieldWords[key].short}`;
}

/** A filter key inside a schema message ("must be greater than inFromNm"), said in words. */
export function spokenFilterKey(key: string): string | null {
  return key in filterFieldWords ? filterFieldWords[key as keyof OrderSortingFilter].spoken : null;
}
