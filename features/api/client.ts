import type { z } from 'zod';
import { errorBodySchema } from '@/shared/api-error';
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

type Options = { method?: 'GET' | 'POST' | 'PUT' | 'PATCH' | 'DELETE'; body?: unknown; signal?: AbortSignal };

/** Same-origin in the exported app; the dev server proxies /api to the API. */
const base = '/api';

/**
 * The one way the client talks to the server: every response is parsed with the shared zod
 * schema, so a drift between client and server fails loudly here instead of deep in a screen.
 */
export async function api<S extends z.ZodType>(path: string, schema: S, options: Options = {}): Promise<z.output<S>> {
  const response = await fetch(`${base}${path}`, {
    method: options.method ?? 'GET',
    credentials: 'same-origin',
    headers: options.body === undefined ? { accept: 'application/json' } : { accept: 'application/json', 'content-type': 'application/json' },
    body: options.body === undefined ? undefined : JSON.stringify(options.body),
    signal: options.signal,
  });
  const payload: unknown = await response.json().catch(() => null);
  if (!response.ok) {
    const parsed = errorBodySchema.safeParse(payload);
    if (parsed.success) {
      const { code, message, fields, details } = parsed.data.error;
      throw new ApiError(response.status, code, message, fields, details);
    }
    throw new ApiError(response.status, 'unexpected', `The server answered ${response.status}.`);
  }
  const parsed = schema.safeParse(payload);
  if (!parsed.success) {
    throw new ApiError(response.status, 'bad_response', `The server's answer to ${path} did not match what this app expects.`);
  }
  return parsed.data;
}
