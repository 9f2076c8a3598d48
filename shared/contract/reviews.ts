import { createReviewRequestSchema, reviewListResponseSchema, reviewParamsSchema, reviewResponseSchema } from '../reviews';
import { route } from './route';

const tag = 'Reviews';

/** Review comments on a version: members read them; owners and reviewers comment and decide. */
export const reviews = {
  list: route({
    tag,
    method: 'GET',
    path: '/designs/{id}/versions/{n}/reviews',
    summary: "A version's reviews, oldest first",
    access: { kind: 'team', capability: 'designs.read' },
    params: reviewParamsSchema,
    output: reviewListResponseSchema,
  }),
  create: route({
    tag,
    method: 'POST',
    path: '/designs/{id}/versions/{n}/reviews',
    summary: 'Comment on a version, with an optional decision',
    status: 201,
    access: { kind: 'team', capability: 'designs.comment' },
    params: reviewParamsSchema,
    body: createReviewRequestSchema,
    output: reviewResponseSchema,
  }),
};
