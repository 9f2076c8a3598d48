import { randomUUID } from 'node:crypto';
import type { z } from 'zod';
import type { User } from '../../shared/auth';
import type { Design } from '../../shared/design';
import { changedPaths } from '../../shared/design-diff';
import type { Person } from '../../shared/notebooks/fields';
import type {
  Carry,
  Decision,
  editRemarkRequestSchema,
  Pin,
  recordDecisionRequestSchema,
  Remark,
  replyRequestSchema,
  requestReviewSchema,
  ReviewRequestItem,
  startThreadRequestSchema,
  Thread,
  ThreadStatus,
  VersionReview,
  VersionReviewState,
} from '../../shared/reviews';
import { can, type Capability } from '../../shared/teams';
import type { Clock } from '../clock';
import { badRequest, conflict, forbidden, notFound } from '../http/errors';
// The notebook routes' words, so an outsider cannot tell a real design from a made-up one.
import { designNotFound, versionNotFound } from '../notebooks/service';
import { allow } from '../teams/index';
import type { Actor, ReviewEvent, ReviewNotifier } from './events';
import type {
  DecisionRow,
  RemarkRow,
  RequestRow,
  ReviewsRepository,
  StoredEarlierBody,
  StoredStatusEvent,
  ThreadRow,
} from './repository';

export const threadNotFound = () => notFound('No such thread.');
export const remarkNotFound = () => notFound('No such remark.');
const notInTeam = 'names someone who is not in this team';

/** What the design list needs to hear when a version's review state changes: its pages are remembered. */
export type ReviewLists = { forgetTeam(teamId: string): void };

export type ReviewsServiceDeps = {
  repository: ReviewsRepository;
  clock: Clock;
  notifier: ReviewNotifier;
  lists: ReviewLists;
  /** Where a failure to notify is written; it never fails the request. */
  log?: (error: unknown) => void;
};

/** The value at a dotted path of a design (`slits.exitWidthUm`), or null when it has none. */
export function valueAt(params: unknown, path: string): unknown {
  let value: unknown = params;
  for (const key of path.split('.')) {
    if (typeof value !== 'object' || value === null) return null;
    value = (value as Record<string, unknown>)[key];
  }
  return value ?? null;
}

const sameValue = (a: unknown, b: unknown) => JSON.stringify(a ?? null) === JSON.stringify(b ?? null);

/**
 * How an open thread of an earlier version reads on version `n` (see `carrySchema`): a field pin
 * compares the field's value then and now; any other pin compares the whole design.
 */
export function carryOf(thread: Pick<ThreadRow, 'versionNumber' | 'pin' | 'pinnedValue'>, n: number, then: unknown, now: unknown): Carry {
  const since = thread.versionNumber;
  if (since === n) return { state: 'here' };
  const pin = thread.pin as Pin;
  if (pin.kind === 'field') {
    const current = valueAt(now, pin.path);
    const was = thread.pinnedValue ?? null;
    return sameValue(was, current) ? { state: 'still-applies', since } : { state: 'field-changed', since, was, now: current };
  }
  const paths = then && now ? changedPaths(then as Design, now as Design) : [];
  return paths.length === 0 ? { state: 'still-applies', since } : { state: 'design-changed', since, paths };
}

/** People as the answers name them: the account's current name, else the name kept with the row. */
type Names = Map<string, string>;
const person = (names: Names, id: string | null, kept = ''): Person | null =>
  id ? { id, displayName: names.get(id) ?? kept } : null;

function toRemark(row: RemarkRow, names: Names): Remark {
  const removed = row.removedAt !== null;
  return {
    id: row.id,
    author: person(names, row.authorId, row.authorName),
    authorName: (row.authorId && names.get(row.authorId)) || row.authorName,
    body: removed ? null : row.body,
    mentions: removed ? [] : row.mentions.filter((id) => names.has(id)).map((id) => ({ id, displayName: names.get(id)! })),
    createdAt: row.createdAt.toISOString(),
    editedAt: row.editedAt?.toISOString() ?? null,
    earlierBodies: removed ? [] : (row.earlierBodies as StoredEarlierBody[]),
    removedAt: row.removedAt?.toISOString() ?? null,
  };
}

function toThread(row: ThreadRow, remarks: RemarkRow[], names: Names, carry: Carry): Thread {
  const pin = row.pin as Pin;
  const events = row.statusEvents as StoredStatusEvent[];
  return {
    id: row.id,
    designId: row.designId,
    version: row.versionNumber,
    pin,
    ...(pin.kind === 'field' ? { pinnedValue: row.pinnedValue ?? null } : {}),
    status: row.status,
    resolvedBy: row.status === 'resolved' ? person(names, row.resolvedBy, events.at(-1)?.byName) : null,
    resolvedAt: row.status === 'resolved' ? (row.resolvedAt?.toISOString() ?? null) : null,
    statusEvents: events.map((event) => ({ status: event.status, by: person(names, event.byId, event.byName), at: event.at })),
    remarks: remarks.map((remark) => toRemark(remark, names)),
    carry,
  };
}

function toDecision(row: DecisionRow, names: Names): Decision {
  return {
    id: row.id,
    version: row.versionNumber,
    reviewer: person(names, row.reviewerId, row.reviewerName),
    reviewerName: (row.reviewerId && names.get(row.reviewerId)) || row.reviewerName,
    outcome: row.outcome,
    summary: row.summary,
    createdAt: row.createdAt.toISOString(),
  };
}

function toRequest(row: RequestRow, names: Names): ReviewRequestItem {
  return {
    id: row.id,
    version: row.versionNumber,
    requestedBy: person(names, row.requestedBy),
    reviewer: person(names, row.reviewerId)!,
    dueDate: row.dueDate,
    note: row.note,
    createdAt: row.createdAt.toISOString(),
    answeredAt: row.answeredAt?.toISOString() ?? null,
  };
}

/** Every account id a set of rows names, so their names are read in one query. */
function idsOf(threads: ThreadRow[], remarks: RemarkRow[], others: (string | null)[] = []): string[] {
  const ids: (string | null)[] = [...others];
  for (const thread of threads) {
    ids.push(thread.createdBy, thread.resolvedBy);
    for (const event of thread.statusEvents as StoredStatusEvent[]) ids.push(event.byId);
  }
  for (const remark of remarks) ids.push(remark.authorId, ...remark.mentions);
  return ids.filter((id): id is string => id !== null);
}

const unique = (ids: string[]) => [...new Set(ids)];
const actorOf = (user: User): Actor => ({ id: user.id, displayName: user.displayName });

/**
 * Design review: threads pinned to what they are about, review requests and decisions. Roles are
 * checked here (never only in the client); the inbox hears of every committed write.
 */
export function createReviewsService({ repository, clock, notifier, lists, log = console.error }: ReviewsServiceDeps) {
  /** Outsiders and made-up ids: 404 in the notebooks' words. Members without the capability: 403. */
  async function designFor(user: User, designId: string, capability: Capability) {
    const place = await repository.designPlace(designId, user.id);
    const role = allow(place?.role, capability, designNotFound);
    return { teamId: place!.teamId, role };
  }

  async function versionOf(designId: string, n: number) {
    const version = await repository.version(designId, n);
    if (!version) throw versionNotFound(n);
    return version;
  }

  async function threadFor(user: User, threadId: string, capability: Capability) {
    const place = await repository.threadPlace(threadId, user.id);
    allow(place?.role, capability, threadNotFound);
    return place!;
  }

  async function ownRemark(user: User, remarkId: string, refusal: string) {
    const place = await repository.remarkPlace(remarkId, user.id);
    allow(place?.role, 'designs.comment', remarkNotFound);
    if (place!.remark.authorId !== user.id) throw forbidden(refusal);
    return place!;
  }

  /** Every mentioned id must be a member of the design's team. */
  async function checkMentions(teamId: string, mentions: string[]): Promise<string[]> {
    const ids = unique(mentions);
    const members = await repository.members(teamId, ids);
    if (members.length !== ids.length) throw badRequest('A mention names someone who is not in this team.', { mentions: notInTeam });
    return ids;
  }

  /** Tells the inbox after the write committed; a failure is logged and never fails the request. */
  async function tell(event: ReviewEvent) {
    try {
      await notifier.notify(event);
    } catch (error) {
      log(error);
    }
  }

  /** One thread as an answer, read afresh, as it reads on its own version. */
  async function threadAnswer(threadId: string): Promise<Thread> {
    const row = await repository.thread(threadId);
    if (!row) throw threadNotFound();
    const remarks = await repository.remarksOf([row.id]);
    const names = await repository.names(idsOf([row], remarks));
    return toThread(row, remarks, names, { state: 'here' });
  }

  async function requestsAnswer(designId: string, n: number): Promise<ReviewRequestItem[]> {
    const rows = await repository.requests(designId, n);
    const names = await repository.names(rows.flatMap((row) => (row.requestedBy ? [row.reviewerId, row.requestedBy] : [row.reviewerId])));
    return rows.map((row) => toRequest(row, names));
  }

  /** Version `n`'s review as the panel shows it; callers check access first. */
  async function reviewOf(designId: string, n: number): Promise<VersionReview> {
    const version = await versionOf(designId, n);
    const threads = await repository.threadsFor(designId, n);
    // Field pins compare with the value kept on the thread; other pins need their version's design.
    const earlier = [...new Set(threads.filter((t) => t.versionNumber < n && (t.pin as Pin).kind !== 'field').map((t) => t.versionNumber))];
    const [remarks, decisions, params, signOff, state] = await Promise.all([
      repository.remarksOf(threads.map((t) => t.id)),
      repository.decisions(designId, n),
      repository.versionParams(designId, earlier),
      repository.earlierSignOff(designId, n),
      repository.versionState(designId, n),
    ]);
    const requests = await requestsAnswer(designId, n);
    const names = await repository.names(
      idsOf(threads, remarks, [...decisions.map((d) => d.reviewerId), signOff?.reviewerId ?? null]),
    );
    const remarksBy = new Map<string, RemarkRow[]>();
    for (const remark of remarks) remarksBy.set(remark.threadId, [...(remarksBy.get(remark.threadId) ?? []), remark]);
    let signOffPaths: string[] = [];
    if (signOff) {
      const then = (await repository.versionParams(designId, [signOff.versionNumber])).get(signOff.versionNumber);
      signOffPaths = then ? changedPaths(then as Design, version.params as Design) : [];
    }
    return {
      version: n,
      authorId: version.authorId,
      state,
      threads: threads.map((thread) =>
        toThread(
          thread,
          remarksBy.get(thread.id) ?? [],
          names,
          carryOf(thread, n, params.get(thread.versionNumber), version.params),
        ),
      ),
      requests,
      decisions: decisions.map((row) => toDecision(row, names)),
      earlierSignOff: signOff ? { decision: toDecision(signOff, names), changedPaths: signOffPaths } : null,
    };
  }

  return {
    /** Version `n`'s review panel: its threads, the open ones carried from earlier versions, requests, decisions, state. */
    async get(user: User, designId: string, n: number): Promise<VersionReview> {
      await designFor(user, designId, 'designs.read');
      return reviewOf(designId, n);
    },

    /** The same without an access check: for the design sheet, whose route checked access already. */
    reviewOf,

    /** Every version's state, newest first. */
    async states(user: User, designId: string): Promise<VersionReviewState[]> {
      await designFor(user, designId, 'designs.read');
      const rows = await repository.versionStates(designId);
      return rows.map((row) => ({
        version: row.version,
        state: row.state,
        decidedBy: row.decidedById ? { id: row.decidedById, displayName: row.decidedByName ?? '' } : null,
        decidedAt: row.decidedAt?.toISOString() ?? null,
        openThreads: row.openThreads,
      }));
    },

    /** A thread on version `n`, pinned to what the caller chose; a field pin keeps the field's value on `n`. */
    async startThread(
      user: User,
      designId: string,
      n: number,
      input: z.output<typeof startThreadRequestSchema>,
    ): Promise<Thread> {
      const { teamId } = await designFor(user, designId, 'designs.comment');
      const version = await versionOf(designId, n);
      const mentions = await checkMentions(teamId, input.mentions);
      const now = clock.now();
      const threadId = randomUUID();
      await repository.insertThread(
        {
          id: threadId,
          designId,
          versionNumber: n,
          pin: input.pin,
          pinnedValue: input.pin.kind === 'field' ? valueAt(version.params, input.pin.path) : null,
          status: 'open',
          createdBy: user.id,
          createdByName: user.displayName,
          createdAt: now,
        },
        {
          id: randomUUID(),
          threadId,
          authorId: user.id,
          authorName: user.displayName,
          body: input.body,
          mentions,
          createdAt: now,
        },
      );
      await tell({
        kind: 'thread-started',
        designId,
        version: n,
        threadId,
        actor: actorOf(user),
        body: input.body,
        mentions,
        versionAuthorId: version.authorId,
      });
      return threadAnswer(threadId);
    },

    async getThread(user: User, threadId: string): Promise<Thread> {
      await threadFor(user, threadId, 'designs.read');
      return threadAnswer(threadId);
    },

    async reply(user: User, threadId: string, input: z.output<typeof replyRequestSchema>): Promise<Thread> {
      const { thread, teamId } = await threadFor(user, threadId, 'designs.comment');
      const mentions = await checkMentions(teamId, input.mentions);
      await repository.insertRemark({
        id: randomUUID(),
        threadId,
        authorId: user.id,
        authorName: user.displayName,
        body: input.body,
        mentions,
        createdAt: clock.now(),
      });
      const version = await repository.version(thread.designId, thread.versionNumber);
      await tell({
        kind: 'remark-added',
        designId: thread.designId,
        version: thread.versionNumber,
        threadId,
        actor: actorOf(user),
        body: input.body,
        mentions,
        versionAuthorId: version?.authorId ?? null,
        threadStarterId: thread.createdBy,
      });
      return threadAnswer(threadId);
    },

    /** Resolve or reopen; asking for the status it already has changes nothing. */
    async setThreadStatus(user: User, threadId: string, status: ThreadStatus): Promise<Thread> {
      await threadFor(user, threadId, 'designs.comment');
      await repository.setStatus(threadId, {
        status,
        byId: user.id,
        byName: user.displayName,
        at: clock.now().toISOString(),
      });
      return threadAnswer(threadId);
    },

    /** Only its author edits a remark; the earlier text is kept. */
    async editRemark(user: User, remarkId: string, input: z.output<typeof editRemarkRequestSchema>): Promise<Thread> {
      const { remark, thread, teamId } = await ownRemark(user, remarkId, 'You can only edit your own remarks.');
      const removed = () => conflict('This remark was removed, so it can no longer be edited.');
      if (remark.removedAt) throw removed();
      const mentions = await checkMentions(teamId, input.mentions);
      if (!(await repository.editRemark(remarkId, input.body, mentions, clock.now()))) throw removed();
      const newMentions = mentions.filter((id) => !remark.mentions.includes(id));
      await tell({
        kind: 'remark-edited',
        designId: thread.designId,
        version: thread.versionNumber,
        threadId: thread.id,
        actor: actorOf(user),
        body: input.body,
        newMentions,
      });
      return threadAnswer(thread.id);
    },

    /** Only its author removes a remark; the thread keeps its place and says it was removed. */
    async removeRemark(user: User, remarkId: string): Promise<Thread> {
      const { thread } = await ownRemark(user, remarkId, 'You can only remove your own remarks.');
      await repository.removeRemark(remarkId, clock.now());
      return threadAnswer(thread.id);
    },

    /** An owner asks named reviewers; each must be able to review and must not be the version's author. */
    async requestReview(
      user: User,
      designId: string,
      n: number,
      input: z.output<typeof requestReviewSchema>,
    ): Promise<ReviewRequestItem[]> {
      const { teamId } = await designFor(user, designId, 'designs.edit');
      const version = await versionOf(designId, n);
      const ids = unique(input.reviewerIds);
      const members = new Map((await repository.members(teamId, ids)).map((m) => [m.id, m]));
      for (const id of ids) {
        const member = members.get(id);
        const why = !member
          ? notInTeam
          : !can(member.role, 'designs.review')
            ? `names ${member.displayName}, a ${member.role}, who cannot review`
            : id === version.authorId
              ? `names ${member.displayName}, who wrote v${n}: the author never reviews their own version`
              : null;
        if (why) throw badRequest('A named reviewer cannot review this version.', { reviewerIds: why });
      }
      const now = clock.now();
      await repository.upsertRequests(
        ids.map((reviewerId) => ({
          id: randomUUID(),
          designId,
          versionNumber: n,
          requestedBy: user.id,
          reviewerId,
          dueDate: input.dueDate,
          note: input.note,
          createdAt: now,
        })),
      );
      lists.forgetTeam(teamId);
      await tell({
        kind: 'review-requested',
        designId,
        version: n,
        actor: actorOf(user),
        reviewerIds: ids,
        dueDate: input.dueDate,
        note: input.note,
      });
      return requestsAnswer(designId, n);
    },

    /** A decision on version `n`, never by its author; it stays with `n` (a new version starts unreviewed). */
    async decide(
      user: User,
      designId: string,
      n: number,
      input: z.output<typeof recordDecisionRequestSchema>,
    ): Promise<Decision> {
      const { teamId } = await designFor(user, designId, 'designs.review');
      const version = await versionOf(designId, n);
      if (version.authorId === user.id) throw forbidden(`You wrote v${n}; another owner or reviewer must decide on it.`);
      const row = {
        id: randomUUID(),
        designId,
        versionNumber: n,
        reviewerId: user.id,
        reviewerName: user.displayName,
        outcome: input.outcome,
        summary: input.summary,
        createdAt: clock.now(),
      };
      await repository.insertDecision(row);
      lists.forgetTeam(teamId);
      await tell({
        kind: 'decision',
        designId,
        version: n,
        actor: actorOf(user),
        outcome: input.outcome,
        summary: input.summary,
        versionAuthorId: version.authorId,
      });
      return toDecision({ ...row, seq: 0 }, new Map([[user.id, user.displayName]]));
    },
  };
}

export type ReviewsService = ReturnType<typeof createReviewsService>;
