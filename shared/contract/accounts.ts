import {
  acceptedResponseSchema,
  passwordResetConfirmSchema,
  passwordResetRequestSchema,
  sessionResponseSchema,
  signedInResponseSchema,
  signInRequestSchema,
  signUpRequestSchema,
  verifyEmailRequestSchema,
} from '../auth';
import { route } from './route';

const tag = 'Accounts';

/** `/api/auth/*`: accounts and sessions. Every answer about an e-mail is the same whether it has an account. */
export const accounts = {
  session: route({ tag, method: 'GET', path: '/auth/session', summary: 'Who is signed in (user null when nobody is)', access: { kind: 'anyone' }, output: sessionResponseSchema }),
  signUp: route({
    tag,
    method: 'POST',
    path: '/auth/sign-up',
    summary: 'Create an account and sign in; a confirmation link is e-mailed',
    status: 201,
    access: { kind: 'anyone' },
    body: signUpRequestSchema,
    output: signedInResponseSchema,
  }),
  signIn: route({ tag, method: 'POST', path: '/auth/sign-in', summary: 'Sign in with e-mail and password', access: { kind: 'anyone' }, body: signInRequestSchema, output: signedInResponseSchema }),
  signOut: route({ tag, method: 'POST', path: '/auth/sign-out', summary: 'End this session', status: 204, access: { kind: 'anyone' } }),
  signOutEverywhere: route({ tag, method: 'POST', path: '/auth/sign-out-everywhere', summary: 'End every session of this account', status: 204, access: { kind: 'signed-in' } }),
  requestPasswordReset: route({
    tag,
    method: 'POST',
    path: '/auth/password-reset',
    summary: 'E-mail a link to choose a new password (the same answer whether the account exists)',
    status: 202,
    access: { kind: 'anyone' },
    body: passwordResetRequestSchema,
    output: acceptedResponseSchema,
  }),
  confirmPasswordReset: route({
    tag,
    method: 'POST',
    path: '/auth/password-reset/confirm',
    summary: 'Choose a new password with the e-mailed token; ends every other session',
    access: { kind: 'anyone' },
    body: passwordResetConfirmSchema,
    output: signedInResponseSchema,
  }),
  verifyEmail: route({ tag, method: 'POST', path: '/auth/verify-email', summary: 'Confirm the e-mail address with the e-mailed token', access: { kind: 'anyone' }, body: verifyEmailRequestSchema, output: signedInResponseSchema }),
  resendVerification: route({
    tag,
    method: 'POST',
    path: '/auth/verify-email/resend',
    summary: 'Send the confirmation link again',
    status: 202,
    access: { kind: 'signed-in' },
    output: acceptedResponseSchema,
  }),
};
