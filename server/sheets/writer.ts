import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import * as fontkit from 'fontkit';
import PDFDocument from 'pdfkit';
import type { Paper } from '../../shared/sheets';
import { colors } from '../../features/ui/theme';

/**
 * The design sheet's page layout over pdfkit: the fonts shipped in `assets/fonts` (subset into the
 * file by pdfkit), the paper, the margins, and the few building blocks every section uses —
 * section headings, paragraphs, key–value lists and tables that break across pages. Coordinates
 * are PDF points (1/72 in) from the page's top-left corner, y down, as in the sketch's scene.
 */

export type SheetFont = 'regular' | 'semibold' | 'bold' | 'mono' | 'monoMedium';

const fontFiles: Record<SheetFont, string> = {
  regular: 'Inter_400Regular.ttf',
  semibold: 'Inter_600SemiBold.ttf',
  bold: 'Inter_700Bold.ttf',
  mono: 'IBMPlexMono_400Regular.ttf',
  monoMedium: 'IBMPlexMono_500Medium.ttf',
};

const fontDir = fileURLToPath(new URL('../../assets/fonts/', import.meta.url));
let parsedFonts: Record<SheetFont, fontkit.Font> | null = null;

/**
 * The fonts, read and parsed once per process: pdfkit takes a parsed font as well as bytes, and
 * parsing each font again for every sheet was most of a sheet's time (measured with
 * `npm run bench:sheet`: one version's sheet 274 → 126 ms, the compare sheet 177 → 39 ms, the same
 * bytes out). Each document still makes its own subset of the glyphs it uses.
 */
function loadFonts(): Record<SheetFont, fontkit.Font> {
  parsedFonts ??= Object.fromEntries(
    Object.entries(fontFiles).map(([name, file]) => {
      // Padded with zeros: IBM Plex Mono's empty glyphs (space, no-break space) sit at the very end
      // of its glyph table, and fontkit 2.0.4 reads a glyph header past the end of the file for
      // them (a RangeError that would fail the whole sheet). The padding is never referenced.
      const bytes = Buffer.concat([readFileSync(`${fontDir}${file}`), Buffer.alloc(64)]);
      return [name, fontkit.create(bytes) as fontkit.Font];
    }),
  ) as Record<SheetFont, fontkit.Font>;
  return parsedFonts;
}

/**
 * The font as pdfkit sees it, shaping text as it was written: Inter's contextual alternates
 * (OpenType `calt`) set the x between two digits as a multiplication sign, so a share link's token
 * "…6x8…" printed, copied and read back as "…6×8…" (a link that leads nowhere), and a part number or
 * a note would change the same way. Every other default feature (kerning, ligatures) stays; fontkit
 * drops a feature given as `false`. The glyph table and metrics are the parsed font's own.
 */
function asWritten(font: fontkit.Font): fontkit.Font {
  const layout = (text: string, features?: unknown) =>
    font.layout(text, (features ?? { calt: false }) as Parameters<fontkit.Font['layout']>[1]);
  return new Proxy(font, {
    get: (target, key) => (key === 'layout' ? layout : Reflect.get(target, key, target)),
  });
}

/** Paper sizes in points (ISO 216 A4 210 × 297 mm; US Letter 8.5 × 11 in). */
export const paperPt: Record<Paper, { width: number; height: number }> = {
  a4: { width: 595.28, height: 841.89 },
  letter: { width: 612, height: 792 },
};

/** Margins in points: the footer lives in the bottom margin, below `bottom`. */
export const margins = { top: 50, bottom: 62, left: 48, right: 48 };

export const sheetColors = {
  ink: colors.ink,
  muted: colors.inkMuted,
  faint: colors.inkFaint,
  line: colors.line,
  primary: colors.primary,
  accent: colors.accent,
  danger: colors.danger,
  warning: colors.warning,
  ok: colors.ok,
  shade: '#F3F0E9',
} as const;

export const textSize = { title: 18, heading: 12.5, subheading: 10, body: 9, small: 7.5 } as const;

export type TableColumn = {
  header: string;
  /** Share of the content width (the shares of a table add up to 1). */
  width: number;
  align?: 'left' | 'right' | 'center';
  font?: SheetFont;
};

export type TableRow = {
  cells: string[];
  /** Drawn on a tint, for a changed or failing row. */
  marked?: boolean;
  bold?: boolean;
};

export type DocumentInfo = { title: string; subject: string; author?: string; createdAt: Date };

export class SheetWriter {
  readonly doc: PDFKit.PDFDocument;
  readonly pageWidth: number;
  readonly pageHeight: number;
  /** Left edge and width of the content column. */
  readonly left = margins.left;
  readonly contentWidth: number;
  /** Lowest y content may reach on a page. */
  readonly bottom: number;

  constructor(paper: Paper, info: DocumentInfo) {
    const size = paperPt[paper];
    this.pageWidth = size.width;
    this.pageHeight = size.height;
    this.contentWidth = size.width - margins.left - margins.right;
    this.bottom = size.height - margins.bottom;
    this.doc = new PDFDocument({
      size: [size.width, size.height],
      margins,
      bufferPages: true,
      autoFirstPage: true,
      // No compression of the text would make the file larger; keep pdfkit's default (compressed).
      info: {
        Title: info.title,
        Subject: info.subject,
        Author: info.author ?? 'Blazebook',
        Creator: 'Blazebook',
        Producer: 'Blazebook design sheet',
        CreationDate: info.createdAt,
        ModDate: info.createdAt,
      },
      lang: 'en',
      displayTitle: true,
    });
    for (const [name, font] of Object.entries(loadFonts())) {
      // fontkit keeps each glyph with the characters it was first laid out for, and pdfkit writes
      // those into the file's text map (what copying and screen readers get). Shared across sheets,
      // a glyph first met as one character (Inter draws the space and the no-break space alike)
      // would read as that character in every later sheet: start each sheet with none kept, as a
      // freshly parsed font would (fontkit 2.0.4's `_glyphs`, pinned).
      (font as unknown as { _glyphs: Record<number, unknown> })._glyphs = {};
      // pdfkit's types list only paths and bytes; its code takes a parsed font (anything with `layout`).
      this.doc.registerFont(name, asWritten(font) as unknown as Buffer);
    }
    this.use('regular', textSize.body);
    this.doc.fillColor(sheetColors.ink);
  }

  /** The cursor: where the next block starts. */
  get y(): number {
    return this.doc.y;
  }
  set y(value: number) {
    this.doc.y = value;
  }

  use(font: SheetFont, size: number): this {
    this.doc.font(font).fontSize(size);
    return this;
  }

  /**
   * Whether `font` can set `char` (a PDF prints a character its font lacks as an empty box; IBM
   * Plex Mono has no Greek, for one). Read from the parsed font, not from pdfkit's internals.
   */
  hasGlyph(font: SheetFont, char: string): boolean {
    return loadFonts()[font].hasGlyphForCodePoint(char.codePointAt(0) ?? 0);
  }

  /** Starts a new page when fewer than `heightPt` points are left on this one. */
  ensureSpace(heightPt: number): void {
    if (this.y + heightPt > this.bottom) this.newPage();
  }

  newPage(): void {
    this.doc.addPage();
    this.y = margins.top;
  }

  /** Vertical space. */
  gap(pt: number): void {
    this.y = Math.min(this.y + pt, this.bottom);
  }

  /** The height `text` takes in `font` at `size` across `width` (default: the content width). */
  measure(text: string, font: SheetFont, size: number, width = this.contentWidth): number {
    this.use(font, size);
    return this.doc.heightOfString(text, { width });
  }

  /** A section's heading, kept on the page with at least `keepWithPt` of what follows it. */
  sectionHeading(title: string, keepWithPt = 60): void {
    this.gap(8);
    this.ensureSpace(28 + keepWithPt);
    const y = this.y;
    this.doc.moveTo(this.left, y).lineTo(this.left + this.contentWidth, y).lineWidth(0.75).strokeColor(sheetColors.primary).stroke();
    this.use('bold', textSize.heading).doc.fillColor(sheetColors.primary).text(title, this.left, y + 5, { width: this.contentWidth });
    this.doc.fillColor(sheetColors.ink);
    this.gap(4);
  }

  subheading(text: string): void {
    this.ensureSpace(30);
    this.use('semibold', textSize.subheading).doc.fillColor(sheetColors.ink).text(text, this.left, this.y, { width: this.contentWidth });
    this.gap(2);
  }

  /** A paragraph across the content column (or `width` from `x`), breaking onto new pages as needed. */
  paragraph(
    text: string,
    options: { font?: SheetFont; size?: number; color?: string; x?: number; width?: number; gapAfter?: number } = {},
  ): void {
    const font = options.font ?? 'regular';
    const size = options.size ?? textSize.body;
    const x = options.x ?? this.left;
    const width = options.width ?? this.contentWidth;
    this.ensureSpace(Math.min(this.measure(text, font, size, width), size * 3));
    this.use(font, size).doc.fillColor(options.color ?? sheetColors.ink).text(text, x, this.y, { width });
    this.doc.fillColor(sheetColors.ink);
    this.gap(options.gapAfter ?? 4);
  }

  /** `label: value` lines in two columns, the labels muted. */
  keyValues(pairs: readonly (readonly [string, string])[], labelShare = 0.32): void {
    const labelWidth = this.contentWidth * labelShare;
    const valueWidth = this.contentWidth - labelWidth - 8;
    for (const [label, value] of pairs) {
      const height = Math.max(this.measure(label, 'regular', textSize.body, labelWidth), this.measure(value, 'semibold', textSize.body, valueWidth));
      this.ensureSpace(height + 2);
      const y = this.y;
      this.use('regular', textSize.body).doc.fillColor(sheetColors.muted).text(label, this.left, y, { width: labelWidth });
      this.use('semibold', textSize.body).doc.fillColor(sheetColors.ink).text(value, this.left + labelWidth + 8, y, { width: valueWidth });
      this.y = y + height + 2;
    }
    this.doc.fillColor(sheetColors.ink);
    this.gap(2);
  }

  /** A table with a header row that repeats on every page it runs onto. */
  table(columns: readonly TableColumn[], rows: readonly TableRow[], options: { size?: number } = {}): void {
    const size = options.size ?? textSize.body;
    const pad = 3;
    const xs: number[] = [];
    let x = this.left;
    for (const column of columns) {
      xs.push(x);
      x += column.width * this.contentWidth;
    }
    const widthOf = (i: number) => columns[i]!.width * this.contentWidth - 2 * pad;
    const rowHeight = (cells: readonly string[], font: (i: number) => SheetFont) =>
      Math.max(...cells.map((cell, i) => this.measure(cell, font(i), size, widthOf(i)))) + 2 * pad;
    const headerFont = () => 'semibold' as const;
    const drawHeader = () => {
      const height = rowHeight(columns.map((c) => c.header), headerFont);
      const y = this.y;
      this.doc.rect(this.left, y, this.contentWidth, height).fill(sheetColors.shade);
      columns.forEach((column, i) => {
        this.use('semibold', size).doc.fillColor(sheetColors.muted).text(column.header, xs[i]! + pad, y + pad, { width: widthOf(i), align: column.align ?? 'left' });
      });
      this.y = y + height;
    };
    const headerHeight = rowHeight(columns.map((c) => c.header), headerFont);
    this.ensureSpace(headerHeight + 16);
    drawHeader();
    for (const row of rows) {
      const font = (i: number): SheetFont => (row.bold ? 'semibold' : (columns[i]!.font ?? 'regular'));
      const height = rowHeight(row.cells, font);
      if (this.y + height > this.bottom) {
        this.newPage();
        drawHeader();
      }
      const y = this.y;
      if (row.marked) this.doc.rect(this.left, y, this.contentWidth, height).fill('#FFF2E6');
      row.cells.forEach((cell, i) => {
        this.use(font(i), size).doc.fillColor(sheetColors.ink).text(cell, xs[i]! + pad, y + pad, { width: widthOf(i), align: columns[i]!.align ?? 'left' });
      });
      this.doc
        .moveTo(this.left, y + height)
        .lineTo(this.left + this.contentWidth, y + height)
        .lineWidth(0.4)
        .strokeColor(sheetColors.line)
        .stroke();
      this.y = y + height;
    }
    this.doc.fillColor(sheetColors.ink);
    this.gap(6);
  }

  /**
   * Reserves a box `heightPt` tall across the content column (on a new page if it does not fit),
   * moves the cursor below it and returns its corner, for drawings.
   */
  box(heightPt: number): { x: number; y: number; width: number; height: number } {
    this.ensureSpace(heightPt);
    const box = { x: this.left, y: this.y, width: this.contentWidth, height: heightPt };
    this.y = this.y + heightPt;
    return box;
  }

  /**
   * Page numbers and the footer on every page, once all pages exist: the generation note, then the
   * link back, each kept whole on its line (a link broken at one of an id's hyphens cannot be
   * followed or copied); when both fit on one line they share it.
   */
  footers(note: string, link: string): void {
    const range = this.doc.bufferedPageRange();
    const pageWidth = 70;
    const room = this.contentWidth - pageWidth - 8;
    for (let i = range.start; i < range.start + range.count; i += 1) {
      this.doc.switchToPage(i);
      const y = this.pageHeight - margins.bottom + 22;
      // pdfkit would add a page for text below the bottom margin: lift the margin while writing here.
      const saved = this.doc.page.margins.bottom;
      this.doc.page.margins.bottom = 0;
      this.doc.moveTo(this.left, y - 6).lineTo(this.left + this.contentWidth, y - 6).lineWidth(0.4).strokeColor(sheetColors.line).stroke();
      this.use('regular', textSize.small).doc.fillColor(sheetColors.muted);
      const oneLine = `${note} · ${link}`;
      if (this.doc.widthOfString(oneLine) <= room) {
        this.doc.text(oneLine, this.left, y, { lineBreak: false });
      } else {
        this.doc.text(note, this.left, y, { lineBreak: false });
        // A very long link (a long public address) gets a smaller size rather than a break.
        const size = Math.max(5, Math.min(textSize.small, (textSize.small * room) / this.doc.widthOfString(link)));
        this.use('regular', size).doc.text(link, this.left, y + 9, { lineBreak: false });
        this.use('regular', textSize.small);
      }
      this.doc.text(`Page ${i - range.start + 1} of ${range.count}`, this.left + this.contentWidth - pageWidth, y, { width: pageWidth, align: 'right', lineBreak: false });
      this.doc.page.margins.bottom = saved;
    }
  }

  /** Ends the document and resolves with the whole file. */
  finish(): Promise<Buffer> {
    return new Promise((resolve, reject) => {
      const chunks: Buffer[] = [];
      this.doc.on('data', (chunk: Buffer) => chunks.push(chunk));
      this.doc.on('end', () => resolve(Buffer.concat(chunks)));
      this.doc.on('error', reject);
      this.doc.end();
    });
  }
}
