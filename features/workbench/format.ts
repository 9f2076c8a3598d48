import { formatNumber } from '@/features/solver';

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

/** Efficiency as a whole percentage. */
export function percent(value: number | null | undefined): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return '—';
  return `${Math.round(value * 100)} %`;
}
