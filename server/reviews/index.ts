import type { Database } from '../../db/client';
import type { Clock } from '../clock';
import type { ReviewNotifier } from './events';
import { createReviewsRepository } from './repository';
import { reviewsRouter } from './router';
import { createReviewsService, type ReviewLists } from './service';

export type { ReviewsService, ReviewLists } from './service';
export { reviewStateSql } from './repository';

/**
 * Design review: threads, requests and decisions. `notifier` is the inbox (it hears of each
 * committed write); `lists` is the notebooks' door for forgetting a team's remembered list pages,
 * which show each design's latest review state.
 */
export function createReviews(deps: {
  db: Database;
  clock: Clock;
  notifier: ReviewNotifier;
  lists: ReviewLists;
  log?: (error: unknown) => void;
}) {
  const service = createReviewsService({ repository: createReviewsRepository(deps.db), ...deps });
  return { service, router: reviewsRouter(service) };
}
