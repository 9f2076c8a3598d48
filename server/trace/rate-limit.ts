import type { RequestHandler } from 'express';
import { ipKeyGenerator, rateLimit } from 'express-rate-limit';
import { tooManyRequests } from '../auth/errors';
import { defaultRateLimits, type RateLimits } from '../auth/rate-limit';

/** `POST /api/trace` per IP (`tracePerIp`): its own counters, apart from solving, searching and signing in. */
export function createTraceRateLimiter(limits: Partial<RateLimits> = {}): RequestHandler {
  return rateLimit({
    windowMs: limits.solveWindowMs ?? defaultRateLimits.solveWindowMs,
    limit: limits.tracePerIp ?? defaultRateLimits.tracePerIp,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    keyGenerator: (req) => `ip:${ipKeyGenerator(req.ip ?? '')}`,
    handler: (_req, _res, next) => next(tooManyRequests('Too many traces from this address. Wait a minute and try again.')),
  });
}
