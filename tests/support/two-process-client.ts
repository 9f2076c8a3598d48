import http from 'node:http';
import { sessionCookieName } from '../../server/auth/lucia';
import { outboxResponseSchema } from '../../shared/outbox';

/**
 * A browser reduced to what the two-process tests need: a session cookie that goes to whichever
 * API process it is sent to (as behind a load balancer), the Origin of that process (the CSRF check
 * compares it with Host), and a keep-alive connection of its own, so twenty clients are twenty
 * connections. Plain node:http: supertest's agents keep one cookie jar per base URL.
 */
export type Client = { cookie: string | null; agent: http.Agent };

export type Answer = { status: number; body: unknown };

export function newClient(cookie: string | null = null): Client {
  return { cookie, agent: new http.Agent({ keepAlive: true, maxSockets: 1 }) };
}

/** The session cookie a response sets (null when it clears it), or `current` when it sets none. */
function sessionAfter(setCookie: string[] | undefined, current: string | null): string | null {
  for (const line of setCookie ?? []) {
    const [pair = '', ...attributes] = line.split(';').map((part) => part.trim());
    if (!pair.startsWith(`${sessionCookieName}=`)) continue;
    const cleared = pair === `${sessionCookieName}=` || attributes.some((a) => /^max-age=0$/i.test(a));
    return cleared ? null : pair;
  }
  return current;
}

/** One request to the process at `url` (its origin), as `client`; keeps the session cookie it is given. */
export function send(url: string, client: Client, method: string, path: string, body?: unknown): Promise<Answer> {
  const payload = body === undefined ? undefined : JSON.stringify(body);
  return new Promise((resolve, reject) => {
    const req = http.request(
      `${url}${path}`,
      {
        method,
        agent: client.agent,
        headers: {
          origin: url,
          ...(client.cookie ? { cookie: client.cookie } : {}),
          ...(payload === undefined ? {} : { 'content-type': 'application/json', 'content-length': Buffer.byteLength(payload) }),
        },
      },
      (res) => {
        let text = '';
        res.on('data', (chunk: Buffer) => (text += chunk.toString()));
        res.on('end', () => {
          client.cookie = sessionAfter(res.headers['set-cookie'], client.cookie);
          let parsed: unknown = text;
          try {
            parsed = text ? JSON.parse(text) : null;
          } catch {
            // Not JSON: kept as text, for the failure message.
          }
          resolve({ status: res.statusCode ?? 0, body: parsed });
        });
        res.on('error', reject);
      },
    );
    req.on('error', reject);
    req.end(payload);
  });
}

/** `send`, failing with the answer's body unless the status is `status`; answers the body. */
export async function expectStatus(status: number, answer: Promise<Answer>): Promise<unknown> {
  const got = await answer;
  if (got.status !== status) throw new Error(`expected ${status}, got ${got.status}: ${JSON.stringify(got.body)}`);
  return got.body;
}

/** The token of the newest mail to `to` with a link to `route` (`/verify-email`, `/invitations/`), from the dev outbox. */
export async function mailedToken(url: string, to: string, route: string): Promise<string> {
  const body = await expectStatus(200, send(url, newClient(), 'GET', '/api/dev/outbox'));
  const message = outboxResponseSchema.parse(body).messages.find((m) => m.to === to && m.text.includes(route));
  const token = message && new RegExp(`${route.replace(/\/$/, '')}(?:\\?token=|/)([\\w-]+)`).exec(message.text)?.[1];
  if (!token) throw new Error(`no ${route} link in the outbox for ${to}`);
  return token;
}

export type Person = { id: string; email: string; password: string; client: Client };

/** Signs up through the process at `url` and confirms the address from the outbox (invitations need it). */
export async function signUpConfirmed(url: string, name: string): Promise<Person> {
  const client = newClient();
  const email = `${name.toLowerCase()}@example.com`;
  const password = `${name} keeps a long password`;
  const body = await expectStatus(201, send(url, client, 'POST', '/api/auth/sign-up', { email, displayName: name, password }));
  const { id } = (body as { user: { id: string } }).user;
  const token = await mailedToken(url, email, '/verify-email');
  await expectStatus(200, send(url, client, 'POST', '/api/auth/verify-email', { token }));
  return { id, email, password, client };
}

/** A new session of `person` (a client of its own) through the process at `url`. */
export async function signIn(url: string, person: Pick<Person, 'email' | 'password'>): Promise<Client> {
  const client = newClient();
  await expectStatus(200, send(url, client, 'POST', '/api/auth/sign-in', { email: person.email, password: person.password }));
  return client;
}

/** `owner` invites `member` with `role` through `ownerUrl`; the member accepts through `memberUrl`. */
export async function addMember(
  ownerUrl: string,
  owner: Person,
  teamId: string,
  member: Person,
  role: 'owner' | 'reviewer' | 'viewer',
  memberUrl: string,
): Promise<void> {
  await expectStatus(201, send(ownerUrl, owner.client, 'POST', `/api/teams/${teamId}/invitations`, { email: member.email, role }));
  const token = await mailedToken(memberUrl, member.email, '/invitations/');
  await expectStatus(200, send(memberUrl, member.client, 'POST', `/api/invitations/${token}/accept`));
}
