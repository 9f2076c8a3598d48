import { randomUUID } from 'node:crypto';
import { asc, eq, inArray, sql } from 'drizzle-orm';
import { alias } from 'drizzle-orm/pg-core';
import type { Database } from '../../db/client';
import { reviewDecisions, reviewRemarks, reviewThreads, users } from '../../db/schema';
import type { NotebookFileReview, NotebookFileThread } from '../../shared/notebooks';
import type { Pin, ThreadStatus } from '../../shared/reviews';

/** A resolve or reopen as `review_threads.status_events` keeps it. */
type StoredStatusEvent = { status: ThreadStatus; byId: string | null; byName: string; at: string };
type StoredEarlierBody = { body: string; replacedAt: string };

const threadCreator = alias(users, 'thread_creator');
const threadResolver = alias(users, 'thread_resolver');
const remarkAuthor = alias(users, 'remark_author');
const decisionReviewer = alias(users, 'decision_reviewer');

// Multi-row inserts stay well below PostgreSQL's 65,535 bound parameters.
const insertChunk = 500;

async function insertInChunks<T>(rows: T[], insert: (chunk: T[]) => Promise<unknown>) {
  for (let start = 0; start < rows.length; start += insertChunk) await insert(rows.slice(start, start + insertChunk));
}

const iso = (at: Date | null) => at?.toISOString() ?? null;

/** A design field's value in stored params, by its dotted path (`slits.exitWidthUm`). */
function fieldValue(params: unknown, path: string): unknown {
  let value: unknown = params;
  for (const key of path.split('.')) {
    if (typeof value !== 'object' || value === null) return undefined;
    value = (value as Record<string, unknown>)[key];
  }
  return value;
}

const isFileScalar = (value: unknown): value is number | string | boolean | null =>
  value === null || ['number', 'string', 'boolean'].includes(typeof value);

/**
 * A design's threads, remarks and decisions as a notebook file carries them, and back. The names
 * written out are the people's current display names, or the names kept with the rows when the
 * account is gone (or the rows came from a file). Import writes no person ids: the file's names
 * are not accounts here.
 */
export function reviewTransfer(db: Database) {
  return {
    /** Threads in the order they were started (remarks in theirs), decisions in the order recorded. */
    async read(designId: string): Promise<NotebookFileReview> {
      const threads = await db
        .select({
          id: reviewThreads.id,
          versionNumber: reviewThreads.versionNumber,
          pin: reviewThreads.pin,
          pinnedValue: reviewThreads.pinnedValue,
          status: reviewThreads.status,
          createdByName: sql<string>`coalesce(${threadCreator.displayName}, ${reviewThreads.createdByName})`,
          createdAt: reviewThreads.createdAt,
          resolverName: threadResolver.displayName,
          resolvedAt: reviewThreads.resolvedAt,
          statusEvents: reviewThreads.statusEvents,
        })
        .from(reviewThreads)
        .leftJoin(threadCreator, eq(threadCreator.id, reviewThreads.createdBy))
        .leftJoin(threadResolver, eq(threadResolver.id, reviewThreads.resolvedBy))
        .where(eq(reviewThreads.designId, designId))
        .orderBy(asc(reviewThreads.seq));
      const remarks = await db
        .select({
          threadId: reviewRemarks.threadId,
          authorName: sql<string>`coalesce(${remarkAuthor.displayName}, ${reviewRemarks.authorName})`,
          body: reviewRemarks.body,
          createdAt: reviewRemarks.createdAt,
          editedAt: reviewRemarks.editedAt,
          earlierBodies: reviewRemarks.earlierBodies,
          removedAt: reviewRemarks.removedAt,
        })
        .from(reviewRemarks)
        .innerJoin(reviewThreads, eq(reviewThreads.id, reviewRemarks.threadId))
        .leftJoin(remarkAuthor, eq(remarkAuthor.id, reviewRemarks.authorId))
        .where(eq(reviewThreads.designId, designId))
        .orderBy(asc(reviewRemarks.seq));
      const decisions = await db
        .select({
          version: reviewDecisions.versionNumber,
          reviewerName: sql<string>`coalesce(${decisionReviewer.displayName}, ${reviewDecisions.reviewerName})`,
          outcome: reviewDecisions.outcome,
          summary: reviewDecisions.summary,
          createdAt: reviewDecisions.createdAt,
        })
        .from(reviewDecisions)
        .leftJoin(decisionReviewer, eq(decisionReviewer.id, reviewDecisions.reviewerId))
        .where(eq(reviewDecisions.designId, designId))
        .orderBy(asc(reviewDecisions.seq));

      // Resolves and reopens name their people inside JSON: look the still-existing ones up once.
      const eventsOf = (thread: (typeof threads)[number]) => (thread.statusEvents ?? []) as StoredStatusEvent[];
      const eventPeople = [...new Set(threads.flatMap((t) => eventsOf(t).flatMap((e) => (e.byId ? [e.byId] : []))))];
      const currentNames = new Map(
        eventPeople.length === 0
          ? []
          : (
              await db
                .select({ id: users.id, displayName: users.displayName })
                .from(users)
                .where(inArray(users.id, eventPeople))
            ).map((u) => [u.id, u.displayName] as const),
      );

      const remarksByThread = new Map<string, typeof remarks>();
      for (const remark of remarks) {
        const list = remarksByThread.get(remark.threadId);
        if (list) list.push(remark);
        else remarksByThread.set(remark.threadId, [remark]);
      }
      return {
        threads: threads.map((thread) => {
          const statusEvents = eventsOf(thread).map((e) => ({
            status: e.status,
            byName: (e.byId && currentNames.get(e.byId)) || e.byName,
            at: new Date(e.at).toISOString(),
          }));
          const lastResolve = statusEvents.findLast((e) => e.status === 'resolved');
          const pin = thread.pin as Pin;
          const exported: NotebookFileThread = {
            version: thread.versionNumber,
            pin,
            status: thread.status,
            createdByName: thread.createdByName,
            createdAt: thread.createdAt.toISOString(),
            resolvedByName: thread.status === 'resolved' ? (thread.resolverName ?? lastResolve?.byName ?? null) : null,
            resolvedAt: thread.status === 'resolved' ? iso(thread.resolvedAt) : null,
            statusEvents,
            remarks: (remarksByThread.get(thread.id) ?? []).map((remark) => ({
              authorName: remark.authorName,
              body: remark.body,
              createdAt: remark.createdAt.toISOString(),
              editedAt: iso(remark.editedAt),
              earlierBodies: ((remark.earlierBodies ?? []) as StoredEarlierBody[]).map((e) => ({
                body: e.body,
                replacedAt: new Date(e.replacedAt).toISOString(),
              })),
              removedAt: iso(remark.removedAt),
            })),
          };
          if (pin.kind === 'field' && thread.pinnedValue !== null && isFileScalar(thread.pinnedValue))
            exported.pinnedValue = thread.pinnedValue;
          return exported;
        }),
        decisions: decisions.map((d) => ({ ...d, createdAt: d.createdAt.toISOString() })),
      };
    },

    /**
     * Writes a file's review onto the design just inserted with `versionParams` (its versions'
     * params, oldest first), inside the import's transaction. A field pin's value is read from
     * the version again, as summaries are recomputed; the file's `pinnedValue` is informative.
     */
    async insert(designId: string, review: NotebookFileReview, versionParams: readonly unknown[]): Promise<void> {
      const threadRows: (typeof reviewThreads.$inferInsert)[] = [];
      const remarkRows: (typeof reviewRemarks.$inferInsert)[] = [];
      for (const thread of review.threads) {
        const id = randomUUID();
        const statusEvents: StoredStatusEvent[] = thread.statusEvents.map((e) => ({ ...e, byId: null }));
        const last = statusEvents.at(-1);
        // A hand-written file may name who resolved without the event: keep the name in one.
        if (
          thread.status === 'resolved' &&
          thread.resolvedByName !== null &&
          thread.resolvedAt !== null &&
          !(last?.status === 'resolved' && last.byName === thread.resolvedByName)
        ) {
          statusEvents.push({ status: 'resolved', byId: null, byName: thread.resolvedByName, at: thread.resolvedAt });
        }
        const pinned =
          thread.pin.kind === 'field' ? fieldValue(versionParams[thread.version - 1], thread.pin.path) : undefined;
        threadRows.push({
          id,
          designId,
          versionNumber: thread.version,
          pin: thread.pin,
          pinnedValue: pinned ?? null,
          status: thread.status,
          createdBy: null,
          createdByName: thread.createdByName,
          createdAt: new Date(thread.createdAt),
          resolvedBy: null,
          resolvedAt: thread.resolvedAt === null ? null : new Date(thread.resolvedAt),
          statusEvents,
        });
        for (const remark of thread.remarks) {
          remarkRows.push({
            id: randomUUID(),
            threadId: id,
            authorId: null,
            authorName: remark.authorName,
            body: remark.body,
            earlierBodies: remark.earlierBodies,
            createdAt: new Date(remark.createdAt),
            editedAt: remark.editedAt === null ? null : new Date(remark.editedAt),
            removedAt: remark.removedAt === null ? null : new Date(remark.removedAt),
          });
        }
      }
      // Rows go in file order, so their sequence numbers keep the file's order.
      await insertInChunks(threadRows, (chunk) => db.insert(reviewThreads).values(chunk));
      await insertInChunks(remarkRows, (chunk) => db.insert(reviewRemarks).values(chunk));
      await insertInChunks(review.decisions, (chunk) =>
        db.insert(reviewDecisions).values(
          chunk.map((d) => ({
            id: randomUUID(),
            designId,
            versionNumber: d.version,
            reviewerId: null,
            reviewerName: d.reviewerName,
            outcome: d.outcome,
            summary: d.summary,
            createdAt: new Date(d.createdAt),
          })),
        ),
      );
    },
  };
}

export type ReviewTransfer = ReturnType<typeof reviewTransfer>;
