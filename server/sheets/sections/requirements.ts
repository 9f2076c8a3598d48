import type { Design } from '../../../shared/design';
import { formatStoredValue } from '../../../shared/design-values';
import { formatInteger, formatNumber, formatPercent, formatQuantity } from '../../../shared/format';
import { formatRequirementsMet, requirementNames } from '../../../shared/notebooks/figure-labels';
import type { RequirementId } from '../../../shared/requirements';
import { REQUIREMENT_POINTS, TRACED_REQUIREMENT_RAYS, checkRequirements, hasRequirements, type RequirementCheck } from '../../../features/requirements/index';
import type { SheetSection } from '../section';
import { spanTable, spanTableHeight, type SpanTableRow } from '../sheet-text';
import { margins, sheetColors, textSize, type TableColumn } from '../writer';

/** The result column's words: printed, so pass and fail survive a grey printer. */
export const RESULT_WORDS = { pass: 'Pass', fail: 'Fail', unknown: 'Not checked' } as const;

/** "Bandpass", "f-number": the requirement's noun, capitalised for the first column. */
export function requirementTitle(id: RequirementId): string {
  const name = requirementNames[id];
  // "f-number" keeps its small f, as the read-out and the figure tables write it.
  return id === 'maxFNumber' ? name : name.charAt(0).toUpperCase() + name.slice(1);
}

const path = (id: string) => `requirements.${id}`;

/**
 * The limit as stated, in full as stored (a requirement is a stored value, not a derived one):
 * "≤ 0.5 nm", "≥ 2000", "≤ 300 × 200 mm", "forbidden".
 */
export function limitCell(id: RequirementId, requirements: NonNullable<Design['requirements']>): string {
  if (id === 'maxFootprintMm') {
    const { widthMm, depthMm } = requirements.maxFootprintMm!;
    // Width × depth, as the editor asks for them; the "At" column says which one is the worse.
    return `≤ ${formatNumber(widthMm, 12)} × ${formatQuantity(depthMm, 'mm', 12)}`;
  }
  if (id === 'oneShotCoverage') return 'whole range at one setting';
  if (id === 'orderOverlap') return `other orders ${requirements.orderOverlap}`;
  const sign = id.startsWith('max') ? '≤' : '≥';
  // The basis is part of the limit: a traced 0.5 nm is a different promise from a slit-limited one.
  const basis = id === 'maxBandpassNm' && requirements.bandpassBasis === 'traced' ? ' traced' : '';
  return `${sign} ${formatStoredValue(path(id), requirements[id])}${basis}`;
}

/**
 * The worst value at the read-out card's precision (resolving power and efficiency 3 significant
 * figures, the rest 4), with its unit; "—" when there is none.
 */
export function worstCell(check: RequirementCheck): string {
  if (check.worst === null) return '—';
  switch (check.id) {
    case 'maxFNumber':
      return `f/${formatNumber(check.worst, 3)}`;
    case 'minResolvingPower':
    case 'minBlazeEfficiency':
    case 'minRelativeThroughput':
    case 'minPixelsPerBandpass':
      return formatNumber(check.worst, 3);
    case 'maxBandpassNm':
    case 'maxWavelengthErrorNm':
      return formatQuantity(check.worst, 'nm');
    case 'maxReciprocalDispersionNmPerMm':
      return formatQuantity(check.worst, 'nm/mm');
    case 'maxFocalLengthMm':
    case 'maxFootprintMm':
      return formatQuantity(check.worst, 'mm');
    default:
      return formatNumber(check.worst);
  }
}

/** "24 % over", "12 % to spare", "3 % short"; a near miss keeps a decimal so it never reads "0 % over". */
export function marginCell(check: RequirementCheck): string {
  if (check.margin === null) return '—';
  const abs = Math.abs(check.margin);
  const digits = abs >= 0.1 ? 0 : abs >= 0.01 ? 1 : 2;
  const percent = formatPercent(abs, { maximumFractionDigits: digits });
  if (check.margin >= 0) return `${percent} to spare`;
  return `${percent} ${check.id.startsWith('max') ? 'over' : 'short'}`;
}

/** Where the worst value is: a wavelength, the footprint's tighter side, or the whole design. */
function whereCell(check: RequirementCheck): string {
  if (check.id === 'maxFootprintMm') return /^footprint depth/.test(check.message) ? 'depth' : 'width';
  return check.worstWavelengthNm === null ? 'design' : formatQuantity(check.worstWavelengthNm, 'nm', 5);
}

/**
 * One row per check. A check with a number reads limit, worst, where and margin; one without (a
 * yes/no requirement, an unreachable wavelength, or one that cannot be checked) gives those
 * columns over to its sentence, which says what was found or why it is not known.
 */
export function requirementRows(checks: readonly RequirementCheck[], requirements: NonNullable<Design['requirements']>): SpanTableRow[] {
  return checks.map((check) => {
    const lead = [requirementTitle(check.id), RESULT_WORDS[check.status], limitCell(check.id, requirements)];
    const marked = check.status === 'fail';
    if (check.worst === null || check.status === 'unknown') {
      const color = check.status === 'unknown' ? sheetColors.muted : check.status === 'fail' ? sheetColors.danger : sheetColors.ink;
      return { cells: lead, marked, headed: true, span: { from: 3, text: sentence(check.message), color } };
    }
    return { cells: [...lead, worstCell(check), whereCell(check), marginCell(check)], marked, headed: true };
  });
}

/** The check's message as a sentence: capitalised, with its full stop. */
function sentence(text: string): string {
  const trimmed = text.trim();
  return `${trimmed.charAt(0).toUpperCase()}${trimmed.slice(1)}${/[.!?]$/.test(trimmed) ? '' : '.'}`;
}

/** "4 of 5 met. Failing: bandpass. 1 not checked (why, in its row)." */
export function metLine(checks: readonly RequirementCheck[]): string {
  const failing = checks.filter((check) => check.status === 'fail').map((check) => requirementNames[check.id]);
  const unknown = checks.filter((check) => check.status === 'unknown').length;
  const met = checks.filter((check) => check.status === 'pass').length;
  const parts = [`${formatRequirementsMet({ met, total: checks.length, unknown, failing: [] })}.`];
  if (failing.length > 0) parts.push(`Failing: ${failing.join(', ')}.`);
  if (unknown > 0) parts.push(`${formatInteger(unknown)} not checked (why, in ${unknown === 1 ? 'its row' : 'their rows'}).`);
  return parts.join(' ');
}

/** Where the per-wavelength checks looked: the listed wavelengths, or the sweep of the range. */
function scopeLine(params: Design): string {
  const requirements = params.requirements!;
  const { startNm, endNm } = params.range;
  const sweep = `the range swept at ${formatInteger(REQUIREMENT_POINTS)} wavelengths from ${formatNumber(startNm, 12)} to ${formatQuantity(endNm, 'nm', 12)}`;
  const lines = [
    requirements.atWavelengthsNm
      ? `Bandpass, resolving power, blaze efficiency, pixels per bandpass and reciprocal dispersion are checked at ` +
        `${formatStoredValue(path('atWavelengthsNm'), requirements.atWavelengthsNm)}; wavelength error and overlapping orders over ${sweep}.`
      : `Checked over ${sweep}, with the workbench's solver.`,
  ];
  if (requirements.maxBandpassNm !== undefined) {
    lines.push(
      requirements.bandpassBasis === 'traced'
        ? `Bandpass basis: traced, the FWHM of the exact ray trace's line shape at ${formatInteger(TRACED_REQUIREMENT_RAYS)} rays per wavelength, ` +
            `${requirements.atWavelengthsNm ? 'at the listed wavelengths' : "at the range's start, quarter points, centre and end"}.`
        : 'Bandpass basis: slit-limited, the closed-form FWHM of the slit images.',
    );
  }
  if (requirements.driveStepArcsec !== undefined) {
    lines.push(`Wavelength error: one drive step of ${formatStoredValue(path('driveStepArcsec'), requirements.driveStepArcsec)} times the scan sensitivity.`);
  }
  lines.push('Margin: how far the worst value sits inside the limit (to spare) or past it (over, short), as a share of the limit.');
  return lines.join(' ');
}

/**
 * What the instrument must do, checked against this version: each requirement with its result in
 * words, the limit as stated, the worst value, where it is and the margin, then how many are met.
 * Printed only for a design that states requirements: one without them has nothing to check, and
 * its sheet reads as it did before requirements existed.
 */
export const requirementsSection: SheetSection & Required<Pick<SheetSection, 'appliesTo'>> = {
  id: 'requirements',
  title: 'Requirements',
  appliesTo: (sheet) => hasRequirements(sheet.params),
  draw(writer, sheet) {
    const report = checkRequirements(sheet.params);
    const numeric = { align: 'right' as const };
    const columns: TableColumn[] = [
      { header: 'Requirement', width: 0.17 },
      { header: 'Result', width: 0.11, font: 'semibold' },
      { header: 'Limit', width: 0.22 },
      { header: 'Worst', width: 0.14, ...numeric },
      { header: 'At', width: 0.13, ...numeric },
      { header: 'Margin', width: 0.23, ...numeric },
    ];
    const rows = requirementRows(report.checks, sheet.params.requirements!);
    const size = textSize.small;
    const met = metLine(report.checks);
    writer.sectionHeading(this.title, Math.min(spanTableHeight(writer, columns, rows, { size }) + 30, writer.bottom - margins.top - 60));
    writer.paragraph(met, { font: 'semibold', color: report.failed > 0 ? sheetColors.danger : sheetColors.ink });
    spanTable(writer, columns, rows, { size });
    writer.gap(6);
    writer.paragraph(scopeLine(sheet.params), { size, color: sheetColors.muted });
  },
};
