import type { Design } from './design';

/**
 * Invented demo instruments (not catalogue products): round numbers a designer would sketch first
 * and then refine. The workbench offers them as starting points and the demo seed builds its
 * notebooks from them, so both show the same instruments.
 */
export const demoDesigns = {
  visibleScanner: {
    grating: {
      grooveDensityPerMm: 1200,
      order: 1,
      blazeWavelengthNm: 500,
      ruledWidthMm: 25,
      ruledHeightMm: 25,
    },
    layout: {
      kind: 'czerny-turner',
      deviationAngleDeg: 24,
      collimatorFocalMm: 150,
      cameraFocalMm: 150,
      collimatorOffAxisDeg: 6,
    },
    slits: { entranceWidthUm: 50, exitWidthUm: 50, heightMm: 4 },
    range: { startNm: 380, endNm: 780 },
    source: { minNm: 350, maxNm: 2500 },
  },
  uvExcitation: {
    grating: {
      grooveDensityPerMm: 2400,
      order: 1,
      blazeWavelengthNm: 250,
      ruledWidthMm: 50,
      ruledHeightMm: 50,
    },
    layout: {
      kind: 'czerny-turner',
      deviationAngleDeg: 26,
      collimatorFocalMm: 250,
      cameraFocalMm: 250,
      collimatorOffAxisDeg: 5,
      cameraOffAxisDeg: 6,
    },
    slits: { entranceWidthUm: 500, exitWidthUm: 500, heightMm: 10 },
    range: { startNm: 200, endNm: 450 },
    source: { minNm: 190, maxNm: 1100 },
  },
  nirSpectrograph: {
    grating: {
      grooveDensityPerMm: 300,
      order: 1,
      blazeWavelengthNm: 1200,
      ruledWidthMm: 40,
      ruledHeightMm: 40,
    },
    layout: {
      kind: 'czerny-turner',
      deviationAngleDeg: 28,
      collimatorFocalMm: 200,
      cameraFocalMm: 240,
      collimatorOffAxisDeg: 8,
      cameraOffAxisDeg: 10,
    },
    slits: { entranceWidthUm: 25, exitWidthUm: 25, heightMm: 2 },
    range: { startNm: 900, endNm: 1700 },
    source: { minNm: 400, maxNm: 2500 },
    detector: { pixelPitchUm: 25, pixelCount: 512 },
  },
} as const satisfies Record<string, Design>;
