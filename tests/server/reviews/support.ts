import {
  decisionResponseSchema,
  reviewRequestListResponseSchema,
  reviewStatesResponseSchema,
  threadResponseSchema,
  versionReviewResponseSchema,
  type Pin,
} from '../../../shared/reviews';
import type { NotebookFixture, Person } from '../notebooks/fixture';

export const reviewPath = (designId: string, n: number) => `/api/designs/${designId}/versions/${n}/review`;
export const threadsPath = (designId: string, n: number) => `/api/designs/${designId}/versions/${n}/threads`;
export const threadPath = (threadId: string) => `/api/threads/${threadId}`;
export const remarkPath = (remarkId: string) => `/api/remarks/${remarkId}`;
export const requestsPath = (designId: string, n: number) => `/api/designs/${designId}/versions/${n}/review-requests`;
export const decisionsPath = (designId: string, n: number) => `/api/designs/${designId}/versions/${n}/decisions`;
export const statesPath = (designId: string) => `/api/designs/${designId}/review-states`;

export const exitSlit: Pin = { kind: 'field', path: 'slits.exitWidthUm' };

/** Starts a thread and answers it (expects 201). */
export async function startThread(
  person: Person,
  designId: string,
  n: number,
  pin: Pin = exitSlit,
  body = 'Too wide for the 0.2 nm requirement.',
  mentions: string[] = [],
) {
  const res = await person.agent.post(threadsPath(designId, n)).send({ pin, body, mentions }).expect(201);
  return threadResponseSchema.parse(res.body).thread;
}

export async function getReview(person: Person, designId: string, n: number) {
  return versionReviewResponseSchema.parse((await person.agent.get(reviewPath(designId, n)).expect(200)).body);
}

export async function getThread(person: Person, threadId: string) {
  return threadResponseSchema.parse((await person.agent.get(threadPath(threadId)).expect(200)).body).thread;
}

export async function setStatus(person: Person, threadId: string, status: 'open' | 'resolved') {
  const res = await person.agent.put(`${threadPath(threadId)}/status`).send({ status }).expect(200);
  return threadResponseSchema.parse(res.body).thread;
}

export async function decide(person: Person, designId: string, n: number, outcome: string, summary = 'Checked.') {
  const res = await person.agent.post(decisionsPath(designId, n)).send({ outcome, summary }).expect(201);
  return decisionResponseSchema.parse(res.body).decision;
}

export async function requestReview(person: Person, designId: string, n: number, body: object) {
  const res = await person.agent.post(requestsPath(designId, n)).send(body).expect(201);
  return reviewRequestListResponseSchema.parse(res.body).requests;
}

export async function states(person: Person, designId: string) {
  return reviewStatesResponseSchema.parse((await person.agent.get(statesPath(designId)).expect(200)).body).versions;
}

/** A version saved by someone other than the fixture's owner, so the owner may decide on it. */
export async function saveAs(fx: NotebookFixture, person: Person, designId: string, baseVersion: number, params: object, message = 'Change') {
  return person.agent
    .post(`/api/designs/${designId}/versions`)
    .send({ baseVersion, params, notes: '', message })
    .expect(201);
}
