import { Router } from 'express';
import { createReviewRequestSchema, reviewParamsSchema } from '../../shared/reviews';
import { requireUser, signedIn } from '../auth/index';
import { handle } from '../http/validate';
import type { ReviewsService } from './service';

/** Review comments on a version. Roles are checked in the service; this only translates HTTP. */
export function reviewsRouter(reviews: ReviewsService) {
  const router = Router();

  router.get(
    '/designs/:id/versions/:n/reviews',
    signedIn,
    handle({ params: reviewParamsSchema }, async ({ params }, _req, res) => ({
      reviews: await reviews.list(requireUser(res), params.id, params.n),
    })),
  );
  router.post(
    '/designs/:id/versions/:n/reviews',
    signedIn,
    handle({ params: reviewParamsSchema, body: createReviewRequestSchema }, async ({ params, body }, _req, res) => {
      const review = await reviews.create(requireUser(res), params.id, params.n, body);
      res.status(201);
      return { review };
    }),
  );

  return router;
}
