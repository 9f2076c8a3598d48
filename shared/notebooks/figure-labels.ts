import { NONE, formatInteger, formatNumber, formatPercent } from '../format';
import type { FigureKey } from './compare';

/**
 * The compare answer's key figures in words: their labels, how a value and a change between two
 * versions read ("Bandpass at centre", "0.0689 nm", "−12 %"), and whether a change is for the
 * better. Shared so the compare screen and the compare sheet word them alike.
 */

export const figureLabels: Record<FigureKey, { label: string; unit: string; lowerIsBetter: boolean | null }> = {
  bandpassAtCentreNm: { label: 'Bandpass at centre', unit: 'nm', lowerIsBetter: true },
  resolvingPowerAtCentre: { label: 'R at centre', unit: '', lowerIsBetter: false },
  reciprocalDispersionAtCentreNmPerMm: { label: 'Reciprocal dispersion', unit: 'nm/mm', lowerIsBetter: null },
  fNumber: { label: 'f-number', unit: '', lowerIsBetter: null },
  warningCount: { label: 'Warnings', unit: '', lowerIsBetter: true },
};

/** "−12 %", "+3.4 %", "±0 %"; a dash when there is nothing to compare. Relative change as a fraction. */
export function formatRelativeChange(relative: number | null): string {
  if (relative === null || !Number.isFinite(relative)) return NONE;
  const maximumFractionDigits = Math.abs(relative) >= 0.1 ? 0 : 1;
  const text = formatPercent(relative, { maximumFractionDigits, signed: true });
  // Only a change that rounds to zero comes back unsigned; it reads "±0 %", no change either way.
  return /^\d/.test(text) ? `±${text}` : text;
}

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
