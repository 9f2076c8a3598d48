/**
 * The search's answer in words: which requirement excluded the most candidates, and how far the
 * nearest ones miss. Pure; the search screen, the command line and tests read it.
 */

import { formatNumber, formatPercent } from '../../shared/format';
import { requirementWords, type RequirementId } from '../../shared/requirements';
import type { SearchAnswer } from '../../shared/search';

/** A short name for an `excludedBy` key: a requirement's label, or the reach of the range. */
export function exclusionLabel(key: string): string {
  if (key === 'range') return 'Range within reach';
  return requirementWords[key as RequirementId]?.label ?? key;
}

/** The key that excluded the most candidates and how many (the first listed wins a tie); null when none excluded any. */
export function mostExcluding(excludedBy: Readonly<Record<string, number>>): { key: string; count: number } | null {
  let best: { key: string; count: number } | null = null;
  for (const [key, count] of Object.entries(excludedBy)) {
    if (count > 0 && (best === null || count > best.count)) best = { key, count };
  }
  return best;
}

/** "24 % over" (a maximum) or "24 % short" (a minimum, the range's reach, a yes/no requirement): a miss as a share of its limit. */
export function missWords(key: string, margin: number): string {
  const abs = Math.abs(margin);
  const digits = abs >= 0.1 ? 0 : abs >= 0.01 ? 1 : 2;
  const way = margin >= 0 ? 'to spare' : key.startsWith('max') ? 'over' : 'short';
  return `${formatPercent(abs, { maximumFractionDigits: digits })} ${way}`;
}

/**
 * One sentence about an answer: how many passed, or, when none did, which requirement excluded
 * the most and by how much the nearest candidate misses.
 */
export function explainAnswer(answer: SearchAnswer): string {
  const considered = formatNumber(answer.considered, 6);
  if (answer.candidates.length > 0) {
    return `${answer.candidates.length} of ${considered} candidates shown, best score first.`;
  }
  const most = mostExcluding(answer.excludedBy);
  const culprit = most
    ? ` "${exclusionLabel(most.key)}" excluded the most: ${formatNumber(most.count, 6)} of ${considered}.`
    : '';
  const nearest = answer.nearest[0];
  const misses = nearest
    ? Object.entries(nearest.misses)
        .map(([key, margin]) => `${exclusionLabel(key).toLowerCase()} ${missWords(key, margin)}`)
        .join(', ')
    : '';
  return `No candidate meets every requirement.${culprit}${misses ? ` The nearest misses: ${misses}.` : ''}`;
}
