import type { z } from 'zod';
import { errorBodySchema } from '@/shared/api-error';
import { describe, routeName, type Route, type RouteAnswer, type RouteInput } from '@/shared/contract';
import type { FieldErrors } from '@/shared/validation';

/**
 * A failed API call, carrying the server's error code, per-field reasons and `details`: what that
 * code needs to be acted on, left for the caller who knows the code to parse with its schema.
 */
export class ApiError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly fields: FieldErrors = {},
    readonly details?: Record<string, unknown>,
  ) {
    super(message);
    this.name = 'ApiError';
  }
}

/** Same-origin in the exported app; the dev server proxies /api to the API. */
const base = '/api';

type PartValues = { params?: Record<string, string | number>; query?: Record<string, unknown>; body?: unknown };

/** The route's path with its `{name}` parameters filled in (encoded) and its query string. */
export function urlFor(route: Route, input: PartValues = {}): string {
  const { path } = describe(route);
  const filled = path.replace(/\{(\w+)\}/g, (_, name: string) => {
    const value = input.params?.[name];
    if (value === undefined || value === '') throw new Error(`${routeName(route)} needs the path parameter ${name}.`);
    return encodeURIComponent(String(value));
  });
  const search = new URLSearchParams();
  for (const [key, value] of Object.entries(input.query ?? {})) {
    if (value !== undefined && value !== null && value !== '') search.set(key, String(value));
  }
  const text = search.toString();
  return `${base}${filled}${text ? `?${text}` : ''}`;
}

/**
 * A TanStack Query key derived from the contract: `[group, route]`, then the input when given.
 * Without an input it is the prefix of every key of that route (for invalidating all of them).
 */
export function routeKey<R extends Route>(route: R, input?: RouteInput<R>): readonly unknown[] {
  const [group, name] = routeName(route).split('.');
  return input === undefined ? [group, name] : [group, name, input];
}

/**
 * The one way the client talks to the server: the route's method and path come from the shared
 * contract, and every answer is parsed with the contract's schema, so a drift between client and
 * server fails loudly here instead of deep in a screen. A 204 answers `undefined`.
 */
export async function call<R extends Route>(route: R, input: RouteInput<R>, options: { signal?: AbortSignal } = {}): Promise<RouteAnswer<R>> {
  const { method, status, output } = describe(route);
  const parts = input as PartValues;
  const url = urlFor(route, parts);
  const response = await fetch(url, {
    method,
    credentials: 'same-origin',
    headers: parts.body === undefined ? { accept: 'application/json' } : { accept: 'application/json', 'content-type': 'application/json' },
    body: parts.body === undefined ? undefined : JSON.stringify(parts.body),
    signal: options.signal,
  });
  const payload: unknown = response.status === 204 ? undefined : await response.json().catch(() => null);
  if (!response.ok) {
    const parsed = errorBodySchema.safeParse(payload);
    if (parsed.success) {
      const { code, message, fields, details } = parsed.data.error;
      throw new ApiError(response.status, code, message, fields, details);
    }
    throw new ApiError(response.status, 'unexpected', `The server answered ${response.status}.`);
  }
  if (status === 204 || !output) return undefined as RouteAnswer<R>;
  const parsed = (output as z.ZodType).safeParse(payload);
  if (!parsed.success) {
    throw new ApiError(response.status, 'bad_response', `The server's answer to ${routeName(route)} did not match what this app expects.`);
  }
  return parsed.data as RouteAnswer<R>;
}

/** Every key of one contract group (`['teams']`): invalidates all of its routes at once. */
export function groupKey(group: string): readonly unknown[] {
  return [group];
}

/**
 * Matches the cached answers of `group` whose path parameters include `params` (every route of
 * one team, or of one design), for `invalidateQueries({ predicate })`.
 */
export function withParams(group: string, params: Record<string, string>) {
  return (query: { queryKey: readonly unknown[] }): boolean => {
    const [first, , input] = query.queryKey;
    if (first !== group || typeof input !== 'object' || input === null) return false;
    const sent = (input as { params?: Record<string, unknown> }).params ?? {};
    return Object.entries(params).every(([name, value]) => sent[name] === value);
  };
}
