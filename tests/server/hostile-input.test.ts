import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { exampleDesign } from '../../shared/design';
import { errorBodySchema } from '../../shared/api-error';
import { listRoutes } from '../support/routes';
import { browserAgent, createTestApp, testOrigin, type TestApp } from '../support/test-app';
import { createNotebookFixture, type NotebookFixture } from './notebooks/fixture';

/**
 * Input an attacker (or a broken script) sends: every case answers 4xx with the one error shape,
 * never 500, and nothing is stored or changed by a refused request.
 */

const NUL = '\u0000';
/** Two high surrogates with no low one after them: not text PostgreSQL can store. */
const LONE_SURROGATES = 'Scanner \uD800\uD800';
const INT4_MAX = 2_147_483_647;

function expectErrorShape(res: request.Response, status?: number) {
  if (status !== undefined) expect(res.status, JSON.stringify(res.body)).toBe(status);
  expect(res.status).toBeGreaterThanOrEqual(400);
  expect(res.status).toBeLessThan(500);
  expect(errorBodySchema.safeParse(res.body).success, JSON.stringify(res.body)).toBe(true);
  return res.body.error as { code: string; message: string; fields?: Record<string, string> };
}

let fx: NotebookFixture;
let designId: string;
let reviewedDesignId: string;

beforeAll(async () => {
  fx = await createNotebookFixture();
  const made = await fx.owner.agent
    .post(`/api/teams/${fx.teamId}/designs`)
    .send({ title: 'Target scanner', params: exampleDesign, notes: 'Original notes', message: 'First cut' })
    .expect(201);
  designId = made.body.design.id;
  reviewedDesignId = designId;
}, 60_000);
afterAll(() => fx?.ctx.close());

/** What a refused write must leave exactly as it was. */
async function snapshot() {
  const list = await fx.owner.agent
    .get(`/api/teams/${fx.teamId}/designs?archived=include&pageSize=100`)
    .expect(200);
  const versions = await fx.owner.agent.get(`/api/designs/${designId}/versions`).expect(200);
  const teams = await fx.owner.agent.get('/api/teams').expect(200);
  const reviews = await fx.owner.agent.get(`/api/designs/${reviewedDesignId}/versions/1/review`).expect(200);
  return JSON.stringify([list.body, versions.body, teams.body, reviews.body]);
}

describe('a compressed body that is not what it says it is', () => {
  const encodings = ['gzip', 'deflate', 'br'] as const;

  it.each(encodings)(
    'is refused with 4xx on every state-changing route (Content-Encoding: %s)',
    async (encoding) => {
      const routes = listRoutes((entry) => entry.method !== 'GET');
      expect(routes.length).toBeGreaterThan(15);
      for (const route of routes) {
        const [method, pattern] = route.split(' ') as [string, string];
        const url = pattern.replace(/:[a-zA-Z]+/g, 'x1');
        const res = await fx.owner.agent[method.toLowerCase() as 'post'](url)
          .set('content-type', 'application/json')
          .set('content-encoding', encoding)
          .send(Buffer.from('{"title": "this is plain JSON, not compressed"}'));
        expectErrorShape(res);
      }
    },
  );

  it('names the problem', async () => {
    const res = await fx.owner.agent
      .post('/api/teams')
      .set('content-type', 'application/json')
      .set('content-encoding', 'gzip')
      .send(Buffer.from('not gzip at all'));
    const error = expectErrorShape(res, 400);
    expect(error.message).toMatch(/compress|gzip|encoding/i);
  });
});

describe('NUL characters and lone surrogates in stored text', () => {
  type Case = { what: string; send: () => request.Test; field: string };
  const bad = (value: string): Case[] => [
    {
      what: 'a design title',
      field: 'title',
      send: () =>
        fx.owner.agent.post(`/api/teams/${fx.teamId}/designs`).send({ title: value, params: exampleDesign }),
    },
    {
      what: 'a tag',
      field: 'tags.1',
      send: () =>
        fx.owner.agent
          .post(`/api/teams/${fx.teamId}/designs`)
          .send({ title: 'Tagged', tags: ['ok', value], params: exampleDesign }),
    },
    {
      what: 'a renamed title',
      field: 'title',
      send: () => fx.owner.agent.patch(`/api/designs/${designId}`).send({ title: value }),
    },
    {
      what: 'version notes',
      field: 'notes',
      send: () =>
        fx.owner.agent
          .post(`/api/designs/${designId}/versions`)
          .send({ baseVersion: 1, params: exampleDesign, notes: value, message: 'Change' }),
    },
    {
      what: 'a version message',
      field: 'message',
      send: () =>
        fx.owner.agent
          .post(`/api/designs/${designId}/versions`)
          .send({ baseVersion: 1, params: exampleDesign, message: value }),
    },
    {
      what: 'a team name',
      field: 'name',
      send: () => fx.owner.agent.post('/api/teams').send({ name: value }),
    },
    {
      what: 'a team rename',
      field: 'name',
      send: () => fx.owner.agent.patch(`/api/teams/${fx.teamId}`).send({ name: value }),
    },
    {
      what: 'a remark starting a thread',
      field: 'body',
      send: () =>
        fx.reviewer.agent
          .post(`/api/designs/${reviewedDesignId}/versions/1/threads`)
          .send({ pin: { kind: 'version' }, body: value }),
    },
    {
      what: 'a decision summary',
      field: 'summary',
      send: () =>
        fx.reviewer.agent
          .post(`/api/designs/${reviewedDesignId}/versions/1/decisions`)
          .send({ outcome: 'revise', summary: value }),
    },
    {
      what: 'a review request note',
      field: 'note',
      send: () =>
        fx.owner.agent
          .post(`/api/designs/${reviewedDesignId}/versions/1/review-requests`)
          .send({ reviewerIds: [fx.reviewer.user.id], note: value }),
    },
    {
      what: 'a clone title',
      field: 'title',
      send: () => fx.owner.agent.post(`/api/designs/${designId}/clone`).send({ title: value }),
    },
    {
      what: 'a display name at sign-up',
      field: 'displayName',
      send: () =>
        browserAgent(fx.ctx.app)
          .post('/api/auth/sign-up')
          .send({ email: 'nul-name@example.com', displayName: value, password: 'a long enough password' }),
    },
    {
      what: 'notes inside an imported notebook',
      field: 'versions.0.notes',
      send: () =>
        fx.owner.agent.post(`/api/teams/${fx.teamId}/designs/import`).send({
          kind: 'blazebook-notebook',
          formatVersion: 1,
          title: 'Imported',
          versions: [
            {
              number: 1,
              message: 'Start',
              notes: value,
              params: exampleDesign,
              createdAt: '2026-01-05T10:00:00Z',
            },
          ],
        }),
    },
  ];

  it.each(bad(`Scanner${NUL}`))(
    'refuses a NUL character in $what with 400 naming $field, and stores nothing',
    async ({ send, field }) => {
      const before = await snapshot();
      const error = expectErrorShape(await send(), 400);
      expect(error.fields?.[field]).toMatch(/NUL/);
      expect(await snapshot()).toBe(before);
    },
  );

  it.each(bad(LONE_SURROGATES))(
    'refuses lone surrogates in $what with 400 naming $field, and stores nothing',
    async ({ send, field }) => {
      const before = await snapshot();
      const error = expectErrorShape(await send(), 400);
      expect(error.fields?.[field]).toMatch(/surrogate/);
      expect(await snapshot()).toBe(before);
    },
  );

  it('keeps unusual but valid text exactly as sent: the save, a read and the export agree', async () => {
    const notes = 'Résumé 👩🏽‍🔬 e\u0301 \u202Eright-to-left\u202C 𝛌 = 546.074 nm\tend';
    const title = 'Spektrometer “Ω” 𝄞';
    const made = await fx.owner.agent
      .post(`/api/teams/${fx.teamId}/designs`)
      .send({ title, params: exampleDesign, notes, message: 'First' })
      .expect(201);
    expect(made.body.design.title).toBe(title);
    expect(made.body.version.notes).toBe(notes);
    const id: string = made.body.design.id;
    const read = await fx.owner.agent.get(`/api/designs/${id}/versions/1`).expect(200);
    expect(read.body.version.notes).toBe(notes);
    const exported = await fx.owner.agent.get(`/api/designs/${id}/export`).expect(200);
    const file = JSON.parse(exported.text) as { title: string; versions: { notes: string }[] };
    expect(file.title).toBe(title);
    expect(file.versions[0]?.notes).toBe(notes);
  });
});

describe('NUL characters in paths, query strings and cookies', () => {
  it.each([
    ['/api/designs/a%00b', 'id'],
    [`/api/teams/%00/designs`, 'teamId'],
    ['/api/teams/x%00', 'teamId'],
    ['/api/designs/a%00b/versions/1', 'id'],
    ['/api/designs/a%00b/review-states', 'id'],
    ['/api/threads/a%00b', 'threadId'],
    [`/api/share/${'a'.repeat(30)}%00`, 'token'],
    [`/api/invitations/${'a'.repeat(30)}%00`, 'token'],
  ])('GET %s answers 400 naming %s', async (url, field) => {
    const error = expectErrorShape(await fx.owner.agent.get(url), 400);
    expect(error.fields?.[field]).toMatch(/NUL/);
  });

  it('refuses a NUL in a member id on a delete, and removes nobody', async () => {
    const before = await fx.owner.agent.get(`/api/teams/${fx.teamId}/members`).expect(200);
    expectErrorShape(
      await fx.owner.agent.delete(`/api/teams/${fx.teamId}/members/${fx.viewer.user.id}%00`),
      400,
    );
    const after = await fx.owner.agent.get(`/api/teams/${fx.teamId}/members`).expect(200);
    expect(after.body).toEqual(before.body);
  });

  it.each(['q', 'tag'])('refuses a NUL in the list query value %s with 400 naming it', async (name) => {
    const error = expectErrorShape(
      await fx.owner.agent.get(`/api/teams/${fx.teamId}/designs?${name}=uv%00`),
      400,
    );
    expect(error.fields?.[name]).toMatch(/NUL/);
  });

  it.each([
    { label: '%00', value: '%00' },
    { label: 'abc%00def', value: 'abc%00def' },
    { label: 'bad percent-encoding', value: '%ff%fe' },
    { label: 'a lone %', value: '%' },
    { label: '5,000 letters', value: 'a'.repeat(5000) },
    { label: 'quotes', value: '"quoted"' },
  ])('treats a session cookie of $label as no session on every kind of route', async ({ value }) => {
    const cookie = `blazebook_session=${value}`;
    const session = await request(fx.ctx.app).get('/api/auth/session').set('cookie', cookie).expect(200);
    expect(session.body.user).toBeNull();
    expectErrorShape(await request(fx.ctx.app).get('/api/teams').set('cookie', cookie), 401);
    expectErrorShape(
      await request(fx.ctx.app)
        .post('/api/teams')
        .set('cookie', cookie)
        .set('origin', testOrigin)
        .send({ name: 'X' }),
      401,
    );
    await request(fx.ctx.app).get('/api/health').set('cookie', cookie).expect(200);
  });
});

describe('numbers beyond what a version column holds', () => {
  const tooBig = String(INT4_MAX + 1);

  it.each([
    [`versions/${tooBig}`, 'n'],
    [`versions/${tooBig}/review`, 'n'],
    [`versions/99999999999999999999999`, 'n'],
    [`compare?a=${tooBig}`, 'a'],
    [`compare?b=${tooBig}`, 'b'],
  ])('GET …/%s answers 400 naming %s', async (tail, field) => {
    const error = expectErrorShape(await fx.owner.agent.get(`/api/designs/${designId}/${tail}`), 400);
    expect(error.fields?.[field]).toMatch(/2147483647/);
  });

  it('still answers 404 for a version that could exist but does not', async () => {
    expectErrorShape(await fx.owner.agent.get(`/api/designs/${designId}/versions/${INT4_MAX}`), 404);
  });

  it('refuses a page number that would overflow the offset', async () => {
    const error = expectErrorShape(
      await fx.owner.agent.get(`/api/teams/${fx.teamId}/designs?page=1e20`),
      400,
    );
    expect(error.fields?.page).toMatch(/1000000/);
  });

  it.each([
    {
      what: 'baseVersion of a save',
      field: 'baseVersion',
      send: () =>
        fx.owner.agent
          .post(`/api/designs/${designId}/versions`)
          .send({ baseVersion: INT4_MAX + 1, params: exampleDesign, message: 'x' }),
    },
    {
      what: 'version of a clone',
      field: 'version',
      send: () => fx.owner.agent.post(`/api/designs/${designId}/clone`).send({ version: 2 ** 53 }),
    },
    {
      what: 'version of a baseline',
      field: 'version',
      send: () => fx.owner.agent.put(`/api/designs/${designId}/baseline`).send({ version: INT4_MAX + 1 }),
    },
    {
      what: 'version of a share link',
      field: 'version',
      send: () => fx.owner.agent.post(`/api/designs/${designId}/share-links`).send({ version: 1e300 }),
    },
  ])('refuses the $what above 2,147,483,647 with 400 naming $field', async ({ send, field }) => {
    const before = await snapshot();
    const error = expectErrorShape(await send(), 400);
    expect(error.fields?.[field]).toMatch(/2147483647/);
    expect(await snapshot()).toBe(before);
  });
});

describe('malformed percent-encoding in paths', () => {
  let web: TestApp;
  beforeAll(async () => {
    const webRoot = mkdtempSync(path.join(tmpdir(), 'blazebook-web-'));
    writeFileSync(path.join(webRoot, 'index.html'), '<!doctype html><title>Blazebook</title>');
    web = await createTestApp({ webRoot, database: fx.ctx.database });
  });
  afterAll(() => web?.close());

  it.each([
    '/api/designs/%ff',
    '/api/teams/%E0%A4%A/designs',
    '/api/designs/%',
    '/%ff.js',
    '/notebooks/%ff',
    '/_expo/%c0%af.js',
  ])('GET %s answers 400 with the error shape', async (url) => {
    const res = await request(web.app).get(url);
    const error = expectErrorShape(res, 400);
    expect(error.message).toMatch(/percent|encod/i);
    expect(web.errors).toEqual([]);
  });
});
