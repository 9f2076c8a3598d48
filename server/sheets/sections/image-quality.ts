import type { Design } from '../../../shared/design';
import { formatInteger, formatNumber, formatQuantity } from '../../../shared/format';
import { TRACE_LIMITS } from '../../../shared/trace';
import { traceDesign, traceWarnings, type Spot, type TraceReport, type TracedWavelength } from '../../../features/trace/index';
import { micrometres, straighteningWords, tiltWords } from '../../../features/trace/image-quality-words';
import { scaleBar, spotWindow, toPx, type SpotWindow } from '../../../features/trace/spot-figure';
import type { SheetContext } from '../context';
import type { SheetSection } from '../section';
import { sheetColors, textSize, type SheetWriter, type TableColumn, type TableRow } from '../writer';

/**
 * The design sheet's image quality: the exact ray trace (features/trace) at the range's start,
 * centre and end and at the wavelengths the sheet was asked for, with the centre-height spot
 * diagram of each drawn as vector dots beside the exit slit to scale, a table of the traced
 * figures and the trace's warnings in words. Every design gets it; a trace that cannot run says
 * why instead of failing the sheet.
 */

/** Diagrams per row across the content column: start, centre, end and two picked on one row. */
const PER_ROW = 5;
/** Largest side of one spot diagram, pt. */
const MAX_SIDE_PT = 92;
/** Dots are drawn on a grid this many times finer than a point (half-point dots read as a cloud). */
const DOTS_PER_PT = 2;
const LABEL_PT = 12;
const SCALE_PT = 16;

/** The wavelengths the sheet traces beyond start, centre and end: the picked ones, as many as the trace takes. */
export function pickedWavelengthsNm(sheet: Pick<SheetContext, 'performance'>): number[] {
  return sheet.performance
    .filter((row) => row.label === 'Picked')
    .map((row) => row.point.wavelengthNm)
    .slice(0, TRACE_LIMITS.maxWavelengths);
}

/** The trace the section prints, or why there is none. Default rays: the workbench's figure. */
export function sheetTrace(params: Design, pickedNm: readonly number[]): { ok: true; report: TraceReport } | { ok: false; reason: string } {
  try {
    return { ok: true, report: traceDesign(params, pickedNm.length > 0 ? { atNm: [...pickedNm] } : {}) };
  } catch (error) {
    return { ok: false, reason: error instanceof Error ? error.message : String(error) };
  }
}

const ROLE_WORDS: Record<TracedWavelength['role'], string> = { start: 'start', centre: 'centre', end: 'end', asked: 'picked' };

/** "404.7 nm, picked": the same precision as the performance table's wavelengths. */
export function tracedLabel(w: Pick<TracedWavelength, 'wavelengthNm' | 'role'>): string {
  return `${formatQuantity(w.wavelengthNm, 'nm', 5)}, ${ROLE_WORDS[w.role]}`;
}

/** The figures at the precision the sheet prints them (shared by the table and its test). */
export const imageQualityCells = {
  rmsWidth: (w: TracedWavelength) => formatNumber(w.rmsWidthMm * 1000, 3),
  tracedFwhm: (w: TracedWavelength) => (w.tracedFwhmNm === null ? 'none' : formatNumber(w.tracedFwhmNm, 3)),
  slitLimited: (w: TracedWavelength) => formatNumber(w.slitLimitedFwhmNm, 3),
  sagitta: (w: TracedWavelength) => formatNumber(w.curvatureSagittaMm * 1000, 3),
  astigmatism: (w: TracedWavelength) => formatNumber(Math.abs(w.astigmatismMm), 3),
};

const numeric = { align: 'right' as const };

export const imageQualityColumns: TableColumn[] = [
  { header: 'Wavelength', width: 0.2 },
  { header: 'RMS width (µm)', width: 0.14, ...numeric },
  { header: 'Traced FWHM (nm)', width: 0.16, ...numeric },
  { header: 'Slit-limited (nm)', width: 0.18, ...numeric },
  { header: 'Sagitta (µm)', width: 0.17, ...numeric },
  { header: 'Astigmatism (mm)', width: 0.15, ...numeric },
];

/** One row per traced wavelength; one the mount cannot reach says so across its figures. */
export function imageQualityRows(report: TraceReport): TableRow[] {
  return report.wavelengths.map((w) => {
    if (!w.reachable) return { cells: [tracedLabel(w), 'out of reach', '—', '—', '—', '—'], marked: true };
    const c = imageQualityCells;
    return { cells: [tracedLabel(w), c.rmsWidth(w), c.tracedFwhm(w), c.slitLimited(w), c.sagitta(w), c.astigmatism(w)] };
  });
}

/** The centre-height spot (a point on the slit's middle), which the diagrams draw. */
export function centreSpot(w: TracedWavelength): Spot | null {
  return w.spots.find((spot) => spot.role === 'centre') ?? null;
}

/** What the aperture drawn beside the spot is: the exit slit, or one detector pixel for a spectrograph. */
function apertureOf(report: TraceReport): { widthMm: number; heightMm: number; words: string } {
  if (report.mode === 'spectrograph' && report.pixel) {
    return { widthMm: report.pixel.widthMm, heightMm: report.exitSlit.heightMm, words: 'one detector pixel' };
  }
  return { widthMm: report.exitSlit.widthMm, heightMm: report.exitSlit.heightMm, words: 'the exit slit' };
}

/**
 * A square per occupied dot cell, as `spotDots` (features/trace/spot-figure.ts) picks them for
 * the screen, written as PDF rectangles instead of its SVG path string: pdfkit parses the string
 * far slower than it writes `re` ops (this section alone, sample sheet, median CPU per build:
 * 159 ms with the path string, 108 ms with rectangles). Returns how many were added to the path.
 */
function drawDots(writer: SheetWriter, window: SpotWindow, spot: Spot): number {
  const size = Math.max(1, Math.round(window.sizePx));
  const seen = new Uint8Array(size * size);
  let dots = 0;
  for (let i = 0; i < spot.x.length; i += 1) {
    const { px, py } = toPx(window, spot.x[i]!, spot.y[i]!);
    const col = Math.floor(px);
    const row = Math.floor(py);
    if (!(col >= 0 && col < size && row >= 0 && row < size) || seen[row * size + col]) continue;
    seen[row * size + col] = 1;
    writer.doc.rect(col, row, 1, 1);
    dots += 1;
  }
  return dots;
}

/**
 * One spot diagram in a `side`-point square at (x, y): frame, aperture tint and edges, dots, scale
 * bar. `halfMm` sets the scale (half the square's side in the image plane); by default the spot's
 * own window (features/trace/spot-figure.ts), so the compare sheet can draw two at one scale.
 */
export function drawSpotDiagram(
  writer: SheetWriter,
  spot: Spot,
  aperture: { widthMm: number; heightMm: number },
  at: { x: number; y: number; side: number },
  halfMm?: number,
): void {
  const { doc } = writer;
  const sizePx = at.side * DOTS_PER_PT;
  const own = spotWindow(spot.x, spot.y, spot.centroidMm, { centreXMm: 0, widthMm: aperture.widthMm }, sizePx);
  const window = halfMm === undefined ? own : { ...own, halfMm };
  const clamp = (v: number) => Math.min(sizePx, Math.max(0, v));
  const leftEdge = toPx(window, -aperture.widthMm / 2, aperture.heightMm / 2);
  const rightEdge = toPx(window, aperture.widthMm / 2, -aperture.heightMm / 2);
  doc.save();
  doc.translate(at.x, at.y).scale(1 / DOTS_PER_PT);
  doc.rect(0, 0, sizePx, sizePx).lineWidth(0.6 * DOTS_PER_PT).strokeColor(sheetColors.line).stroke();
  const [x0, x1, y0, y1] = [clamp(leftEdge.px), clamp(rightEdge.px), clamp(leftEdge.py), clamp(rightEdge.py)];
  if (x1 > x0 && y1 > y0) {
    doc.rect(x0, y0, x1 - x0, y1 - y0).fillOpacity(0.12).fill(sheetColors.primary);
    doc.fillOpacity(1);
    for (const edge of [leftEdge.px, rightEdge.px]) {
      if (edge > 0 && edge < sizePx) doc.moveTo(edge, y0).lineTo(edge, y1).lineWidth(0.8 * DOTS_PER_PT).strokeColor(sheetColors.primary).stroke();
    }
  }
  if (drawDots(writer, window, spot) > 0) doc.fill(sheetColors.ink);
  doc.restore();
  // The scale bar under the square, its length in the diagram's own scale.
  const bar = scaleBar(window);
  const barPt = bar.lengthPx / DOTS_PER_PT;
  const barY = at.y + at.side + 5;
  doc.moveTo(at.x, barY).lineTo(at.x + barPt, barY).lineWidth(1).strokeColor(sheetColors.ink).stroke();
  writer.use('regular', textSize.small).doc.fillColor(sheetColors.muted).text(bar.label, at.x + barPt + 4, barY - 3.5, { lineBreak: false });
  doc.fillColor(sheetColors.ink);
}

/** Room a diagram takes under its square for the scale bar, pt. */
export const SPOT_SCALE_PT = SCALE_PT;

/** The spot diagrams, `PER_ROW` to a row, each under its wavelength's label. */
function drawSpotGrid(writer: SheetWriter, report: TraceReport): void {
  const cellWidth = writer.contentWidth / PER_ROW;
  const side = Math.min(MAX_SIDE_PT, cellWidth - 16);
  const rowHeight = LABEL_PT + side + SCALE_PT;
  const { doc } = writer;
  for (let start = 0; start < report.wavelengths.length; start += PER_ROW) {
    const row = report.wavelengths.slice(start, start + PER_ROW);
    const box = writer.box(rowHeight);
    const cursor = { x: doc.x, y: doc.y };
    row.forEach((w, i) => {
      const x = box.x + i * cellWidth;
      writer.use('semibold', textSize.small).doc.fillColor(sheetColors.ink).text(tracedLabel(w), x, box.y, { width: cellWidth - 4, lineBreak: false });
      const spot = w.reachable ? centreSpot(w) : null;
      if (!spot || spot.x.length === 0) {
        writer.use('regular', textSize.small).doc.fillColor(sheetColors.muted).text(w.reachable ? 'no rays arrive' : 'out of reach', x, box.y + LABEL_PT + side / 2, { width: side, align: 'center', lineBreak: false });
        return;
      }
      drawSpotDiagram(writer, spot, apertureOf(report), { x, y: box.y + LABEL_PT, side });
    });
    doc.fillColor(sheetColors.ink);
    doc.x = cursor.x;
    doc.y = cursor.y;
  }
}

/** What the diagrams show, in words: the source point, the plane, the axes and the aperture. */
export function spotCaption(report: TraceReport): string {
  const aperture = apertureOf(report);
  return (
    `Exact ray trace, ${formatInteger(report.raysPerWavelength)} rays per wavelength, to ${report.imagePlane}. ` +
    `Each diagram: the rays from the middle of the entrance slit where they cross the image plane ` +
    `(across: the dispersion, longer wavelengths to the right; up: along the slit), with ${aperture.words} ` +
    `(${micrometres(aperture.widthMm)} wide) shaded to the same scale.`
  );
}

/** The trace's warnings, then its straightening and tilt findings, in words. */
export function findingLines(report: TraceReport): { text: string; warning: boolean }[] {
  const warnings = traceWarnings(report).map((w) => ({ text: w.message, warning: true }));
  const lines = warnings.length > 0 ? warnings : [{ text: 'The trace finds nothing the first-order figures miss.', warning: false }];
  lines.push({ text: straighteningWords(report), warning: false });
  if (report.detectorTilt) lines.push({ text: tiltWords(report.detectorTilt), warning: false });
  return lines;
}

export const imageQualitySection: SheetSection = {
  id: 'image-quality',
  title: 'Image quality',
  draw(writer, sheet) {
    const traced = sheetTrace(sheet.params, pickedWavelengthsNm(sheet));
    const size = textSize.small;
    writer.sectionHeading(this.title, 170);
    if (!traced.ok) {
      writer.paragraph(`The ray trace could not run: ${traced.reason}.`, { color: sheetColors.muted });
      return;
    }
    const { report } = traced;
    writer.paragraph(spotCaption(report), { size, color: sheetColors.muted });
    drawSpotGrid(writer, report);
    writer.table(imageQualityColumns, imageQualityRows(report), { size });
    writer.paragraph(
      'RMS width: of the spot from the slit’s middle, along the dispersion. Traced FWHM: the half-maximum width of the traced line shape ' +
        '(the whole entrance slit scanned across the exit slit), beside the slit-limited FWHM. Sagitta: how far the image of the slit’s ends bows from its middle. ' +
        'Astigmatism: the gap between the tangential and sagittal foci along the chief ray.',
      { size, color: sheetColors.muted },
    );
    for (const line of findingLines(report)) {
      writer.paragraph(line.text, { size, color: line.warning ? sheetColors.warning : sheetColors.ink, gapAfter: 2 });
    }
  },
};
