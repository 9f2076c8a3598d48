import { Router } from 'express';
import { evaluateDesign } from '../../features/solver/index';
import { solveRequestSchema } from '../../shared/design';
import { handle } from '../http/validate';

/**
 * `POST /api/solve`: the solver for scripts and other tools, no sign-in needed. It runs the same
 * module as the client, so a script and the workbench never disagree.
 */
export function solveRouter() {
  const router = Router();
  router.post(
    '/solve',
    handle({ body: solveRequestSchema }, ({ body }) =>
      evaluateDesign(body.design, { wavelengthsNm: body.at, points: body.points }),
    ),
  );
  return router;
}
