import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { designSchema, exampleDesign, storedDesignSchema } from '../../../shared/design';
import { errorBodySchema } from '../../../shared/api-error';
import { notebookResponseSchema, notebookWithVersionResponseSchema, type NotebookFileInput } from '../../../shared/notebooks';
import { createNotebookFixture, designWith, type NotebookFixture } from './fixture';

/**
 * Physical limits (a blaze at 2d or beyond, fewer than two grooves, faster than f/0.5) came after
 * designs were saved. What was saved before must still open, compare, export and import again:
 * nothing saved is lost. Only a new save, create or solve is refused, naming the field.
 */
let fx: NotebookFixture;
beforeAll(async () => {
  fx = await createNotebookFixture();
}, 60_000);
afterAll(() => fx?.ctx.close());

// 1200 grooves/mm: 2d = 1666.7 nm, so a 5000 nm blaze is out of reach (Palmer & Loewen, ch. 9).
const beyondReach = designWith({ grating: { grooveDensityPerMm: 1200, blazeWavelengthNm: 5000 } });

const oldFile: NotebookFileInput = {
  kind: 'blazebook-notebook',
  formatVersion: 1,
  title: 'Saved before the limits',
  versions: [
    { number: 1, message: 'Start', params: exampleDesign, createdAt: '2025-06-02T10:00:00Z' },
    { number: 2, message: 'Far-IR blaze', params: beyondReach, createdAt: '2025-06-03T10:00:00Z', parentNumber: 1 },
  ],
};

describe('a design saved before a physical limit existed', () => {
  it('is refused as new input but read back as stored', () => {
    expect(designSchema.safeParse(beyondReach).success).toBe(false);
    expect(storedDesignSchema.safeParse(beyondReach).success).toBe(true);
  });

  it('opens, compares, exports and imports again unchanged, and a save on top of it names the field', async () => {
    const imported = await fx.owner.agent.post(`/api/teams/${fx.teamId}/designs/import`).send(oldFile).expect(201);
    const { design } = notebookWithVersionResponseSchema.parse(imported.body);

    const read = notebookResponseSchema.parse((await fx.viewer.agent.get(`/api/designs/${design.id}`).expect(200)).body);
    expect(read.version.number).toBe(2);
    expect(read.version.params.grating.blazeWavelengthNm).toBe(5000);

    const compared = await fx.viewer.agent.get(`/api/designs/${design.id}/compare`).query({ a: 1, b: 2 }).expect(200);
    expect(JSON.stringify(compared.body.changes)).toContain('blazeWavelengthNm');

    const exported = await fx.owner.agent.get(`/api/designs/${design.id}/export`).expect(200);
    expect(exported.body.versions[1].params).toEqual(beyondReach);
    await fx.owner.agent.post(`/api/teams/${fx.teamId}/designs/import`).send(exported.body).expect(201);

    const refused = await fx.owner.agent
      .post(`/api/designs/${design.id}/versions`)
      .send({ baseVersion: 2, params: beyondReach, notes: 'Same again', message: 'Again' })
      .expect(400);
    expect(errorBodySchema.parse(refused.body).error.fields?.['params.grating.blazeWavelengthNm']).toMatch(
      /twice the groove spacing/,
    );
    // The refusal changed nothing: version 2 is still the latest, as it was.
    const after = notebookResponseSchema.parse((await fx.viewer.agent.get(`/api/designs/${design.id}`).expect(200)).body);
    expect(after.design.latestVersion).toBe(2);
  });
});
