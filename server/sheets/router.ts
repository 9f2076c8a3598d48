import type { Response } from 'express';
import type { apiContract } from '../../shared/contract/index';
import { requireUser } from '../auth/index';
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

/** Design sheets (`apiContract.sheets`). Access is checked in the notebooks module the service calls. */
export function sheetsRouter(sheets: SheetsService): GroupImplementation<typeof apiContract.sheets> {
  return {
    version: async ({ params, query }, _req, res) => {
      sendPdf(res, await sheets.version(requireUser(res), params.id, params.n, query), { private: true });
    },
    compare: async ({ params, query }, _req, res) => {
      sendPdf(res, await sheets.compare(requireUser(res), params.id, query), { private: true });
    },
    shared: async ({ params, query }, _req, res) => {
      res.set('referrer-policy', 'no-referrer');
      sendPdf(res, await sheets.shared(params.token, query), { private: false });
    },
  };
}
