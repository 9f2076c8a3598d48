/** What the search benchmark and the soak both ask the search for. */

export const range = (from: number, step: number, count: number) => Array.from({ length: count }, (_, i) => from + i * step);

/**
 * A search a person refines: 5 densities × 5 blazes (each below 2d of every density) × orders ±1
 * × 10 deviations × the focal lengths given, every one reaching 400–700 nm.
 */
export function searchInput(focalLengthsMm: number[]) {
  return {
    range: { startNm: 400, endNm: 700 },
    source: { minNm: 380, maxNm: 780 },
    detector: { pixelPitchUm: 14, pixelCount: 2048 },
    requirements: { maxBandpassNm: 0.5, minBlazeEfficiency: 0.3, maxFocalLengthMm: 900, orderOverlap: 'forbidden' },
    search: {
      grooveDensitiesPerMm: [300, 600, 900, 1000, 1200],
      blazeWavelengthsNm: [300, 400, 500, 600, 750],
      maxOrder: 1,
      deviationAnglesDeg: range(5, 5, 10),
      focalLengthsMm,
    },
  };
}
