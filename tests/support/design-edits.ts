import type { Design } from '../../shared/design';

/** An invented demo design with only the required sections, for diff and rebase tests. */
export const plainDesign: Design = {
  grating: { grooveDensityPerMm: 1200, order: 1, blazeWavelengthNm: 500, ruledWidthMm: 25, ruledHeightMm: 25 },
  layout: { kind: 'czerny-turner', deviationAngleDeg: 24, collimatorFocalMm: 150, cameraFocalMm: 150 },
  slits: { entranceWidthUm: 50, exitWidthUm: 50, heightMm: 4 },
  range: { startNm: 380, endNm: 780 },
};

/** A copy of `base` with `changes` made to it; `base` is left as it was. */
export function editedCopy(changes: (design: Design) => void, base: Design = plainDesign): Design {
  const copy = structuredClone(base);
  changes(copy);
  return copy;
}
