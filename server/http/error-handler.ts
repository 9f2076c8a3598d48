import type { ErrorRequestHandler, Request, RequestHandler } from 'express';
import { ZodError } from 'zod';
import type { ErrorBody } from '../../shared/api-error';
import { fieldErrors } from '../../shared/validation';
import { HttpError } from './errors';

function body(
  code: string,
  message: string,
  fields?: ErrorBody['error']['fields'],
  details?: ErrorBody['error']['details'],
): ErrorBody {
  return { error: { code, message, ...(fields && { fields }), ...(details && { details }) } };
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
 * Other client errors raised by Express's own layers (http-errors with a 4xx `status`): a path
 * whose percent-encoding does not decode, a compressed body that does not decompress. They are
 * the client's fault, so they get the error shape and a message that says what was wrong.
 */
function clientErrorFromStatus(error: unknown, req: Request): HttpError | null {
  if (typeof error !== 'object' || error === null) return null;
  const status =
    (error as { status?: unknown; statusCode?: unknown }).status ??
    (error as { statusCode?: unknown }).statusCode;
  if (typeof status !== 'number' || status < 400 || status > 499) return null;
  if (error instanceof URIError) {
    return new HttpError(
      400,
      'malformed_path',
      'The address has malformed percent-encoding (such as %ff or a lone %).',
    );
  }
  const encoding = req.get('content-encoding');
  if (status === 400 && encoding && encoding !== 'identity') {
    return new HttpError(
      400,
      'malformed_body',
      `The request body says Content-Encoding: ${encoding.slice(0, 40)}, but it does not decompress.`,
    );
  }
  return new HttpError(status, 'invalid_request', 'The request could not be read.');
}

/** PostgreSQL's connection-exception and shutdown SQLSTATEs, and the socket errors of a server that is gone. */
const unavailableCodes = new Set(['ECONNREFUSED', 'ECONNRESET', 'ETIMEDOUT', 'EPIPE', '57P01', '57P02', '57P03', '08000', '08001', '08003', '08006']);

/**
 * The database server is down or restarting (server mode): not the request's fault and not a bug,
 * and it passes. Drizzle wraps the driver's error, so the cause chain is searched.
 */
function databaseUnavailable(error: unknown): string | null {
  for (let at: unknown = error, depth = 0; at && typeof at === 'object' && depth < 5; at = (at as { cause?: unknown }).cause, depth++) {
    const { code, message } = at as { code?: unknown; message?: unknown };
    const text = typeof message === 'string' ? message : '';
    if ((typeof code === 'string' && unavailableCodes.has(code)) || /^Connection terminated/.test(text)) {
      return `${typeof code === 'string' ? `${code} ` : ''}${text}`.trim();
    }
  }
  return null;
}

/** Seconds a client is asked to wait while the database is unavailable: a restart takes a few. */
export const unavailableRetryAfterS = 5;

/**
 * The one place that turns failures into the API's error shape. Unknown errors are logged here
 * and reach the client as a bare 500: no stack, no message from inside the server.
 */
export function errorHandler(log: (error: unknown) => void): ErrorRequestHandler {
  return (error, req, res, next) => {
    if (res.headersSent) {
      next(error);
      return;
    }
    const known =
      error instanceof HttpError
        ? error
        : error instanceof ZodError
          ? new HttpError(400, 'invalid_request', 'The request has invalid fields.', fieldErrors(error))
          : (bodyParserError(error) ?? clientErrorFromStatus(error, req));
    if (known) {
      res.status(known.status).json(body(known.code, known.message, known.fields, known.details));
      return;
    }
    const unavailable = databaseUnavailable(error);
    if (unavailable) {
      // One line, not a stack per request: an outage of a few seconds is hundreds of requests.
      log(`Database unavailable (${req.method} ${req.path}): ${unavailable}`);
      res.setHeader('Retry-After', String(unavailableRetryAfterS));
      res.status(503).json(body('database_unavailable', 'The database is not answering just now. Try again in a few seconds.'));
      return;
    }
    log(error);
    res.status(500).json(body('internal', 'Something went wrong on our side. Try again.'));
  };
}
