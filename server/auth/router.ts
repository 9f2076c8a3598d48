import { Router } from 'express';
import {
  passwordResetConfirmSchema,
  passwordResetRequestSchema,
  signInRequestSchema,
  signUpRequestSchema,
  verifyEmailRequestSchema,
  type SessionResponse,
} from '../../shared/auth';
import { handle } from '../http/validate';
import type { createRateLimiters } from './rate-limit';
import type { AuthService } from './service';
import { currentAuth, currentUser, requireUser, signedIn } from './session';

const resetAccepted = { message: 'If an account has this e-mail, a link to choose a new password is on its way.' };

/** `/api/auth/*`: accounts and sessions. Every answer about an e-mail is the same whether it has an account. */
export function authRouter(auth: AuthService, limits: ReturnType<typeof createRateLimiters>) {
  const router = Router();

  router.get('/auth/session', (_req, res) => {
    const body: SessionResponse = { user: currentUser(res) };
    res.json(body);
  });

  router.post(
    '/auth/sign-up',
    ...limits.signUp,
    handle({ body: signUpRequestSchema }, async ({ body }, _req, res) => {
      const { user, setCookie } = await auth.signUp(body);
      res.append('Set-Cookie', setCookie).status(201);
      return { user };
    }),
  );

  router.post(
    '/auth/sign-in',
    ...limits.signIn,
    handle({ body: signInRequestSchema }, async ({ body }, _req, res) => {
      const { user, setCookie } = await auth.signIn(body);
      res.append('Set-Cookie', setCookie);
      return { user };
    }),
  );

  router.post(
    '/auth/sign-out',
    handle({}, async (_input, _req, res) => {
      const current = currentAuth(res);
      if (current) res.append('Set-Cookie', await auth.signOut(current.sessionId));
      res.status(204).end();
    }),
  );

  router.post(
    '/auth/sign-out-everywhere',
    signedIn,
    handle({}, async (_input, _req, res) => {
      const user = requireUser(res);
      res.append('Set-Cookie', await auth.signOutEverywhere(user.id));
      res.status(204).end();
    }),
  );

  router.post(
    '/auth/password-reset',
    ...limits.reset,
    handle({ body: passwordResetRequestSchema }, async ({ body }, _req, res) => {
      await auth.requestPasswordReset(body.email);
      res.status(202);
      return resetAccepted;
    }),
  );

  router.post(
    '/auth/password-reset/confirm',
    ...limits.resetConfirm,
    handle({ body: passwordResetConfirmSchema }, async ({ body }, _req, res) => {
      const { user, setCookie } = await auth.resetPassword(body.token, body.password);
      res.append('Set-Cookie', setCookie);
      return { user };
    }),
  );

  router.post(
    '/auth/verify-email',
    handle({ body: verifyEmailRequestSchema }, async ({ body }) => ({ user: await auth.verifyEmail(body.token) })),
  );

  router.post(
    '/auth/verify-email/resend',
    signedIn,
    ...limits.resendConfirmation,
    handle({}, async (_input, _req, res) => {
      await auth.resendVerification(requireUser(res).id);
      res.status(202);
      return { message: 'A new confirmation link is on its way.' };
    }),
  );

  return router;
}
