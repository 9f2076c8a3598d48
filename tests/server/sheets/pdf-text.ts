import { getDocument } from 'pdfjs-dist/legacy/build/pdf.mjs';
import type { TextItem } from 'pdfjs-dist/types/src/display/api';

/**
 * A PDF's text as a reader sees it, through pdfjs-dist (Mozilla's PDF reader, a library other than
 * the pdfkit that wrote the file): one string per page, its lines top to bottom, the pieces of a
 * line left to right with a space where the page leaves a gap (so table cells stay apart), and
 * each page's size in points.
 */
export type PdfText = {
  pages: string[];
  text: string;
  pageSizes: { width: number; height: number }[];
  /** Each page's pieces of text where they stand, for checks that need a table's columns. */
  pieces: TextPiece[][];
};

/**
 * One run of text as pdfjs reports it: `x` its left end and `right` its right end, `baseline` the
 * height of its baseline above the page's foot (PDF's y, growing upwards), `size` its font size,
 * all in points. Blank runs (the gaps pdfjs reports as spaces) are left out.
 */
export type TextPiece = { str: string; x: number; right: number; baseline: number; size: number };

/** Pieces whose baselines lie closer than this (in points) are one line. */
const SAME_LINE_PT = 2;

export async function pdfText(bytes: Uint8Array): Promise<PdfText> {
  // pdfjs takes ownership of (and detaches) the buffer it is given: hand it a copy.
  const task = getDocument({ data: new Uint8Array(bytes), useSystemFonts: false, isEvalSupported: false, verbosity: 0 });
  const doc = await task.promise;
  try {
    const pages: string[] = [];
    const pageSizes: { width: number; height: number }[] = [];
    const pieces: TextPiece[][] = [];
    for (let n = 1; n <= doc.numPages; n += 1) {
      const page = await doc.getPage(n);
      const { width, height } = page.getViewport({ scale: 1 });
      pageSizes.push({ width, height });
      // No normalisation: the text as printed (a narrow no-break space stays U+202F, not a space).
      const content = await page.getTextContent({ disableNormalization: true });
      const items = content.items.filter((item): item is TextItem => 'str' in item && item.str !== '');
      const placed = items.map(pieceOf);
      pieces.push(placed.filter((piece) => piece.str.trim() !== ''));
      pages.push(linesOf(placed).join('\n'));
    }
    return { pages, text: pages.join('\n'), pageSizes, pieces };
  } finally {
    await task.destroy();
  }
}

function pieceOf(item: TextItem): TextPiece {
  const [, , c, d, x, y] = item.transform as number[];
  return { str: item.str, x: x!, right: x! + item.width, baseline: y!, size: Math.hypot(c!, d!) };
}

/** Groups text pieces into lines by baseline, top to bottom, and joins each line left to right. */
function linesOf(placed: readonly TextPiece[]): string[] {
  const sorted = [...placed].sort((a, b) => b.baseline - a.baseline || a.x - b.x);
  const lines: TextPiece[][] = [];
  for (const piece of sorted) {
    const line = lines.at(-1);
    if (line && Math.abs(line[0]!.baseline - piece.baseline) < SAME_LINE_PT) line.push(piece);
    else lines.push([piece]);
  }
  return lines.map((line) => {
    line.sort((a, b) => a.x - b.x);
    let text = '';
    let end = -Infinity;
    for (const piece of line) {
      const touching = piece.x - end < Math.max(piece.size, 1) * 0.15;
      if (text !== '' && !touching && !text.endsWith(' ') && !piece.str.startsWith(' ')) text += ' ';
      text += piece.str;
      end = piece.right;
    }
    return text.trimEnd();
  });
}

const superscriptDigits: Record<string, string> = { '⁻': '-', '⁰': '0', '¹': '1', '²': '2', '³': '3', '⁴': '4', '⁵': '5', '⁶': '6', '⁷': '7', '⁸': '8', '⁹': '9' };

/**
 * The number a piece of text starts with, as shared/format.ts writes numbers for people — a true
 * minus (U+2212), digits grouped by a narrow no-break space (U+202F), "1.23×10⁻⁴" outside plain
 * range — with half a unit in its last printed digit: the most the printed figure may differ
 * from the value it was rounded from. An integer's trailing zeros may be rounding ("2200" from
 * 2204 at three figures), so they do not count as printed digits. Null when it starts with none.
 */
export function printedNumber(text: string): { value: number; halfUnit: number; printed: string } | null {
  const match = /^\s*([\u2212-]?)(\d{1,3}(?:[\u202F\u00A0]\d{3})+|\d+)(?:\.(\d+))?(?:×10([⁻⁰¹²³⁴⁵⁶⁷⁸⁹]+))?/.exec(text);
  if (!match) return null;
  const [printed, sign, whole, fraction = '', exponentText] = match;
  const digits = whole!.replace(/[\u202F\u00A0]/g, '');
  const exponent = exponentText ? Number([...exponentText].map((c) => superscriptDigits[c]).join('')) : 0;
  const mantissa = Number(`${sign ? '-' : ''}${digits}.${fraction || '0'}`);
  const lastDigit = fraction ? -fraction.length : /^0+$/.test(digits) ? 0 : (/0+$/.exec(digits)?.[0].length ?? 0);
  return { value: mantissa * 10 ** exponent, halfUnit: 0.5 * 10 ** (lastDigit + exponent), printed: printed!.trim() };
}
