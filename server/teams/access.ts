import { can, type Capability, type Role } from '../../shared/teams';
import { forbidden, notFound } from '../http/errors';
import type { TeamsRepository } from './repository';

export const teamNotFound = () => notFound('No such team.');

/**
 * The one gate for anything that belongs to a team (members today, designs next). Someone outside
 * the team learns nothing, not even that it exists: 404. A member without the right role: 403.
 */
export function createTeamAccess(repository: Pick<TeamsRepository, 'roleOf'>) {
  return {
    async require(teamId: string, userId: string, capability: Capability): Promise<Role> {
      const role = await repository.roleOf(teamId, userId);
      if (!role) throw teamNotFound();
      if (!can(role, capability)) throw forbidden(`A ${role} of this team may not do that.`);
      return role;
    },
  };
}

export type TeamAccess = ReturnType<typeof createTeamAccess>;
