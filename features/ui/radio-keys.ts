import type { KeyboardEvent } from 'react';

/**
 * Web (and default): an option listens for keys itself, and moving the choice moves the focus.
 * React Native's types have no `onKeyDown`; react-native-web's Pressable passes it to the element.
 */
export function radioKeyProps(onKey: (key: string) => boolean): { onKeyDown?: (event: KeyboardEvent) => void } {
  return {
    onKeyDown(event) {
      // Space would scroll the page and the arrows a scrolling row.
      if (onKey(event.key)) event.preventDefault();
    },
  };
}

export function focusOption(node: unknown): void {
  (node as { focus?: () => void } | null)?.focus?.();
}
