import { describe, expect, it } from 'vitest';
import { hatchPath } from '../../../features/plots/plot-paths';
import { requirementShading } from '../../../features/plots/requirement-shading';
import { evaluateDesign, type WavelengthPoint } from '../../../features/solver';
import { exampleDesign, type Design } from '../../../shared/design';

describe('hatching for a failing span', () => {
  it('fills a 10 px square with 45° lines 5 px apart, clipped to its sides', () => {
    // Feet at x0 = −5, 0, 5 on the bottom edge, each rising 1 px per px (worked by hand):
    // x0 = −5 enters at the left side 5 px up; x0 = 5 leaves at the right side 5 px up.
    expect(hatchPath(0, 10, 0, 10, 5)).toBe('M0,5L5,0M0,10L10,0M5,10L10,5');
  });

  it('draws nothing for an empty band', () => {
    expect(hatchPath(10, 10, 0, 10)).toBe('');
    expect(hatchPath(0, 10, 10, 10)).toBe('');
  });
});

describe('where a plot shades its failing requirements', () => {
  const points = (design: Design): WavelengthPoint[] => evaluateDesign(design, { points: 200 }).points;

  it('shades nothing and says nothing without requirements', () => {
    expect(requirementShading(points(exampleDesign), exampleDesign)).toBeNull();
  });

  it('shades the bandpass plot exactly over the samples whose bandpass is over the limit', () => {
    const sweep = points(exampleDesign);
    const bandpasses = sweep.map((p) => p.bandpassNm ?? 0);
    // A limit half-way between the smallest and largest bandpass must fail part of the range.
    const limit = (Math.min(...bandpasses) + Math.max(...bandpasses)) / 2;
    const design: Design = { ...exampleDesign, requirements: { maxBandpassNm: limit } };
    const shade = requirementShading(sweep, design);
    const over = sweep.filter((p) => (p.bandpassNm ?? 0) > limit).map((p) => p.wavelengthNm);
    expect(over.length).toBeGreaterThan(0);
    expect(over.length).toBeLessThan(sweep.length);
    const inside = (nm: number) => (shade?.bandpass.intervals ?? []).some((iv) => nm >= iv.startNm && nm <= iv.endNm);
    for (const p of sweep) expect(inside(p.wavelengthNm)).toBe(over.includes(p.wavelengthNm));
    expect(shade?.bandpass.summary).toMatch(/^bandpass over [\d.]+ nm (between|at) /);
    // Other plots show other requirements: nothing of theirs fails.
    expect(shade?.dispersion.intervals).toEqual([]);
    expect(shade?.efficiency.intervals).toEqual([]);
  });
});
