import { existsSync, readFileSync, renameSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import type { TestProject } from 'vitest/node';
import { startWebBuild } from '../../scripts/web-build';

declare module 'vitest' {
  export interface ProvidedContext {
    /** Where the web export's outcome is written once it ends (`{ ok, log }`); see `webBuildReady`. */
    webBuildOutcome: string;
  }
}

/** Whole or not at all: a reader never sees half the file. */
function writeOutcome(file: string, outcome: { ok: boolean; log: string }): void {
  writeFileSync(`${file}.part`, JSON.stringify(outcome));
  renameSync(`${file}.part`, file);
}

/**
 * Browser tests run against the real export; build it once per run if the sources moved on.
 *
 * The export takes one to one and a half minutes of both cores on a fresh clone. Vitest runs every
 * project's global setup before any test, and the browser files run last (after unit and API), so
 * waiting here held every test back that long. It runs beside the unit and API files instead,
 * and writes its outcome to a file the browser tests wait for (`webBuildReady`).
 */
export default function setup(project: TestProject) {
  const outcome = path.join(tmpdir(), `blazebook-web-build-${process.pid}.json`);
  rmSync(outcome, { force: true });
  project.provide('webBuildOutcome', outcome);
  const build = startWebBuild(fileURLToPath(new URL('../..', import.meta.url)));
  if (!build) {
    writeOutcome(outcome, { ok: true, log: 'The web export is up to date.' });
    return () => rmSync(outcome, { force: true });
  }
  build.done.then(
    (log) => {
      console.log(log.split('\n').at(-1));
      writeOutcome(outcome, { ok: true, log });
    },
    (error: Error) => writeOutcome(outcome, { ok: false, log: error.message }),
  );
  return () => {
    build.stop();
    rmSync(outcome, { force: true });
  };
}

/** Resolves once the export of this run has finished; throws its output if it failed. */
export async function webBuildReady(outcome: string, timeoutMs = 10 * 60_000): Promise<void> {
  const until = Date.now() + timeoutMs;
  while (!existsSync(outcome)) {
    if (Date.now() > until) throw new Error(`The web export did not finish within ${timeoutMs / 60_000} min.`);
    await new Promise((resolve) => setTimeout(resolve, 250));
  }
  const { ok, log } = JSON.parse(readFileSync(outcome, 'utf8')) as { ok: boolean; log: string };
  if (!ok) throw new Error(`The web export failed, so no browser test can run:\n${log.slice(-4000)}`);
}
