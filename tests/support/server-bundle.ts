import { build } from 'esbuild';
import { mkdirSync, readdirSync, readFileSync, rmSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';
import { processExists } from '../../db/data-dir-lock';

/**
 * `server/index.ts` and everything of ours it imports as one ES module, for the server processes
 * the tests start. The code is the same; only the loading differs. Under `node --import tsx` each
 * start spent 5–6 s of CPU and 3.1–3.9 s before its ready line (tsx's loader thread transforming
 * and resolving every file); from the bundle 2.8–3.7 s of CPU and 2.4–3.1 s, and a test run starts
 * about 40 servers. `npm start` still runs the sources through tsx.
 *
 * Packages stay outside (`packages: 'external'`) and load from node_modules as usual: PGlite finds
 * its WebAssembly beside its own files. The file sits under node_modules/.cache so that those
 * imports resolve from it. Each file's `import.meta.url` is replaced by that file's own URL, so
 * paths built from it (migrations, fonts, the repository root) point where they did.
 */
const rootDir = fileURLToPath(new URL('../..', import.meta.url));
const bundleDir = path.join(rootDir, 'node_modules', '.cache', 'blazebook-server');

let bundled: Promise<string> | null = null;

/**
 * Builds the bundle once per process (about 0.4 s) and returns its path. It is removed when the
 * process exits; a worker ended by a signal leaves its file, which the next build removes.
 */
export function serverBundle(): Promise<string> {
  bundled ??= (async () => {
    mkdirSync(bundleDir, { recursive: true });
    for (const name of readdirSync(bundleDir)) {
      const pid = Number(/^server-(\d+)\.mjs$/.exec(name)?.[1]);
      if (pid && !processExists(pid)) rmSync(path.join(bundleDir, name), { force: true });
    }
    const outfile = path.join(bundleDir, `server-${process.pid}.mjs`);
    await build({
      entryPoints: [path.join(rootDir, 'server', 'index.ts')],
      absWorkingDir: rootDir,
      bundle: true,
      platform: 'node',
      format: 'esm',
      target: 'node20',
      packages: 'external',
      // Stack traces in a server's output name the TypeScript files (node --enable-source-maps).
      sourcemap: 'inline',
      outfile,
      logLevel: 'error',
      plugins: [
        {
          name: 'own-import-meta-url',
          setup(builder) {
            builder.onLoad({ filter: /\.ts$/ }, (args) => ({
              contents: readFileSync(args.path, 'utf8').replaceAll('import.meta.url', JSON.stringify(pathToFileURL(args.path).href)),
              loader: 'ts',
            }));
          },
        },
      ],
    });
    process.once('exit', () => rmSync(outfile, { force: true }));
    return outfile;
  })();
  return bundled;
}
