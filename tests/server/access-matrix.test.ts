import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { exampleDesign } from '../../shared/design';
import { apiRoutes, type RouteEntry } from '../../shared/contract/index';
import { can, type Role } from '../../shared/teams';
import { browserAgent, createTestApp, linkIn, signUp, testOrigin, testPassword, tokenFrom, type TestApp } from '../support/test-app';

/**
 * Who may call what: every route of the API contract × every kind of caller → the status they
 * get. The statuses follow from the access the contract states for the route (`anyone`,
 * `signed-in`, `team` with a capability, `link`, `local`), so this checks the contract against
 * the running server; a row gives its own only where the answer depends on more (a made-up
 * token, an invitation addressed to someone else). A contract route missing here fails the build.
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

/**
 * `query`: for a route that needs one to answer at all (the compare sheet names both versions).
 * `form`: a multipart body (the curve uploads): its text fields and the file sent in the part `file`.
 */
type Case = { params?: Record<string, string>; query?: Record<string, string>; body?: unknown; form?: { fields: Record<string, string>; file: string } };
/**
 * `session`: 'own' when the call ends or replaces the session it carries (sign-up, sign-in,
 * sign-out), so it must not use the shared agent; 'ends-all' when it may end every session of the
 * caller, so the shared agent is signed in again afterwards.
 */
type Row = { expect?: Statuses; prepare?: (fx: Fixture, actor: Actor) => Promise<Case>; session?: 'own' | 'ends-all' };

const everyone = (status: number): Statuses => ({ owner: status, reviewer: status, viewer: status, outsider: status, anonymous: status });

/**
 * What the contract's access for a route promises each caller: its success status where allowed;
 * 401 without a session; for a team's resource 404 outside the team (as if it did not exist) and
 * 403 for a member whose role lacks the capability (`can()` from shared/teams). The matrix's
 * members hold exactly the role their name says.
 */
function promised(entry: RouteEntry): Statuses {
  const ok = entry.status;
  const access = entry.meta.access;
  switch (access.kind) {
    case 'anyone':
    case 'link':
    case 'local':
      return everyone(ok);
    case 'signed-in':
      return { ...everyone(ok), anonymous: 401 };
    case 'team': {
      const member = (role: Role) => (can(role, access.capability) ? ok : 403);
      return { owner: member('owner'), reviewer: member('reviewer'), viewer: member('viewer'), outsider: 404, anonymous: 401 };
    }
  }
}

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
const versionParams = async (fx: Fixture): Promise<Case> => ({ params: { id: await design(fx), n: '1' } });
/** A thread the owner starts on v1 of the matrix design, with the id of its first remark. */
async function newThread(fx: Fixture): Promise<{ id: string; remarkId: string }> {
  const res = await (await fx.agent('owner'))
    .post(`/api/designs/${await design(fx)}/versions/1/threads`)
    .send({ pin: { kind: 'version' }, body: 'Matrix thread' })
    .expect(201);
  return { id: res.body.thread.id, remarkId: res.body.thread.remarks[0].id };
}
let matrixThread: Promise<{ id: string; remarkId: string }> | undefined;
const thread = (fx: Fixture) => (matrixThread ??= newThread(fx));

let unique = 0;
/** A curve file no earlier case sent, so an upload is new (201), not recognised (200). */
const freshCurveForm = () => ({ fields: { kind: 'mirror-reflectance' }, file: `nm,R\n500,0.9\n${600 + (unique += 1)},0.95\n` });
async function newCurve(fx: Fixture): Promise<string> {
  const { fields, file } = freshCurveForm();
  const res = await (await fx.agent('owner')).post(`/api/teams/${fx.teamId}/curves`).field(fields).attach('file', Buffer.from(file), 'matrix.csv').expect(201);
  return res.body.curve.id as string;
}
let matrixCurve: Promise<string> | undefined;
const curve = (fx: Fixture) => (matrixCurve ??= newCurve(fx));
const freshEmail = () => `matrix-${(unique += 1)}@example.com`;
const password = testPassword;

const matrix: Record<string, Row> = {
  'platform.health': {},
  'platform.solve': { prepare: async () => ({ body: { design: exampleDesign, at: [500] } }) },
  'platform.outbox': {},
  'platform.openapi': {},
  'search.run': {
    prepare: async () => ({
      body: {
        range: { startNm: 500, endNm: 600 },
        requirements: { maxBandpassNm: 1 },
        search: { grooveDensitiesPerMm: [1200], blazeWavelengthsNm: [500], maxOrder: 1, deviationAnglesDeg: [20], focalLengthsMm: [300] },
      },
    }),
  },
  'trace.run': { prepare: async () => ({ body: { design: exampleDesign, atNm: [500], rays: 200 } }) },
  'selectors.run': { prepare: async () => ({ body: { kind: 'prism', material: 'fused-silica', apexDeg: 60, baseMm: 50, wavelengthsNm: [587.6] } }) },

  'accounts.session': {},
  'accounts.signUp': {
    session: 'own',
    prepare: async () => ({ body: { email: freshEmail(), displayName: 'Matrix', password } }),
  },
  'accounts.signIn': {
    session: 'own',
    prepare: async (fx) => ({ body: { email: fx.users.viewer.email, password } }),
  },
  'accounts.signOut': { session: 'own' },
  'accounts.signOutEverywhere': { session: 'ends-all' },
  'accounts.requestPasswordReset': { prepare: async (fx) => ({ body: { email: fx.users.viewer.email } }) },
  // The token is the credential: a made-up one is refused for everybody alike. A reset that went
  // through would end every session of the account, so it is treated as one that does.
  'accounts.confirmPasswordReset': {
    expect: everyone(400),
    session: 'ends-all',
    prepare: async () => ({ body: { token: 'x'.repeat(40), password: 'another password 1' } }),
  },
  'accounts.verifyEmail': { expect: everyone(400), prepare: async () => ({ body: { token: 'x'.repeat(40) } }) },
  'accounts.resendVerification': {},

  'teams.list': {},
  'teams.create': { prepare: async () => ({ body: { name: 'Matrix team' } }) },
  'teams.get': {},
  'teams.rename': { prepare: async () => ({ body: { name: 'Renamed lab' } }) },
  'teams.remove': { prepare: async (fx) => ({ params: { teamId: await fx.freshTeam() } }) },

  'teams.members': {},
  'teams.changeRole': {
    
    prepare: async (fx) => ({ params: { userId: fx.users.viewer.id }, body: { role: 'viewer' } }),
  },
  'teams.removeMember': {
    
    prepare: async (fx) => ({ params: { userId: await fx.extraMember(fx.teamId, 'viewer') } }),
  },

  'teams.invitations': {},
  'teams.invite': {
    
    prepare: async () => ({ body: { email: freshEmail(), role: 'reviewer' } }),
  },
  'teams.revokeInvitation': {
    
    prepare: async (fx) => ({ params: { invitationId: (await fx.invite(fx.teamId, freshEmail())).id } }),
  },

  // Design notebooks: members read and clone, owners write; outsiders learn nothing (404).
  'notebooks.list': {},
  'notebooks.create': { prepare: async () => ({ body: { title: 'Matrix notebook', params: exampleDesign } }) },
  'notebooks.importFile': {
    
    prepare: async () => ({
      body: {
        kind: 'blazebook-notebook',
        formatVersion: 1,
        title: 'Imported in the matrix',
        versions: [{ number: 1, message: 'Start', params: exampleDesign, createdAt: '2026-01-05T10:00:00Z' }],
      },
    }),
  },
  'notebooks.get': { prepare: designParams },
  'notebooks.update': { prepare: async (fx) => ({ ...(await designParams(fx)), body: { tags: ['matrix'] } }) },
  'notebooks.versions': { prepare: designParams },
  // A design of its own per case, so every save is on top of the latest.
  'notebooks.saveVersion': {
    
    prepare: async (fx) => ({ params: { id: await newDesign(fx) }, body: { baseVersion: 1, params: exampleDesign, message: 'Matrix save' } }),
  },
  'notebooks.version': { prepare: async (fx) => ({ params: { id: await design(fx), n: '1' } }) },
  'notebooks.compare': { prepare: designParams },
  // Into the caller's own workspace, where everyone is owner.
  'notebooks.clone': { prepare: async (fx) => ({ ...(await designParams(fx)), body: {} }) },
  'notebooks.setBaseline': { prepare: async (fx) => ({ ...(await designParams(fx)), body: { version: 1 } }) },
  'notebooks.shareLinks': { prepare: designParams },
  'notebooks.createShareLink': { prepare: async (fx) => ({ ...(await designParams(fx)), body: { version: 1 } }) },
  'notebooks.revokeShareLink': {
    
    prepare: async (fx) => {
      const link = await newShareLink(fx);
      return { params: { id: link.designId, linkId: link.id } };
    },
  },
  'notebooks.exportFile': { prepare: designParams },
  // Design review: members read it; owners and reviewers write remarks, resolve and decide; owners ask for reviews.
  'reviews.get': { prepare: versionParams },
  'reviews.states': { prepare: designParams },
  'reviews.startThread': {
    prepare: async (fx) => ({ ...(await versionParams(fx)), body: { pin: { kind: 'field', path: 'slits.exitWidthUm' }, body: 'Matrix remark' } }),
  },
  'reviews.getThread': { prepare: async (fx) => ({ params: { threadId: (await thread(fx)).id } }) },
  'reviews.reply': { prepare: async (fx) => ({ params: { threadId: (await thread(fx)).id }, body: { body: 'Matrix reply' } }) },
  // Resolving a resolved thread changes nothing and answers 200 too.
  'reviews.setThreadStatus': { prepare: async (fx) => ({ params: { threadId: (await thread(fx)).id }, body: { status: 'resolved' } }) },
  // A remark of the owner's, new for each case: only its author edits or removes it, so a reviewer,
  // who may write remarks, is refused someone else's (403).
  'reviews.editRemark': {
    expect: { owner: 200, reviewer: 403, viewer: 403, outsider: 404, anonymous: 401 },
    prepare: async (fx) => ({ params: { remarkId: (await newThread(fx)).remarkId }, body: { body: 'Matrix edit' } }),
  },
  'reviews.removeRemark': {
    expect: { owner: 200, reviewer: 403, viewer: 403, outsider: 404, anonymous: 401 },
    prepare: async (fx) => ({ params: { remarkId: (await newThread(fx)).remarkId } }),
  },
  'reviews.requestReview': { prepare: async (fx) => ({ ...(await versionParams(fx)), body: { reviewerIds: [fx.users.reviewer.id] } }) },
  // The owner wrote v1 of the matrix design, and the author of a version never decides on it.
  'reviews.decide': {
    expect: { owner: 403, reviewer: 201, viewer: 403, outsider: 404, anonymous: 401 },
    prepare: async (fx) => ({ ...(await versionParams(fx)), body: { outcome: 'signed-off', summary: 'Matrix sign-off' } }),
  },

  // What waits for me: each signed-in person's own inbox and e-mail settings.
  'inbox.list': {},
  'inbox.unreadCount': {},
  'inbox.markRead': { prepare: async () => ({ body: { all: true } }) },
  'inbox.mailSettings': {},
  'inbox.updateMailSettings': {
    prepare: async () => ({ body: { reviewRequests: true, mentions: true, threadsOnMyDesigns: false, decisionsOnMyVersions: true } }),
  },
  // The token is the credential: signed in or not, member or not, it shows one version and nothing else.
  'notebooks.shared': { prepare: async (fx) => ({ params: { token: (await newShareLink(fx)).token } }) },
  // Design sheets: read like the version they print; the share link's sheet like its page.
  'sheets.version': { prepare: versionParams },
  'sheets.compare': { prepare: async (fx) => ({ ...(await designParams(fx)), query: { a: '1', b: '1' } }) },
  'sheets.shared': { prepare: async (fx) => ({ params: { token: (await newShareLink(fx)).token } }) },

  // The curve library: anyone signed in previews a file; members read the library, owners add and remove.
  'curves.preview': { prepare: async () => ({ form: freshCurveForm() }) },
  'curves.upload': { prepare: async () => ({ form: freshCurveForm() }) },
  'curves.list': {},
  'curves.get': { prepare: async (fx) => ({ params: { curveId: await curve(fx) } }) },
  'curves.remove': { prepare: async (fx) => ({ params: { curveId: await newCurve(fx) } }) },

  // Anyone holding the link may read what it offers; only its addressee may accept it.
  'teams.previewInvitation': {
    
    prepare: async (fx) => ({ params: { token: (await fx.invite(fx.teamId, freshEmail())).token } }),
  },
  'teams.acceptInvitation': {
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
    const ctx = await createTestApp({ rateLimits: { signInPerIp: 10_000, signInFailuresPerEmailPerIp: 10_000, signInFailuresPerIp: 10_000, signUpPerIp: 10_000, resetPerIp: 10_000, resetPerEmail: 10_000, curveUploadsPerIp: 10_000 } });
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

  it('has a row for every route of the contract, and none for a route it does not have', () => {
    expect(Object.keys(matrix).sort()).toEqual(apiRoutes.map((entry) => entry.name).sort());
  });

  const cases = apiRoutes.flatMap((entry) => {
    const row = matrix[entry.name] ?? {};
    const statuses = row.expect ?? promised(entry);
    return actors.map((actor) => ({ route: `${entry.name} (${entry.method} /api${entry.path})`, entry, actor, status: statuses[actor], row }));
  });

  it.each(cases)('$route as $actor → $status', async ({ entry, actor, status, row }) => {
    const method = entry.method;
    const prepared = row.prepare ? await row.prepare(fx, actor) : {};
    const params: Record<string, string> = { teamId: fx.teamId, ...prepared.params };
    const path = `/api${entry.path}`.replace(/\{(\w+)\}/g, (_, name: string) => {
      const value = params[name];
      if (!value) throw new Error(`no value for {${name}} in ${entry.name}`);
      return encodeURIComponent(value);
    });
    const agent = row.session ? await fx.freshAgent(actor) : await fx.agent(actor);
    const bare = agent[method.toLowerCase() as 'get' | 'post' | 'put' | 'patch' | 'delete'](path);
    const call = prepared.query ? bare.query(prepared.query) : bare;
    let res: Awaited<typeof call>;
    try {
      const form = prepared.form;
      res = await (form ? call.field(form.fields).attach('file', Buffer.from(form.file), 'matrix.csv') : prepared.body === undefined ? call : call.send(prepared.body as object));
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

  it('has no dev outbox in production: it answers like a path that does not exist', async () => {
    // Only the mounted routes matter here, so it borrows the matrix's database.
    const prod = await createTestApp({ nodeEnv: 'production', database: fx.ctx.database });
    await request(prod.app).get('/api/dev/outbox').set('origin', testOrigin).expect(404);
    await prod.close();
  });
});
