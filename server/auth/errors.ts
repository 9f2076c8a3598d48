import { HttpError } from '../http/errors';

export const unauthenticated = (message = 'Sign in to do that.') => new HttpError(401, 'unauthenticated', message);
export const tooManyRequests = (message = 'Too many attempts. Wait a few minutes and try again.') =>
  new HttpError(429, 'rate_limited', message);
