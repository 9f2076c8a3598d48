import { describe, expect, it } from 'vitest';
import { designCalibrationLines, designLineListNames, DEFAULT_LAMP_ELEMENTS } from '../../../features/calibration/design-lines';
import type { DesignCurve } from '../../../shared/curves';
import { exampleDesign, type Design } from '../../../shared/design';

const curve = (over: Partial<DesignCurve>): DesignCurve => ({
  kind: 'line-list',
  name: 'Bench lamp',
  checksum: 'a'.repeat(64),
  medium: 'air',
  wavelengthsNm: [500, 700],
  values: [1, 0.5],
  ...over,
});

describe('the lines a design is checked against', () => {
  it('shows mercury and neon until the designer picks other lamps', () => {
    expect(DEFAULT_LAMP_ELEMENTS).toEqual(['Hg', 'Ne']);
    const lines = designCalibrationLines(exampleDesign, DEFAULT_LAMP_ELEMENTS);
    expect(new Set(lines.map((l) => l.element))).toEqual(new Set(['Hg', 'Ne']));
    // Mercury's green e-line, 546.0735 nm in air (NIST ASD, Hg I).
    expect(lines.some((l) => l.element === 'Hg' && Math.abs(l.wavelengthNm - 546.0735) < 1e-4)).toBe(true);
    for (let i = 1; i < lines.length; i++) expect(lines[i]!.wavelengthNm).toBeGreaterThanOrEqual(lines[i - 1]!.wavelengthNm);
  });

  it('adds the design’s own line lists, labelled with the list’s name, and ignores other curve kinds', () => {
    const design: Design = {
      ...exampleDesign,
      curves: [
        curve({ name: 'Bench lamp', wavelengthsNm: [512.5, 650.25] }),
        curve({ kind: 'mirror-reflectance', name: 'Mirror', wavelengthsNm: [400, 800], values: [0.9, 0.9] }),
      ],
    };
    const user = designCalibrationLines(design, []).filter((l) => l.origin === 'user');
    expect(user.map((l) => [l.wavelengthNm, l.label])).toEqual([
      [512.5, 'Bench lamp'],
      [650.25, 'Bench lamp'],
    ]);
    expect(designLineListNames(design)).toEqual(['Bench lamp']);
  });

  it('converts a list stated in vacuum to air', () => {
    // Na D1: 589.7558 nm in vacuum, 589.5924 nm in air (NIST ASD, Na I); n_air ≈ 1.000277 there.
    const design: Design = { ...exampleDesign, curves: [curve({ medium: 'vacuum', wavelengthsNm: [589.7558, 600] })] };
    const d1 = designCalibrationLines(design, [])[0]!;
    expect(d1.wavelengthNm).toBeCloseTo(589.5924, 2);
    expect(d1.vacuumWavelengthNm).toBe(589.7558);
  });
});
