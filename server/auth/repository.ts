import { and, eq, sql } from 'drizzle-orm';
import type { Database } from '../../db/client';
import { authTokens, memberships, teams, users } from '../../db/schema';

export type UserRow = typeof users.$inferSelect;
export type TokenPurpose = (typeof authTokens.$inferSelect)['purpose'];

export type AuthRepository = ReturnType<typeof createAuthRepository>;

export function createAuthRepository(db: Database) {
  return {
    async findUserByEmail(email: string): Promise<UserRow | null> {
      const [row] = await db.select().from(users).where(sql`lower(${users.email}) = lower(${email})`);
      return row ?? null;
    },

    async findUserById(id: string): Promise<UserRow | null> {
      const [row] = await db.select().from(users).where(eq(users.id, id));
      return row ?? null;
    },

    /**
     * A user never exists without a personal workspace, so both are written in one transaction.
     * Returns null when the e-mail is already taken (the unique index decides, not a prior read).
     */
    async insertUserWithWorkspace(user: typeof users.$inferInsert, workspace: { id: string; name: string }) {
      return db.transaction(async (tx) => {
        const [inserted] = await tx.insert(users).values(user).onConflictDoNothing().returning();
        if (!inserted) return null;
        const at = user.createdAt ?? new Date();
        await tx.insert(teams).values({ id: workspace.id, name: workspace.name, personal: true, createdAt: at });
        await tx.insert(memberships).values({ teamId: workspace.id, userId: inserted.id, role: 'owner', joinedAt: at });
        return inserted;
      });
    },

    async setPasswordHash(userId: string, passwordHash: string) {
      await db.update(users).set({ passwordHash }).where(eq(users.id, userId));
    },

    async markEmailVerified(userId: string, at: Date) {
      await db.update(users).set({ emailVerifiedAt: at }).where(eq(users.id, userId));
    },

    async insertToken(token: typeof authTokens.$inferInsert) {
      await db.insert(authTokens).values(token);
    },

    /** Reads a token without using it up, for checks that must not spend the link when they fail. */
    async findToken(tokenHash: string, purpose: TokenPurpose) {
      const [row] = await db
        .select()
        .from(authTokens)
        .where(and(eq(authTokens.tokenHash, tokenHash), eq(authTokens.purpose, purpose)));
      return row ?? null;
    },

    /** Deletes and returns the token in one statement, so two requests cannot both use it. */
    async consumeToken(tokenHash: string, purpose: TokenPurpose) {
      const [row] = await db
        .delete(authTokens)
        .where(and(eq(authTokens.tokenHash, tokenHash), eq(authTokens.purpose, purpose)))
        .returning();
      return row ?? null;
    },

    async deleteTokens(userId: string, purpose: TokenPurpose) {
      await db.delete(authTokens).where(and(eq(authTokens.userId, userId), eq(authTokens.purpose, purpose)));
    },
  };
}
