import type { Design } from '../../../shared/design';
import { formatFixed, formatNumber, formatQuantity } from '../../../shared/format';
import { UM_PER_MM, type WavelengthPoint } from '../../../features/solver/index';
import type { SheetSection } from '../section';
import { overlapsText, spanTable, spanTableHeight, type SpanTableRow } from '../sheet-text';
import { margins, sheetColors, textSize, type TableColumn } from '../writer';

/**
 * Slit-limited bandpass over the width one pixel covers, `Δλ / (RLD × pitch)`: how many pixels
 * one bandpass spans on a detector in the exit plane. Null without a detector or an angle.
 */
export function pixelsPerBandpass(point: WavelengthPoint, detector: Design['detector']): number | null {
  if (!detector || point.bandpassNm === null || point.reciprocalDispersionNmPerMm === null) return null;
  return point.bandpassNm / (point.reciprocalDispersionNmPerMm * (detector.pixelPitchUm / UM_PER_MM));
}

/**
 * The figures of one row, with the read-out card's significant figures (features/workbench/
 * components/readout-card.tsx): rotation 5, dispersion and bandpass 4, resolving power 3; the
 * efficiency as a whole percentage, as `formatPercent` rounds it. Units live in the headers, so
 * each cell is a plain number.
 */
function figures(point: WavelengthPoint, { grating, detector }: Design): string[] {
  const cells = [
    formatNumber(point.gratingRotationDeg, 5),
    formatNumber(point.reciprocalDispersionNmPerMm),
    formatNumber(point.bandpassNm),
    formatNumber(point.resolvingPower, 3),
    point.blazeEfficiency === null ? '—' : formatFixed(point.blazeEfficiency * 100, 0),
    overlapsText(point, grating.order),
  ];
  if (detector) cells.push(formatNumber(pixelsPerBandpass(point, detector), 3));
  return cells;
}

/**
 * The design at the range's start, centre and end and at the wavelengths the request picked
 * (`?at=`): rotation, reciprocal linear dispersion, bandpass, resolving power, blaze efficiency,
 * the other orders at the same angle and, with a detector, pixels per bandpass. A wavelength no
 * grating angle reaches gives the solver's reason across its row instead of numbers.
 */
export const performanceSection: SheetSection = {
  id: 'performance',
  title: 'Performance across the range',
  draw(writer, sheet) {
    const { detector, grating } = sheet.params;
    const numeric = { align: 'right' as const };
    const columns: TableColumn[] = [
      { header: 'Point', width: 0.1 },
      { header: 'λ\n(nm)', width: 0.07, ...numeric },
      { header: 'Rotation\nφ (°)', width: 0.09, ...numeric },
      { header: 'RLD\n(nm/mm)', width: 0.09, ...numeric },
      { header: 'Bandpass\n(nm)', width: 0.1, ...numeric },
      { header: 'R\n(λ/Δλ)', width: 0.08, ...numeric },
      { header: 'Blaze\neff. (%)', width: 0.08, ...numeric },
      { header: 'Other orders at this angle', width: detector ? 0.27 : 0.39 },
      ...(detector ? [{ header: 'Pixels per\nbandpass', width: 0.12, ...numeric }] : []),
    ];
    const rows: SpanTableRow[] = sheet.performance.map(({ label, point }) => {
      const lead = [label, formatNumber(point.wavelengthNm, 5)];
      if (point.reachable) return { cells: [...lead, ...figures(point, sheet.params)] };
      return {
        cells: lead,
        marked: true,
        span: { from: 2, text: `Cannot be reached: ${point.reason ?? 'no grating angle delivers it'}`, font: 'semibold', color: sheetColors.danger },
      };
    });
    const notes = [
      'RLD: reciprocal linear dispersion at the exit plane. Bandpass: slit-limited FWHM. R: resolving power, ' +
        'with the slit and diffraction widths added in quadrature. Blaze efficiency: scalar estimate of the blaze ' +
        'envelope relative to its peak; it ignores polarisation and groove shape, so take throughput from the ' +
        'grating maker’s measured curves.',
    ];
    if (grating.blazeWavelengthNm === undefined) notes.push('No blaze wavelength is set, so there is no efficiency estimate.');
    if (detector) {
      const coverage = sheet.evaluation.design.detector;
      notes.push(
        `Pixels per bandpass: bandpass ÷ (RLD × ${formatQuantity(detector.pixelPitchUm, 'µm', 12)} pixel pitch).` +
          (coverage
            ? ` Without an exit slit the detector sees the entrance-slit image or the diffraction-limited line: ` +
              `${formatNumber(coverage.pixelsPerResolutionElement, 3)} pixels per resolution element at the fewest over the range ` +
              '(under 2 undersamples).'
            : ''),
      );
    } else {
      notes.push('No detector is set (a scanning monochromator), so pixels per bandpass does not apply.');
    }
    const legend = notes.join('\n');
    const size = textSize.small;
    const legendHeight = writer.measure(legend, 'regular', size);
    // The heading keeps the table and the legend's first lines with it while they fit a page (a handful of rows always does).
    const keepWith = spanTableHeight(writer, columns, rows, { size }) + 6 + Math.min(legendHeight, 3 * size * 1.25);
    writer.sectionHeading(this.title, Math.min(keepWith, writer.bottom - margins.top - 60));
    spanTable(writer, columns, rows, { size });
    writer.gap(6);
    writer.paragraph(legend, { size, color: sheetColors.muted });
  },
};
