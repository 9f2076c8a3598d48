import { calibrationLineList, type CalibrationLine } from '../solver/calibration-lines';
import type { Design } from '../../shared/design';
import type { LampElement } from '../../shared/lamp-lines';

/**
 * The lamps shown until the designer picks others: mercury and neon. Between them they cover the
 * usual 250–900 nm with well-spaced lines (mercury's strong blue–green lines, neon's dense red and
 * near infrared), the pair most benches carry as pen-ray lamps (common practice). All five lamps
 * at once list over a hundred lines and crowd the detector strip.
 */
export const DEFAULT_LAMP_ELEMENTS: readonly LampElement[] = ['Hg', 'Ne'];

/**
 * The built-in lines of `elements` and every line of the design's own uploaded line lists
 * (`curves` of kind `line-list`), each user line labelled with its curve's name. Each list is
 * converted to air by its own stated medium, which is why the lists are read one by one.
 */
export function designCalibrationLines(design: Design, elements: readonly LampElement[]): CalibrationLine[] {
  const lines = calibrationLineList(elements);
  for (const curve of design.curves ?? []) {
    if (curve.kind !== 'line-list') continue;
    const user = curve.wavelengthsNm.map((wavelengthNm) => ({ wavelengthNm, label: curve.name }));
    lines.push(...calibrationLineList([], user, curve.medium));
  }
  return lines.sort((a, b) => a.wavelengthNm - b.wavelengthNm);
}

/** The names of the design's uploaded line lists, for the card to say which are included. */
export function designLineListNames(design: Design): string[] {
  return (design.curves ?? []).filter((curve) => curve.kind === 'line-list').map((curve) => curve.name);
}
