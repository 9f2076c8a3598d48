import type { Response } from 'express';
import { promisify } from 'node:util';
import { gzip } from 'node:zlib';

const gzipAsync = promisify(gzip);

/**
 * An answer smaller than TCP's initial congestion window (10 segments, about 14 KB; RFC 6928)
 * arrives in one round trip compressed or not, so only larger ones are worth compressing.
 */
export const compressFromBytes = 14 * 1024;

type Body = { bytes: Buffer; tag: string | undefined; gzipped?: Buffer };

/**
 * Answers are serialised once per frozen object: a service that hands out the same frozen value
 * again (an immutable version, a cached list page) saves the JSON, ETag and gzip work on every
 * repeat. Entries go with their objects (a WeakMap).
 */
const serialised = new WeakMap<object, Body>();

function serialise(res: Response, value: unknown): Body {
  const bytes = Buffer.from(JSON.stringify(value) ?? 'null', 'utf8');
  // The app's own ETag function (weak by default), so every answer is tagged the same way.
  const etagOf = res.app.get('etag fn') as ((body: Buffer) => string) | undefined;
  return { bytes, tag: etagOf?.(bytes) };
}

/**
 * Sends a JSON answer: a weak ETag (a matching If-None-Match gets 304), and gzip for large
 * answers to clients that accept it. API answers do not pass through a compression middleware:
 * nearly all are small, and wrapping every response costs more than the JSON itself.
 */
export async function sendJson(res: Response, value: unknown): Promise<void> {
  const reusable = typeof value === 'object' && value !== null && Object.isFrozen(value);
  let body = reusable ? serialised.get(value) : undefined;
  if (!body) {
    body = serialise(res, value);
    if (reusable) serialised.set(value, body);
  }
  if (body.tag) res.set('ETag', body.tag);
  if (!res.get('Content-Type')) res.set('Content-Type', 'application/json; charset=utf-8');
  if (body.bytes.length < compressFromBytes) {
    res.send(body.bytes);
    return;
  }
  res.vary('Accept-Encoding');
  if (res.req.acceptsEncodings('gzip', 'identity') !== 'gzip' || res.req.fresh) {
    res.send(body.bytes);
    return;
  }
  body.gzipped ??= await gzipAsync(body.bytes);
  res.set('Content-Encoding', 'gzip');
  res.send(body.gzipped);
}

/** Freezes a value and everything in it, so it can be handed out again and again (see `sendJson`). */
export function deepFreeze<T>(value: T): T {
  if (typeof value === 'object' && value !== null && !Object.isFrozen(value)) {
    Object.freeze(value);
    for (const inner of Object.values(value)) deepFreeze(inner);
  }
  return value;
}
