import { describeDesignPath } from '@/shared/design-fields';
import { formatNumber } from '@/shared/format';
import type { VersionSummary } from '@/shared/notebooks';
import { formatFigure, formatRequirementsMet, requirementsMetLabel } from '@/shared/notebooks/figure-labels';

// Screens in this folder still import the dates from here; new code imports '@/shared/format'.
export { formatDay, formatWhen } from '@/shared/format';

// The key figures' words are shared with the compare sheet on the server.
export {
  REQUIREMENTS_MET_LABEL,
  changeTone,
  figureLabels,
  formatFigure,
  formatRelativeChange,
  formatRequirementsMet,
  requirementsChange,
  requirementsMetLabel,
} from '@/shared/notebooks/figure-labels';

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
    /** "4 of 5 met", or "—" for a version without requirements (or saved before they existed). */
    requirements: formatRequirementsMet(summary.requirements),
    /** The same read aloud, naming the failing ones. */
    requirementsLabel: requirementsMetLabel(summary.requirements),
    /** Whether the version states requirements at all (phones leave the words out when not). */
    hasRequirements: (summary.requirements?.total ?? 0) > 0,
  };
}

/** "a reviewer", "an owner", "an editor": the indefinite article by the word's first letter (enough for role names). */
export function withArticle(word: string): string {
  return `${/^[aeiou]/i.test(word) ? 'an' : 'a'} ${word}`;
}

/** `slits.exitWidthUm` → "Slits: exit width (µm)"; a whole section → "Detector". */
export const describePath = describeDesignPath;

// Stored values and field paths in the editor's words are shared with the design sheet.
export { editorFieldName, editorSectionTitle, formatParam, formatParamAt } from '@/shared/design-values';
