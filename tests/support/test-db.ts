import { readFileSync } from 'node:fs';
import { inject } from 'vitest';
import { openDatabase, type DatabaseHandle } from '../../db/client';
import { createTestDatabase, testEngine } from './server-databases';

/**
 * A fresh database, already migrated, private to the calling test file: PGlite in memory, or in
 * the api-postgres project a new database on the PostgreSQL server, dropped when closed.
 */
export async function openTestDatabase(): Promise<DatabaseHandle> {
  if (testEngine() === 'server') {
    const created = await createTestDatabase();
    const handle = await openDatabase({ url: created.url, poolSize: 4 });
    return {
      ...handle,
      async close() {
        await handle.close();
        await created.drop();
      },
    };
  }
  const template = new Blob([readFileSync(inject('dbTemplatePath'))]);
  return openDatabase({ memory: true, loadDataDir: template });
}
