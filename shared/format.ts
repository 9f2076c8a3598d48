/**
 * Every number and date a person reads, written one way, for the app and the server alike.
 *
 * - A true minus sign (U+2212), never the hyphen-minus.
 * - Digits grouped in threes by a narrow no-break space (U+202F) from five integer digits up:
 *   "1200" and "12 000". A four-digit number is left whole (ISO 80000-1 and the SI Brochure,
 *   §5.4.4, from memory), so groove densities and wavelengths read as they are usually written;
 *   the space cannot break, so a number never wraps inside a narrow table cell.
 * - A decimal point, and "—" for a missing or non-finite value.
 * - Dates day first with the month in letters and a 24-hour clock: "14 Mar 2026, 09:05".
 *
 * `formatMachineNumber` is the one exception on purpose: files and form fields that a program
 * reads back (CSV, the editor's text) get plain ASCII with no grouping.
 */

export const MINUS = '\u2212';
/** Groups digits and separates a number from "%": thin like a thin space, but never a line break. */
export const NARROW_SPACE = '\u202F';
/** Stands for a value that is missing or not finite. */
export const NONE = '—';
/**
 * Between a number and its unit ("6 nm"): a no-break space, so a narrow column never puts the
 * unit on a line of its own. A full-width space, as the SI Brochure writes a unit (§5.4.3, from memory).
 */
export const UNIT_SPACE = '\u00A0';
/** Units written straight after the number, without a space: the plane-angle signs (SI Brochure §5.4.3, from memory). */
const ATTACHED_UNITS = new Set(['°', '′', '″']);

// Numbers: en-US gives a decimal point; the group separator and minus sign are replaced below.
const numberFormats = new Map<string, Intl.NumberFormat>();

function numberFormat(options: Intl.NumberFormatOptions): Intl.NumberFormat {
  const key = JSON.stringify(options);
  let format = numberFormats.get(key);
  if (!format) {
    format = new Intl.NumberFormat('en-US', options);
    numberFormats.set(key, format);
  }
  return format;
}

/**
 * en-US writes ',' between digit groups and '-' for a minus: swapping those two in `format()`'s
 * text gives what picking `formatToParts()`'s parts would, at a third of the cost (about 2.7 against
 * 8.5 µs a call in Node 20), which matters because one workbench edit formats thousands of figures.
 */
function write(value: number, options: Intl.NumberFormatOptions): string {
  return numberFormat({ useGrouping: 'min2', signDisplay: 'negative', ...options })
    .format(value)
    .replace(/,/g, NARROW_SPACE)
    .replace('-', MINUS);
}

const superscripts: Record<string, string> = {
  '-': '⁻',
  '0': '⁰',
  '1': '¹',
  '2': '²',
  '3': '³',
  '4': '⁴',
  '5': '⁵',
  '6': '⁶',
  '7': '⁷',
  '8': '⁸',
  '9': '⁹',
};

/** Plain digits from here up to `SCIENTIFIC_FROM`; "1.2×10⁻⁴" style outside. */
const PLAIN_FROM = 1e-3;
const SCIENTIFIC_FROM = 1e9;

function isNumber(value: number | null | undefined): value is number {
  return typeof value === 'number' && Number.isFinite(value);
}

/**
 * A figure for people, rounded to `significant` figures with trailing zeros dropped:
 * 0.52341 → "0.5234", -12345.6 → "−12 350", 0.000123 → "1.23×10⁻⁴"; "—" for none.
 */
export function formatNumber(value: number | null | undefined, significant = 4): string {
  if (!isNumber(value)) return NONE;
  const abs = Math.abs(value);
  if (abs === 0 || (abs >= PLAIN_FROM && abs < SCIENTIFIC_FROM)) {
    return write(value, { maximumSignificantDigits: significant });
  }
  const parts = numberFormat({ notation: 'scientific', maximumSignificantDigits: significant }).formatToParts(value);
  const mantissa = parts
    .filter((part) => !part.type.startsWith('exponent'))
    .map((part) => (part.type === 'minusSign' ? MINUS : part.value))
    .join('');
  const exponent = parts
    .filter((part) => part.type === 'exponentMinusSign' || part.type === 'exponentInteger')
    .map((part) => (part.type === 'exponentMinusSign' ? '-' : part.value))
    .join('');
  if (exponent === '0') return mantissa;
  return `${mantissa}×10${[...exponent].map((c) => superscripts[c] ?? c).join('')}`;
}

/**
 * A value's text and its unit as one unbreakable run: "0.0689" + "nm" → "0.0689 nm" (no-break
 * space), "12.5" + "°" → "12.5°". Every plain space inside the value is made unbreakable too, so
 * a composed value such as "380 – 780" or "0.07 / 6" never wraps. The value alone when there is no
 * unit, and "—" stays bare.
 */
export function withUnit(text: string, unit?: string | null): string {
  const value = keepTogether(text);
  if (!unit || text === NONE) return value;
  return `${value}${unitSuffix(unit)}`;
}

/** What follows a value for its unit: " nm" with a no-break space, "°" with none. */
export function unitSuffix(unit: string): string {
  return ATTACHED_UNITS.has(unit) ? unit : `${UNIT_SPACE}${unit}`;
}

/** `formatNumber` with its unit, kept on one line: 578.9 nm → "578.9 nm" (no-break space). */
export function formatQuantity(value: number | null | undefined, unit: string, significant = 4): string {
  return withUnit(formatNumber(value, significant), unit);
}

/** The text with every plain space made a no-break space: for a value a line must not split. */
export function keepTogether(text: string): string {
  return text.replace(/ /g, UNIT_SPACE);
}

/**
 * A signed number as typed (a form's text, "-2") written for reading ("−2", true minus); text
 * that is not a plain decimal number is returned as it was.
 */
export function formatTypedNumber(text: string): string {
  const trimmed = text.trim();
  if (!/^[+-]?(\d+\.?\d*|\.\d+)$/.test(trimmed)) return text;
  return trimmed.replace(/^-/, MINUS).replace(/^\+/, '');
}

/** A whole count, grouped like every other number but never cut to significant figures. */
export function formatInteger(value: number | null | undefined): string {
  if (!isNumber(value)) return NONE;
  return write(value, { maximumFractionDigits: 0 });
}

/** Exactly `fractionDigits` decimals, for figures read against a fixed step: 12.5 → "12.50". */
export function formatFixed(value: number | null | undefined, fractionDigits: number): string {
  if (!isNumber(value)) return NONE;
  return write(value, { minimumFractionDigits: fractionDigits, maximumFractionDigits: fractionDigits });
}

/**
 * A fraction as a percentage with at most `maximumFractionDigits` decimals: 0.123 → "12 %".
 * `signed` writes "+" before a rise (a change between two values); zero stays unsigned.
 */
export function formatPercent(
  fraction: number | null | undefined,
  { maximumFractionDigits = 0, signed = false }: { maximumFractionDigits?: number; signed?: boolean } = {},
): string {
  if (!isNumber(fraction)) return NONE;
  const digits = write(fraction * 100, { maximumFractionDigits, signDisplay: signed ? 'exceptZero' : 'negative' });
  return `${digits}${NARROW_SPACE}%`;
}

/**
 * A number a program reads back: ASCII hyphen-minus, no grouping, binary noise trimmed to
 * `significant` figures (500.00000000000006 → "500", 0.1 + 0.2 → "0.3"). JavaScript's own
 * shortest round-trip form, not Intl, because the reader is `Number()` and the unit parser.
 */
export function formatMachineNumber(value: number, significant = 12): string {
  return String(Number(value.toPrecision(significant)));
}

// Dates: en-GB gives day-month-year and a 24-hour clock.
const dateFormats = new Map<string, Intl.DateTimeFormat>();

function dateFormat(withTime: boolean, timeZone: string | undefined): Intl.DateTimeFormat {
  const key = `${withTime ? 'when' : 'day'}|${timeZone ?? ''}`;
  let format = dateFormats.get(key);
  if (!format) {
    format = new Intl.DateTimeFormat('en-GB', {
      day: 'numeric',
      month: 'short',
      year: 'numeric',
      ...(withTime ? { hour: '2-digit', minute: '2-digit', hourCycle: 'h23' } : {}),
      timeZone,
    });
    dateFormats.set(key, format);
  }
  return format;
}

function toDate(when: string | Date): Date | null {
  const date = typeof when === 'string' ? new Date(when) : when;
  return Number.isNaN(date.getTime()) ? null : date;
}

/** "14 Mar 2026": day first and the month in letters, so no reader mistakes 3/4 for 4/3. */
export function formatDay(when: string | Date, timeZone?: string): string {
  const date = toDate(when);
  return date ? dateFormat(false, timeZone).format(date) : NONE;
}

/** "14 Mar 2026, 09:05". `timeZone` is the reader's own unless given (an IANA name). */
export function formatWhen(when: string | Date, timeZone?: string): string {
  const date = toDate(when);
  return date ? dateFormat(true, timeZone).format(date) : NONE;
}
