import { fileURLToPath } from 'node:url';
import { ensureWebBuild } from '../../scripts/web-build';

/** Browser tests run against the real export; build it once per run if the sources moved on. */
export default function setup() {
  ensureWebBuild(fileURLToPath(new URL('../..', import.meta.url)));
}
