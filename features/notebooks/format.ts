import { describeDesignPath, fieldTableName } from '@/shared/design-fields';
import { NONE, formatInteger, formatNumber, formatPercent } from '@/shared/format';
import type { FigureKey, VersionSummary } from '@/shared/notebooks';

// Screens in this folder still import the dates from here; new code imports '@/shared/format'.
export { formatDay, formatWhen } from '@/shared/format';

/** "−12 %", "+3.4 %", "±0 %"; a dash when there is nothing to compare. Relative change as a fraction. */
export function formatRelativeChange(relative: number | null): string {
  if (relative === null || !Number.isFinite(relative)) return NONE;
  const maximumFractionDigits = Math.abs(relative) >= 0.1 ? 0 : 1;
  const text = formatPercent(relative, { maximumFractionDigits, signed: true });
  // Only a change that rounds to zero comes back unsigned; it reads "±0 %", no change either way.
  return /^\d/.test(text) ? `±${text}` : text;
}

export const figureLabels: Record<FigureKey, { label: string; unit: string; lowerIsBetter: boolean | null }> = {
  bandpassAtCentreNm: { label: 'Bandpass at centre', unit: 'nm', lowerIsBetter: true },
  resolvingPowerAtCentre: { label: 'R at centre', unit: '', lowerIsBetter: false },
  reciprocalDispersionAtCentreNmPerMm: { label: 'Reciprocal dispersion', unit: 'nm/mm', lowerIsBetter: null },
  fNumber: { label: 'f-number', unit: '', lowerIsBetter: null },
  warningCount: { label: 'Warnings', unit: '', lowerIsBetter: true },
};

export function formatFigure(key: FigureKey, value: number | null): string {
  if (value === null) return NONE;
  if (key === 'fNumber') return `f/${formatNumber(value, 3)}`;
  if (key === 'warningCount') return formatInteger(value);
  if (key === 'resolvingPowerAtCentre') return formatNumber(Math.round(value), 4);
  const { unit } = figureLabels[key];
  return unit ? `${formatNumber(value)} ${unit}` : formatNumber(value);
}

/** Whether a change reads as better, worse or neither, for colouring. */
export function changeTone(key: FigureKey, relative: number | null): 'ok' | 'danger' | 'muted' {
  const { lowerIsBetter } = figureLabels[key];
  if (relative === null || relative === 0 || lowerIsBetter === null) return 'muted';
  return (relative < 0) === lowerIsBetter ? 'ok' : 'danger';
}

/** "380–780 nm". */
export function formatRange(summary: Pick<VersionSummary, 'rangeStartNm' | 'rangeEndNm'>): string {
  return `${formatNumber(summary.rangeStartNm)}–${formatNumber(summary.rangeEndNm)} nm`;
}

/** The history table's key figures, as short strings. */
export function summaryFigures(summary: VersionSummary) {
  return {
    range: formatRange(summary),
    bandpass: formatFigure('bandpassAtCentreNm', summary.bandpassAtCentreNm),
    resolvingPower: formatFigure('resolvingPowerAtCentre', summary.resolvingPowerAtCentre),
    fNumber: formatFigure('fNumber', summary.fNumber),
  };
}

/** `slits.exitWidthUm` → "Slits: exit width (µm)"; a whole section → "Detector". */
export const describePath = describeDesignPath;

/** A parameter value as it reads in a table: numbers plainly, sections as "set" / "not set". */
export function formatParam(value: unknown): string {
  if (value === null || value === undefined) return 'not set';
  // A stored parameter is shown in full, not cut to the four figures of a derived one.
  if (typeof value === 'number') return formatNumber(value, 12);
  if (typeof value === 'string') return value;
  if (typeof value === 'object') {
    return Object.entries(value as Record<string, unknown>)
      .map(([key, inner]) => `${fieldTableName(key)} ${formatParam(inner)}`)
      .join(', ');
  }
  return String(value);
}
