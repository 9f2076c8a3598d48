import { parseMarkdown, type Block, type Inline } from '../../features/notebooks/markdown';
import { sheetColors, textSize, type SheetFont, type SheetWriter } from './writer';

/**
 * Version notes and remarks on the design sheet: the app's own Markdown reader
 * (features/notebooks/markdown.ts, linear, HTML read as its characters) drawn with pdfkit text in
 * the sheet's fonts, as the app's MarkdownView draws it with React Native `Text`:
 * - strong is Inter semibold; Inter ships no italic, so emphasis is set in the muted ink instead
 *   of a slant the font does not have (a synthetic oblique would misdraw the glyphs);
 * - inline code and code blocks are IBM Plex Mono, blocks on a shaded band;
 * - a link is its text followed by its address in brackets, since paper cannot be clicked (only
 *   http:, https: and mailto: addresses are links, as in the app; the reader already writes any
 *   other address out as text);
 * - a mention is the person's name, without the `@`.
 * Text breaks across pages where pdfkit's line wrapper takes it, and a word wider than the column
 * is cut to fit (pdfkit does this), so nothing runs past the margins.
 */

export type MarkdownPdfOptions = {
  /** Left edge; the content column's by default. */
  x?: number;
  /** Column width; from `x` to the right margin by default. */
  width?: number;
  size?: number;
  /** Display names drawn as mentions (a remark's mentioned people). */
  mentions?: readonly string[];
  /** Printed (muted) when the source holds nothing to draw. */
  emptyText?: string;
};

type Run = { text: string; font: SheetFont; color: string };
type Style = { strong: boolean; em: boolean };

const lineGap = 1.5;

/** The spans as runs of one font and colour each. */
function toRuns(spans: readonly Inline[], style: Style = { strong: false, em: false }, out: Run[] = []): Run[] {
  const font: SheetFont = style.strong ? 'semibold' : 'regular';
  const color = style.em ? sheetColors.muted : sheetColors.ink;
  for (const span of spans) {
    switch (span.kind) {
      case 'text':
        out.push({ text: span.text, font, color });
        break;
      case 'code':
        out.push({ text: span.text, font: 'mono', color: sheetColors.ink });
        break;
      case 'mention':
        out.push({ text: span.name, font, color });
        break;
      case 'strong':
        toRuns(span.children, { ...style, strong: true }, out);
        break;
      case 'em':
        toRuns(span.children, { ...style, em: true }, out);
        break;
      case 'link': {
        const before = out.length;
        toRuns(span.children, style, out);
        const shown = out
          .slice(before)
          .map((run) => run.text)
          .join('');
        // An autolink (or a bare address) already shows its address.
        if (!sameAddress(shown, span.href)) out.push({ text: ` (${span.href})`, font: 'regular', color: sheetColors.primary });
        break;
      }
    }
  }
  return out;
}

function sameAddress(shown: string, href: string): boolean {
  const trimmed = shown.trim();
  return trimmed === href || `${trimmed}/` === href || `mailto:${trimmed}` === href;
}

const isMono = (font: SheetFont) => font === 'mono' || font === 'monoMedium';

/**
 * Mono runs made safe to draw: any character Plex Mono lacks (Greek letters, for one) is set in
 * Inter instead of an empty box, and white space inside code is set in Inter too (an invisible
 * character either way; this began as a way round a font-reading fault the writer now prevents).
 */
function drawable(writer: SheetWriter, runs: readonly Run[]): Run[] {
  const out: Run[] = [];
  const push = (text: string, font: SheetFont, color: string) => {
    const last = out[out.length - 1];
    if (last && last.font === font && last.color === color) last.text += text;
    else out.push({ text, font, color });
  };
  for (const run of runs) {
    if (!isMono(run.font)) {
      if (run.text !== '') push(run.text, run.font, run.color);
      continue;
    }
    for (const char of run.text) {
      if (/\s/u.test(char)) push(' ', 'regular', run.color);
      else push(char, writer.hasGlyph(run.font, char) ? run.font : 'regular', run.color);
    }
  }
  return out;
}

/** Draws runs as one flowing paragraph from (x, writer.y), across pages as needed. */
function drawRuns(writer: SheetWriter, runs: readonly Run[], x: number, width: number, size: number): void {
  const shown = drawable(writer, runs);
  if (shown.length === 0) shown.push({ text: '\u00A0', font: 'regular', color: sheetColors.ink });
  writer.ensureSpace(size * 2.5);
  const doc = writer.doc;
  shown.forEach((run, index) => {
    writer.use(run.font, size);
    doc.fillColor(run.color);
    const options = { width, lineGap, continued: index < shown.length - 1 };
    if (index === 0) doc.text(run.text, x, writer.y, options);
    else doc.text(run.text, options);
  });
  doc.fillColor(sheetColors.ink);
}

/**
 * A code block on a shaded band, laid out on the fixed pitch of the mono face: each line is cut
 * into rows of as many characters as fit (code is not reflowed at spaces), and only the runs of
 * non-space characters are drawn, each at its column (see `drawable` for why spaces are not).
 */
function drawCode(writer: SheetWriter, text: string, x: number, width: number, size: number): void {
  const pad = 4;
  const codeSize = size - 0.5;
  const pitch = writer.use('mono', codeSize).doc.widthOfString('0');
  const columns = Math.max(1, Math.floor((width - 2 * pad) / pitch));
  const rowHeight = writer.doc.currentLineHeight(true) + lineGap;
  const rows: string[] = [];
  for (const line of text.replace(/\t/g, '    ').split('\n')) {
    const chars = [...line];
    if (chars.length === 0) rows.push('');
    for (let at = 0; at < chars.length; at += columns) rows.push(chars.slice(at, at + columns).join(''));
  }
  writer.gap(1);
  rows.forEach((row, index) => {
    const top = index === 0 ? pad : 0;
    const bottom = index === rows.length - 1 ? pad : 0;
    writer.ensureSpace(rowHeight + top + bottom);
    const y = writer.y;
    writer.doc.rect(x, y, width, rowHeight + top + bottom).fill(sheetColors.shade);
    const chars = [...row];
    let column = 0;
    while (column < chars.length) {
      if (/\s/u.test(chars[column]!)) {
        column += 1;
        continue;
      }
      const font: SheetFont = writer.hasGlyph('mono', chars[column]!) ? 'mono' : 'regular';
      let end = column + 1;
      // A character the mono face lacks is drawn alone, in Inter, in its own column.
      while (font === 'mono' && end < chars.length && !/\s/u.test(chars[end]!) && writer.hasGlyph('mono', chars[end]!)) end += 1;
      writer
        .use(font, codeSize)
        .doc.fillColor(sheetColors.ink)
        .text(chars.slice(column, end).join(''), x + pad + column * pitch, y + top, { lineBreak: false });
      column = end;
    }
    writer.y = y + top + rowHeight + bottom;
  });
}

function drawBlock(writer: SheetWriter, block: Block, x: number, width: number, size: number): void {
  switch (block.kind) {
    case 'heading': {
      writer.gap(block.level === 1 ? 4 : 2);
      const headingSize = block.level === 1 ? size + 2 : size + 0.5;
      // Kept with at least two lines of what follows.
      writer.ensureSpace(headingSize * 2 + size * 3);
      const runs = toRuns(block.children).map((run) => ({ ...run, font: run.font === 'mono' ? run.font : ('semibold' as const) }));
      drawRuns(writer, runs, x, width, headingSize);
      writer.gap(2);
      break;
    }
    case 'paragraph':
      drawRuns(writer, toRuns(block.children), x, width, size);
      writer.gap(4);
      break;
    case 'list': {
      const markerWidth = block.ordered ? Math.max(14, writer.use('regular', size).doc.widthOfString(`${block.start + block.items.length - 1}.`) + 4) : 12;
      block.items.forEach((item, index) => {
        writer.ensureSpace(size * 2.5);
        const y = writer.y;
        const marker = block.ordered ? `${block.start + index}.` : '•';
        writer.use('regular', size).doc.fillColor(sheetColors.muted).text(marker, x, y, { width: markerWidth - 4, align: 'right', lineBreak: false });
        writer.y = y;
        drawRuns(writer, toRuns(item), x + markerWidth, width - markerWidth, size);
        writer.gap(1.5);
      });
      writer.gap(2.5);
      break;
    }
    case 'code':
      drawCode(writer, block.text, x, width, size);
      writer.gap(4);
      break;
    case 'rule':
      writer.ensureSpace(10);
      writer.doc
        .moveTo(x, writer.y + 3)
        .lineTo(x + width, writer.y + 3)
        .lineWidth(0.5)
        .strokeColor(sheetColors.line)
        .stroke();
      writer.gap(10);
      break;
  }
}

/** Draws Markdown `source` at the cursor, moving it below; `emptyText` when there is nothing to draw. */
export function drawMarkdown(writer: SheetWriter, source: string, options: MarkdownPdfOptions = {}): void {
  const x = options.x ?? writer.left;
  const width = options.width ?? writer.left + writer.contentWidth - x;
  const size = options.size ?? textSize.body;
  const blocks = parseMarkdown(source, { mentions: options.mentions });
  if (blocks.length === 0) {
    if (options.emptyText) writer.paragraph(options.emptyText, { color: sheetColors.muted, x, width, size });
    return;
  }
  for (const block of blocks) drawBlock(writer, block, x, width, size);
  writer.doc.fillColor(sheetColors.ink);
}
