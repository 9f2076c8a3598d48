/**
 * Adds one `<style>` element with this id to the document, once: for the few rules React Native
 * Web styles cannot express (`:focus-visible`, `@media print`).
 */
export function installGlobalStyle(id: string, css: string): void {
  if (typeof document === 'undefined' || document.getElementById(id)) return;
  const style = document.createElement('style');
  style.id = id;
  style.textContent = css;
  document.head.appendChild(style);
}
