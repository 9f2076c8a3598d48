import { describe, expect, it } from 'vitest';
import { spectralBand, wavelengthStroke } from '../../../features/sketch/wavelength-colour';

/** WCAG 2.1 relative luminance and contrast ratio (W3C, Web Content Accessibility Guidelines 2.1, §1.4.3 definitions). */
function luminance(hex: string): number {
  const channel = (i: number) => {
    const c = parseInt(hex.slice(1 + 2 * i, 3 + 2 * i), 16) / 255;
    return c <= 0.03928 ? c / 12.92 : ((c + 0.055) / 1.055) ** 2.4;
  };
  return 0.2126 * channel(0) + 0.7152 * channel(1) + 0.0722 * channel(2);
}
function contrast(a: string, b: string): number {
  const [hi, lo] = [luminance(a), luminance(b)].sort((x, y) => y - x) as [number, number];
  return (hi + 0.05) / (lo + 0.05);
}
const PAPER = '#F4F1EA';

describe('wavelengthStroke', () => {
  it('gives ultraviolet, visible and infrared light three different dash styles', () => {
    const uv = wavelengthStroke(250);
    const visible = wavelengthStroke(550);
    const ir = wavelengthStroke(1200);
    expect(visible.dash).toBeNull();
    expect(uv.dash).not.toBeNull();
    expect(ir.dash).not.toBeNull();
    expect(uv.dash).not.toBe(ir.dash);
    expect(new Set([uv.stroke, visible.stroke, ir.stroke]).size).toBe(3);
  });

  it.each([
    { nm: 379.9, band: 'ultraviolet' },
    { nm: 380, band: 'visible' },
    { nm: 750, band: 'visible' },
    { nm: 750.1, band: 'infrared' },
  ] satisfies { nm: number; band: ReturnType<typeof spectralBand> }[])(
    'puts $nm nm in the $band (380–750 nm visible, common practice)',
    ({ nm, band }) => {
      expect(spectralBand(nm)).toBe(band);
      expect(wavelengthStroke(nm).band).toBe(band);
    },
  );

  it('keeps every stroke at least 3:1 against the paper (WCAG 2.1 SC 1.4.11, non-text contrast)', () => {
    for (let nm = 200; nm <= 1200; nm += 5) {
      expect(contrast(wavelengthStroke(nm).stroke, PAPER), `${nm} nm`).toBeGreaterThanOrEqual(3);
    }
  });

  it('runs from violet through green to red across the visible band', () => {
    const hue = (hex: string) => {
      const [r, g, b] = [1, 3, 5].map((i) => parseInt(hex.slice(i, i + 2), 16));
      return { r: r!, g: g!, b: b! };
    };
    const violet = hue(wavelengthStroke(400).stroke);
    const green = hue(wavelengthStroke(530).stroke);
    const red = hue(wavelengthStroke(680).stroke);
    expect(violet.b).toBeGreaterThan(violet.g);
    expect(green.g).toBeGreaterThan(green.r);
    expect(green.g).toBeGreaterThan(green.b);
    expect(red.r).toBeGreaterThan(red.g);
  });
});
