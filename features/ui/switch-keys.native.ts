/** Native: screen readers turn a switch by themselves; no key handling. */
export function switchKeyProps(_toggle: () => void): { onKeyDown?: undefined } {
  return {};
}
