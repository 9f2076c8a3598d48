import { describe, expect, it } from 'vitest';
import {
  formatDay,
  formatFixed,
  formatInteger,
  formatMachineNumber,
  formatNumber,
  formatPercent,
  formatQuantity,
  formatTypedNumber,
  formatWhen,
  withUnit,
} from '@/shared/format';

const minus = '\u2212';
const gap = '\u202F';

describe('formatNumber', () => {
  it.each([
    { value: 0.523412, significant: 4, text: '0.5234' },
    { value: 500.00000000000006, significant: 4, text: '500' },
    { value: 1200, significant: 4, text: '1200' },
    { value: 12345.6, significant: 4, text: `12${gap}350` },
    { value: 12345.6, significant: 6, text: `12${gap}345.6` },
    { value: 1234567, significant: 7, text: `1${gap}234${gap}567` },
    { value: -25, significant: 4, text: `${minus}25` },
    { value: -12345, significant: 5, text: `${minus}12${gap}345` },
    { value: 0, significant: 4, text: '0' },
    { value: -0, significant: 4, text: '0' },
    { value: 0.0012345, significant: 3, text: '0.00123' },
    { value: 0.000123456, significant: 3, text: '1.23×10⁻⁴' },
    { value: -0.0005, significant: 4, text: `${minus}5×10⁻⁴` },
    { value: 2.5e12, significant: 4, text: '2.5×10¹²' },
  ] satisfies { value: number; significant: number; text: string }[])(
    '$value to $significant figures reads "$text"',
    ({ value, significant, text }) => {
      expect(formatNumber(value, significant)).toBe(text);
    },
  );

  it('uses a true minus sign, never the hyphen-minus', () => {
    expect(formatNumber(-1.5)).toBe('\u22121.5');
    expect(formatNumber(-1.5)).not.toContain('-');
  });

  it('groups from five integer digits up, so a four-digit figure stays whole', () => {
    expect(formatNumber(9999)).toBe('9999');
    expect(formatNumber(10_000)).toBe(`10${gap}000`);
  });

  it.each([null, undefined, Number.NaN, Number.POSITIVE_INFINITY])('writes a dash for %s', (value) => {
    expect(formatNumber(value)).toBe('—');
  });
});

describe('formatInteger', () => {
  it('groups a count without cutting it to significant figures', () => {
    expect(formatInteger(123456)).toBe(`123${gap}456`);
    expect(formatInteger(1234)).toBe('1234');
    expect(formatInteger(-40)).toBe(`${minus}40`);
  });
});

describe('formatFixed', () => {
  it('keeps the decimals it is given', () => {
    expect(formatFixed(12.5, 2)).toBe('12.50');
    expect(formatFixed(-3.14159, 1)).toBe(`${minus}3.1`);
  });
});

describe('formatPercent', () => {
  it.each([
    { fraction: 0.123, options: {}, text: `12${gap}%` },
    { fraction: -0.12, options: { signed: true }, text: `${minus}12${gap}%` },
    { fraction: 0.034, options: { signed: true, maximumFractionDigits: 1 }, text: `+3.4${gap}%` },
    { fraction: 0, options: { signed: true }, text: `0${gap}%` },
    { fraction: 1.5, options: {}, text: `150${gap}%` },
  ] satisfies { fraction: number; options: { signed?: boolean; maximumFractionDigits?: number }; text: string }[])(
    '$fraction reads "$text"',
    ({ fraction, options, text }) => {
      expect(formatPercent(fraction, options)).toBe(text);
    },
  );
});

describe('formatMachineNumber', () => {
  it('writes plain ASCII a program can read back', () => {
    expect(formatMachineNumber(0.1 + 0.2)).toBe('0.3');
    expect(formatMachineNumber(-12345.678)).toBe('-12345.678');
    expect(formatMachineNumber(123.456789, 4)).toBe('123.5');
  });
});

describe('dates', () => {
  const when = '2026-03-14T23:05:00Z';

  it('writes the day first with the month in letters', () => {
    expect(formatDay(when, 'UTC')).toBe('14 Mar 2026');
  });

  it('writes the time on a 24-hour clock', () => {
    expect(formatWhen(when, 'UTC')).toBe('14 Mar 2026, 23:05');
  });

  it('reads the instant in the time zone it is given', () => {
    // Tokyo is UTC+9 all year (no daylight saving), so 23:05 UTC is 08:05 the next day.
    expect(formatWhen(when, 'Asia/Tokyo')).toBe('15 Mar 2026, 08:05');
    expect(formatDay(new Date(when), 'Asia/Tokyo')).toBe('15 Mar 2026');
  });

  it('writes a dash for a date that does not parse', () => {
    expect(formatDay('not a date', 'UTC')).toBe('—');
  });
});

describe('numbers with units', () => {
  const nbsp = '\u00A0';

  it.each([
    { text: '0.0689', unit: 'nm', out: `0.0689${nbsp}nm` },
    { text: '12.50', unit: '°', out: '12.50°' },
    { text: '0.07 / 6', unit: 'mm', out: `0.07${nbsp}/${nbsp}6${nbsp}mm` },
    { text: '380 – 780', unit: 'nm', out: `380${nbsp}–${nbsp}780${nbsp}nm` },
    { text: '—', unit: 'nm', out: '—' },
    { text: '1.5', unit: '', out: '1.5' },
  ] satisfies { text: string; unit: string; out: string }[])('"$text" with "$unit" reads "$out"', ({ text, unit, out }) => {
    expect(withUnit(text, unit)).toBe(out);
  });

  it('leaves no place where a line could break between a number and its unit', () => {
    const text = formatQuantity(-578.94, 'nm');
    expect(text).toBe(`${minus}578.9${nbsp}nm`);
    expect(text).not.toMatch(/ /);
  });

  it('writes a typed signed number with a true minus and leaves other text alone', () => {
    expect(formatTypedNumber('-2')).toBe(`${minus}2`);
    expect(formatTypedNumber(' +3 ')).toBe('3');
    expect(formatTypedNumber('0.5 m')).toBe('0.5 m');
    expect(formatTypedNumber('')).toBe('');
  });
});

describe('plain figures written from Intl’s text', () => {
  it('match Intl’s parts with a narrow space between groups and a true minus, over many values', () => {
    // The reference reads Intl.NumberFormat's own parts (ECMA-402 formatToParts), independently of
    // the swap of ',' and '-' the formatter does for speed.
    const byParts = (value: number, options: Intl.NumberFormatOptions) =>
      new Intl.NumberFormat('en-US', { useGrouping: 'min2', signDisplay: 'negative', ...options })
        .formatToParts(value)
        .map((part) => (part.type === 'group' ? '\u202F' : part.type === 'minusSign' ? '\u2212' : part.value))
        .join('');
    for (let i = -2000; i <= 2000; i++) {
      const value = i * 37.123 * 10 ** ((i % 7) - 2);
      if (Math.abs(value) >= 1e-3 && Math.abs(value) < 1e9) expect(formatNumber(value)).toBe(byParts(value, { maximumSignificantDigits: 4 }));
      expect(formatFixed(value, 2)).toBe(byParts(value, { minimumFractionDigits: 2, maximumFractionDigits: 2 }));
    }
  });
});
