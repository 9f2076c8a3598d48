import { count } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { designVersions, designs } from '../../../db/schema';
import { exampleDesign } from '../../../shared/design';
import {
  notebookFileSchema,
  notebookWithVersionResponseSchema,
  versionListResponseSchema,
  type NotebookFileInput,
} from '../../../shared/notebooks';
import {
  createNotebook,
  createNotebookFixture,
  designWith,
  saveVersion,
  type NotebookFixture,
} from './fixture';

let fx: NotebookFixture;
beforeAll(async () => {
  fx = await createNotebookFixture();
}, 60_000);
afterAll(() => fx?.ctx.close());

async function rowCounts() {
  const [d] = await fx.ctx.database.db.select({ n: count() }).from(designs);
  const [v] = await fx.ctx.database.db.select({ n: count() }).from(designVersions);
  return { designs: d?.n, versions: v?.n };
}

const goodFile = (): NotebookFileInput => ({
  kind: 'blazebook-notebook',
  formatVersion: 1,
  title: 'Imported monochromator',
  tags: ['imported'],
  baselineVersion: 2,
  clonedFrom: { title: 'Somebody’s scanner', version: 4 },
  versions: [
    {
      number: 1,
      message: 'Start',
      notes: 'From the lab book.',
      params: exampleDesign,
      parentNumber: null,
      createdAt: '2025-11-02T10:00:00Z',
      authorName: 'Elsewhere',
    },
    {
      number: 2,
      message: 'Finer grating',
      notes: '',
      params: designWith({ grating: { grooveDensityPerMm: 1800 } }),
      parentNumber: 1,
      createdAt: '2025-11-03T10:00:00Z',
      authorName: null,
    },
  ],
});

describe('export', () => {
  it('writes our file format with every version and its notes, as an attachment', async () => {
    const { design } = await createNotebook(fx, 'Export me');
    await saveVersion(fx, design.id, 1, designWith({ slits: { exitWidthUm: 60 } }), 'Narrower').expect(201);
    await fx.owner.agent.put(`/api/designs/${design.id}/baseline`).send({ version: 1 }).expect(200);
    const res = await fx.viewer.agent.get(`/api/designs/${design.id}/export`).expect(200);
    expect(res.headers['content-disposition']).toBe('attachment; filename=export-me.blazebook.json');
    const file = notebookFileSchema.parse(res.body);
    expect(file).toMatchObject({
      kind: 'blazebook-notebook',
      formatVersion: 3,
      title: 'Export me',
      baselineVersion: 1,
      clonedFrom: null,
    });
    expect(file.versions.map((v) => [v.number, v.parentNumber, v.message, v.authorName])).toEqual([
      [1, null, 'First cut', fx.owner.user.displayName],
      [2, 1, 'Narrower', fx.owner.user.displayName],
    ]);
    expect(file.versions[0]?.notes).toBe('# Why\nStarting point.');
    expect(file.versions[1]?.params.slits.exitWidthUm).toBe(60);
  });

  it('round-trips: an exported file imports into another team as the same notebook', async () => {
    const { design } = await createNotebook(fx, 'Round trip');
    await saveVersion(fx, design.id, 1, designWith({ range: { startNm: 400 } }), 'Start at 400 nm').expect(
      201,
    );
    const file = (await fx.owner.agent.get(`/api/designs/${design.id}/export`).expect(200)).body;
    const personal = (
      (await fx.owner.agent.get('/api/teams').expect(200)).body.teams as { id: string; personal: boolean }[]
    ).find((t) => t.personal)!;
    const res = await fx.owner.agent.post(`/api/teams/${personal.id}/designs/import`).send(file).expect(201);
    const imported = notebookWithVersionResponseSchema.parse(res.body);
    expect(imported.design).toMatchObject({ teamId: personal.id, title: 'Round trip', latestVersion: 2 });
    const original = versionListResponseSchema.parse(
      (await fx.owner.agent.get(`/api/designs/${design.id}/versions`).expect(200)).body,
    );
    const copy = versionListResponseSchema.parse(
      (await fx.owner.agent.get(`/api/designs/${imported.design.id}/versions`).expect(200)).body,
    );
    const strip = (v: (typeof copy.versions)[number]) => ({
      number: v.number,
      message: v.message,
      parentNumber: v.parentNumber,
      createdAt: v.createdAt,
      summary: v.summary,
    });
    expect(copy.versions.map(strip)).toEqual(original.versions.map(strip));
  });
});

describe('import', () => {
  it('imports a good file whole: versions, notes, dates, baseline and provenance, with summaries computed here', async () => {
    const res = await fx.owner.agent
      .post(`/api/teams/${fx.teamId}/designs/import`)
      .send(goodFile())
      .expect(201);
    const { design, version } = notebookWithVersionResponseSchema.parse(res.body);
    expect(design).toMatchObject({
      title: 'Imported monochromator',
      tags: ['imported'],
      latestVersion: 2,
      baselineVersion: 2,
      clonedFrom: { designId: null, title: 'Somebody’s scanner', version: 4 },
    });
    expect(version).toMatchObject({
      number: 2,
      parentNumber: 1,
      message: 'Finer grating',
      createdAt: '2025-11-03T10:00:00.000Z',
    });
    // The importer is recorded as the author: names in a file are not accounts here.
    expect(version.author?.id).toBe(fx.owner.user.id);
    expect(version.summary.centreWavelengthNm).toBe(600);
    const first = await fx.owner.agent.get(`/api/designs/${design.id}/versions/1`).expect(200);
    expect(first.body.version.notes).toBe('From the lab book.');
  });

  it('refuses a broken file, names every problem by its path, and writes nothing', async () => {
    const before = await rowCounts();
    const file = goodFile() as Record<string, unknown> & { versions: Record<string, unknown>[] };
    file.formatVersion = 4;
    file.title = '';
    file.baselineVersion = 9;
    file.surprise = true;
    file.versions[0]!.params = designWith({ grating: { order: 0 }, slits: { exitWidthUm: -5 } });
    file.versions[1]!.number = 3;
    file.versions[1]!.message = 'two\nlines';
    delete file.versions[1]!.createdAt;
    const res = await fx.owner.agent.post(`/api/teams/${fx.teamId}/designs/import`).send(file).expect(400);
    expect(res.body.error.fields).toEqual({
      '(body)': "has an unknown field 'surprise' (check the spelling)",
      formatVersion: 'must be 1, 2 or 3 (the formats this version reads)',
      title: 'is required',
      'versions.0.params.grating.order': 'must be a whole number other than 0',
      'versions.0.params.slits.exitWidthUm': 'must be greater than 0',
      'versions.1.message': 'must be one line',
      'versions.1.createdAt': 'must be a date and time such as 2026-03-14T09:00:00Z',
      'versions.1.number': 'must be 2 (versions run 1, 2, … in order)',
      baselineVersion: 'must be one of the versions in the file',
    });
    expect(await rowCounts()).toEqual(before);
  });

  it('is for the team’s owners', async () => {
    const before = await rowCounts();
    await fx.reviewer.agent.post(`/api/teams/${fx.teamId}/designs/import`).send(goodFile()).expect(403);
    await fx.outsider.agent.post(`/api/teams/${fx.teamId}/designs/import`).send(goodFile()).expect(404);
    expect(await rowCounts()).toEqual(before);
  });
});
