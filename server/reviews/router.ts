import type { apiContract } from '../../shared/contract/index';
import { requireUser } from '../auth/index';
import type { GroupImplementation } from '../http/contract';
import type { ReviewsService } from './service';

/** Review comments on a version (`apiContract.reviews`). Roles are checked in the service; this only translates HTTP. */
export function reviewsRouter(reviews: ReviewsService): GroupImplementation<typeof apiContract.reviews> {
  return {
    list: async ({ params }, _req, res) => ({ reviews: await reviews.list(requireUser(res), params.id, params.n) }),
    create: async ({ params, body }, _req, res) => ({ review: await reviews.create(requireUser(res), params.id, params.n, body) }),
  };
}
