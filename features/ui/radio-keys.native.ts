/** Native: screen readers move between options and choose them by themselves; no key handling. */
export function radioKeyProps(_onKey: (key: string) => boolean): { onKeyDown?: undefined } {
  return {};
}

export function focusOption(_node: unknown): void {}
