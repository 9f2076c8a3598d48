import { and, asc, count, eq, gt, isNull } from 'drizzle-orm';
import type { Database } from '../../db/client';
import { invitations, memberships, teams, users } from '../../db/schema';
import type { Role } from '../../shared/teams';

export type TeamRow = typeof teams.$inferSelect;
export type InvitationRow = typeof invitations.$inferSelect;

function queries(db: Database) {
  const memberCount = db
    .select({ teamId: memberships.teamId, n: count().as('n') })
    .from(memberships)
    .groupBy(memberships.teamId)
    .as('member_count');

  function listForUser(userId: string) {
    return db
      .select({
        id: teams.id,
        name: teams.name,
        personal: teams.personal,
        createdAt: teams.createdAt,
        role: memberships.role,
        memberCount: memberCount.n,
      })
      .from(memberships)
      .innerJoin(teams, eq(teams.id, memberships.teamId))
      .innerJoin(memberCount, eq(memberCount.teamId, teams.id))
      .where(eq(memberships.userId, userId))
      .orderBy(asc(teams.personal), asc(teams.name));
  }

  function listMembers(teamId: string) {
    return db
      .select({
        userId: users.id,
        displayName: users.displayName,
        email: users.email,
        role: memberships.role,
        joinedAt: memberships.joinedAt,
      })
      .from(memberships)
      .innerJoin(users, eq(users.id, memberships.userId))
      .where(eq(memberships.teamId, teamId))
      .orderBy(asc(memberships.joinedAt), asc(users.displayName));
  }

  function listPendingInvitations(teamId: string, now: Date) {
    return db
      .select({
        id: invitations.id,
        email: invitations.email,
        role: invitations.role,
        invitedBy: users.displayName,
        createdAt: invitations.createdAt,
        expiresAt: invitations.expiresAt,
      })
      .from(invitations)
      .leftJoin(users, eq(users.id, invitations.invitedBy))
      .where(and(eq(invitations.teamId, teamId), isNull(invitations.acceptedAt), gt(invitations.expiresAt, now)))
      .orderBy(asc(invitations.createdAt), asc(invitations.email));
  }

  return {
    listForUser,
    listMembers,
    listPendingInvitations,

    async roleOf(teamId: string, userId: string): Promise<Role | null> {
      const [row] = await db
        .select({ role: memberships.role })
        .from(memberships)
        .where(and(eq(memberships.teamId, teamId), eq(memberships.userId, userId)));
      return row?.role ?? null;
    },

    async teamForUser(teamId: string, userId: string) {
      const rows = await listForUser(userId);
      return rows.find((row) => row.id === teamId) ?? null;
    },

    async insertTeam(team: { id: string; name: string; personal: boolean; createdAt: Date }, ownerId: string) {
      await db.transaction(async (tx) => {
        await tx.insert(teams).values(team);
        await tx.insert(memberships).values({ teamId: team.id, userId: ownerId, role: 'owner', joinedAt: team.createdAt });
      });
    },

    async getTeam(teamId: string): Promise<TeamRow | null> {
      const [row] = await db.select().from(teams).where(eq(teams.id, teamId));
      return row ?? null;
    },

    async renameTeam(teamId: string, name: string) {
      await db.update(teams).set({ name }).where(eq(teams.id, teamId));
    },

    async deleteTeam(teamId: string) {
      await db.delete(teams).where(eq(teams.id, teamId));
    },

    async getMember(teamId: string, userId: string) {
      const rows = await listMembers(teamId);
      return rows.find((row) => row.userId === userId) ?? null;
    },

    async isMemberByEmail(teamId: string, email: string): Promise<boolean> {
      const [row] = await db
        .select({ userId: users.id })
        .from(memberships)
        .innerJoin(users, eq(users.id, memberships.userId))
        .where(and(eq(memberships.teamId, teamId), eq(users.email, email)));
      return row !== undefined;
    },

    /**
     * Holds the team's row until the transaction ends: two owners demoting or removing each other
     * at once on a PostgreSQL server would otherwise both count two owners and leave none (the
     * embedded database runs one transaction at a time, so there it changes nothing).
     */
    async lockTeam(teamId: string) {
      await db.select({ id: teams.id }).from(teams).where(eq(teams.id, teamId)).for('update');
    },

    async countOwners(teamId: string): Promise<number> {
      const [row] = await db
        .select({ n: count() })
        .from(memberships)
        .where(and(eq(memberships.teamId, teamId), eq(memberships.role, 'owner')));
      return row?.n ?? 0;
    },

    async setRole(teamId: string, userId: string, role: Role) {
      await db.update(memberships).set({ role }).where(and(eq(memberships.teamId, teamId), eq(memberships.userId, userId)));
    },

    async removeMember(teamId: string, userId: string) {
      await db.delete(memberships).where(and(eq(memberships.teamId, teamId), eq(memberships.userId, userId)));
    },

    async addMember(teamId: string, userId: string, role: Role, joinedAt: Date) {
      await db.insert(memberships).values({ teamId, userId, role, joinedAt });
    },

    /** One pending invitation per address and team: a new one replaces the old link. */
    async replaceInvitation(row: typeof invitations.$inferInsert) {
      await db.transaction(async (tx) => {
        await tx
          .delete(invitations)
          .where(and(eq(invitations.teamId, row.teamId), eq(invitations.email, row.email), isNull(invitations.acceptedAt)));
        await tx.insert(invitations).values(row);
      });
    },

    async getInvitation(teamId: string, invitationId: string) {
      const rows = await listPendingInvitations(teamId, new Date(0));
      return rows.find((row) => row.id === invitationId) ?? null;
    },

    async deleteInvitation(teamId: string, invitationId: string) {
      await db.delete(invitations).where(and(eq(invitations.teamId, teamId), eq(invitations.id, invitationId)));
    },

    async findInvitationByTokenHash(tokenHash: string) {
      const [row] = await db
        .select({ invitation: invitations, teamName: teams.name, inviterName: users.displayName })
        .from(invitations)
        .innerJoin(teams, eq(teams.id, invitations.teamId))
        .leftJoin(users, eq(users.id, invitations.invitedBy))
        .where(eq(invitations.tokenHash, tokenHash));
      return row ?? null;
    },

    async markInvitationAccepted(invitationId: string, userId: string, at: Date) {
      await db.update(invitations).set({ acceptedAt: at, acceptedBy: userId }).where(eq(invitations.id, invitationId));
    },

    async userExistsWithEmail(email: string): Promise<boolean> {
      const [row] = await db.select({ id: users.id }).from(users).where(eq(users.email, email));
      return row !== undefined;
    },
  };
}

export type TeamQueries = ReturnType<typeof queries>;

export function createTeamsRepository(db: Database) {
  return {
    ...queries(db),
    /** Runs `work` on one transaction; a check-then-write rule (last owner) takes `lockTeam` first. */
    inTransaction<T>(work: (repo: TeamQueries) => Promise<T>): Promise<T> {
      return db.transaction((tx) => work(queries(tx as unknown as Database)));
    },
  };
}

export type TeamsRepository = ReturnType<typeof createTeamsRepository>;
