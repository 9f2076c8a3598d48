import type { apiContract } from '../../shared/contract/index';
import type { Implementation } from '../http/contract';
import { traceAnswer } from './answer';
import type { RateLimits } from '../auth/rate-limit';
import { createTraceRateLimiter } from './rate-limit';

/**
 * `POST /api/trace`: the exact ray trace for scripts, no sign-in needed; the engine the workbench
 * runs in a Web Worker. It runs on the server's only thread, so its work is bounded as the
 * solver's is: the body is at most 1 MB (`bodyLimit`, else 413), the shared schema refuses more
 * than `TRACE_LIMITS.maxRays` rays or `maxWavelengths` wavelengths (and a bad design) with a 400
 * naming the field before any ray is traced, and each address may trace `tracePerIp` times a
 * minute (then 429 `rate_limited`).
 */
export function traceRoute(rateLimits: Partial<RateLimits> = {}): Implementation<typeof apiContract.trace.run> {
  return {
    use: [createTraceRateLimiter(rateLimits)],
    handle: ({ body }) => traceAnswer(body),
  };
}
