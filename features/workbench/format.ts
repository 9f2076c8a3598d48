import { formatNumber, type Overlap, type WavelengthPoint } from '@/features/solver';

/** A figure for people: 4 significant figures, thousands grouped with a thin space, "—" for none. */
export function fmt(value: number | null | undefined, significant = 4): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return '—';
  const text = formatNumber(value, significant);
  if (/e/i.test(text)) return text;
  const [whole = '', fraction] = text.split('.');
  const sign = whole.startsWith('-') ? '−' : '';
  const digits = whole.replace('-', '');
  const grouped = digits.length > 4 ? digits.replace(/\B(?=(\d{3})+(?!\d))/g, '\u2009') : digits;
  return `${sign}${grouped}${fraction ? `.${fraction}` : ''}`;
}

const wholeNumber = new Intl.NumberFormat('en-US', { maximumFractionDigits: 0 });

/** A whole count grouped like `fmt` (thin space); unlike `fmt`, never rounded to 4 figures. */
function count(value: number): string {
  return wholeNumber.format(value).replace(/,/g, '\u2009');
}

/**
 * The overlapping orders at one wavelength, ending in "+N more" when the solver cut the list
 * (at `MAX_LISTED_OVERLAPS`), so a cut list never reads as complete. Empty when there are none.
 */
export function overlapsText(
  p: Pick<WavelengthPoint, 'overlaps' | 'overlapCount'>,
  item: (overlap: Overlap) => string,
  separator: string,
): string {
  const parts = p.overlaps.map(item);
  const hidden = p.overlapCount - p.overlaps.length;
  if (hidden > 0) parts.push(`+${count(hidden)} more`);
  return parts.join(separator);
}

/** Efficiency as a whole percentage. */
export function percent(value: number | null | undefined): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return '—';
  return `${Math.round(value * 100)} %`;
}
