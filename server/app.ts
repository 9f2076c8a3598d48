import express, { type RequestHandler } from 'express';
import helmet from 'helmet';
import type { DatabaseHandle } from '../db/client';
import { apiRoutes } from '../shared/contract/index';
import { createAuth, originCheck, signedIn, type PasswordHasher, type RateLimits } from './auth/index';
import type { Clock } from './clock';
import { outboxRoute } from './dev/router';
import { healthRoute } from './health/router';
import { mountContract } from './http/contract';
import { apiNotFound, errorHandler } from './http/error-handler';
import { webRouter } from './http/web';
import type { Mailer } from './mail/mailer';
import type { Writers } from './read-cache';
import { databaseCounterStores } from './auth/counter-store';
import { createOutboxRepository } from './mail/outbox-repository';
import { createCurves } from './curves/index';
import { createInbox } from './inbox/index';
import { createNotebooks } from './notebooks/index';
import { createReviews } from './reviews/index';
import { createSheets } from './sheets/index';
import { openApiRoute } from './openapi';
import { searchRoute } from './search/router';
import { selectorsRoute } from './selectors/router';
import { solveRoute } from './solve/router';
import { createTeams } from './teams/index';
import { traceRoute } from './trace/router';

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
  /** 'production' turns off the dev outbox. */
  nodeEnv?: 'development' | 'production' | 'test';
  /** Base of the links in e-mails. A function: without PUBLIC_URL the port is known only once listening. */
  publicUrl?: () => string;
  /** PUBLIC_URL's origin, when configured: the only Origin state-changing requests may carry. */
  trustedOrigin?: string;
  /** Sign-in, sign-up, reset, solve, search and selectors limits; tests inject small ones. */
  rateLimits?: Partial<RateLimits>;
  /** Express's `trust proxy` (TRUST_PROXY): which proxies in front may name the client. */
  trustProxy?: string | number;
  /** argon2id for account passwords; left out, OWASP's minimum cost (server/index.ts leaves it out). */
  passwords?: PasswordHasher;
};

/**
 * State-changing routes that skip the Origin check, as the contract marks them: `POST /api/solve`
 * is a pure computation that reads no cookie and writes nothing, so a forged cross-site call gains
 * nothing, and lab scripts (curl, Python) send no Origin.
 */
export const originExempt = apiRoutes.filter((entry) => entry.meta.originExempt).map((entry) => `${entry.method} /api${entry.path}`);

export const bodyLimit = '1mb';

/**
 * Powerful browser features the app never uses, switched off for its pages and anything injected
 * into them. Only features Chromium knows are listed: an unknown one is a console error.
 */
export const permissionsPolicyValue = 'camera=(), microphone=(), geolocation=(), payment=(), usb=(), display-capture=()';
const permissionsPolicy: RequestHandler = (_req, res, next) => {
  res.setHeader('Permissions-Policy', permissionsPolicyValue);
  next();
};

/**
 * API answers are one person's data (or a share link's): no browser or proxy keeps them. ETags
 * still spare the body when a client asks again with If-None-Match.
 */
const apiCacheControl: RequestHandler = (_req, res, next) => {
  res.setHeader('Cache-Control', 'private, no-store');
  next();
};

/** Builds the HTTP app without listening, so tests drive it with supertest. */
export function createApp(deps: AppDeps) {
  const app = express();
  app.disable('x-powered-by');
  if (deps.trustProxy !== undefined) app.set('trust proxy', deps.trustProxy);
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
  app.use(permissionsPolicy);

  const apiRouter = express.Router();
  apiRouter.use(apiCacheControl);
  apiRouter.use(express.json({ limit: bodyLimit }));
  apiRouter.use(originCheck({ trustedOrigin: deps.trustedOrigin, exempt: originExempt }));
  const publicUrl = deps.publicUrl ?? (() => 'http://localhost:8080');
  // The embedded database has this process as its only writer; a PostgreSQL server may have more.
  const writers: Writers = deps.database.engine === 'embedded' ? 'alone' : 'shared';
  // With other writers, other processes count requests too: the counts live in the database.
  const rateLimits: Partial<RateLimits> = {
    ...deps.rateLimits,
    ...(writers === 'shared' ? { counters: databaseCounterStores(deps.database.db) } : {}),
  };
  const auth = createAuth({
    db: deps.database.db,
    mailer: deps.mailer,
    clock: deps.clock,
    publicUrl,
    secureCookies: deps.https ?? false,
    rateLimits,
    passwords: deps.passwords,
    writers,
  });
  apiRouter.use(auth.sessions);
  const teams = createTeams({ db: deps.database.db, mailer: deps.mailer, clock: deps.clock, publicUrl, writers });
  const notebooks = createNotebooks({ db: deps.database.db, roles: teams.roles, clock: deps.clock, writers });
  const inbox = createInbox({ db: deps.database.db, mailer: deps.mailer, clock: deps.clock, publicUrl, log: deps.log });
  const reviews = createReviews({ db: deps.database.db, clock: deps.clock, notifier: inbox.notifier, lists: notebooks.lists });
  const sheets = createSheets({
    db: deps.database.db,
    clock: deps.clock,
    publicUrl,
    rateLimits,
    notebooks: notebooks.service,
    reviews: reviews.service,
  });
  const curves = createCurves({ db: deps.database.db, roles: teams.roles, clock: deps.clock, rateLimits });
  apiRouter.use(
    mountContract(
      {
        accounts: auth.router,
        teams: teams.router,
        notebooks: notebooks.router,
        reviews: reviews.router,
        sheets: sheets.router,
        inbox: inbox.router,
        platform: {
          solve: solveRoute(rateLimits),
          health: healthRoute(deps),
          openapi: openApiRoute(deps.version),
          outbox: deps.nodeEnv === 'production' ? null : outboxRoute(createOutboxRepository(deps.database.db, deps.clock), { trustedOrigin: deps.trustedOrigin }),
        },
        search: { run: searchRoute(rateLimits) },
        selectors: { run: selectorsRoute(rateLimits) },
        trace: { run: traceRoute(rateLimits) },
        curves: curves.router,
      },
      { signedIn },
    ),
  );
  apiRouter.use(apiNotFound);
  app.use('/api', apiRouter);

  if (deps.webRoot) app.use(webRouter(deps.webRoot));

  app.use(errorHandler(deps.log ?? ((error) => console.error(error))));
  return app;
}
