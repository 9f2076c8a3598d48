import type { apiContract } from '../../shared/contract/index';
import type { GroupImplementation } from '../http/contract';
import type { createRateLimiters } from './rate-limit';
import type { AuthService } from './service';
import { currentAuth, currentUser, requireUser } from './session';

const resetAccepted = { message: 'If an account has this e-mail, a link to choose a new password is on its way.' };

/**
 * `/api/auth/*` (`apiContract.accounts`): accounts and sessions. Every answer about an e-mail is
 * the same whether it has an account.
 */
export function authRouter(auth: AuthService, limits: ReturnType<typeof createRateLimiters>): GroupImplementation<typeof apiContract.accounts> {
  return {
    session: (_input, _req, res) => ({ user: currentUser(res) }),
    signUp: {
      use: limits.signUp,
      handle: async ({ body }, _req, res) => {
        const { user, setCookie } = await auth.signUp(body);
        res.append('Set-Cookie', setCookie);
        return { user };
      },
    },
    signIn: {
      use: limits.signIn,
      handle: async ({ body }, _req, res) => {
        const { user, setCookie } = await auth.signIn(body);
        res.append('Set-Cookie', setCookie);
        return { user };
      },
    },
    signOut: async (_input, _req, res) => {
      const current = currentAuth(res);
      if (current) res.append('Set-Cookie', await auth.signOut(current.sessionId));
    },
    signOutEverywhere: async (_input, _req, res) => {
      res.append('Set-Cookie', await auth.signOutEverywhere(requireUser(res).id));
    },
    requestPasswordReset: {
      use: limits.reset,
      handle: async ({ body }) => {
        await auth.requestPasswordReset(body.email);
        return resetAccepted;
      },
    },
    confirmPasswordReset: {
      use: limits.resetConfirm,
      handle: async ({ body }, _req, res) => {
        const { user, setCookie } = await auth.resetPassword(body.token, body.password);
        res.append('Set-Cookie', setCookie);
        return { user };
      },
    },
    verifyEmail: async ({ body }) => ({ user: await auth.verifyEmail(body.token) }),
    resendVerification: {
      use: limits.resendConfirmation,
      handle: async (_input, _req, res) => {
        await auth.resendVerification(requireUser(res).id);
        return { message: 'A new confirmation link is on its way.' };
      },
    },
  };
}
