import { describe, expect, it } from 'vitest';
import { z } from 'zod';
import { designSchema, exampleDesign } from '@/shared/design';
import { sections } from '@/features/workbench/fields';
import { designToForm, formToDesign, formValuesSchema } from '@/features/workbench/form-model';

/** Every leaf path of the zod schema's parameter sections (requirements and filters are described apart), read from the schema alone. */
function schemaPaths(): string[] {
  return parameterSections().flatMap(([section, schema]) => {
    const inner = schema instanceof z.ZodOptional ? schema.unwrap() : schema;
    return Object.keys((inner as z.ZodObject).shape).map((key) => `${section}.${key}`);
  });
}

function parameterSections() {
  return Object.entries(designSchema.shape).filter(([section]) => !['requirements', 'filters', 'input', 'curves'].includes(section));
}

describe('the editor fields and form, derived from the described schema', () => {
  it('gives the editor every typed field, with the mount kind left to its own picker', () => {
    expect(sections.map((s) => [s.id, s.title])).toEqual([
      ['grating', 'Grating'],
      ['layout', 'Mount'],
      ['slits', 'Slits'],
      ['range', 'Wavelength range'],
      ['source', 'Light source'],
      ['detector', 'Detector'],
    ]);
    expect(sections.flatMap((s) => s.fields.map((f) => f.path))).toEqual(
      schemaPaths().filter((path) => path !== 'layout.kind'),
    );
  });

  it('holds every field as text in the editor form, and an absent one as empty text', () => {
    const { source: _source, ...withoutSource } = exampleDesign;
    const form = designToForm(withoutSource);
    // The parameter sections, then the requirements' text (requirement-fields.test.ts covers it)
    // and the filters' rows (filter-fields.test.ts).
    expect(Object.keys(form)).toEqual([...parameterSections().map(([section]) => section), 'requirements', 'filters', 'input', 'curves']);
    expect(form.source).toEqual({ minNm: '', maxNm: '' });
    expect(form.layout.kind).toBe('czerny-turner');
    expect(form.grating.grooveDensityPerMm).toBe('1200');
  });

  it('stores a draft’s form with every field and refuses an unknown mount kind', () => {
    const form = designToForm(exampleDesign);
    expect(formValuesSchema.parse(form)).toEqual(form);
    expect(formValuesSchema.safeParse({ ...form, layout: { ...form.layout, kind: 'rowland' } }).success).toBe(
      false,
    );
    const { exitWidthUm: _exit, ...slits } = form.slits;
    expect(formValuesSchema.safeParse({ ...form, slits }).success).toBe(false);
  });

  it('says field names inside schema messages the way the editor labels them', () => {
    const form = designToForm(exampleDesign);
    const result = formToDesign({ ...form, source: { minNm: '900', maxNm: '400' } });
    expect(result.ok ? null : result.fields['source.maxNm']).toBe(
      'must be greater than the shortest wavelength emitted',
    );
  });
});
