/**
 * Reading what people type into a field ("1200/mm", "0.5 m", "25 µm", "0.35 deg") into the
 * field's own unit. Uses a units-only mathjs instance (the full library would quadruple the web
 * bundle), loaded on first use — a separate chunk on the web — so importing this module has no
 * side effects and plain numbers never wait for it.
 */

import type { UnitParser } from './mathjs-units';

/** Units the design's fields are stored in. */
export type FieldUnit = 'nm' | 'um' | 'mm' | 'deg' | 'mm^-1';

export type ParseResult =
  | { ok: true; value: number }
  /** `pending`: the text has units and the unit parser is still loading; ask again once it is. */
  | { ok: false; message: string; pending?: true };

interface FieldUnitInfo {
  /** How mathjs spells the unit. */
  mathjs: string;
  /** The kind of quantity and an example, for the wrong-dimension message. */
  kind: string;
  expected: string;
}

const FIELD_UNITS: Record<FieldUnit, FieldUnitInfo> = {
  nm: { mathjs: 'nm', kind: 'a length', expected: 'a length such as 500 nm' },
  um: { mathjs: 'um', kind: 'a length', expected: 'a length such as 25 µm' },
  mm: { mathjs: 'mm', kind: 'a length', expected: 'a length such as 500 mm' },
  deg: { mathjs: 'deg', kind: 'an angle', expected: 'an angle such as 0.35 deg' },
  'mm^-1': {
    mathjs: 'mm^-1',
    kind: 'a groove density (per length)',
    expected: 'a groove density such as 1200 / mm',
  },
};

let units: UnitParser | null = null;
let loading: Promise<void> | null = null;

/**
 * Loads mathjs's unit parser. Plain numbers are read without it; text with units waits for it
 * (`parseQuantity` answers `pending` until then). Safe to call any number of times.
 */
export function loadUnitParser(): Promise<void> {
  loading ??= import('./mathjs-units').then((module) => {
    units = module.createUnitParser();
  });
  return loading;
}

export function unitParserReady(): boolean {
  return units !== null;
}

const PLAIN_NUMBER = /^[+-]?(\d+\.?\d*|\.\d+)(e[+-]?\d+)?$/i;

/**
 * Normalises spellings mathjs does not read: micro signs, the degree sign, "per mm" words and
 * "lines/mm" or "g/mm" groove densities.
 */
function normalise(text: string): string {
  return text
    .trim()
    .replace(/[µμ]/g, 'u')
    .replace(/\s*°/g, ' deg')
    .replace(/\b(lines?|grooves?|l|g|gr)\s*\/\s*/gi, '/')
    .replace(/\bper\s+/gi, '/')
    .replace(/,(?=\d{3}\b)/g, '');
}

/**
 * Parses `text` as a quantity in `unit`. A plain number means the field's unit. Never throws:
 * returns `{ ok: false, message }` with a plain-words reason instead.
 */
export function parseQuantity(text: string, unit: FieldUnit): ParseResult {
  const info = FIELD_UNITS[unit];
  const source = normalise(text);
  if (source === '') return { ok: false, message: `enter ${info.expected}` };
  if (PLAIN_NUMBER.test(source)) {
    const value = Number(source);
    return Number.isFinite(value)
      ? { ok: true, value }
      : { ok: false, message: `${text.trim()} is too large; expected ${info.expected}` };
  }
  let parsed;
  try {
    if (units === null) {
      void loadUnitParser();
      return { ok: false, message: 'reading the units…', pending: true };
    }
    parsed = units.unit(source);
  } catch {
    return { ok: false, message: `could not read "${text.trim()}"; expected ${info.expected}` };
  }
  if (parsed.value === null) {
    return { ok: false, message: `"${text.trim()}" has no number; expected ${info.expected}` };
  }
  try {
    const value = parsed.toNumber(info.mathjs);
    if (!Number.isFinite(value)) {
      return { ok: false, message: `"${text.trim()}" is too large; expected ${info.expected}` };
    }
    // Round away binary noise from prefix scaling (500 nm → 500.00000000000006).
    return { ok: true, value: Number(value.toPrecision(15)) };
  } catch {
    return { ok: false, message: `"${text.trim()}" is not ${info.kind}; expected ${info.expected}` };
  }
}
