import { installGlobalStyle } from './global-style.web';
/**
 * What a printed screen keeps: the content, sketch and plots included, without the controls.
 *
 * On screen every page is a window-high column of scrolling panes, so a printer gets only what
 * fits the first window. On paper the panes give up their heights and scrolling and the content
 * flows over as many pages as it needs. Controls are marked `data-print="hide"` (see
 * `printHidden`); text fields keep their value without their box (the input and the box drawn
 * around it).
 */
const printCss = `
@media print {
  html, body, #root { height: auto !important; min-height: 0 !important; overflow: visible !important; }
  #root * { overflow: visible !important; max-height: none !important; }
  [data-print="hide"], input[type="file"] { display: none !important; }
  input, textarea, select,
  #root div:has(> input), #root div:has(> textarea) {
    border-color: transparent !important;
    background: transparent !important;
    box-shadow: none !important;
    outline: none !important;
  }
  svg, canvas, img, [role="img"] { break-inside: avoid; }
  * { -webkit-print-color-adjust: exact; print-color-adjust: exact; }
}
`;

/** Adds the print styles to the document once, on the web. */
export function installPrintStyles(): void {
  installGlobalStyle('blazebook-print', printCss);
}
