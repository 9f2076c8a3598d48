import type { RequestHandler } from 'express';
import { ipKeyGenerator, rateLimit } from 'express-rate-limit';
import type { apiContract } from '../../shared/contract/index';
import { runSelector } from '../../features/solver/selectors';
import { tooManyRequests } from '../auth/errors';
import { defaultRateLimits, type RateLimits } from '../auth/rate-limit';
import type { Implementation } from '../http/contract';

/** `POST /api/selectors` calls per address per `solveWindowMs`, apart from solving and searching. */
export type SelectorRateLimits = Pick<RateLimits, 'solveWindowMs'> & { selectorsPerIp: number };

// One call evaluates at most 1,000 wavelengths through closed forms (SELECTOR_LIMITS), a small
// fraction of the thread's time, so 60 a minute (one a second, the pace of a script sweeping
// parameters) holds the thread for very little of each minute.
export const defaultSelectorsPerIp = 60;

/** Per address, with its own counters, like the solve and search limiters in ../auth/rate-limit.ts. */
export function createSelectorsRateLimiter(limits: SelectorRateLimits): RequestHandler {
  return rateLimit({
    windowMs: limits.solveWindowMs,
    limit: limits.selectorsPerIp,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    keyGenerator: (req) => `ip:${ipKeyGenerator(req.ip ?? '')}`,
    handler: (_req, _res, next) => next(tooManyRequests('Too many selector calculations from this address. Wait a minute and try again.')),
  });
}

/**
 * `POST /api/selectors`: the interference-filter, absorption-stack and prism calculators for
 * scripts, no sign-in needed; the same `runSelector` the selectors screens and the selectors
 * script call. Every list in the body is bounded by the shared schema (SELECTOR_LIMITS), which
 * refuses a bad field with a 400 naming it before any work; each address may call
 * `selectorsPerIp` times a minute (then 429 `rate_limited`).
 */
export function selectorsRoute(
  rateLimits: Partial<SelectorRateLimits> = {},
): Implementation<typeof apiContract.selectors.run> {
  return {
    use: [
      createSelectorsRateLimiter({
        solveWindowMs: rateLimits.solveWindowMs ?? defaultRateLimits.solveWindowMs,
        selectorsPerIp: rateLimits.selectorsPerIp ?? defaultSelectorsPerIp,
      }),
    ],
    handle: ({ body }) => runSelector(body),
  };
}
