import { getDocument } from 'pdfjs-dist/legacy/build/pdf.mjs';
import type { TextItem } from 'pdfjs-dist/types/src/display/api';

/**
 * A PDF's text as a reader sees it, through pdfjs-dist (Mozilla's PDF reader, a library other than
 * the pdfkit that wrote the file): one string per page, its lines top to bottom, the pieces of a
 * line left to right with a space where the page leaves a gap (so table cells stay apart), and
 * each page's size in points.
 */
export type PdfText = { pages: string[]; text: string; pageSizes: { width: number; height: number }[] };

/** Pieces whose baselines lie closer than this (in points) are one line. */
const SAME_LINE_PT = 2;

export async function pdfText(bytes: Uint8Array): Promise<PdfText> {
  // pdfjs takes ownership of (and detaches) the buffer it is given: hand it a copy.
  const task = getDocument({ data: new Uint8Array(bytes), useSystemFonts: false, isEvalSupported: false, verbosity: 0 });
  const doc = await task.promise;
  try {
    const pages: string[] = [];
    const pageSizes: { width: number; height: number }[] = [];
    for (let n = 1; n <= doc.numPages; n += 1) {
      const page = await doc.getPage(n);
      const { width, height } = page.getViewport({ scale: 1 });
      pageSizes.push({ width, height });
      const content = await page.getTextContent();
      const items = content.items.filter((item): item is TextItem => 'str' in item && item.str !== '');
      pages.push(linesOf(items).join('\n'));
    }
    return { pages, text: pages.join('\n'), pageSizes };
  } finally {
    await task.destroy();
  }
}

/** Groups text pieces into lines by baseline (PDF y grows upwards) and joins each line. */
function linesOf(items: readonly TextItem[]): string[] {
  const pieces = items
    .map((item) => ({ str: item.str, x: item.transform[4] as number, y: item.transform[5] as number, width: item.width, size: Math.hypot(item.transform[2] as number, item.transform[3] as number) }))
    .sort((a, b) => b.y - a.y || a.x - b.x);
  const lines: (typeof pieces)[] = [];
  for (const piece of pieces) {
    const line = lines.at(-1);
    if (line && Math.abs(line[0]!.y - piece.y) < SAME_LINE_PT) line.push(piece);
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
      end = piece.x + piece.width;
    }
    return text;
  });
}
