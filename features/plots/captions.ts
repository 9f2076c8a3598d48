/** Plot captions that depend on the evaluation. Pure: no React. */

import { SCALAR_LIMIT_LAMBDA_OVER_D, type Evaluation } from '../solver';
import { formatNumber } from '../../shared/format';

/** The efficiency plot's key for its shading, in the app and on the sheet. */
export const OVERLAP_SHADE_LABEL = 'Shaded: other orders land here and no filter blocks them';

export interface ScalarBlazeCaution {
  /** Shortest plotted wavelength with an efficiency value past the scalar region, nm. */
  fromNm: number;
  text: string;
}

/**
 * The caution under the efficiency plot when some plotted efficiency lies where λ/d exceeds the
 * scalar limit (the solver's `beyond-scalar-blaze` warning says the same in the list); null when
 * every value is inside it or there is no efficiency to show.
 */
export function scalarBlazeCaution(evaluation: Evaluation): ScalarBlazeCaution | null {
  const d = evaluation.design.grooveSpacingNm;
  let fromNm = Infinity;
  let firstNm = Infinity;
  for (const p of evaluation.points) {
    if (p.blazeEfficiency === null) continue;
    firstNm = Math.min(firstNm, p.wavelengthNm);
    if (p.wavelengthNm / d > SCALAR_LIMIT_LAMBDA_OVER_D) fromNm = Math.min(fromNm, p.wavelengthNm);
  }
  if (fromNm === Infinity) return null;
  // λ/d grows with λ, so every longer wavelength is past the limit too.
  const where = fromNm === firstNm ? 'across the whole plot' : `from ${formatNumber(fromNm)} nm on`;
  return {
    fromNm,
    text:
      `Caution: ${where} λ/d exceeds ${SCALAR_LIMIT_LAMBDA_OVER_D}: real efficiency depends on polarisation ` +
      'and groove profile and can differ from this curve by tens of per cent.',
  };
}
