import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { exampleDesign } from '../../../shared/design';
import {
  designListResponseSchema,
  notebookFileSchema,
  notebookResponseSchema,
  notebookWithVersionResponseSchema,
  type NotebookFileInput,
} from '../../../shared/notebooks';
import { createNotebook, createNotebookFixture, type NotebookFixture } from './fixture';

let fx: NotebookFixture;
beforeAll(async () => {
  fx = await createNotebookFixture();
}, 60_000);
afterAll(() => fx?.ctx.close());

const file = (title: string): NotebookFileInput => ({
  kind: 'blazebook-notebook',
  formatVersion: 1,
  title,
  versions: [{ number: 1, message: 'Start', params: exampleDesign, createdAt: '2025-11-02T10:00:00Z' }],
});

async function importInto(teamId: string, body: object) {
  const res = await fx.owner.agent.post(`/api/teams/${teamId}/designs/import`).send(body).expect(201);
  return notebookWithVersionResponseSchema.parse(res.body);
}

describe('where a design came from', () => {
  it('an imported design records the moment of the import, kept by the server and read back', async () => {
    fx.ctx.clock.advance(36 * 3_600_000);
    const importedAt = fx.ctx.clock.now().toISOString();
    const { design } = await importInto(fx.teamId, file('Lab scanner'));
    expect(design.importedAt).toBe(importedAt);
    // The file's own version dates stay as they were; only the design is marked.
    fx.ctx.clock.advance(60_000);
    const read = notebookResponseSchema.parse((await fx.viewer.agent.get(`/api/designs/${design.id}`).expect(200)).body);
    expect(read.design.importedAt).toBe(importedAt);
    expect(read.version.createdAt).toBe('2025-11-02T10:00:00.000Z');
  });

  it('keeps the file’s title and marks only the import, so the list tells the two rows apart', async () => {
    const { design: original } = await createNotebook(fx, 'Twin scanner');
    const exported = (await fx.owner.agent.get(`/api/designs/${original.id}/export`).expect(200)).body;
    const { design: copy } = await importInto(fx.teamId, exported);
    const list = designListResponseSchema.parse(
      (await fx.viewer.agent.get(`/api/teams/${fx.teamId}/designs`).query({ q: 'Twin scanner' }).expect(200)).body,
    );
    const rows = list.designs.map((d) => [d.id, d.title, d.importedAt]);
    expect(rows).toHaveLength(2);
    expect(rows).toContainEqual([original.id, 'Twin scanner', null]);
    expect(rows).toContainEqual([copy.id, 'Twin scanner', fx.ctx.clock.now().toISOString()]);
  });

  it('designs made here and clones are not marked, not even a clone of an imported design', async () => {
    const { design: made } = await createNotebook(fx, 'Made here');
    const read = notebookResponseSchema.parse((await fx.owner.agent.get(`/api/designs/${made.id}`).expect(200)).body);
    expect(read.design.importedAt).toBeNull();
    const { design: imported } = await importInto(fx.teamId, file('To be cloned'));
    const clone = await fx.owner.agent
      .post(`/api/designs/${imported.id}/clone`)
      .send({ teamId: fx.teamId })
      .expect(201);
    expect(notebookWithVersionResponseSchema.parse(clone.body).design.importedAt).toBeNull();
  });

  it('the exported file stays in the same format: no origin field, and it imports again', async () => {
    const { design } = await importInto(fx.teamId, file('Exported again'));
    const res = await fx.owner.agent.get(`/api/designs/${design.id}/export`).expect(200);
    expect(Object.keys(res.body)).not.toContain('importedAt');
    // Strict: a file that carried an unknown field would fail here.
    const again = notebookFileSchema.parse(res.body);
    const reimported = await importInto(fx.teamId, again);
    expect(reimported.design.importedAt).not.toBeNull();
  });

  it('a file cannot set its own origin: importedAt in a file is refused by name', async () => {
    const res = await fx.owner.agent
      .post(`/api/teams/${fx.teamId}/designs/import`)
      .send({ ...file('Sneaky'), importedAt: '2020-01-01T00:00:00Z' })
      .expect(400);
    expect(res.body.error.fields).toEqual({ '(body)': "has an unknown field 'importedAt' (check the spelling)" });
  });

  it('the OpenAPI document describes importedAt on a design', async () => {
    const doc = (await request(fx.ctx.app).get('/api/openapi.json').expect(200)).body;
    const answer = JSON.stringify(doc.paths['/designs/{id}'].get.responses['200']);
    const refs = [...answer.matchAll(/"#\/components\/schemas\/([^"]+)"/g)].map((m) => m[1]!);
    const described = [answer, ...refs.map((name) => JSON.stringify(doc.components?.schemas?.[name]))].join('\n');
    expect(described).toMatch(/"importedAt":\{[^}]*"format":"date-time"/);
  });
});
