import { fieldLabel } from '../../../shared/design-fields';
import { formatInteger, formatWhen } from '../../../shared/format';
import { decisionOutcomeLabels, reviewStateLabels, type Decision, type ReviewRequestItem, type VersionReview } from '../../../shared/reviews';
import type { SheetContext } from '../context';
import type { SheetSection } from '../section';
import { dayText, instrumentLine, provenanceText } from '../sheet-text';
import { sheetColors, textSize } from '../writer';

/** A person the answer may have lost (a deleted account), in the review panel's words. */
const FORMER_MEMBER = 'a former member';

function decisionLine(decision: Decision): string {
  const who = decision.reviewer?.displayName ?? decision.reviewerName;
  return `${decisionOutcomeLabels[decision.outcome]} by ${who} on ${dayText(decision.createdAt)}`;
}

/** "Tomas Lindqvist, due 4 Dec 2026 — answered 30 Nov 2026", as the review panel lists a request. */
function requestLine(request: ReviewRequestItem): string {
  // A due date is a calendar day, not an instant: read at UTC midnight so it never slips a day.
  const due = request.dueDate ? `, due ${dayText(`${request.dueDate}T00:00:00Z`)}` : '';
  const answer = request.answeredAt ? ` — answered ${dayText(request.answeredAt)}` : ' — waiting';
  return `${request.reviewer.displayName}${due}${answer}`;
}

function openThreadsText(review: VersionReview): string {
  const open = review.threads.filter((thread) => thread.status === 'open');
  if (open.length === 0) return 'None';
  const carried = open.filter((thread) => thread.version !== review.version).length;
  return carried === 0 ? formatInteger(open.length) : `${formatInteger(open.length)} (${formatInteger(carried)} carried over from earlier versions)`;
}

function reviewPairs(review: VersionReview | null): [string, string][] {
  if (!review) return [['Review', reviewStateLabels.unreviewed]];
  const decisions = [...review.decisions].sort((a, b) => a.createdAt.localeCompare(b.createdAt));
  const pairs: [string, string][] = [
    ['Review', reviewStateLabels[review.state]],
    ['Reviewers asked', review.requests.length === 0 ? 'None' : review.requests.map(requestLine).join('\n')],
    ['Decisions', decisions.length === 0 ? 'None yet' : decisions.map(decisionLine).join('\n')],
  ];
  if (review.earlierSignOff) {
    const { decision, changedPaths } = review.earlierSignOff;
    const since = changedPaths.length === 0 ? 'nothing changed since' : `changed since: ${changedPaths.map(fieldLabel).join(', ')}`;
    pairs.push(['Earlier sign-off', `v${decision.version}: ${decisionLine(decision)}; ${since}`]);
  }
  pairs.push(['Open review threads', openThreadsText(review)]);
  return pairs;
}

function baselineText(sheet: SheetContext): string {
  if (sheet.audience === 'link') return 'Not shown through a share link';
  if (sheet.design.isBaseline === null) return 'Not known';
  return sheet.design.isBaseline ? 'This version is the design’s baseline' : 'This version is not the design’s baseline';
}

/**
 * The sheet's first block: what the design is and which version, who saved it and when, whose it
 * is and where it came from, and how far its review got.
 */
export const titleSection: SheetSection = {
  id: 'title',
  title: 'Design sheet',
  draw(writer, sheet) {
    writer.sectionHeading(this.title);
    const { version } = sheet;
    writer.paragraph(sheet.design.title, { font: 'bold', size: textSize.title, gapAfter: 2 });
    const parent = version.parentNumber === null ? '' : ` · saved on top of v${version.parentNumber}`;
    writer.paragraph(`Version ${version.number}${parent}`, { font: 'semibold', size: textSize.subheading, gapAfter: 2 });
    writer.paragraph(instrumentLine(sheet.params), { color: sheetColors.muted, gapAfter: 8 });
    writer.keyValues(
      [
        ['Version message', version.message.trim() === '' ? '—' : version.message],
        ['Author', version.author?.displayName ?? FORMER_MEMBER],
        ['Saved', `${formatWhen(version.createdAt, 'UTC')} UTC`],
        ['Team', sheet.audience === 'link' ? 'Shared read-only link' : (sheet.design.teamName ?? '—')],
        ['Origin', provenanceText(sheet)],
        ['Baseline', baselineText(sheet)],
        ...reviewPairs(sheet.review),
      ],
      0.24,
    );
  },
};
