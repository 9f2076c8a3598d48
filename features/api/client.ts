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
  const { method, status, output, meta } = describe(route);
  const upload = meta.upload;
  const parts = input as PartValues;
  const url = urlFor(route, parts);
  // An upload route takes its body as a multipart form (the file a Blob); the browser sets the
  // content type with its boundary. Every other body is JSON.
  const form = upload && parts.body !== undefined ? multipart(parts.body as Record<string, unknown>) : null;
  const response = await fetch(url, {
    method,
    credentials: 'same-origin',
    headers:
      parts.body === undefined || form
        ? { accept: 'application/json' }
        : { accept: 'application/json', 'content-type': 'application/json' },
    body: form ?? (parts.body === undefined ? undefined : JSON.stringify(parts.body)),
    signal: options.signal,
  });
  const payload: unknown = response.status === 204 ? undefined : await response.json().catch(() => null);
  if (!response.ok) throw refusal(response.status, payload);
  if (status === 204 || !output) return undefined as RouteAnswer<R>;
  const parsed = (output as z.ZodType).safeParse(payload);
  if (!parsed.success) {
    throw new ApiError(response.status, 'bad_response', `The server's answer to ${routeName(route)} did not match what this app expects.`);
  }
  return parsed.data as RouteAnswer<R>;
}

/** A form of text fields and Blobs (files keep their names); undefined fields are left out. */
function multipart(fields: Record<string, unknown>): FormData {
  const form = new FormData();
  for (const [key, value] of Object.entries(fields)) {
    if (value === undefined || value === null) continue;
    if (value instanceof Blob) form.append(key, value, value instanceof File ? value.name : key);
    else form.append(key, String(value));
  }
  return form;
}

/** The error an answer that is not ok carries: the server's error shape, or a plain one. */
function refusal(status: number, payload: unknown): ApiError {
  const parsed = errorBodySchema.safeParse(payload);
  if (parsed.success) {
    const { code, message, fields, details } = parsed.data.error;
    return new ApiError(status, code, message, fields, details);
  }
  return new ApiError(status, 'unexpected', `The server answered ${status}.`);
}

/** A downloaded file: its bytes and the name the server's Content-Disposition gave it. */
export type DownloadedFile = { blob: Blob; fileName: string | null };

/**
 * Fetches a route whose answer is a file (`file` in the contract, e.g. a design sheet): the bytes
 * whole, or the server's error shape as an `ApiError`, like `call`.
 */
export async function fetchFile<R extends Route>(route: R, input: RouteInput<R>, options: { signal?: AbortSignal } = {}): Promise<DownloadedFile> {
  const { method, meta } = describe(route);
  if (!meta.file) throw new Error(`${routeName(route)} answers JSON: use call().`);
  const response = await fetch(urlFor(route, input as PartValues), {
    method,
    credentials: 'same-origin',
    headers: { accept: `${meta.file.mediaType}, application/json` },
    signal: options.signal,
  });
  if (!response.ok) throw refusal(response.status, await response.json().catch(() => null));
  const blob = await response.blob();
  const disposition = response.headers.get('content-disposition') ?? '';
  const fileName = /filename="([^"]+)"/.exec(disposition)?.[1] ?? null;
  return { blob, fileName };
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
