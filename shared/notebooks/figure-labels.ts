import { NONE, formatInteger, formatNumber, formatPercent } from '../format';
import type { RequirementId } from '../requirements';
import type { FigureKey } from './compare';
import type { RequirementsSummary } from './versions';

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

/** Each requirement as a noun, for lists of which ones fail ("bandpass, f-number"). */
export const requirementNames: Record<RequirementId, string> = {
  maxBandpassNm: 'bandpass',
  minResolvingPower: 'resolving power',
  minBlazeEfficiency: 'blaze efficiency',
  minRelativeThroughput: 'relative throughput',
  maxFNumber: 'f-number',
  maxFocalLengthMm: 'focal length',
  maxFootprintMm: 'footprint',
  minPixelsPerBandpass: 'pixels per bandpass',
  oneShotCoverage: 'one-shot coverage',
  maxWavelengthErrorNm: 'wavelength error',
  maxReciprocalDispersionNmPerMm: 'reciprocal dispersion',
  orderOverlap: 'order overlap',
};

/** The key figure's name, in the history table's column and the compare tables. */
export const REQUIREMENTS_MET_LABEL = 'Requirements met';

/** "4 of 5 met"; a dash when the version states no requirements (or was saved before they existed). */
export function formatRequirementsMet(summary: RequirementsSummary | null | undefined): string {
  if (!summary || summary.total === 0) return NONE;
  return `${formatInteger(summary.met)} of ${formatInteger(summary.total)} met`;
}

function namesText(ids: readonly RequirementId[]): string {
  return ids.map((id) => requirementNames[id]).join(', ');
}

/**
 * The figure read aloud, naming what a glance at "4 of 5 met" leaves out: "Requirements: 3 of 5
 * met; failing: bandpass, f-number; 1 not checked".
 */
export function requirementsMetLabel(summary: RequirementsSummary | null | undefined): string {
  if (!summary || summary.total === 0) return 'Requirements: none stated';
  const parts = [`Requirements: ${formatRequirementsMet(summary)}`];
  if (summary.failing.length > 0) parts.push(`failing: ${namesText(summary.failing)}`);
  if (summary.unknown > 0) parts.push(`${formatInteger(summary.unknown)} not checked`);
  return parts.join('; ');
}

/**
 * How the requirements moved from one version to another, in words ("1 more met; bandpass no
 * longer fails"), the count alone ("+1 met") and what it leaves out (`detail`: the names, or
 * requirements added or removed; null when the count says it all), and whether that is for the better. Names come from the failing lists, so a
 * requirement that went from failing to not checked reads as no longer failing: the count beside
 * it still says it is not met.
 */
export function requirementsChange(
  before: RequirementsSummary | null | undefined,
  after: RequirementsSummary | null | undefined,
): { text: string; tone: 'ok' | 'danger' | 'muted'; delta: string; detail: string | null } {
  const a = before && before.total > 0 ? before : null;
  const b = after && after.total > 0 ? after : null;
  if (!a && !b) return { text: NONE, tone: 'muted', delta: NONE, detail: null };
  if (!a) return { text: 'requirements added', tone: 'muted', delta: NONE, detail: 'requirements added' };
  if (!b) return { text: 'requirements removed', tone: 'muted', delta: NONE, detail: 'requirements removed' };
  const nowFailing = b.failing.filter((id) => !a.failing.includes(id));
  const fixed = a.failing.filter((id) => !b.failing.includes(id));
  const delta = b.met - a.met;
  const count: string[] = [];
  if (delta > 0) count.push(`${formatInteger(delta)} more met`);
  if (delta < 0) count.push(`${formatInteger(-delta)} fewer met`);
  const names: string[] = [];
  if (nowFailing.length > 0) names.push(`${namesText(nowFailing)} now ${nowFailing.length === 1 ? 'fails' : 'fail'}`);
  if (fixed.length > 0) names.push(`${namesText(fixed)} no longer ${fixed.length === 1 ? 'fails' : 'fail'}`);
  // "+1 met", "−2 met", "±0 met": the count alone, for a narrow column beside the figures.
  const deltaText = `${delta > 0 ? '+' : delta < 0 ? '−' : '±'}${formatInteger(Math.abs(delta))} met`;
  const parts = [...count, ...names];
  if (parts.length === 0) {
    const same = a.total === b.total && a.unknown === b.unknown;
    const checked = `${formatInteger(b.total)} checked, was ${formatInteger(a.total)}`;
    return { text: same ? 'no change' : checked, tone: 'muted', delta: deltaText, detail: same ? null : checked };
  }
  const better = nowFailing.length === 0 && (fixed.length > 0 || delta > 0);
  const worse = fixed.length === 0 && (nowFailing.length > 0 || delta < 0);
  return {
    text: parts.join('; '),
    tone: better ? 'ok' : worse ? 'danger' : 'muted',
    delta: deltaText,
    detail: names.length > 0 ? names.join('; ') : null,
  };
}
