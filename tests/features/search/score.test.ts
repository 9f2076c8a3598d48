import { describe, expect, it } from 'vitest';
import { DEFAULT_WEIGHTS, SCORE_EXPLANATION, resolveWeights, scoreParts, weightedScore } from '@/features/search';

describe('score', () => {
  it('takes each part from 0 to 1 as stated', () => {
    // 25 % headroom; 60 % worst blaze; 250 of 1000 mm → 1 − 0.25; 5 of 50 wavelengths overlapped → 0.9.
    expect(
      scoreParts({
        minMarginUnsolved: 0.25,
        minBlazeEfficiency: 0.6,
        focalLengthMm: 250,
        longestFocalMm: 1000,
        overlappedWavelengths: 5,
        checkedWavelengths: 50,
      }),
    ).toEqual({ margin: 0.25, efficiency: 0.6, size: 0.75, overlap: 0.9 });
  });

  it('caps a generous margin at 1, counts no tight requirement as 1, and never goes below 0', () => {
    const base = { minBlazeEfficiency: 0.5, focalLengthMm: 1000, longestFocalMm: 1000, overlappedWavelengths: 50, checkedWavelengths: 50 };
    expect(scoreParts({ ...base, minMarginUnsolved: 3 }).margin).toBe(1);
    expect(scoreParts({ ...base, minMarginUnsolved: null }).margin).toBe(1);
    expect(scoreParts({ ...base, minMarginUnsolved: -0.2 }).margin).toBe(0);
    expect(scoreParts({ ...base, minMarginUnsolved: 0 }).size).toBe(0);
    expect(scoreParts({ ...base, minMarginUnsolved: 0 }).overlap).toBe(0);
  });

  it('is the weighted mean of the parts', () => {
    const parts = { margin: 0.25, efficiency: 0.6, size: 0.75, overlap: 0.9 };
    // (0.25 + 0.6 + 0.75 + 0.9) / 4 = 0.625; with efficiency ×3: (0.25 + 1.8 + 0.75 + 0.9) / 6 = 0.61667.
    expect(weightedScore(parts, DEFAULT_WEIGHTS)).toBeCloseTo(0.625, 12);
    expect(weightedScore(parts, resolveWeights({ efficiency: 3 }))).toBeCloseTo(3.7 / 6, 12);
    expect(weightedScore(parts, resolveWeights({ margin: 0, efficiency: 0, size: 0, overlap: 0 }))).toBe(0);
  });

  it('fills missing weights with 1 and says so in words', () => {
    expect(resolveWeights({ size: 2 })).toEqual({ margin: 1, efficiency: 1, size: 2, overlap: 1 });
    expect(resolveWeights(undefined)).toEqual(DEFAULT_WEIGHTS);
    for (const word of ['Margin', 'Efficiency', 'Size', 'Overlap', 'weighted mean']) expect(SCORE_EXPLANATION).toContain(word);
  });
});
