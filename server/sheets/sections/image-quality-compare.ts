import type { Design } from '../../../shared/design';
import { formatInteger, formatQuantity } from '../../../shared/format';
import { centreWavelengthSpot, sharedSpotWindows, spotChangeWords, type ComparedSpot } from '../../../features/notebooks/compare-spots';
import { traceDesign } from '../../../features/trace/index';
import type { CompareSheetSection } from '../section';
import { sheetColors, textSize } from '../writer';
import { SPOT_SCALE_PT, drawSpotDiagram } from './image-quality';

/**
 * The compare sheet's spot diagrams: each version traced exactly (default rays) and its spot from
 * the middle of the entrance slit at its own range centre drawn beside the other's, both at one
 * scale with the exit slit to that scale, each version's figures under its square and the change
 * in words. A version the trace cannot answer for says why in its place.
 */

/** Largest side of each square, pt: two across the column with room between them. */
const MAX_SIDE_PT = 170;
const LABEL_PT = 13;
const FIGURES_PT = 24;

function tracedSpot(params: Design): ComparedSpot & { rays?: number } {
  try {
    const report = traceDesign(params);
    return { ...centreWavelengthSpot(report), rays: report.raysPerWavelength };
  } catch (error) {
    return { ok: false, reason: `the ray trace could not run: ${error instanceof Error ? error.message : String(error)}` };
  }
}

/** "RMS width 51.2 µm · traced FWHM 0.412 nm (slit-limited 0.276 nm)". */
export function spotFiguresText(spot: Extract<ComparedSpot, { ok: true }>): string {
  const w = spot.wavelength;
  const traced = w.tracedFwhmNm === null ? 'no traced FWHM' : `traced FWHM ${formatQuantity(w.tracedFwhmNm, 'nm', 3)}`;
  return `RMS width ${formatQuantity(w.rmsWidthMm * 1000, 'µm', 3)} · ${traced} (slit-limited ${formatQuantity(w.slitLimitedFwhmNm, 'nm', 3)})`;
}

export const compareSpotsSection: CompareSheetSection = {
  id: 'compare-spots',
  title: 'Spot diagrams at the centre wavelength',
  draw(writer, sheet) {
    const sides = [
      { version: sheet.a.version, spot: tracedSpot(sheet.a.params), exitHeightMm: sheet.a.params.slits.heightMm },
      { version: sheet.b.version, spot: tracedSpot(sheet.b.params), exitHeightMm: sheet.b.params.slits.heightMm },
    ];
    const cellWidth = writer.contentWidth / 2;
    const side = Math.min(MAX_SIDE_PT, cellWidth - 24);
    const caption =
      'Exact ray trace of each version: the rays from the middle of its entrance slit at the centre of its range, where they ' +
      'cross the image plane (across: the dispersion, longer wavelengths to the right; up: along the slit), with its exit slit ' +
      'shaded. Both squares are at one scale.';
    const height = LABEL_PT + side + SPOT_SCALE_PT + FIGURES_PT;
    writer.sectionHeading(this.title, writer.measure(caption, 'regular', textSize.small) + height + 30);
    writer.paragraph(caption, { size: textSize.small, color: sheetColors.muted });
    const drawn = sides.flatMap((s) => (s.spot.ok ? [{ spot: s.spot.spot, aperture: s.spot.aperture }] : []));
    const halfMm = drawn.length > 0 ? sharedSpotWindows(drawn, side)[0]!.halfMm : undefined;
    const box = writer.box(height);
    const { doc } = writer;
    const cursor = { x: doc.x, y: doc.y };
    sides.forEach(({ version, spot, exitHeightMm }, i) => {
      const x = box.x + i * cellWidth;
      const label = spot.ok
        ? `v${version.number} (${i === 0 ? 'before' : 'after'}), ${formatQuantity(spot.wavelength.wavelengthNm, 'nm', 5)}`
        : `v${version.number} (${i === 0 ? 'before' : 'after'})`;
      writer.use('semibold', textSize.body).doc.fillColor(sheetColors.ink).text(label, x, box.y, { width: cellWidth - 8, lineBreak: false });
      if (!spot.ok) {
        writer.use('regular', textSize.small).doc.fillColor(sheetColors.muted).text(`No spot: ${spot.reason}.`, x, box.y + LABEL_PT + side / 2, { width: cellWidth - 12 });
        return;
      }
      drawSpotDiagram(writer, spot.spot, { widthMm: spot.aperture.widthMm, heightMm: exitHeightMm }, { x, y: box.y + LABEL_PT, side }, halfMm);
      writer.use('regular', textSize.small).doc.fillColor(sheetColors.ink).text(spotFiguresText(spot), x, box.y + LABEL_PT + side + SPOT_SCALE_PT + 2, { width: cellWidth - 12 });
    });
    doc.fillColor(sheetColors.ink);
    doc.x = cursor.x;
    doc.y = cursor.y;
    const [a, b] = sides.map((s) => s.spot);
    if (a?.ok && b?.ok) {
      writer.paragraph(`From v${sheet.a.version.number} to v${sheet.b.version.number}: ${spotChangeWords(a.wavelength, b.wavelength)}.`, { font: 'semibold' });
    }
    const rays = sides.map((s) => s.spot.rays).find((n) => n !== undefined);
    if (rays !== undefined) writer.paragraph(`${formatInteger(rays)} rays per wavelength.`, { size: textSize.small, color: sheetColors.muted });
  },
};
