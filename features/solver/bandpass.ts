/**
 * Slit-limited instrument function. The exit slit scans the image of the entrance slit, so the
 * instrument function is the convolution of two rectangles: a trapezoid whose base is the sum of
 * the widths and whose top is their difference (a triangle when they match), with FWHM equal to the
 * wider of the two. Source: Palmer & Loewen, Diffraction Grating Handbook, ch. 9 (bandpass =
 * reciprocal linear dispersion × slit width).
 */

export type SlitFunctionShape = 'triangle' | 'trapezoid';

/** The slit function in wavelength units at the exit plane. */
export interface SlitFunction {
  shape: SlitFunctionShape;
  /** Full width at the base (zero transmission), nm. */
  baseNm: number;
  /** Width of the flat top, nm (0 for a triangle). */
  topNm: number;
}

/** Below this relative mismatch the two widths count as equal and the function as a triangle. */
const MATCHED_WIDTHS = 1e-9;

/** Width of the entrance-slit image at the exit plane, mm. */
export function entranceImageWidthMm(entranceWidthMm: number, magnification: number): number {
  return entranceWidthMm * magnification;
}

/**
 * FWHM of the slit function: `RLD × max(w_image, w_exit)`, in nm.
 * Source: Palmer & Loewen, Diffraction Grating Handbook, ch. 9.
 */
export function bandpassNm(
  reciprocalDispersionNmPerMm: number,
  entranceImageMm: number,
  exitWidthMm: number,
): number {
  return reciprocalDispersionNmPerMm * Math.max(entranceImageMm, exitWidthMm);
}

/** Base and top of the trapezoid `rect(w_image) ⊗ rect(w_exit)`, in nm. */
export function slitFunction(
  reciprocalDispersionNmPerMm: number,
  entranceImageMm: number,
  exitWidthMm: number,
): SlitFunction {
  const baseNm = reciprocalDispersionNmPerMm * (entranceImageMm + exitWidthMm);
  const mismatchMm = Math.abs(entranceImageMm - exitWidthMm);
  const matched = mismatchMm <= MATCHED_WIDTHS * (entranceImageMm + exitWidthMm);
  return matched
    ? { shape: 'triangle', baseNm, topNm: 0 }
    : { shape: 'trapezoid', baseNm, topNm: reciprocalDispersionNmPerMm * mismatchMm };
}
