import { z } from 'zod';
import { parseQuantity, unitParserReady } from '@/features/solver';
import { designSchema, type Design } from '@/shared/design';
import { describedFieldByPath, describedFields, describedSections } from '@/shared/design-fields';
import { formatMachineNumber } from '@/shared/format';
import { fieldErrors, type FieldErrors } from '@/shared/validation';
import { allFields, type FieldSpec } from './fields';
import { filtersFromText, filtersTextSchema, filtersToText, spokenFilterKey, type FiltersText } from './filter-fields';
import {
  draftCurvesSchema,
  inputFieldWords,
  inputFromText,
  inputTextSchema,
  inputToText,
  type DraftCurves,
  type InputText,
} from './input-fields';
import {
  requirementLabel,
  requirementsFromText,
  requirementsTextSchema,
  requirementsToText,
  type RequirementsText,
} from './requirement-fields';

type FieldText<V> = Exclude<V, undefined> extends number ? string : Exclude<V, undefined>;

/**
 * What the editor holds: the text exactly as typed, so a half-typed "0.5 m" or a refused value
 * survives a reload. The design is derived from it, never the other way round while typing.
 * Every section and field of the design, optional or not; numbers as text, a choice as its value.
 */
export type FormValues = {
  [S in Exclude<keyof Design, 'requirements' | 'filters' | 'input' | 'curves'>]-?: { [K in keyof NonNullable<Design[S]>]-?: FieldText<NonNullable<Design[S]>[K]> };
} & {
  /** What the instrument must do, as typed (requirement-fields.ts); all blank for none. */
  requirements: RequirementsText;
  /** The order-sorting filters, one row of text each (filter-fields.ts); null when the design has no list. */
  filters: FiltersText;
  /** How light reaches the slit, as typed (input-fields.ts); kind '' for none. */
  input: InputText;
  /** The attached measured curves, exactly as stored (never typed); null when the design has no list. */
  curves: DraftCurves;
};

const text = z.string().max(200);

/** The editor's text as a draft stores it, built from the described fields. */
export const formValuesSchema = z.object(
  Object.fromEntries([
    ...describedSections.map((section) => [
      section.id,
      z.object(
        Object.fromEntries(
          section.fields.map((field) => [
            field.key,
            field.kind === 'choice' ? z.enum(Object.keys(field.options) as [string, ...string[]]) : text,
          ]),
        ),
      ),
    ]),
    // Drafts saved before requirements existed lack the key and read as none.
    ['requirements', requirementsTextSchema],
    // …and those saved before filters existed, as no list.
    ['filters', filtersTextSchema],
    // …and those saved before the light budget existed, as no input and no curves.
    ['input', inputTextSchema],
    ['curves', draftCurvesSchema],
  ]),
) as unknown as z.ZodType<FormValues>;

export type FormResult = { ok: true; design: Design } | { ok: false; fields: FieldErrors };

function read(values: FormValues, path: string): string {
  const [section, key] = path.split('.') as [keyof FormValues, string];
  const value = (values[section] as Record<string, string> | undefined)?.[key];
  return typeof value === 'string' ? value : '';
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

/** A field path or key ("range.startNm", "collimatorFocalMm") inside a schema message. */
const FIELD_NAME = /\b(?:[a-z]+\.)?[a-z]+[A-Z]\w*\b/g;

/** Field names inside schema messages, said the way the editor labels them ("the range start"). */
function speak(message: string): string {
  return message.replace(FIELD_NAME, (name) => {
    const filterWords = spokenFilterKey(name);
    if (filterWords) return filterWords;
    const inputWords = inputFieldWords[name as keyof typeof inputFieldWords];
    if (inputWords) return `the ${inputWords.label.toLowerCase()}`;
    const field = describedFieldByPath.get(name) ?? describedFields.find((f) => f.key === name);
    const label = field?.label ?? requirementLabel(name.startsWith('requirements.') ? name : `requirements.${name}`);
    return label ? `the ${label.charAt(0).toLowerCase()}${label.slice(1)}` : name;
  });
}

/**
 * Turns the typed text into a design checked by the shared schema. Unit errors and schema errors
 * are reported together, one plain-words message per field path.
 */
export function formToDesign(values: FormValues): FormResult {
  const errors: FieldErrors = {};
  const candidate: Record<string, Record<string, unknown>> = {};
  const oneMirror = values.layout.kind === 'ebert-fastie';
  for (const section of describedSections) {
    const typed = section.fields.filter((field) => field.kind !== 'choice');
    const blank = typed.every((field) => read(values, field.path).trim() === '');
    if (section.optional && blank) continue;
    const target: Record<string, unknown> = {};
    candidate[section.id] = target;
    for (const field of section.fields) {
      if (field.kind === 'choice') {
        target[field.key] = read(values, field.path);
        continue;
      }
      // An Ebert–Fastie's camera is its collimator mirror: the camera fields are hidden and take
      // the collimator's values, whatever they held before the switch (kept for a switch back).
      const source = oneMirror ? (MIRRORED_BY_COLLIMATOR[field.path] ?? field) : field;
      const parsed = parseField(source, read(values, source.path));
      if (parsed.ok) {
        if (parsed.value !== undefined) target[field.key] = parsed.value;
      } else if (source === field) {
        errors[field.path] = parsed.message;
      }
    }
  }
  const typedRequirements = requirementsFromText(values.requirements);
  Object.assign(errors, typedRequirements.errors);
  if (typedRequirements.requirements) candidate.requirements = typedRequirements.requirements;
  const typedFilters = filtersFromText(values.filters);
  Object.assign(errors, typedFilters.errors);
  if (typedFilters.filters) (candidate as Record<string, unknown>).filters = typedFilters.filters;
  const typedInput = inputFromText(values.input);
  Object.assign(errors, typedInput.errors);
  if (typedInput.input) (candidate as Record<string, unknown>).input = typedInput.input;
  if (values.curves) (candidate as Record<string, unknown>).curves = values.curves;
  const checked = designSchema.safeParse(candidate);
  if (checked.success && Object.keys(errors).length === 0) return { ok: true, design: checked.data };
  if (!checked.success) {
    for (const [issuePath, message] of Object.entries(fieldErrors(checked.error))) {
      // One field holds the whole wavelength list: its items' messages say which item.
      const item = /^(requirements\.atWavelengthsNm)\.(\d+)$/.exec(issuePath);
      const path = item ? (item[1] as string) : issuePath;
      const said = item ? `wavelength ${Number(item[2]) + 1} ${message}` : message;
      // A field whose text could not be read already has the better message.
      if (!(path in errors)) errors[path] = speak(said);
    }
  }
  return { ok: false, fields: errors };
}

/** The camera fields an Ebert–Fastie reads from its one mirror's (the collimator's) fields. */
const MIRRORED_BY_COLLIMATOR: Readonly<Record<string, FieldSpec>> = {
  'layout.cameraFocalMm': fieldByPathOrThrow('layout.collimatorFocalMm'),
  'layout.cameraOffAxisDeg': fieldByPathOrThrow('layout.collimatorOffAxisDeg'),
};

/** The fields an Ebert–Fastie hides from the editor, because its one mirror sets them. */
export const ONE_MIRROR_HIDDEN_PATHS: ReadonlySet<string> = new Set(Object.keys(MIRRORED_BY_COLLIMATOR));

function fieldByPathOrThrow(path: string): FieldSpec {
  const field = allFields.find((f) => f.path === path);
  if (!field) throw new Error(`No described field ${path}`);
  return field;
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
  const form: Record<string, Record<string, string>> = {};
  for (const section of describedSections) {
    const stored = design[section.id] as Record<string, unknown> | undefined;
    form[section.id] = Object.fromEntries(
      section.fields.map((field) => {
        const value = stored?.[field.key];
        return [field.key, typeof value === 'number' ? formatMachineNumber(value) : typeof value === 'string' ? value : ''];
      }),
    );
  }
  return {
    ...form,
    requirements: requirementsToText(design.requirements),
    filters: filtersToText(design.filters),
    input: inputToText(design.input),
    curves: design.curves ?? null,
  } as FormValues;
}

/**
 * The value a stepper (or ArrowUp/ArrowDown) moves to from `text`, or null when the text is not a
 * number yet. `times` is how many steps at once (10 with Shift). The result stays within the
 * field's min and max; a list of catalogue values is walked `times` entries along, stopping at its ends.
 */
export function stepValue(field: FieldSpec, text: string, direction: 1 | -1, times = 1): string | null {
  const parsed = parseField(field, text);
  if (!parsed.ok) return null;
  const current = parsed.value;
  const clamp = (v: number) => Math.min(field.max ?? Infinity, Math.max(field.min ?? -Infinity, v));
  if (field.kind === 'integer') {
    const from = current ?? 0;
    let next = from + direction * field.step * times;
    // Stepping across 0 (orders): 0 is no order, so it is passed over, not landed on.
    if (field.skipZero && (next === 0 || Math.sign(next) !== Math.sign(from))) {
      if (next === 0 || from !== 0) next += direction;
    }
    return String(clamp(next));
  }
  if (Array.isArray(field.step)) {
    const list = field.step as readonly number[];
    const value = current ?? list[0] ?? 0;
    const ahead =
      direction > 0 ? list.filter((v) => v > value + 1e-9) : [...list].reverse().filter((v) => v < value - 1e-9);
    const next = ahead[Math.min(times, ahead.length) - 1];
    return formatMachineNumber(clamp(next ?? value));
  }
  const step = field.step as number;
  const base = current ?? field.min ?? 0;
  // Snap to the step grid first, so 103 + 10 → 110 rather than 113.
  const snapped =
    direction > 0
      ? Math.floor(base / step + 1e-9) * step + step * times
      : Math.ceil(base / step - 1e-9) * step - step * times;
  return formatMachineNumber(clamp(snapped));
}

/** Whether typed text names its own unit ("0.5 m", "-25 µm"), so the field's unit suffix would repeat it. */
export function carriesOwnUnit(text: string): boolean {
  const trimmed = text.trim();
  return trimmed !== '' && !/^[+\-\u2212]?(\d+\.?\d*|\.\d+)(e[+-]?\d+)?$/i.test(trimmed);
}

/** The canonical reading of a field's text when it differs from what was typed ("0.5 m" → "500"). */
export function canonicalText(field: FieldSpec, text: string): string | null {
  const parsed = parseField(field, text);
  if (!parsed.ok || parsed.value === undefined) return null;
  const canonical = formatMachineNumber(parsed.value);
  return canonical === text.trim() ? null : canonical;
}

export { allFields };
