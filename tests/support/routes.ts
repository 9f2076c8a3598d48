import { apiRoutes, expressPath } from '../../shared/contract/index';

/**
 * Every `METHOD /api/path` of the API contract, spelt as Express spells paths (`:id`), sorted. The
 * server mounts exactly these (server/http/contract.ts), so tests that must visit every route of a
 * kind list them from here, and a new route is visited without editing the test.
 */
export function listRoutes(filter: (entry: (typeof apiRoutes)[number]) => boolean = () => true): string[] {
  return apiRoutes
    .filter(filter)
    .map((entry) => `${entry.method} /api${expressPath(entry.path)}`)
    .sort();
}
