import type { Database } from '../../db/client';
import type { RateLimits } from '../auth/rate-limit';
import type { Clock } from '../clock';
import { createSheetsRepository } from './repository';
import { sheetsRouter } from './router';
import { createSheetsService, type SheetsServiceDeps } from './service';

export type { SheetsService } from './service';

/** The design sheet module: PDFs of a version, of a shared version, and of two versions compared. */
export function createSheets(
  deps: { db: Database; clock: Clock; publicUrl: () => string; rateLimits?: Partial<RateLimits> } & Pick<SheetsServiceDeps, 'notebooks' | 'reviews'>,
) {
  const service = createSheetsService({ ...deps, repository: createSheetsRepository(deps.db) });
  return { service, router: sheetsRouter(service, deps.rateLimits) };
}
