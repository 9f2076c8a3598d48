/**
 * The light budget's warnings: an input that over-fills the grating (light spilling past it is
 * stray light), one that under-fills it (fewer grooves lit, a lower diffraction limit on resolving
 * power), and measured curves that leave part of the range without data.
 */

import { CURVE_KIND_WORDS } from '../../shared/curves';
import { formatNumber } from '../../shared/format';
import { OVERFILL_BELOW, UNDERFILL_BELOW } from './input-fill';
import type { LightBudget } from './light-budget';
import type { Warning } from './results';
import type { ThroughputFactorId } from './throughput';

export const FACTOR_WORDS: Readonly<Record<ThroughputFactorId, string>> = {
  grating: 'grating efficiency',
  collimator: 'collimator reflectance',
  camera: 'camera reflectance',
  filter: 'order-sorting filter transmission',
  detector: CURVE_KIND_WORDS['detector-response'],
  input: 'input coupling',
};

const percent = (fraction: number) => `${formatNumber(fraction * 100, 3)} %`;

export function lightBudgetWarnings(light: LightBudget): Warning[] {
  const warnings: Warning[] = [];
  const fill = light.fill;
  if (fill && fill.state === 'overfilled' && fill.inputFNumber !== null) {
    warnings.push({
      code: 'input-overfills',
      message:
        `The input cone (f/${formatNumber(fill.inputFNumber, 3)}) is faster than the instrument accepts ` +
        `(about f/${formatNumber(light.acceptanceFNumber ?? 0, 3)}): only ${percent(fill.pupilFraction)} of it ` +
        `lands on the grating (below ${percent(OVERFILL_BELOW)}), and the rest scatters inside the instrument as ` +
        'stray light. Slow the input down (a lens or a fibre of lower NA), mask it, or use a larger grating.',
    });
  }
  if (fill && fill.state === 'underfilled' && fill.inputFNumber !== null) {
    warnings.push({
      code: 'input-underfills',
      message:
        `The input cone (f/${formatNumber(fill.inputFNumber, 3)}) lights only ${percent(fill.litWidthFraction)} of ` +
        `the grating width (below ${percent(UNDERFILL_BELOW)}): ${formatNumber(fill.litGrooves, 3)} grooves, so the ` +
        `diffraction limit on resolving power drops to ${formatNumber(fill.litResolvingPower, 3)}. Speed the input ` +
        'up to fill the grating, or accept the lower limit.',
    });
  }
  const gappy = light.factors.filter((f) => f.basis === 'measured' && f.gapsNm.length > 0);
  if (gappy.length > 0) {
    const first = gappy[0]!.gapsNm[0]!;
    const words = gappy.map((f) => {
      const spans = f.gapsNm.map((g) => (g.fromNm === g.toNm ? `${formatNumber(g.fromNm)} nm` : `${formatNumber(g.fromNm)}–${formatNumber(g.toNm)} nm`));
      return `${FACTOR_WORDS[f.id]} (${f.curveNames.join(', ')}) has no data at ${spans.join(', ')}`;
    });
    warnings.push({
      code: 'curve-gap',
      wavelengthNm: first.fromNm,
      message:
        `A measured curve does not cover the whole range: ${words.join('; ')}. The throughput is drawn only where ` +
        'every curve has data (nothing is extrapolated). Attach a curve that covers the range, or narrow the range.',
    });
  }
  return warnings;
}
