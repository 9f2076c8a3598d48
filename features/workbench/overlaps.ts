import type { Overlap, WavelengthPoint } from '@/features/solver';
import { formatInteger } from '@/shared/format';

/**
 * The overlapping orders at one wavelength, ending in "+N more" when the solver cut the list
 * (at `MAX_LISTED_OVERLAPS`), so a cut list never reads as complete. Empty when there are none.
 */
export function overlapsText(
  p: Pick<WavelengthPoint, 'overlaps' | 'overlapCount'>,
  item: (overlap: Overlap) => string,
  separator: string,
): string {
  const parts = p.overlaps.map(item);
  const hidden = p.overlapCount - p.overlaps.length;
  if (hidden > 0) parts.push(`+${formatInteger(hidden)} more`);
  return parts.join(separator);
}
