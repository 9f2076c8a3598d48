import { installGlobalStyle } from './global-style.web';

/**
 * Text is drawn as it was typed. Inter's contextual alternates (OpenType `calt`, on by default in
 * browsers) draw the x of "6x8" as a raised multiplication sign, so a share link's token, a part
 * number or "2x20 mm" in a note would show a character that is not there; someone copying the
 * link by eye would type a link that leads nowhere. The design sheet turns the same feature off
 * (server/sheets/writer.ts). Every element, not the body alone: fields do not inherit fonts, and
 * a class's `font` shorthand would put the default back.
 */
const shapingCss = `
* { font-feature-settings: "calt" 0 !important; }
`;

/** Turns the contextual alternates off once, on the web. */
export function installPlainShaping(): void {
  installGlobalStyle('blazebook-shaping', shapingCss);
}
