/**
 * The stretch of a line shape worth drawing: from the first to the last sample where either curve
 * rises above `floor` of its peak, widened by `padShare` of that stretch on each side (clamped to
 * the samples). The engine samples well past the line's wings; drawn whole, the line is a spike.
 */
export function lineShapeWindow(
  offsets: ArrayLike<number>,
  curves: readonly ArrayLike<number>[],
  floor = 0.005,
  padShare = 0.3,
): { from: number; to: number } {
  let first = -1;
  let last = -1;
  for (let i = 0; i < offsets.length; i += 1) {
    if (curves.some((c) => (c[i] as number) > floor)) {
      if (first < 0) first = i;
      last = i;
    }
  }
  if (first < 0) return { from: 0, to: offsets.length - 1 };
  const pad = Math.ceil((last - first + 1) * padShare);
  return { from: Math.max(0, first - pad), to: Math.min(offsets.length - 1, last + pad) };
}
