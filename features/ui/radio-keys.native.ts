/** Native: screen readers move between options and choose them by themselves; no key handling. */
export function radioKeyProps(_onKey: (key: string) => number | null): { onKeyDown?: undefined } {
  return {};
}
