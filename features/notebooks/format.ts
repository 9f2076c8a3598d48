import { describeDesignPath, fieldTableName } from '@/shared/design-fields';
import type { FigureKey, VersionSummary } from '@/shared/notebooks';

const minus = '\u2212';
const thinSpace = '\u2009';

/** "−12 %", "+3.4 %", "±0 %"; a dash when there is nothing to compare. Relative change as a fraction. */
export function formatRelativeChange(relative: number | null): string {
  if (relative === null || !Number.isFinite(relative)) return '—';
  const percent = relative * 100;
  const rounded = Math.abs(percent) >= 10 ? Math.round(percent) : Math.round(percent * 10) / 10;
  if (rounded === 0) return `±0${thinSpace}%`;
  const sign = rounded < 0 ? minus : '+';
  return `${sign}${formatNumber(Math.abs(rounded))}${thinSpace}%`;
}

/** Four significant figures, thousands grouped, a real minus sign. */
export function formatNumber(value: number, significant = 4): string {
  if (!Number.isFinite(value)) return '—';
  const abs = Math.abs(value);
  const digits = abs === 0 ? 0 : Math.max(0, significant - 1 - Math.floor(Math.log10(abs)));
  const text = abs.toLocaleString('en-GB', { maximumFractionDigits: Math.min(digits, 6), useGrouping: abs >= 10_000 });
  return value < 0 ? `${minus}${text}` : text;
}

export const figureLabels: Record<FigureKey, { label: string; unit: string; lowerIsBetter: boolean | null }> = {
  bandpassAtCentreNm: { label: 'Bandpass at centre', unit: 'nm', lowerIsBetter: true },
  resolvingPowerAtCentre: { label: 'R at centre', unit: '', lowerIsBetter: false },
  reciprocalDispersionAtCentreNmPerMm: { label: 'Reciprocal dispersion', unit: 'nm/mm', lowerIsBetter: null },
  fNumber: { label: 'f-number', unit: '', lowerIsBetter: null },
  warningCount: { label: 'Warnings', unit: '', lowerIsBetter: true },
};

export function formatFigure(key: FigureKey, value: number | null): string {
  if (value === null) return '—';
  if (key === 'fNumber') return `f/${formatNumber(value, 3)}`;
  if (key === 'warningCount') return String(value);
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

/** "14 Mar 2026, 09:05": day first, month in letters, 24-hour clock. */
export function formatWhen(iso: string): string {
  const date = new Date(iso);
  const day = date.toLocaleDateString('en-GB', { day: 'numeric', month: 'short', year: 'numeric' });
  const time = date.toLocaleTimeString('en-GB', { hour: '2-digit', minute: '2-digit' });
  return `${day}, ${time}`;
}

export function formatDay(iso: string): string {
  return new Date(iso).toLocaleDateString('en-GB', { day: 'numeric', month: 'short', year: 'numeric' });
}

/** `slits.exitWidthUm` → "Slits: exit width (µm)"; a whole section → "Detector". */
export const describePath = describeDesignPath;

/** A parameter value as it reads in a table: numbers plainly, sections as "set" / "not set". */
export function formatParam(value: unknown): string {
  if (value === null || value === undefined) return 'not set';
  if (typeof value === 'number') return formatCanonicalNumber(value);
  if (typeof value === 'string') return value;
  if (typeof value === 'object') {
    return Object.entries(value as Record<string, unknown>)
      .map(([key, inner]) => `${fieldTableName(key)} ${formatParam(inner)}`)
      .join(', ');
  }
  return String(value);
}

function formatCanonicalNumber(value: number): string {
  return String(Number(value.toPrecision(12))).replace('-', minus);
}
