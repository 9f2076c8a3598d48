import { beforeAll, describe, expect, it } from 'vitest';
import { loadUnitParser, parseQuantity, type FieldUnit } from '@/features/solver';

describe('parseQuantity', () => {
  beforeAll(loadUnitParser);

  it.each([
    { text: '1200/mm', unit: 'mm^-1', value: 1200 },
    { text: '1200 / mm', unit: 'mm^-1', value: 1200 },
    { text: '1200 lines/mm', unit: 'mm^-1', value: 1200 },
    { text: '1.2 / um', unit: 'mm^-1', value: 1200 },
    { text: '0.5 m', unit: 'mm', value: 500 },
    { text: '25 um', unit: 'um', value: 25 },
    { text: '25 µm', unit: 'um', value: 25 },
    { text: '0.025 mm', unit: 'um', value: 25 },
    { text: '500 nm', unit: 'nm', value: 500 },
    { text: '0.5 um', unit: 'nm', value: 500 },
    { text: '0.35 deg', unit: 'deg', value: 0.35 },
    { text: '0.35°', unit: 'deg', value: 0.35 },
    { text: '21 arcmin', unit: 'deg', value: 0.35 },
    { text: '500', unit: 'nm', value: 500 },
    { text: ' 12.5 ', unit: 'mm', value: 12.5 },
  ] satisfies readonly { text: string; unit: FieldUnit; value: number }[])(
    '"$text" in $unit is $value',
    ({ text, unit, value }) => {
      const r = parseQuantity(text, unit);
      expect(r.ok).toBe(true);
      if (r.ok) expect(r.value).toBeCloseTo(value, 12);
    },
  );

  it.each([
    { text: '5 kg', unit: 'mm', message: /expected a length such as 500 mm/ },
    { text: '500 nm', unit: 'deg', message: /is not an angle; expected an angle such as 0.35 deg/ },
    { text: '0.5 m', unit: 'mm^-1', message: /expected a groove density such as 1200 \/ mm/ },
    { text: 'abc', unit: 'nm', message: /could not read "abc"/ },
    { text: '', unit: 'um', message: /enter a length such as 25 µm/ },
    { text: 'mm', unit: 'mm', message: /has no number/ },
    { text: '1e999', unit: 'mm', message: /too large/ },
  ] satisfies readonly { text: string; unit: FieldUnit; message: RegExp }[])(
    '"$text" as $unit fails with a clear message and does not throw',
    ({ text, unit, message }) => {
      const r = parseQuantity(text, unit);
      expect(r.ok).toBe(false);
      if (!r.ok) expect(r.message).toMatch(message);
    },
  );
});
