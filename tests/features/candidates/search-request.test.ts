import { describe, expect, it } from 'vitest';
import { DEFAULT_CONTROLS, hasRequirements, searchRequestFromDesign } from '../../../features/candidates/search-request';
import { exampleDesign, type Design } from '../../../shared/design';
import { searchRequestSchema } from '../../../shared/search';

const withRequirements: Design = { ...exampleDesign, requirements: { maxBandpassNm: 0.5, minBlazeEfficiency: 0.4 } };

describe('the search request built from the design in the editor', () => {
  it('is null without requirements, or with only qualifiers that limit nothing', () => {
    expect(searchRequestFromDesign({ ...exampleDesign, requirements: undefined }, DEFAULT_CONTROLS)).toBeNull();
    expect(searchRequestFromDesign({ ...exampleDesign, requirements: {} }, DEFAULT_CONTROLS)).toBeNull();
    expect(hasRequirements({ atWavelengthsNm: [546.1], driveStepArcsec: 2 })).toBe(false);
    expect(hasRequirements({ oneShotCoverage: true })).toBe(true);
  });

  it("carries the design's range, source, detector and requirements, and the panel's limits", () => {
    const request = searchRequestFromDesign(withRequirements, {
      maxOrder: 3,
      top: 5,
      weights: { margin: 2, efficiency: 0, size: 1, overlap: 3 },
    });
    expect(request).toEqual({
      range: exampleDesign.range,
      source: exampleDesign.source,
      detector: exampleDesign.detector,
      requirements: { maxBandpassNm: 0.5, minBlazeEfficiency: 0.4 },
      search: { maxOrder: 3, top: 5, weights: { margin: 2, efficiency: 0, size: 1, overlap: 3 } },
    });
    // The same shape POST /api/search takes, so the panel and the route cannot drift.
    expect(searchRequestSchema.safeParse(request).success).toBe(true);
  });

  it('leaves out a source or detector the design does not have', () => {
    const request = searchRequestFromDesign({ ...withRequirements, source: undefined, detector: undefined }, DEFAULT_CONTROLS);
    expect(request).not.toHaveProperty('source');
    expect(request).not.toHaveProperty('detector');
  });

  it('keeps the number shown within 1…20', () => {
    expect(searchRequestFromDesign(withRequirements, { ...DEFAULT_CONTROLS, top: 50 })?.search?.top).toBe(20);
    expect(searchRequestFromDesign(withRequirements, { ...DEFAULT_CONTROLS, top: 0 })?.search?.top).toBe(1);
  });
});
