/** Native platforms draw their own focus; the web build adds its focus ring here. */
export function installFocusRing(): void {}
