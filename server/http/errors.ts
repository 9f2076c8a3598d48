import type { FieldErrors } from '../../shared/validation';

/**
 * An error the API reports to the client on purpose. The error middleware turns it into the one
 * error shape; anything that is not an HttpError becomes a 500 with no details.
 */
export class HttpError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly fields?: FieldErrors,
    /** Sent as `error.details`: what the client needs to act on this code without asking again. */
    readonly details?: Record<string, unknown>,
  ) {
    super(message);
    this.name = 'HttpError';
  }
}

export const badRequest = (message: string, fields?: FieldErrors) =>
  new HttpError(400, 'invalid_request', message, fields);
export const notFound = (message = 'Nothing here.') => new HttpError(404, 'not_found', message);
export const forbidden = (message = 'You may not do that.') =>
  new HttpError(403, 'forbidden', message);
export const conflict = (message: string) => new HttpError(409, 'conflict', message);
