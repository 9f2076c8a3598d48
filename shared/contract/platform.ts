import { z } from 'zod';
import { solveRequestSchema } from '../design';
import { healthSchema } from '../health';
import { outboxResponseSchema } from '../outbox';
import { MAX_LISTED_OVERLAPS, MAX_SOLVE_WAVELENGTHS } from '../solve-limits';
import { solveResponseSchema } from '../solve';
import { route } from './route';

/** The solver for scripts, the health check, this document, and the local mail outbox. */
export const platform = {
  solve: route({
    tag: 'Solver',
    method: 'POST',
    path: '/solve',
    summary: 'Evaluate a design at chosen wavelengths (the same solver the workbench runs)',
    description:
      `No sign-in and no Origin header needed. At most ${MAX_SOLVE_WAVELENGTHS} wavelengths in \`at\` or \`points\`; ` +
      `each wavelength lists at most ${MAX_LISTED_OVERLAPS} overlapping orders (\`overlapCount\` is the full number, ` +
      '`overlapsTruncated` says when the list was cut). 120 calls a minute per address, then 429 `rate_limited`.',
    access: { kind: 'anyone' },
    originExempt: true,
    body: solveRequestSchema,
    output: solveResponseSchema,
  }),
  health: route({
    tag: 'Service',
    method: 'GET',
    path: '/health',
    summary: 'Is the server up, which build, does its database answer (503 with status "degraded" when not)',
    access: { kind: 'anyone' },
    output: healthSchema,
  }),
  openapi: route({
    tag: 'Service',
    method: 'GET',
    path: '/openapi.json',
    summary: 'This document: every route of the API as OpenAPI 3.1',
    access: { kind: 'anyone' },
    output: z.looseObject({ openapi: z.string(), paths: z.record(z.string(), z.unknown()) }),
  }),
  outbox: route({
    tag: 'Service',
    method: 'GET',
    path: '/dev/outbox',
    summary: 'Mail the local fake mailer kept (development only; answered over loopback only)',
    access: { kind: 'local' },
    output: outboxResponseSchema,
  }),
};
