/**
 * One entry for the simpler wavelength selectors' calculators (the selectors script,
 * `POST /api/selectors` and the selectors screens): the parsed input's `kind` picks the calculator.
 */

import type { SelectorAnswer, SelectorInput } from '../../shared/selectors';
import { absorptionStack } from './absorption';
import { designInterferenceFilter } from './fabry-perot';
import { prismMonochromator } from './prism';

/** The answer for a parsed selector input (validate with `selectorInputSchema` first). */
export function runSelector(input: SelectorInput): SelectorAnswer {
  switch (input.kind) {
    case 'interference-filter':
      return designInterferenceFilter(input);
    case 'absorption-stack':
      return absorptionStack(input);
    case 'prism':
      return prismMonochromator(input);
  }
}
