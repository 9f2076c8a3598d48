import { beforeAll, describe, expect, it } from 'vitest';
import { loadUnitParser } from '../../../features/solver';
import { carriesOwnUnit, readFieldText, type CalculatorField } from '../../../features/selectors/field-reading';

// mathjs loads in seconds, but a machine shared by several test runs has taken over 10 s.
beforeAll(loadUnitParser, 60_000);

const field = (reading: CalculatorField['reading'], optional = false): CalculatorField => ({
  key: 'x',
  label: 'X',
  reading,
  help: '',
  optional,
});

describe('reading a calculator field', () => {
  it.each([
    // Unit conversions: SI prefixes (common practice).
    ['nm', '0.55 µm', 550],
    ['nm', '550', 550],
    ['nm', '5500 Å', 550],
    ['mm', '2 cm', 20],
    ['um', '0.05 mm', 50],
    ['deg', '5°', 5],
    ['fraction', '90 %', 0.9],
    ['fraction', '0.9', 0.9],
    ['number', '1.45', 1.45],
    ['integer', '3', 3],
  ] as const)('reads %s from "%s" as %d', (reading, text, value) => {
    const read = readFieldText(field(reading), text);
    expect(read.ok).toBe(true);
    expect(read.ok && (read.value as number)).toBeCloseTo(value, 9);
  });

  it('reads a list separated by commas', () => {
    expect(readFieldText(field('number-list'), '0.6961663, 0.4079426,0.8974794')).toEqual({
      ok: true,
      value: [0.6961663, 0.4079426, 0.8974794],
    });
  });

  it('names the list item it cannot read', () => {
    const read = readFieldText(field('number-list'), '0.69, x');
    expect(read.ok).toBe(false);
    expect(!read.ok && read.message).toMatch(/^item 2: could not read "x"/);
  });

  it('refuses a fraction of an order and a wavelength given as an angle', () => {
    expect(readFieldText(field('integer'), '2.5')).toEqual({ ok: false, message: 'must be a whole number' });
    const read = readFieldText(field('nm'), '5 deg');
    expect(!read.ok && read.message).toMatch(/is not a length/);
  });

  it('leaves a blank optional field out and asks for a blank required one', () => {
    expect(readFieldText(field('mm', true), ' ')).toEqual({ ok: true, value: undefined });
    expect(readFieldText(field('mm'), '')).toEqual({ ok: false, message: 'is required' });
  });

  it('knows when the text names its own unit', () => {
    expect(carriesOwnUnit('550')).toBe(false);
    expect(carriesOwnUnit('0.55 um')).toBe(true);
  });
});
