import { OVERLAP_SHADE_LABEL, scalarBlazeCaution } from '../../../features/plots/captions';
import { performanceSeries } from '../../../features/plots/series';
import { colors } from '../../../features/ui/theme';
import { drawLinePlot, linePlotHeight, plotHeaderHeight, type PdfPlot } from '../plot-pdf';
import type { SheetSection } from '../section';
import type { SheetContext } from '../context';

/** Gap between the two plots of a row, and between rows, pt. */
const COLUMN_GAP_PT = 18;
const ROW_GAP_PT = 12;

const NO_VALUE = 'No wavelength in the range is reachable';

/**
 * The workbench's four plots of the sweep, worded and coloured as the app draws them
 * (features/plots/components/performance-plots.tsx): dispersion, bandpass with R, blaze
 * efficiency with the overlapping-order shading and the scalar-model caution, and the scan curve.
 */
export function sheetPlots(evaluation: SheetContext['evaluation']): PdfPlot[] {
  const data = performanceSeries(evaluation.points);
  const xs = data.wavelengthsNm;
  return [
    {
      title: 'Reciprocal dispersion',
      wavelengthsNm: xs,
      series: {
        label: 'Reciprocal dispersion',
        unit: 'nm/mm',
        values: data.reciprocalDispersionNmPerMm,
        color: colors.primary,
      },
      emptyMessage: NO_VALUE,
    },
    {
      title: 'Bandpass and resolving power',
      wavelengthsNm: xs,
      series: {
        label: 'Bandpass',
        unit: 'nm',
        axisTitle: 'bandpass, nm',
        values: data.bandpassNm,
        color: colors.primary,
      },
      secondSeries: {
        label: 'R',
        unit: '',
        axisTitle: 'resolving power R',
        values: data.resolvingPower,
        color: colors.accent,
        dash: [4, 2],
        tickFormat: '~s',
      },
      emptyMessage: NO_VALUE,
    },
    {
      title: 'Blaze efficiency',
      wavelengthsNm: xs,
      series: {
        label: 'Efficiency',
        unit: '',
        axisTitle: 'relative to peak',
        values: data.blazeEfficiency,
        color: colors.ok,
        domain: [0, 1],
        tickFormat: '.0%',
      },
      shaded: data.overlapIntervals,
      shadedLabel: OVERLAP_SHADE_LABEL,
      emptyMessage: 'Give a blaze wavelength to see the efficiency',
      caution: scalarBlazeCaution(evaluation)?.text ?? null,
    },
    {
      title: 'Grating rotation (scan curve)',
      wavelengthsNm: xs,
      series: {
        label: 'Rotation',
        unit: '°',
        axisTitle: 'rotation φ, °',
        values: data.gratingRotationDeg,
        color: colors.primary,
      },
      emptyMessage: NO_VALUE,
    },
  ];
}

/** Counts the sweep's wavelengths without a value, for the line under the heading. */
function unreachableCount(evaluation: SheetContext['evaluation']): number {
  return evaluation.points.filter((p) => p.gratingRotationDeg === null).length;
}

/** The four plots, two to a row; a row never splits across pages. */
export const plotsSection: SheetSection = {
  id: 'plots',
  title: 'Plots',
  draw(writer, sheet) {
    const plots = sheetPlots(sheet.evaluation);
    const width = (writer.contentWidth - COLUMN_GAP_PT) / 2;
    const rows = [plots.slice(0, 2), plots.slice(2, 4)];
    // Plots side by side share a header height, so their plot areas line up.
    const headerOf = (row: PdfPlot[]) =>
      Math.max(...row.map((plot) => plotHeaderHeight(writer, plot, width)));
    const rowHeight = (row: PdfPlot[]) =>
      Math.max(...row.map((plot) => linePlotHeight(writer, plot, width, headerOf(row))));
    const missing = unreachableCount(sheet.evaluation);
    const note =
      missing > 0
        ? `${missing} of ${sheet.evaluation.points.length} wavelengths of the sweep are out of reach: the lines break there.`
        : null;
    writer.sectionHeading(this.title, rowHeight(rows[0] ?? []) + (note ? 14 : 0));
    if (note) writer.paragraph(note, { gapAfter: 6 });
    rows.forEach((row, i) => {
      if (i > 0) writer.gap(ROW_GAP_PT);
      const box = writer.box(rowHeight(row));
      const headerPt = headerOf(row);
      row.forEach((plot, j) =>
        drawLinePlot(writer, plot, { x: box.x + j * (width + COLUMN_GAP_PT), y: box.y, width, headerPt }),
      );
    });
  },
};
