import type { RequestHandler } from 'express';
import type { apiContract } from '../../shared/contract/index';
import { requireUser } from '../auth/index';
import type { GroupImplementation } from '../http/contract';
import type { TeamAccess } from '../teams/index';
import type { CurvesService } from './service';
import { curveUpload } from './upload';

/**
 * `apiContract.curves`; only translates HTTP. The uploads are limited per address and read their
 * multipart body in memory; a team upload checks the caller's role before reading a byte of it, so
 * nobody who may not add curves can make the server buffer 2 MB (the service checks again).
 */
export function curvesRouter(service: CurvesService, deps: { access: TeamAccess; rateLimit: RequestHandler }): GroupImplementation<typeof apiContract.curves> {
  const readBody = curveUpload();
  const mayManage: RequestHandler = (req, res, next) => {
    deps.access
      .require(String(req.params.teamId), requireUser(res).id, 'curves.manage')
      .then(() => next(), next);
  };
  return {
    preview: { use: [deps.rateLimit, readBody], handle: ({ body }) => service.preview(body) },
    upload: {
      use: [deps.rateLimit, mayManage, readBody],
      handle: async ({ params, body }, _req, res) => {
        const answer = await service.upload(params.teamId, requireUser(res), body);
        // The contract's 201 is for a new curve; a recognised one was already there.
        if (answer.recognised) res.status(200);
        return answer;
      },
    },
    list: ({ params }, _req, res) => service.list(params.teamId, requireUser(res)),
    get: ({ params }, _req, res) => service.get(params.teamId, params.curveId, requireUser(res)),
    remove: ({ params }, _req, res) => service.remove(params.teamId, params.curveId, requireUser(res)),
  };
}
