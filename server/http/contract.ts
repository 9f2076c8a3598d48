import { Router, type Request, type RequestHandler, type Response } from 'express';
import { apiRoutes, expressPath, type ApiContract, type Route, type RouteAnswer, type RouteArgs } from '../../shared/contract/index';
import { handle } from './validate';

/** What a route's handler gets (the parsed parts) and may answer (its output schema's type). */
export type Handler<R> = (input: RouteArgs<R>, req: Request, res: Response) => Promise<RouteAnswer<R> | void> | RouteAnswer<R> | void;

/** A handler, or one with middleware that runs before its parts are parsed (rate limits, guards). */
export type Implementation<R> = Handler<R> | { use: RequestHandler[]; handle: Handler<R> };

/** One handler per route of a contract group; TypeScript refuses a missing or misspelt one. */
export type GroupImplementation<G> = { [K in keyof G]: Implementation<G[K]> };

/**
 * The whole API. A `local` route (the dev outbox) may be `null`: not mounted at all, as in
 * production, where it then answers 404 like any path that does not exist.
 */
export type ContractImplementation = {
  [G in keyof ApiContract]: { [K in keyof ApiContract[G]]: Implementation<ApiContract[G][K]> | (ApiContract[G][K] extends Route ? null : never) };
};

/**
 * Mounts every route of the contract, in its order, on one router: the session guard its access
 * needs, its own middleware, then `handle()` (parts parsed once with the contract's schemas, text
 * the database cannot store refused) and the success status the contract states. A 204 answers
 * with no body. So the method, path, schemas and status of a route are written once, in
 * `shared/contract/`, and the server cannot drift from what the client and the OpenAPI document
 * read there.
 */
export function mountContract(implementation: ContractImplementation, guards: { signedIn: RequestHandler }): Router {
  const router = Router();
  const groups = implementation as unknown as Record<string, Record<string, Implementation<Route> | null>>;
  for (const entry of apiRoutes) {
    const [group = '', name = ''] = entry.name.split('.');
    const found = groups[group]?.[name];
    if (found === undefined) throw new Error(`No handler for ${entry.name} (${entry.method} ${entry.path}).`);
    if (found === null) {
      if (entry.meta.access.kind !== 'local') throw new Error(`${entry.name} may not be left out: only local routes may.`);
      continue;
    }
    const { use, handle: run } = typeof found === 'function' ? { use: [], handle: found } : found;
    const kind = entry.meta.access.kind;
    const guard = kind === 'signed-in' || kind === 'team' ? [guards.signedIn] : [];
    const method = entry.method.toLowerCase() as 'get' | 'post' | 'put' | 'patch' | 'delete';
    router[method](
      expressPath(entry.path),
      ...guard,
      ...use,
      handle(entry.parts, async (input, req, res) => {
        res.status(entry.status);
        const value = await run(input as RouteArgs<Route>, req, res);
        if (entry.status === 204) {
          if (!res.headersSent) res.end();
          return undefined;
        }
        return value;
      }),
    );
  }
  return router;
}
