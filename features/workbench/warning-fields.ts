import type { RequirementCheck } from '@/features/requirements';
import type { WarningCode } from '@/features/solver';

/** The field a designer most likely changes to clear each warning; tapping the warning focuses it. */
export const warningField: Record<WarningCode, string> = {
  unreachable: 'range.endNm',
  'near-grazing': 'layout.deviationAngleDeg',
  'below-diffraction-limit': 'slits.entranceWidthUm',
  undersampled: 'detector.pixelPitchUm',
  'order-overlap': 'source.minNm',
  // The first filter's switch-in point: the usual fix for a filter cutting into the signal.
  'filter-attenuates': 'filters.0.inFromNm',
  'low-efficiency': 'grating.blazeWavelengthNm',
  'beyond-scalar-blaze': 'grating.grooveDensityPerMm',
  'few-grooves': 'grating.ruledWidthMm',
  'fast-optics': 'layout.collimatorFocalMm',
  'degenerate-mount': 'layout.deviationAngleDeg',
  'input-overfills': 'input.kind',
  'input-underfills': 'input.kind',
  'curve-gap': 'range.startNm',
};

/**
 * The field a failing requirement's "fix" link opens: the design field the check names (the exit
 * slit for a bandpass), else the requirement's own field so its limit can be eased.
 */
export function requirementFixField(check: Pick<RequirementCheck, 'id' | 'fixPath'>): string {
  if (check.fixPath) return check.fixPath === 'requirements.maxFootprintMm' ? `${check.fixPath}.widthMm` : check.fixPath;
  return check.id === 'maxFootprintMm' ? 'requirements.maxFootprintMm.widthMm' : `requirements.${check.id}`;
}
