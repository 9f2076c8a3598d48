/** Native apps do not print screens; the web build adds its print styles here. */
export function installPrintStyles(): void {}
