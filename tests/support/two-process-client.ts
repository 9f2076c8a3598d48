import http from 'node:http';
import { outboxResponseSchema } from '../../shared/outbox';
import { httpRequest, parsed, sessionAfter } from './http-request';

/**
 * A browser reduced to what the two-process tests need: a session cookie that goes to whichever
 * API process it is sent to (as behind a load balancer), and a keep-alive connection of its own,
 * so twenty clients are twenty connections (requests through tests/support/http-request.ts).
 */
export type Client = { cookie: string | null; agent: http.Agent };

export type Answer = { status: number; body: unknown };

export function newClient(cookie: string | null = null): Client {
  return { cookie, agent: new http.Agent({ keepAlive: true, maxSockets: 1 }) };
}

/** One request to the process at `url` (its origin), as `client`; keeps the session cookie it is given. */
export async function send(url: string, client: Client, method: string, path: string, body?: Record<string, unknown>): Promise<Answer> {
  const reply = await httpRequest({ base: url, method, path, payload: body, cookie: client.cookie, agent: client.agent, timeoutMs: 60_000 });
  client.cookie = sessionAfter(reply.setCookie, client.cookie);
  return { status: reply.status, body: parsed<unknown>(reply.text, null, (text) => text) };
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
