import type { Request, RequestHandler } from 'express';
import { ipKeyGenerator, rateLimit } from 'express-rate-limit';
import { tooManyRequests } from './errors';

export type RateLimits = {
  windowMs: number;
  signInPerIp: number;
  signInPerEmail: number;
  signUpPerIp: number;
  resetPerIp: number;
  resetPerEmail: number;
};

/** Generous for people, tight for scripts guessing passwords (common practice: a few per minute). */
export const defaultRateLimits: RateLimits = {
  windowMs: 15 * 60_000,
  signInPerIp: 100,
  signInPerEmail: 10,
  signUpPerIp: 20,
  resetPerIp: 20,
  resetPerEmail: 5,
};

function emailKey(req: Request): string {
  const email: unknown = (req.body as { email?: unknown } | undefined)?.email;
  return `email:${typeof email === 'string' ? email.trim().toLowerCase() : ''}`;
}

function limiter(limit: number, windowMs: number, by: 'ip' | 'email', skipSuccessfulRequests = false): RequestHandler {
  return rateLimit({
    windowMs,
    limit,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    skipSuccessfulRequests,
    keyGenerator: by === 'ip' ? (req) => `ip:${ipKeyGenerator(req.ip ?? '')}` : emailKey,
    handler: (_req, _res, next) => next(tooManyRequests()),
  });
}

/**
 * In-memory counters, one set per app: enough for one server process. Sign-in counts only
 * failures per e-mail, so a person who signs in often is never locked out by their successes.
 */
export function createRateLimiters(limits: RateLimits) {
  return {
    signIn: [
      limiter(limits.signInPerIp, limits.windowMs, 'ip'),
      limiter(limits.signInPerEmail, limits.windowMs, 'email', true),
    ],
    signUp: [limiter(limits.signUpPerIp, limits.windowMs, 'ip')],
    reset: [limiter(limits.resetPerIp, limits.windowMs, 'ip'), limiter(limits.resetPerEmail, limits.windowMs, 'email')],
    /** Following a reset link carries a token, not an e-mail: per IP only. */
    resetConfirm: [limiter(limits.resetPerIp, limits.windowMs, 'ip')],
  };
}
