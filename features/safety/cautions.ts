import type { Design } from '../../shared/design';
import { formatNumber, formatQuantity, unitSuffix } from '../../shared/format';

/**
 * The safety cautions a design calls for: which hazards of the lamps and lasers used with a grating
 * monochromator apply to this design, each with one line saying why. A reminder for the people who
 * build and run the instrument, never a risk assessment: every caution ends with the same line
 * handing the decision to local codes and the site's safety officer.
 */

export type CautionId = 'deep-uv' | 'lamp-high-voltage' | 'mercury-breakage' | 'lasers';

export type Caution = {
  id: CautionId;
  title: string;
  /** What the hazard is and the usual care, in plain words. */
  text: string;
  /** Why it applies to this design: one line, naming the wavelengths that trigger it. */
  why: string;
  /** Always `cautionClosingLine`: printed last, after the text and the reason. */
  closing: typeof cautionClosingLine;
};

/** The last line of every caution, the same for all. */
export const cautionClosingLine =
  'Local codes and your site’s licensed laser or radiation safety officer decide what is required; this note does not.';

/** Below this the UV caution applies: UV-C and the short end of UV-B. */
export const deepUvBelowNm = 300;

/**
 * Strong Hg I lines used to calibrate monochromators, in nm (air): NIST Atomic Spectra Database /
 * Handbook of Basic Atomic Spectroscopic Data, "Strong lines of neutral mercury (Hg I)",
 * https://physics.nist.gov/PhysRefData/Handbook/Tables/mercurytable2.htm (253.652, 296.728,
 * 365.015, 404.656, 435.833, 546.074, 576.960, 579.066 nm there; rounded to 0.01 nm here).
 */
export const mercuryCalibrationLinesNm = [253.65, 296.73, 365.02, 404.66, 435.83, 546.07, 576.96, 579.07] as const;

const nm = (value: number) => formatQuantity(value, 'nm', 6);

/** "a, b and c". */
function listed(items: readonly string[]): string {
  if (items.length <= 1) return items.join('');
  return `${items.slice(0, -1).join(', ')} and ${items[items.length - 1]}`;
}

/** Where the design reaches below `deepUvBelowNm`, or null when it does not. */
function deepUvReason(design: Design): string | null {
  const reasons: string[] = [];
  if (design.range.startNm < deepUvBelowNm) reasons.push(`the range starts at ${nm(design.range.startNm)}`);
  if (design.source && design.source.minNm < deepUvBelowNm) reasons.push(`the source is set to emit from ${nm(design.source.minNm)}`);
  if (reasons.length === 0) return null;
  const sentence = listed(reasons);
  return `${sentence[0]!.toUpperCase()}${sentence.slice(1)}, below ${nm(deepUvBelowNm)}.`;
}

/** The calibration lines inside the design's range, shortest first. */
export function mercuryLinesInRange(design: Design): number[] {
  return mercuryCalibrationLinesNm.filter((line) => line >= design.range.startNm && line <= design.range.endNm);
}

/**
 * The cautions that apply to `design`, in a fixed order (UV, high voltage, mercury, lasers).
 * High voltage and lasers apply to every design: calibration lamps run from high-voltage supplies
 * and alignment uses lasers whatever the grating.
 */
export function cautionsFor(design: Design): Caution[] {
  const cautions: Caution[] = [];
  const uv = deepUvReason(design);
  if (uv) {
    cautions.push({
      id: 'deep-uv',
      title: 'Ultraviolet below 300 nm',
      text:
        'Mercury and deuterium lamps give off ultraviolet below 300 nm. It cannot be seen, and a short exposure can ' +
        'inflame the eyes and redden the skin, often only noticed hours later. Keep the lamp in its housing, look at it ' +
        'only through UV-blocking glasses or a window, and cover the skin near an open beam. Near-UV and blue light from ' +
        'intense lamps can harm the eye as well (IEC 62471, Photobiological safety of lamps and lamp systems), so do not ' +
        'stare into any bright source.',
      why: uv,
      closing: cautionClosingLine,
    });
  }
  cautions.push({
    id: 'lamp-high-voltage',
    title: 'High-voltage lamp supplies',
    text:
      'Arc and discharge lamps (mercury, deuterium, xenon, neon and other calibration lamps) start and run from supplies ' +
      'of hundreds to thousands of volts. Switch off and unplug the supply and let it stand before touching the lamp, ' +
      'its leads or its housing, and keep the housing closed while it runs. Lamps also run hot.',
    why: 'Applies to every design: wavelength calibration uses discharge lamps on such supplies.',
    closing: cautionClosingLine,
  });
  const lines = mercuryLinesInRange(design);
  if (lines.length > 0) {
    cautions.push({
      id: 'mercury-breakage',
      title: 'Mercury lamp breakage',
      text:
        'A mercury lamp holds liquid mercury, which turns to vapour when the lamp is hot or broken. Handle lamps cold and ' +
        'by the base, and if one breaks, air the room, do not vacuum the pieces, and follow the site’s mercury spill procedure.',
      why: `The range ${nm(design.range.startNm)} – ${nm(design.range.endNm)} includes the mercury calibration ${
        lines.length === 1 ? 'line' : 'lines'
      } at ${listed(lines.map((line) => formatNumber(line, 6)))}${unitSuffix('nm')}.`,
      closing: cautionClosingLine,
    });
  }
  cautions.push({
    id: 'lasers',
    title: 'Lasers',
    text:
      'Alignment lasers and laser sources can injure the eye, and a grating or mirror sends the beam, and its other ' +
      'orders, off in directions that are easy to forget. Keep beams low and below eye level, block stray orders, ' +
      'remove watches and rings, and wear eyewear rated for the laser’s wavelength and power.',
    why: 'Applies to every design: optics are usually aligned with a laser, and gratings tested with laser lines.',
    closing: cautionClosingLine,
  });
  return cautions;
}
