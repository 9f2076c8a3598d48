/**
 * The prism calculator's fields (material, apex, base, range and the optional monochromator
 * around it), its defaults and the checked input they make. Pure: no React.
 */

import { PRISM_MATERIALS } from '@/features/solver';
import { prismInputSchema, PRISM_MATERIAL_IDS, type PrismInput, type PrismMaterialId } from '@/shared/selectors';
import { evenlySpaced, rangeErrors, readFields, schemaErrors, type FormCheck } from './form-check';
import type { CalculatorField } from './field-reading';

export type PrismMaterialChoice = PrismMaterialId | 'custom';

export type PrismKey =
  | 'sellmeierB'
  | 'sellmeierC'
  | 'apexDeg'
  | 'baseMm'
  | 'startNm'
  | 'endNm'
  | 'collimatorFocalMm'
  | 'cameraFocalMm'
  | 'entranceWidthUm'
  | 'exitWidthUm';

export type PrismText = { material: PrismMaterialChoice } & Record<PrismKey, string>;

export const PRISM_FIELDS: readonly CalculatorField<PrismKey>[] = [
  {
    key: 'sellmeierB',
    label: 'Sellmeier B',
    reading: 'number-list',
    help: 'Coefficients B₁, B₂, … separated by commas',
  },
  {
    key: 'sellmeierC',
    label: 'Sellmeier C (µm)',
    reading: 'number-list',
    help: 'Resonance wavelengths C₁, C₂, … in µm, squared in the formula as Malitson writes it',
  },
  { key: 'apexDeg', label: 'Apex angle', reading: 'deg', unitLabel: '°', help: 'Refracting angle, above 0 and below 180°' },
  { key: 'baseMm', label: 'Base length', reading: 'mm', unitLabel: 'mm', help: 'Longest glass path; the beam is taken to fill it' },
  { key: 'startNm', label: 'Range start', reading: 'nm', unitLabel: 'nm', help: 'Shortest wavelength' },
  { key: 'endNm', label: 'Range end', reading: 'nm', unitLabel: 'nm', help: 'Longest wavelength' },
  { key: 'collimatorFocalMm', label: 'Collimator focal length', reading: 'mm', unitLabel: 'mm', help: 'Optional: with the camera and both slits, gives the bandpass', optional: true },
  { key: 'cameraFocalMm', label: 'Camera focal length', reading: 'mm', unitLabel: 'mm', help: 'Optional: with the collimator and both slits, gives the bandpass', optional: true },
  { key: 'entranceWidthUm', label: 'Entrance slit', reading: 'um', unitLabel: 'µm', help: 'Optional: width, e.g. 50 µm', optional: true },
  { key: 'exitWidthUm', label: 'Exit slit', reading: 'um', unitLabel: 'µm', help: 'Optional: width, e.g. 50 µm', optional: true },
];

const FIELD = Object.fromEntries(PRISM_FIELDS.map((f) => [f.key, f])) as Record<PrismKey, CalculatorField<PrismKey>>;

export const MONOCHROMATOR_KEYS = ['collimatorFocalMm', 'cameraFocalMm', 'entranceWidthUm', 'exitWidthUm'] as const satisfies readonly PrismKey[];

export const PRISM_MATERIAL_CHOICES: readonly { value: PrismMaterialChoice; label: string }[] = [
  ...PRISM_MATERIAL_IDS.map((id) => ({ value: id, label: PRISM_MATERIALS[id].label })),
  { value: 'custom', label: 'Your own Sellmeier formula' },
];

/** A 60° fused-silica prism with a small monochromator around it (demo values). */
export const PRISM_DEFAULTS: PrismText = {
  material: 'fused-silica',
  // Start a custom formula from fused silica's coefficients, so it reads as an example.
  sellmeierB: PRISM_MATERIALS['fused-silica'].sellmeier.B.join(', '),
  sellmeierC: PRISM_MATERIALS['fused-silica'].sellmeier.C.join(', '),
  apexDeg: '60',
  baseMm: '50',
  startNm: '350',
  endNm: '1000',
  collimatorFocalMm: '250',
  cameraFocalMm: '250',
  entranceWidthUm: '50',
  exitWidthUm: '50',
};

/** Wavelengths the prism is evaluated and drawn at. */
export const PRISM_POINTS = 201;

/** The fields the chosen material shows: the Sellmeier lists only for a custom formula. */
export function prismFieldsFor(material: PrismMaterialChoice): readonly CalculatorField<PrismKey>[] {
  return material === 'custom' ? PRISM_FIELDS : PRISM_FIELDS.filter((f) => f.key !== 'sellmeierB' && f.key !== 'sellmeierC');
}

function fieldForPath(path: readonly PropertyKey[], count: number): CalculatorField | null {
  const [head, sub, list] = path;
  if (head === 'material') {
    if (sub === 'sellmeier' && list === 'C') return FIELD.sellmeierC;
    return FIELD.sellmeierB;
  }
  if (head === 'wavelengthsNm') return sub === 0 && count > 1 ? FIELD.startNm : FIELD.endNm;
  return (FIELD as Record<string, CalculatorField>)[String(head)] ?? null;
}

/** The typed text as the API's input, or every field's message. */
export function checkPrism(text: PrismText): FormCheck<PrismInput> {
  const read = readFields(prismFieldsFor(text.material), text as unknown as Record<string, string>);
  const v = read.values as Partial<Record<PrismKey, number>> & { sellmeierB?: number[]; sellmeierC?: number[] };
  const errors = { ...read.errors, ...rangeErrors(FIELD.startNm, FIELD.endNm, v.startNm, v.endNm) };
  if (Object.keys(errors).length > 0) return { ok: false, errors, pending: read.pending };
  const wavelengthsNm = evenlySpaced(v.startNm!, v.endNm!, PRISM_POINTS);
  const optional = Object.fromEntries(MONOCHROMATOR_KEYS.filter((k) => v[k] !== undefined).map((k) => [k, v[k]]));
  const candidate = {
    kind: 'prism' as const,
    material: text.material === 'custom' ? { sellmeier: { B: v.sellmeierB, C: v.sellmeierC } } : text.material,
    apexDeg: v.apexDeg,
    baseMm: v.baseMm,
    wavelengthsNm,
    ...optional,
  };
  const parsed = prismInputSchema.safeParse(candidate);
  if (!parsed.success) {
    return {
      ok: false,
      errors: schemaErrors(parsed.error, (path) => fieldForPath(path, wavelengthsNm.length), { B: 'Sellmeier B' }),
      pending: false,
    };
  }
  return { ok: true, input: parsed.data };
}

/** The monochromator fields left blank while others are filled: the bandpass needs all four. */
export function missingMonochromatorFields(text: PrismText): CalculatorField[] {
  const blank = MONOCHROMATOR_KEYS.filter((k) => text[k].trim() === '');
  return blank.length === 0 || blank.length === MONOCHROMATOR_KEYS.length ? [] : blank.map((k) => FIELD[k]);
}
