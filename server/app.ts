import compression from 'compression';
import express from 'express';
import helmet from 'helmet';
import type { DatabaseHandle } from '../db/client';
import type { Clock } from './clock';
import { healthRouter } from './health/router';
import { apiNotFound, errorHandler } from './http/error-handler';
import { webRouter } from './http/web';
import type { Mailer } from './mail/mailer';
import { solveRouter } from './solve/router';

export type AppDeps = {
  database: DatabaseHandle;
  mailer: Mailer;
  clock: Clock;
  /** Reported by /api/health. */
  version: string;
  /** Folder of the exported web app; omitted in API tests. */
  webRoot?: string;
  /** Served over https (PUBLIC_URL starts with https): turns on HSTS and upgrading of requests. */
  https?: boolean;
  /** Where unexpected errors are written; they never reach the client. */
  log?: (error: unknown) => void;
};

export const bodyLimit = '1mb';

/** Builds the HTTP app without listening, so tests drive it with supertest. */
export function createApp(deps: AppDeps) {
  const app = express();
  app.disable('x-powered-by');
  app.use(
    helmet({
      contentSecurityPolicy: {
        directives: {
          // react-native-web writes its styles at run time; the fonts and images are ours.
          'style-src': ["'self'", "'unsafe-inline'"],
          'img-src': ["'self'", 'data:', 'blob:'],
          'font-src': ["'self'", 'data:'],
          'upgrade-insecure-requests': deps.https ? [] : null,
        },
      },
      strictTransportSecurity: deps.https ?? false,
    }),
  );
  app.use(compression());

  const apiRouter = express.Router();
  apiRouter.use(express.json({ limit: bodyLimit }));
  apiRouter.use(healthRouter(deps));
  apiRouter.use(solveRouter());
  apiRouter.use(apiNotFound);
  app.use('/api', apiRouter);

  if (deps.webRoot) app.use(webRouter(deps.webRoot));

  app.use(errorHandler(deps.log ?? ((error) => console.error(error))));
  return app;
}
