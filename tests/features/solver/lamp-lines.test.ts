import { describe, expect, it } from 'vitest';
import {
  LAMP_ELEMENTS,
  LAMP_LINES,
  LAMP_LINES_MEDIUM,
  LAMP_LINES_SOURCE,
  LINE_STRENGTHS,
  type LampElement,
} from '@/shared/lamp-lines';

const has = (element: LampElement, nm: number, within = 5e-4) =>
  LAMP_LINES[element].some((l) => Math.abs(l.wavelengthNm - nm) <= within);

describe('built-in lamp lines', () => {
  it('name their source and medium, and say they are to be verified', () => {
    expect(LAMP_LINES_SOURCE).toMatch(/NIST Atomic Spectra Database/);
    expect(LAMP_LINES_SOURCE).toMatch(/from memory/);
    expect(LAMP_LINES_SOURCE).toMatch(/verified/);
    expect(LAMP_LINES_MEDIUM).toBe('air');
  });

  it.each(LAMP_ELEMENTS)('%s: sorted, unique, 250–1000 nm, each with a strength', (element) => {
    const lines = LAMP_LINES[element];
    expect(lines.length).toBeGreaterThanOrEqual(2);
    for (let i = 0; i < lines.length; i++) {
      const line = lines[i]!;
      expect(line.element).toBe(element);
      expect(line.wavelengthNm).toBeGreaterThanOrEqual(250);
      expect(line.wavelengthNm).toBeLessThanOrEqual(1000);
      expect(LINE_STRENGTHS).toContain(line.strength);
      if (i > 0) expect(line.wavelengthNm).toBeGreaterThan(lines[i - 1]!.wavelengthNm);
    }
  });

  it.each([
    // NIST ASD air wavelengths as the issue and REFERENCES.md name them (from memory).
    ...[253.652, 296.728, 302.15, 313.155, 334.148, 365.015, 404.656, 407.783, 435.833, 546.074, 576.96, 579.066].map(
      (nm) => ({ element: 'Hg' as const, nm }),
    ),
    ...[588.995, 589.592].map((nm) => ({ element: 'Na' as const, nm })),
    ...[585.249, 640.225, 703.241].map((nm) => ({ element: 'Ne' as const, nm })),
    ...[696.543, 706.722, 763.511, 811.531, 912.297].map((nm) => ({ element: 'Ar' as const, nm })),
    ...[557.029, 587.092, 760.155, 811.29].map((nm) => ({ element: 'Kr' as const, nm })),
  ] satisfies { element: LampElement; nm: number }[])('$element has the line at $nm nm', ({ element, nm }) => {
    expect(has(element, nm)).toBe(true);
  });

  it('carries the full-precision pairs the resolution tests use (NIST ASD, from memory)', () => {
    expect(has('Na', 588.995, 0)).toBe(true);
    expect(has('Na', 589.5924, 0)).toBe(true);
    expect(has('Hg', 576.9598, 0)).toBe(true);
    expect(has('Hg', 579.0663, 0)).toBe(true);
  });
});
