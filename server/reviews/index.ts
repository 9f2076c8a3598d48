import type { Database } from '../../db/client';
import type { Clock } from '../clock';
import { createReviewsRepository } from './repository';
import { reviewsRouter } from './router';
import { createReviewsService } from './service';

export type { ReviewsService } from './service';

export function createReviews(deps: { db: Database; clock: Clock }) {
  const service = createReviewsService({ repository: createReviewsRepository(deps.db), clock: deps.clock });
  return { service, router: reviewsRouter(service) };
}
