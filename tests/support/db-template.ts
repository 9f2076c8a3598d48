import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import type { TestProject } from 'vitest/node';
import { dumpMigratedTemplate } from '../../db/client';

declare module 'vitest' {
  export interface ProvidedContext {
    dbTemplatePath: string;
  }
}

/**
 * Migrates one in-memory database per test run and dumps it; each API test opens a copy in about a
 * second instead of migrating from scratch (see ../shared/STACK.md figures).
 */
export default async function setup(project: TestProject) {
  const dir = mkdtempSync(path.join(tmpdir(), 'blazebook-db-template-'));
  const file = path.join(dir, 'template.tar');
  const dump = await dumpMigratedTemplate();
  writeFileSync(file, Buffer.from(await dump.arrayBuffer()));
  project.provide('dbTemplatePath', file);
  return () => rmSync(dir, { recursive: true, force: true });
}
