import compression from 'compression';
import express, { Router } from 'express';
import { existsSync } from 'node:fs';
import path from 'node:path';
import { compressFromBytes } from './json';

/**
 * Serves the exported web app. The export is a single page, so every GET that is not an API
 * call and not a file answers index.html and the client router takes over (deep links, reloads).
 */
export function webRouter(webRoot: string) {
  const router = Router();
  // The bundles are megabytes. API answers compress themselves (http/json.ts).
  router.use(compression({ threshold: compressFromBytes }));
  const indexHtml = path.join(webRoot, 'index.html');
  router.use(
    express.static(webRoot, {
      index: false,
      setHeaders(res, filePath) {
        // Bundles and assets carry a content hash in their names; index.html must not be cached.
        if (filePath.includes(`${path.sep}_expo${path.sep}`) || filePath.includes(`${path.sep}assets${path.sep}`)) {
          res.setHeader('cache-control', 'public, max-age=31536000, immutable');
        }
      },
    }),
  );
  router.get('/{*splat}', (req, res, next) => {
    if (req.path.startsWith('/api/') || path.extname(req.path) !== '') {
      next();
      return;
    }
    if (!existsSync(indexHtml)) {
      res.status(503).type('text/plain').send('The web app has not been built. Run `npm start`, which exports it first.');
      return;
    }
    res.setHeader('cache-control', 'no-cache');
    res.sendFile(indexHtml);
  });
  return router;
}
