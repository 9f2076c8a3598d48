import type { Database } from '../../db/client';
import type { Clock } from '../clock';
import type { Writers } from '../read-cache';
import type { RoleDirectory } from '../teams/index';
import { createNotebooksRepository } from './repository';
import { notebooksRouter } from './router';
import { createNotebooksService } from './service';
import { createNotebooksStore } from './store';

export type { NotebooksService } from './service';
export { summarizeVersion } from './summary';

export function createNotebooks(deps: { db: Database; roles: RoleDirectory; clock: Clock; writers: Writers }) {
  const store = createNotebooksStore({ repository: createNotebooksRepository(deps.db), roles: deps.roles, writers: deps.writers });
  const service = createNotebooksService({ store, roles: deps.roles, clock: deps.clock });
  // The review module's door: a decision or request changes a design's review state on the list.
  const lists = { forgetTeam: (teamId: string) => store.forgetTeamLists(teamId) };
  return { service, router: notebooksRouter(service), lists };
}
