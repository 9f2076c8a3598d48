import { Validator } from '@seriousme/openapi-schema-validator';
import Ajv2020 from 'ajv/dist/2020.js';
import addFormats from 'ajv-formats';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { apiRoutes } from '../../shared/contract/index';
import { exampleDesign } from '../../shared/design';
import { createTestApp, type TestApp } from '../support/test-app';

type Operation = {
  operationId?: string;
  parameters?: { name: string; in: string; required?: boolean }[];
  requestBody?: { content: Record<string, { schema: unknown }> };
  responses: Record<string, { content?: Record<string, { schema: unknown }> }>;
  security?: unknown[];
};
type Document = { openapi: string; servers: { url: string }[]; paths: Record<string, Record<string, Operation>>; components: { schemas?: Record<string, unknown> } };

let ctx: TestApp;
let document: Document;

beforeAll(async () => {
  ctx = await createTestApp();
  const res = await request(ctx.app).get('/api/openapi.json').expect(200).expect('content-type', /application\/json/);
  document = res.body as Document;
}, 60_000);
afterAll(() => ctx?.close());

/** A documented schema compiled with Ajv's JSON Schema 2020-12 dialect, OpenAPI 3.1's default. */
function compile(schema: unknown) {
  const ajv = new Ajv2020({ strict: false, allErrors: true });
  addFormats(ajv);
  ajv.addSchema({ $id: 'doc', components: document.components });
  return ajv.compile(JSON.parse(JSON.stringify(schema).replaceAll('"#/components/', '"doc#/components/')) as object);
}

describe('GET /api/openapi.json', () => {
  it('is a valid OpenAPI 3.1 document (checked against the OpenAPI Initiative schema)', async () => {
    expect(document.openapi).toMatch(/^3\.1\./);
    const result = await new Validator().validate(structuredClone(document) as unknown as Parameters<Validator['validate']>[0]);
    expect(result.errors ?? []).toEqual([]);
    expect(result.valid).toBe(true);
  });

  it('lists every route of the contract under /api, named by its contract name, and no other', () => {
    expect(document.servers).toEqual([{ url: '/api' }]);
    const documented = Object.entries(document.paths).flatMap(([path, item]) =>
      Object.entries(item).map(([method, op]) => `${method.toUpperCase()} ${path} ${op.operationId}`),
    );
    expect(documented.sort()).toEqual(apiRoutes.map((entry) => `${entry.method} ${entry.path} ${entry.name}`).sort());
  });

  it('states each route’s path parameters, success status, error shape and session need', () => {
    for (const entry of apiRoutes) {
      const op = document.paths[entry.path]?.[entry.method.toLowerCase()];
      expect(op, entry.name).toBeDefined();
      const pathParams = [...entry.path.matchAll(/\{(\w+)\}/g)].map((m) => m[1]);
      expect(op!.parameters?.filter((p) => p.in === 'path').map((p) => p.name) ?? [], entry.name).toEqual(pathParams);
      expect(Object.keys(op!.responses), entry.name).toEqual(expect.arrayContaining([String(entry.status), '4XX']));
      expect(op!.requestBody !== undefined, entry.name).toBe(entry.parts.body !== undefined);
      const needsSession = entry.meta.access.kind === 'signed-in' || entry.meta.access.kind === 'team';
      expect(op!.security !== undefined, entry.name).toBe(needsSession);
    }
  });

  it('describes a file answer by its media type: the design sheets answer application/pdf', () => {
    const files = apiRoutes.filter((entry) => entry.meta.file);
    expect(files.map((entry) => entry.name).sort()).toEqual(expect.arrayContaining(['sheets.compare', 'sheets.shared', 'sheets.version']));
    for (const entry of files) {
      const ok = document.paths[entry.path]?.[entry.method.toLowerCase()]?.responses[String(entry.status)];
      expect(Object.keys(ok?.content ?? {}), entry.name).toEqual([entry.meta.file!.mediaType]);
    }
    expect(Object.keys(document.paths['/designs/{id}/versions/{n}/sheet.pdf']!.get!.responses['200']!.content!)).toEqual(['application/pdf']);
  });

  it('describes the curve uploads as multipart/form-data with a binary file part, and nothing else', () => {
    const uploads = apiRoutes.filter((entry) => entry.meta.upload);
    expect(uploads.map((entry) => entry.name).sort()).toEqual(['curves.preview', 'curves.upload']);
    for (const entry of uploads) {
      const content = document.paths[entry.path]![entry.method.toLowerCase()]!.requestBody!.content;
      expect(Object.keys(content), entry.name).toEqual(['multipart/form-data']);
      const schema = content['multipart/form-data']!.schema as { properties: Record<string, { type?: string; format?: string }>; required: string[] };
      expect(schema.properties.file).toMatchObject({ type: 'string', format: 'binary' });
      expect(schema.required).toEqual(expect.arrayContaining(['file', 'kind']));
    }
    // A recognised re-upload answers 200 with the stored curve, beside the 201 of a new one.
    expect(Object.keys(document.paths['/teams/{teamId}/curves']!.post!.responses)).toEqual(expect.arrayContaining(['200', '201']));
  });

  it('describes the solver’s real answer: a POST /api/solve answer validates against the documented schema', async () => {
    const schema = document.paths['/solve']!.post!.responses['200']!.content!['application/json']!.schema;
    const validate = compile(schema);
    const answer = await request(ctx.app).post('/api/solve').send({ design: exampleDesign, at: [300, 500, 900, 5000] }).expect(200);
    expect(validate(answer.body) ? [] : validate.errors).toEqual([]);
    // …and refuses what the solver never answers, so the check above is not vacuous.
    expect(validate({ ...answer.body, points: [{ wavelengthNm: 'five hundred' }] })).toBe(false);
  });

  it('describes the error shape the server really sends', async () => {
    const schema = document.paths['/solve']!.post!.responses['4XX']!.content!['application/json']!.schema;
    const validate = compile(schema);
    const refused = await request(ctx.app).post('/api/solve').send({ design: { grating: {} } }).expect(400);
    expect(validate(refused.body) ? [] : validate.errors).toEqual([]);
    expect(validate({ error: { code: 1 } })).toBe(false);
  });

  it('documents the request body as the server checks it: a body the server refuses fails the documented schema too', () => {
    const validate = compile(document.paths['/teams']!.post!.requestBody!.content['application/json']!.schema);
    expect(validate({ name: 'Spectroscopy teaching lab' })).toBe(true);
    expect(validate({})).toBe(false);
  });
});
