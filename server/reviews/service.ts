import { randomUUID } from 'node:crypto';
import type { z } from 'zod';
import type { User } from '../../shared/auth';
import type { createReviewRequestSchema, Review } from '../../shared/reviews';
import type { Capability } from '../../shared/teams';
import type { Clock } from '../clock';
// The notebook routes' words, so an outsider cannot tell a real design from a made-up one.
import { designNotFound, versionNotFound } from '../notebooks/service';
import { allow } from '../teams/index';
import type { ReviewsRepository, ReviewView } from './repository';

function toReview(row: ReviewView): Review {
  return {
    id: row.id,
    version: row.versionNumber,
    author: row.authorId ? { id: row.authorId, displayName: row.authorName ?? '' } : null,
    body: row.body,
    decision: row.decision,
    createdAt: row.createdAt.toISOString(),
  };
}

export type ReviewsServiceDeps = { repository: ReviewsRepository; clock: Clock };

/** Review comments and decisions on design versions. Roles are checked here, never only in the client. */
export function createReviewsService({ repository, clock }: ReviewsServiceDeps) {
  /** Outsiders and made-up ids: 404. Members without the capability: 403. Then the version must exist. */
  async function requireVersion(user: User, designId: string, n: number, capabilities: Capability[]) {
    const access = await repository.versionAccess(designId, n, user.id);
    allow(access?.role, capabilities, designNotFound);
    if (!access!.versionExists) throw versionNotFound(n);
  }

  return {
    async list(user: User, designId: string, n: number): Promise<Review[]> {
      await requireVersion(user, designId, n, ['designs.read']);
      return (await repository.list(designId, n)).map(toReview);
    },

    /** A plain comment needs `designs.comment`; one that records a decision needs `designs.review` too. */
    async create(
      user: User,
      designId: string,
      n: number,
      input: z.output<typeof createReviewRequestSchema>,
    ): Promise<Review> {
      await requireVersion(
        user,
        designId,
        n,
        input.decision === null ? ['designs.comment'] : ['designs.comment', 'designs.review'],
      );
      const row = {
        id: randomUUID(),
        designId,
        versionNumber: n,
        authorId: user.id,
        body: input.body,
        decision: input.decision,
        createdAt: clock.now(),
      };
      await repository.insert(row);
      return toReview({ ...row, authorName: user.displayName });
    },
  };
}

export type ReviewsService = ReturnType<typeof createReviewsService>;
