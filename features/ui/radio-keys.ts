import type { KeyboardEvent } from 'react';

/**
 * Web (and default): an option listens for keys itself. `onKey` chooses and answers the index
 * of the option it moved to (null to let the key through); the focus follows the choice.
 * React Native's types have no `onKeyDown`; react-native-web's Pressable passes it to the element.
 */
export function radioKeyProps(onKey: (key: string) => number | null): { onKeyDown?: (event: KeyboardEvent) => void } {
  return {
    onKeyDown(event) {
      const target = onKey(event.key);
      if (target === null) return;
      // Space would scroll the page, and the arrows a scrolling row.
      event.preventDefault();
      const group = (event.currentTarget as HTMLElement).closest('[role="radiogroup"]');
      group?.querySelectorAll<HTMLElement>('[role="radio"]')[target]?.focus();
    },
  };
}
