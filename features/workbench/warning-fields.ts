import type { WarningCode } from '@/features/solver';

/** The field a designer most likely changes to clear each warning; tapping the warning focuses it. */
export const warningField: Record<WarningCode, string> = {
  unreachable: 'range.endNm',
  'near-grazing': 'layout.deviationAngleDeg',
  'below-diffraction-limit': 'slits.entranceWidthUm',
  undersampled: 'detector.pixelPitchUm',
  'order-overlap': 'source.minNm',
  'low-efficiency': 'grating.blazeWavelengthNm',
  'beyond-scalar-blaze': 'grating.grooveDensityPerMm',
  'few-grooves': 'grating.ruledWidthMm',
  'fast-optics': 'layout.collimatorFocalMm',
  'degenerate-mount': 'layout.deviationAngleDeg',
};
