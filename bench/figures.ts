/**
 * The small JSON of headline figures each benchmark leaves in tests/artifacts, which `npm run bench`
 * (bench/all.bench.ts) reads instead of parsing printed text. No other imports: the solver's and
 * search's timing processes load nothing they do not time.
 */
import { mkdirSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';

const rootDir = fileURLToPath(new URL('..', import.meta.url));
export const artifactsDir = path.join(rootDir, 'tests', 'artifacts');

/** A benchmark's headline figures, by name: tests/artifacts/bench-<name>.json. */
export type Figures = Record<string, number | string | null | Record<string, unknown> | unknown[]>;

export function writeFigures(name: string, figures: Figures): string {
  mkdirSync(artifactsDir, { recursive: true });
  const file = path.join(artifactsDir, `bench-${name}.json`);
  writeFileSync(file, `${JSON.stringify({ at: new Date().toISOString(), ...figures }, null, 2)}\n`);
  return file;
}
