import { eq, sql } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { designVersions } from '../../../db/schema';
import { exampleDesign, type Design } from '../../../shared/design';
import {
  compareResponseSchema,
  notebookFileSchema,
  notebookResponseSchema,
  notebookWithVersionResponseSchema,
  versionListResponseSchema,
  versionResponseSchema,
  type NotebookFileInput,
} from '../../../shared/notebooks';
import { createTeamsRepository } from '../../../server/teams/repository';
import { createTestApp, signUp } from '../../support/test-app';
import { createNotebookFixture, type NotebookFixture } from './fixture';

/**
 * Requirements came after notebooks were saved and exported. A file and a stored version written
 * without them import, open, compare and export unchanged — the file byte for byte — and a file
 * with them round-trips exactly, its versions' summaries now counting what is met.
 */
let fx: NotebookFixture;
beforeAll(async () => {
  fx = await createNotebookFixture();
}, 60_000);
afterAll(() => fx?.ctx.close());

/** The keys every summary had before requirements existed. */
const SUMMARY_KEYS_BEFORE = [
  'rangeStartNm',
  'rangeEndNm',
  'centreWavelengthNm',
  'centreReachable',
  'bandpassAtCentreNm',
  'resolvingPowerAtCentre',
  'reciprocalDispersionAtCentreNmPerMm',
  'fNumber',
  'warningCount',
].sort();

const narrower: Design = { ...structuredClone(exampleDesign), slits: { entranceWidthUm: 60, exitWidthUm: 60, heightMm: 10 } };

/** A format 1 file as an earlier Blazebook wrote it: no review, no requirements. */
const oldFile: NotebookFileInput = {
  kind: 'blazebook-notebook',
  formatVersion: 1,
  title: 'Saved before requirements',
  versions: [
    { number: 1, message: 'Start', params: exampleDesign, createdAt: '2025-06-02T10:00:00Z' },
    { number: 2, message: 'Narrower slits', params: narrower, createdAt: '2025-06-03T10:00:00Z', parentNumber: 1 },
  ],
};

/** Version 2 states what the instrument must do (limits either side of its figures). */
const withRequirements: Design = {
  ...structuredClone(narrower),
  requirements: {
    maxBandpassNm: 0.5,
    atWavelengthsNm: [404.7, 546.1],
    maxFocalLengthMm: 250,
    maxFootprintMm: { widthMm: 600, depthMm: 500 },
    oneShotCoverage: false,
    maxWavelengthErrorNm: 0.05,
    driveStepArcsec: 2,
    orderOverlap: 'allowed',
  },
};
const newFile: NotebookFileInput = {
  ...oldFile,
  formatVersion: 2,
  title: 'With requirements',
  versions: [oldFile.versions[0]!, { ...oldFile.versions[1]!, message: 'Requirements stated', params: withRequirements }],
};

async function importFile(file: object) {
  const res = await fx.owner.agent.post(`/api/teams/${fx.teamId}/designs/import`).send(file).expect(201);
  return notebookWithVersionResponseSchema.parse(res.body).design;
}

async function exportText(designId: string): Promise<string> {
  const res = await fx.owner.agent.get(`/api/designs/${designId}/export`).expect(200);
  return JSON.stringify(res.body);
}

async function storedSummaries(designId: string): Promise<Record<string, unknown>[]> {
  const rows = await fx.ctx.database.db
    .select({ number: designVersions.number, summary: designVersions.summary })
    .from(designVersions)
    .where(eq(designVersions.designId, designId))
    .orderBy(designVersions.number);
  return rows.map((row) => row.summary as Record<string, unknown>);
}

describe('a notebook without requirements', () => {
  it('imports, opens, compares and exports unchanged, and its export imports back to the same bytes', async () => {
    const design = await importFile(oldFile);
    // Stored summaries keep exactly the keys they always had: nothing is added for requirements.
    for (const summary of await storedSummaries(design.id)) expect(Object.keys(summary).sort()).toEqual(SUMMARY_KEYS_BEFORE);

    const opened = notebookResponseSchema.parse((await fx.viewer.agent.get(`/api/designs/${design.id}`).expect(200)).body);
    expect(opened.version.params).toEqual(narrower);
    expect('requirements' in opened.version.params).toBe(false);

    const compared = compareResponseSchema.parse(
      (await fx.viewer.agent.get(`/api/designs/${design.id}/compare`).query({ a: 1, b: 2 }).expect(200)).body,
    );
    expect(compared.changes.map((change) => change.path)).toEqual(['slits.entranceWidthUm', 'slits.exitWidthUm']);
    expect(compared.a.summary.requirements).toBeUndefined();
    expect(compared.b.summary.requirements).toBeUndefined();

    const first = await exportText(design.id);
    const file = notebookFileSchema.parse(JSON.parse(first));
    // Each version's parameters exactly as the file gave them, key for key and in order.
    file.versions.forEach((version, i) => expect(JSON.stringify(version.params)).toBe(JSON.stringify(oldFile.versions[i]!.params)));
    const again = await importFile(JSON.parse(first));
    expect(await exportText(again.id)).toBe(first);
  });
});

describe('a notebook with requirements', () => {
  it('round-trips exactly through export and import, and its summaries count what is met', async () => {
    const design = await importFile(newFile);
    const first = await exportText(design.id);
    const file = notebookFileSchema.parse(JSON.parse(first));
    expect(file.versions[1]!.params).toEqual(withRequirements);
    expect(JSON.stringify(file.versions[1]!.params)).toBe(JSON.stringify(withRequirements));
    const again = await importFile(JSON.parse(first));
    expect(await exportText(again.id)).toBe(first);

    const list = versionListResponseSchema.parse((await fx.viewer.agent.get(`/api/designs/${again.id}/versions`).expect(200)).body);
    const [v2, v1] = list.versions;
    expect(v1!.summary.requirements).toBeUndefined();
    // 60 µm slits: 0.06 mm × ≈ 2.78 nm/mm ≈ 0.17 nm, inside 0.5 nm (Palmer & Loewen, ch. 8, RLD = d cos β / (m f));
    // 300 mm focal lengths break the 250 mm limit; oneShotCoverage false states no limit; overlap
    // allowed passes; footprint and drive error are checked by the solver. Three of five are judged
    // here by hand; the summary must agree with these and count five in all.
    expect(v2!.summary.requirements).toMatchObject({ total: 5, unknown: 0 });
    expect(v2!.summary.requirements!.failing).toContain('maxFocalLengthMm');
    expect(v2!.summary.requirements!.failing).not.toContain('maxBandpassNm');
    expect(v2!.summary.requirements!.failing).not.toContain('orderOverlap');
    expect(v2!.summary.requirements!.met + v2!.summary.requirements!.failing.length).toBe(5);

    const compared = compareResponseSchema.parse(
      (await fx.viewer.agent.get(`/api/designs/${again.id}/compare`).query({ a: 1, b: 2 }).expect(200)).body,
    );
    const paths = compared.changes.map((change) => change.path);
    expect(paths).toContain('requirements.atWavelengthsNm');
    expect(paths).toContain('requirements.maxFootprintMm.widthMm');
    expect(compared.changes.find((change) => change.path === 'requirements.atWavelengthsNm')).toEqual({
      path: 'requirements.atWavelengthsNm',
      before: null,
      after: [404.7, 546.1],
    });
  });

  it('still lists and opens a version whose stored summary predates requirements', async () => {
    const design = await importFile(newFile);
    // As a summary written before requirements existed would be stored: without the field.
    await fx.ctx.database.db
      .update(designVersions)
      .set({ summary: sql`${designVersions.summary} - 'requirements'` })
      .where(eq(designVersions.designId, design.id));
    // A second server on the same database: nothing remembered from the import.
    const later = await createTestApp({ database: fx.ctx.database });
    const reader = await signUp(later.app, 'Later reader');
    await createTeamsRepository(later.database.db).addMember(fx.teamId, reader.user.id, 'viewer', later.clock.now());
    const list = versionListResponseSchema.parse((await reader.agent.get(`/api/designs/${design.id}/versions`).expect(200)).body);
    expect(list.versions.map((version) => version.summary.requirements)).toEqual([undefined, undefined]);
    const opened = versionResponseSchema.parse((await reader.agent.get(`/api/designs/${design.id}/versions/2`).expect(200)).body);
    expect(opened.version.params.requirements).toEqual(withRequirements.requirements);
    await reader.agent.get(`/api/designs/${design.id}/compare`).query({ a: 1, b: 2 }).expect(200);
  });
});
