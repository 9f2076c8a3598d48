/**
 * Reading what people type into a calculator field, with the workbench's conventions: any unit
 * the field understands ("0.55 um", "2 cm", "5°"), a plain number meaning the field's own unit,
 * fractions as "0.9" or "90 %", lists as "0.69, 0.41, 0.90". Never throws. Pure: no React.
 */

import { parseQuantity, type FieldUnit } from '@/features/solver';

export type FieldReading = FieldUnit | 'number' | 'integer' | 'fraction' | 'number-list';

export interface CalculatorField<K extends string = string> {
  key: K;
  /** The label above the box; messages start with it. */
  label: string;
  reading: FieldReading;
  /** Shown after the box when a plain number is typed ("nm", "°"). */
  unitLabel?: string;
  /** What the field wants, shown while it has the focus. */
  help: string;
  optional?: boolean;
}

export type ReadResult =
  | { ok: true; value: number | number[] | undefined }
  /** `pending`: the text has units and the unit parser is still loading. */
  | { ok: false; message: string; pending?: true };

const PLAIN_NUMBER = /^[+-]?(\d+\.?\d*|\.\d+)(e[+-]?\d+)?$/i;

function plainNumber(trimmed: string, expected: string): ReadResult & { value?: number } {
  const normal = trimmed.replace(/\u2212/g, '-');
  if (!PLAIN_NUMBER.test(normal)) return { ok: false, message: `could not read "${trimmed}"; expected ${expected}` };
  const value = Number(normal);
  return Number.isFinite(value) ? { ok: true, value } : { ok: false, message: `"${trimmed}" is too large` };
}

/** One field's text as its number (or list); `undefined` for a blank optional field. */
export function readFieldText(field: CalculatorField, typed: string): ReadResult {
  const trimmed = typed.trim();
  if (trimmed === '') return field.optional ? { ok: true, value: undefined } : { ok: false, message: 'is required' };
  switch (field.reading) {
    case 'number':
      return plainNumber(trimmed, 'a number such as 1.45');
    case 'integer': {
      if (!/^[+-]?\d+$/.test(trimmed.replace(/\u2212/g, '-'))) return { ok: false, message: 'must be a whole number' };
      return { ok: true, value: Number(trimmed.replace(/\u2212/g, '-')) };
    }
    case 'fraction': {
      const percent = /^(.*?)\s*%$/.exec(trimmed);
      if (percent) {
        const read = plainNumber((percent[1] ?? '').trim(), 'a percent such as 90 %');
        return read.ok && typeof read.value === 'number' ? { ok: true, value: read.value / 100 } : read;
      }
      return plainNumber(trimmed, 'a fraction such as 0.9, or a percent such as 90 %');
    }
    case 'number-list': {
      const items = trimmed.split(/[,;\s]+/).filter((item) => item !== '');
      const values: number[] = [];
      for (const [index, item] of items.entries()) {
        const read = plainNumber(item, 'numbers separated by commas, such as 0.69, 0.41, 0.90');
        if (!read.ok) return { ok: false, message: `item ${index + 1}: ${read.message}` };
        values.push(read.value as number);
      }
      return { ok: true, value: values };
    }
    default:
      return parseQuantity(trimmed.replace(/\s*[ÅÅ]/g, ' angstrom'), field.reading);
  }
}

/** Whether typed text names its own unit ("0.5 m", "5°"), so the unit shown after the box would repeat it. */
export function carriesOwnUnit(text: string): boolean {
  const trimmed = text.trim();
  return trimmed !== '' && !/^[+\-\u2212]?(\d+\.?\d*|\.\d+)(e[+-]?\d+)?$/i.test(trimmed);
}

/** A field's message as people read it: its label first, so the message names the field. */
export function fieldMessage(field: Pick<CalculatorField, 'label'>, message: string): string {
  return `${field.label} ${message}`;
}
