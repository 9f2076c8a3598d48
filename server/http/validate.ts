import type { NextFunction, Request, RequestHandler, Response } from 'express';
import type { z } from 'zod';
import { unstorableText } from '../../shared/storable-text';
import { fieldErrors } from '../../shared/validation';
import { badRequest } from './errors';
import { sendJson } from './json';

type Schemas = { body?: z.ZodType; params?: z.ZodType; query?: z.ZodType };
type Parsed<S extends Schemas> = {
  [K in keyof S]: S[K] extends z.ZodType ? z.output<S[K]> : never;
};

const partNames = { body: 'body', params: 'path', query: 'query' } as const;

/**
 * Parses the request parts once with their shared zod schemas and hands the typed values to the
 * handler, so no handler reads an unchecked `req.body`. A failure is a 400 whose `fields` name
 * every bad path. Text that the database could not store as sent (NUL, lone surrogates) is refused
 * here first, for every part of every route, so no schema can forget it.
 */
export function handle<S extends Schemas>(
  schemas: S,
  handler: (input: Parsed<S>, req: Request, res: Response) => unknown,
): RequestHandler {
  return async (req: Request, res: Response, next: NextFunction) => {
    try {
      const input: Record<string, unknown> = {};
      for (const part of ['params', 'query', 'body'] as const) {
        const schema = schemas[part];
        if (!schema) continue;
        const unstorable = unstorableText(req[part]);
        if (Object.keys(unstorable).length > 0) {
          throw badRequest(`The request ${partNames[part]} has text that cannot be stored.`, unstorable);
        }
        const result = schema.safeParse(req[part] ?? {});
        if (!result.success) {
          throw badRequest(`The request ${partNames[part]} has invalid fields.`, fieldErrors(result.error));
        }
        input[part] = result.data;
      }
      const value = await handler(input as Parsed<S>, req, res);
      if (value !== undefined && !res.headersSent) await sendJson(res, value);
    } catch (error) {
      next(error);
    }
  };
}
