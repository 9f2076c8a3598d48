import http from 'node:http';
import { sessionCookieName } from '../../server/auth/lucia';

/**
 * One HTTP request to a real server process, as a browser would send it (the Origin of the
 * process it goes to, which the CSRF check compares with Host, and a session cookie), over plain
 * node:http: the multi-process and crash tests need what supertest's agents do not give — one
 * cookie sent to whichever process, a connection per client, a chosen local address.
 */
export type Payload = Record<string, unknown> | { multipart: FormData };
export type Reply = { status: number; text: string; setCookie: string[] };

export type RequestOptions = {
  /** The process's origin, e.g. `http://127.0.0.1:41234`. */
  base: string;
  method: string;
  path: string;
  payload?: Payload;
  cookie?: string | null;
  /** A keep-alive agent of the client's own; false opens a connection per request. */
  agent?: http.Agent | false;
  /** The client's address on loopback (127.0.0.0/8): per-address limits count it. */
  localAddress?: string;
  /** A request still unanswered after this long fails instead of hanging the test. */
  timeoutMs?: number;
};

/** JSON, or multipart through the platform's own encoder (Response serialises a FormData, boundary included). */
async function encode(payload: Payload | undefined): Promise<{ bytes?: Buffer; type?: string }> {
  if (!payload) return {};
  if (payload.multipart instanceof FormData) {
    const encoded = new Response(payload.multipart);
    return { bytes: Buffer.from(await encoded.arrayBuffer()), type: encoded.headers.get('content-type')! };
  }
  return { bytes: Buffer.from(JSON.stringify(payload)), type: 'application/json' };
}

/** Answers the status, the body as text and the Set-Cookie lines; rejects when the server cannot be reached or hangs up. */
export async function httpRequest({ base, method, path, payload, cookie, agent = false, localAddress, timeoutMs = 20_000 }: RequestOptions): Promise<Reply> {
  const { bytes, type } = await encode(payload);
  const headers: http.OutgoingHttpHeaders = { origin: base };
  if (cookie) headers.cookie = cookie;
  if (bytes) Object.assign(headers, { 'content-type': type, 'content-length': bytes.length });
  return new Promise((resolve, reject) => {
    const req = http.request(`${base}${path}`, { method, headers, agent, localAddress, timeout: timeoutMs }, (res) => {
      const chunks: Buffer[] = [];
      res.on('data', (chunk: Buffer) => chunks.push(chunk));
      res.on('end', () => resolve({ status: res.statusCode ?? 0, text: Buffer.concat(chunks).toString(), setCookie: res.headers['set-cookie'] ?? [] }));
      res.on('error', reject);
    });
    req.on('timeout', () => req.destroy(new Error(`${method} ${path} hung for ${timeoutMs / 1000} s`)));
    req.on('error', reject);
    req.end(bytes);
  });
}

/** The body as JSON, or as `fallback(text)` when it is not JSON (kept for the failure message). */
export function parsed<T>(text: string, empty: T, fallback: (text: string) => T): T {
  if (!text) return empty;
  try {
    return JSON.parse(text) as T;
  } catch {
    return fallback(text);
  }
}

/** The session cookie (`name=value`) a response sets, null when it clears it, or `current` when it says nothing of it. */
export function sessionAfter(setCookie: readonly string[], current: string | null): string | null {
  for (const line of setCookie) {
    const [pair = '', ...attributes] = line.split(';').map((part) => part.trim());
    if (!pair.startsWith(`${sessionCookieName}=`)) continue;
    const cleared = pair === `${sessionCookieName}=` || attributes.some((a) => /^max-age=0$/i.test(a));
    return cleared ? null : pair;
  }
  return current;
}
