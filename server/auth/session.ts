import type { RequestHandler, Response } from 'express';
import type { User } from '../../shared/auth';
import { unauthenticated } from './errors';
import type { AuthService, SessionAuth } from './service';

/** Reads the session cookie once per API request and keeps the result on `res.locals`. */
export function sessionMiddleware(auth: AuthService): RequestHandler {
  return async (req, res, next) => {
    try {
      const { auth: current, setCookie } = await auth.readSession(req.headers.cookie);
      if (setCookie) res.append('Set-Cookie', setCookie);
      res.locals.auth = current;
      next();
    } catch (error) {
      next(error);
    }
  };
}

export function currentAuth(res: Response): SessionAuth | null {
  return (res.locals.auth as SessionAuth | null | undefined) ?? null;
}

export function currentUser(res: Response): User | null {
  return currentAuth(res)?.user ?? null;
}

/** The signed-in user, or a 401 for the error middleware. */
export function requireUser(res: Response): User {
  const user = currentUser(res);
  if (!user) throw unauthenticated();
  return user;
}

/** Route middleware: refuses signed-out requests before their input is even parsed. */
export const signedIn: RequestHandler = (_req, res, next) => {
  next(currentUser(res) ? undefined : unauthenticated());
};
