import { beforeAll, describe, expect, it } from 'vitest';
import { loadUnitParser } from '../../../features/solver';
import { GLASS_STACK_DEFAULTS, checkGlassStack, defaultGlassFilter, type GlassStackText } from '../../../features/selectors/glass-stack-form';
import { edgeFigures, glassTradeOff } from '../../../features/selectors/glass-trade-off';
import type { AbsorptionFilter } from '../../../shared/selectors';

// mathjs loads in seconds, but a machine shared by several test runs has taken over 10 s.
beforeAll(loadUnitParser, 60_000);

/** n = 1 has no surface loss, so the curve is the internal transmittance alone. */
const bare: AbsorptionFilter = {
  shape: 'long-pass',
  edgeNm: 500,
  edgeWidthNm: 20,
  peakInternalTransmission: 1,
  referenceThicknessMm: 2,
  thicknessMm: 2,
  refractiveIndex: 1,
};

describe('the glass stack’s edge and peak', () => {
  it('measures a lone filter’s 10–90 % edge as the width it was given', () => {
    // A logistic edge with scale s = w/(2 ln 9) goes from 10 % to 90 % over 2 s ln 9 = w (by definition).
    const figures = edgeFigures(
      (nm) => 1 / (1 + Math.exp(-(nm - 500) / (20 / (2 * Math.log(9))))),
      300,
      900,
    );
    expect(figures.edgeWidthNm).toBeCloseTo(20, 1);
    expect(figures.peak).toBeCloseTo(1, 6);
  });

  it('shows two stacked filters with a narrower edge: 0.839 of one filter’s width', () => {
    // Two stacked: T = L², so L runs from √0.1 = 0.3162 to √0.9 = 0.9487; in scale lengths
    // ln(L/(1−L)) goes from −0.7713 to 2.9170, 3.6883 s against one filter's 2 ln 9 s = 4.3944 s:
    // 20 nm × 3.6883/4.3944 = 16.79 nm (hand computation, Beer–Lambert).
    const tradeOff = glassTradeOff([bare, bare], 300, 900);
    expect(tradeOff?.stack.edgeWidthNm).toBeCloseTo(16.79, 1);
    expect(tradeOff?.baseline.edgeWidthNm).toBeCloseTo(20, 1);
  });

  it('puts numbers on the lower peak: 0.9 internal, n = 1.5 loses 4 % per surface', () => {
    // ρ = (0.5/2.5)² = 0.04 (Hecht, Optics, §4.6); one filter 0.9 × 0.96² = 0.82944,
    // twice as thick 0.81 × 0.9216 = 0.746496 (hand computation).
    const glass = { ...bare, peakInternalTransmission: 0.9, refractiveIndex: 1.5 };
    const tradeOff = glassTradeOff([glass], 300, 900);
    expect(tradeOff?.stack.peak).toBeCloseTo(0.82944, 4);
    expect(tradeOff?.baseline.peak).toBeCloseTo(0.746496, 4);
    expect(tradeOff?.sentence).toMatch(/^This filter at its reference thickness: 10–90 % edge 20\u00A0nm, peak 82\.9\u202F%\. Twice as thick \(4\u00A0mm\), or two of it stacked: 10–90 % edge 16\.8\u00A0nm, peak 74\.6\u202F%\./);
  });

  it('says when the range holds no rising edge', () => {
    expect(edgeFigures(() => 0.5, 300, 900).edgeWidthNm).toBeNull();
  });
});

describe('the glass stack calculator', () => {
  const withFilter = (patch: Partial<GlassStackText['filters'][number]>): GlassStackText => ({
    ...GLASS_STACK_DEFAULTS,
    filters: [{ ...defaultGlassFilter('a'), ...patch }],
  });

  it('makes the API input from the defaults: 401 wavelengths across the range', () => {
    const check = checkGlassStack(GLASS_STACK_DEFAULTS);
    expect(check.ok).toBe(true);
    expect(check.ok && check.input.wavelengthsNm.length).toBe(401);
    expect(check.ok && check.input.filters[0]).not.toHaveProperty('upperEdgeNm');
  });

  it('names the filter and its field in each refusal', () => {
    const check = checkGlassStack(withFilter({ shape: 'band-pass', upperEdgeNm: '' }));
    expect(!check.ok && check.errors['filters.0.upperEdgeNm']).toBe('Filter 1 upper edge is required');
    const lower = checkGlassStack(withFilter({ shape: 'band-pass', upperEdgeNm: '400' }));
    expect(!lower.ok && lower.errors['filters.0.upperEdgeNm']).toBe('Filter 1 upper edge must be greater than the edge');
    const peak = checkGlassStack(withFilter({ peakInternalTransmission: '120 %' }));
    expect(!peak.ok && peak.errors['filters.0.peakInternalTransmission']).toBe(
      'Filter 1 peak internal transmission must be at most 1 (a fraction: 0.9 means 90 %)',
    );
  });

  it('reads a thickness in centimetres', () => {
    const check = checkGlassStack(withFilter({ thicknessMm: '0.5 cm' }));
    expect(check.ok && check.input.filters[0]?.thicknessMm).toBeCloseTo(5, 9);
  });
});
