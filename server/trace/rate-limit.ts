import type { RequestHandler } from 'express';
import { defaultRateLimits, limiter, type RateLimits } from '../auth/rate-limit';

/** `POST /api/trace` per IP (`tracePerIp`): its own counters, apart from solving, searching and signing in. */
export function createTraceRateLimiter(limits: Partial<RateLimits> = {}): RequestHandler {
  return limiter({
    name: 'trace',
    limit: limits.tracePerIp ?? defaultRateLimits.tracePerIp,
    windowMs: limits.solveWindowMs ?? defaultRateLimits.solveWindowMs,
    by: 'ip',
    message: 'Too many traces from this address. Wait a minute and try again.',
    counters: limits.counters,
  });
}
