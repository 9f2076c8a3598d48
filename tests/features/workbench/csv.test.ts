import { describe, expect, it } from 'vitest';
import { evaluateDesign } from '../../../features/solver';
import { rangeTableColumns, rangeTableCsv } from '../../../features/workbench/csv';
import { exampleDesign, type Design } from '../../../shared/design';

/** Minimal RFC 4180 reader, enough for the table: quoted fields may hold commas. */
function parseCsv(text: string): string[][] {
  return text
    .trimEnd()
    .split('\r\n')
    .map((line) =>
      line
        .match(/("([^"]|"")*"|[^,]*)(,|$)/g)!
        .filter((f) => f !== '')
        .map((f) => f.replace(/,$/, '').replace(/^"|"$/g, '')),
    );
}

describe('the range table as CSV', () => {
  it('has a header row with units and one row per wavelength, numbers as the solver gave them', () => {
    const { points } = evaluateDesign(exampleDesign, { wavelengthsNm: [400, 600, 800] });
    const rows = parseCsv(rangeTableCsv(points));
    expect(rows[0]).toEqual([...rangeTableColumns]);
    expect(rows).toHaveLength(4);
    expect(Number(rows[2]?.[0])).toBe(600);
    expect(Number(rows[2]?.[3])).toBeCloseTo(points[1]!.bandpassNm!, 5);
  });

  it('keeps an unreachable wavelength as a row with empty figures', () => {
    const { points } = evaluateDesign(exampleDesign, { wavelengthsNm: [500, 5000] });
    const rows = parseCsv(rangeTableCsv(points));
    expect(rows[2]?.[0]).toBe('5000');
    expect(rows[2]?.slice(1, 6)).toEqual(['', '', '', '', '']);
  });

  it('quotes the list of overlapping orders so it stays one column', () => {
    // With a source from 200 to 1100 nm, second order 300 nm leaves at the angle of first order 600 nm.
    const { points } = evaluateDesign(exampleDesign, { wavelengthsNm: [600] });
    expect(points[0]?.overlaps.length).toBeGreaterThan(0);
    const rows = parseCsv(rangeTableCsv(points));
    expect(rows[1]).toHaveLength(rangeTableColumns.length);
    expect(rows[1]?.[6]).toContain('m=2 300 nm');
  });

  it('writes numbers for a program, not for people: hyphen-minus and no digit grouping', () => {
    // Order −1 turns the grating the other way, so the rotation column is negative.
    const mirrored: Design = { ...exampleDesign, grating: { ...exampleDesign.grating, order: -1 } };
    const { points } = evaluateDesign(mirrored, { wavelengthsNm: [600] });
    const rows = parseCsv(rangeTableCsv(points));
    expect(rows[1]?.[1]).toMatch(/^-\d/);
    expect(rows[1]?.[4]).toMatch(/^\d+$/);
    expect(rangeTableCsv(points)).not.toMatch(/[\u2212\u2009\u202F]/);
  });
});
