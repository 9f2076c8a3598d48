/** The short ultraviolet note a calculator shows when its range reaches below 300 nm. Pure: no React. */

// The pure file, not the feature's index: the index also exports a React card, and this module stays pure.
import { cautionClosingLine, deepUvBelowNm } from '@/features/safety/cautions';
import { formatQuantity } from '@/shared/format';

export interface UvNote {
  title: string;
  text: string;
  closing: string;
}

/** Null when the range starts at or above the workbench's deep-UV threshold (the same caution the design sheet prints). */
export function uvNote(startNm: number): UvNote | null {
  if (!(startNm < deepUvBelowNm)) return null;
  return {
    title: `Ultraviolet below ${formatQuantity(deepUvBelowNm, 'nm')}`,
    text:
      `The range starts at ${formatQuantity(startNm, 'nm')}. Lamps that reach it (mercury, deuterium) give off ultraviolet ` +
      'that cannot be seen and harms eyes and skin: keep them housed and look only through UV-blocking glass.',
    closing: cautionClosingLine,
  };
}
