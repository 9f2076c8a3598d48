import type { KeyboardEvent } from 'react';

/**
 * Web: Space turns a switch, as it does a checkbox. react-native-web presses a focused Pressable on
 * Enter by itself, but on Space only for buttons; its Pressable passes `onKeyDown` to the element.
 */
export function switchKeyProps(toggle: () => void): { onKeyDown?: (event: KeyboardEvent) => void } {
  return {
    onKeyDown(event) {
      if (event.key !== ' ' && event.key !== 'Spacebar') return;
      // Space would scroll the page.
      event.preventDefault();
      toggle();
    },
  };
}
