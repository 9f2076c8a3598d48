import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { exampleDesign } from '../../shared/design';
import type { Role } from '../../shared/teams';
import { listRoutes } from '../support/routes';
import { browserAgent, createTestApp, linkIn, signUp, testOrigin, testPassword, tokenFrom, type TestApp } from '../support/test-app';

/**
 * Who may call what: every API route × every kind of caller → the status they get. The test walks
 * the routes the app really mounts, so a new route that is not in this table fails the build.
 */
const actors = ['owner', 'reviewer', 'viewer', 'outsider', 'anonymous'] as const;
type Actor = (typeof actors)[number];
type Statuses = Record<Actor, number>;

type Fixture = {
  ctx: TestApp;
  teamId: string;
  users: Record<Exclude<Actor, 'anonymous'>, { id: string; email: string }>;
  /**
   * The actor's one signed-in agent, reused across cases: signing in costs an argon2 hash. The
   * anonymous caller gets a new cookie-less agent every time, so no case can leave it signed in.
   */
  agent(actor: Actor): Promise<ReturnType<typeof browserAgent>>;
  /** A new session of its own, for a case that ends or replaces the session it is called with. */
  freshAgent(actor: Actor): Promise<ReturnType<typeof browserAgent>>;
  /** Drops the actor's shared agent after a case that ended all of its sessions. */
  forget(actor: Actor): void;
  /** A new team A-like team owned by `owner` with `reviewer` and `viewer` in it. */
  freshTeam(): Promise<string>;
  /** Adds a new person to the team with a role and returns their id. */
  extraMember(teamId: string, role: Role): Promise<string>;
  invite(teamId: string, email: string, role?: Role): Promise<{ id: string; token: string }>;
};

type Case = { params?: Record<string, string>; body?: unknown };
/**
 * `session`: 'own' when the call ends or replaces the session it carries (sign-up, sign-in,
 * sign-out), so it must not use the shared agent; 'ends-all' when it may end every session of the
 * caller, so the shared agent is signed in again afterwards.
 */
type Row = { expect: Statuses; prepare?: (fx: Fixture, actor: Actor) => Promise<Case>; session?: 'own' | 'ends-all' };

const everyone = (status: number): Statuses => ({ owner: status, reviewer: status, viewer: status, outsider: status, anonymous: status });
const signedIn = (status: number): Statuses => ({ ...everyone(status), anonymous: 401 });
const members = (status: number): Statuses => ({ owner: status, reviewer: status, viewer: status, outsider: 404, anonymous: 401 });
const ownersOnly = (status: number): Statuses => ({ owner: status, reviewer: 403, viewer: 403, outsider: 404, anonymous: 401 });

/** One design in Team A for the read cases; writes that need a clean state make their own. */
let matrixDesign: Promise<string> | undefined;
async function newDesign(fx: Fixture): Promise<string> {
  const res = await (await fx.agent('owner')).post(`/api/teams/${fx.teamId}/designs`).send({ title: 'Matrix design', params: exampleDesign }).expect(201);
  return res.body.design.id as string;
}
const design = (fx: Fixture) => (matrixDesign ??= newDesign(fx));
async function newShareLink(fx: Fixture): Promise<{ id: string; designId: string; token: string }> {
  const designId = await design(fx);
  const res = await (await fx.agent('owner')).post(`/api/designs/${designId}/share-links`).send({}).expect(201);
  return { id: res.body.link.id, designId, token: res.body.token };
}
const designParams = async (fx: Fixture): Promise<Case> => ({ params: { id: await design(fx) } });

let unique = 0;
const freshEmail = () => `matrix-${(unique += 1)}@example.com`;
const password = testPassword;

const matrix: Record<string, Row> = {
  'GET /api/health': { expect: everyone(200) },
  'POST /api/solve': { expect: everyone(200), prepare: async () => ({ body: { design: exampleDesign, at: [500] } }) },
  'GET /api/dev/outbox': { expect: everyone(200) },

  'GET /api/auth/session': { expect: everyone(200) },
  'POST /api/auth/sign-up': {
    expect: everyone(201),
    session: 'own',
    prepare: async () => ({ body: { email: freshEmail(), displayName: 'Matrix', password } }),
  },
  'POST /api/auth/sign-in': {
    expect: everyone(200),
    session: 'own',
    prepare: async (fx) => ({ body: { email: fx.users.viewer.email, password } }),
  },
  'POST /api/auth/sign-out': { expect: everyone(204), session: 'own' },
  'POST /api/auth/sign-out-everywhere': { expect: signedIn(204), session: 'ends-all' },
  'POST /api/auth/password-reset': { expect: everyone(202), prepare: async (fx) => ({ body: { email: fx.users.viewer.email } }) },
  // The token is the credential: a made-up one is refused for everybody alike. A reset that went
  // through would end every session of the account, so it is treated as one that does.
  'POST /api/auth/password-reset/confirm': {
    expect: everyone(400),
    session: 'ends-all',
    prepare: async () => ({ body: { token: 'x'.repeat(40), password: 'another password 1' } }),
  },
  'POST /api/auth/verify-email': { expect: everyone(400), prepare: async () => ({ body: { token: 'x'.repeat(40) } }) },
  'POST /api/auth/verify-email/resend': { expect: signedIn(202) },

  'GET /api/teams': { expect: signedIn(200) },
  'POST /api/teams': { expect: signedIn(201), prepare: async () => ({ body: { name: 'Matrix team' } }) },
  'GET /api/teams/:teamId': { expect: members(200) },
  'PATCH /api/teams/:teamId': { expect: ownersOnly(200), prepare: async () => ({ body: { name: 'Renamed lab' } }) },
  'DELETE /api/teams/:teamId': { expect: ownersOnly(204), prepare: async (fx) => ({ params: { teamId: await fx.freshTeam() } }) },

  'GET /api/teams/:teamId/members': { expect: members(200) },
  'PATCH /api/teams/:teamId/members/:userId': {
    expect: ownersOnly(200),
    prepare: async (fx) => ({ params: { userId: fx.users.viewer.id }, body: { role: 'viewer' } }),
  },
  'DELETE /api/teams/:teamId/members/:userId': {
    expect: ownersOnly(204),
    prepare: async (fx) => ({ params: { userId: await fx.extraMember(fx.teamId, 'viewer') } }),
  },

  'GET /api/teams/:teamId/invitations': { expect: ownersOnly(200) },
  'POST /api/teams/:teamId/invitations': {
    expect: ownersOnly(201),
    prepare: async () => ({ body: { email: freshEmail(), role: 'reviewer' } }),
  },
  'DELETE /api/teams/:teamId/invitations/:invitationId': {
    expect: ownersOnly(204),
    prepare: async (fx) => ({ params: { invitationId: (await fx.invite(fx.teamId, freshEmail())).id } }),
  },

  // Design notebooks: members read and clone, owners write; outsiders learn nothing (404).
  'GET /api/teams/:teamId/designs': { expect: members(200) },
  'POST /api/teams/:teamId/designs': { expect: ownersOnly(201), prepare: async () => ({ body: { title: 'Matrix notebook', params: exampleDesign } }) },
  'POST /api/teams/:teamId/designs/import': {
    expect: ownersOnly(201),
    prepare: async () => ({
      body: {
        kind: 'blazebook-notebook',
        formatVersion: 1,
        title: 'Imported in the matrix',
        versions: [{ number: 1, message: 'Start', params: exampleDesign, createdAt: '2026-01-05T10:00:00Z' }],
      },
    }),
  },
  'GET /api/designs/:id': { expect: members(200), prepare: designParams },
  'PATCH /api/designs/:id': { expect: ownersOnly(200), prepare: async (fx) => ({ ...(await designParams(fx)), body: { tags: ['matrix'] } }) },
  'GET /api/designs/:id/versions': { expect: members(200), prepare: designParams },
  // A design of its own per case, so every save is on top of the latest.
  'POST /api/designs/:id/versions': {
    expect: ownersOnly(201),
    prepare: async (fx) => ({ params: { id: await newDesign(fx) }, body: { baseVersion: 1, params: exampleDesign, message: 'Matrix save' } }),
  },
  'GET /api/designs/:id/versions/:n': { expect: members(200), prepare: async (fx) => ({ params: { id: await design(fx), n: '1' } }) },
  'GET /api/designs/:id/compare': { expect: members(200), prepare: designParams },
  // Into the caller's own workspace, where everyone is owner.
  'POST /api/designs/:id/clone': { expect: members(201), prepare: async (fx) => ({ ...(await designParams(fx)), body: {} }) },
  'PUT /api/designs/:id/baseline': { expect: ownersOnly(200), prepare: async (fx) => ({ ...(await designParams(fx)), body: { version: 1 } }) },
  'GET /api/designs/:id/share-links': { expect: ownersOnly(200), prepare: designParams },
  'POST /api/designs/:id/share-links': { expect: ownersOnly(201), prepare: async (fx) => ({ ...(await designParams(fx)), body: { version: 1 } }) },
  'DELETE /api/designs/:id/share-links/:linkId': {
    expect: ownersOnly(204),
    prepare: async (fx) => {
      const link = await newShareLink(fx);
      return { params: { id: link.designId, linkId: link.id } };
    },
  },
  'GET /api/designs/:id/export': { expect: members(200), prepare: designParams },
  // Reviews: members read them; owners and reviewers comment and record decisions.
  'GET /api/designs/:id/versions/:n/reviews': { expect: members(200), prepare: async (fx) => ({ params: { id: await design(fx), n: '1' } }) },
  'POST /api/designs/:id/versions/:n/reviews': {
    expect: { owner: 201, reviewer: 201, viewer: 403, outsider: 404, anonymous: 401 },
    prepare: async (fx) => ({ params: { id: await design(fx), n: '1' }, body: { body: 'Matrix review', decision: 'approved' } }),
  },
  // The token is the credential: signed in or not, member or not, it shows one version and nothing else.
  'GET /api/share/:token': { expect: everyone(200), prepare: async (fx) => ({ params: { token: (await newShareLink(fx)).token } }) },

  // Anyone holding the link may read what it offers; only its addressee may accept it.
  'GET /api/invitations/:token': {
    expect: everyone(200),
    prepare: async (fx) => ({ params: { token: (await fx.invite(fx.teamId, freshEmail())).token } }),
  },
  'POST /api/invitations/:token/accept': {
    // Members hold a link addressed to somebody else; the outsider holds one addressed to them.
    expect: { owner: 403, reviewer: 403, viewer: 403, outsider: 200, anonymous: 401 },
    prepare: async (fx, actor) => {
      const email = actor === 'outsider' ? fx.users.outsider.email : freshEmail();
      const team = actor === 'outsider' ? await fx.freshTeam() : fx.teamId;
      return { params: { token: (await fx.invite(team, email)).token } };
    },
  },
};

describe('access matrix: every API route × every kind of caller', () => {
  let fx: Fixture;

  beforeAll(async () => {
    const ctx = await createTestApp({ rateLimits: { signInPerIp: 10_000, signInFailuresPerEmailPerIp: 10_000, signInFailuresPerIp: 10_000, signUpPerIp: 10_000, resetPerIp: 10_000, resetPerEmail: 10_000 } });
    const owner = await signUp(ctx.app, 'Owner', 'matrix-owner@example.com');
    const made = await owner.agent.post('/api/teams').send({ name: 'Team A' }).expect(201);
    const teamId: string = made.body.team.id;

    const signIn = async (email: string) => {
      const agent = browserAgent(ctx.app);
      await agent.post('/api/auth/sign-in').send({ email, password }).expect(200);
      return agent;
    };
    // The owner's sign-up session serves until a case ends it; fx.agent then signs in again.
    const shared = new Map<Actor, Promise<ReturnType<typeof browserAgent>>>([['owner', Promise.resolve(owner.agent)]]);
    const asOwner = () => shared.get('owner') ?? fx.agent('owner');
    const invite = async (team: string, email: string, role: Role = 'viewer') => {
      const res = await (await asOwner()).post(`/api/teams/${team}/invitations`).send({ email, role }).expect(201);
      return { id: res.body.invitation.id as string, token: tokenFrom(linkIn(ctx.mailer, email, '/invitations/')) };
    };
    // Only a confirmed address may accept an invitation: follow the link from the sign-up mail.
    const signUpConfirmed = async (name: string, email: string) => {
      const person = await signUp(ctx.app, name, email);
      const token = tokenFrom(linkIn(ctx.mailer, email, '/verify-email'));
      await browserAgent(ctx.app).post('/api/auth/verify-email').send({ token }).expect(200);
      return person;
    };
    const join = async (team: string, role: Role, name: string, email = freshEmail()) => {
      const person = await signUpConfirmed(name, email);
      const { token } = await invite(team, email, role);
      await person.agent.post(`/api/invitations/${token}/accept`).expect(200);
      return person.user;
    };
    const reviewer = await join(teamId, 'reviewer', 'Reviewer', 'matrix-reviewer@example.com');
    const viewer = await join(teamId, 'viewer', 'Viewer', 'matrix-viewer@example.com');
    const outsider = (await signUpConfirmed('Outsider', 'matrix-outsider@example.com')).user;
    const users = { owner: owner.user, reviewer, viewer, outsider };

    fx = {
      ctx,
      teamId,
      users,
      invite,
      agent(actor) {
        if (actor === 'anonymous') return Promise.resolve(browserAgent(ctx.app));
        let agent = shared.get(actor);
        if (!agent) shared.set(actor, (agent = fx.freshAgent(actor)));
        return agent;
      },
      freshAgent: async (actor) => (actor === 'anonymous' ? browserAgent(ctx.app) : signIn(users[actor].email)),
      forget(actor) {
        shared.delete(actor);
      },
      async freshTeam() {
        const res = await (await asOwner()).post('/api/teams').send({ name: 'Fresh team' }).expect(201);
        const id: string = res.body.team.id;
        for (const role of ['reviewer', 'viewer'] as const) {
          const { token } = await invite(id, users[role].email, role);
          const agent = await fx.agent(role);
          await agent.post(`/api/invitations/${token}/accept`).expect(200);
        }
        return id;
      },
      async extraMember(team, role) {
        return (await join(team, role, 'Extra')).id;
      },
    };
  }, 120_000);
  afterAll(() => fx?.ctx.close());

  it('lists every mounted API route, and nothing that is not mounted', () => {
    const mounted = listRoutes(fx.ctx.app).filter((route) => route.includes(' /api/'));
    expect(mounted).toEqual(Object.keys(matrix).sort());
  });

  const cases = Object.entries(matrix).flatMap(([route, row]) =>
    actors.map((actor) => ({ route, actor, status: row.expect[actor], row })),
  );

  it.each(cases)('$route as $actor → $status', async ({ route, actor, status, row }) => {
    const [method, template] = route.split(' ') as [string, string];
    const prepared = row.prepare ? await row.prepare(fx, actor) : {};
    const params: Record<string, string> = { teamId: fx.teamId, ...prepared.params };
    const path = template.replace(/:(\w+)/g, (_, name: string) => {
      const value = params[name];
      if (!value) throw new Error(`no value for :${name} in ${route}`);
      return encodeURIComponent(value);
    });
    const agent = row.session ? await fx.freshAgent(actor) : await fx.agent(actor);
    const call = agent[method.toLowerCase() as 'get' | 'post' | 'put' | 'patch' | 'delete'](path);
    let res: Awaited<typeof call>;
    try {
      res = await (prepared.body === undefined ? call : call.send(prepared.body as object));
    } finally {
      if (row.session === 'ends-all') fx.forget(actor);
    }
    expect({ status: res.status, error: res.status >= 400 ? res.body?.error?.message : undefined }).toMatchObject({ status });
  });

  // Reusing agents is only sound if no case swapped or ended a shared session without saying so.
  it('still has each shared agent signed in as its own actor after every case', async () => {
    for (const actor of ['owner', 'reviewer', 'viewer', 'outsider'] as const) {
      const res = await (await fx.agent(actor)).get('/api/auth/session').expect(200);
      expect(res.body.user?.email).toBe(fx.users[actor].email);
    }
  });

  it('answers an outsider exactly as it answers a team id that does not exist', async () => {
    const outsider = await fx.agent('outsider');
    const real = await outsider.get(`/api/teams/${fx.teamId}/members`).expect(404);
    const made_up = await outsider.get('/api/teams/no-such-team/members').expect(404);
    expect(real.body).toEqual(made_up.body);
  });

  it('answers an outsider about a real design exactly as about a made-up one', async () => {
    const outsider = await fx.agent('outsider');
    const real = await outsider.get(`/api/designs/${await design(fx)}/versions/1`).expect(404);
    const madeUp = await outsider.get('/api/designs/no-such-design/versions/1').expect(404);
    expect(real.body).toEqual(madeUp.body);
  });

  it('has no dev outbox in production', async () => {
    // Only the mounted routes matter here, so it borrows the matrix's database.
    const prod = await createTestApp({ nodeEnv: 'production', database: fx.ctx.database });
    expect(listRoutes(prod.app)).not.toContain('GET /api/dev/outbox');
    await request(prod.app).get('/api/dev/outbox').set('origin', testOrigin).expect(404);
    await prod.close();
  });
});
