import { isDeepStrictEqual } from 'node:util';
import { exampleDesign, type Design } from '../../shared/design';
import { httpRequest, parsed, sessionAfter, type Payload } from './http-request';

/**
 * The durability tests' load and ledger (tests/server/durability.test.ts on both engines,
 * tests/server-postgres/crash-recovery.test.ts): several clients save versions, upload curves and
 * post review remarks against the real server over HTTP; every write the server acknowledged (a
 * 2xx answer) goes into the ledger, and `verify` checks, after a crash and a restart, that each is
 * still there as it was answered and that each design's versions are 1..n.
 */

type Json = Record<string, unknown>;
export type Answer = { status: number; body: Json };

const password = 'a long enough password for crash tests';

/**
 * One client machine: its own cookies and its own loopback address. The address is what the
 * per-address limits count (20 curve uploads a minute), which are not what these tests are about,
 * so `moveTo` gives a client a fresh one for each round of load.
 */
export class Client {
  private cookie: string | null = null;
  constructor(
    readonly name: string,
    private target: () => string,
    private localAddress = '127.0.0.1',
  ) {}

  moveTo(localAddress: string) {
    this.localAddress = localAddress;
  }

  /** Answers the status and parsed JSON; rejects when the server cannot be reached or hangs up. */
  async send(method: string, path: string, payload?: Payload): Promise<Answer> {
    const reply = await httpRequest({ base: this.target(), method, path, payload, cookie: this.cookie, localAddress: this.localAddress });
    // None of these flows signs out, so a cookie once set stays.
    this.cookie = sessionAfter(reply.setCookie, this.cookie);
    return { status: reply.status, body: parsed<Json>(reply.text, {}, (text) => ({ text })) };
  }

  /** `send`, expecting `status`: for the setup, where anything else is a broken test. */
  async expect(status: number, method: string, path: string, payload?: Payload): Promise<Json> {
    const answer = await this.send(method, path, payload);
    if (answer.status !== status) throw new Error(`${this.name}: ${method} ${path} answered ${answer.status}, not ${status}: ${JSON.stringify(answer.body)}`);
    return answer.body;
  }
}

export type Version = { number: number; parentNumber: number | null; params: unknown; notes: string; message: string } & Json;
type Curve = { id: string } & Json;
type Thread = { id: string; version: number; remarks: { id: string; body: string | null }[] } & Json;

/** Every acknowledged write, with the answer that acknowledged it. */
export class Ledger {
  versions = new Map<string, Map<number, Version>>();
  curves = new Map<string, Curve>();
  threads = new Map<string, { designId: string; version: number }>();
  remarks = new Map<string, { threadId: string; body: string }>();
  /** Things wrong with an answer at the time it came (two 201s for one number, a wrong parent). */
  problems: string[] = [];

  get count() {
    let versions = 0;
    for (const byNumber of this.versions.values()) versions += byNumber.size;
    return { versions, curves: this.curves.size, remarks: this.remarks.size };
  }

  addVersion(designId: string, version: Version, base: number | null) {
    const byNumber = this.versions.get(designId) ?? new Map<number, Version>();
    this.versions.set(designId, byNumber);
    if (byNumber.has(version.number)) this.problems.push(`design ${designId}: version ${version.number} acknowledged twice`);
    if (base !== null && (version.number !== base + 1 || version.parentNumber !== base)) {
      this.problems.push(`design ${designId}: a save on ${base} was answered as version ${version.number} on ${version.parentNumber}`);
    }
    byNumber.set(version.number, version);
  }

  latest(designId: string): number {
    return Math.max(...(this.versions.get(designId)?.keys() ?? [1]));
  }
}

export type Team = {
  teamId: string;
  designIds: string[];
  /** Sessions of the team's owner (saves and uploads are an owner's). */
  owners: Client[];
  /** Two reviewers (remarks). */
  reviewers: Client[];
  /** Reads for the checks, from 127.0.0.1 (the dev outbox answers only loopback). */
  reader: Client;
};

/** The token of the first link to `path` in a mail's text (in its query, or its last segment). */
function tokenAfter(text: string, path: string): string | undefined {
  const link = new RegExp(`https?://\\S*${path}\\S*`).exec(text)?.[0];
  if (!link) return undefined;
  const url = new URL(link);
  return url.searchParams.get('token') ?? url.pathname.split('/').pop();
}

/** The confirmation or invitation link in the newest message to `to`, from the dev outbox. */
async function tokenFor(reader: Client, to: string, path: string): Promise<string> {
  const { messages } = (await reader.expect(200, 'GET', '/api/dev/outbox')) as { messages: { to: string; text: string }[] };
  const token = messages.filter((m) => m.to === to).map((m) => tokenAfter(m.text, path)).find(Boolean);
  if (!token) throw new Error(`no ${path} link to ${to} in the outbox`);
  return token;
}

/**
 * An owner (three sessions, as on three machines) and two reviewers, each address confirmed
 * through the outbox's links; a team they share by invitation, and `designCount` notebooks, whose
 * versions 1 go into the ledger.
 */
export async function setUpTeam(target: () => string, ledger: Ledger, { label, designCount = 2 }: { label: string; designCount?: number }): Promise<Team> {
  const reader = new Client('reader', target);
  const people = ['owner', 'reviewer-1', 'reviewer-2'].map((role) => ({ role, email: `${role}.${label}@example.com` }));
  const clients = people.map(({ role }) => new Client(role, target));
  await Promise.all(
    people.map(({ role, email }, i) => clients[i]!.expect(201, 'POST', '/api/auth/sign-up', { email, displayName: `${role} ${label}`, password })),
  );
  for (const [i, { email }] of people.entries()) {
    await clients[i]!.expect(200, 'POST', '/api/auth/verify-email', { token: await tokenFor(reader, email, '/verify-email') });
  }
  const [owner, ...reviewers] = clients as [Client, Client, Client];
  const { team } = (await owner.expect(201, 'POST', '/api/teams', { name: `Crash bench ${label}` })) as { team: { id: string } };
  for (const [i, reviewer] of reviewers.entries()) {
    const email = people[i + 1]!.email;
    await owner.expect(201, 'POST', `/api/teams/${team.id}/invitations`, { email, role: 'reviewer' });
    await reviewer.expect(200, 'POST', `/api/invitations/${await tokenFor(reader, email, '/invitations/')}/accept`);
  }
  const owners = [owner, new Client('owner-2', target), new Client('owner-3', target)];
  for (const session of owners.slice(1)) await session.expect(200, 'POST', '/api/auth/sign-in', { email: people[0]!.email, password });
  const designIds: string[] = [];
  for (let d = 0; d < designCount; d++) {
    const made = (await owner.expect(201, 'POST', `/api/teams/${team.id}/designs`, {
      title: `Scanner ${d + 1}`,
      tags: [],
      params: exampleDesign,
      notes: 'First cut.',
      message: 'Version 1',
    })) as { design: { id: string }; version: Version };
    designIds.push(made.design.id);
    ledger.addVersion(made.design.id, made.version, null);
  }
  return { teamId: team.id, designIds, owners, reviewers, reader };
}

export type Round = {
  /** Set to end the load; every worker returns after its request in flight. */
  stop(): Promise<void>;
  /** Requests sent and not yet answered (nor failed). */
  inFlight(): number;
  /** Acknowledged writes in this round so far. */
  acknowledged(): number;
  /** Acknowledged writes of each kind in this round so far. */
  kinds: { versions: number; curves: number; remarks: number };
  /** Writes whose request failed or got no 2xx, by status (0: no answer). */
  refused: Map<number, number>;
};

let unique = 0;
const pause = (ms: number) => new Promise((resolve) => setTimeout(resolve, ms));

/**
 * One round of mixed load: each owner session saves versions on every design in turn (on the
 * latest it knows, taking the latest from a 409's details and saving again), the first owner
 * session also uploads a curve after every few saves, and each reviewer starts threads on the
 * latest acknowledged version and replies in known ones. Clients move to addresses of their own
 * for the round (`127.0.<round>.<n>`).
 */
export function startRound(team: Team, ledger: Ledger, round: number): Round {
  let running = true;
  let inFlight = 0;
  const kinds = { versions: 0, curves: 0, remarks: 0 };
  const refused = new Map<number, number>();
  [...team.owners, ...team.reviewers].forEach((client, i) => client.moveTo(`127.0.${round + 1}.${i + 2}`));

  async function attempt(client: Client, method: string, path: string, payload?: Payload): Promise<Answer> {
    inFlight++;
    try {
      return await client.send(method, path, payload);
    } catch {
      return { status: 0, body: {} };
    } finally {
      inFlight--;
    }
  }
  const refuse = (status: number) => refused.set(status, (refused.get(status) ?? 0) + 1);

  async function saver(client: Client, index: number) {
    const base = new Map(team.designIds.map((id) => [id, ledger.latest(id)]));
    for (let turn = 0; running; turn++) {
      const designId = team.designIds[(turn + index) % team.designIds.length]!;
      const n = ++unique;
      const params: Design = { ...exampleDesign, slits: { ...exampleDesign.slits, exitWidthUm: 50 + n / 8 } };
      const baseVersion = base.get(designId)!;
      const answer = await attempt(client, 'POST', `/api/designs/${designId}/versions`, {
        baseVersion,
        params,
        notes: `Round ${round}, save ${n} by ${client.name}.`,
        message: `Save ${n}`,
      });
      if (answer.status === 201) {
        const version = answer.body.version as Version;
        ledger.addVersion(designId, version, baseVersion);
        base.set(designId, version.number);
        kinds.versions++;
      } else if (answer.status === 409) {
        const latest = (answer.body.error as { details?: { latest?: Version } }).details?.latest;
        if (latest) base.set(designId, latest.number);
      } else {
        refuse(answer.status);
        // The server is gone or its database is: ask again for the latest once it answers.
        await pause(25);
        const fresh = await attempt(client, 'GET', `/api/designs/${designId}`);
        if (fresh.status === 200) base.set(designId, (fresh.body.design as { latestVersion: number }).latestVersion);
      }
      if (index === 0 && turn % 3 === 0 && running) await upload(client);
    }
  }

  async function upload(client: Client) {
    const n = ++unique;
    const form = new FormData();
    form.set('kind', 'grating-efficiency');
    form.set('name', `Grating ${n}`);
    // Different bytes each time, so no upload is recognised as one already stored.
    const file = `# round ${round}, upload ${n}\nWavelength (nm),Efficiency (%)\n500,45\n550,${50 + n / 1000}\n600,52\n`;
    form.set('file', new Blob([file], { type: 'text/csv' }), `grating-${n}.csv`);
    const answer = await attempt(client, 'POST', `/api/teams/${team.teamId}/curves`, { multipart: form });
    if (answer.status === 201) {
      const curve = answer.body.curve as Curve;
      if (ledger.curves.has(curve.id)) ledger.problems.push(`curve ${curve.id} acknowledged twice`);
      ledger.curves.set(curve.id, curve);
      kinds.curves++;
    } else refuse(answer.status);
  }

  async function remarker(client: Client, index: number) {
    for (let turn = 0; running; turn++) {
      const designId = team.designIds[(turn + index) % team.designIds.length]!;
      const n = ++unique;
      const body = `Remark ${n} in round ${round} by ${client.name}.`;
      const known = [...ledger.threads].filter(([, t]) => t.designId === designId);
      const reply = known.length > 0 && turn % 3 !== 0 ? known[n % known.length]![0] : null;
      const answer = reply
        ? await attempt(client, 'POST', `/api/threads/${reply}/remarks`, { body, mentions: [] })
        : await attempt(client, 'POST', `/api/designs/${designId}/versions/${ledger.latest(designId)}/threads`, {
            pin: { kind: 'version' },
            body,
            mentions: [],
          });
      if (answer.status !== 201) {
        refuse(answer.status);
        await pause(25);
        continue;
      }
      const thread = answer.body.thread as Thread;
      if (!reply) ledger.threads.set(thread.id, { designId, version: thread.version });
      const remark = thread.remarks.find((r) => r.body === body);
      if (!remark) ledger.problems.push(`thread ${thread.id}: a 201 whose thread lacks the remark “${body}”`);
      else ledger.remarks.set(remark.id, { threadId: thread.id, body });
      kinds.remarks++;
    }
  }

  const workers = [...team.owners.map(saver), ...team.reviewers.map(remarker)];
  const done = Promise.all(workers);
  return {
    async stop() {
      running = false;
      await done;
    },
    inFlight: () => inFlight,
    acknowledged: () => kinds.versions + kinds.curves + kinds.remarks,
    kinds,
    refused,
  };
}

/**
 * Resolves once the round has at least `writes` acknowledged writes, one of each kind among them,
 * and at least two requests in flight, so whatever comes next (a kill, a crash) lands in the
 * middle of the load; rejects after `timeoutMs`. Answers how many requests were in flight.
 */
export async function midLoad(round: Round, writes: number, timeoutMs = 20_000): Promise<number> {
  const until = performance.now() + timeoutMs;
  const ready = () => round.acknowledged() >= writes && Object.values(round.kinds).every((n) => n > 0) && round.inFlight() >= 2;
  while (!ready()) {
    if (performance.now() > until) {
      throw new Error(`the load did not reach ${writes} writes of every kind with requests in flight in ${timeoutMs} ms: ${JSON.stringify(round.kinds)}`);
    }
    await new Promise((resolve) => setImmediate(resolve));
  }
  return round.inFlight();
}

export type Verified = {
  /** Everything that is not as acknowledged: empty when the data survived. */
  problems: string[];
  /** Versions present that were never acknowledged: commits whose answer the crash cut off. */
  unacknowledgedVersions: number;
  /** Each design's version numbers as the server lists them, oldest first. */
  numbers: Map<string, number[]>;
};

/**
 * Reads everything in the ledger back through the API: each design lists exactly versions 1..n
 * (n its latest), and every acknowledged version, curve, thread and remark is there and equal to
 * the answer that acknowledged it.
 */
export async function verify(team: Team, ledger: Ledger): Promise<Verified> {
  const problems = [...ledger.problems];
  const reader = team.owners[0]!;
  reader.moveTo('127.0.0.1');
  const numbers = new Map<string, number[]>();
  let unacknowledgedVersions = 0;
  // Every read at once: the checks read a lot, and the answers do not depend on each other.
  await Promise.all(
    [...ledger.versions].map(async ([designId, acknowledged]) => {
      const { versions } = (await reader.expect(200, 'GET', `/api/designs/${designId}/versions`)) as { versions: { number: number }[] };
      const listed = versions.map((v) => v.number).sort((a, b) => a - b);
      numbers.set(designId, listed);
      const expected = Array.from({ length: listed.length }, (_, i) => i + 1);
      if (!isDeepStrictEqual(listed, expected)) problems.push(`design ${designId}: versions ${listed.join(',')} are not 1..${listed.length}`);
      const { design } = (await reader.expect(200, 'GET', `/api/designs/${designId}`)) as { design: { latestVersion: number } };
      if (design.latestVersion !== listed.at(-1)) problems.push(`design ${designId}: latest ${design.latestVersion}, but versions end at ${listed.at(-1)}`);
      unacknowledgedVersions += listed.filter((n) => !acknowledged.has(n)).length;
      await Promise.all(
        [...acknowledged].map(async ([number, version]) => {
          const answer = await reader.send('GET', `/api/designs/${designId}/versions/${number}`);
          if (answer.status !== 200) problems.push(`design ${designId}: acknowledged version ${number} answers ${answer.status}`);
          else if (!isDeepStrictEqual(answer.body.version, version)) {
            problems.push(`design ${designId}: version ${number} differs from its acknowledgement: ${JSON.stringify(answer.body.version)} ≠ ${JSON.stringify(version)}`);
          }
        }),
      );
    }),
  );
  await Promise.all(
    [...ledger.curves].map(async ([curveId, curve]) => {
      const answer = await reader.send('GET', `/api/teams/${team.teamId}/curves/${curveId}`);
      if (answer.status !== 200) problems.push(`acknowledged curve ${curveId} answers ${answer.status}`);
      else if (!isDeepStrictEqual(answer.body.curve, curve)) problems.push(`curve ${curveId} differs from its acknowledgement`);
    }),
  );
  const threads = new Map<string, Thread>();
  await Promise.all(
    [...ledger.threads].map(async ([threadId, { version }]) => {
      const answer = await reader.send('GET', `/api/threads/${threadId}`);
      if (answer.status !== 200) problems.push(`acknowledged thread ${threadId} answers ${answer.status}`);
      else {
        const thread = answer.body.thread as Thread;
        threads.set(threadId, thread);
        if (thread.version !== version) problems.push(`thread ${threadId} moved from version ${version} to ${thread.version}`);
      }
    }),
  );
  for (const [remarkId, { threadId, body }] of ledger.remarks) {
    const remark = threads.get(threadId)?.remarks.find((r) => r.id === remarkId);
    if (!remark) problems.push(`acknowledged remark ${remarkId} is missing from thread ${threadId}`);
    else if (remark.body !== body) problems.push(`remark ${remarkId} reads “${remark.body}”, not “${body}”`);
  }
  return { problems, unacknowledgedVersions, numbers };
}
