import type { InboxItem } from '@/shared/reviews';

/**
 * Where an inbox item leads: its thread on the version it was written on, or the version's review
 * (a request or a decision has no thread). The notebook screen opens the thread named in the query.
 */
export function inboxItemPath(item: Pick<InboxItem, 'designId' | 'version' | 'threadId'>): string {
  const version = `/notebooks/${encodeURIComponent(item.designId)}/v/${item.version}`;
  return item.threadId ? `${version}?thread=${encodeURIComponent(item.threadId)}` : `${version}?review=1`;
}

/** “Teaching monochromator” v2: the design and the version an item is about. */
export function inboxItemSubject(item: Pick<InboxItem, 'designTitle' | 'version'>): string {
  return `“${item.designTitle}” v${item.version}`;
}

/** Above this the header badge says "99+", so the phone header keeps room for the wordmark. */
const badgeMax = 99;

/** The header badge's visible text: "3", or "99+" for more. */
export function inboxBadgeText(unread: number): string {
  return unread > badgeMax ? `${badgeMax}+` : String(unread);
}

/**
 * "Inbox, 3 unread": the header link's accessible name. It holds the visible words ("Inbox 3")
 * in order, as WCAG 2.5.3 asks; just "Inbox" until the count is known.
 */
export function inboxLinkName(unread: number | undefined): string {
  if (unread === undefined) return 'Inbox';
  if (unread === 0) return 'Inbox, nothing unread';
  return unread > badgeMax ? `Inbox, ${badgeMax}+ unread` : `Inbox, ${unread} unread`;
}
