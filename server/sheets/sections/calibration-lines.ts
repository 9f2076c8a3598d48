import type { Design } from '../../../shared/design';
import { formatInteger, formatPercent, formatQuantity, withUnit } from '../../../shared/format';
import { LAMP_ELEMENTS, LAMP_LINES_SOURCE } from '../../../shared/lamp-lines';
import {
  RESOLUTION_CRITERION,
  calibrationReport,
  type CalibrationLine,
  type CalibrationReport,
} from '../../../features/solver/index';
import {
  blockingFilterNumbers,
  coverageSentences,
  lineNm,
  lineSource,
  placementCell,
  resolvedPairsSentence,
} from '../../../features/calibration/calibration-words';
import { designCalibrationLines, designLineListNames } from '../../../features/calibration/design-lines';
import { cautionClosingLine, mercuryLampCautions } from '../../../features/calibration/lamp-caution';
import type { SheetContext } from '../context';
import type { SheetSection } from '../section';
import { sheetColors, textSize, type TableColumn, type TableRow } from '../writer';

/**
 * The design sheet's calibration lines: the built-in lamp lines and the design's own line lists
 * (its `line-list` curves) that fall in its range, with their bandpass and detector pixel; the
 * neighbouring pairs it cannot separate; lines that reach the range through another order
 * (ghosts), blocked by its filters or not; how well the lines cover the detector and how closely
 * a cubic follows its dispersion. Printed for a design whose range holds a line or a ghost of one.
 * The words are the calibration card's (features/calibration), so screen and paper agree; the
 * sheet checks every built-in lamp, since a design does not store which lamps the bench has.
 */

/** Rows a table prints before "… and N more": the sheet is for reading, the app lists them all. */
export const MAX_SHEET_ROWS = 30;

/** Every line the design is checked against: all five built-in lamps and its own line lists, in air. */
export function designLines(params: Design): CalibrationLine[] {
  return designCalibrationLines(params, LAMP_ELEMENTS);
}

/** The design's report, against `designLines`. */
export function sheetCalibration(params: Design): CalibrationReport {
  return calibrationReport(params, designLines(params));
}

/** Where this section applies: a line inside the range, or a line seen there through another order. */
export function calibrationApplies(sheet: Pick<SheetContext, 'params'>): boolean {
  const report = sheetCalibration(sheet.params);
  return report.linesInRangeCount > 0 || report.ghostCount > 0;
}

/** A line's wavelength as its list gives it (the card's `lineNm`: up to seven figures, never padded), with its unit. */
const airNm = (nm: number) => withUnit(lineNm(nm), 'nm');

/** "… and 12 more." when a list is cut; null when it is not. */
export function moreText(listed: number, total: number, what: string): string | null {
  return total > listed ? `… and ${formatInteger(total - listed)} more ${what} (the app lists them all).` : null;
}

const numeric = { align: 'right' as const };

export function lineColumns(hasDetector: boolean): TableColumn[] {
  return [
    { header: 'Line', width: hasDetector ? 0.28 : 0.4 },
    { header: 'Air wavelength', width: 0.2, ...numeric },
    { header: 'Bandpass', width: 0.18, ...numeric },
    ...(hasDetector ? [{ header: 'Pixel', width: 0.16, ...numeric }] : []),
    { header: 'Note', width: hasDetector ? 0.18 : 0.22 },
  ];
}

export function lineRows(report: CalibrationReport, hasDetector: boolean): TableRow[] {
  return report.linesInRange.slice(0, MAX_SHEET_ROWS).map(({ line, bandpassNm, detector, reason }) => ({
    cells: [
      lineSource(line),
      airNm(line.wavelengthNm),
      bandpassNm === null ? (reason ?? 'out of reach') : formatQuantity(bandpassNm, 'nm'),
      ...(hasDetector ? [placementCell(detector, report.coverage?.pixelCount ?? null)] : []),
      line.vacuumWavelengthNm === null ? (line.strength ?? '') : `${airNm(line.vacuumWavelengthNm)} in vacuum`,
    ],
  }));
}

const PAIR_COLUMNS: readonly TableColumn[] = [
  { header: 'Shorter', width: 0.3 },
  { header: 'Longer', width: 0.3 },
  { header: 'Separation', width: 0.2, ...numeric },
  { header: 'Bandpass', width: 0.2, ...numeric },
];

/** The unresolved pairs among those listed, shortest first. */
export function unresolvedPairRows(report: CalibrationReport): TableRow[] {
  return report.pairs
    .filter((pair) => pair.resolved === false)
    .slice(0, MAX_SHEET_ROWS)
    .map((pair) => ({
      cells: [
        `${lineSource(pair.shorter)} ${airNm(pair.shorter.wavelengthNm)}`,
        `${lineSource(pair.longer)} ${airNm(pair.longer.wavelengthNm)}`,
        formatQuantity(pair.separationNm, 'nm'),
        formatQuantity(pair.bandpassNm, 'nm'),
      ],
      marked: true,
    }));
}

/** "46 of 47 neighbouring pairs are resolved.", in the card's words. */
export function pairsText(report: CalibrationReport): string {
  return resolvedPairsSentence(report.pairCount, report.unresolvedPairCount);
}

const GHOST_COLUMNS: readonly TableColumn[] = [
  { header: 'Line', width: 0.3 },
  { header: 'Order', width: 0.12, ...numeric },
  { header: 'Appears at', width: 0.2, ...numeric },
  { header: 'Filters', width: 0.38 },
];

/** "blocked by filter 1", "not blocked (40 % passed)", or that the mount cannot reach the setting. */
function ghostFilterCell(ghost: CalibrationReport['ghosts'][number], params: Design): string {
  if (!ghost.reachable) return 'setting out of reach';
  if (ghost.blocked) {
    const numbers = blockingFilterNumbers(params.filters ?? [], ghost.apparentWavelengthNm, ghost.line.wavelengthNm);
    return numbers.length === 0 ? 'blocked' : `blocked by filter${numbers.length === 1 ? '' : 's'} ${numbers.join(', ')}`;
  }
  return `not blocked${ghost.filterTransmission < 1 ? ` (${formatPercent(ghost.filterTransmission)} passed)` : ''}`;
}

export function ghostRows(report: CalibrationReport, params: Design): TableRow[] {
  return report.ghosts.slice(0, MAX_SHEET_ROWS).map((ghost) => ({
    cells: [
      `${lineSource(ghost.line)} ${airNm(ghost.line.wavelengthNm)}`,
      formatInteger(ghost.order),
      formatQuantity(ghost.apparentWavelengthNm, 'nm', 7),
      ghostFilterCell(ghost, params),
    ],
    marked: ghost.reachable && !ghost.blocked,
  }));
}

/** The coverage and the cubic's residual in the card's sentences; a design without a detector says so. */
export function coverageText(report: CalibrationReport): string[] {
  if (!report.coverage) return ['Detector coverage: no detector in the design (a scanning monochromator), or the range centre is out of reach.'];
  return coverageSentences(report.coverage);
}

export const calibrationLinesSection: SheetSection & Required<Pick<SheetSection, 'appliesTo'>> = {
  id: 'calibration-lines',
  title: 'Calibration lines',
  appliesTo: calibrationApplies,
  draw(writer, sheet) {
    const { params } = sheet;
    const report = sheetCalibration(params);
    const hasDetector = params.detector !== undefined;
    const size = textSize.small;
    writer.sectionHeading(this.title, 100);
    const lists = (params.curves ?? []).filter((curve) => curve.kind === 'line-list');
    const listNames = designLineListNames(params);
    writer.paragraph(
      `Lamp lines of ${LAMP_ELEMENTS.join(', ')} in air (${LAMP_LINES_SOURCE})` +
        (lists.length > 0
          ? `, and the design’s own ${lists.length === 1 ? 'list' : 'lists'} ${lists.map((c, i) => `“${listNames[i]}” (${c.medium === 'vacuum' ? 'converted from vacuum' : 'air'})`).join(', ')}`
          : '') +
        `. Pixels with the grating fixed at the range centre; bandpass as a monochromator.`,
      { size, color: sheetColors.muted },
    );

    writer.subheading(`In the range: ${formatInteger(report.linesInRangeCount)} ${report.linesInRangeCount === 1 ? 'line' : 'lines'}`);
    if (report.linesInRangeCount > 0) {
      writer.table(lineColumns(hasDetector), lineRows(report, hasDetector), { size });
      const more = moreText(Math.min(MAX_SHEET_ROWS, report.linesInRange.length), report.linesInRangeCount, 'lines');
      if (more) writer.paragraph(more, { size, color: sheetColors.muted });
    }

    writer.subheading('Neighbouring pairs');
    writer.paragraph(pairsText(report), { font: 'semibold', color: report.unresolvedPairCount > 0 ? sheetColors.warning : sheetColors.ink });
    const unresolved = unresolvedPairRows(report);
    if (unresolved.length > 0) {
      writer.table(PAIR_COLUMNS, unresolved, { size });
      const more = moreText(unresolved.length, report.unresolvedPairCount, 'unresolved pairs');
      if (more) writer.paragraph(more, { size, color: sheetColors.muted });
    }
    writer.paragraph(`Resolved: ${RESOLUTION_CRITERION}.`, { size, color: sheetColors.muted });

    writer.subheading(`Ghosts through other orders: ${formatInteger(report.ghostCount)}`);
    if (report.ghostCount > 0) {
      writer.table(GHOST_COLUMNS, ghostRows(report, params), { size });
      const more = moreText(Math.min(MAX_SHEET_ROWS, report.ghosts.length), report.ghostCount, 'ghosts');
      if (more) writer.paragraph(more, { size, color: sheetColors.muted });
      writer.paragraph(
        'A line λ reaches the setting |m′| λ / |m| in order m′ (the grating equation; Palmer & Loewen, Diffraction Grating Handbook, ch. 2); ' +
          'a tinted row is not blocked by the design’s filters and will show as a false line there.',
        { size, color: sheetColors.muted },
      );
    } else {
      writer.paragraph('None: no lamp line of the source’s span reaches the range through another order.', { size });
    }

    writer.subheading('Calibration coverage');
    for (const line of coverageText(report)) writer.paragraph(line);

    if (report.linesInRange.some(({ line }) => line.element === 'Hg')) {
      writer.subheading('Mercury lamp');
      for (const caution of mercuryLampCautions(params)) {
        writer.ensureSpace(30);
        writer.paragraph(caution.title, { font: 'semibold', gapAfter: 1 });
        writer.paragraph(caution.text, { size });
      }
      writer.paragraph('Listed because mercury lines are used here: a mercury lamp gives off 253.65 nm (UV-C) whatever range it calibrates.', { size, font: 'semibold' });
      writer.paragraph(cautionClosingLine, { size, color: sheetColors.muted });
    }
  },
};
