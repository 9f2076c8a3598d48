import { readFileSync } from 'node:fs';
import { inject } from 'vitest';
import { openDatabase, type DatabaseHandle } from '../../db/client';

/** A fresh in-memory database, already migrated, private to the calling test file. */
export async function openTestDatabase(): Promise<DatabaseHandle> {
  const template = new Blob([readFileSync(inject('dbTemplatePath'))]);
  return openDatabase({ memory: true, loadDataDir: template });
}
