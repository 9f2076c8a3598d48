import type { RequestHandler } from 'express';
import { ipKeyGenerator, rateLimit } from 'express-rate-limit';
import { tooManyRequests } from '../auth/errors';
import { defaultRateLimits, type RateLimits } from '../auth/rate-limit';

/**
 * `POST /api/trace` calls per IP per `solveWindowMs`. The largest request traces 50,000 rays at
 * each of 11 wavelengths (8 asked for and the range's start, centre and end; 1.75 × that with the
 * spots): measured on this shared 2-core machine under a load of 8, 0.7–1.4 s of the thread (median
 * 0.9 s of 7; the default 4,000 rays at 3 wavelengths, 45–75 ms). 10 a minute holds one address to
 * about the solver's share of each minute (120 × < 0.1 s), and a lab script rarely traces more often.
 */
export const TRACE_PER_IP = 10;

/**
 * The limits the trace route reads: the app's (`AppDeps.rateLimits`) and its own `tracePerIp`,
 * which tests set to let a fuzzer through. Kept beside the route until `RateLimits` holds it.
 */
export type TraceRateLimits = Partial<RateLimits> & { tracePerIp?: number };

/** `POST /api/trace` per IP: its own counters, apart from solving, searching and signing in. */
export function createTraceRateLimiter(limits: TraceRateLimits = {}): RequestHandler {
  return rateLimit({
    windowMs: limits.solveWindowMs ?? defaultRateLimits.solveWindowMs,
    limit: limits.tracePerIp ?? TRACE_PER_IP,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    keyGenerator: (req) => `ip:${ipKeyGenerator(req.ip ?? '')}`,
    handler: (_req, _res, next) => next(tooManyRequests('Too many traces from this address. Wait a minute and try again.')),
  });
}
