import type { Design } from '../../../shared/design';
import { formatInteger, formatNumber, formatPercent, formatQuantity } from '../../../shared/format';
import { LAMP_ELEMENTS, LAMP_LINES_SOURCE } from '../../../shared/lamp-lines';
import {
  RESOLUTION_CRITERION,
  calibrationLineList,
  calibrationReport,
  type CalibrationLine,
  type CalibrationReport,
  type DetectorLanding,
} from '../../../features/solver/index';
import { cautionsFor, type Caution } from '../../../features/safety/cautions';
import type { SheetContext } from '../context';
import type { SheetSection } from '../section';
import { sheetColors, textSize, type TableColumn, type TableRow } from '../writer';

/**
 * The design sheet's calibration lines: the built-in lamp lines and the design's own line lists
 * (its `line-list` curves) that fall in its range, with their bandpass and detector pixel; the
 * neighbouring pairs it cannot separate; lines that reach the range through another order
 * (ghosts), blocked by its filters or not; how well the lines cover the detector and how closely
 * a cubic follows its dispersion. Printed for a design whose range holds a line or a ghost of one.
 */

/** Rows a table prints before "… and N more": the sheet is for reading, the app lists them all. */
export const MAX_SHEET_ROWS = 30;

/** Every line the design is checked against: the built-in lamps and each line-list curve, in air. */
export function designLines(params: Design): CalibrationLine[] {
  const user = (params.curves ?? [])
    .filter((curve) => curve.kind === 'line-list')
    .flatMap((curve) => calibrationLineList([], curve.wavelengthsNm.map((wavelengthNm) => ({ wavelengthNm, label: curve.name })), curve.medium));
  return [...calibrationLineList(LAMP_ELEMENTS), ...user].sort((a, b) => a.wavelengthNm - b.wavelengthNm);
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

/** "Hg", or the user's list by name ("line list “Lab Ne lamp”"). */
export function lineSource(line: CalibrationLine): string {
  if (line.element) return line.element;
  return line.label ? `list “${line.label}”` : 'own list';
}

/** An air wavelength as given (built-in values carry at most seven figures, never padded). */
const airNm = (nm: number) => formatQuantity(nm, 'nm', 7);

const PLACEMENT_WORDS: Readonly<Record<DetectorLanding['placement'], string>> = {
  'on-detector': '',
  'short-of-detector': 'short of the detector',
  'past-detector': 'past the detector',
  'misses-camera': 'misses the camera',
};

/** "512.3", or where the light goes instead. */
export function pixelText(landing: DetectorLanding | null): string {
  if (!landing) return '—';
  if (landing.placement === 'on-detector') return formatNumber(landing.pixel, 5);
  return PLACEMENT_WORDS[landing.placement];
}

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
      ...(hasDetector ? [pixelText(detector)] : []),
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

/** "12 neighbouring pairs: 10 resolved, 2 not." */
export function pairsText(report: CalibrationReport): string {
  if (report.pairCount === 0) return 'Neighbouring pairs: none (fewer than two lines in the range).';
  const unknown = report.pairs.filter((pair) => pair.resolved === null).length;
  const resolved = report.pairCount - report.unresolvedPairCount - unknown;
  return (
    `${formatInteger(report.pairCount)} neighbouring ${report.pairCount === 1 ? 'pair' : 'pairs'}: ` +
    `${formatInteger(resolved)} resolved, ${formatInteger(report.unresolvedPairCount)} not` +
    `${unknown > 0 ? `, ${formatInteger(unknown)} out of reach` : ''}.`
  );
}

const GHOST_COLUMNS: readonly TableColumn[] = [
  { header: 'Line', width: 0.3 },
  { header: 'Order', width: 0.12, ...numeric },
  { header: 'Appears at', width: 0.2, ...numeric },
  { header: 'Filters', width: 0.38 },
];

export function ghostRows(report: CalibrationReport): TableRow[] {
  return report.ghosts.slice(0, MAX_SHEET_ROWS).map((ghost) => ({
    cells: [
      `${lineSource(ghost.line)} ${airNm(ghost.line.wavelengthNm)}`,
      formatInteger(ghost.order),
      formatQuantity(ghost.apparentWavelengthNm, 'nm', 6),
      !ghost.reachable
        ? 'setting out of reach'
        : ghost.blocked
          ? 'blocked'
          : `not blocked${ghost.filterTransmission < 1 ? ` (${formatPercent(ghost.filterTransmission)} passed)` : ''}`,
    ],
    marked: ghost.reachable && !ghost.blocked,
  }));
}

/** The coverage sentence and the cubic's residual, in words. */
export function coverageText(report: CalibrationReport): string[] {
  const coverage = report.coverage;
  if (!coverage) return ['Detector coverage: no detector in the design (a scanning monochromator), or the range centre is out of reach.'];
  const lines: string[] = [];
  lines.push(
    coverage.linesOnDetector === 0
      ? `No line lands on the ${formatInteger(coverage.pixelCount)}-pixel detector.`
      : `${formatInteger(coverage.linesOnDetector)} ${coverage.linesOnDetector === 1 ? 'line lands' : 'lines land'} on the ` +
          `${formatInteger(coverage.pixelCount)}-pixel detector, spanning pixels ${formatNumber(coverage.firstLinePixel, 5)} to ` +
          `${formatNumber(coverage.lastLinePixel, 5)} (${formatPercent(coverage.spanFraction)} of its length).`,
  );
  if (coverage.fit) {
    const fit = coverage.fit;
    lines.push(
      `A cubic fitted to the design’s own dispersion across the detector leaves at most ${formatQuantity(fit.maxResidualNm, 'nm', 3)} ` +
        `(rms ${formatQuantity(fit.rmsResidualNm, 'nm', 3)}): ${formatNumber(fit.maxResidualPerBandpass, 3)} of the bandpass and ` +
        `${formatNumber(fit.maxResidualPerPixel, 3)} of a pixel.`,
    );
  }
  if (coverage.note) lines.push(`${coverage.note.charAt(0).toUpperCase()}${coverage.note.slice(1)}.`);
  return lines;
}

/**
 * The cautions of features/safety/cautions.ts a mercury lamp on the bench calls for: its UV-C,
 * its high-voltage supply and a broken lamp. `cautionsFor` decides by the design's range, but a
 * mercury lamp gives off 253.65 nm whatever range it calibrates, so it is asked about a range that
 * holds the lamp's lines (250–600 nm) and its words are printed as they are.
 */
export function mercuryLampCautions(params: Design): Caution[] {
  const lampRange: Design = { ...params, range: { startNm: 250, endNm: 600 } };
  delete lampRange.source;
  const wanted: readonly Caution['id'][] = ['deep-uv', 'lamp-high-voltage', 'mercury-breakage'];
  return cautionsFor(lampRange).filter((caution) => wanted.includes(caution.id));
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
    writer.paragraph(
      `Lamp lines of Hg, Ne, Ar, Kr and Na in air (${LAMP_LINES_SOURCE})` +
        (lists.length > 0 ? `, and the design’s own ${lists.length === 1 ? 'list' : 'lists'} ${lists.map((c) => `“${c.name}” (${c.medium === 'vacuum' ? 'converted from vacuum' : 'air'})`).join(', ')}` : '') +
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
      writer.table(GHOST_COLUMNS, ghostRows(report), { size });
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
      const cautions = mercuryLampCautions(params);
      for (const caution of cautions) {
        writer.ensureSpace(30);
        writer.paragraph(caution.title, { font: 'semibold', gapAfter: 1 });
        writer.paragraph(caution.text, { size });
      }
      writer.paragraph('Listed because mercury lines are used here: a mercury lamp gives off 253.65 nm (UV-C) whatever range it calibrates.', { size, font: 'semibold' });
      const closing = cautions[0]?.closing;
      if (closing) writer.paragraph(closing, { size, color: sheetColors.muted });
    }
  },
};
