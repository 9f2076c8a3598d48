/**
 * The mercury-lamp caution the calibration card shows while Hg lines are on screen. The words
 * live once, in the safety module's `cautionsFor`; this only picks the ones a mercury lamp calls
 * for, whatever the design's range.
 */

import { cautionClosingLine, cautionsFor, type CautionId } from '../safety/cautions';
import type { Design } from '../../shared/design';

export interface LampCaution {
  id: CautionId;
  title: string;
  text: string;
}

const MERCURY_CAUTIONS: readonly CautionId[] = ['deep-uv', 'lamp-high-voltage', 'mercury-breakage'];

/**
 * A mercury lamp shines its 253.65 nm line (UV-C) and holds mercury whether or not the design's
 * range reaches there, so the safety module is asked about a range that starts in the UV and holds
 * that line; its titles and texts come back unchanged, its design-specific reasons are dropped.
 */
export function mercuryLampCautions(design: Design): LampCaution[] {
  const asked: Design = { ...design, range: { startNm: 250, endNm: Math.max(600, design.range.endNm) } };
  return cautionsFor(asked)
    .filter((c) => MERCURY_CAUTIONS.includes(c.id))
    .map(({ id, title, text }) => ({ id, title, text }));
}

/**
 * Not in the safety module: a lamp whose envelope passes 185 nm makes ozone (from memory; the
 * reason "ozone-free" lamps exist).
 */
export const OZONE_NOTE =
  'A mercury lamp whose envelope passes 185 nm also makes ozone: use an ozone-free lamp or run it where the air is changed.';

export { cautionClosingLine };
