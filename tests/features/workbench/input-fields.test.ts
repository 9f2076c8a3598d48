import { describe, expect, it } from 'vitest';
import { loadUnitParser } from '@/features/solver';
import { designToForm, formToDesign, formValuesSchema } from '@/features/workbench/form-model';
import { blankInputText, inputFromText, inputToText } from '@/features/workbench/input-fields';
import type { DesignCurve } from '@/shared/curves';
import { exampleDesign, type Design } from '@/shared/design';

const curve: DesignCurve = {
  kind: 'grating-efficiency',
  name: 'Ruled 1200/mm, batch 7',
  checksum: 'a'.repeat(64),
  medium: 'air',
  order: 1,
  wavelengthsNm: [300, 450.5, 900],
  values: [0.31, 0.72, 0.4],
};

describe('the light input and curves in the editor form', () => {
  it('reads back a design with an input and a curve exactly, through a stored draft too', async () => {
    await loadUnitParser();
    for (const input of [
      { kind: 'fibre', numericalAperture: 0.22, coreDiameterUm: 200 },
      { kind: 'lens', fNumber: 3.9 },
      { kind: 'free-space' },
      { kind: 'free-space', fNumber: 2 },
    ] as const) {
      const design: Design = { ...exampleDesign, input, curves: [curve] };
      const form = formValuesSchema.parse(JSON.parse(JSON.stringify(designToForm(design))));
      const read = formToDesign(form);
      expect(read.ok && read.design).toEqual(design);
    }
  });
  it('keeps a design without an input or curves without them', () => {
    const form = designToForm(exampleDesign);
    expect(form.input).toEqual(blankInputText());
    expect(form.curves).toBeNull();
    const read = formToDesign(form);
    expect(read.ok && 'input' in read.design).toBe(false);
    expect(read.ok && 'curves' in read.design).toBe(false);
  });
  it('reads drafts saved before the light budget existed as no input and no curves', () => {
    const { input: _input, curves: _curves, ...old } = designToForm(exampleDesign);
    const parsed = formValuesSchema.parse(old);
    expect(parsed.input.kind).toBe('');
    expect(parsed.curves).toBeNull();
  });
  it('names the field of a missing or unreadable value, and the schema’s bounds on it', async () => {
    await loadUnitParser();
    expect(inputFromText({ ...blankInputText(), kind: 'fibre', numericalAperture: 'abc' }).errors).toEqual({
      'input.numericalAperture': 'must be a number',
      'input.coreDiameterUm': 'is required',
    });
    // Free space may leave its f-number out.
    expect(inputFromText({ ...blankInputText(), kind: 'free-space' }).errors).toEqual({});
    const form = designToForm(exampleDesign);
    const read = formToDesign({ ...form, input: { ...blankInputText(), kind: 'fibre', numericalAperture: '1.4', coreDiameterUm: '0.2 mm' } });
    expect(read.ok ? null : read.fields).toEqual({ 'input.numericalAperture': 'must be at most 1 (in air)' });
  });
  it('reads a core diameter in any length unit and an f-number typed as "f/4"', async () => {
    await loadUnitParser();
    expect(inputFromText({ ...blankInputText(), kind: 'fibre', numericalAperture: '0.22', coreDiameterUm: '0.2 mm' }).input).toEqual({
      kind: 'fibre',
      numericalAperture: 0.22,
      coreDiameterUm: 200,
    });
    expect(inputFromText({ ...blankInputText(), kind: 'lens', fNumber: 'f/4' }).input).toEqual({ kind: 'lens', fNumber: 4 });
    expect(inputToText({ kind: 'lens', fNumber: 4 }).fNumber).toBe('4');
  });
});
