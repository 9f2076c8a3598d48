import type { Request, RequestHandler } from 'express';
import { ipKeyGenerator, rateLimit } from 'express-rate-limit';
import type { CounterStores } from './counter-store';
import { tooManyRequests } from './errors';

export type RateLimits = {
  windowMs: number;
  /** Every sign-in attempt from one address, right or wrong. */
  signInPerIp: number;
  /** Failed sign-ins for one e-mail from one address: guessing one account's password. */
  signInFailuresPerEmailPerIp: number;
  /** Failed sign-ins from one address, whatever the e-mail: guessing across accounts. */
  signInFailuresPerIp: number;
  signUpPerIp: number;
  resetPerIp: number;
  resetPerEmail: number;
  /** `POST /api/solve` calls per IP per `solveWindowMs`. */
  solvePerIp: number;
  solveWindowMs: number;
  /** Design sheets (PDFs) per IP per `solveWindowMs`, all three routes together. */
  sheetsPerIp: number;
  /** `POST /api/search` calls per IP per `solveWindowMs`. */
  searchPerIp: number;
  /** `POST /api/selectors` calls per IP per `solveWindowMs`. */
  selectorsPerIp: number;
  /** Curve file previews and uploads together per IP per `solveWindowMs`. */
  curveUploadsPerIp: number;
  /** `POST /api/trace` calls per IP per `solveWindowMs`. */
  tracePerIp: number;
  /**
   * Where the counts live: this process's memory when left out (the embedded database, one
   * process), or the database (`databaseCounterStores`) when several API processes share a
   * PostgreSQL server. Set by createApp.
   */
  counters?: CounterStores;
};

/** Generous for people, tight for scripts guessing passwords (common practice: a few per minute). */
export const defaultRateLimits: RateLimits = {
  windowMs: 15 * 60_000,
  signInPerIp: 100,
  signInFailuresPerEmailPerIp: 10,
  signInFailuresPerIp: 30,
  signUpPerIp: 20,
  resetPerIp: 20,
  resetPerEmail: 5,
  // A person at the workbench never calls the API (the solver runs in the page) and a lab script
  // sweeping designs rarely needs two calls a second. The largest request takes under 0.1 s of the
  // thread (`npm run bench:solver`), so one address holds it for at most ~10 s a minute.
  solvePerIp: 120,
  solveWindowMs: 60_000,
  // A sheet takes ~0.13 s of the thread (`npm run bench:sheet`, up to ~0.6 s for the first of a
  // process): 60 a minute holds it for well under half of each minute, and nobody reads one a second.
  sheetsPerIp: 60,
  // The largest search the cap allows (about 40,000 candidates once blazes past 2d are left out,
  // every requirement, footprint included) holds the thread for about 0.35 s (`npm run
  // bench:search`; over a second the first time in a process): 20 a minute keeps one address to a
  // small share of each minute, and a script refining requirements rarely searches more often.
  searchPerIp: 20,
  // One selector call evaluates at most 1,000 wavelengths through closed forms (SELECTOR_LIMITS), a
  // small fraction of the thread, so 60 a minute (a script sweeping parameters once a second) is safe.
  selectorsPerIp: 60,
  // A curve file is at most 2 MB held in memory and read once. Measured on a shared 2-core machine
  // (medians of 7): a 2 MB file of 5,000 wide rows takes ~115 ms of the thread (up to ~270 ms), 2 MB
  // of short rows refused by their count ~90 ms, an ordinary 5,000-point file ~26 ms. A person
  // previews, corrects a unit and uploads a handful a minute; 20 a minute keeps one address to a
  // few seconds of the thread and 40 MB read a minute at worst.
  curveUploadsPerIp: 20,
  // The largest trace (50,000 rays at each of 11 wavelengths, 1.75 × that with the spots) holds the
  // thread for 0.7–1.4 s on a shared 2-core machine under load (median 0.9 s of 7; the default
  // 4,000 rays at 3 wavelengths, 45–75 ms): 10 a minute keeps one address to about the solver's
  // share of each minute, and a lab script rarely traces more often.
  tracePerIp: 10,
};

type KeyBy = 'ip' | 'email' | 'email-and-ip';

const ipOf = (req: Request) => ipKeyGenerator(req.ip ?? '');

function emailOf(req: Request): string {
  const email: unknown = (req.body as { email?: unknown } | undefined)?.email;
  return typeof email === 'string' ? email.trim().toLowerCase() : '';
}

const keys: Record<KeyBy, (req: Request) => string> = {
  ip: (req) => `ip:${ipOf(req)}`,
  email: (req) => `email:${emailOf(req)}`,
  'email-and-ip': (req) => `email+ip:${ipOf(req)}:${emailOf(req)}`,
};

/** One limit: `name` keeps its counts apart from every other limit's in a shared store. */
export function limiter({
  name,
  limit,
  windowMs,
  by,
  skipSuccessfulRequests = false,
  message,
  counters,
}: {
  name: string;
  limit: number;
  windowMs: number;
  by: KeyBy;
  skipSuccessfulRequests?: boolean;
  message?: string;
  counters: CounterStores | undefined;
}): RequestHandler {
  return rateLimit({
    windowMs,
    limit,
    ...(counters ? { store: counters(name) } : {}),
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    skipSuccessfulRequests,
    keyGenerator: keys[by],
    handler: (_req, _res, next) => next(tooManyRequests(message)),
  });
}

/**
 * Counters per app, in memory unless `limits.counters` says where else. Sign-in failures are
 * counted per e-mail *and address*, and per address: someone guessing from elsewhere uses up their
 * own allowance, never the account owner's, so nobody can lock a colleague out by failing on
 * purpose. Successes are not counted, so a person who signs in often is never limited by them.
 */
export function createRateLimiters(limits: RateLimits) {
  const { windowMs, counters } = limits;
  return {
    signIn: [
      limiter({ name: 'sign-in', limit: limits.signInPerIp, windowMs, by: 'ip', counters }),
      limiter({ name: 'sign-in-failures', limit: limits.signInFailuresPerIp, windowMs, by: 'ip', skipSuccessfulRequests: true, counters }),
      limiter({
        name: 'sign-in-failures-per-email',
        limit: limits.signInFailuresPerEmailPerIp,
        windowMs,
        by: 'email-and-ip',
        skipSuccessfulRequests: true,
        counters,
      }),
    ],
    signUp: [limiter({ name: 'sign-up', limit: limits.signUpPerIp, windowMs, by: 'ip', counters })],
    reset: [
      limiter({ name: 'reset', limit: limits.resetPerIp, windowMs, by: 'ip', counters }),
      limiter({ name: 'reset-per-email', limit: limits.resetPerEmail, windowMs, by: 'email', counters }),
    ],
    /** Following a reset link carries a token, not an e-mail: per IP only. */
    resetConfirm: [limiter({ name: 'reset-confirm', limit: limits.resetPerIp, windowMs, by: 'ip', counters })],
    /** Each resend is an e-mail we send: as few as reset requests. */
    resendConfirmation: [limiter({ name: 'resend-confirmation', limit: limits.resetPerIp, windowMs, by: 'ip', counters })],
  };
}

/** `POST /api/solve` per IP: its own counters, so solving never uses up a person's sign-in allowance. */
export function createSolveRateLimiter(
  limits: Pick<RateLimits, 'solvePerIp' | 'solveWindowMs' | 'counters'>,
): RequestHandler {
  return limiter({
    name: 'solve',
    limit: limits.solvePerIp,
    windowMs: limits.solveWindowMs,
    by: 'ip',
    message: 'Too many solve requests from this address. Wait a minute and try again.',
    counters: limits.counters,
  });
}

/** Design sheets per IP (the share link's route needs no session): one counter for the three routes. */
export function createSheetRateLimiter(limits: Pick<RateLimits, 'sheetsPerIp' | 'solveWindowMs' | 'counters'>): RequestHandler {
  return limiter({
    name: 'sheets',
    limit: limits.sheetsPerIp,
    windowMs: limits.solveWindowMs,
    by: 'ip',
    message: 'Too many design sheets from this address. Wait a minute and try again.',
    counters: limits.counters,
  });
}

/** `POST /api/search` per IP: its own counters, apart from solving and signing in. */
export function createSearchRateLimiter(limits: Pick<RateLimits, 'searchPerIp' | 'solveWindowMs' | 'counters'>): RequestHandler {
  return limiter({
    name: 'search',
    limit: limits.searchPerIp,
    windowMs: limits.solveWindowMs,
    by: 'ip',
    message: 'Too many searches from this address. Wait a minute and try again.',
    counters: limits.counters,
  });
}

/** `POST /api/selectors` per IP: its own counters, apart from solving and searching. */
export function createSelectorsRateLimiter(limits: Pick<RateLimits, 'selectorsPerIp' | 'solveWindowMs' | 'counters'>): RequestHandler {
  return limiter({
    name: 'selectors',
    limit: limits.selectorsPerIp,
    windowMs: limits.solveWindowMs,
    by: 'ip',
    message: 'Too many selector calculations from this address. Wait a minute and try again.',
    counters: limits.counters,
  });
}

/** Curve file previews and uploads per IP, one counter for both: each holds up to 2 MB in memory while it is read. */
export function createCurveUploadRateLimiter(limits: Pick<RateLimits, 'curveUploadsPerIp' | 'solveWindowMs' | 'counters'>): RequestHandler {
  return limiter({
    name: 'curve-uploads',
    limit: limits.curveUploadsPerIp,
    windowMs: limits.solveWindowMs,
    by: 'ip',
    message: 'Too many curve files from this address. Wait a minute and try again.',
    counters: limits.counters,
  });
}
