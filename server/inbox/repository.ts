import { and, count, desc, eq, inArray, isNull } from 'drizzle-orm';
import { alias } from 'drizzle-orm/pg-core';
import type { Database } from '../../db/client';
import { designs, inboxItems, mailSettings, memberships, reviewThreads, users } from '../../db/schema';
import { defaultMailSettings, type InboxKind, type MailSettings } from '../../shared/reviews';

export type NewInboxItem = typeof inboxItems.$inferInsert & { kind: InboxKind };

/** Reads and writes for the inbox and the review mail settings; the only place that calls Drizzle for them. */
export function createInboxRepository(db: Database) {
  const actors = alias(users, 'actors');

  /** An item is visible while its design's team still has the person as a member. */
  function visibleTo(userId: string) {
    return and(eq(inboxItems.userId, userId), eq(memberships.userId, userId));
  }

  return {
    async design(designId: string): Promise<{ title: string; teamId: string } | null> {
      const [row] = await db.select({ title: designs.title, teamId: designs.teamId }).from(designs).where(eq(designs.id, designId));
      return row ?? null;
    },

    /** The thread's pin as stored (JSON), for the e-mail's "pinned to …" words. */
    async threadPin(threadId: string): Promise<unknown> {
      const [row] = await db.select({ pin: reviewThreads.pin }).from(reviewThreads).where(eq(reviewThreads.id, threadId));
      return row?.pin ?? null;
    },

    /** The given people who are members of the team, with their address and name. */
    async membersAmong(teamId: string, userIds: string[]) {
      if (userIds.length === 0) return [];
      return db
        .select({ id: users.id, email: users.email, displayName: users.displayName })
        .from(memberships)
        .innerJoin(users, eq(users.id, memberships.userId))
        .where(and(eq(memberships.teamId, teamId), inArray(memberships.userId, userIds)));
    },

    async settingsOf(userIds: string[]): Promise<Map<string, MailSettings>> {
      const found = new Map<string, MailSettings>();
      if (userIds.length === 0) return found;
      const rows = await db.select().from(mailSettings).where(inArray(mailSettings.userId, userIds));
      for (const { userId, ...settings } of rows) found.set(userId, settings);
      return found;
    },

    async settings(userId: string): Promise<MailSettings> {
      return (await this.settingsOf([userId])).get(userId) ?? { ...defaultMailSettings };
    },

    async saveSettings(userId: string, settings: MailSettings): Promise<MailSettings> {
      const [row] = await db
        .insert(mailSettings)
        .values({ userId, ...settings })
        .onConflictDoUpdate({ target: mailSettings.userId, set: settings })
        .returning();
      if (!row) throw new Error('mail settings vanished after upsert');
      const { userId: _userId, ...stored } = row;
      return stored;
    },

    async insertItems(rows: NewInboxItem[]): Promise<void> {
      if (rows.length > 0) await db.insert(inboxItems).values(rows);
    },

    /** Newest first; only items whose design is in a team the person still belongs to. */
    async list(userId: string, options: { unreadOnly: boolean; limit: number }) {
      return db
        .select({
          id: inboxItems.id,
          kind: inboxItems.kind,
          designId: inboxItems.designId,
          designTitle: designs.title,
          version: inboxItems.versionNumber,
          threadId: inboxItems.threadId,
          actorId: actors.id,
          actorName: actors.displayName,
          excerpt: inboxItems.excerpt,
          createdAt: inboxItems.createdAt,
          readAt: inboxItems.readAt,
        })
        .from(inboxItems)
        .innerJoin(designs, eq(designs.id, inboxItems.designId))
        .innerJoin(memberships, eq(memberships.teamId, designs.teamId))
        .leftJoin(actors, eq(actors.id, inboxItems.actorId))
        .where(and(visibleTo(userId), options.unreadOnly ? isNull(inboxItems.readAt) : undefined))
        .orderBy(desc(inboxItems.seq))
        .limit(options.limit);
    },

    async unreadCount(userId: string): Promise<number> {
      const [row] = await db
        .select({ n: count() })
        .from(inboxItems)
        .innerJoin(designs, eq(designs.id, inboxItems.designId))
        .innerJoin(memberships, eq(memberships.teamId, designs.teamId))
        .where(and(visibleTo(userId), isNull(inboxItems.readAt)));
      return row?.n ?? 0;
    },

    /** Marks the person's own unread items read: the listed ones, or all. Others' ids match nothing. */
    async markRead(userId: string, ids: string[] | 'all', at: Date): Promise<void> {
      await db
        .update(inboxItems)
        .set({ readAt: at })
        .where(and(eq(inboxItems.userId, userId), isNull(inboxItems.readAt), ids === 'all' ? undefined : inArray(inboxItems.id, ids)));
    },
  };
}

export type InboxRepository = ReturnType<typeof createInboxRepository>;
