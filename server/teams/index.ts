import type { Database } from '../../db/client';
import type { Clock } from '../clock';
import type { Mailer } from '../mail/mailer';
import { createTeamsRepository } from './repository';
import { teamsRouter } from './router';
import { createTeamsService } from './service';

export { createTeamAccess, type TeamAccess } from './access';
export type { TeamsService } from './service';

export function createTeams(deps: { db: Database; mailer: Mailer; clock: Clock; publicUrl: () => string }) {
  const service = createTeamsService({ repository: createTeamsRepository(deps.db), ...deps });
  return { service, router: teamsRouter(service) };
}
