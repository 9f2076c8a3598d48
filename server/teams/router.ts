import type { apiContract } from '../../shared/contract/index';
import { requireUser } from '../auth/index';
import type { GroupImplementation } from '../http/contract';
import type { TeamsService } from './service';

/**
 * Teams, members and invitations (`apiContract.teams`). Roles are checked in the service; this
 * only translates HTTP.
 */
export function teamsRouter(teams: TeamsService): GroupImplementation<typeof apiContract.teams> {
  return {
    list: async (_input, _req, res) => ({ teams: await teams.list(requireUser(res)) }),
    create: async ({ body }, _req, res) => ({ team: await teams.create(requireUser(res), body.name) }),
    get: async ({ params }, _req, res) => ({ team: await teams.get(requireUser(res), params.teamId) }),
    rename: async ({ params, body }, _req, res) => ({ team: await teams.rename(requireUser(res), params.teamId, body.name) }),
    remove: async ({ params }, _req, res) => {
      await teams.remove(requireUser(res), params.teamId);
    },
    members: async ({ params }, _req, res) => ({ members: await teams.members(requireUser(res), params.teamId) }),
    changeRole: async ({ params, body }, _req, res) => ({
      member: await teams.changeRole(requireUser(res), params.teamId, params.userId, body.role),
    }),
    removeMember: async ({ params }, _req, res) => {
      await teams.removeMember(requireUser(res), params.teamId, params.userId);
    },
    invitations: async ({ params }, _req, res) => ({ invitations: await teams.invitations(requireUser(res), params.teamId) }),
    invite: async ({ params, body }, _req, res) => ({ invitation: await teams.invite(requireUser(res), params.teamId, body) }),
    revokeInvitation: async ({ params }, _req, res) => {
      await teams.revokeInvitation(requireUser(res), params.teamId, params.invitationId);
    },
    // The link's token is the credential here: anyone holding it may see what it offers.
    previewInvitation: ({ params }) => teams.previewInvitation(params.token),
    acceptInvitation: async ({ params }, _req, res) => ({ team: await teams.acceptInvitation(requireUser(res), params.token) }),
  };
}
