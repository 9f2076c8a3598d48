import { z } from 'zod';
import { parseQuantity } from '@/features/solver';
import { curvesSchema, type DesignCurve } from '@/shared/curves';
import { INPUT_KINDS, type InputKind, type LightInput } from '@/shared/light-input';
import type { FieldErrors } from '@/shared/validation';

/**
 * The design's light input as the editor holds it: the chosen kind and each field as typed, so a
 * half-typed "0.22" survives a reload like the design's own fields. `kind: ''` is a design that
 * states no input (taken as matched), kept apart from any input so a stored design reads back
 * exactly as it was saved. The fields of the kinds not chosen keep their text for a switch back.
 */
export type InputText = {
  kind: '' | InputKind;
  fNumber: string;
  numericalAperture: string;
  coreDiameterUm: string;
};

export const INPUT_TEXT_KEYS = ['fNumber', 'numericalAperture', 'coreDiameterUm'] as const;
export type InputTextKey = (typeof INPUT_TEXT_KEYS)[number];

/** The fields each kind shows, in order; `fNumber` is optional for free space. */
export const INPUT_KIND_FIELDS: Readonly<Record<InputKind, readonly InputTextKey[]>> = {
  'free-space': ['fNumber'],
  fibre: ['numericalAperture', 'coreDiameterUm'],
  lens: ['fNumber'],
};

export const inputKindWords: Readonly<Record<'' | InputKind, { label: string; help: string }>> = {
  '': { label: 'Not given', help: 'Taken as matched to the instrument: the input coupling is not counted.' },
  'free-space': { label: 'Free space', help: 'A source at or imaged onto the slit; give its cone as an f-number if known.' },
  fibre: { label: 'Fibre', help: 'A fibre butted against the slit: its NA sets the cone (f/# ≈ 1/(2 NA)), its core the spot.' },
  lens: { label: 'Lens', help: 'A lens focusing the source onto the slit at an f-number.' },
};

export const inputFieldWords: Readonly<Record<InputTextKey, { label: string; unit: string; help: string }>> = {
  fNumber: { label: 'Input f-number', unit: '', help: 'The cone the input fills, e.g. 4 for f/4.' },
  numericalAperture: { label: 'Numerical aperture', unit: '', help: 'The fibre’s NA, e.g. 0.22.' },
  coreDiameterUm: { label: 'Core diameter', unit: 'µm', help: 'e.g. 200 µm or 0.2 mm.' },
};

const text = z.string().max(200);

export const inputTextSchema = z
  .object({
    kind: z.enum(['', ...INPUT_KINDS]),
    fNumber: text,
    numericalAperture: text,
    coreDiameterUm: text,
  })
  // Drafts saved before the light input existed read as none.
  .default(blankInputText);

export function blankInputText(): InputText {
  return { kind: '', fNumber: '', numericalAperture: '', coreDiameterUm: '' };
}

/** The shortest text that reads back as the same number, so a saved input survives other edits byte for byte. */
const exact = (value: number | undefined) => (value === undefined ? '' : String(value));

export function inputToText(input: LightInput | undefined): InputText {
  const out = blankInputText();
  if (!input) return out;
  out.kind = input.kind;
  if (input.kind === 'fibre') {
    out.numericalAperture = exact(input.numericalAperture);
    out.coreDiameterUm = exact(input.coreDiameterUm);
  } else {
    out.fNumber = exact(input.fNumber);
  }
  return out;
}

function readPlain(typed: string): { ok: true; value: number } | { ok: false; message: string } {
  const trimmed = typed.trim().replace(/^f\s*\/\s*/i, '');
  if (!/^[+-]?(?:\d+\.?\d*|\.\d+)(?:e[+-]?\d+)?$/i.test(trimmed)) return { ok: false, message: 'must be a number' };
  return { ok: true, value: Number(trimmed) };
}

/**
 * The input block the typed text makes, with a reason per field it cannot read (the shared schema
 * checks the numbers afterwards). `undefined` for no input.
 */
export function inputFromText(values: InputText | undefined): { input: Record<string, unknown> | undefined; errors: FieldErrors } {
  const errors: FieldErrors = {};
  if (!values || values.kind === '') return { input: undefined, errors };
  const out: Record<string, unknown> = { kind: values.kind };
  for (const key of INPUT_KIND_FIELDS[values.kind]) {
    const typed = values[key].trim();
    if (typed === '') {
      if (!(values.kind === 'free-space' && key === 'fNumber')) errors[`input.${key}`] = 'is required';
      continue;
    }
    const read = key === 'coreDiameterUm' ? parseQuantity(typed, 'um') : readPlain(typed);
    if (read.ok) out[key] = read.value;
    else errors[`input.${key}`] = read.message;
  }
  return { input: out, errors };
}

/** The attached curves as a draft keeps them: exactly the design's own (they are never typed). */
export const draftCurvesSchema = curvesSchema.nullable().default(null);
export type DraftCurves = DesignCurve[] | null;
