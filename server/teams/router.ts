import { Router } from 'express';
import {
  changeRoleRequestSchema,
  createTeamRequestSchema,
  invitationParamsSchema,
  invitationTokenParamsSchema,
  inviteRequestSchema,
  memberParamsSchema,
  renameTeamRequestSchema,
  teamParamsSchema,
} from '../../shared/teams';
import { requireUser, signedIn } from '../auth/index';
import { handle } from '../http/validate';
import type { TeamsService } from './service';

/** Teams, members and invitations. Roles are checked in the service; this only translates HTTP. */
export function teamsRouter(teams: TeamsService) {
  const router = Router();

  router.get(
    '/teams',
    signedIn,
    handle({}, async (_input, _req, res) => ({ teams: await teams.list(requireUser(res)) })),
  );
  router.post(
    '/teams',
    signedIn,
    handle({ body: createTeamRequestSchema }, async ({ body }, _req, res) => {
      const team = await teams.create(requireUser(res), body.name);
      res.status(201);
      return { team };
    }),
  );
  router.get(
    '/teams/:teamId',
    signedIn,
    handle({ params: teamParamsSchema }, async ({ params }, _req, res) => ({
      team: await teams.get(requireUser(res), params.teamId),
    })),
  );
  router.patch(
    '/teams/:teamId',
    signedIn,
    handle({ params: teamParamsSchema, body: renameTeamRequestSchema }, async ({ params, body }, _req, res) => ({
      team: await teams.rename(requireUser(res), params.teamId, body.name),
    })),
  );
  router.delete(
    '/teams/:teamId',
    signedIn,
    handle({ params: teamParamsSchema }, async ({ params }, _req, res) => {
      await teams.remove(requireUser(res), params.teamId);
      res.status(204).end();
    }),
  );

  router.get(
    '/teams/:teamId/members',
    signedIn,
    handle({ params: teamParamsSchema }, async ({ params }, _req, res) => ({
      members: await teams.members(requireUser(res), params.teamId),
    })),
  );
  router.patch(
    '/teams/:teamId/members/:userId',
    signedIn,
    handle({ params: memberParamsSchema, body: changeRoleRequestSchema }, async ({ params, body }, _req, res) => ({
      member: await teams.changeRole(requireUser(res), params.teamId, params.userId, body.role),
    })),
  );
  router.delete(
    '/teams/:teamId/members/:userId',
    signedIn,
    handle({ params: memberParamsSchema }, async ({ params }, _req, res) => {
      await teams.removeMember(requireUser(res), params.teamId, params.userId);
      res.status(204).end();
    }),
  );

  router.get(
    '/teams/:teamId/invitations',
    signedIn,
    handle({ params: teamParamsSchema }, async ({ params }, _req, res) => ({
      invitations: await teams.invitations(requireUser(res), params.teamId),
    })),
  );
  router.post(
    '/teams/:teamId/invitations',
    signedIn,
    handle({ params: teamParamsSchema, body: inviteRequestSchema }, async ({ params, body }, _req, res) => {
      const invitation = await teams.invite(requireUser(res), params.teamId, body);
      res.status(201);
      return { invitation };
    }),
  );
  router.delete(
    '/teams/:teamId/invitations/:invitationId',
    signedIn,
    handle({ params: invitationParamsSchema }, async ({ params }, _req, res) => {
      await teams.revokeInvitation(requireUser(res), params.teamId, params.invitationId);
      res.status(204).end();
    }),
  );

  // The link's token is the credential here: anyone holding it may see what it offers.
  router.get(
    '/invitations/:token',
    handle({ params: invitationTokenParamsSchema }, ({ params }) => teams.previewInvitation(params.token)),
  );
  router.post(
    '/invitations/:token/accept',
    signedIn,
    handle({ params: invitationTokenParamsSchema }, async ({ params }, _req, res) => ({
      team: await teams.acceptInvitation(requireUser(res), params.token),
    })),
  );

  return router;
}
