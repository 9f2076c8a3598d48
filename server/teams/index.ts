import type { Database } from '../../db/client';
import type { Clock } from '../clock';
import type { Mailer } from '../mail/mailer';
import type { Writers } from '../read-cache';
import { createTeamsRepository } from './repository';
import { createRoleDirectory } from './roles';
import { teamsRouter } from './router';
import { createTeamsService } from './service';

export { allow, createTeamAccess, teamNotFound, type TeamAccess } from './access';
export type { RoleDirectory } from './roles';
export type { TeamsService } from './service';

/** `roles` is the app's one role directory: every team-scoped feature checks access through it. */
export function createTeams(deps: { db: Database; mailer: Mailer; clock: Clock; publicUrl: () => string; writers: Writers }) {
  const repository = createTeamsRepository(deps.db);
  const roles = createRoleDirectory(repository, deps.writers);
  const service = createTeamsService({ repository, roles, ...deps });
  return { service, roles, router: teamsRouter(service) };
}
