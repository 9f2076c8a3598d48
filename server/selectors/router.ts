import type { apiContract } from '../../shared/contract/index';
import { runSelector } from '../../features/solver/selectors';
import { createSelectorsRateLimiter, defaultRateLimits, type RateLimits } from '../auth/rate-limit';
import type { Implementation } from '../http/contract';

/**
 * `POST /api/selectors`: the interference-filter, absorption-stack and prism calculators for
 * scripts, no sign-in needed; the same `runSelector` the selectors screens and the selectors
 * script call. Every list in the body is bounded by the shared schema (SELECTOR_LIMITS), which
 * refuses a bad field with a 400 naming it before any work; each address may call
 * `selectorsPerIp` times a minute (then 429 `rate_limited`).
 */
export function selectorsRoute(rateLimits: Partial<RateLimits> = {}): Implementation<typeof apiContract.selectors.run> {
  return {
    use: [createSelectorsRateLimiter({ ...defaultRateLimits, ...rateLimits })],
    handle: ({ body }) => runSelector(body),
  };
}
