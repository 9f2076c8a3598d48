import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { DesignCurve } from '../../../shared/curves';
import { exampleDesign, type Design } from '../../../shared/design';
import {
  notebookFileSchema,
  notebookFormatVersion,
  notebookWithVersionResponseSchema,
  type NotebookFileInput,
} from '../../../shared/notebooks';
import { createNotebook, createNotebookFixture, saveVersion, type NotebookFixture } from './fixture';

/**
 * The notebook file and the light budget's new design fields: format 3 carries a version's light
 * input and measured curves, formats 1 and 2 (written before either existed) still import, and a
 * curve's points come back exactly, number for number, through export and import.
 */

let fx: NotebookFixture;
beforeAll(async () => {
  fx = await createNotebookFixture();
}, 60_000);
afterAll(() => fx?.ctx.close());

/** Demo data of our own: an uneven grating-efficiency curve whose numbers do not survive a careless round. */
const curve: DesignCurve = {
  kind: 'grating-efficiency',
  name: 'Bench grating, TE, test report 7',
  checksum: 'a'.repeat(64),
  medium: 'air',
  order: 1,
  polarisation: 'te',
  wavelengthsNm: [300, 412.5, 500.125, 650.0625, 900],
  values: [0.1234567890123, 0.45, 0.7, 0.333333333333333, 0.05],
};

const withLight: Design = {
  ...structuredClone(exampleDesign),
  input: { kind: 'fibre', numericalAperture: 0.22, coreDiameterUm: 200 },
  curves: [curve],
};

const oldFile = (formatVersion: 1 | 2, params: unknown = exampleDesign): NotebookFileInput =>
  ({
    kind: 'blazebook-notebook',
    formatVersion,
    title: `Written by format ${formatVersion}`,
    versions: [{ number: 1, message: 'Start', params, createdAt: '2025-11-02T10:00:00Z' }],
  }) as NotebookFileInput;

describe('the notebook file with the light input and curves', () => {
  it('is written as format 3', () => {
    expect(notebookFormatVersion).toBe(3);
  });

  it.each([1, 2] as const)('still imports a format %i file, which has no curves', async (format) => {
    const res = await fx.owner.agent.post(`/api/teams/${fx.teamId}/designs/import`).send(oldFile(format)).expect(201);
    const { version } = notebookWithVersionResponseSchema.parse(res.body);
    expect(version.params.curves).toBeUndefined();
    expect(version.params.input).toBeUndefined();
    expect(version.params.grating).toEqual(exampleDesign.grating);
  });

  it('refuses an older format carrying the light input or curves, by path, since no older writer made one', async () => {
    const res = await fx.owner.agent
      .post(`/api/teams/${fx.teamId}/designs/import`)
      .send(oldFile(2, withLight))
      .expect(400);
    expect(res.body.error.fields).toEqual({
      'versions.0.params.input': 'is not part of format 2 (use formatVersion 3)',
      'versions.0.params.curves': 'is not part of format 2 (use formatVersion 3)',
    });
  });

  it('round-trips a version with a fibre input and a curve exactly through export and import', async () => {
    const { design } = await createNotebook(fx, 'Curve round trip');
    await saveVersion(fx, design.id, 1, withLight, 'Measured grating').expect(201);
    const exported = (await fx.owner.agent.get(`/api/designs/${design.id}/export`).expect(200)).body;
    const file = notebookFileSchema.parse(exported);
    expect(file.formatVersion).toBe(3);
    expect(file.versions[1]?.params.curves).toEqual([curve]);
    expect(file.versions[1]?.params.input).toEqual(withLight.input);

    const res = await fx.owner.agent.post(`/api/teams/${fx.teamId}/designs/import`).send(exported).expect(201);
    const imported = notebookWithVersionResponseSchema.parse(res.body);
    const again = (await fx.owner.agent.get(`/api/designs/${imported.design.id}/export`).expect(200)).body;
    // The same file but for when and what it was exported as.
    const comparable = (f: { versions: unknown[] }) => f.versions.map((v) => (v as { params: unknown }).params);
    expect(comparable(again)).toEqual(comparable(exported));
    // Exact: the JSON text of the points is the same, so no number was rounded on the way.
    expect(JSON.stringify(again.versions[1].params.curves)).toBe(JSON.stringify(exported.versions[1].params.curves));
  });
});
