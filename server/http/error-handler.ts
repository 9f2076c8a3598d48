import type { ErrorRequestHandler, RequestHandler } from 'express';
import { ZodError } from 'zod';
import type { ErrorBody } from '../../shared/api-error';
import { fieldErrors } from '../../shared/validation';
import { HttpError } from './errors';

function body(code: string, message: string, fields?: ErrorBody['error']['fields']): ErrorBody {
  return { error: fields ? { code, message, fields } : { code, message } };
}

/** Any `/api` path no router answered. */
export const apiNotFound: RequestHandler = (req, res) => {
  res.status(404).json(body('not_found', `No API route ${req.method} ${req.originalUrl}.`));
};

/** Body-parser marks its failures with `type`; these are the client's fault, not ours. */
function bodyParserError(error: unknown): HttpError | null {
  if (typeof error !== 'object' || error === null || !('type' in error)) return null;
  switch ((error as { type: unknown }).type) {
    case 'entity.parse.failed':
      return new HttpError(400, 'malformed_json', 'The request body is not valid JSON.');
    case 'entity.too.large':
      return new HttpError(413, 'payload_too_large', 'The request body is larger than 1 MB.');
    case 'encoding.unsupported':
    case 'charset.unsupported':
      return new HttpError(415, 'unsupported_encoding', 'The request body encoding is not supported.');
    default:
      return null;
  }
}

/**
 * The one place that turns failures into the API's error shape. Unknown errors are logged here
 * and reach the client as a bare 500: no stack, no message from inside the server.
 */
export function errorHandler(log: (error: unknown) => void): ErrorRequestHandler {
  return (error, _req, res, next) => {
    if (res.headersSent) {
      next(error);
      return;
    }
    const known =
      error instanceof HttpError
        ? error
        : error instanceof ZodError
          ? new HttpError(400, 'invalid_request', 'The request has invalid fields.', fieldErrors(error))
          : bodyParserError(error);
    if (known) {
      res.status(known.status).json(body(known.code, known.message, known.fields));
      return;
    }
    log(error);
    res.status(500).json(body('internal', 'Something went wrong on our side. Try again.'));
  };
}
