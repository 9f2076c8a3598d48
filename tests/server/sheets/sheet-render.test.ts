import { execFileSync } from 'node:child_process';
import { mkdirSync, readdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { beforeAll, describe, expect, it } from 'vitest';
import { buildCompareSheet, buildSheet } from '../../../server/sheets/build';
import { margins, paperPt } from '../../../server/sheets/writer';
import type { Paper } from '../../../shared/sheets';
import { exampleDesign } from '../../../shared/design';
import { sampleCompareSheet, sampleSheet, sampleVersion } from './sample';

/**
 * The sample sheets rendered by another program — poppler's pdftoppm, as Debian ships it — and
 * checked pixel by pixel: no page is blank, and all ink lies inside the margins, with only the
 * footer (its rule, generation line and page number) in the bottom margin. The pages are kept as
 * PNGs in tests/artifacts/sheets/ to look at.
 */

const outDir = fileURLToPath(new URL('../../artifacts/sheets/', import.meta.url));
/** 72 dpi: one pixel is one PDF point, so the margins in points are pixel columns and rows. */
const DPI = 72;
/** Antialiasing spreads an edge over about a pixel; a line drawn on the margin may touch the next. */
const EDGE_PX = 1.5;
/** Lighter than this (0–255) counts as paper. The faintest ink, the table header's shade #F3F0E9, is about 240. */
const PAPER = 250;
/** The footer's rule stands this far below the content's bottom (writer.ts `footers`: bottom + 22 − 6). */
const FOOTER_RULE_BELOW_BOTTOM = 16;

function requirePdftoppm(): void {
  try {
    execFileSync('pdftoppm', ['-v'], { stdio: 'pipe' });
  } catch (error) {
    throw new Error(
      `pdftoppm is missing (${(error as Error).message}): install poppler-utils (apt-get install poppler-utils; .ci/run does) to run the sheet render checks`,
    );
  }
}

/** A binary PGM (P5, 8-bit) as pdftoppm -gray writes it. */
function readPgm(file: string): { width: number; height: number; gray: Uint8Array } {
  const bytes = readFileSync(file);
  const fields: string[] = [];
  let at = 0;
  while (fields.length < 4) {
    while (/\s/.test(String.fromCharCode(bytes[at]!))) at += 1;
    if (bytes[at] === 0x23) {
      while (bytes[at] !== 0x0a) at += 1;
      continue;
    }
    let field = '';
    while (!/\s/.test(String.fromCharCode(bytes[at]!))) field += String.fromCharCode(bytes[at++]!);
    fields.push(field);
  }
  const [magic, width, height, max] = fields;
  if (magic !== 'P5' || max !== '255') throw new Error(`${file}: not an 8-bit binary PGM (${fields.join(' ')})`);
  const w = Number(width);
  const h = Number(height);
  return { width: w, height: h, gray: bytes.subarray(at + 1, at + 1 + w * h) };
}

type Box = { left: number; top: number; right: number; bottom: number; pixels: number };

/** The bounding box of the ink in rows [fromRow, toRow) (null when there is none). */
function inkBox(page: ReturnType<typeof readPgm>, fromRow = 0, toRow = page.height): Box | null {
  let box: Box | null = null;
  for (let y = Math.max(0, fromRow); y < Math.min(page.height, toRow); y += 1) {
    for (let x = 0; x < page.width; x += 1) {
      if (page.gray[y * page.width + x]! >= PAPER) continue;
      if (!box) box = { left: x, top: y, right: x + 1, bottom: y + 1, pixels: 0 };
      box.left = Math.min(box.left, x);
      box.right = Math.max(box.right, x + 1);
      box.top = Math.min(box.top, y);
      box.bottom = Math.max(box.bottom, y + 1);
      box.pixels += 1;
    }
  }
  return box;
}

type Rendered = { name: string; paper: Paper; pages: { file: string; png: string; problems: string[] }[] };

/** Writes the PDF, renders every page (a PGM to measure, a PNG to keep) and checks each page. */
function renderAndCheck(name: string, paper: Paper, bytes: Buffer): Rendered {
  const pdf = path.join(outDir, `${name}.pdf`);
  writeFileSync(pdf, bytes);
  const prefix = path.join(outDir, name);
  execFileSync('pdftoppm', ['-r', String(DPI), '-gray', pdf, prefix]);
  execFileSync('pdftoppm', ['-r', String(DPI), '-png', pdf, prefix]);
  const pgms = readdirSync(outDir)
    .filter((file) => file.startsWith(`${name}-`) && file.endsWith('.pgm'))
    .sort((a, b) => pageNumber(a) - pageNumber(b));
  const size = paperPt[paper];
  const pages = pgms.map((file) => {
    const page = readPgm(path.join(outDir, file));
    rmSync(path.join(outDir, file));
    const problems: string[] = [];
    // pdftoppm rounds the page to whole pixels.
    if (Math.abs(page.width - size.width) > 1 || Math.abs(page.height - size.height) > 1) {
      problems.push(`is ${page.width} × ${page.height} px, not ${paper}`);
    }
    const contentBottom = size.height - margins.bottom;
    const footerRule = contentBottom + FOOTER_RULE_BELOW_BOTTOM;
    const all = inkBox(page);
    const content = inkBox(page, margins.top, Math.floor(contentBottom));
    if (!content || content.pixels < 300) problems.push(`is blank (${content?.pixels ?? 0} ink pixels inside the margins)`);
    if (all) {
      if (all.left < margins.left - EDGE_PX) problems.push(`has ink ${(margins.left - all.left).toFixed(0)} pt into the left margin`);
      if (all.right > size.width - margins.right + EDGE_PX) problems.push(`has ink ${(all.right - (size.width - margins.right)).toFixed(0)} pt into the right margin`);
      if (all.top < margins.top - EDGE_PX) problems.push(`has ink ${(margins.top - all.top).toFixed(0)} pt into the top margin`);
    }
    // Between the content's bottom and the footer's rule the page stays empty: nothing ran past the bottom.
    const below = inkBox(page, Math.ceil(contentBottom + EDGE_PX), Math.floor(footerRule - EDGE_PX));
    if (below) problems.push(`has ink below the content's bottom, down to ${(below.bottom - contentBottom).toFixed(0)} pt past it (rows ${below.top}–${below.bottom})`);
    // The footer itself is a few lines high and leaves the page's foot empty.
    const footer = inkBox(page, Math.floor(footerRule - EDGE_PX), page.height);
    if (!footer) problems.push('has no footer');
    else if (footer.bottom > size.height - 20) problems.push(`has its footer ${(size.height - footer.bottom).toFixed(0)} pt from the page's foot`);
    return { file, png: file.replace(/\.pgm$/, '.png'), problems };
  });
  return { name, paper, pages };
}

const pageNumber = (file: string) => Number(/-(\d+)\.\w+$/.exec(file)?.[1] ?? 0);

/**
 * The longest words the product lets in (a 120-character title with an unbroken run, a
 * 200-character message), no source or detector, and eight picked wavelengths, two of which no
 * grating angle reaches: the widest rows and the longest lines a sheet can get.
 */
function stressSheet() {
  const { source: _source, detector: _detector, ...params } = exampleDesign;
  const base = sampleSheet();
  const title = `Sodium-doublet monochromator ${'Czerny–Turner-with-a-very-long-unbroken-name'.repeat(2)}`.slice(0, 120);
  const version = { ...sampleVersion(params), message: 'Narrower exit slit '.repeat(11).slice(0, 200).trim() };
  return sampleSheet({
    paper: 'letter',
    params,
    version,
    design: { ...base.design, title, teamName: 'Harbourview teaching laboratory, optics and spectroscopy section (second floor)' },
    picked: [250, 404.7, 435.8, 546.1, 577, 589, 2500, 5000],
  });
}

const sheets: { name: string; paper: Paper; build: () => Promise<Buffer> }[] = [
  { name: 'sheet-stress-letter', paper: 'letter', build: () => buildSheet(stressSheet()) },
  { name: 'sheet-a4', paper: 'a4', build: () => buildSheet(sampleSheet()) },
  { name: 'sheet-letter', paper: 'letter', build: () => buildSheet(sampleSheet({ paper: 'letter' })) },
  { name: 'compare-a4', paper: 'a4', build: () => buildCompareSheet(sampleCompareSheet()) },
  { name: 'compare-letter', paper: 'letter', build: () => buildCompareSheet({ ...sampleCompareSheet(), paper: 'letter' }) },
];

describe('design sheets rendered with pdftoppm', () => {
  const rendered = new Map<string, Rendered>();

  beforeAll(async () => {
    requirePdftoppm();
    mkdirSync(outDir, { recursive: true });
    // Pages of an earlier, longer run would otherwise be checked (and looked at) as this run's.
    for (const file of readdirSync(outDir)) {
      if (sheets.some((s) => file.startsWith(`${s.name}-`) || file === `${s.name}.pdf`)) rmSync(path.join(outDir, file));
    }
    for (const sheet of sheets) rendered.set(sheet.name, renderAndCheck(sheet.name, sheet.paper, await sheet.build()));
  }, 120_000);

  it.each(sheets.map((s) => ({ name: s.name })))('$name: every page has content and stays inside its margins', ({ name }) => {
    const { pages } = rendered.get(name)!;
    expect(pages.length, 'pages rendered').toBeGreaterThan(0);
    expect(pages.flatMap((page) => page.problems.map((problem) => `${page.png} ${problem}`))).toEqual([]);
  });

  it('keeps a PNG of every page to look at', () => {
    const files = readdirSync(outDir);
    for (const { pages } of rendered.values()) for (const page of pages) expect(files).toContain(page.png);
  });
});
