import { fileURLToPath } from 'node:url';
import { ensureWebBuild, webRoot } from './web-build';

const rootDir = fileURLToPath(new URL('..', import.meta.url));

ensureWebBuild(rootDir);
process.env.WEB_ROOT ??= webRoot(rootDir);
await import('../server/index');
