import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import { errorBodySchema } from '../../shared/api-error';
import { exampleDesign } from '../../shared/design';
import {
  designListResponseSchema,
  notebookResponseSchema,
  notebookWithVersionResponseSchema,
  versionConflictBodySchema,
  versionListResponseSchema,
} from '../../shared/notebooks';
import { memberListResponseSchema, teamResponseSchema } from '../../shared/teams';
import { startServer, type RunningServer } from '../support/live-server';
import { createTestDatabase } from '../support/server-databases';
import {
  addMember,
  expectStatus,
  newClient,
  send,
  signIn,
  signUpConfirmed,
  type Answer,
  type Client,
  type Person,
} from '../support/two-process-client';

/**
 * Two real API processes on one PostgreSQL database, as behind a load balancer: what one process
 * changes, the other must answer from on its very next request, and the limits and rules that
 * guard the data must hold whichever process takes each request. Each check first reads through B
 * what it is about to change, so a B that kept those answers in memory would fail it.
 */
let a: RunningServer;
let b: RunningServer;
let database: Awaited<ReturnType<typeof createTestDatabase>>;

let olga: Person; // owns the team
let remi: Person; // a viewer, removed
let dana: Person; // an owner, demoted to viewer
let pat: Person; // the second owner of the team where two owners demote each other
let teamId: string;

const save = (url: string, client: Client, designId: string, baseVersion: number, message: string) =>
  send(url, client, 'POST', `/api/designs/${designId}/versions`, { baseVersion, params: exampleDesign, notes: '', message });

async function newDesign(title: string): Promise<string> {
  const body = await expectStatus(201, send(a.url, olga.client, 'POST', `/api/teams/${teamId}/designs`, { title, params: exampleDesign }));
  return notebookWithVersionResponseSchema.parse(body).design.id;
}

const listPage = async (url: string, client: Client) =>
  designListResponseSchema.parse(await expectStatus(200, send(url, client, 'GET', `/api/teams/${teamId}/designs?pageSize=100`)));

beforeAll(async () => {
  database = await createTestDatabase();
  const env = { DATABASE_URL: database.url, DATABASE_POOL_SIZE: '10' };
  // Settled one by one, so that afterAll stops whichever started when the other did not.
  const [first, second] = await Promise.allSettled([startServer(inject('dataDirTemplate'), env), startServer(inject('dataDirTemplate'), env)]);
  if (first.status === 'fulfilled') a = first.value;
  if (second.status === 'fulfilled') b = second.value;
  for (const started of [first, second]) if (started.status === 'rejected') throw started.reason;

  // Accounts made through either process; each mailed link is read back through the other one.
  [olga, remi, dana, pat] = await Promise.all([
    signUpConfirmed(a.url, 'Olga'),
    signUpConfirmed(b.url, 'Remi'),
    signUpConfirmed(a.url, 'Dana'),
    signUpConfirmed(b.url, 'Pat'),
  ]);
  const team = await expectStatus(201, send(a.url, olga.client, 'POST', '/api/teams', { name: 'Two processes' }));
  teamId = teamResponseSchema.parse(team).team.id;
  await addMember(a.url, olga, teamId, remi, 'viewer', b.url);
  await addMember(b.url, olga, teamId, dana, 'owner', a.url);
}, 120_000);

afterAll(async () => {
  for (const person of [olga, remi, dana, pat]) person?.client.agent.destroy();
  await Promise.all([a?.stop(), b?.stop()]);
  await database?.drop();
});

describe('what one process changes, the other answers from on its very next request', () => {
  it('shuts a member removed through A out of B', async () => {
    const designId = await newDesign('Members only');
    // Warm B: the team, its list page, the design and its version 1, all read as a member.
    await expectStatus(200, send(b.url, remi.client, 'GET', `/api/teams/${teamId}`));
    await listPage(b.url, remi.client);
    await expectStatus(200, send(b.url, remi.client, 'GET', `/api/designs/${designId}`));
    await expectStatus(200, send(b.url, remi.client, 'GET', `/api/designs/${designId}/versions/1`));

    await expectStatus(204, send(a.url, olga.client, 'DELETE', `/api/teams/${teamId}/members/${remi.id}`));

    expect((await send(b.url, remi.client, 'GET', `/api/designs/${designId}/versions/1`)).status).toBe(404);
    expect((await send(b.url, remi.client, 'GET', `/api/designs/${designId}`)).status).toBe(404);
    expect((await send(b.url, remi.client, 'GET', `/api/teams/${teamId}/designs`)).status).toBe(404);
    expect((await send(b.url, remi.client, 'GET', `/api/teams/${teamId}`)).status).toBe(404);
  });

  it('stops an owner demoted to viewer through A saving through B', async () => {
    const designId = await newDesign('Demotion');
    // Warm B: Dana's role, used by a save through B.
    await expectStatus(201, save(b.url, dana.client, designId, 1, 'Saved as owner'));
    expect(teamResponseSchema.parse(await expectStatus(200, send(b.url, dana.client, 'GET', `/api/teams/${teamId}`))).team.role).toBe('owner');

    await expectStatus(200, send(a.url, olga.client, 'PATCH', `/api/teams/${teamId}/members/${dana.id}`, { role: 'viewer' }));

    const refused = await save(b.url, dana.client, designId, 2, 'Saved as viewer');
    expect(refused.status).toBe(403);
    expect(teamResponseSchema.parse(await expectStatus(200, send(b.url, dana.client, 'GET', `/api/teams/${teamId}`))).team.role).toBe('viewer');
    // Still a member, so still a reader.
    await expectStatus(200, send(b.url, dana.client, 'GET', `/api/designs/${designId}/versions/2`));
  });

  it('refuses through B a session signed out through A', async () => {
    const session = (await signIn(b.url, olga)).cookie;
    const onB = newClient(session);
    await expectStatus(200, send(b.url, onB, 'GET', '/api/teams'));
    expect(await expectStatus(200, send(b.url, onB, 'GET', '/api/auth/session'))).toMatchObject({ user: { id: olga.id } });

    await expectStatus(204, send(a.url, newClient(session), 'POST', '/api/auth/sign-out'));

    expect(onB.cookie).toBe(session);
    const refused = await send(b.url, onB, 'GET', '/api/teams');
    expect(refused.status).toBe(401);
    expect((await send(b.url, newClient(session), 'GET', '/api/auth/session')).body).toEqual({ user: null });
  });

  it('refuses through B every session of an account signed out everywhere through A', async () => {
    const elsewhere = await signIn(b.url, dana);
    await expectStatus(200, send(b.url, elsewhere, 'GET', '/api/teams'));
    await expectStatus(200, send(b.url, dana.client, 'GET', '/api/teams'));

    await expectStatus(204, send(a.url, newClient(dana.client.cookie), 'POST', '/api/auth/sign-out-everywhere'));

    expect((await send(b.url, elsewhere, 'GET', '/api/teams')).status).toBe(401);
    expect((await send(b.url, dana.client, 'GET', '/api/teams')).status).toBe(401);
  });

  it('shows through B a save and a new design made through A: the latest version, the history and the list page', async () => {
    const designId = await newDesign('Saved elsewhere');
    const other = await newDesign('Listed after');
    // Warm B: the design, its history and the list page (where `other` is now first).
    expect(notebookResponseSchema.parse(await expectStatus(200, send(b.url, olga.client, 'GET', `/api/designs/${designId}`))).design.latestVersion).toBe(1);
    await expectStatus(200, send(b.url, olga.client, 'GET', `/api/designs/${designId}/versions`));
    const before = await listPage(b.url, olga.client);
    expect(before.designs[0]?.id).toBe(other);

    const saved = notebookWithVersionResponseSchema.parse(
      await expectStatus(201, save(a.url, olga.client, designId, 1, 'Saved through A')),
    );
    expect(saved.version.number).toBe(2);

    const latest = notebookResponseSchema.parse(await expectStatus(200, send(b.url, olga.client, 'GET', `/api/designs/${designId}`)));
    expect(latest.design.latestVersion).toBe(2);
    expect(latest.version).toMatchObject({ number: 2, message: 'Saved through A', parentNumber: 1 });
    const history = versionListResponseSchema.parse(await expectStatus(200, send(b.url, olga.client, 'GET', `/api/designs/${designId}/versions`)));
    expect(history.versions.map((v) => v.number)).toEqual([2, 1]);
    const after = await listPage(b.url, olga.client);
    // Newest first: the save moved the design to the top of the page.
    expect(after.designs[0]).toMatchObject({ id: designId, latestVersion: 2 });
    expect(after.total).toBe(before.total);

    const third = await newDesign('Made through A');
    const withNew = await listPage(b.url, olga.client);
    expect(withNew.total).toBe(before.total + 1);
    expect(withNew.designs[0]?.id).toBe(third);
  });
});

describe('rate limits count every process’s requests', () => {
  it('answers the 11th trace in a minute from one address with 429, alternating A and B', async () => {
    // `tracePerIp` is 10 a minute (server/auth/rate-limit.ts); refused bodies count too, so each
    // call is a cheap 400 until the limit, then 429 whichever process takes it.
    const client = newClient();
    const statuses: number[] = [];
    for (let i = 0; i < 10; i++) statuses.push((await send(i % 2 === 0 ? a.url : b.url, client, 'POST', '/api/trace', { rays: 1 })).status);
    expect(statuses).toEqual(Array(10).fill(400));
    for (const url of [a.url, b.url]) {
      const limited = await send(url, client, 'POST', '/api/trace', { rays: 1 });
      expect(limited.status).toBe(429);
      expect(errorBodySchema.parse(limited.body).error.code).toBe('rate_limited');
    }
  });
});

describe('saves on one base from two processes at once', () => {
  const clients = 20;
  const rounds = 5;

  it(`lets exactly one of ${clients} clients win each of ${rounds} rounds, tells the rest the latest version, and loses no save`, async () => {
    const designId = await newDesign('Contended');
    // Twenty signed-in clients, each with its own session and connection, half on each process.
    const urlOf = (i: number) => (i % 2 === 0 ? a.url : b.url);
    // One after another: a sign-in counts as a failure until it has succeeded (express-rate-limit's
    // skipSuccessfulRequests), and ten at once for one e-mail would meet the per-e-mail limit.
    const sessions: Client[] = [];
    for (let i = 0; i < clients; i++) sessions.push(await signIn(urlOf(i), olga));

    const winners: string[] = [];
    const winningProcess: string[] = [];
    for (let round = 1; round <= rounds; round++) {
      const base = round;
      const answers: Answer[] = await Promise.all(
        sessions.map((client, i) => save(urlOf(i), client, designId, base, `Round ${round}, client ${i + 1}`)),
      );
      const won = answers.flatMap((answer, i) => (answer.status === 201 ? [i] : []));
      expect(answers.filter((answer) => answer.status !== 201 && answer.status !== 409)).toEqual([]);
      expect(won).toHaveLength(1);
      const winner = notebookWithVersionResponseSchema.parse(answers[won[0]!]!.body).version;
      expect(winner).toMatchObject({ number: base + 1, parentNumber: base });
      winners.push(winner.message);
      winningProcess.push(won[0]! % 2 === 0 ? 'A' : 'B');
      for (const answer of answers.filter((each) => each.status === 409)) {
        const { error } = versionConflictBodySchema.parse(answer.body);
        expect(error.details.latest).toMatchObject({ number: base + 1, message: winner.message });
      }
    }

    // Read back through both processes: 1..n with no hole and no duplicate, each the one that won.
    for (const url of [a.url, b.url]) {
      const history = versionListResponseSchema.parse(await expectStatus(200, send(url, olga.client, 'GET', `/api/designs/${designId}/versions`)));
      expect(history.versions.map((v) => v.number)).toEqual(Array.from({ length: rounds + 1 }, (_, i) => rounds + 1 - i));
      expect(history.versions.slice(0, rounds).map((v) => v.message).reverse()).toEqual(winners);
    }
    for (const client of sessions) client.agent.destroy();
    // Printed for the report: which process took each round.
    console.log(`contended saves, winner's process per round: ${winningProcess.join(' ')}`);
  });
});

describe('the last-owner rule across processes', () => {
  it('lets only one of two owners demoting each other at once through A and B succeed, round after round', async () => {
    const made = await expectStatus(201, send(a.url, olga.client, 'POST', '/api/teams', { name: 'Two owners' }));
    const twoOwners = teamResponseSchema.parse(made).team.id;
    await addMember(a.url, olga, twoOwners, pat, 'owner', b.url);
    const owners = async () =>
      memberListResponseSchema
        .parse(await expectStatus(200, send(a.url, olga.client, 'GET', `/api/teams/${twoOwners}/members`)))
        .members.filter((m) => m.role === 'owner')
        .map((m) => m.userId);
    const demote = (url: string, by: Person, who: Person) =>
      send(url, by.client, 'PATCH', `/api/teams/${twoOwners}/members/${who.id}`, { role: 'viewer' });

    const losers: number[] = [];
    for (let round = 0; round < 6; round++) {
      expect((await owners()).sort()).toEqual([olga.id, pat.id].sort());
      // Each on its own process, swapped every round; both requests leave together.
      const [olgaUrl, patUrl] = round % 2 === 0 ? [a.url, b.url] : [b.url, a.url];
      const [byOlga, byPat] = await Promise.all([demote(olgaUrl, olga, pat), demote(patUrl, pat, olga)]);
      const statuses = [byOlga.status, byPat.status];
      expect(statuses.filter((s) => s === 200)).toHaveLength(1);
      // The loser either passed the role check and found the last owner (409), or was already a viewer (403).
      const lost = statuses.find((s) => s !== 200)!;
      expect([403, 409]).toContain(lost);
      losers.push(lost);
      const [winner, loser, winnerUrl] = byOlga.status === 200 ? [olga, pat, olgaUrl] : [pat, olga, patUrl];
      expect(await owners()).toEqual([winner.id]);
      await expectStatus(200, send(winnerUrl, winner.client, 'PATCH', `/api/teams/${twoOwners}/members/${loser.id}`, { role: 'owner' }));
    }
    // Printed for the report: how many rounds the row lock decided (409) rather than the role check (403).
    console.log(`last-owner rounds: ${losers.map(String).join(' ')}`);
  });
});
