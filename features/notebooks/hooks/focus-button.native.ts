/**
 * Native: focus follows the screen reader, which reads the status line as it appears
 * (`accessibilityLiveRegion`), so nothing is moved here.
 */
export function focusButton(_container: unknown, _name: string): void {}
