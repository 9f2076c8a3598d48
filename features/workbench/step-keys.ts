import type { NativeSyntheticEvent, TextInputKeyPressEventData } from 'react-native';

type KeyEvent = NativeSyntheticEvent<TextInputKeyPressEventData & { shiftKey?: boolean }>;

/**
 * Web (and default): ArrowUp/ArrowDown in a numeric field step its value, ten steps with Shift, as
 * a browser's own number input does. `onStep` answers whether it moved; then the key's default
 * (the caret jumping to an end of the text) is prevented. react-native-web hands `onKeyPress` the
 * keydown event, Shift included.
 */
export function stepKeyProps(onStep: (direction: 1 | -1, times: number) => boolean): {
  onKeyPress?: (event: KeyEvent) => void;
} {
  return {
    onKeyPress(event) {
      const { key, shiftKey } = event.nativeEvent;
      const direction = key === 'ArrowUp' ? 1 : key === 'ArrowDown' ? -1 : 0;
      if (direction === 0) return;
      if (onStep(direction, shiftKey ? 10 : 1)) event.preventDefault();
    },
  };
}
