import { accounts } from './accounts';
import { curves } from './curves';
import { inbox } from './inbox';
import { notebooks } from './notebooks';
import { platform } from './platform';
import { reviews } from './reviews';
import { search } from './search';
import { selectors } from './selectors';
import { sheets } from './sheets';
import { describe, type Route } from './route';
import { teams } from './teams';
import { trace } from './trace';

export { describe, route } from './route';
export type { Access, Method, Route, RouteAnswer, RouteArgs, RouteInput, RouteMeta } from './route';

/**
 * Every route of the HTTP API, described once. Group and route names are the OpenAPI
 * operation ids (`notebooks.saveVersion`) and the first two items of each TanStack Query key.
 */
export const apiContract = { accounts, teams, notebooks, reviews, sheets, inbox, platform, search, selectors, trace, curves };
export type ApiContract = typeof apiContract;

export type RouteEntry = { name: string; route: Route } & ReturnType<typeof describe>;

/** The contract as a flat list, in the order it is written. */
export const apiRoutes: readonly RouteEntry[] = Object.entries(apiContract).flatMap(([group, routes]) =>
  Object.entries(routes as Record<string, Route>).map(([name, route]) => ({ name: `${group}.${name}`, route, ...describe(route) })),
);

const names = new Map<Route, string>(apiRoutes.map((entry) => [entry.route, entry.name]));

/** `notebooks.get` for `apiContract.notebooks.get`: a route's one name. */
export function routeName(route: Route): string {
  const name = names.get(route);
  if (!name) throw new Error('That route is not in the API contract.');
  return name;
}

/** `GET /api/designs/:id` style, as Express spells it (and the access matrix lists it). */
export function expressPath(path: string): string {
  return path.replace(/\{(\w+)\}/g, ':$1');
}
