import { oc, type ContractProcedure } from '@orpc/contract';
import { z } from 'zod';
import type { Capability } from '../teams';

/**
 * Who may call a route, as the server enforces it and the access-matrix test checks it:
 * - `anyone`: no session needed (the health check, the solver, signing in);
 * - `signed-in`: any signed-in account, else 401;
 * - `team`: a member of the route's team whose role has `capability`; an outsider gets 404 (they
 *   learn nothing, not even that the team or design exists), a member without it 403;
 * - `link`: the token in the path is the credential (share and invitation links);
 * - `local`: the dev outbox, answered only over loopback and never mounted in production.
 */
export type Access =
  | { kind: 'anyone' }
  | { kind: 'signed-in' }
  | { kind: 'team'; capability: Capability }
  | { kind: 'link' }
  | { kind: 'local' };

export type RouteMeta = {
  access: Access;
  /**
   * Skips the Origin check of state-changing requests. Only for pure computations that read no
   * cookie and write nothing (the solver), which lab scripts call without an Origin header.
   */
  originExempt?: boolean;
  /**
   * The answer is a file of this media type (sent as bytes with a Content-Disposition naming it),
   * not JSON: the route has no output schema, the client downloads it (`features/api` `fetchFile`)
   * and the OpenAPI document describes it as binary.
   */
  file?: { mediaType: 'application/pdf' };
  /**
   * The body is multipart/form-data with one file in the part `field` (the body schema holds it
   * as `z.file()`); the OpenAPI document describes only that content type. `sameAnswerStatus`: a
   * second success status the route also answers (an upload recognised as already stored).
   */
  upload?: { field: string; sameAnswerStatus?: 200 };
};

export type Method = 'GET' | 'POST' | 'PUT' | 'PATCH' | 'DELETE';
type Part = z.ZodType;
type Parts = { params?: Part; query?: Part; body?: Part };

/* eslint-disable @typescript-eslint/no-empty-object-type -- `{}` adds no part to the intersection */
/** The request parts a route reads, as one object `{ params, query, body }` (each if present): as parsed, and as sent. */
type PartsOut<Params, Query, Body> = (Params extends Part ? { params: z.output<Params> } : {}) &
  (Query extends Part ? { query: z.output<Query> } : {}) &
  (Body extends Part ? { body: z.output<Body> } : {});
type PartsIn<Params, Query, Body> = (Params extends Part ? { params: z.input<Params> } : {}) &
  (Query extends Part ? { query: z.input<Query> } : {}) &
  (Body extends Part ? { body: z.input<Body> } : {});
/* eslint-enable @typescript-eslint/no-empty-object-type */
type InputSchema<Params, Query, Body> = z.ZodType<PartsOut<Params, Query, Body>, PartsIn<Params, Query, Body>>;

export type RouteSpec<Params, Query, Body, O> = {
  method: Method;
  /** Below `/api`, with `{name}` for path parameters (OpenAPI's spelling). */
  path: `/${string}`;
  /** One line for the OpenAPI document. */
  summary: string;
  description?: string;
  /** The status of a success; 204 answers carry no body. */
  status?: 200 | 201 | 202 | 204;
  params?: Params;
  query?: Query;
  body?: Body;
  /** The answer's schema; omitted only with status 204 or a `file` answer. */
  output?: O;
  access: Access;
  originExempt?: boolean;
  file?: RouteMeta['file'];
  upload?: RouteMeta['upload'];
  tag: string;
};

export type Route<I extends Part = Part, O extends Part = Part> = ContractProcedure<I, O, Record<never, never>, RouteMeta>;

/**
 * Describes one HTTP route once: method, path, the zod schemas of its parts and answer (the
 * shared ones), and who may call it. The server mounts it (`server/http/contract.ts`), the client
 * calls it (`features/api/client.ts`), the access matrix walks it and `/api/openapi.json` is
 * generated from it.
 */
export function route<
  Params extends Part | undefined = undefined,
  Query extends Part | undefined = undefined,
  Body extends Part | undefined = undefined,
  O extends Part = z.ZodVoid,
>(spec: RouteSpec<Params, Query, Body, O>): Route<InputSchema<Params, Query, Body>, O> {
  const shape: Record<string, Part> = {};
  for (const part of ['params', 'query', 'body'] as const) {
    const schema = spec[part];
    if (schema) shape[part] = schema;
  }
  const procedure = oc
    .$meta<RouteMeta>({ access: spec.access })
    .route({
      method: spec.method,
      path: spec.path,
      summary: spec.summary,
      description: spec.description,
      successStatus: spec.status ?? 200,
      tags: [spec.tag],
      inputStructure: 'detailed',
    })
    .meta({ access: spec.access, ...(spec.originExempt ? { originExempt: true } : {}), ...(spec.file ? { file: spec.file } : {}), ...(spec.upload ? { upload: spec.upload } : {}) })
    .input(z.object(shape));
  return (spec.output ? procedure.output(spec.output) : procedure) as unknown as Route<InputSchema<Params, Query, Body>, O>;
}

/** What a route's definition holds, read back for the server, the client and the tests. */
export function describe(procedure: Route) {
  const def = procedure['~orpc'];
  const input = def.inputSchema as unknown as z.ZodObject<Record<string, Part>>;
  return {
    method: def.route.method as Method,
    path: def.route.path as `/${string}`,
    status: (def.route.successStatus ?? 200) as 200 | 201 | 202 | 204,
    meta: def.meta,
    parts: input.shape as Parts,
    output: def.outputSchema as Part | undefined,
  };
}

/** Values a caller sends (before parsing); what a handler receives (after); what the answer holds. */
/* The error map and meta positions are not read here, so they match anything. */
export type RouteInput<R> = R extends ContractProcedure<infer I extends Part, any, any, any> ? z.input<I> : never;
export type RouteArgs<R> = R extends ContractProcedure<infer I extends Part, any, any, any> ? z.output<I> : never;
export type RouteAnswer<R> = R extends ContractProcedure<any, infer O extends Part, any, any> ? z.output<O> : never;
