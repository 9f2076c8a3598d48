import { fileURLToPath } from 'node:url';
import { ensureWebBuild } from './web-build';

const rootDir = fileURLToPath(new URL('..', import.meta.url));

ensureWebBuild(rootDir);
await import('../server/index');
