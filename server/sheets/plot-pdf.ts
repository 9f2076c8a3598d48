import { scaleLinear, type ScaleLinear } from 'd3-scale';
import {
  axisTitleOf,
  labelWidthPx,
  sharesAxis,
  valueScale,
  valueTicks,
  type AxisSeries,
} from '../../features/plots/axes';
import { linePath, type Interval, type Values } from '../../features/plots/plot-paths';
import { colors } from '../../features/ui/theme';
import { sheetColors, textSize, type SheetFont, type SheetWriter } from './writer';

/**
 * A wavelength plot as PDF vectors, laid out as the app's line plot (features/plots): the same
 * value scales and ticks (axes.ts), the same line with gaps where a value is missing
 * (plot-paths.ts `linePath`), the same shaded intervals, a second series on a right-hand axis of
 * its own. Sizes are points; the page's y runs down, as the app's SVG.
 */

export type PdfPlotSeries = AxisSeries & {
  /** Short name, for the key ("Bandpass", "R"). */
  label: string;
  values: Values;
  color: string;
  /** Dash pattern, pt (on, off). */
  dash?: [number, number];
};

export type PdfPlot = {
  title: string;
  /** Ascending wavelengths (x), nm. */
  wavelengthsNm: readonly number[];
  series: PdfPlotSeries;
  secondSeries?: PdfPlotSeries;
  shaded?: readonly Interval[];
  /** What the shading means, keyed under the title when anything is shaded. */
  shadedLabel?: string;
  /** Printed in the plot area when the series has no value at all. */
  emptyMessage?: string;
  /** Where the figure stops holding, under the plot in the warning colour. */
  caution?: string | null;
  /** Small print under the plot: what the figure assumes. */
  caption?: string;
};

const TICK_PT = 6.5;
const AXIS_TITLE_PT = 7;
const TICK_GAP_PT = 3.5;
/** Band along a value axis that holds its rotated title. */
const TITLE_BAND_PT = AXIS_TITLE_PT + 4;
/** Room right of the last x tick label when there is no right-hand axis. */
const MIN_SIDE_PT = 10;
/** Plot area (axes and lines) height, pt. */
export const PLOT_AREA_PT = 112;
/** Below the plot area: x tick labels, then the x axis title. */
const X_AXIS_PT = TICK_PT + AXIS_TITLE_PT + 12;
const KEY_PT = 10;
const CAPTION_GAP_PT = 3;

type Part = { text: string; font: SheetFont; size: number; color: string };
type Key = { label: string; swatch: 'line' | 'shade'; series?: PdfPlotSeries };

/**
 * The key lines under the title: both lines of a two-series plot (on paper the colours may not
 * survive a grey printer, the dash does), and the shading when anything is shaded.
 */
function headerKeys(plot: PdfPlot): { keys: Key[] } {
  const keys: Key[] = [];
  if (plot.secondSeries) {
    keys.push({ label: axisTitleOf(plot.series), swatch: 'line', series: plot.series });
    keys.push({ label: axisTitleOf(plot.secondSeries), swatch: 'line', series: plot.secondSeries });
  }
  if (plot.shadedLabel && plot.shaded && plot.shaded.length > 0)
    keys.push({ label: plot.shadedLabel, swatch: 'shade' });
  return { keys };
}

function footerParts(plot: PdfPlot): Part[] {
  const parts: Part[] = [];
  if (plot.caution)
    parts.push({ text: plot.caution, font: 'semibold', size: textSize.small, color: sheetColors.warning });
  if (plot.caption)
    parts.push({ text: plot.caption, font: 'regular', size: textSize.small, color: sheetColors.muted });
  return parts;
}

/** Height of the title and keys above the plot area at `width`, pt. */
export function plotHeaderHeight(writer: SheetWriter, plot: PdfPlot, width: number): number {
  return (
    writer.measure(plot.title, 'semibold', textSize.body, width) +
    3 +
    headerKeys(plot).keys.length * KEY_PT +
    4
  );
}

/**
 * Height the plot takes at `width`: title and keys (or `headerPt`, when plots side by side share
 * one header height so their axes line up), plot area with its axes, caution and caption.
 */
export function linePlotHeight(writer: SheetWriter, plot: PdfPlot, width: number, headerPt?: number): number {
  const footer = footerParts(plot).reduce(
    (h, p) => h + writer.measure(p.text, p.font, p.size, width) + CAPTION_GAP_PT,
    0,
  );
  return (headerPt ?? plotHeaderHeight(writer, plot, width)) + PLOT_AREA_PT + X_AXIS_PT + footer;
}

type Frame = {
  x: ScaleLinear<number, number>;
  y: ScaleLinear<number, number>;
  yTicks: { values: number[]; labels: string[] };
  y2: ScaleLinear<number, number> | null;
  y2Ticks: { values: number[]; labels: string[] } | null;
  left: number;
  right: number;
  top: number;
  bottom: number;
};

/** Scales first, then margins, as the app lays its plot out: the tick labels set the axes' room. */
function layoutFrame(plot: PdfPlot, box: { x: number; y: number; width: number }): Frame {
  const top = box.y;
  const bottom = box.y + PLOT_AREA_PT;
  const { series, secondSeries } = plot;
  const shared = secondSeries !== undefined && sharesAxis(series, secondSeries);
  const y = valueScale(shared ? [series, secondSeries] : [series], top, bottom);
  const yTicks = valueTicks(y, series.tickFormat);
  const y2 = secondSeries && !shared ? valueScale([secondSeries], top, bottom) : null;
  const y2Ticks = y2 ? valueTicks(y2, secondSeries?.tickFormat) : null;
  const margin = (labels: readonly string[]) =>
    TITLE_BAND_PT + labelWidthPx(labels, TICK_PT) + TICK_GAP_PT + 2;
  const left = box.x + margin(yTicks.labels);
  const right = box.x + box.width - (y2Ticks ? margin(y2Ticks.labels) : MIN_SIDE_PT);
  const xs = plot.wavelengthsNm;
  const first = xs[0] ?? 0;
  const last = xs[xs.length - 1] ?? first + 1;
  const x = scaleLinear()
    .domain([first, last > first ? last : first + 1])
    .range([left, right]);
  return { x, y, yTicks, y2, y2Ticks, left, right, top, bottom };
}

/**
 * Draws `plot` across `width` from (x, y) — the caller has reserved `linePlotHeight` there, with
 * the same `headerPt` — and leaves pdfkit's cursor where it found it.
 */
export function drawLinePlot(
  writer: SheetWriter,
  plot: PdfPlot,
  at: { x: number; y: number; width: number; headerPt?: number },
): void {
  const { doc } = writer;
  const cursor = { x: doc.x, y: doc.y };
  let y = at.y;
  writer
    .use('semibold', textSize.body)
    .doc.fillColor(sheetColors.ink)
    .text(plot.title, at.x, y, { width: at.width });
  y += writer.measure(plot.title, 'semibold', textSize.body, at.width) + 3;
  for (const key of headerKeys(plot).keys) {
    drawKey(writer, key, at.x, y);
    y += KEY_PT;
  }
  y = at.y + (at.headerPt ?? plotHeaderHeight(writer, plot, at.width));
  const frame = layoutFrame(plot, { x: at.x, y, width: at.width });
  drawBody(writer, plot, frame, at);
  y = frame.bottom + X_AXIS_PT;
  for (const part of footerParts(plot)) {
    writer.use(part.font, part.size).doc.fillColor(part.color).text(part.text, at.x, y, { width: at.width });
    y += writer.measure(part.text, part.font, part.size, at.width) + CAPTION_GAP_PT;
  }
  doc.fillColor(sheetColors.ink);
  doc.x = cursor.x;
  doc.y = cursor.y;
}

function drawKey(writer: SheetWriter, key: Key, x: number, y: number): void {
  const { doc } = writer;
  const mid = y + KEY_PT / 2 - 1;
  doc.save();
  if (key.swatch === 'shade') {
    doc
      .rect(x, mid - 3.5, 14, 7)
      .lineWidth(0.5)
      .fillAndStroke(colors.warningSoft, sheetColors.line);
  } else if (key.series) {
    stroke(writer, `M${x},${mid}H${x + 14}`, key.series.color, 1.3, key.series.dash);
  }
  doc.restore();
  label(writer, key.label, x + 18, mid + TICK_PT * 0.35, {
    font: 'regular',
    size: AXIS_TITLE_PT,
    color: sheetColors.muted,
  });
}

function drawBody(writer: SheetWriter, plot: PdfPlot, frame: Frame, at: { x: number; width: number }): void {
  const { doc } = writer;
  const { x, y, y2, yTicks, y2Ticks, left, right, top, bottom } = frame;
  const { series, secondSeries } = plot;
  doc.save();
  doc.rect(left, top, right - left, bottom - top).fill(colors.surface);
  for (const iv of plot.shaded ?? []) {
    const a = Math.max(left, x(iv.startNm));
    const b = Math.min(right, x(iv.endNm));
    if (b > a) doc.rect(a, top, b - a, bottom - top).fill(colors.warningSoft);
  }
  doc.restore();
  const grid = yTicks.values.map((t) => `M${left},${y(t)}H${right}`).join('');
  if (grid) stroke(writer, grid, sheetColors.line, 0.5);
  stroke(writer, `M${left},${top}V${bottom}H${right}${y2 ? `V${top}` : ''}`, sheetColors.muted, 0.6);
  const xTicks = x.ticks(Math.max(2, Math.floor((right - left) / 48)));
  const xFormat = x.tickFormat(xTicks.length);
  let marks =
    xTicks.map((t) => `M${x(t)},${bottom}v2.5`).join('') +
    yTicks.values.map((t) => `M${left},${y(t)}h-2.5`).join('');
  if (y2 && y2Ticks) marks += y2Ticks.values.map((t) => `M${right},${y2(t)}h2.5`).join('');
  stroke(writer, marks, sheetColors.muted, 0.6);

  const d = linePath(plot.wavelengthsNm, series.values, x, y);
  const d2 = secondSeries ? linePath(plot.wavelengthsNm, secondSeries.values, x, y2 ?? y) : '';
  if (d2 && secondSeries) stroke(writer, d2, secondSeries.color, 1.1, secondSeries.dash);
  if (d) stroke(writer, d, series.color, 1.4, series.dash);

  const tick = { font: 'mono' as const, size: TICK_PT, color: sheetColors.muted };
  for (const t of xTicks) {
    // A label at the right end would spill past the plot: end it at its tick instead.
    const anchor = !y2 && x(t) > right - 12 ? 'end' : 'middle';
    label(writer, xFormat(t), x(t), bottom + 3 + TICK_PT, { ...tick, anchor });
  }
  yTicks.values.forEach((t, i) =>
    label(writer, yTicks.labels[i] ?? '', left - TICK_GAP_PT, y(t) + TICK_PT * 0.35, {
      ...tick,
      anchor: 'end',
    }),
  );
  if (y2 && y2Ticks && secondSeries) {
    y2Ticks.values.forEach((t, i) =>
      label(writer, y2Ticks.labels[i] ?? '', right + TICK_GAP_PT, y2(t) + TICK_PT * 0.35, {
        ...tick,
        color: secondSeries.color,
      }),
    );
  }
  const axisTitle = { font: 'regular' as const, size: AXIS_TITLE_PT, anchor: 'middle' as const };
  label(writer, 'Wavelength (nm)', (left + right) / 2, bottom + X_AXIS_PT - 4, {
    ...axisTitle,
    color: sheetColors.ink,
  });
  const midY = (top + bottom) / 2;
  // Turned titles: their glyphs rise from the baseline towards the plot's outer edge.
  // One axis for two lines: its title belongs to both, so it takes neither line's colour.
  const yTitleColor = secondSeries && !y2 ? sheetColors.ink : series.color;
  label(writer, axisTitleOf(series), at.x + AXIS_TITLE_PT, midY, {
    ...axisTitle,
    color: yTitleColor,
    rotate: -90,
  });
  if (secondSeries && y2) {
    label(writer, axisTitleOf(secondSeries), at.x + at.width - AXIS_TITLE_PT, midY, {
      ...axisTitle,
      color: secondSeries.color,
      rotate: 90,
    });
  }
  if (!d && plot.emptyMessage) {
    label(writer, plot.emptyMessage, (left + right) / 2, midY, {
      font: 'regular',
      size: textSize.body,
      color: sheetColors.muted,
      anchor: 'middle',
    });
  }
}

function stroke(writer: SheetWriter, d: string, color: string, width: number, dash?: [number, number]): void {
  const { doc } = writer;
  doc.save();
  doc.path(d).lineWidth(width).lineJoin('round').lineCap('butt');
  if (dash) doc.dash(dash[0], { space: dash[1] });
  doc.stroke(color);
  doc.undash();
  doc.restore();
}

/** One line of text with its baseline at `y`, anchored as SVG anchors it, optionally turned about (x, y). */
function label(
  writer: SheetWriter,
  text: string,
  x: number,
  y: number,
  options: {
    font: SheetFont;
    size: number;
    color: string;
    anchor?: 'start' | 'middle' | 'end';
    rotate?: number;
  },
): void {
  const { doc } = writer;
  writer.use(options.font, options.size);
  const width = doc.widthOfString(text);
  const dx = options.anchor === 'middle' ? -width / 2 : options.anchor === 'end' ? -width : 0;
  doc.save();
  if (options.rotate) doc.rotate(options.rotate, { origin: [x, y] });
  doc.fillColor(options.color).text(text, x + dx, y, { lineBreak: false, baseline: 'alphabetic' });
  doc.restore();
}
