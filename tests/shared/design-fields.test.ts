import { describe, expect, it } from 'vitest';
import { z } from 'zod';
import { LAYOUT_KINDS, designSchema } from '@/shared/design';
import { fibreInputSchema, freeSpaceInputSchema, lensInputSchema } from '@/shared/light-input';
import {
  describeDesignPath,
  describedFields,
  inputFieldWords,
  describedSections,
  fieldLabel,
  fieldTableName,
  layoutKindOptions,
} from '@/shared/design-fields';

/** Every leaf path of the zod schema's parameter sections (requirements are described apart), read from the schema alone. */
function schemaPaths(): string[] {
  return parameterSections().flatMap(([section, schema]) => {
    const inner = schema instanceof z.ZodOptional ? schema.unwrap() : schema;
    return Object.keys((inner as z.ZodObject).shape).map((key) => `${section}.${key}`);
  });
}

// The words the editor and the compare tables showed before they were derived; browser tests
// assert some of them, so a change here is a visible change.
const words = {
  'grating.grooveDensityPerMm': ['Groove density', 'Grating: groove density (/mm)'],
  'grating.order': ['Diffraction order', 'Grating: order'],
  'grating.blazeWavelengthNm': ['Blaze wavelength (first-order Littrow)', 'Grating: blaze wavelength (nm)'],
  'grating.ruledWidthMm': ['Ruled width', 'Grating: ruled width (mm)'],
  'grating.ruledHeightMm': ['Ruled height', 'Grating: ruled height (mm)'],
  'layout.kind': ['Mount type', 'Layout: kind'],
  'layout.deviationAngleDeg': ['Deviation angle', 'Layout: deviation angle (°)'],
  'layout.collimatorFocalMm': ['Collimator focal length', 'Layout: collimator focal length (mm)'],
  'layout.cameraFocalMm': ['Camera focal length', 'Layout: camera focal length (mm)'],
  'layout.collimatorOffAxisDeg': ['Collimator off-axis angle', 'Layout: collimator off-axis angle (°)'],
  'layout.cameraOffAxisDeg': ['Camera off-axis angle', 'Layout: camera off-axis angle (°)'],
  'slits.entranceWidthUm': ['Entrance slit width', 'Slits: entrance width (µm)'],
  'slits.exitWidthUm': ['Exit slit width', 'Slits: exit width (µm)'],
  'slits.heightMm': ['Slit height', 'Slits: height (mm)'],
  'range.startNm': ['Range start', 'Range: start (nm)'],
  'range.endNm': ['Range end', 'Range: end (nm)'],
  'source.minNm': ['Shortest wavelength emitted', 'Source: shortest wavelength (nm)'],
  'source.maxNm': ['Longest wavelength emitted', 'Source: longest wavelength (nm)'],
  'detector.pixelPitchUm': ['Pixel pitch', 'Detector: pixel pitch (µm)'],
  'detector.pixelCount': ['Pixel count', 'Detector: pixel count'],
} satisfies Record<string, [editor: string, table: string]>;

function parameterSections() {
  // Requirements and the filter list have editors of their own (a limit block and a list).
  return Object.entries(designSchema.shape).filter(([section]) => !['requirements', 'filters', 'input', 'curves'].includes(section));
}

describe('the described design schema', () => {
  it('describes every field of the zod schema exactly once, in the schema’s order', () => {
    expect(describedFields.map((field) => field.path)).toEqual(schemaPaths());
  });

  it('gives every field a label of its own and a key no other section uses', () => {
    const labels = describedFields.map((field) => field.label);
    expect(new Set(labels).size).toBe(labels.length);
    const keys = describedFields.map((field) => field.key);
    expect(new Set(keys).size).toBe(keys.length);
  });

  it.each(Object.entries(words))('names %s as before in the editor and in tables', (path, [label, table]) => {
    expect(fieldLabel(path)).toBe(label);
    expect(describeDesignPath(path)).toBe(table);
  });

  it('names whole sections and unknown paths in tables', () => {
    expect(describeDesignPath('detector')).toBe('Detector');
    expect(describeDesignPath('layout')).toBe('Layout');
    expect(describeDesignPath('grating.nonsense')).toBe('Grating: nonsense');
    expect(fieldLabel('grating.nonsense')).toBe('grating.nonsense');
    expect(fieldTableName('exitWidthUm')).toBe('exit width (µm)');
  });

  it('reads which sections and fields are optional from the zod schema', () => {
    expect(describedSections.filter((s) => s.optional).map((s) => s.id)).toEqual(['source', 'detector']);
    expect(describedFields.filter((f) => f.optional).map((f) => f.path)).toEqual([
      'grating.blazeWavelengthNm',
      'layout.collimatorOffAxisDeg',
      'layout.cameraOffAxisDeg',
    ]);
  });

  it('offers every mount kind of the schema, in its order', () => {
    expect(layoutKindOptions.map((option) => option.value)).toEqual([...LAYOUT_KINDS]);
  });
});

describe('stepper bounds', () => {
  it('gives every integer field a step, and keeps every max inside what the schema accepts', () => {
    for (const field of describedFields) {
      if (field.kind === 'integer') expect(field.step, field.path).toBeGreaterThan(0);
      if (field.kind === 'choice' || field.max === undefined) continue;
      const [section, key] = field.path.split('.') as [keyof typeof designSchema.shape, string];
      const inner = designSchema.shape[section];
      const shape = (inner instanceof z.ZodOptional ? inner.unwrap() : inner) as z.ZodObject;
      const schema = shape.shape[key] as z.ZodType;
      expect(schema.safeParse(field.max).success, `${field.path} max ${field.max}`).toBe(true);
      // One more step would be refused: the max is the last value on the step grid.
      const step = typeof field.step === 'number' ? field.step : 1;
      expect(schema.safeParse(field.max + step).success, `${field.path} past max`).toBe(false);
    }
  });
});

describe('the light input and measured curves in tables', () => {
  it.each([
    ['input', 'Light input', 'Light input'],
    ['input.kind', 'Light input: kind', 'Light input'],
    ['input.numericalAperture', 'Light input: numerical aperture', 'Numerical aperture'],
    ['input.coreDiameterUm', 'Light input: core diameter (µm)', 'Core diameter'],
    ['input.fNumber', 'Light input: f-number', 'Input f-number'],
  ] satisfies [string, string, string][])('names %s in tables and in the editor', (path, table, label) => {
    expect(describeDesignPath(path)).toBe(table);
    expect(fieldLabel(path)).toBe(label);
  });

  it('has words for every field any input kind carries, read from the schemas', () => {
    const keys = [fibreInputSchema, freeSpaceInputSchema, lensInputSchema].flatMap((schema) => Object.keys(schema.shape));
    expect(Object.keys(inputFieldWords).sort()).toEqual([...new Set(keys)].sort());
  });

  it('counts curves from 1 and names one by its kind when the designs compared say what it is', () => {
    const design = { curves: [{ kind: 'mirror-reflectance' }, { kind: 'grating-efficiency' }] };
    expect(describeDesignPath('curves.1.name', design)).toBe('Curve 2 (grating efficiency): name');
    expect(describeDesignPath('curves.1.points', undefined, design)).toBe('Curve 2 (grating efficiency): points');
    expect(describeDesignPath('curves.1.name')).toBe('Curve 2: name');
    expect(describeDesignPath('curves.0')).toBe('Curve 1');
    expect(describeDesignPath('curves')).toBe('Measured curves');
    expect(fieldLabel('curves.1.filterNumber')).toBe('Curve 2 filter');
  });
});
