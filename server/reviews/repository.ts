import { and, asc, eq } from 'drizzle-orm';
import type { Database } from '../../db/client';
import { designs, designVersions, memberships, users, versionReviews } from '../../db/schema';
import type { Role } from '../../shared/teams';

export type ReviewInsert = typeof versionReviews.$inferInsert;

export type ReviewView = {
  id: string;
  versionNumber: number;
  authorId: string | null;
  authorName: string | null;
  body: string;
  decision: 'approved' | 'changes-requested' | null;
  createdAt: Date;
};

/**
 * Who the caller is to one version: null when the design does not exist; `role` null when the
 * caller is not in its team; `versionExists` false when the design has no such version.
 */
export type VersionAccess = { role: Role | null; versionExists: boolean };

const reviewColumns = {
  id: versionReviews.id,
  versionNumber: versionReviews.versionNumber,
  authorId: versionReviews.authorId,
  authorName: users.displayName,
  body: versionReviews.body,
  decision: versionReviews.decision,
  createdAt: versionReviews.createdAt,
};

export function createReviewsRepository(db: Database) {
  return {
    /** The design, the caller's membership and the version's existence in one round trip. */
    async versionAccess(designId: string, n: number, userId: string): Promise<VersionAccess | null> {
      const [row] = await db
        .select({ role: memberships.role, versionId: designVersions.id })
        .from(designs)
        .leftJoin(memberships, and(eq(memberships.teamId, designs.teamId), eq(memberships.userId, userId)))
        .leftJoin(designVersions, and(eq(designVersions.designId, designs.id), eq(designVersions.number, n)))
        .where(eq(designs.id, designId));
      return row ? { role: row.role, versionExists: row.versionId !== null } : null;
    },

    async list(designId: string, n: number): Promise<ReviewView[]> {
      return db
        .select(reviewColumns)
        .from(versionReviews)
        .leftJoin(users, eq(users.id, versionReviews.authorId))
        .where(and(eq(versionReviews.designId, designId), eq(versionReviews.versionNumber, n)))
        .orderBy(asc(versionReviews.seq));
    },

    async insert(row: ReviewInsert): Promise<void> {
      await db.insert(versionReviews).values(row);
    },
  };
}

export type ReviewsRepository = ReturnType<typeof createReviewsRepository>;
