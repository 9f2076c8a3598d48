import type { Design } from '@/shared/design';

/**
 * Starting points for a new design. Invented demo instruments, not catalogue products: round
 * numbers a designer would sketch first and then refine.
 */
export type Preset = { id: string; title: string; summary: string; design: Design };

export const presets: readonly Preset[] = [
  {
    id: 'visible-scanner',
    title: 'Compact visible scanner',
    summary: '0.15 m Czerny–Turner, 1200/mm, 380–780 nm with a tungsten lamp',
    design: {
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
  },
  {
    id: 'uv-excitation',
    title: 'UV excitation monochromator',
    summary: '0.25 m Czerny–Turner, 2400/mm, 200–450 nm from a xenon arc, wide slits for throughput',
    design: {
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
  },
  {
    id: 'nir-spectrograph',
    title: 'Near-IR line-detector spectrograph',
    summary: 'Czerny–Turner with a longer camera, 300/mm, 900–1700 nm on a 512-pixel array',
    design: {
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
  },
];

export const defaultPreset = presets[0] as Preset;
