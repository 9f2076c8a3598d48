/**
 * Moves keyboard focus to the button named `name` inside `container` (a View's ref, which is its
 * DOM node on the web). Used when the control that had focus goes away — an archived row leaves
 * the list, a confirmation replaces its trigger — so focus does not fall back to the page.
 */
export function focusButton(container: unknown, name: string): void {
  const node = container as HTMLElement | null;
  const buttons = node?.querySelectorAll?.<HTMLElement>('[role="button"]') ?? [];
  for (const button of buttons) {
    if (button.getAttribute('aria-label') === name) {
      button.focus();
      return;
    }
  }
}
