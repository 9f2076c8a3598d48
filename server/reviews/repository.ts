import { and, asc, desc, eq, inArray, lt, or, sql, type SQL } from 'drizzle-orm';
import type { AnyPgColumn } from 'drizzle-orm/pg-core';
import type { Database } from '../../db/client';
import {
  designs,
  designVersions,
  memberships,
  reviewDecisions,
  reviewRemarks,
  reviewRequests,
  reviewThreads,
  users,
} from '../../db/schema';
import type { ReviewState } from '../../shared/reviews';
import type { Role } from '../../shared/teams';

export type ThreadRow = typeof reviewThreads.$inferSelect;
export type ThreadInsert = Omit<typeof reviewThreads.$inferInsert, 'seq'>;
export type RemarkRow = typeof reviewRemarks.$inferSelect;
export type RemarkInsert = Omit<typeof reviewRemarks.$inferInsert, 'seq'>;
export type RequestRow = typeof reviewRequests.$inferSelect;
export type RequestInsert = typeof reviewRequests.$inferInsert;
export type DecisionRow = typeof reviewDecisions.$inferSelect;
export type DecisionInsert = Omit<typeof reviewDecisions.$inferInsert, 'seq'>;

/** How `statusEvents` holds one resolve or reopen (db/schema.ts). */
export type StoredStatusEvent = { status: 'open' | 'resolved'; byId: string | null; byName: string; at: string };
/** How `earlierBodies` holds one edited-away text. */
export type StoredEarlierBody = { body: string; replacedAt: string };

/** The caller's place in a design's team: `role` null when they are not a member. */
export type TeamPlace = { teamId: string; role: Role | null };

/**
 * The review state of version `version` of design `designId`, in SQL, so the design list can
 * show and filter by it without a second query: the latest decision's outcome, else `requested`
 * while a request waits for an answer, else `unreviewed`. The one definition of the rule: the
 * review routes and the notebooks' list both use it.
 */
export function reviewStateSql(designId: AnyPgColumn | SQL, version: AnyPgColumn | SQL): SQL<ReviewState> {
  return sql<ReviewState>`coalesce(
    (select d.outcome from ${reviewDecisions} d
      where d.design_id = ${designId} and d.version_number = ${version}
      order by d.seq desc limit 1),
    case when exists (select 1 from ${reviewRequests} r
      where r.design_id = ${designId} and r.version_number = ${version} and r.answered_at is null)
    then 'requested' else 'unreviewed' end)`;
}

/** One version's review state with its latest decision and open thread count (the `states` route). */
export type VersionStateRow = {
  version: number;
  state: ReviewState;
  decidedById: string | null;
  decidedByName: string | null;
  decidedAt: Date | null;
  openThreads: number;
};

export function createReviewsRepository(db: Database) {
  return {
    /** The design's team and the caller's role in it; null for a made-up design. */
    async designPlace(designId: string, userId: string): Promise<TeamPlace | null> {
      const [row] = await db
        .select({ teamId: designs.teamId, role: memberships.role })
        .from(designs)
        .leftJoin(memberships, and(eq(memberships.teamId, designs.teamId), eq(memberships.userId, userId)))
        .where(eq(designs.id, designId));
      return row ?? null;
    },

    /** A thread with its design's team and the caller's role there; null for a made-up id. */
    async threadPlace(threadId: string, userId: string): Promise<(TeamPlace & { thread: ThreadRow }) | null> {
      const [row] = await db
        .select({ thread: reviewThreads, teamId: designs.teamId, role: memberships.role })
        .from(reviewThreads)
        .innerJoin(designs, eq(designs.id, reviewThreads.designId))
        .leftJoin(memberships, and(eq(memberships.teamId, designs.teamId), eq(memberships.userId, userId)))
        .where(eq(reviewThreads.id, threadId));
      return row ?? null;
    },

    /** A remark with its thread, the design's team and the caller's role there; null for a made-up id. */
    async remarkPlace(
      remarkId: string,
      userId: string,
    ): Promise<(TeamPlace & { remark: RemarkRow; thread: ThreadRow }) | null> {
      const [row] = await db
        .select({ remark: reviewRemarks, thread: reviewThreads, teamId: designs.teamId, role: memberships.role })
        .from(reviewRemarks)
        .innerJoin(reviewThreads, eq(reviewThreads.id, reviewRemarks.threadId))
        .innerJoin(designs, eq(designs.id, reviewThreads.designId))
        .leftJoin(memberships, and(eq(memberships.teamId, designs.teamId), eq(memberships.userId, userId)))
        .where(eq(reviewRemarks.id, remarkId));
      return row ?? null;
    },

    /** A version's author and design; null when the design has no such version. */
    async version(designId: string, n: number): Promise<{ authorId: string | null; params: unknown } | null> {
      const [row] = await db
        .select({ authorId: designVersions.authorId, params: designVersions.params })
        .from(designVersions)
        .where(and(eq(designVersions.designId, designId), eq(designVersions.number, n)));
      return row ?? null;
    },

    /** The designs of some versions, by number. */
    async versionParams(designId: string, numbers: number[]): Promise<Map<number, unknown>> {
      if (numbers.length === 0) return new Map();
      const rows = await db
        .select({ number: designVersions.number, params: designVersions.params })
        .from(designVersions)
        .where(and(eq(designVersions.designId, designId), inArray(designVersions.number, numbers)));
      return new Map(rows.map((row) => [row.number, row.params]));
    },

    /** Which of `ids` are members of the team, with their names and roles. */
    async members(teamId: string, ids: string[]): Promise<{ id: string; displayName: string; role: Role }[]> {
      if (ids.length === 0) return [];
      return db
        .select({ id: users.id, displayName: users.displayName, role: memberships.role })
        .from(memberships)
        .innerJoin(users, eq(users.id, memberships.userId))
        .where(and(eq(memberships.teamId, teamId), inArray(memberships.userId, ids)));
    },

    /** Current display names of the accounts among `ids` (deleted ones are absent). */
    async names(ids: Iterable<string>): Promise<Map<string, string>> {
      const unique = [...new Set(ids)];
      if (unique.length === 0) return new Map();
      const rows = await db
        .select({ id: users.id, displayName: users.displayName })
        .from(users)
        .where(inArray(users.id, unique));
      return new Map(rows.map((row) => [row.id, row.displayName]));
    },

    /**
     * What version `n`'s review panel shows: the threads started on it (any status) and the open
     * threads of earlier versions, oldest version first, then in the order they were started.
     */
    async threadsFor(designId: string, n: number): Promise<ThreadRow[]> {
      return db
        .select()
        .from(reviewThreads)
        .where(
          and(
            eq(reviewThreads.designId, designId),
            or(
              eq(reviewThreads.versionNumber, n),
              and(lt(reviewThreads.versionNumber, n), eq(reviewThreads.status, 'open')),
            ),
          ),
        )
        .orderBy(asc(reviewThreads.versionNumber), asc(reviewThreads.seq));
    },

    async thread(threadId: string): Promise<ThreadRow | null> {
      const [row] = await db.select().from(reviewThreads).where(eq(reviewThreads.id, threadId));
      return row ?? null;
    },

    /** The remarks of some threads, oldest first. */
    async remarksOf(threadIds: string[]): Promise<RemarkRow[]> {
      if (threadIds.length === 0) return [];
      return db
        .select()
        .from(reviewRemarks)
        .where(inArray(reviewRemarks.threadId, threadIds))
        .orderBy(asc(reviewRemarks.seq));
    },

    /** A thread with its first remark, in one transaction. */
    async insertThread(thread: ThreadInsert, remark: RemarkInsert): Promise<void> {
      await db.transaction(async (tx) => {
        await tx.insert(reviewThreads).values(thread);
        await tx.insert(reviewRemarks).values(remark);
      });
    },

    async insertRemark(remark: RemarkInsert): Promise<void> {
      await db.insert(reviewRemarks).values(remark);
    },

    /**
     * Moves a thread to `status` and appends the event, only if it is not there already (so two
     * resolves at once record one event). Answers whether it moved.
     */
    async setStatus(threadId: string, event: StoredStatusEvent): Promise<boolean> {
      const resolved = event.status === 'resolved';
      const rows = await db
        .update(reviewThreads)
        .set({
          status: event.status,
          resolvedBy: resolved ? event.byId : null,
          resolvedAt: resolved ? new Date(event.at) : null,
          statusEvents: sql`${reviewThreads.statusEvents} || ${JSON.stringify([event])}::jsonb`,
        })
        .where(and(eq(reviewThreads.id, threadId), sql`${reviewThreads.status} <> ${event.status}`))
        .returning({ id: reviewThreads.id });
      return rows.length > 0;
    },

    /**
     * Replaces a remark's text, keeping the text it replaces (read in the same statement, so two
     * edits at once each keep the other's). Answers false when the remark has been removed.
     */
    async editRemark(remarkId: string, body: string, mentions: string[], at: Date): Promise<boolean> {
      const rows = await db
        .update(reviewRemarks)
        .set({
          body,
          mentions,
          editedAt: at,
          earlierBodies: sql`${reviewRemarks.earlierBodies} || jsonb_build_array(jsonb_build_object('body', ${reviewRemarks.body}, 'replacedAt', ${at.toISOString()}::text))`,
        })
        .where(and(eq(reviewRemarks.id, remarkId), sql`${reviewRemarks.removedAt} is null`))
        .returning({ id: reviewRemarks.id });
      return rows.length > 0;
    },

    /** Removes a remark's text, its earlier texts and mentions; the row stays so the thread shows the removal. */
    async removeRemark(remarkId: string, at: Date): Promise<void> {
      await db
        .update(reviewRemarks)
        .set({ body: null, mentions: [], earlierBodies: [], removedAt: at })
        .where(and(eq(reviewRemarks.id, remarkId), sql`${reviewRemarks.removedAt} is null`));
    },

    /** A version's review requests, in the order they were first made. */
    async requests(designId: string, n: number): Promise<RequestRow[]> {
      return db
        .select()
        .from(reviewRequests)
        .where(and(eq(reviewRequests.designId, designId), eq(reviewRequests.versionNumber, n)))
        .orderBy(asc(reviewRequests.createdAt), asc(reviewRequests.id));
    },

    /** One request per (design, version, reviewer): asking again updates the due date and note and waits again. */
    async upsertRequests(rows: RequestInsert[]): Promise<void> {
      if (rows.length === 0) return;
      await db
        .insert(reviewRequests)
        .values(rows)
        .onConflictDoUpdate({
          target: [reviewRequests.designId, reviewRequests.versionNumber, reviewRequests.reviewerId],
          set: {
            dueDate: sql`excluded.due_date`,
            note: sql`excluded.note`,
            requestedBy: sql`excluded.requested_by`,
            answeredAt: null,
          },
        });
    },

    /** A version's decisions, oldest first. */
    async decisions(designId: string, n: number): Promise<DecisionRow[]> {
      return db
        .select()
        .from(reviewDecisions)
        .where(and(eq(reviewDecisions.designId, designId), eq(reviewDecisions.versionNumber, n)))
        .orderBy(asc(reviewDecisions.seq));
    },

    /** The newest earlier version's latest sign-off (with or without remarks), if any. */
    async earlierSignOff(designId: string, n: number): Promise<DecisionRow | null> {
      const [row] = await db
        .select()
        .from(reviewDecisions)
        .where(
          and(
            eq(reviewDecisions.designId, designId),
            lt(reviewDecisions.versionNumber, n),
            inArray(reviewDecisions.outcome, ['signed-off', 'signed-off-with-remarks']),
          ),
        )
        .orderBy(desc(reviewDecisions.versionNumber), desc(reviewDecisions.seq))
        .limit(1);
      return row ?? null;
    },

    /** Records a decision and marks the reviewer's request for that version answered, together. */
    async insertDecision(row: DecisionInsert): Promise<void> {
      await db.transaction(async (tx) => {
        await tx.insert(reviewDecisions).values(row);
        if (row.reviewerId)
          await tx
            .update(reviewRequests)
            .set({ answeredAt: row.createdAt })
            .where(
              and(
                eq(reviewRequests.designId, row.designId),
                eq(reviewRequests.versionNumber, row.versionNumber),
                eq(reviewRequests.reviewerId, row.reviewerId),
              ),
            );
      });
    },

    async versionState(designId: string, n: number): Promise<ReviewState> {
      const result = (await db.execute(
        sql`select ${reviewStateSql(sql`${designId}::text`, sql`${n}::integer`)} as state`,
      )) as unknown as { rows: { state: ReviewState }[] };
      return result.rows[0]!.state;
    },

    /** Every version's state, latest decision and open threads started on it, newest first. */
    async versionStates(designId: string): Promise<VersionStateRow[]> {
      const result = (await db.execute(sql`
        select v.number as version,
          ${reviewStateSql(sql`v.design_id`, sql`v.number`)} as state,
          d.reviewer_id as decided_by_id,
          coalesce(u.display_name, d.reviewer_name) as decided_by_name,
          d.created_at as decided_at,
          (select count(*) from ${reviewThreads} t
            where t.design_id = v.design_id and t.version_number = v.number and t.status = 'open')::int as open_threads
        from ${designVersions} v
        left join lateral (
          select * from ${reviewDecisions} rd
          where rd.design_id = v.design_id and rd.version_number = v.number
          order by rd.seq desc limit 1
        ) d on true
        left join ${users} u on u.id = d.reviewer_id
        where v.design_id = ${designId}
        order by v.number desc`)) as unknown as {
        rows: {
          version: number;
          state: ReviewState;
          decided_by_id: string | null;
          decided_by_name: string | null;
          decided_at: string | Date | null;
          open_threads: number;
        }[];
      };
      return result.rows.map((row) => ({
        version: row.version,
        state: row.state,
        decidedById: row.decided_by_id,
        decidedByName: row.decided_by_name,
        decidedAt: row.decided_at === null ? null : new Date(row.decided_at),
        openThreads: Number(row.open_threads),
      }));
    },
  };
}

export type ReviewsRepository = ReturnType<typeof createReviewsRepository>;
