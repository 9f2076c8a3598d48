import { describe, expect, it } from 'vitest';
import {
  axisMarginPx,
  labelWidthPx,
  MONO_ADVANCE_EM,
  sharesAxis,
  TICK_GAP_PX,
  TICK_PX,
  TITLE_BAND_PX,
  valueScale,
  valueTicks,
} from '../../../features/plots/axes';
import { scalarBlazeCaution } from '../../../features/plots/captions';
import { evaluateDesign } from '../../../features/solver';
import { exampleDesign, type Design } from '../../../shared/design';

describe('room for tick labels', () => {
  it('measures labels in characters of the monospaced tick font', () => {
    // IBM Plex Mono advances every glyph 600/1000 em (the font's metrics, from memory).
    expect(MONO_ADVANCE_EM).toBe(0.6);
    expect(labelWidthPx(['0', '20,000', '5'])).toBe(Math.ceil(6 * 0.6 * TICK_PX));
    // A true minus is one character, like a hyphen.
    expect(labelWidthPx(['−1.5'])).toBe(labelWidthPx(['-1.5']));
  });

  it.each([
    { name: '5-digit resolving powers', labels: ['10,000', '15,000', '20,000', '25,000', '30,000'] },
    { name: 'percentages', labels: ['0%', '50%', '100%'] },
    { name: 'small bandpasses', labels: ['0.000', '0.005', '0.010'] },
  ])('keeps $name clear of the axis title band', ({ labels }) => {
    // Labels end TICK_GAP_PX left of the axis; the rotated title fills the outer TITLE_BAND_PX.
    const margin = axisMarginPx(labels);
    const labelStart = margin - TICK_GAP_PX - labelWidthPx(labels);
    expect(labelStart).toBeGreaterThanOrEqual(TITLE_BAND_PX);
  });

  it('grows with the labels: the margin that fit 3-digit ticks is too narrow for 5-digit ones', () => {
    expect(axisMarginPx(['20,000'])).toBeGreaterThan(axisMarginPx(['200']));
    // The fixed 54 px margin the plots had before, with the title at 12 px, left 5-digit labels
    // over the title (the compare screen's resolving power plot).
    const oldLabelStart = 54 - 6 - labelWidthPx(['20,000']);
    expect(oldLabelStart).toBeLessThan(12 + TICK_PX / 2);
  });
});

describe('one value scale, one axis', () => {
  const before = { label: 'v1', unit: '', axisTitle: 'Resolving power R', values: [10_000, 12_000, 14_000] };
  const after = { label: 'v2', unit: '', axisTitle: 'Resolving power R', values: [20_000, 26_000, 31_000] };

  it('two versions of one figure share the axis; two different figures keep their own', () => {
    expect(sharesAxis(before, after)).toBe(true);
    const bandpass = { label: 'Bandpass', unit: 'nm', axisTitle: 'bandpass, nm', values: [0.1, 0.2] };
    const power = { label: 'R', unit: '', axisTitle: 'resolving power R', values: [3000, 6000] };
    expect(sharesAxis(bandpass, power)).toBe(false);
    expect(sharesAxis(bandpass, { ...power, axis: 'shared' })).toBe(true);
    expect(sharesAxis(before, { ...after, axis: 'own' })).toBe(false);
  });

  it('a shared scale spans both series, so neither line leaves the plot', () => {
    const scale = valueScale([before, after], 10, 200);
    const [lo, hi] = scale.domain() as [number, number];
    expect(lo).toBeLessThanOrEqual(10_000);
    expect(hi).toBeGreaterThanOrEqual(31_000);
    expect(valueTicks(scale).labels.every((label) => /^\d{1,2},\d{3}$|^0$/.test(label))).toBe(true);
  });

  it('a fixed domain wins over the data', () => {
    const scale = valueScale([{ ...before, domain: [0, 1] }, after], 10, 200);
    expect(scale.domain()).toEqual([0, 1]);
  });
});

describe('efficiency caption', () => {
  const design = (overrides: Partial<Design['grating']>, range?: Design['range']): Design => ({
    ...exampleDesign,
    grating: { ...exampleDesign.grating, ...overrides },
    range: range ?? exampleDesign.range,
  });

  it('cautions from the first wavelength where λ/d passes 0.2 (Palmer & Loewen, ch. 9, from memory)', () => {
    // 300 g/mm: d = 3333 nm, λ/d = 0.2 at 666.7 nm; 11 points over 400–900 nm.
    const caution = scalarBlazeCaution(evaluateDesign(design({ grooveDensityPerMm: 300 }, { startNm: 400, endNm: 900 }), { points: 11 }));
    expect(caution?.fromNm).toBe(700);
    expect(caution?.text).toMatch(/^Caution: from 700 nm on λ\/d exceeds 0\.2:/);
    // 1200 g/mm over 300–900 nm: λ/d ≥ 0.36 everywhere.
    expect(scalarBlazeCaution(evaluateDesign(design({}), { points: 11 }))?.text).toMatch(/^Caution: across the whole plot λ\/d exceeds 0\.2:/);
  });

  it('says nothing extra inside the scalar region or without a blaze wavelength', () => {
    expect(scalarBlazeCaution(evaluateDesign(design({ grooveDensityPerMm: 300 }, { startNm: 400, endNm: 600 }), { points: 11 }))).toBeNull();
    expect(scalarBlazeCaution(evaluateDesign(design({ blazeWavelengthNm: undefined }), { points: 11 }))).toBeNull();
  });
});
