import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { errorBodySchema } from '../../../shared/api-error';
import { exampleDesign, type Design } from '../../../shared/design';
import { createShareLinkResponseSchema, sharedVersionResponseSchema, versionListResponseSchema } from '../../../shared/notebooks';
import { summarizeRequirements, summarizeVersion } from '../../../server/notebooks/summary';
import { browserAgent } from '../../support/test-app';
import { createNotebook, createNotebookFixture, saveVersion, type NotebookFixture } from './fixture';

/**
 * The version summary's requirements figure: counted once when a version is saved, with the
 * workbench's checks, and left out for a design that states none so its summary is what it
 * always was. Served with the history list and share links; a bad limit is refused by name.
 */

/**
 * The example design (1200 grooves/mm, 30° deviation, 300 mm focal lengths, 100 µm slits) with
 * limits worked by hand (Palmer & Loewen, Diffraction Grating Handbook, ch. 2 and 8):
 * - bandpass at 546.1 nm: sin φ = 546.1 / (2 × 833.33 nm × cos 15°) = 0.3392, φ = 19.83°,
 *   β = 4.83°, RLD = 833.33 × cos 4.83° / 300 = 2.768 nm/mm; 0.1 mm × 2.768 = 0.277 nm > 0.25: fails;
 * - focal length 300 mm ≤ 400 mm: passes;
 * - f-number ≤ 20: the collimator is f/6 along the 50 mm grating (300 / 50) and a little slower
 *   across it (the beam narrows by cos α), well under f/20: passes;
 * - order overlap "filtered": the 200–1100 nm source puts λ/2 on every λ from 400 nm and no filter
 *   blocks it: fails (the design carries no filter);
 * - pixels per bandpass ≥ 2 without a detector: not checked.
 */
const { detector: _detector, ...withoutDetector } = structuredClone(exampleDesign);
const stated: Design = {
  ...withoutDetector,
  requirements: {
    minPixelsPerBandpass: 2,
    maxBandpassNm: 0.25,
    atWavelengthsNm: [546.1],
    maxFocalLengthMm: 400,
    maxFNumber: 20,
    orderOverlap: 'filtered',
  },
};

describe('summarizeRequirements', () => {
  it('counts met, failing and unknown against the hand-worked limits', () => {
    expect(summarizeRequirements(stated)).toEqual({ met: 2, total: 5, unknown: 1, failing: ['maxBandpassNm', 'orderOverlap'] });
  });

  it('is null without requirements, or with only the list of wavelengths they would apply at', () => {
    expect(summarizeRequirements(exampleDesign)).toBeNull();
    expect(summarizeRequirements({ ...exampleDesign, requirements: {} })).toBeNull();
    expect(summarizeRequirements({ ...exampleDesign, requirements: { atWavelengthsNm: [500], driveStepArcsec: 2 } })).toBeNull();
  });

  it('leaves the field out of a summary without requirements, so it is the summary saved before', () => {
    const summary = summarizeVersion(exampleDesign);
    expect('requirements' in summary).toBe(false);
    expect(summarizeVersion(stated).requirements).toEqual(summarizeRequirements(stated));
    // Requirements never change the design's own figures.
    const { requirements: _requirements, ...figures } = summarizeVersion(stated);
    expect(figures).toEqual(summary);
  });
});

let fx: NotebookFixture;
beforeAll(async () => {
  fx = await createNotebookFixture();
}, 60_000);
afterAll(() => fx?.ctx.close());

describe('requirements through the notebook routes', () => {
  it('lists each version with its requirements figure, and none for a version without them', async () => {
    const { design } = await createNotebook(fx, 'With limits');
    await saveVersion(fx, design.id, 1, stated, 'State the limits').expect(201);
    const list = versionListResponseSchema.parse((await fx.viewer.agent.get(`/api/designs/${design.id}/versions`).expect(200)).body);
    expect(list.versions.map((version) => [version.number, version.summary.requirements ?? null])).toEqual([
      [2, { met: 2, total: 5, unknown: 1, failing: ['maxBandpassNm', 'orderOverlap'] }],
      [1, null],
    ]);
  });

  it('shows the figure to a share link’s holder', async () => {
    const { design } = await createNotebook(fx, 'Shared limits', stated);
    const { token } = createShareLinkResponseSchema.parse(
      (await fx.owner.agent.post(`/api/designs/${design.id}/share-links`).send({}).expect(201)).body,
    );
    const shared = sharedVersionResponseSchema.parse((await browserAgent(fx.ctx.app).get(`/api/share/${token}`).expect(200)).body);
    expect(shared.version.summary.requirements?.failing).toEqual(['maxBandpassNm', 'orderOverlap']);
  });

  it.each([
    { requirements: { maxBandpassNm: -1 }, field: 'params.requirements.maxBandpassNm', message: /greater than 0/ },
    { requirements: { maxWavelengthErrorNm: 0.05 }, field: 'params.requirements.driveStepArcsec', message: /required with maxWavelengthErrorNm/ },
    { requirements: { orderOverlap: 'never' }, field: 'params.requirements.orderOverlap', message: /forbidden, filtered or allowed/ },
  ])('refuses a save with a bad limit, naming $field', async ({ requirements, field, message }) => {
    const { design } = await createNotebook(fx, `Bad ${field}`);
    const res = await saveVersion(fx, design.id, 1, { ...exampleDesign, requirements } as Design).expect(400);
    expect(errorBodySchema.parse(res.body).error.fields?.[field]).toMatch(message);
  });
});
