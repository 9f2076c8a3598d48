import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import {
  createShareLinkResponseSchema,
  shareLinkListResponseSchema,
  sharedVersionResponseSchema,
} from '../../../shared/notebooks';
import { browserAgent } from '../../support/test-app';
import {
  createNotebook,
  createNotebookFixture,
  designWith,
  saveVersion,
  type NotebookFixture,
} from './fixture';

let fx: NotebookFixture;
let designId: string;
beforeAll(async () => {
  fx = await createNotebookFixture();
  designId = (await createNotebook(fx, 'Shared scanner')).design.id;
  await saveVersion(fx, designId, 1, designWith({ slits: { exitWidthUm: 40 } }), 'Narrow exit').expect(201);
}, 60_000);
afterAll(() => fx?.ctx.close());

const anonymous = () => browserAgent(fx.ctx.app);
const createLink = async (body: object) =>
  createShareLinkResponseSchema.parse(
    (await fx.owner.agent.post(`/api/designs/${designId}/share-links`).send(body).expect(201)).body,
  );

describe('share links', () => {
  it('shows a signed-out visitor the pinned version read-only, with notes and summary', async () => {
    const { token, path, link } = await createLink({ version: 1 });
    expect(path).toBe(`/share/${token}`);
    expect(link).toMatchObject({ version: 1, expiresAt: null, revokedAt: null, active: true });
    const res = await anonymous().get(`/api/share/${token}`).expect(200);
    expect(res.headers['cache-control']).toBe('private, no-store');
    const shared = sharedVersionResponseSchema.parse(res.body);
    expect(shared).toMatchObject({
      title: 'Shared scanner',
      pinned: true,
      version: { number: 1, notes: '# Why\nStarting point.' },
    });
    expect(shared.version.params.slits.exitWidthUm).toBe(100);
    expect(shared.version.summary.bandpassAtCentreNm).toBeGreaterThan(0);
  });

  it('follows the latest version when made for the latest', async () => {
    const { token } = await createLink({});
    expect(
      sharedVersionResponseSchema.parse((await anonymous().get(`/api/share/${token}`).expect(200)).body)
        .version.number,
    ).toBe(2);
    await saveVersion(fx, designId, 2, designWith({ slits: { exitWidthUm: 30 } }), 'Narrower still').expect(
      201,
    );
    const later = sharedVersionResponseSchema.parse(
      (await anonymous().get(`/api/share/${token}`).expect(200)).body,
    );
    expect(later).toMatchObject({ pinned: false, version: { number: 3 } });
  });

  it('stops working when it expires, by the injected clock', async () => {
    const expiresAt = new Date(fx.ctx.clock.now().getTime() + 60 * 60_000).toISOString();
    const { token } = await createLink({ version: 2, expiresAt });
    await anonymous().get(`/api/share/${token}`).expect(200);
    fx.ctx.clock.advance(60 * 60_000);
    const gone = await anonymous().get(`/api/share/${token}`).expect(404);
    expect(gone.body.error.message).toMatch(/not valid any more/);
    const listed = shareLinkListResponseSchema.parse(
      (await fx.owner.agent.get(`/api/designs/${designId}/share-links`).expect(200)).body,
    );
    expect(listed.links.find((l) => l.expiresAt === expiresAt)?.active).toBe(false);
  });

  it('refuses an expiry in the past', async () => {
    const res = await fx.owner.agent
      .post(`/api/designs/${designId}/share-links`)
      .send({ expiresAt: new Date(fx.ctx.clock.now().getTime() - 1000).toISOString() })
      .expect(400);
    expect(res.body.error.fields).toEqual({ expiresAt: 'must be in the future' });
  });

  it('stops working when revoked, and a revoked, an expired and a made-up token look alike', async () => {
    const { token, link } = await createLink({ version: 1 });
    await fx.owner.agent.delete(`/api/designs/${designId}/share-links/${link.id}`).expect(204);
    const revoked = await anonymous().get(`/api/share/${token}`).expect(404);
    const madeUp = await anonymous()
      .get(`/api/share/${'z'.repeat(40)}`)
      .expect(404);
    expect(revoked.body).toEqual(madeUp.body);
    const listed = shareLinkListResponseSchema.parse(
      (await fx.owner.agent.get(`/api/designs/${designId}/share-links`).expect(200)).body,
    );
    expect(listed.links.find((l) => l.id === link.id)).toMatchObject({
      active: false,
      revokedAt: fx.ctx.clock.now().toISOString(),
    });
    await fx.owner.agent.delete(`/api/designs/${designId}/share-links/no-such-link`).expect(404);
  });

  it('stores only the token’s hash', async () => {
    const { token } = await createLink({ version: 1 });
    const rows = await fx.ctx.database.db.query.shareLinks.findMany();
    expect(rows.some((row) => row.tokenHash === token)).toBe(false);
    expect(rows.every((row) => /^[0-9a-f]{64}$/.test(row.tokenHash))).toBe(true);
  });

  it('opens nothing else: no other version, design, member list or team', async () => {
    const { token } = await createLink({ version: 1 });
    const visitor = anonymous();
    const shared = await visitor.get(`/api/share/${token}`).expect(200);
    // Only the named fields: no ids of the design, team, authors or links.
    expect(Object.keys(shared.body).sort()).toEqual(['expiresAt', 'pinned', 'title', 'version']);
    expect(Object.keys(shared.body.version).sort()).toEqual([
      'createdAt',
      'message',
      'notes',
      'number',
      'params',
      'summary',
    ]);
    expect(JSON.stringify(shared.body)).not.toContain(fx.owner.user.displayName);
    expect(JSON.stringify(shared.body)).not.toContain(designId);
    // The token is no session: every other route still sees a signed-out visitor.
    for (const path of [
      `/api/designs/${designId}`,
      `/api/designs/${designId}/versions/2`,
      `/api/teams/${fx.teamId}/designs`,
      `/api/teams/${fx.teamId}/members`,
    ]) {
      await visitor.get(path).set('authorization', `Bearer ${token}`).expect(401);
    }
    await visitor.get(`/api/share/${token}/versions/2`).expect(404);
  });

  it('is managed by owners only', async () => {
    await fx.reviewer.agent.post(`/api/designs/${designId}/share-links`).send({}).expect(403);
    await fx.viewer.agent.get(`/api/designs/${designId}/share-links`).expect(403);
    await fx.outsider.agent.get(`/api/designs/${designId}/share-links`).expect(404);
  });
});
