import type { apiContract } from '../../shared/contract/index';
import { evaluateDesign } from '../../features/solver/index';
import { createSolveRateLimiter, defaultRateLimits, type RateLimits } from '../auth/rate-limit';
import type { Implementation } from '../http/contract';

/**
 * `POST /api/solve`: the solver for scripts and other tools, no sign-in needed. It runs the same
 * module as the client, so a script and the workbench never disagree.
 *
 * It runs on the server's only thread, so one call's work and answer are bounded:
 * - `at`: at most 1,000 wavelengths; `points`: 2 to 1,000 (`MAX_SOLVE_WAVELENGTHS`). More is a 400
 *   naming the field (`at: must list at most 1000 wavelengths`), before each item is checked.
 * - each wavelength lists at most 20 overlapping orders (`MAX_LISTED_OVERLAPS`, the ones nearest
 *   the working order), with `overlapCount` the full number and `overlapsTruncated: true` when cut.
 * - so the largest answer is under 2.5 MB of JSON (2.05 MB for order −1000, 1,000 wavelengths and a
 *   0.001 nm–10 mm source; about 0.35 MB gzipped for clients that accept it) and under 0.1 s of
 *   the thread (`npm run bench:solver` prints it).
 * - 120 calls per minute per IP (`solvePerIp`, `solveWindowMs`); the next is a 429 `rate_limited`.
 */
export function solveRoute(rateLimits: Partial<RateLimits> = {}): Implementation<typeof apiContract.platform.solve> {
  return {
    use: [createSolveRateLimiter({ ...defaultRateLimits, ...rateLimits })],
    handle: ({ body }) => evaluateDesign(body.design, { wavelengthsNm: body.at, points: body.points }),
  };
}
