import { getDocument } from 'pdfjs-dist/legacy/build/pdf.mjs';
import type { TextItem } from 'pdfjs-dist/types/src/display/api';
import { describe, expect, it } from 'vitest';
import { exampleDesign, type Design } from '../../../shared/design';
import type { Paper } from '../../../shared/sheets';
import { sketchGeometry } from '../../../features/sketch/geometry';
import { buildSketchScene } from '../../../features/sketch/sketch-scene';
import { buildSheet } from '../../../server/sheets/build';
import type { SheetSection } from '../../../server/sheets/section';
import { plotsSection } from '../../../server/sheets/sections/plots';
import { sketchSection } from '../../../server/sheets/sections/sketch';
import { sketchSceneOptions, sketchWords } from '../../../server/sheets/sketch-pdf';
import { margins, paperPt, SheetWriter } from '../../../server/sheets/writer';
import { pdfText } from './pdf-text';
import { sampleSheet } from './sample';

/**
 * The design sheet's two drawings: the ray sketch (the app's scene as PDF vectors) and the four
 * plots. Read back through pdfjs-dist, a reader other than the pdfkit that wrote them.
 */

/** One run of text with its box in page points, y down from the page's top, rotation allowed. */
type Placed = {
  str: string;
  page: number;
  left: number;
  right: number;
  top: number;
  bottom: number;
  x: number;
  baseline: number;
  size: number;
  rotated: boolean;
};

/** Runs of white space (no-break spaces too) as one space, as the tests compare words. */
const flat = (text: string) => text.normalize('NFKC').replace(/\s+/g, ' ').trim();

async function placedText(bytes: Uint8Array): Promise<Placed[]> {
  const task = getDocument({
    data: new Uint8Array(bytes),
    useSystemFonts: false,
    isEvalSupported: false,
    verbosity: 0,
  });
  const doc = await task.promise;
  try {
    const items: Placed[] = [];
    for (let n = 1; n <= doc.numPages; n += 1) {
      const page = await doc.getPage(n);
      const { height } = page.getViewport({ scale: 1 });
      const content = await page.getTextContent({ disableNormalization: true });
      for (const item of content.items) {
        if (!('str' in item) || item.str.trim() === '') continue;
        const [a, b, c, d, e, f] = (item as TextItem).transform as number[];
        const size = Math.hypot(c!, d!);
        // The run's direction, then its far end; the box spans the glyphs' height across it.
        const ux = a! / Math.hypot(a!, b!);
        const uy = b! / Math.hypot(a!, b!);
        const ends = [
          [e!, f!],
          [e! + ux * item.width, f! + uy * item.width],
          [e! - uy * size, f! + ux * size],
          [e! + ux * item.width - uy * size, f! + uy * item.width + ux * size],
        ];
        const xs = ends.map((p) => p[0]!);
        const ys = ends.map((p) => height - p[1]!);
        items.push({
          str: item.str,
          page: n,
          left: Math.min(...xs),
          right: Math.max(...xs),
          top: Math.min(...ys),
          bottom: Math.max(...ys),
          x: e!,
          baseline: height - f!,
          size,
          rotated: Math.abs(b!) > 1e-6,
        });
      }
    }
    return joinWords(items);
  } finally {
    await task.destroy();
  }
}

/**
 * pdfjs reports a label set in IBM Plex Mono as one run per word (its space glyph is empty), where
 * a reader sees one label: join runs on one baseline whose gap is at most a space's width.
 */
function joinWords(items: Placed[]): Placed[] {
  const joined: Placed[] = [];
  for (const item of items) {
    const last = joined.at(-1);
    const gap = last ? item.left - last.right : Infinity;
    if (
      last &&
      !last.rotated &&
      !item.rotated &&
      last.page === item.page &&
      Math.abs(last.baseline - item.baseline) < 0.5 &&
      Math.abs(last.size - item.size) < 0.1 &&
      gap > -0.5 &&
      gap < 0.7 * item.size
    ) {
      joined[joined.length - 1] = {
        ...last,
        str: `${last.str}${gap > 0.15 * item.size && !last.str.endsWith(' ') ? ' ' : ''}${item.str}`,
        right: item.right,
        top: Math.min(last.top, item.top),
        bottom: Math.max(last.bottom, item.bottom),
      };
    } else {
      joined.push(item);
    }
  }
  return joined;
}

/** A sheet's text runs where they stand, and its text as a reader reads it (white space flattened). */
async function read(bytes: Uint8Array): Promise<{ items: Placed[]; text: string }> {
  return { items: await placedText(bytes), text: flat((await pdfText(bytes)).text) };
}

async function sheetOf(sections: SheetSection[], params: Design = exampleDesign, paper: Paper = 'a4') {
  return read(await buildSheet({ ...sampleSheet({ params }), paper }, sections));
}

/** The scene the sketch section draws for `params`, built here from the same pure model. */
function sceneFor(params: Design, paper: Paper = 'a4') {
  const writer = new SheetWriter(paper, { title: 't', subject: 's', createdAt: new Date(0) });
  const geometry = sketchGeometry(params);
  return {
    geometry,
    scene: buildSketchScene(geometry, sketchSceneOptions(writer)),
    contentWidth: writer.contentWidth,
  };
}

/** A range reaching past what a 1200 g/mm grating can deliver at K = 15° (no off-axis angles given). */
const tooLong: Design = {
  ...exampleDesign,
  layout: { kind: 'czerny-turner', deviationAngleDeg: 30, collimatorFocalMm: 300, cameraFocalMm: 300 },
  range: { startNm: 300, endNm: 2000 },
  source: { minNm: 200, maxNm: 2100 },
};

/** Pushes the next section down to `leftPt` above the page's bottom margin. */
function filler(leftPt: number): SheetSection {
  return {
    id: 'filler',
    title: 'Filler',
    draw(writer) {
      writer.sectionHeading(this.title, 0);
      writer.y = writer.bottom - leftPt;
    },
  };
}

/** Every run of text inside the page's margins; the footer's two runs live in the bottom margin. */
function expectInsideMargins(items: readonly Placed[], paper: Paper): void {
  const { width, height } = paperPt[paper];
  for (const i of items) {
    expect(i.left, i.str).toBeGreaterThanOrEqual(margins.left - 0.5);
    expect(i.right, i.str).toBeLessThanOrEqual(width - margins.right + 0.5);
    expect(i.top, i.str).toBeGreaterThanOrEqual(margins.top - 0.5);
    if (!i.str.startsWith('Generated') && !i.str.startsWith('Page'))
      expect(i.bottom, i.str).toBeLessThanOrEqual(height - margins.bottom + 0.5);
  }
}

describe('ray sketch on the sheet', () => {
  it.each(['a4', 'letter'] as const)(
    'prints every label of the app scene for the same design, on %s',
    async (paper) => {
      const { scene } = sceneFor(exampleDesign, paper);
      const labels = scene.shapes.flatMap((s) => (s.type === 'text' ? [flat(s.text)] : []));
      expect(labels.length).toBeGreaterThan(6);
      const { items } = await sheetOf([sketchSection], exampleDesign, paper);
      const printed = new Set(items.map((i) => flat(i.str)));
      expect(labels.filter((label) => !printed.has(label))).toEqual([]);
      expectInsideMargins(items, paper);
    },
  );

  it('sets each label where the scene puts it: one scale and origin for all, anchors and baselines as in SVG', async () => {
    const { scene, contentWidth } = sceneFor(exampleDesign);
    const { items } = await sheetOf([sketchSection]);
    const scale = (contentWidth - 8) / scene.widthPx;
    // The scene's texts in drawing order, each matched to the next run that reads the same (two
    // mirrors may both say "f 300 mm").
    let from = 0;
    const origins = scene.shapes.flatMap((shape) => {
      if (shape.type !== 'text') return [];
      const at = items.findIndex((i, n) => n >= from && flat(i.str) === flat(shape.text));
      if (at < 0) return [];
      from = at + 1;
      const run = items[at]!;
      const width = run.right - run.left;
      // Where the scene's anchor point lands on the page, less where the scene says it is.
      const anchorX =
        shape.anchor === 'middle' ? run.left + width / 2 : shape.anchor === 'end' ? run.right : run.left;
      return [{ text: shape.text, x: anchorX - shape.x * scale, y: run.baseline - shape.y * scale }];
    });
    expect(origins.length).toBeGreaterThan(6);
    const [first] = origins;
    for (const o of origins) {
      expect(Math.abs(o.x - first!.x), `${o.text} across`).toBeLessThan(0.35);
      expect(Math.abs(o.y - first!.y), `${o.text} baseline`).toBeLessThan(0.35);
    }
    // The drawing fills the content column, inside the frame's few points of padding.
    expect(first!.x).toBeGreaterThan(margins.left);
    expect(first!.x).toBeLessThan(margins.left + 8);
  });

  it('prints the one-line description and the notes the saved SVG carries', async () => {
    const { geometry } = sceneFor(exampleDesign);
    const { description, notes } = sketchWords(geometry, exampleDesign);
    const { text } = await sheetOf([sketchSection]);
    expect(text).toContain(flat(description));
    // The example's camera cannot image 900 nm with the grating set for 600 nm (the sketch's own finding).
    expect(notes.length).toBeGreaterThan(0);
    for (const note of notes) expect(text).toContain(flat(note));
  });

  it('keeps its heading, drawing and description on one page when little room is left', async () => {
    const bar = sceneFor(exampleDesign).scene.shapes.find((s) => s.key === 'scale-bar-label');
    const { items } = await sheetOf([filler(200), sketchSection]);
    const heading = items.find((i) => i.str === 'Ray sketch');
    const barLabel = items.find((i) => bar?.type === 'text' && flat(i.str) === flat(bar.text));
    const description = items.find((i) => i.str.startsWith('Czerny–Turner layout to scale'));
    expect(heading?.page).toBe(2);
    expect(barLabel?.page).toBe(2);
    expect(description?.page).toBe(2);
    expect(barLabel!.baseline).toBeGreaterThan(heading!.baseline);
  });

  it('draws a design with wavelengths out of reach and names them', async () => {
    const { geometry } = sceneFor(tooLong);
    expect(geometry.unreachable.length).toBeGreaterThan(0);
    const { text } = await sheetOf([sketchSection], tooLong);
    expect(text).toContain('Not drawn: 2000 nm');
  });
});

/** The app's titles and axis titles (features/plots/components/performance-plots.tsx, line-plot.tsx). */
const plotWords = {
  titles: [
    'Reciprocal dispersion',
    'Bandpass and resolving power',
    'Blaze efficiency',
    'Grating rotation (scan curve)',
  ],
  axisTitles: ['nm/mm', 'bandpass, nm', 'resolving power R', 'relative to peak', 'rotation φ, °'],
};

describe('plots on the sheet', () => {
  it.each(['a4', 'letter'] as const)(
    'prints each plot title, its axis titles and the wavelength axis, inside the margins, on %s',
    async (paper) => {
      const { items, text } = await sheetOf([plotsSection], exampleDesign, paper);
      for (const title of plotWords.titles)
        expect(
          items.some((i) => i.str === title),
          title,
        ).toBe(true);
      for (const title of plotWords.axisTitles)
        expect(
          items.some((i) => flat(i.str) === flat(title)),
          title,
        ).toBe(true);
      expect(items.filter((i) => i.str === 'Wavelength (nm)')).toHaveLength(4);
      // The efficiency axis runs 0 to 100 % relative to the peak.
      expect(text).toContain('0%');
      expect(text).toContain('100%');
      expectInsideMargins(items, paper);
      // Axis titles stand along the plots' heights.
      expect(
        items
          .filter((i) => i.rotated)
          .map((i) => flat(i.str))
          .sort(),
      ).toEqual(plotWords.axisTitles.map(flat).sort());
    },
  );

  it('cautions under the efficiency plot when λ/d passes the scalar limit', async () => {
    // 1200 g/mm: d = 833 nm, so λ/d = 0.36 already at 300 nm, past the 0.2 the scalar model holds to
    // (Palmer & Loewen, Diffraction Grating Handbook, ch. 9, as the app's caption cites).
    const { text } = await sheetOf([plotsSection]);
    expect(text).toContain('Caution: across the whole plot λ/d exceeds 0.2');
    // A coarse grating keeps λ/d below 0.2 over the range: 150 g/mm, d = 6667 nm, λ/d ≤ 0.135 at 900 nm.
    const coarse: Design = {
      ...exampleDesign,
      grating: { ...exampleDesign.grating, grooveDensityPerMm: 150 },
    };
    const coarseText = (await sheetOf([plotsSection], coarse)).text;
    expect(coarseText).toContain('Blaze efficiency');
    expect(coarseText).not.toContain('Caution');
  });

  it('shades and keys the overlapping orders when another order lands in the range', async () => {
    // The grating equation depends on mλ only: the source's 200–450 nm in order 2 leaves the grating
    // at the same angles as 400–900 nm in order 1.
    const { text } = await sheetOf([plotsSection]);
    expect(text).toContain('Shaded: other orders land here and no filter blocks them');
  });

  it('says how much of the sweep is out of reach, and still draws every plot', async () => {
    const sheet = sampleSheet({ params: tooLong });
    const missing = sheet.evaluation.points.filter((p) => p.gratingRotationDeg === null).length;
    // Grating equation at constant deviation, mλ = 2d sin φ cos K (from memory): no rotation passes
    // 2d cos K = 2 · 833.3 · cos 15° = 1610 nm, so the sweep points 1611–2000 nm (every 17 nm) are out: 23.
    expect(missing).toBeGreaterThanOrEqual(23);
    const { items, text } = await read(await buildSheet(sheet, [plotsSection]));
    expect(text).toContain(`${missing} of 101 wavelengths of the sweep are out of reach`);
    for (const title of plotWords.titles)
      expect(
        items.some((i) => i.str === title),
        title,
      ).toBe(true);
  });

  it.each([120, 260, 400])(
    'never splits a row of plots across pages (%i pt left on the page)',
    async (left) => {
      const { items } = await sheetOf([filler(left), plotsSection]);
      for (const [title, axis] of [
        ['Reciprocal dispersion', 'nm/mm'],
        ['Bandpass and resolving power', 'resolving power R'],
        ['Blaze efficiency', 'relative to peak'],
        ['Grating rotation (scan curve)', 'rotation φ, °'],
      ] as const) {
        const top = items.find((i) => i.str === title);
        const side = items.find((i) => flat(i.str) === flat(axis));
        expect(side?.page, title).toBe(top?.page);
      }
      const heading = items.find((i) => i.str === 'Plots');
      const first = items.find((i) => i.str === 'Reciprocal dispersion');
      expect(heading?.page).toBe(first?.page);
    },
  );
});
