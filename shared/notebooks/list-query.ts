import { z } from 'zod';
import { reviewStateSchema } from '../reviews';
import { notebookSchema } from './designs';
import { tagSchema } from './fields';

export const designSorts = ['title', 'updated', 'owner'] as const;
export const designSortSchema = z.enum(designSorts, { error: 'must be title, updated or owner' });
export type DesignSort = z.infer<typeof designSortSchema>;

export const maxPageSize = 100;
export const maxPage = 1_000_000;

/**
 * `GET /api/teams/:teamId/designs?q=&tag=&sort=&dir=&page=&pageSize=&archived=&review=`. Designs with a
 * baseline always come first; `sort` orders within each group. `dir` defaults to ascending for
 * title and owner, descending (newest first) for updated.
 */
export const listDesignsQuerySchema = z.object({
  /** Matches anywhere in the title, case-insensitive. */
  q: z.string().trim().max(120, { error: 'must be at most 120 characters' }).optional(),
  tag: tagSchema.optional(),
  sort: designSortSchema.default('updated'),
  dir: z.enum(['asc', 'desc'], { error: 'must be asc or desc' }).optional(),
  page: z.coerce
    .number({ error: 'must be a number' })
    .int({ error: `must be a whole number from 1 to ${maxPage}` })
    .min(1, { error: 'must be at least 1' })
    // Far past any real list, well inside the database's OFFSET range.
    .max(maxPage, { error: `must be at most ${maxPage}` })
    .default(1),
  pageSize: z.coerce
    .number({ error: 'must be a number' })
    .int({ error: 'must be a whole number' })
    .min(1, { error: 'must be at least 1' })
    .max(maxPageSize, { error: `must be at most ${maxPageSize}` })
    .default(20),
  /** `only`: the archived ones; `include`: both; default: the live ones. */
  archived: z
    .enum(['exclude', 'include', 'only'], { error: 'must be exclude, include or only' })
    .default('exclude'),
  /** Only designs whose latest version is in this review state. */
  review: reviewStateSchema.optional(),
});
export type ListDesignsQuery = z.input<typeof listDesignsQuerySchema>;

export const designListResponseSchema = z.object({
  designs: z.array(notebookSchema),
  total: z.number().int().nonnegative(),
  page: z.number().int().positive(),
  pageSize: z.number().int().positive(),
  /** Every tag used in the team (for the filter), sorted. */
  tags: z.array(z.string()),
});
export type DesignListResponse = z.infer<typeof designListResponseSchema>;
