import { installGlobalStyle } from './global-style.web';
import { colors } from './theme';

/**
 * One clear focus ring for every control reached from the keyboard — buttons, links, radios and
 * fields — instead of the browser's thin default, which all but vanishes on the primary buttons
 * and the copper chips (WCAG 2.2, 2.4.7 Focus Visible and 2.4.13 Focus Appearance: at least 2 px
 * and 3:1 against what is next to it; #2F7FA8 on the paper is 3.9:1, computed with the WCAG
 * relative-luminance formula). `:focus-visible` keeps it off controls clicked with a pointer;
 * fields always show it while typing, as browsers do.
 */
const focusCss = `
:focus-visible {
  outline: 2px solid ${colors.focus} !important;
  outline-offset: 2px;
}
input:focus-visible, textarea:focus-visible { outline-offset: 1px; }
`;

/** Adds the focus ring to the document once, on the web. */
export function installFocusRing(): void {
  installGlobalStyle('blazebook-focus', focusCss);
}
