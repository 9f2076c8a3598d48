import { formatInteger, formatNumber, formatPercent, formatQuantity, MINUS } from '@/shared/format';
import { requirementWords, type RequirementId } from '@/shared/requirements';
import type { CandidateFigures, SearchAnswer } from '@/shared/search';

/** "3200 of 13 440 designs": the progress bar's words (grouped the house way, shared/format.ts). */
export function progressWords(done: number, total: number): string {
  return `${formatInteger(done)} of ${formatInteger(total)} designs`;
}

export function cancelledWords(done: number): string {
  return `Search cancelled after ${formatInteger(done)} ${done === 1 ? 'design' : 'designs'}.`;
}

/** What the live region says when a search ends. */
export function finishedWords(answer: Pick<SearchAnswer, 'candidates' | 'considered'>): string {
  const found = answer.candidates.length;
  const considered = formatInteger(answer.considered);
  if (found === 0) return `No design of ${considered} meets every requirement.`;
  return `${formatInteger(found)} ${found === 1 ? 'design meets' : 'designs meet'} every requirement, best first (of ${considered} tried).`;
}

/** A signed order as written on a grating: "+1", "−2". */
export function formatOrder(order: number): string {
  return order < 0 ? `${MINUS}${Math.abs(order)}` : `+${order}`;
}

/** The version message of a saved candidate: "Candidate 1 from the search: 1200/mm, order +1, f = 300 mm". */
export function candidateMessage(rank: number, figures: Pick<CandidateFigures, 'grooveDensityPerMm' | 'order' | 'focalLengthMm'>): string {
  return `Candidate ${rank} from the search: ${formatNumber(figures.grooveDensityPerMm)}/mm, order ${formatOrder(figures.order)}, f = ${formatNumber(figures.focalLengthMm)} mm`;
}

/** One figure of a candidate, its label and its text; the table's columns and the cards' rows. */
export type FigureColumn = { key: keyof CandidateFigures | 'score'; label: string; text: (figures: CandidateFigures, score: number) => string };

export const FIGURE_COLUMNS: readonly FigureColumn[] = [
  { key: 'grooveDensityPerMm', label: 'Grooves', text: (f) => `${formatNumber(f.grooveDensityPerMm)}/mm` },
  { key: 'order', label: 'Order', text: (f) => formatOrder(f.order) },
  { key: 'blazeWavelengthNm', label: 'Blaze', text: (f) => formatQuantity(f.blazeWavelengthNm, 'nm') },
  { key: 'deviationAngleDeg', label: 'Deviation', text: (f) => formatQuantity(f.deviationAngleDeg, '°', 3) },
  { key: 'focalLengthMm', label: 'Focal length', text: (f) => formatQuantity(f.focalLengthMm, 'mm') },
  { key: 'slitWidthUm', label: 'Slit', text: (f) => formatQuantity(f.slitWidthUm, 'µm', 3) },
  { key: 'worstBandpassNm', label: 'Worst bandpass', text: (f) => formatQuantity(f.worstBandpassNm, 'nm', 3) },
  { key: 'worstResolvingPower', label: 'Worst resolving power', text: (f) => formatInteger(f.worstResolvingPower) },
  { key: 'minBlazeEfficiency', label: 'Min efficiency', text: (f) => formatPercent(f.minBlazeEfficiency) },
  {
    key: 'reciprocalDispersionAtCentreNmPerMm',
    label: 'RLD at centre',
    text: (f) => formatQuantity(f.reciprocalDispersionAtCentreNmPerMm, 'nm/mm', 3),
  },
  { key: 'fNumber', label: 'f-number', text: (f) => (f.fNumber === null ? formatNumber(null) : `f/${formatNumber(f.fNumber, 3)}`) },
  { key: 'score', label: 'Score', text: (_f, score) => formatNumber(score, 3) },
];

function requirementLabel(id: string): string {
  return requirementWords[id as RequirementId]?.label.toLowerCase() ?? id;
}

/** The requirement that excluded the most candidates, or null when none did. */
export function mostExcluding(excludedBy: Readonly<Record<string, number>>): { id: string; count: number } | null {
  let best: { id: string; count: number } | null = null;
  // Ties go to the first in the answer's order, so the words do not change between runs.
  for (const [id, count] of Object.entries(excludedBy)) if (count > 0 && (!best || count > best.count)) best = { id, count };
  return best;
}

/**
 * Why nothing passed, in words: the requirement that excluded the most candidates, and how far the
 * nearest candidate misses each requirement it fails ("bandpass at most: 12 % short").
 */
export function nothingPassesWords(answer: Pick<SearchAnswer, 'considered' | 'excludedBy' | 'nearest'>): { headline: string; misses: string[] } {
  const top = mostExcluding(answer.excludedBy);
  const headline = top
    ? `“${requirementWords[top.id as RequirementId]?.label ?? top.id}” excluded the most: ${formatInteger(top.count)} of ${formatInteger(answer.considered)} designs.`
    : `None of the ${formatInteger(answer.considered)} designs tried meets every requirement.`;
  const nearest = answer.nearest[0];
  const misses = nearest
    ? Object.entries(nearest.misses)
        .sort(([, a], [, b]) => a - b)
        .map(([id, margin]) => `${requirementLabel(id)}: misses by ${formatPercent(Math.abs(margin))}`)
    : [];
  return { headline, misses };
}
