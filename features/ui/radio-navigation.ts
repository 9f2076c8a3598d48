/**
 * Which option a key moves a radio group to (WAI-ARIA Authoring Practices, radio group pattern):
 * the arrows step and wrap (Left/Up back, Right/Down on), Home and End jump to the ends, Space
 * and Enter choose the focused option itself. Null for any other key, or for an empty group.
 */
export function nextIndex(key: string, index: number, count: number): number | null {
  if (count < 1) return null;
  const from = Math.min(Math.max(index, 0), count - 1);
  switch (key) {
    case 'ArrowRight':
    case 'ArrowDown':
      return (from + 1) % count;
    case 'ArrowLeft':
    case 'ArrowUp':
      return (from - 1 + count) % count;
    case 'Home':
      return 0;
    case 'End':
      return count - 1;
    case ' ':
    case 'Spacebar':
    case 'Enter':
      return from;
    default:
      return null;
  }
}

/** The one option a Tab key lands on: the checked one, else the first (roving tabindex). */
export function tabStopIndex(checkedIndex: number, count: number): number {
  return checkedIndex >= 0 && checkedIndex < count ? checkedIndex : 0;
}
