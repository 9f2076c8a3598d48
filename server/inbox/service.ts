import { randomUUID } from 'node:crypto';
import type { User } from '../../shared/auth';
import {
  decisionOutcomeLabels,
  pinLabel,
  pinSchema,
  type InboxItem,
  type InboxKind,
  type MailSettings,
  type MarkReadRequest,
} from '../../shared/reviews';
import type { Clock } from '../clock';
import type { Mailer } from '../mail/mailer';
import type { MailMessage } from '../mail/message';
import { decisionMessage, remarkMessage, reviewRequestMessage } from '../mail/templates';
import { threadPath, type ReviewEvent, type ReviewNotifier } from '../reviews/events';
import type { InboxRepository, NewInboxItem } from './repository';

/** Which mail setting turns each kind of inbox item's e-mail off. */
export const mailSettingOf: Record<InboxKind, keyof MailSettings> = {
  'review-requested': 'reviewRequests',
  mentioned: 'mentions',
  'thread-on-my-design': 'threadsOnMyDesigns',
  'remark-on-my-thread': 'threadsOnMyDesigns',
  'decision-on-my-version': 'decisionsOnMyVersions',
};

/** When one person is concerned in several ways by one event, the highest rank names their one item. */
const rank: Record<InboxKind, number> = {
  mentioned: 3,
  'remark-on-my-thread': 2,
  'thread-on-my-design': 1,
  'review-requested': 1,
  'decision-on-my-version': 1,
};

export const excerptLength = 140;
const quoteLength = 600;

/**
 * Markdown as one line of plain text: link and image targets, emphasis, code, heading and quote
 * marks dropped, whitespace collapsed. Only for excerpts and e-mail quotes, never for display of
 * the remark itself (the client renders that with the Markdown parser).
 */
export function plainText(markdown: string): string {
  return markdown
    .replace(/!\[([^\]]*)\]\([^)]*\)/g, '$1')
    .replace(/\[([^\]]*)\]\([^)]*\)/g, '$1')
    .replace(/^\s{0,3}(#{1,6}|>+|[-*+]|\d+[.)])\s+/gm, '')
    .replace(/```[^\n]*/g, ' ')
    .replace(/(\*\*|__|\*|_|~~|`)(?=\S)([^\n]*?\S)\1/g, '$2')
    .replace(/\s+/g, ' ')
    .trim();
}

/** Cuts at a word boundary near `max` characters and marks the cut with an ellipsis. */
export function shorten(text: string, max: number): string {
  if (text.length <= max) return text;
  const cut = text.slice(0, max - 1);
  const space = cut.lastIndexOf(' ');
  return `${(space > max * 0.6 ? cut.slice(0, space) : cut).trimEnd()}…`;
}

/** "24 Dec 2026" for a calendar date `2026-12-24`: read the same in every time zone. */
function calendarDate(date: string): string {
  const parsed = new Date(`${date}T00:00:00Z`);
  if (Number.isNaN(parsed.getTime())) return date;
  return new Intl.DateTimeFormat('en-GB', { day: 'numeric', month: 'short', year: 'numeric', timeZone: 'UTC' }).format(parsed);
}

/** Who is concerned by an event and how: never the actor, one kind per person, a mention first. */
export function concerned(event: ReviewEvent): Map<string, InboxKind> {
  const kinds = new Map<string, InboxKind>();
  const add = (userId: string | null, kind: InboxKind) => {
    if (!userId || userId === event.actor.id) return;
    const had = kinds.get(userId);
    if (!had || rank[kind] > rank[had]) kinds.set(userId, kind);
  };
  switch (event.kind) {
    case 'thread-started':
      add(event.versionAuthorId, 'thread-on-my-design');
      for (const id of event.mentions) add(id, 'mentioned');
      break;
    case 'remark-added':
      add(event.versionAuthorId, 'thread-on-my-design');
      add(event.threadStarterId, 'remark-on-my-thread');
      for (const id of event.mentions) add(id, 'mentioned');
      break;
    case 'remark-edited':
      for (const id of event.newMentions) add(id, 'mentioned');
      break;
    case 'review-requested':
      for (const id of event.reviewerIds) add(id, 'review-requested');
      break;
    case 'decision':
      add(event.versionAuthorId, 'decision-on-my-version');
      break;
  }
  return kinds;
}

/** The inbox item's one line for an event. */
export function excerptOf(event: ReviewEvent): string {
  switch (event.kind) {
    case 'thread-started':
    case 'remark-added':
    case 'remark-edited':
      return shorten(plainText(event.body), excerptLength);
    case 'decision':
      return shorten(`${decisionOutcomeLabels[event.outcome]}: ${plainText(event.summary)}`, excerptLength);
    case 'review-requested': {
      const note = plainText(event.note);
      if (event.dueDate) return shorten(note ? `Due ${calendarDate(event.dueDate)} — ${note}` : `Due ${calendarDate(event.dueDate)}`, excerptLength);
      return shorten(note || 'No due date', excerptLength);
    }
  }
}

export type InboxDeps = {
  repository: InboxRepository;
  mailer: Mailer;
  clock: Clock;
  publicUrl: () => string;
  /** Where a failed notification is written; it never reaches the caller. */
  log: (error: unknown) => void;
};

export function createInboxService({ repository, mailer, clock, publicUrl, log }: InboxDeps) {
  function link(event: ReviewEvent): string {
    const threadId = 'threadId' in event ? event.threadId : null;
    return `${publicUrl().replace(/\/+$/, '')}${threadPath(event.designId, event.version, threadId)}`;
  }

  async function pinWords(event: ReviewEvent): Promise<string | null> {
    if (!('threadId' in event)) return null;
    const parsed = pinSchema.safeParse(await repository.threadPin(event.threadId));
    return parsed.success && parsed.data.kind !== 'version' ? pinLabel(parsed.data) : null;
  }

  function mailFor(event: ReviewEvent, kind: InboxKind, to: { email: string; displayName: string }, title: string, pin: string | null): MailMessage {
    const common = { name: to.displayName, actor: event.actor.displayName, title, version: event.version, link: link(event) };
    switch (event.kind) {
      case 'thread-started':
      case 'remark-added':
      case 'remark-edited':
        return remarkMessage(to.email, {
          ...common,
          kind: kind as 'mentioned' | 'thread-on-my-design' | 'remark-on-my-thread',
          startsThread: event.kind === 'thread-started',
          pin,
          quote: shorten(plainText(event.body), quoteLength),
        });
      case 'review-requested':
        return reviewRequestMessage(to.email, {
          ...common,
          dueDate: event.dueDate ? calendarDate(event.dueDate) : null,
          note: shorten(plainText(event.note), quoteLength),
        });
      case 'decision':
        return decisionMessage(to.email, {
          ...common,
          outcome: event.outcome,
          outcomeLabel: decisionOutcomeLabels[event.outcome],
          summary: shorten(plainText(event.summary), quoteLength),
        });
    }
  }

  async function notify(event: ReviewEvent): Promise<void> {
    const kinds = concerned(event);
    if (kinds.size === 0) return;
    const design = await repository.design(event.designId);
    if (!design) return;
    // People who left the team (a version's author may have) hear nothing more of it.
    const people = await repository.membersAmong(design.teamId, [...kinds.keys()]);
    if (people.length === 0) return;
    const now = clock.now();
    const excerpt = excerptOf(event);
    const threadId = 'threadId' in event ? event.threadId : null;
    await repository.insertItems(
      people.map(
        (person): NewInboxItem => ({
          id: randomUUID(),
          userId: person.id,
          kind: kinds.get(person.id)!,
          designId: event.designId,
          versionNumber: event.version,
          threadId,
          actorId: event.actor.id,
          excerpt,
          createdAt: now,
        }),
      ),
    );
    const settings = await repository.settingsOf(people.map((person) => person.id));
    const wanted = people.filter((person) => settings.get(person.id)?.[mailSettingOf[kinds.get(person.id)!]] ?? true);
    if (wanted.length === 0) return;
    const pin = await pinWords(event);
    for (const person of wanted) {
      try {
        await mailer.send(mailFor(event, kinds.get(person.id)!, person, design.title, pin));
      } catch (error) {
        log(error);
      }
    }
  }

  const notifier: ReviewNotifier = {
    async notify(event) {
      try {
        await notify(event);
      } catch (error) {
        log(error);
      }
    },
  };

  return {
    notifier,

    async list(user: User, query: { unread: 'only' | 'all'; limit: number }): Promise<{ items: InboxItem[]; unread: number }> {
      const rows = await repository.list(user.id, { unreadOnly: query.unread === 'only', limit: query.limit });
      const items = rows.map(
        (row): InboxItem => ({
          id: row.id,
          kind: row.kind,
          designId: row.designId,
          designTitle: row.designTitle,
          version: row.version,
          threadId: row.threadId,
          actor: row.actorId ? { id: row.actorId, displayName: row.actorName ?? '' } : null,
          excerpt: row.excerpt,
          createdAt: row.createdAt.toISOString(),
          readAt: row.readAt ? row.readAt.toISOString() : null,
        }),
      );
      return { items, unread: await repository.unreadCount(user.id) };
    },

    async unreadCount(user: User): Promise<{ unread: number }> {
      return { unread: await repository.unreadCount(user.id) };
    },

    async markRead(user: User, request: MarkReadRequest): Promise<{ unread: number }> {
      await repository.markRead(user.id, 'all' in request ? 'all' : request.ids, clock.now());
      return { unread: await repository.unreadCount(user.id) };
    },

    async mailSettings(user: User): Promise<{ settings: MailSettings }> {
      return { settings: await repository.settings(user.id) };
    },

    async updateMailSettings(user: User, settings: MailSettings): Promise<{ settings: MailSettings }> {
      return { settings: await repository.saveSettings(user.id, settings) };
    },
  };
}

export type InboxService = ReturnType<typeof createInboxService>;
