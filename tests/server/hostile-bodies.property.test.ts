import * as fc from 'fast-check';
import { createServer, type Server } from 'node:http';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { errorBodySchema } from '../../shared/api-error';
import { exampleDesign } from '../../shared/design';
import { listRoutes } from '../support/routes';
import { testOrigin } from '../support/test-app';
import { createNotebookFixture, type NotebookFixture } from './notebooks/fixture';
import { testEngine } from '../support/server-databases';

/**
 * Random and poisoned JSON thrown at every route that reads a body: whatever arrives, the answer
 * is never a 500, and every refusal has the one error shape. Half the cases are a valid body with
 * one value replaced (so they get past the outer checks and reach the deep ones and the database),
 * half are arbitrary JSON. Runs per route are fixed; the whole file is bounded by its timeouts.
 */

/**
 * On a PostgreSQL server (api-postgres) each request also counts its rate limits and checks its
 * session and role in the database (no process keeps them there), about four times the time per
 * request: a quarter of the runs keep the file near the embedded one's minute and a half, and
 * still reach what the server engine adds (NUL and odd text in stored keys, huge numbers).
 */
const runsPerRoute = testEngine() === 'server' ? 250 : 1000;
/**
 * The example design with an order-sorting filter, a light input and a measured curve, so the
 * fuzzer reaches the filter list's, the input's and the curve's fields too.
 */
const filteredDesign = {
  ...exampleDesign,
  filters: [{ kind: 'long-pass', cutOnNm: 395, inFromNm: 400, inToNm: 780, edgeWidthNm: 10 }],
  input: { kind: 'fibre', numericalAperture: 0.22, coreDiameterUm: 200 },
  curves: [
    {
      kind: 'grating-efficiency',
      name: 'Demo batch',
      checksum: 'e'.repeat(64),
      medium: 'air',
      order: 1,
      wavelengthsNm: [300, 600, 900],
      values: [0.3, 0.7, 0.4],
    },
  ],
};

/** Every string PostgreSQL could choke on shows up: NUL, lone surrogates, any UTF-16 code unit. */
const anyCodeUnits = fc.array(fc.integer({ min: 0, max: 0xffff }), { maxLength: 24 }).map((units) => String.fromCharCode(...units));

function nested(depth: number): unknown {
  let value: unknown = 'bottom';
  for (let i = 0; i < depth; i += 1) value = i % 2 ? [value] : { deeper: value };
  return value;
}

const hostileLeaf: fc.Arbitrary<unknown> = fc.oneof(
  anyCodeUnits,
  fc.constantFrom(
    '\u0000',
    'a\u0000b',
    '\uD800',
    'x\uDC00y',
    '\uD800\uD800',
    '',
    '   ',
    'x'.repeat(10_000),
    2 ** 31,
    2 ** 31 - 1,
    -(2 ** 31) - 1,
    2 ** 53,
    Number.MAX_SAFE_INTEGER + 2,
    1e308,
    -1e308,
    5e-324,
    0,
    -1,
    1.5,
    true,
    false,
    null,
    [],
    {},
    '2026-02-30T25:61:00Z',
    '99999-01-01T00:00:00Z',
    '__proto__',
    { __proto__: { polluted: true } },
  ),
  fc.constantFrom(nested(20), nested(70), nested(300)),
  fc.jsonValue({ maxDepth: 3 }),
);

type Path = (string | number)[];

/** Paths to every value inside a JSON value, the value itself included. */
function pathsIn(value: unknown, prefix: Path = []): Path[] {
  const here = [prefix];
  if (Array.isArray(value)) return here.concat(value.flatMap((v, i) => pathsIn(v, [...prefix, i])));
  if (value && typeof value === 'object') return here.concat(Object.entries(value).flatMap(([k, v]) => pathsIn(v, [...prefix, k])));
  return here;
}

function replaceAt(base: unknown, path: Path, replacement: unknown): unknown {
  if (path.length === 0) return replacement;
  const copy = structuredClone(base) as Record<string | number, unknown>;
  let node = copy;
  for (const key of path.slice(0, -1)) node = node[key] as Record<string | number, unknown>;
  node[path[path.length - 1]!] = replacement;
  return copy;
}

/** A valid body with one value replaced, a key added, or arbitrary JSON. */
function bodies(base: unknown): fc.Arbitrary<unknown> {
  const paths = pathsIn(base);
  return fc.oneof(
    { weight: 3, arbitrary: fc.tuple(fc.constantFrom(...paths), hostileLeaf).map(([path, leaf]) => replaceAt(base, path, leaf)) },
    { weight: 1, arbitrary: fc.tuple(anyCodeUnits, hostileLeaf).map(([key, leaf]) => (base && typeof base === 'object' && !Array.isArray(base) ? { ...base, [key]: leaf } : leaf)) },
    { weight: 2, arbitrary: fc.jsonValue({ maxDepth: 4 }) },
  );
}

type Target = { params?: Record<string, string>; body: unknown; as: 'owner' | 'reviewer' | 'anonymous' };

/** The trace's allowance, kept beside its route until `RateLimits` holds it. */

let fx: NotebookFixture;
let server: Server;
const cookies: Record<'owner' | 'reviewer', string> = { owner: '', reviewer: '' };
let targets: Record<string, Target>;

beforeAll(async () => {
  fx = await createNotebookFixture({
    rateLimits: { signInPerIp: 1e9, signInFailuresPerEmailPerIp: 1e9, signInFailuresPerIp: 1e9, signUpPerIp: 1e9, resetPerIp: 1e9, resetPerEmail: 1e9, solvePerIp: 1e9, searchPerIp: 1e9, selectorsPerIp: 1e9, curveUploadsPerIp: 1e9, tracePerIp: 1e9 },
  });
  server = createServer(fx.ctx.app).listen(0, '127.0.0.1');
  for (const who of ['owner', 'reviewer'] as const) {
    const res = await fx[who].agent.post('/api/auth/sign-in').send({ email: fx[who].user.email, password: fx[who].password });
    cookies[who] = (res.headers['set-cookie'] as unknown as string[])[0]!.split(';')[0]!;
  }
  const made = await fx.owner.agent.post(`/api/teams/${fx.teamId}/designs`).send({ title: 'Fuzzed', params: exampleDesign, message: 'Start' }).expect(201);
  const id: string = made.body.design.id;
  const team = fx.teamId;
  const design = { id };
  // The reviewer's thread on v1: its remark is theirs to edit.
  const started = await fx.reviewer.agent
    .post(`/api/designs/${id}/versions/1/threads`)
    .send({ pin: { kind: 'version' }, body: 'Fuzz target' })
    .expect(201);
  const threadId: string = started.body.thread.id;
  const remarkId: string = started.body.thread.remarks[0].id;
  targets = {
    'POST /api/solve': { as: 'anonymous', body: { design: filteredDesign, at: [400, 500] } },
    // A one-candidate space, so a thousand bodies that pass stay quick.
    'POST /api/search': {
      as: 'anonymous',
      body: {
        range: exampleDesign.range,
        source: exampleDesign.source,
        detector: exampleDesign.detector,
        requirements: { maxBandpassNm: 1, minBlazeEfficiency: 0.2 },
        search: { grooveDensitiesPerMm: [600], blazeWavelengthsNm: [500], maxOrder: 1, deviationAnglesDeg: [20], focalLengthsMm: [300], top: 1 },
      },
    },
    // A prism of a user-entered Sellmeier formula with the optional slits: the kind with the most
    // arithmetic a poisoned number can reach (a pole at C, a negative n², a prism past total reflection).
    'POST /api/selectors': {
      as: 'anonymous',
      body: {
        kind: 'prism',
        material: { sellmeier: { B: [0.6961663, 0.4079426, 0.8974794], C: [0.0684043, 0.1162414, 9.896161] } },
        apexDeg: 60,
        baseMm: 50,
        wavelengthsNm: [250, 587.6, 2000],
        collimatorFocalMm: 300,
        cameraFocalMm: 300,
        entranceWidthUm: 50,
        exitWidthUm: 50,
      },
    },
    // Few rays and a curved entrance slit, so a thousand bodies that pass stay quick and reach the arc's code.
    'POST /api/trace': { as: 'anonymous', body: { design: filteredDesign, atNm: [450], rays: 200, curvedEntrance: true } },
    'POST /api/auth/sign-up': { as: 'anonymous', body: { email: 'fuzz@example.com', displayName: 'Fuzz', password: 'a long enough password' } },
    'POST /api/auth/sign-in': { as: 'anonymous', body: { email: fx.viewer.user.email, password: fx.viewer.password } },
    'POST /api/auth/password-reset': { as: 'anonymous', body: { email: fx.viewer.user.email } },
    'POST /api/auth/password-reset/confirm': { as: 'anonymous', body: { token: 'x'.repeat(40), password: 'a long enough password' } },
    'POST /api/auth/verify-email': { as: 'anonymous', body: { token: 'x'.repeat(40) } },
    'POST /api/teams': { as: 'owner', body: { name: 'Fuzz lab' } },
    'PATCH /api/teams/:teamId': { as: 'owner', params: { teamId: team }, body: { name: 'Spectroscopy lab' } },
    'PATCH /api/teams/:teamId/members/:userId': { as: 'owner', params: { teamId: team, userId: fx.viewer.user.id }, body: { role: 'viewer' } },
    'POST /api/teams/:teamId/invitations': { as: 'owner', params: { teamId: team }, body: { email: 'invitee@example.com', role: 'viewer' } },
    'POST /api/teams/:teamId/designs': { as: 'owner', params: { teamId: team }, body: { title: 'T', tags: ['uv'], params: exampleDesign, notes: 'n', message: 'm' } },
    'POST /api/teams/:teamId/designs/import': {
      as: 'owner',
      params: { teamId: team },
      body: {
        kind: 'blazebook-notebook',
        formatVersion: 1,
        title: 'Imported',
        tags: ['x'],
        baselineVersion: 1,
        versions: [{ number: 1, message: 'Start', notes: 'n', params: exampleDesign, createdAt: '2026-01-05T10:00:00Z' }],
      },
    },
    'PATCH /api/designs/:id': { as: 'owner', params: design, body: { title: 'Fuzzed', tags: ['a'], archived: false } },
    'POST /api/designs/:id/versions': { as: 'owner', params: design, body: { baseVersion: 1, params: filteredDesign, notes: 'n', message: 'm' } },
    'POST /api/designs/:id/clone': { as: 'owner', params: design, body: { version: 1, title: 'Clone' } },
    'PUT /api/designs/:id/baseline': { as: 'owner', params: design, body: { version: 1 } },
    'POST /api/designs/:id/share-links': { as: 'owner', params: design, body: { version: 1, expiresAt: '2027-01-01T00:00:00Z' } },
    'POST /api/designs/:id/versions/:n/threads': {
      as: 'reviewer',
      params: { ...design, n: '1' },
      body: { pin: { kind: 'result', result: 'bandpass', wavelengthNm: 500 }, body: 'Looks wide', mentions: [fx.owner.user.id] },
    },
    'POST /api/threads/:threadId/remarks': { as: 'owner', params: { threadId }, body: { body: 'Agreed', mentions: [] } },
    'PUT /api/threads/:threadId/status': { as: 'owner', params: { threadId }, body: { status: 'resolved' } },
    'PATCH /api/remarks/:remarkId': { as: 'reviewer', params: { remarkId }, body: { body: 'Edited', mentions: [fx.viewer.user.id] } },
    'POST /api/designs/:id/versions/:n/review-requests': {
      as: 'owner',
      params: { ...design, n: '1' },
      body: { reviewerIds: [fx.reviewer.user.id], dueDate: '2026-04-01', note: 'Please' },
    },
    'POST /api/designs/:id/versions/:n/decisions': { as: 'reviewer', params: { ...design, n: '1' }, body: { outcome: 'signed-off', summary: 'Fine' } },
    'POST /api/inbox/read': { as: 'owner', body: { all: true } },
    'PUT /api/account/mail-settings': {
      as: 'owner',
      body: { reviewRequests: true, mentions: false, threadsOnMyDesigns: true, decisionsOnMyVersions: true },
    },
    // Multipart routes: JSON in any shape is refused before it is read. Poisoned forms and files
    // are thrown at them in curves-hostile.property.test.ts.
    'POST /api/curves/preview': { as: 'owner', body: { kind: 'grating-efficiency', file: '500,0.5\n600,0.6\n' } },
    'POST /api/teams/:teamId/curves': { as: 'owner', params: { teamId: team }, body: { kind: 'grating-efficiency', name: 'Fuzz', file: '500,0.5\n600,0.6\n' } },
  };
}, 120_000);

afterAll(async () => {
  await new Promise((resolve) => server?.close(resolve));
  await fx?.ctx.close();
});

describe('random and poisoned JSON bodies', () => {
  // Routes whose contract reads no body are fuzzed through their paths in hostile-input.test.ts.
  it('covers every route whose contract reads a body', () => {
    const writes = listRoutes((entry) => entry.parts.body !== undefined);
    expect(writes.sort()).toEqual(Object.keys(targets).sort());
  });
});

describe.each([
  'POST /api/solve',
  'POST /api/search',
  'POST /api/selectors',
  'POST /api/trace',
  'POST /api/auth/sign-up',
  'POST /api/auth/sign-in',
  'POST /api/auth/password-reset',
  'POST /api/auth/password-reset/confirm',
  'POST /api/auth/verify-email',
  'POST /api/teams',
  'PATCH /api/teams/:teamId',
  'PATCH /api/teams/:teamId/members/:userId',
  'POST /api/teams/:teamId/invitations',
  'POST /api/teams/:teamId/designs',
  'POST /api/teams/:teamId/designs/import',
  'PATCH /api/designs/:id',
  'POST /api/designs/:id/versions',
  'POST /api/designs/:id/clone',
  'PUT /api/designs/:id/baseline',
  'POST /api/designs/:id/share-links',
  'POST /api/designs/:id/versions/:n/threads',
  'POST /api/threads/:threadId/remarks',
  'PUT /api/threads/:threadId/status',
  'PATCH /api/remarks/:remarkId',
  'POST /api/designs/:id/versions/:n/review-requests',
  'POST /api/designs/:id/versions/:n/decisions',
  'POST /api/inbox/read',
  'PUT /api/account/mail-settings',
  'POST /api/curves/preview',
  'POST /api/teams/:teamId/curves',
])('%s', (route) => {
  it(`answers ${runsPerRoute} hostile bodies without a 500, refusals in the error shape`, async () => {
    const target = targets[route]!;
    const [method, pattern] = route.split(' ') as [string, string];
    const url = pattern.replace(/:([a-zA-Z]+)/g, (_m, name: string) => encodeURIComponent(target.params?.[name] ?? 'x'));
    await fc.assert(
      fc.asyncProperty(bodies(target.body), async (body) => {
        let req = request(server)[method.toLowerCase() as 'post'](url).set('origin', testOrigin).set('content-type', 'application/json');
        if (target.as !== 'anonymous') req = req.set('cookie', cookies[target.as]);
        const res = await req.send(JSON.stringify(body) ?? 'null');
        expect(res.status, `${res.status} ${res.text.slice(0, 300)}`).toBeLessThan(500);
        if (res.status >= 400) expect(errorBodySchema.safeParse(res.body).success, res.text.slice(0, 300)).toBe(true);
      }),
      { numRuns: runsPerRoute },
    );
    expect(fx.ctx.errors).toEqual([]);
  }, 180_000);
});
