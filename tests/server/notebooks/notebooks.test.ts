import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { exampleDesign } from '../../../shared/design';
import {
  compareResponseSchema,
  designListResponseSchema,
  notebookWithVersionResponseSchema,
  versionConflictBodySchema,
  versionListResponseSchema,
  versionResponseSchema,
} from '../../../shared/notebooks';
import { signUp } from '../../support/test-app';
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

describe('creating a notebook', () => {
  it('stores version 1 with its notes, message, author and a solver summary', async () => {
    const res = await fx.owner.agent
      .post(`/api/teams/${fx.teamId}/designs`)
      .send({
        title: '  Compact scanner ',
        tags: ['UV', 'uv', 'teaching'],
        params: exampleDesign,
        notes: '**why**',
        message: 'First cut',
      })
      .expect(201);
    const { design, version } = notebookWithVersionResponseSchema.parse(res.body);
    expect(design).toMatchObject({
      title: 'Compact scanner',
      tags: ['uv', 'teaching'],
      latestVersion: 1,
      baselineVersion: null,
      clonedFrom: null,
      role: 'owner',
      archived: false,
    });
    expect(design.createdBy?.id).toBe(fx.owner.user.id);
    expect(version).toMatchObject({
      number: 1,
      parentNumber: null,
      message: 'First cut',
      notes: '**why**',
      params: exampleDesign,
    });
    expect(version.author?.id).toBe(fx.owner.user.id);
    // The example design's centre, 600 nm, is reachable; its figures are the solver's, so only their presence is checked here.
    expect(version.summary).toMatchObject({
      rangeStartNm: 300,
      rangeEndNm: 900,
      centreWavelengthNm: 600,
      centreReachable: true,
    });
    expect(version.summary.bandpassAtCentreNm).toBeGreaterThan(0);
    expect(version.summary.resolvingPowerAtCentre).toBeGreaterThan(0);
    expect(version.summary.fNumber).toBeGreaterThan(0);
  });

  it('refuses a design the schema rejects, naming each field', async () => {
    const res = await fx.owner.agent
      .post(`/api/teams/${fx.teamId}/designs`)
      .send({ title: '', params: designWith({ grating: { order: 0 }, slits: { exitWidthUm: -1 } }) })
      .expect(400);
    expect(res.body.error.fields).toMatchObject({
      title: 'is required',
      'params.grating.order': 'must be a whole number other than 0',
      'params.slits.exitWidthUm': 'must be greater than 0',
    });
  });

  it('is for owners: a reviewer gets 403, someone outside the team 404', async () => {
    const body = { title: 'Nope', params: exampleDesign };
    await fx.reviewer.agent.post(`/api/teams/${fx.teamId}/designs`).send(body).expect(403);
    await fx.outsider.agent.post(`/api/teams/${fx.teamId}/designs`).send(body).expect(404);
  });
});

describe('saving versions', () => {
  it('saves version n+1 on top of the latest and bumps the design', async () => {
    const { design } = await createNotebook(fx, 'Save test');
    fx.ctx.clock.advance(60_000);
    const res = await saveVersion(
      fx,
      design.id,
      1,
      designWith({ slits: { exitWidthUm: 50 } }),
      'Narrower exit slit',
    ).expect(201);
    const saved = notebookWithVersionResponseSchema.parse(res.body);
    expect(saved.version).toMatchObject({ number: 2, parentNumber: 1, message: 'Narrower exit slit' });
    expect(saved.design.latestVersion).toBe(2);
    expect(saved.design.updatedAt).toBe(fx.ctx.clock.now().toISOString());
    // The answer is built from what was sent; read what was stored back from the database.
    const file = (await fx.owner.agent.get(`/api/designs/${design.id}/export`).expect(200)).body;
    expect(file.versions[1]).toMatchObject({
      number: 2,
      parentNumber: 1,
      message: 'Narrower exit slit',
      notes: 'Notes for Narrower exit slit',
      createdAt: saved.version.createdAt,
    });
    expect(file.versions[1].params).toEqual(saved.version.params);
    const history = (await fx.owner.agent.get(`/api/designs/${design.id}/versions`).expect(200)).body;
    expect(history.versions[0]).toMatchObject({ number: 2, author: { id: fx.owner.user.id } });
    expect(history.versions[0].summary).toEqual(saved.version.summary);
  });

  it('answers 409 with the latest version when the base is stale, and writes nothing', async () => {
    const { design } = await createNotebook(fx, 'Conflict test');
    await saveVersion(
      fx,
      design.id,
      1,
      designWith({ slits: { exitWidthUm: 50 } }),
      'Colleague’s change',
    ).expect(201);
    const res = await saveVersion(
      fx,
      design.id,
      1,
      designWith({ slits: { exitWidthUm: 200 } }),
      'My change',
    ).expect(409);
    const body = versionConflictBodySchema.parse(res.body);
    expect(body.error.code).toBe('version_conflict');
    // One place for the latest: `details`, the field every error may carry.
    expect(res.body.error).not.toHaveProperty('latest');
    expect(body.error.details.latest).toMatchObject({ number: 2, message: 'Colleague’s change' });
    expect(body.error.details.latest.params.slits.exitWidthUm).toBe(50);
    const history = versionListResponseSchema.parse(
      (await fx.owner.agent.get(`/api/designs/${design.id}/versions`).expect(200)).body,
    );
    expect(history.versions.map((v) => v.number)).toEqual([2, 1]);
    // Exactly the version a reader of v2 gets, so the client needs no second request.
    const latest = (await fx.owner.agent.get(`/api/designs/${design.id}/versions/2`).expect(200)).body;
    expect(res.body.error.details.latest).toEqual(latest.version);
    // Rebased on the latest, the same change goes through.
    await saveVersion(
      fx,
      design.id,
      2,
      designWith({ slits: { exitWidthUm: 200 } }),
      'My change, rebased',
    ).expect(201);
  });

  it('lets only one of several concurrent saves on the same base win', async () => {
    const { design } = await createNotebook(fx, 'Race test');
    const results = await Promise.all(
      [10, 20, 30, 40, 50].map((width) =>
        saveVersion(fx, design.id, 1, designWith({ slits: { exitWidthUm: width } }), `width ${width}`),
      ),
    );
    expect(results.map((r) => r.status).sort()).toEqual([201, 409, 409, 409, 409]);
  });

  it('saves concurrent changes to different designs, each as its own next version', async () => {
    // Saves that arrive together are written in one statement: each must still land on its own design.
    const designs = await Promise.all([1, 2, 3, 4, 5, 6].map((i) => createNotebook(fx, `Together ${i}`)));
    const results = await Promise.all(
      designs.map(({ design }, i) =>
        saveVersion(fx, design.id, 1, designWith({ slits: { exitWidthUm: 100 + i } }), `together ${i}`),
      ),
    );
    expect(results.map((r) => r.status)).toEqual([201, 201, 201, 201, 201, 201]);
    for (const [i, { design }] of designs.entries()) {
      const saved = notebookWithVersionResponseSchema.parse(results[i]!.body);
      expect(saved.design).toMatchObject({ id: design.id, title: `Together ${i + 1}`, latestVersion: 2 });
      const file = (await fx.owner.agent.get(`/api/designs/${design.id}/export`).expect(200)).body;
      expect(file.versions.map((v: { message: string }) => v.message)).toEqual(['First cut', `together ${i}`]);
      expect(file.versions[1].params.slits.exitWidthUm).toBe(100 + i);
    }
  });

  it('refuses a base version that does not exist yet', async () => {
    const { design } = await createNotebook(fx, 'Future base');
    const res = await saveVersion(fx, design.id, 7, exampleDesign).expect(400);
    expect(res.body.error.fields).toEqual({ baseVersion: 'must be at most 1' });
  });

  it('is for owners only', async () => {
    const { design } = await createNotebook(fx, 'Owner only');
    const body = { baseVersion: 1, params: exampleDesign, message: 'Sneaky' };
    await fx.reviewer.agent.post(`/api/designs/${design.id}/versions`).send(body).expect(403);
    await fx.viewer.agent.post(`/api/designs/${design.id}/versions`).send(body).expect(403);
    await fx.outsider.agent.post(`/api/designs/${design.id}/versions`).send(body).expect(404);
  });
});

describe('history and versions', () => {
  it('lists the history newest first, with authors, messages and key figures', async () => {
    const { design } = await createNotebook(fx, 'History test');
    await saveVersion(
      fx,
      design.id,
      1,
      designWith({ grating: { grooveDensityPerMm: 1800 } }),
      'Denser grating',
    ).expect(201);
    await saveVersion(
      fx,
      design.id,
      2,
      designWith({ grating: { grooveDensityPerMm: 2400 } }),
      'Denser still',
    ).expect(201);
    const res = await fx.viewer.agent.get(`/api/designs/${design.id}/versions`).expect(200);
    const { versions } = versionListResponseSchema.parse(res.body);
    expect(versions.map((v) => [v.number, v.parentNumber, v.message])).toEqual([
      [3, 2, 'Denser still'],
      [2, 1, 'Denser grating'],
      [1, null, 'First cut'],
    ]);
    expect(versions.every((v) => v.author?.displayName === fx.owner.user.displayName)).toBe(true);
    expect(versions[0]).not.toHaveProperty('params');
  });

  it('reads one version with its parameters and notes; a missing one is 404', async () => {
    const { design } = await createNotebook(fx, 'Read test');
    const res = await fx.reviewer.agent.get(`/api/designs/${design.id}/versions/1`).expect(200);
    expect(versionResponseSchema.parse(res.body).version).toMatchObject({
      number: 1,
      notes: '# Why\nStarting point.',
      params: exampleDesign,
    });
    expect(
      (await fx.reviewer.agent.get(`/api/designs/${design.id}/versions/9`).expect(404)).body.error.message,
    ).toMatch(/no version 9/);
    const outsider = await fx.outsider.agent.get(`/api/designs/${design.id}/versions/1`).expect(404);
    const madeUp = await fx.outsider.agent.get('/api/designs/no-such-design/versions/1').expect(404);
    expect(outsider.body).toEqual(madeUp.body);
  });
});

describe('a removed member', () => {
  it('loses access to a version at once, even one read a moment ago', async () => {
    const { design } = await createNotebook(fx, 'Read then leave');
    const leaver = await signUp(fx.ctx.app, 'Leaver');
    await fx.addMember(fx.teamId, leaver, 'viewer');
    await leaver.agent.get(`/api/designs/${design.id}/versions/1`).expect(200);
    await fx.owner.agent.delete(`/api/teams/${fx.teamId}/members/${leaver.user.id}`).expect(204);
    await leaver.agent.get(`/api/designs/${design.id}/versions/1`).expect(404);
  });
});

describe('compare', () => {
  it('lists changed parameters with before and after, and derived figures with their relative change', async () => {
    const { design } = await createNotebook(fx, 'Compare test');
    const { detector: _dropped, ...withoutDetector } = designWith({
      slits: { exitWidthUm: 50, entranceWidthUm: 50 },
    });
    await saveVersion(fx, design.id, 1, withoutDetector, 'Halve the slits, drop the detector').expect(201);
    const res = await fx.viewer.agent.get(`/api/designs/${design.id}/compare?a=1&b=2`).expect(200);
    const body = compareResponseSchema.parse(res.body);
    expect(body.a.number).toBe(1);
    expect(body.b.number).toBe(2);
    expect(body.changes).toEqual([
      { path: 'slits.entranceWidthUm', before: 100, after: 50 },
      { path: 'slits.exitWidthUm', before: 100, after: 50 },
      { path: 'detector.pixelPitchUm', before: 25, after: null },
      { path: 'detector.pixelCount', before: 1024, after: null },
    ]);
    const bandpass = body.figures.find((f) => f.key === 'bandpassAtCentreNm')!;
    // Bandpass is linear in the (matched) slit width, so halving both slits halves it.
    expect(bandpass.relativeChange).toBeCloseTo(-0.5, 9);
    expect(bandpass.after! / bandpass.before!).toBeCloseTo(0.5, 9);
    const fNumber = body.figures.find((f) => f.key === 'fNumber')!;
    expect(fNumber.relativeChange).toBe(0);
    // Without numbers: the latest against its parent.
    const latest = compareResponseSchema.parse(
      (await fx.viewer.agent.get(`/api/designs/${design.id}/compare`).expect(200)).body,
    );
    expect([latest.a.number, latest.b.number, latest.changes.length]).toEqual([1, 2, 4]);
  });

  it('reports an unknown version as 404 and bad numbers as 400', async () => {
    const { design } = await createNotebook(fx, 'Compare errors');
    await fx.owner.agent.get(`/api/designs/${design.id}/compare?a=1&b=4`).expect(404);
    const res = await fx.owner.agent.get(`/api/designs/${design.id}/compare?a=zero&b=1.5`).expect(400);
    expect(Object.keys(res.body.error.fields)).toEqual(['a', 'b']);
  });
});

describe('rename, tag, archive and the team list', () => {
  it('renames, tags and archives; archived designs leave the default list', async () => {
    const { design } = await createNotebook(fx, 'To archive');
    const renamed = await fx.owner.agent
      .patch(`/api/designs/${design.id}`)
      .send({ title: 'Archived one', tags: ['Old'] })
      .expect(200);
    expect(renamed.body.design).toMatchObject({ title: 'Archived one', tags: ['old'] });
    await fx.owner.agent.patch(`/api/designs/${design.id}`).send({ archived: true }).expect(200);
    const live = designListResponseSchema.parse(
      (await fx.owner.agent.get(`/api/teams/${fx.teamId}/designs?pageSize=100`).expect(200)).body,
    );
    expect(live.designs.map((d) => d.id)).not.toContain(design.id);
    const archived = designListResponseSchema.parse(
      (await fx.owner.agent.get(`/api/teams/${fx.teamId}/designs?archived=only`).expect(200)).body,
    );
    expect(archived.designs.map((d) => d.id)).toEqual([design.id]);
    await saveVersion(fx, design.id, 1, exampleDesign).expect(409);
    await fx.reviewer.agent.patch(`/api/designs/${design.id}`).send({ archived: false }).expect(403);
    await fx.owner.agent.patch(`/api/designs/${design.id}`).send({}).expect(400);
  });
});

describe('the team list with search, tags, sort, paging and baselines first', () => {
  let list: NotebookFixture;
  beforeAll(async () => {
    list = await createNotebookFixture();
    for (const [title, tags] of [
      ['Bravo UV', ['uv']],
      ['alpha visible', ['visible']],
      ['Charlie 50%_wide', ['uv', 'nir']],
      ['Delta NIR', ['nir']],
    ] as const) {
      await createNotebook(list, title, exampleDesign, [...tags]);
      list.ctx.clock.advance(1000);
    }
  }, 60_000);
  afterAll(() => list?.ctx.close());

  const titles = async (query: string) => {
    const res = await list.viewer.agent.get(`/api/teams/${list.teamId}/designs${query}`).expect(200);
    return designListResponseSchema.parse(res.body);
  };

  it.each([
    { query: '', expected: ['Delta NIR', 'Charlie 50%_wide', 'alpha visible', 'Bravo UV'] },
    { query: '?sort=title', expected: ['alpha visible', 'Bravo UV', 'Charlie 50%_wide', 'Delta NIR'] },
    {
      query: '?sort=title&dir=desc',
      expected: ['Delta NIR', 'Charlie 50%_wide', 'Bravo UV', 'alpha visible'],
    },
    {
      query: '?sort=updated&dir=asc',
      expected: ['Bravo UV', 'alpha visible', 'Charlie 50%_wide', 'Delta NIR'],
    },
    { query: '?tag=uv&sort=title', expected: ['Bravo UV', 'Charlie 50%_wide'] },
    { query: '?q=ALPHA', expected: ['alpha visible'] },
    // % and _ are letters in a search, not wildcards.
    { query: `?q=${encodeURIComponent('%_')}`, expected: ['Charlie 50%_wide'] },
    { query: '?sort=title&page=2&pageSize=3', expected: ['Delta NIR'] },
  ] satisfies { query: string; expected: string[] }[])(
    'GET designs$query → $expected',
    async ({ query, expected }) => {
      expect((await titles(query)).designs.map((d) => d.title)).toEqual(expected);
    },
  );

  it('reports the total before paging and every tag in the team', async () => {
    const page = await titles('?pageSize=2');
    expect(page).toMatchObject({ total: 4, page: 1, pageSize: 2, tags: ['nir', 'uv', 'visible'] });
    expect(page.designs).toHaveLength(2);
  });

  it('sorts by owner name', async () => {
    const other = await list.reviewer.agent.get('/api/teams').expect(200);
    expect(other.body.teams.length).toBeGreaterThan(0);
    await list.addMember(list.teamId, list.outsider, 'owner');
    await list.outsider.agent
      .post(`/api/teams/${list.teamId}/designs`)
      .send({ title: 'Echo', params: exampleDesign })
      .expect(201);
    const byOwner = await titles('?sort=owner');
    expect(byOwner.designs.at(0)?.createdBy?.displayName).toBe(list.outsider.user.displayName); // "Outsider …" < "Owner …"
    expect(byOwner.designs.at(0)?.title).toBe('Echo');
  });

  it('puts designs with a baseline first, whatever the sort', async () => {
    const delta = (await titles('?q=Delta')).designs[0]!;
    const marked = await list.owner.agent
      .put(`/api/designs/${delta.id}/baseline`)
      .send({ version: 1 })
      .expect(200);
    expect(marked.body.design.baselineVersion).toBe(1);
    expect((await titles('?sort=title')).designs.map((d) => d.title)).toEqual([
      'Delta NIR',
      'alpha visible',
      'Bravo UV',
      'Charlie 50%_wide',
      'Echo',
    ]);
    await list.reviewer.agent.put(`/api/designs/${delta.id}/baseline`).send({ version: null }).expect(403);
    await list.owner.agent.put(`/api/designs/${delta.id}/baseline`).send({ version: 5 }).expect(404);
    await list.owner.agent.put(`/api/designs/${delta.id}/baseline`).send({ version: null }).expect(200);
    expect((await titles('?sort=title')).designs[0]?.title).toBe('alpha visible');
  });
});

describe('clone', () => {
  it('lets a viewer clone a version into their workspace, recording where it came from', async () => {
    const { design } = await createNotebook(fx, 'Lab baseline');
    await saveVersion(
      fx,
      design.id,
      1,
      designWith({ grating: { grooveDensityPerMm: 600 } }),
      'Coarser grating',
    ).expect(201);
    const res = await fx.viewer.agent
      .post(`/api/designs/${design.id}/clone`)
      .send({ version: 1 })
      .expect(201);
    const { design: clone, version } = notebookWithVersionResponseSchema.parse(res.body);
    const teams = (await fx.viewer.agent.get('/api/teams').expect(200)).body.teams as {
      id: string;
      personal: boolean;
    }[];
    expect(clone.teamId).toBe(teams.find((t) => t.personal)?.id);
    expect(clone).toMatchObject({
      title: 'Lab baseline',
      role: 'owner',
      latestVersion: 1,
      clonedFrom: { designId: design.id, title: 'Lab baseline', version: 1 },
    });
    expect(clone.createdBy?.id).toBe(fx.viewer.user.id);
    expect(version).toMatchObject({
      number: 1,
      params: exampleDesign,
      notes: '# Why\nStarting point.',
      message: 'Cloned from “Lab baseline” v1',
    });
    // The clone is the viewer's own: they may save on it.
    await fx.viewer.agent
      .post(`/api/designs/${clone.id}/versions`)
      .send({ baseVersion: 1, params: exampleDesign, message: 'Mine now' })
      .expect(201);
  });

  it('refuses a target team where the caller is not owner, and hides designs from outsiders', async () => {
    const { design } = await createNotebook(fx, 'Not into here');
    await fx.viewer.agent.post(`/api/designs/${design.id}/clone`).send({ teamId: fx.teamId }).expect(403);
    await fx.viewer.agent
      .post(`/api/designs/${design.id}/clone`)
      .send({ teamId: 'some-other-team' })
      .expect(404);
    await fx.outsider.agent.post(`/api/designs/${design.id}/clone`).send({}).expect(404);
    await fx.viewer.agent.post(`/api/designs/${design.id}/clone`).send({ version: 3 }).expect(404);
  });
});

describe('signed out', () => {
  it('gets 401 from every notebook route but share links', async () => {
    const { design } = await createNotebook(fx, 'Signed out');
    const anonymous = (await import('../../support/test-app')).browserAgent(fx.ctx.app);
    await anonymous.get(`/api/teams/${fx.teamId}/designs`).expect(401);
    await anonymous.get(`/api/designs/${design.id}`).expect(401);
    await anonymous.get(`/api/designs/${design.id}/versions/1`).expect(401);
  });
});
