import { describe, expect, it } from 'vitest';
import {
  cancelledWords,
  candidateMessage,
  FIGURE_COLUMNS,
  finishedWords,
  mostExcluding,
  nothingPassesWords,
  progressWords,
} from '../../../features/candidates/format';
import type { CandidateFigures } from '../../../shared/search';

// Digits from five up are grouped by a narrow no-break space (shared/format.ts); minus is U+2212.
const G = '\u202F';

describe("the candidate search's words", () => {
  it('counts progress the house way', () => {
    expect(progressWords(3200, 13440)).toBe(`3200 of 13${G}440 designs`);
    expect(cancelledWords(1)).toBe('Search cancelled after 1 design.');
    expect(cancelledWords(12500)).toBe(`Search cancelled after 12${G}500 designs.`);
  });

  it('announces how many designs met every requirement', () => {
    expect(finishedWords({ candidates: [], considered: 13440 })).toBe(`No design of 13${G}440 meets every requirement.`);
    expect(finishedWords({ candidates: [{} as never], considered: 250 })).toBe('1 design meets every requirement, best first (of 250 tried).');
  });

  it('writes the version message of a saved candidate with its signed order', () => {
    expect(candidateMessage(1, { grooveDensityPerMm: 1200, order: 1, focalLengthMm: 300 })).toBe(
      'Candidate 1 from the search: 1200/mm, order +1, f = 300 mm',
    );
    expect(candidateMessage(3, { grooveDensityPerMm: 600, order: -2, focalLengthMm: 250 })).toBe(
      'Candidate 3 from the search: 600/mm, order \u22122, f = 250 mm',
    );
  });

  it('shows every figure that matters, a missing one as a dash', () => {
    const figures: CandidateFigures = {
      grooveDensityPerMm: 1200,
      order: 1,
      blazeWavelengthNm: 500,
      deviationAngleDeg: 30,
      focalLengthMm: 300,
      slitWidthUm: 41.7,
      worstBandpassNm: 0.1,
      worstResolvingPower: 4000,
      minBlazeEfficiency: 0.42,
      reciprocalDispersionAtCentreNmPerMm: 2.63,
      fNumber: null,
      overlappedWavelengths: 0,
      minMargin: 0.1,
    };
    const texts = Object.fromEntries(FIGURE_COLUMNS.map((column) => [column.key, column.text(figures, 0.8123)]));
    expect(texts).toMatchObject({
      grooveDensityPerMm: '1200/mm',
      order: '+1',
      slitWidthUm: '41.7\u00A0µm',
      minBlazeEfficiency: `42${G}%`,
      fNumber: '—',
      score: '0.812',
    });
    expect(FIGURE_COLUMNS).toHaveLength(12);
  });

  it('names the requirement that excluded the most and how far the nearest design misses', () => {
    expect(mostExcluding({})).toBeNull();
    expect(mostExcluding({ maxBandpassNm: 900, minBlazeEfficiency: 1200, maxFNumber: 1200 })).toEqual({ id: 'minBlazeEfficiency', count: 1200 });
    const words = nothingPassesWords({
      considered: 2000,
      excludedBy: { maxBandpassNm: 1800, minBlazeEfficiency: 300 },
      nearest: [{ design: {} as never, misses: { minBlazeEfficiency: -0.05, maxBandpassNm: -0.24 } }],
    });
    expect(words.headline).toBe('“Bandpass at most” excluded the most: 1800 of 2000 designs.');
    // The worst miss first.
    expect(words.misses).toEqual([`bandpass at most: misses by 24${G}%`, `blaze efficiency at least: misses by 5${G}%`]);
  });
});
