import { beforeAll, describe, expect, it } from 'vitest';
import { loadUnitParser } from '../../../features/solver';
import type { Design } from '../../../shared/design';
import { exampleDesign } from '../../../shared/design';
import { designToForm, formToDesign, formValuesSchema, type FormValues } from '../../../features/workbench/form-model';
import { SCRATCH_KEY, draftSchema, loadDraft } from '../../../features/workbench/draft';
import { withFakeLocalStorage } from '../../support/fake-local-storage';
import { blankRequirementsText } from '../../../features/workbench/requirement-fields';
import { fieldLabel } from '../../../features/workbench/fields';

beforeAll(loadUnitParser);

/** Every requirement the schema knows, each a value a designer might type (invented for the test). */
const everyRequirement = {
  maxBandpassNm: 0.5,
  minResolvingPower: 2000,
  atWavelengthsNm: [404.7, 546.1],
  minBlazeEfficiency: 0.4,
  maxFNumber: 4,
  maxFocalLengthMm: 400,
  maxFootprintMm: { widthMm: 300, depthMm: 200 },
  minPixelsPerBandpass: 2,
  oneShotCoverage: false,
  maxWavelengthErrorNm: 0.05,
  driveStepArcsec: 2,
  maxReciprocalDispersionNmPerMm: 3.2,
  orderOverlap: 'forbidden',
} satisfies NonNullable<Design['requirements']>;

function withRequirements(text: Partial<FormValues['requirements']>): FormValues {
  const form = designToForm(exampleDesign);
  return { ...form, requirements: { ...form.requirements, ...text } };
}

function designOf(values: FormValues): Design {
  const result = formToDesign(values);
  if (!result.ok) throw new Error(JSON.stringify(result.fields));
  return result.design;
}

describe('requirements in the editor text', () => {
  it('keeps every requirement of a saved version exactly through the editor and back', () => {
    const design: Design = { ...exampleDesign, requirements: everyRequirement };
    expect(formToDesign(designToForm(design))).toEqual({ ok: true, design });
  });

  it('keeps oneShotCoverage true as true', () => {
    const design: Design = { ...exampleDesign, requirements: { oneShotCoverage: true } };
    expect(formToDesign(designToForm(design))).toEqual({ ok: true, design });
  });

  it('leaves a version without requirements without them (no empty block appears)', () => {
    expect(exampleDesign.requirements).toBeUndefined();
    const again = designOf(designToForm(exampleDesign));
    expect('requirements' in again).toBe(false);
  });

  it('reads units: "5 Å" is 0.5 nm, "0.1 mm" is a focal length of 0.1 mm, "2 nm/mm" a dispersion', () => {
    // 1 Å = 0.1 nm (SI definition), so 5 Å = 0.5 nm.
    const design = designOf(
      withRequirements({ maxBandpassNm: '5 Å', maxFocalLengthMm: '0.4 m', maxReciprocalDispersionNmPerMm: '20 Å/mm' }),
    );
    expect(design.requirements?.maxBandpassNm).toBeCloseTo(0.5, 12);
    expect(design.requirements?.maxFocalLengthMm).toBeCloseTo(400, 9);
    expect(design.requirements?.maxReciprocalDispersionNmPerMm).toBeCloseTo(2, 12);
  });

  it('reads a wavelength list, a unit after the last item applying to the bare numbers before it', () => {
    const design = designOf(withRequirements({ atWavelengthsNm: '404.7, 0.5461 um; 800 nm' }));
    expect(design.requirements?.atWavelengthsNm).toEqual([404.7, 546.1, 800]);
    const micro = designOf(withRequirements({ atWavelengthsNm: '0.4, 0.5 um' }));
    expect(micro.requirements?.atWavelengthsNm?.map((nm) => Math.round(nm * 1e6) / 1e6)).toEqual([400, 500]);
  });

  it('reads blaze efficiency typed as a percent or as a fraction, and stores a fraction', () => {
    expect(designOf(withRequirements({ minBlazeEfficiency: '40 %' })).requirements?.minBlazeEfficiency).toBe(0.4);
    expect(designOf(withRequirements({ minBlazeEfficiency: '0.4' })).requirements?.minBlazeEfficiency).toBe(0.4);
  });

  it('refuses "40" for efficiency with a message that says to type a fraction or a percent', () => {
    const result = formToDesign(withRequirements({ minBlazeEfficiency: '40' }));
    expect(result.ok).toBe(false);
    if (!result.ok) expect(result.fields['requirements.minBlazeEfficiency']).toMatch(/at most 1.*40 %/);
  });

  it.each([
    ['requirements.maxBandpassNm', { maxBandpassNm: 'wide' }, /could not read/],
    ['requirements.maxBandpassNm', { maxBandpassNm: '-1 nm' }, /greater than 0/],
    ['requirements.minResolvingPower', { minResolvingPower: 'lots' }, /could not read "lots"/],
    ['requirements.atWavelengthsNm', { atWavelengthsNm: '400, , 500' }, /empty item 2/],
    ['requirements.atWavelengthsNm', { atWavelengthsNm: '400, -5' }, /wavelength 2 must be greater than 0/],
    ['requirements.maxFNumber', { maxFNumber: '0.1' }, /at least 0.5/],
    ['requirements.maxFootprintMm.depthMm', { maxFootprintMm: { widthMm: '300', depthMm: '' } }, /required/],
    ['requirements.driveStepArcsec', { maxWavelengthErrorNm: '0.05' }, /required with the wavelength error at most/],
  ] satisfies [string, Partial<FormValues['requirements']>, RegExp][])(
    'a bad %s gets a message on that field',
    (path, text, message) => {
      const result = formToDesign(withRequirements(text));
      expect(result.ok).toBe(false);
      if (!result.ok) expect(result.fields[path]).toMatch(message);
    },
  );

  it('names requirement fields in the editor’s words', () => {
    expect(fieldLabel('requirements.maxFootprintMm.widthMm')).toBe('Footprint width at most');
    expect(fieldLabel('requirements.maxBandpassNm')).toBe('Bandpass at most');
    expect(fieldLabel('slits.exitWidthUm')).toBe('Exit slit width');
  });
});

describe('drafts saved before requirements existed', () => {
  it('still load, with every requirement blank, and make the same design', () => {
    const { requirements: _none, ...old } = designToForm(exampleDesign);
    const parsed = formValuesSchema.safeParse(old);
    expect(parsed.success).toBe(true);
    if (!parsed.success) return;
    expect(parsed.data.requirements).toEqual(blankRequirementsText());
    expect(formToDesign(parsed.data)).toEqual({ ok: true, design: exampleDesign });
    // A notebook's unsaved edits keep the same draft (features/notebooks/draft-store.ts uses draftSchema).
    const draft = draftSchema.safeParse({ values: old, selectedNm: '500', presetId: null });
    expect(draft.success).toBe(true);
  });
});

describe('drafts in local storage from before requirements', () => {
  const local = withFakeLocalStorage();

  it('the scratch draft opens with its text and no requirements', () => {
    const { requirements: _none, ...old } = designToForm(exampleDesign);
    const stored = { values: old, selectedNm: '612.5', presetId: null };
    local.items.set(SCRATCH_KEY, JSON.stringify({ version: 1, value: stored }));
    const draft = loadDraft();
    expect(draft.selectedNm).toBe('612.5');
    expect(draft.values.requirements).toEqual(blankRequirementsText());
    expect(formToDesign(draft.values)).toEqual({ ok: true, design: exampleDesign });
  });
});
