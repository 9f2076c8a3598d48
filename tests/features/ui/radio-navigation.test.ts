import { describe, expect, it } from 'vitest';
import { nextIndex, tabStopIndex } from '@/features/ui/radio-navigation';

// Expected moves follow the WAI-ARIA Authoring Practices radio group pattern.
describe('nextIndex', () => {
  it.each([
    { key: 'ArrowRight', index: 0, count: 3, expected: 1 },
    { key: 'ArrowDown', index: 1, count: 3, expected: 2 },
    { key: 'ArrowRight', index: 2, count: 3, expected: 0 },
    { key: 'ArrowDown', index: 2, count: 3, expected: 0 },
    { key: 'ArrowLeft', index: 2, count: 3, expected: 1 },
    { key: 'ArrowUp', index: 1, count: 3, expected: 0 },
    { key: 'ArrowLeft', index: 0, count: 3, expected: 2 },
    { key: 'ArrowUp', index: 0, count: 3, expected: 2 },
    { key: 'Home', index: 2, count: 3, expected: 0 },
    { key: 'End', index: 0, count: 3, expected: 2 },
    { key: ' ', index: 1, count: 3, expected: 1 },
    { key: 'Enter', index: 1, count: 3, expected: 1 },
    { key: 'ArrowRight', index: 0, count: 1, expected: 0 },
  ] satisfies { key: string; index: number; count: number; expected: number }[])(
    '$key from option $index of $count goes to option $expected',
    ({ key, index, count, expected }) => {
      expect(nextIndex(key, index, count)).toBe(expected);
    },
  );

  it('ignores other keys, so typing and Tab pass through', () => {
    expect(nextIndex('a', 0, 3)).toBeNull();
    expect(nextIndex('Tab', 0, 3)).toBeNull();
    expect(nextIndex('Escape', 0, 3)).toBeNull();
  });

  it('does nothing in an empty group', () => {
    expect(nextIndex('ArrowRight', 0, 0)).toBeNull();
    expect(nextIndex('Home', 0, 0)).toBeNull();
  });

  it('starts from the first option when none is focused in range', () => {
    expect(nextIndex('ArrowRight', -1, 3)).toBe(1);
    expect(nextIndex(' ', -1, 3)).toBe(0);
  });
});

describe('tabStopIndex', () => {
  it('is the checked option', () => {
    expect(tabStopIndex(2, 3)).toBe(2);
  });

  it('is the first option when nothing is checked', () => {
    expect(tabStopIndex(-1, 3)).toBe(0);
  });
});
