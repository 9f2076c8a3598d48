import { z } from 'zod';
import { personSchema, versionParamsSchema } from './notebooks';

/**
 * Review comments on one version of a design. A comment may carry a decision; a bare comment has
 * `decision: null`. Owners and reviewers write them (`designs.comment`, and `designs.review` for a
 * decision); every member reads them. Share links never show them.
 */
export const reviewDecisions = ['approved', 'changes-requested'] as const;
export const reviewDecisionSchema = z.enum(reviewDecisions, {
  error: 'must be approved, changes-requested or null',
});
export type ReviewDecision = z.infer<typeof reviewDecisionSchema>;

export const reviewDecisionLabels: Record<ReviewDecision, string> = {
  approved: 'Approved',
  'changes-requested': 'Changes requested',
};

export const reviewBodyMaxLength = 4000;

export const reviewBodySchema = z
  .string({ error: 'is required' })
  .trim()
  .min(1, { error: 'is required' })
  .max(reviewBodyMaxLength, { error: `must be at most ${reviewBodyMaxLength} characters` });

export const createReviewRequestSchema = z.object({
  body: reviewBodySchema,
  decision: reviewDecisionSchema.nullable().default(null),
});
export type CreateReviewRequest = z.input<typeof createReviewRequestSchema>;

export const reviewSchema = z.object({
  id: z.string(),
  version: z.number().int().positive(),
  /** Null when the author's account was deleted. */
  author: personSchema.nullable(),
  body: z.string(),
  decision: reviewDecisionSchema.nullable(),
  createdAt: z.iso.datetime(),
});
export type Review = z.infer<typeof reviewSchema>;

/** Oldest first, so the list reads like a conversation. */
export const reviewListResponseSchema = z.object({ reviews: z.array(reviewSchema) });
export const reviewResponseSchema = z.object({ review: reviewSchema });

export const reviewParamsSchema = versionParamsSchema;
