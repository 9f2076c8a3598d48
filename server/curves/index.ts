import type { Database } from '../../db/client';
import { createCurveUploadRateLimiter, defaultRateLimits, type RateLimits } from '../auth/rate-limit';
import type { Clock } from '../clock';
import { createTeamAccess, type RoleDirectory } from '../teams/index';
import { createCurvesRepository } from './repository';
import { curvesRouter } from './router';
import { createCurvesService } from './service';

export type { CurvesService } from './service';

/** The team's curve library and the file preview (`apiContract.curves`), checked through the app's one role directory. */
export function createCurves(deps: { db: Database; roles: RoleDirectory; clock: Clock; rateLimits?: Partial<RateLimits> }) {
  const access = createTeamAccess(deps.roles);
  const service = createCurvesService({ repository: createCurvesRepository(deps.db), access, clock: deps.clock });
  const rateLimit = createCurveUploadRateLimiter({ ...defaultRateLimits, ...deps.rateLimits });
  return { service, router: curvesRouter(service, { access, rateLimit }) };
}
