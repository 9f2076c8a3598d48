import { parseQuantity, unitParserReady } from '@/features/solver';
import { designSchema, type Design, type LayoutKind } from '@/shared/design';
import { fieldErrors, type FieldErrors } from '@/shared/validation';
import { allFields, sections, type FieldSpec } from './fields';

/**
 * What the editor holds: the text exactly as typed, so a half-typed "0.5 m" or a refused value
 * survives a reload. The design is derived from it, never the other way round while typing.
 */
export type FormValues = {
  grating: {
    grooveDensityPerMm: string;
    order: string;
    blazeWavelengthNm: string;
    ruledWidthMm: string;
    ruledHeightMm: string;
  };
  layout: {
    kind: LayoutKind;
    deviationAngleDeg: string;
    collimatorFocalMm: string;
    cameraFocalMm: string;
    collimatorOffAxisDeg: string;
    cameraOffAxisDeg: string;
  };
  slits: { entranceWidthUm: string; exitWidthUm: string; heightMm: string };
  range: { startNm: string; endNm: string };
  source: { minNm: string; maxNm: string };
  detector: { pixelPitchUm: string; pixelCount: string };
};

export type FormResult = { ok: true; design: Design } | { ok: false; fields: FieldErrors };

function read(values: FormValues, path: string): string {
  const [section, key] = path.split('.') as [keyof FormValues, string];
  const value = (values[section] as Record<string, string> | undefined)?.[key];
  return typeof value === 'string' ? value : '';
}

/** Trims binary noise and needless digits: 500.00000000000006 → "500", 0.1 + 0.2 → "0.3". */
export function formatCanonical(value: number): string {
  return String(Number(value.toPrecision(12)));
}

/** Parses one field's text; `undefined` for an empty optional field. */
export function parseField(
  field: FieldSpec,
  text: string,
): { ok: true; value: number | undefined } | { ok: false; message: string } {
  const trimmed = text.trim();
  if (trimmed === '')
    return field.optional ? { ok: true, value: undefined } : { ok: false, message: 'is required' };
  if (field.kind === 'integer') {
    if (!/^[+-]?\d+$/.test(trimmed)) return { ok: false, message: 'must be a whole number' };
    return { ok: true, value: Number(trimmed) };
  }
  const parsed = parseQuantity(trimmed, field.unit);
  return parsed.ok ? parsed : { ok: false, message: parsed.message };
}

/** Field paths inside schema messages, said the way the editor labels them. */
const spokenPaths: Record<string, string> = {
  'range.startNm': 'the range start',
  'source.minNm': 'the shortest emitted wavelength',
  collimatorFocalMm: 'the collimator focal length',
};

function speak(message: string): string {
  return Object.entries(spokenPaths).reduce((text, [path, words]) => text.split(path).join(words), message);
}

/**
 * Turns the typed text into a design checked by the shared schema. Unit errors and schema errors
 * are reported together, one plain-words message per field path.
 */
export function formToDesign(values: FormValues): FormResult {
  const errors: FieldErrors = {};
  const candidate: Record<string, Record<string, unknown>> = {};
  for (const section of sections) {
    const blank = section.fields.every((field) => read(values, field.path).trim() === '');
    if (section.optional && blank) continue;
    const target: Record<string, unknown> = {};
    candidate[section.id] = target;
    if (section.id === 'layout') target.kind = values.layout.kind;
    for (const field of section.fields) {
      const parsed = parseField(field, read(values, field.path));
      const key = field.path.split('.')[1] as string;
      if (parsed.ok) {
        if (parsed.value !== undefined) target[key] = parsed.value;
      } else {
        errors[field.path] = parsed.message;
      }
    }
  }
  const checked = designSchema.safeParse(candidate);
  if (checked.success && Object.keys(errors).length === 0) return { ok: true, design: checked.data };
  if (!checked.success) {
    for (const [path, message] of Object.entries(fieldErrors(checked.error))) {
      // A field whose text could not be read already has the better message.
      if (!(path in errors)) errors[path] = speak(message);
    }
  }
  return { ok: false, fields: errors };
}

let lastRead: { key: string; result: FormResult } | null = null;

/**
 * `formToDesign` for the live editor, which asks twice per keystroke (the form's resolver and
 * the results): the second ask for the same text is answered from the first.
 */
export function readForm(values: FormValues): FormResult {
  // A text with units reads differently once the unit parser has loaded.
  const key = `${unitParserReady()}${JSON.stringify(values)}`;
  if (lastRead?.key !== key) lastRead = { key, result: formToDesign(values) };
  return lastRead.result;
}

/** The editor's text for a stored design: numbers as numbers, absent optional values empty. */
export function designToForm(design: Design): FormValues {
  const text = (value: number | undefined) => (value === undefined ? '' : formatCanonical(value));
  return {
    grating: {
      grooveDensityPerMm: text(design.grating.grooveDensityPerMm),
      order: text(design.grating.order),
      blazeWavelengthNm: text(design.grating.blazeWavelengthNm),
      ruledWidthMm: text(design.grating.ruledWidthMm),
      ruledHeightMm: text(design.grating.ruledHeightMm),
    },
    layout: {
      kind: design.layout.kind,
      deviationAngleDeg: text(design.layout.deviationAngleDeg),
      collimatorFocalMm: text(design.layout.collimatorFocalMm),
      cameraFocalMm: text(design.layout.cameraFocalMm),
      collimatorOffAxisDeg: text(design.layout.collimatorOffAxisDeg),
      cameraOffAxisDeg: text(design.layout.cameraOffAxisDeg),
    },
    slits: {
      entranceWidthUm: text(design.slits.entranceWidthUm),
      exitWidthUm: text(design.slits.exitWidthUm),
      heightMm: text(design.slits.heightMm),
    },
    range: { startNm: text(design.range.startNm), endNm: text(design.range.endNm) },
    source: { minNm: text(design.source?.minNm), maxNm: text(design.source?.maxNm) },
    detector: {
      pixelPitchUm: text(design.detector?.pixelPitchUm),
      pixelCount: text(design.detector?.pixelCount),
    },
  };
}

/** The value a stepper moves to from `text`, or null when the text is not a number yet. */
export function stepValue(field: FieldSpec, text: string, direction: 1 | -1): string | null {
  const parsed = parseField(field, text);
  if (!parsed.ok) return null;
  const current = parsed.value;
  if (field.kind === 'integer') {
    let next = (current ?? 0) + direction;
    if (field.skipZero && next === 0) next += direction;
    if (field.min !== undefined) next = Math.max(field.min, next);
    return String(next);
  }
  if (Array.isArray(field.step)) {
    const list = field.step as readonly number[];
    const value = current ?? list[0] ?? 0;
    const next =
      direction > 0 ? list.find((v) => v > value + 1e-9) : [...list].reverse().find((v) => v < value - 1e-9);
    return formatCanonical(next ?? value);
  }
  const step = field.step as number;
  const base = current ?? field.min ?? 0;
  // Snap to the step grid first, so 103 + 10 → 110 rather than 113.
  const snapped =
    direction > 0
      ? Math.floor(base / step + 1e-9) * step + step
      : Math.ceil(base / step - 1e-9) * step - step;
  return formatCanonical(Math.max(field.min ?? -Infinity, snapped));
}

/** The canonical reading of a field's text when it differs from what was typed ("0.5 m" → "500"). */
export function canonicalText(field: FieldSpec, text: string): string | null {
  const parsed = parseField(field, text);
  if (!parsed.ok || parsed.value === undefined) return null;
  const canonical = formatCanonical(parsed.value);
  return canonical === text.trim() ? null : canonical;
}

export { allFields };
