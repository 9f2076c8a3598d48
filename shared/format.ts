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

function write(value: number, options: Intl.NumberFormatOptions): string {
  return numberFormat({ useGrouping: 'min2', signDisplay: 'negative', ...options })
    .formatToParts(value)
    .map((part) => (part.type === 'group' ? NARROW_SPACE : part.type === 'minusSign' ? MINUS : part.value))
    .join('');
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
