import { carryLine } from '../../../features/reviews/carry';
import { formatDay, formatInteger } from '../../../shared/format';
import { decisionOutcomeLabels, pinLabel, reviewStateLabels, type Remark, type Thread, type VersionReview } from '../../../shared/reviews';
import { drawMarkdown } from '../markdown-pdf';
import type { SheetSection } from '../section';
import { sheetColors, textSize, type SheetWriter } from '../writer';

/**
 * The version's review as the review panel shows it: its state, the requests and decisions, and
 * the open threads with their pins and remarks (earlier versions' threads say whether they still
 * apply, in the panel's words). A share link's holder gets the state, the decisions and how many
 * threads are open, never the threads' text, as the app shows them nothing of the threads.
 * Dates are UTC days, like the footer's time.
 */

/** A calendar date ("2026-12-04") as a day, never shifted by a time zone. */
function dueDay(date: string): string {
  return formatDay(`${date}T00:00:00Z`, 'UTC');
}

const day = (iso: string) => formatDay(iso, 'UTC');

function count(n: number, one: string, many: string): string {
  return `${formatInteger(n)} ${n === 1 ? one : many}`;
}

function isEmpty(review: VersionReview): boolean {
  return review.state === 'unreviewed' && review.threads.length === 0 && review.requests.length === 0 && review.decisions.length === 0;
}

function drawDecisions(writer: SheetWriter, review: VersionReview): void {
  writer.subheading('Decisions');
  if (review.decisions.length === 0) {
    writer.paragraph('No decisions yet.', { color: sheetColors.muted });
    return;
  }
  const oldestFirst = [...review.decisions].sort((a, b) => a.createdAt.localeCompare(b.createdAt));
  writer.table(
    [
      { header: 'Outcome', width: 0.22 },
      { header: 'Reviewer', width: 0.2 },
      { header: 'Date', width: 0.14 },
      // A summary is plain text in the app too, never Markdown.
      { header: 'Summary', width: 0.44 },
    ],
    oldestFirst.map((decision) => ({
      cells: [decisionOutcomeLabels[decision.outcome], decision.reviewer?.displayName ?? decision.reviewerName, day(decision.createdAt), decision.summary],
      marked: decision.outcome === 'revise',
    })),
  );
}

function drawRequests(writer: SheetWriter, review: VersionReview): void {
  writer.subheading('Review requests');
  if (review.requests.length === 0) {
    writer.paragraph('No review requested.', { color: sheetColors.muted });
    return;
  }
  writer.table(
    [
      { header: 'Reviewer', width: 0.24 },
      { header: 'Due', width: 0.16 },
      { header: 'Answered', width: 0.18 },
      { header: 'Asked by', width: 0.42 },
    ],
    review.requests.map((request) => ({
      cells: [
        request.reviewer.displayName,
        request.dueDate ? dueDay(request.dueDate) : '—',
        request.answeredAt ? day(request.answeredAt) : 'Waiting',
        `${request.requestedBy?.displayName ?? 'a former member'} on ${day(request.createdAt)}${request.note ? ` — ${request.note}` : ''}`,
      ],
    })),
  );
}

function drawRemark(writer: SheetWriter, remark: Remark, indent: number): void {
  const x = writer.left + indent;
  const width = writer.contentWidth - indent;
  if (remark.body === null) {
    writer.paragraph(`A remark was removed${remark.removedAt ? ` (${day(remark.removedAt)})` : ''}.`, {
      color: sheetColors.muted,
      size: textSize.small,
      x,
      width,
    });
    return;
  }
  const who = remark.author?.displayName ?? remark.authorName;
  writer.ensureSpace(textSize.small * 2 + textSize.body * 3);
  writer.paragraph(`${who} · ${day(remark.createdAt)}${remark.editedAt ? ' · edited' : ''}`, {
    font: 'semibold',
    size: textSize.small,
    color: sheetColors.muted,
    x,
    width,
    gapAfter: 1,
  });
  drawMarkdown(writer, remark.body, { x, width, mentions: remark.mentions.map((person) => person.displayName) });
}

function drawThread(writer: SheetWriter, thread: Thread): void {
  const indent = 10;
  writer.ensureSpace(60);
  const top = writer.y;
  const pages = writer.doc.bufferedPageRange().count;
  writer.paragraph(pinLabel(thread.pin), { font: 'semibold', gapAfter: 1 });
  const carry = carryLine(thread);
  writer.paragraph(carry ?? `Started on v${thread.version}`, { size: textSize.small, color: sheetColors.muted, gapAfter: 3 });
  for (const remark of thread.remarks) drawRemark(writer, remark, indent);
  // A rule down the left of the remarks ties them to their pin, when the thread fits on one page.
  if (writer.doc.bufferedPageRange().count === pages && writer.y > top) {
    writer.doc
      .moveTo(writer.left + 2, top + 14)
      .lineTo(writer.left + 2, writer.y - 4)
      .lineWidth(1)
      .strokeColor(sheetColors.line)
      .stroke();
  }
  writer.gap(6);
}

export const reviewSection: SheetSection = {
  id: 'review',
  title: 'Design review',
  draw(writer, sheet) {
    writer.sectionHeading(this.title);
    const review = sheet.review;
    if (!review || isEmpty(review)) {
      writer.paragraph('No review yet.', { color: sheetColors.muted });
      return;
    }
    const open = review.threads.filter((thread) => thread.status === 'open');
    const resolved = review.threads.length - open.length;
    const lastDecision = [...review.decisions].sort((a, b) => b.createdAt.localeCompare(a.createdAt))[0];
    writer.keyValues([
      ['State', reviewStateLabels[review.state]],
      ...(lastDecision ? [['Last decision', `${lastDecision.reviewer?.displayName ?? lastDecision.reviewerName}, ${day(lastDecision.createdAt)}`] as const] : []),
      ['Open threads', formatInteger(open.length)],
    ]);
    drawDecisions(writer, review);
    if (sheet.audience === 'link') {
      writer.paragraph('Remarks are shown to team members only.', { color: sheetColors.muted });
      return;
    }
    drawRequests(writer, review);
    writer.subheading('Open threads');
    writer.gap(2);
    if (open.length === 0) writer.paragraph('No open threads on this version.', { color: sheetColors.muted });
    for (const thread of open) drawThread(writer, thread);
    if (resolved > 0) writer.paragraph(`${count(resolved, 'resolved thread', 'resolved threads')} not shown.`, { color: sheetColors.muted });
  },
};
