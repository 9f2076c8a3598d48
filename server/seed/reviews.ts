import { randomUUID } from 'node:crypto';
import type { DatabaseHandle } from '../../db/client';
import type { Pin } from '../../shared/reviews';
import { createReviewsRepository } from '../reviews/repository';
import { valueAt } from '../reviews/service';

const hourMs = 60 * 60_000;

type Person = { id: string; displayName: string };

/**
 * The demo's design review on the teaching-lab scanner, in invented words: the reviewer's thread
 * pinned to v1's exit slit, still open, so v2 and v3 show it as "field changed since v1"; the
 * reviewer's sign-off of v2 (the baseline), which v3 names as the earlier sign-off; and the
 * owner's request that the reviewer look at v3.
 */
export async function seedDemoReview(
  database: DatabaseHandle,
  design: { id: string; versions: { params: unknown; createdAt: Date }[] },
  owner: Person,
  reviewer: Person,
) {
  const reviews = createReviewsRepository(database.db);
  const [v1, v2, v3] = design.versions;
  if (!v1 || !v2 || !v3) return;
  const after = (version: { createdAt: Date }, hours: number) => new Date(version.createdAt.getTime() + hours * hourMs);

  const pin: Pin = { kind: 'field', path: 'slits.exitWidthUm' };
  const threadId = randomUUID();
  await reviews.insertThread(
    {
      id: threadId,
      designId: design.id,
      versionNumber: 1,
      pin,
      pinnedValue: valueAt(v1.params, pin.path),
      status: 'open',
      createdBy: reviewer.id,
      createdByName: reviewer.displayName,
      createdAt: after(v1, 2),
    },
    {
      id: randomUUID(),
      threadId,
      authorId: reviewer.id,
      authorName: reviewer.displayName,
      body: 'At 100 µm the bandpass is about 0.27 nm, wider than the 0.2 nm the line-lamp exercise asks for. Could the exit slit come down before the students use it?',
      mentions: [owner.id],
      createdAt: after(v1, 2),
    },
  );
  await reviews.insertRemark({
    id: randomUUID(),
    threadId,
    authorId: owner.id,
    authorName: owner.displayName,
    body: 'Halved in v2. Leaving this open until we have tried it on the bench.',
    mentions: [],
    createdAt: after(v2, 1),
  });
  await reviews.insertDecision({
    id: randomUUID(),
    designId: design.id,
    versionNumber: 2,
    reviewerId: reviewer.id,
    reviewerName: reviewer.displayName,
    outcome: 'signed-off',
    summary: 'Good starting point for the students: the doublet separates at 50 µm and the lamp is bright enough.',
    createdAt: after(v2, 20),
  });
  await reviews.upsertRequests([
    {
      id: randomUUID(),
      designId: design.id,
      versionNumber: 3,
      requestedBy: owner.id,
      reviewerId: reviewer.id,
      dueDate: null,
      note: 'Is the wider range worth the bandpass?',
      createdAt: after(v3, 1),
    },
  ]);
}
