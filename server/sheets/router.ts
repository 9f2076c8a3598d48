import type { Response } from 'express';
import type { apiContract } from '../../shared/contract/index';
import { requireUser } from '../auth/index';
import { createSheetRateLimiter, defaultRateLimits, type RateLimits } from '../auth/rate-limit';
import type { GroupImplementation } from '../http/contract';
import type { SheetFile, SheetsService } from './service';

/** Sends a finished PDF whole: the bytes exist before the first header goes out. */
function sendPdf(res: Response, file: SheetFile, options: { private: boolean }): void {
  res.set('content-type', 'application/pdf');
  res.set('content-length', String(file.bytes.length));
  res.set('cache-control', options.private ? 'private, no-store' : 'no-store');
  res.set('x-content-type-options', 'nosniff');
  res.attachment(file.fileName);
  res.end(file.bytes);
}

/**
 * Design sheets (`apiContract.sheets`). Access is checked in the notebooks module the service
 * calls. A sheet is a fraction of a second of the server's only thread, so the three routes share
 * one per-address allowance (`sheetsPerIp`; the next is a 429 `rate_limited`).
 */
export function sheetsRouter(sheets: SheetsService, rateLimits: Partial<RateLimits> = {}): GroupImplementation<typeof apiContract.sheets> {
  const use = [createSheetRateLimiter({ ...defaultRateLimits, ...rateLimits })];
  return {
    version: {
      use,
      handle: async ({ params, query }, _req, res) => {
        sendPdf(res, await sheets.version(requireUser(res), params.id, params.n, query), { private: true });
      },
    },
    compare: {
      use,
      handle: async ({ params, query }, _req, res) => {
        sendPdf(res, await sheets.compare(requireUser(res), params.id, query), { private: true });
      },
    },
    shared: {
      use,
      handle: async ({ params, query }, _req, res) => {
        res.set('referrer-policy', 'no-referrer');
        sendPdf(res, await sheets.shared(params.token, query), { private: false });
      },
    },
  };
}
