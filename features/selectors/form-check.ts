/**
 * From a calculator's typed text to a checked API input: each field read on its own (unit and
 * syntax messages), then the assembled input checked with the API's own zod schema, so the screen
 * refuses exactly what `POST /api/selectors` refuses, each message on the field that shows it.
 * Pure: no React.
 */

import type { z } from 'zod';
import { fieldMessage, readFieldText, type CalculatorField } from './field-reading';

/** Field key → the message shown under it, naming the field ("Order must be a whole number"). */
export type FieldErrors = Record<string, string>;

export type FormCheck<I> = { ok: true; input: I } | { ok: false; errors: FieldErrors; pending: boolean };

export type ReadValues = Record<string, number | number[] | undefined>;

/**
 * Reads every field's text; `keyPrefix` names fields of one item in a list ("filters.1.") in the
 * errors. Values are keyed by the bare field key.
 */
export function readFields(
  fields: readonly CalculatorField[],
  text: Readonly<Record<string, string>>,
  keyPrefix = '',
): { values: ReadValues; errors: FieldErrors; pending: boolean } {
  const values: ReadValues = {};
  const errors: FieldErrors = {};
  let pending = false;
  for (const field of fields) {
    const read = readFieldText(field, text[field.key] ?? '');
    if (read.ok) values[field.key] = read.value;
    else {
      errors[`${keyPrefix}${field.key}`] = fieldMessage(field, read.message);
      pending ||= read.pending === true;
    }
  }
  return { values, errors, pending };
}

/** A typed range's own checks, before any list of wavelengths is made from it. */
export function rangeErrors(
  start: CalculatorField,
  end: CalculatorField,
  startNm: number | undefined,
  endNm: number | undefined,
): FieldErrors {
  const errors: FieldErrors = {};
  if (startNm !== undefined && !(startNm > 0)) errors[start.key] = fieldMessage(start, 'must be greater than 0');
  if (endNm !== undefined && startNm !== undefined && startNm > 0 && !(endNm > startNm)) {
    errors[end.key] = fieldMessage(end, `must be greater than the ${start.label.toLowerCase()}`);
  }
  return errors;
}

/** `count` evenly spaced values from `from` to `to` inclusive (one value when they are equal). */
export function evenlySpaced(from: number, to: number, count: number): number[] {
  if (count < 2 || from === to) return [from];
  const step = (to - from) / (count - 1);
  return Array.from({ length: count }, (_, i) => (i === count - 1 ? to : from + i * step));
}

/**
 * The schema's issues as field messages: `fieldFor` maps an issue path to the field that shows
 * it (null: the form's own key is the joined path), and the schema's field names inside a message
 * ("must be greater than edgeNm") are said with the labels (`spoken`).
 */
export function schemaErrors(
  error: z.ZodError,
  fieldFor: (path: readonly PropertyKey[]) => { key: string; label: string } | null,
  spoken: Readonly<Record<string, string>> = {},
): FieldErrors {
  const errors: FieldErrors = {};
  for (const issue of error.issues) {
    const field = fieldFor(issue.path) ?? { key: issue.path.map(String).join('.') || 'input', label: 'The input' };
    if (field.key in errors) continue;
    const message = issue.message.replace(/\b[a-z]+[A-Z]\w*\b/g, (name) => spoken[name] ?? name);
    errors[field.key] = fieldMessage(field, message);
  }
  return errors;
}
