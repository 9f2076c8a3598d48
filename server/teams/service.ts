import { randomUUID } from 'node:crypto';
import { confirmEmailFirstMessage, type User } from '../../shared/auth';
import {
  roleLabels,
  type Invitation,
  type InvitationPreview,
  type InviteRequest,
  type Member,
  type Role,
  type Team,
} from '../../shared/teams';
import { createToken, hashToken } from '../auth/index';
import type { Clock } from '../clock';
import { HttpError, conflict, forbidden, notFound } from '../http/errors';
import type { Mailer } from '../mail/mailer';
import { invitationMessage } from '../mail/templates';
import { createTeamAccess, teamNotFound } from './access';
import type { TeamsRepository } from './repository';
import type { RoleDirectory } from './roles';

export const invitationLifetimeMs = 7 * 24 * 60 * 60_000;

const lastOwner = () => conflict('A team needs at least one owner. Make someone else owner first.');
const invitationGone = () => notFound('This invitation is not valid any more. Ask the team’s owner for a new one.');

type TeamListRow = Awaited<ReturnType<TeamsRepository['listForUser']>>[number];

function toTeam(row: TeamListRow): Team {
  return { ...row, memberCount: Number(row.memberCount), createdAt: row.createdAt.toISOString() };
}

function toMember(row: Awaited<ReturnType<TeamsRepository['listMembers']>>[number]): Member {
  return { ...row, joinedAt: row.joinedAt.toISOString() };
}

function toInvitation(row: Awaited<ReturnType<TeamsRepository['listPendingInvitations']>>[number]): Invitation {
  return { ...row, createdAt: row.createdAt.toISOString(), expiresAt: row.expiresAt.toISOString() };
}

export type TeamsServiceDeps = {
  repository: TeamsRepository;
  /** Reads roles for every team-scoped feature; this service forgets the roles it changes. */
  roles: RoleDirectory;
  mailer: Mailer;
  clock: Clock;
  publicUrl: () => string;
};

export function createTeamsService({ repository, roles, mailer, clock, publicUrl }: TeamsServiceDeps) {
  const access = createTeamAccess(roles);

  async function teamFor(teamId: string, user: User): Promise<Team> {
    const row = await repository.teamForUser(teamId, user.id);
    if (!row) throw teamNotFound();
    return toTeam(row);
  }

  return {
    access,

    async list(user: User): Promise<Team[]> {
      return (await repository.listForUser(user.id)).map(toTeam);
    },

    async create(user: User, name: string): Promise<Team> {
      const id = randomUUID();
      await repository.insertTeam({ id, name, personal: false, createdAt: clock.now() }, user.id);
      return teamFor(id, user);
    },

    async get(user: User, teamId: string): Promise<Team> {
      await access.require(teamId, user.id, 'team.read');
      return teamFor(teamId, user);
    },

    async rename(user: User, teamId: string, name: string): Promise<Team> {
      await access.require(teamId, user.id, 'team.manage');
      await repository.renameTeam(teamId, name);
      return teamFor(teamId, user);
    },

    async remove(user: User, teamId: string): Promise<void> {
      await access.require(teamId, user.id, 'team.manage');
      const team = await repository.getTeam(teamId);
      if (team?.personal) throw conflict('A personal workspace cannot be deleted.');
      await repository.deleteTeam(teamId);
      roles.forgetTeam(teamId);
    },

    async members(user: User, teamId: string): Promise<Member[]> {
      await access.require(teamId, user.id, 'members.read');
      return (await repository.listMembers(teamId)).map(toMember);
    },

    /** Owners change roles; the last owner cannot be demoted, checked inside one transaction. */
    async changeRole(user: User, teamId: string, memberId: string, role: Role): Promise<Member> {
      await access.require(teamId, user.id, 'members.manage');
      const changed = await repository.inTransaction(async (repo) => {
        await repo.lockTeam(teamId);
        const member = await repo.getMember(teamId, memberId);
        if (!member) throw notFound('No such member in this team.');
        if (member.role === 'owner' && role !== 'owner' && (await repo.countOwners(teamId)) <= 1) throw lastOwner();
        await repo.setRole(teamId, memberId, role);
        return toMember({ ...member, role });
      });
      roles.forget(teamId, memberId);
      return changed;
    },

    /** Owners remove anyone; every member may remove themselves (leave), except the last owner. */
    async removeMember(user: User, teamId: string, memberId: string): Promise<void> {
      await access.require(teamId, user.id, memberId === user.id ? 'team.read' : 'members.manage');
      await repository.inTransaction(async (repo) => {
        await repo.lockTeam(teamId);
        const member = await repo.getMember(teamId, memberId);
        if (!member) throw notFound('No such member in this team.');
        if (member.role === 'owner' && (await repo.countOwners(teamId)) <= 1) throw lastOwner();
        await repo.removeMember(teamId, memberId);
      });
      roles.forget(teamId, memberId);
    },

    async invitations(user: User, teamId: string): Promise<Invitation[]> {
      await access.require(teamId, user.id, 'invitations.manage');
      return (await repository.listPendingInvitations(teamId, clock.now())).map(toInvitation);
    },

    async invite(user: User, teamId: string, input: InviteRequest & { email: string }): Promise<Invitation> {
      await access.require(teamId, user.id, 'invitations.manage');
      const team = await repository.getTeam(teamId);
      if (!team) throw teamNotFound();
      if (team.personal) throw conflict('A personal workspace is yours alone. Create a team to invite colleagues.');
      if (await repository.isMemberByEmail(teamId, input.email)) {
        throw new HttpError(409, 'conflict', 'This person is already in the team.', { email: 'is already a member' });
      }
      const { token, hash } = await createToken();
      const now = clock.now();
      const id = randomUUID();
      await repository.replaceInvitation({
        id,
        teamId,
        email: input.email,
        role: input.role,
        tokenHash: hash,
        invitedBy: user.id,
        createdAt: now,
        expiresAt: new Date(now.getTime() + invitationLifetimeMs),
      });
      const link = `${publicUrl().replace(/\/$/, '')}/invitations/${token}`;
      await mailer.send(invitationMessage(input.email, user.displayName, team.name, roleLabels[input.role], link));
      const created = await repository.getInvitation(teamId, id);
      if (!created) throw new Error('invitation vanished after insert');
      return toInvitation(created);
    },

    async revokeInvitation(user: User, teamId: string, invitationId: string): Promise<void> {
      await access.require(teamId, user.id, 'invitations.manage');
      if (!(await repository.getInvitation(teamId, invitationId))) throw notFound('No such invitation.');
      await repository.deleteInvitation(teamId, invitationId);
    },

    async previewInvitation(token: string): Promise<InvitationPreview> {
      const found = await repository.findInvitationByTokenHash(await hashToken(token));
      const now = clock.now();
      if (!found || found.invitation.acceptedAt || found.invitation.expiresAt <= now) throw invitationGone();
      return {
        teamName: found.teamName,
        role: found.invitation.role,
        email: found.invitation.email,
        invitedBy: found.inviterName,
        expiresAt: found.invitation.expiresAt.toISOString(),
        accountExists: await repository.userExistsWithEmail(found.invitation.email),
      };
    },

    /** The link was mailed to one address: only the account with that address, confirmed, may use it. */
    async acceptInvitation(user: User, token: string): Promise<Team> {
      const tokenHash = await hashToken(token);
      const teamId = await repository.inTransaction(async (repo) => {
        // Read again once the team is held: two accepts at once must not both see it unused.
        const seen = await repo.findInvitationByTokenHash(tokenHash);
        if (seen) await repo.lockTeam(seen.invitation.teamId);
        const found = seen && (await repo.findInvitationByTokenHash(tokenHash));
        const now = clock.now();
        if (!found || found.invitation.acceptedAt || found.invitation.expiresAt <= now) throw invitationGone();
        const { invitation } = found;
        if (invitation.email !== user.email.toLowerCase()) {
          throw forbidden(`This invitation was sent to ${invitation.email}. Sign in with that address to accept it.`);
        }
        // Anyone can sign up with any address, so a matching address proves nothing until it is
        // confirmed; otherwise a forwarded link plus a squatted account would join the team.
        if (!user.emailVerified) throw new HttpError(403, 'email_unverified', confirmEmailFirstMessage(user.email));
        if (await repo.roleOf(invitation.teamId, user.id)) throw conflict('You are already in this team.');
        await repo.addMember(invitation.teamId, user.id, invitation.role, now);
        await repo.markInvitationAccepted(invitation.id, user.id, now);
        return invitation.teamId;
      });
      return teamFor(teamId, user);
    },
  };
}

export type TeamsService = ReturnType<typeof createTeamsService>;
