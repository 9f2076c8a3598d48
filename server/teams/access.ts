import { can, type Capability, type Role } from '../../shared/teams';
import { forbidden, notFound, type HttpError } from '../http/errors';
import type { RoleDirectory } from './roles';

export const teamNotFound = () => notFound('No such team.');

/**
 * The one access rule for anything a team owns (the team, its members, its designs, their
 * reviews). Someone outside the team learns nothing, not even that the thing exists: 404, in the
 * words of what they asked for (`outsider`), the same as for a made-up id. A member whose role
 * lacks a capability: 403. Answers the role, which is then known to be a member's.
 */
export function allow(
  role: Role | null | undefined,
  capabilities: Capability | readonly Capability[],
  outsider: () => HttpError,
): Role {
  if (!role) throw outsider();
  for (const capability of typeof capabilities === 'string' ? [capabilities] : capabilities)
    if (!can(role, capability)) throw forbidden(`A ${role} of this team may not do that.`);
  return role;
}

/** `allow` with the caller's role looked up in the role directory, for requests that name the team. */
export function createTeamAccess(roles: Pick<RoleDirectory, 'roleOf'>) {
  return {
    async require(
      teamId: string,
      userId: string,
      capability: Capability,
      outsider: () => HttpError = teamNotFound,
    ): Promise<Role> {
      return allow(await roles.roleOf(teamId, userId), capability, outsider);
    },
  };
}

export type TeamAccess = ReturnType<typeof createTeamAccess>;
