import type { DecisionOutcome } from '../../shared/reviews';

/** Who did something, as the inbox and the e-mails name them. */
export type Actor = { id: string; displayName: string };

/**
 * What the review service tells the inbox after a write has committed. The inbox decides who is
 * concerned (never the actor themself), writes one inbox item per person and event, and sends one
 * e-mail per person and event unless that person turned the kind off. Mentions win over the other
 * kinds, so a mentioned owner gets one e-mail, not two.
 */
export type ReviewEvent =
  | {
      kind: 'thread-started';
      designId: string;
      version: number;
      threadId: string;
      actor: Actor;
      body: string;
      /** Team members named in the remark (already checked to be members). */
      mentions: string[];
      /** The author of the thread's version; null when the account was deleted. */
      versionAuthorId: string | null;
    }
  | {
      kind: 'remark-added';
      designId: string;
      version: number;
      threadId: string;
      actor: Actor;
      body: string;
      mentions: string[];
      versionAuthorId: string | null;
      /** Who started the thread; they hear of replies too. */
      threadStarterId: string | null;
    }
  | {
      /** An edit tells only the people it newly mentions. */
      kind: 'remark-edited';
      designId: string;
      version: number;
      threadId: string;
      actor: Actor;
      body: string;
      newMentions: string[];
    }
  | {
      kind: 'review-requested';
      designId: string;
      version: number;
      actor: Actor;
      reviewerIds: string[];
      dueDate: string | null;
      note: string;
    }
  | {
      kind: 'decision';
      designId: string;
      version: number;
      actor: Actor;
      outcome: DecisionOutcome;
      summary: string;
      versionAuthorId: string | null;
    };

export interface ReviewNotifier {
  /** Called after the write committed; a failure to notify never undoes the write. */
  notify(event: ReviewEvent): Promise<void>;
}

/** The link in e-mails and inbox items: the version's notebook page with the thread open. */
export function threadPath(designId: string, version: number, threadId: string | null): string {
  const base = `/notebooks/${encodeURIComponent(designId)}/v/${version}`;
  return threadId ? `${base}?thread=${encodeURIComponent(threadId)}` : `${base}?review=1`;
}
