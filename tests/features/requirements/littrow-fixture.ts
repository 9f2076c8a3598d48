import type { Design } from '@/shared/design';
import type { Requirements } from '@/shared/requirements';

/**
 * A Littrow mount whose figures are easy by hand: 1200 grooves/mm (d = 833.33 nm), first order,
 * 500 mm focal length, matched 100 µm slits, 50 mm square grating, range 400–600 nm (centre
 * 500 nm), a 2000 × 25 µm detector. In Littrow α = β and `mλ = 2d sin β`, so at 500 nm
 * sin β = 500 / 1666.67 = 0.3 and cos β = √0.91 = 0.953939.
 */
export function littrowDesign(requirements?: Requirements): Design {
  return {
    grating: { grooveDensityPerMm: 1200, order: 1, blazeWavelengthNm: 500, ruledWidthMm: 50, ruledHeightMm: 50 },
    layout: { kind: 'littrow', deviationAngleDeg: 0, collimatorFocalMm: 500, cameraFocalMm: 500 },
    slits: { entranceWidthUm: 100, exitWidthUm: 100, heightMm: 10 },
    range: { startNm: 400, endNm: 600 },
    detector: { pixelPitchUm: 25, pixelCount: 2000 },
    ...(requirements ? { requirements } : {}),
  };
}

/** Just inside / just outside a limit: 0.1 % either side of the hand-computed value. */
export const JUST = 1e-3;
