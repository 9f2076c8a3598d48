import type { apiContract } from '../../shared/contract/index';
import { runSearch, searchRequestIssues } from '../../features/search/index';
import { createSearchRateLimiter, defaultRateLimits, type RateLimits } from '../auth/rate-limit';
import type { Implementation } from '../http/contract';
import { badRequest } from '../http/errors';

/**
 * `POST /api/search`: the candidate search for scripts, no sign-in needed; the same engine the
 * workbench runs in a Web Worker. It runs on the server's only thread, so its work is bounded:
 * the body's lists are checked by the shared schema (at most 40 values each), the candidate
 * count (the product of the lists' lengths, at most `SEARCH_LIMITS.maxCandidates`) and values
 * that make no design are refused with a 400 naming the field before any work starts, and each
 * address may search `searchPerIp` times a minute (then 429 `rate_limited`).
 */
export function searchRoute(rateLimits: Partial<RateLimits> = {}): Implementation<typeof apiContract.search.run> {
  return {
    use: [createSearchRateLimiter({ ...defaultRateLimits, ...rateLimits })],
    handle: ({ body }) => {
      const issues = searchRequestIssues(body);
      if (Object.keys(issues).length > 0) throw badRequest('The request body has invalid fields.', issues);
      return runSearch(body);
    },
  };
}
