import type { Response } from 'express';

/**
 * Answers are serialised once per frozen object: a service that hands out the same frozen value
 * again (an immutable version, a cached list page) saves the JSON and ETag work on every repeat.
 * Anything not frozen is sent as usual. Entries go with their objects (a WeakMap).
 */
const serialised = new WeakMap<object, { bytes: Buffer; tag: string | undefined }>();

export function sendJson(res: Response, value: unknown): void {
  if (typeof value !== 'object' || value === null || !Object.isFrozen(value)) {
    res.json(value);
    return;
  }
  let body = serialised.get(value);
  if (!body) {
    const bytes = Buffer.from(JSON.stringify(value), 'utf8');
    // The app's own ETag function (weak by default), so a cached answer is tagged like any other.
    const etagOf = res.app.get('etag fn') as ((body: Buffer) => string) | undefined;
    body = { bytes, tag: etagOf?.(bytes) };
    serialised.set(value, body);
  }
  // With the ETag set, Express answers a matching If-None-Match with 304 and does not hash again.
  if (body.tag) res.set('ETag', body.tag);
  if (!res.get('Content-Type')) res.set('Content-Type', 'application/json; charset=utf-8');
  res.send(body.bytes);
}

/** Freezes a value and everything in it, so it can be handed out again and again (see `sendJson`). */
export function deepFreeze<T>(value: T): T {
  if (typeof value === 'object' && value !== null && !Object.isFrozen(value)) {
    Object.freeze(value);
    for (const inner of Object.values(value)) deepFreeze(inner);
  }
  return value;
}
