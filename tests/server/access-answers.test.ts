import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { exampleDesign } from '../../shared/design';
import { createNotebook, createNotebookFixture, type NotebookFixture, type Person } from './notebooks/fixture';

/**
 * The exact answers of the one access check, route by route: an outsider (or a made-up id) gets
 * the resource's own 404 and learns nothing; a member without the capability gets the 403 that
 * names their role. The access matrix checks statuses; this pins the bodies, so moving the check
 * cannot change a word the client sees.
 */
let fx: NotebookFixture;
let designId: string;
/** The owner's thread on v1 and its first remark. */
let threadId: string;
let remarkId: string;
beforeAll(async () => {
  fx = await createNotebookFixture();
  designId = (await createNotebook(fx, 'Guarded')).design.id;
  const started = await fx.owner.agent
    .post(`/api/designs/${designId}/versions/1/threads`)
    .send({ pin: { kind: 'version' }, body: 'Owner’s remark' })
    .expect(201);
  threadId = started.body.thread.id;
  remarkId = started.body.thread.remarks[0].id;
}, 60_000);
afterAll(() => fx?.ctx.close());

const madeUp = 'no-such-design';
const noTeam = { status: 404, code: 'not_found', message: 'No such team.' };
const noDesign = { status: 404, code: 'not_found', message: 'No such design.' };
const noThread = { status: 404, code: 'not_found', message: 'No such thread.' };
const noRemark = { status: 404, code: 'not_found', message: 'No such remark.' };
const notAllowed = (role: string) => ({ status: 403, code: 'forbidden', message: `A ${role} of this team may not do that.` });
const save = { baseVersion: 1, params: exampleDesign, notes: '', message: 'Try' };

type Who = 'owner' | 'reviewer' | 'viewer' | 'outsider';
type Case = {
  who: Who;
  method: 'get' | 'post' | 'patch' | 'put' | 'delete';
  path: () => string;
  body?: object | (() => object);
  answer: { status: number; code: string; message: string };
};

const cases = {
  'an outsider reads a team': { who: 'outsider', method: 'get', path: () => `/api/teams/${fx.teamId}`, answer: noTeam },
  'a viewer renames a team': {
    who: 'viewer',
    method: 'patch',
    path: () => `/api/teams/${fx.teamId}`,
    body: { name: 'Mine now' },
    answer: notAllowed('viewer'),
  },
  'a reviewer lists invitations': { who: 'reviewer', method: 'get', path: () => `/api/teams/${fx.teamId}/invitations`, answer: notAllowed('reviewer') },
  'an outsider lists a team’s designs': { who: 'outsider', method: 'get', path: () => `/api/teams/${fx.teamId}/designs`, answer: noTeam },
  'a viewer creates a design': {
    who: 'viewer',
    method: 'post',
    path: () => `/api/teams/${fx.teamId}/designs`,
    body: { title: 'Sneaky', params: exampleDesign },
    answer: notAllowed('viewer'),
  },
  'an outsider reads a design': { who: 'outsider', method: 'get', path: () => `/api/designs/${designId}`, answer: noDesign },
  'a member reads a made-up design': { who: 'owner', method: 'get', path: () => `/api/designs/${madeUp}`, answer: noDesign },
  'a reviewer renames a design': {
    who: 'reviewer',
    method: 'patch',
    path: () => `/api/designs/${designId}`,
    body: { title: 'Renamed' },
    answer: notAllowed('reviewer'),
  },
  'an outsider reads a version': { who: 'outsider', method: 'get', path: () => `/api/designs/${designId}/versions/1`, answer: noDesign },
  'an outsider reads a version that does not exist': {
    who: 'outsider',
    method: 'get',
    path: () => `/api/designs/${designId}/versions/99`,
    answer: noDesign,
  },
  'a member reads a version that does not exist': {
    who: 'viewer',
    method: 'get',
    path: () => `/api/designs/${designId}/versions/99`,
    answer: { status: 404, code: 'not_found', message: 'This design has no version 99.' },
  },
  'an outsider saves a version': { who: 'outsider', method: 'post', path: () => `/api/designs/${designId}/versions`, body: save, answer: noDesign },
  'a member saves on a made-up design': { who: 'owner', method: 'post', path: () => `/api/designs/${madeUp}/versions`, body: save, answer: noDesign },
  'a viewer saves a version': { who: 'viewer', method: 'post', path: () => `/api/designs/${designId}/versions`, body: save, answer: notAllowed('viewer') },
  'a reviewer sets the baseline': {
    who: 'reviewer',
    method: 'put',
    path: () => `/api/designs/${designId}/baseline`,
    body: { version: 1 },
    answer: notAllowed('reviewer'),
  },
  'an outsider compares versions': { who: 'outsider', method: 'get', path: () => `/api/designs/${designId}/compare`, answer: noDesign },
  'an outsider clones': { who: 'outsider', method: 'post', path: () => `/api/designs/${designId}/clone`, body: {}, answer: noDesign },
  'a viewer clones into the team itself': {
    who: 'viewer',
    method: 'post',
    path: () => `/api/designs/${designId}/clone`,
    body: () => ({ teamId: fx.teamId }),
    answer: notAllowed('viewer'),
  },
  'a reviewer lists share links': { who: 'reviewer', method: 'get', path: () => `/api/designs/${designId}/share-links`, answer: notAllowed('reviewer') },
  'an outsider exports': { who: 'outsider', method: 'get', path: () => `/api/designs/${designId}/export`, answer: noDesign },
  'an outsider reads a version’s review': { who: 'outsider', method: 'get', path: () => `/api/designs/${designId}/versions/1/review`, answer: noDesign },
  'an outsider reads review states': { who: 'outsider', method: 'get', path: () => `/api/designs/${designId}/review-states`, answer: noDesign },
  'a viewer starts a thread': {
    who: 'viewer',
    method: 'post',
    path: () => `/api/designs/${designId}/versions/1/threads`,
    body: { pin: { kind: 'version' }, body: 'Looks fine.' },
    answer: notAllowed('viewer'),
  },
  'a member reads the review of a version that does not exist': {
    who: 'reviewer',
    method: 'get',
    path: () => `/api/designs/${designId}/versions/99/review`,
    answer: { status: 404, code: 'not_found', message: 'This design has no version 99.' },
  },
  'an outsider reads a thread': { who: 'outsider', method: 'get', path: () => `/api/threads/${threadId}`, answer: noThread },
  'a member reads a made-up thread': { who: 'owner', method: 'get', path: () => '/api/threads/no-such-thread', answer: noThread },
  'a viewer replies': { who: 'viewer', method: 'post', path: () => `/api/threads/${threadId}/remarks`, body: { body: 'Me too' }, answer: notAllowed('viewer') },
  'an outsider edits a remark': { who: 'outsider', method: 'patch', path: () => `/api/remarks/${remarkId}`, body: { body: 'Mine' }, answer: noRemark },
  'a reviewer edits someone else’s remark': {
    who: 'reviewer',
    method: 'patch',
    path: () => `/api/remarks/${remarkId}`,
    body: { body: 'Mine now' },
    answer: { status: 403, code: 'forbidden', message: 'You can only edit your own remarks.' },
  },
  'a reviewer removes someone else’s remark': {
    who: 'reviewer',
    method: 'delete',
    path: () => `/api/remarks/${remarkId}`,
    answer: { status: 403, code: 'forbidden', message: 'You can only remove your own remarks.' },
  },
  'a reviewer asks for a review': {
    who: 'reviewer',
    method: 'post',
    path: () => `/api/designs/${designId}/versions/1/review-requests`,
    body: () => ({ reviewerIds: [fx.owner.user.id] }),
    answer: notAllowed('reviewer'),
  },
  'a viewer decides': {
    who: 'viewer',
    method: 'post',
    path: () => `/api/designs/${designId}/versions/1/decisions`,
    body: { outcome: 'signed-off', summary: 'Fine' },
    answer: notAllowed('viewer'),
  },
  'the author of a version signs it off': {
    who: 'owner',
    method: 'post',
    path: () => `/api/designs/${designId}/versions/1/decisions`,
    body: { outcome: 'signed-off', summary: 'Mine is fine' },
    answer: { status: 403, code: 'forbidden', message: 'You wrote v1; another owner or reviewer must decide on it.' },
  },
  'an outsider decides': {
    who: 'outsider',
    method: 'post',
    path: () => `/api/designs/${designId}/versions/1/decisions`,
    body: { outcome: 'signed-off', summary: 'Fine' },
    answer: noDesign,
  },
} satisfies Record<string, Case>;

const person = (who: Who): Person => fx[who];

async function answerOf({ who, method, path, body }: Case) {
  const req = person(who).agent[method](path());
  const res = await (body ? req.send(typeof body === 'function' ? body() : body) : req);
  return { status: res.status, code: res.body?.error?.code, message: res.body?.error?.message };
}

describe('the one access check answers in the same words on every route', () => {
  it.each(Object.entries(cases))('%s', async (_name, c: Case) => {
    expect(await answerOf(c)).toEqual(c.answer);
  });

  it('answers an outsider alike whether or not the version is already remembered', async () => {
    const read = cases['an outsider reads a version'];
    await fx.viewer.agent.get(read.path()).expect(200);
    await fx.viewer.agent.get(read.path()).expect(200);
    expect(await answerOf(read)).toEqual(noDesign);
  });
});
