import { beforeAll, describe, expect, it } from 'vitest';
import { loadUnitParser } from '../../../features/solver';
import { designSchema, exampleDesign } from '../../../shared/design';
import { fieldByPath } from '../../../features/workbench/fields';
import {
  ONE_MIRROR_HIDDEN_PATHS,
  canonicalText,
  carriesOwnUnit,
  designToForm,
  formToDesign,
  stepValue,
  type FormValues,
} from '../../../features/workbench/form-model';
import { presets } from '../../../features/workbench/presets';

beforeAll(loadUnitParser);

function edit(values: FormValues, path: string, text: string): FormValues {
  const [section, key] = path.split('.') as [keyof FormValues, string];
  return { ...values, [section]: { ...values[section], [key]: text } };
}

const field = (path: string) => {
  const spec = fieldByPath.get(path);
  if (!spec) throw new Error(`no field ${path}`);
  return spec;
};

describe('the editor text ↔ design', () => {
  it('round-trips the example design through the editor text unchanged', () => {
    const result = formToDesign(designToForm(exampleDesign));
    expect(result).toEqual({ ok: true, design: exampleDesign });
  });

  it.each(presets.map((p) => [p.title, p.design] as const))(
    'round-trips the preset "%s", which the schema accepts',
    (_title, design) => {
      expect(designSchema.safeParse(design).success).toBe(true);
      expect(formToDesign(designToForm(design))).toEqual({ ok: true, design });
    },
  );

  it.each([
    ['layout.cameraFocalMm', '0.5 m', 500],
    ['grating.grooveDensityPerMm', '1200/mm', 1200],
    ['grating.grooveDensityPerMm', '2400 l/mm', 2400],
    ['slits.exitWidthUm', '0.1 mm', 100],
    ['slits.entranceWidthUm', '25 um', 25],
    ['range.endNm', '0.9 um', 900],
  ] satisfies [string, string, number][])(
    'reads %s typed as "%s" as %d in the field unit',
    (path, text, expected) => {
      const result = formToDesign(edit(designToForm(exampleDesign), path, text));
      expect(result.ok).toBe(true);
      if (!result.ok) return;
      const [section, key] = path.split('.') as [string, string];
      expect(
        (result.design as unknown as Record<string, Record<string, number>>)[section]?.[key],
      ).toBeCloseTo(expected, 9);
    },
  );

  it('names the field and the reason for a negative slit width', () => {
    const result = formToDesign(edit(designToForm(exampleDesign), 'slits.exitWidthUm', '-5'));
    expect(result).toEqual({ ok: false, fields: { 'slits.exitWidthUm': 'must be greater than 0' } });
  });

  it('says which kind of unit a field expects when given the wrong dimension', () => {
    const result = formToDesign(edit(designToForm(exampleDesign), 'layout.collimatorFocalMm', '30 deg'));
    expect(result.ok).toBe(false);
    if (result.ok) return;
    expect(result.fields['layout.collimatorFocalMm']).toMatch(/length/);
  });

  it('reports unit errors and schema errors of different fields together', () => {
    let values = edit(designToForm(exampleDesign), 'grating.order', '1.5');
    values = edit(values, 'range.endNm', '200');
    const result = formToDesign(values);
    expect(result.ok).toBe(false);
    if (result.ok) return;
    expect(Object.keys(result.fields).sort()).toEqual(['grating.order', 'range.endNm']);
    expect(result.fields['range.endNm']).toBe('must be greater than the range start');
  });

  it('leaves out an optional section whose fields are all empty, and requires the rest of a half-filled one', () => {
    const values = designToForm(exampleDesign);
    const none = formToDesign({ ...values, detector: { pixelPitchUm: '', pixelCount: '' } });
    expect(none.ok && none.design.detector).toBeUndefined();
    const half = formToDesign({ ...values, detector: { pixelPitchUm: '25', pixelCount: '' } });
    expect(half).toEqual({ ok: false, fields: { 'detector.pixelCount': 'is required' } });
  });

  it('requires deviation 0 for Littrow on the deviation field', () => {
    const values = designToForm(exampleDesign);
    const result = formToDesign({ ...values, layout: { ...values.layout, kind: 'littrow' } });
    expect(result.ok).toBe(false);
    if (result.ok) return;
    expect(Object.keys(result.fields)).toEqual(['layout.deviationAngleDeg']);
  });
});

describe('field helpers', () => {
  it('shows the canonical reading only when the text differs from it', () => {
    expect(canonicalText(field('layout.cameraFocalMm'), '0.5 m')).toBe('500');
    expect(canonicalText(field('layout.cameraFocalMm'), '500')).toBeNull();
    expect(canonicalText(field('layout.cameraFocalMm'), 'half a metre')).toBeNull();
  });

  it('steps the groove density through catalogue values and the order past zero', () => {
    expect(stepValue(field('grating.grooveDensityPerMm'), '1200', 1)).toBe('1800');
    expect(stepValue(field('grating.grooveDensityPerMm'), '1000', -1)).toBe('900');
    expect(stepValue(field('grating.order'), '1', -1)).toBe('-1');
    expect(stepValue(field('grating.order'), '-1', 1)).toBe('1');
  });

  it('snaps a step to the grid and never goes below the field minimum', () => {
    expect(stepValue(field('slits.exitWidthUm'), '103', 1)).toBe('110');
    expect(stepValue(field('slits.exitWidthUm'), '103', -1)).toBe('100');
    expect(stepValue(field('slits.exitWidthUm'), '5', -1)).toBe('5');
    expect(stepValue(field('slits.exitWidthUm'), 'abc', 1)).toBeNull();
  });
});

describe('keyboard stepping (ArrowUp/ArrowDown, ×10 with Shift)', () => {
  it.each([
    { path: 'slits.exitWidthUm', text: '100', direction: 1, times: 10, next: '200' },
    { path: 'slits.exitWidthUm', text: '103', direction: 1, times: 10, next: '200' },
    { path: 'slits.exitWidthUm', text: '50', direction: -1, times: 10, next: '5' },
    { path: 'layout.deviationAngleDeg', text: '175', direction: 1, times: 10, next: '179' },
    { path: 'layout.collimatorOffAxisDeg', text: '89', direction: 1, times: 1, next: '89.5' },
    { path: 'layout.collimatorOffAxisDeg', text: '89.5', direction: 1, times: 1, next: '89.5' },
    { path: 'grating.order', text: '1', direction: -1, times: 10, next: '-10' },
    { path: 'grating.order', text: '5', direction: -1, times: 10, next: '-6' },
    { path: 'grating.order', text: '-3', direction: 1, times: 1, next: '-2' },
    { path: 'grating.order', text: '995', direction: 1, times: 10, next: '1000' },
    { path: 'detector.pixelCount', text: '1', direction: -1, times: 10, next: '1' },
    { path: 'grating.grooveDensityPerMm', text: '600', direction: 1, times: 10, next: '3600' },
    { path: 'grating.grooveDensityPerMm', text: '600', direction: -1, times: 10, next: '50' },
  ] satisfies { path: string; text: string; direction: 1 | -1; times: number; next: string }[])(
    '$path: $text stepped $direction × $times → $next',
    ({ path, text, direction, times, next }) => {
      expect(stepValue(field(path), text, direction, times)).toBe(next);
    },
  );

  it('lands every stepped value inside what the schema accepts', () => {
    for (const path of ['grating.order', 'layout.deviationAngleDeg', 'layout.cameraOffAxisDeg', 'detector.pixelCount']) {
      for (const direction of [1, -1] as const) {
        let values = designToForm(exampleDesign);
        for (let i = 0; i < 300; i++) {
          const [section, key] = path.split('.') as [keyof FormValues, string];
          const text = (values[section] as Record<string, string>)[key] ?? '';
          values = edit(values, path, stepValue(field(path), text, direction, 10) ?? text);
        }
        // Littrow aside, a deviation or angle at its stepper's end is still a valid design.
        expect(formToDesign(values).ok, `${path} ${direction}`).toBe(true);
      }
    }
  });
});

describe('the unit suffix', () => {
  it.each([
    { text: '-25', own: false },
    { text: '\u221225', own: false },
    { text: '0.5', own: false },
    { text: '1e3', own: false },
    { text: '', own: false },
    { text: '-25 µm', own: true },
    { text: '0.5 m', own: true },
    { text: '1200/mm', own: true },
  ] satisfies { text: string; own: boolean }[])('"$text" names its own unit: $own', ({ text, own }) => {
    expect(carriesOwnUnit(text)).toBe(own);
  });
});

describe('an Ebert–Fastie in the editor', () => {
  it('takes the camera from its one mirror, whatever the hidden camera fields still hold', () => {
    let values = edit(designToForm(exampleDesign), 'layout.kind', 'ebert-fastie');
    values = edit(values, 'layout.cameraFocalMm', '450');
    values = edit(values, 'layout.cameraOffAxisDeg', 'not a number');
    const result = formToDesign(values);
    expect(result.ok).toBe(true);
    if (!result.ok) return;
    expect(result.design.layout.cameraFocalMm).toBe(exampleDesign.layout.collimatorFocalMm);
    expect(result.design.layout.cameraOffAxisDeg).toBe(exampleDesign.layout.collimatorOffAxisDeg);
    expect(ONE_MIRROR_HIDDEN_PATHS).toEqual(new Set(['layout.cameraFocalMm', 'layout.cameraOffAxisDeg']));
  });

  it('keeps the camera fields for a switch back to Czerny–Turner', () => {
    const values = edit(designToForm(exampleDesign), 'layout.cameraFocalMm', '450');
    const result = formToDesign(values);
    expect(result.ok && result.design.layout.cameraFocalMm).toBe(450);
  });
});
