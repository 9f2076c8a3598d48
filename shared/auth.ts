import { z } from 'zod';

/** Passwords shorter than this are refused (common practice: NIST SP 800-63B asks for at least 8). */
export const minPasswordLength = 10;
/** argon2 hashes any length, but a megabyte-long password is a way to burn our CPU, not a password. */
export const maxPasswordLength = 200;

/** An e-mail address as typed: trimmed and lower-cased, so `Ada@Example.com` and `ada@example.com` are one account. */
export const emailSchema = z
  .string({ error: 'is required' })
  .trim()
  .toLowerCase()
  .pipe(z.email({ error: 'must be an e-mail address such as name@example.com' }).max(254, { error: 'is too long' }));

/** The reason under the password field when it is the account's own address (sign-up and reset). */
export const passwordIsEmailReason = 'must not be your e-mail address';

/**
 * True when the password is the account's e-mail address, ignoring case and surrounding spaces:
 * the address is the one thing about an account that is not secret.
 */
export function passwordIsEmail(password: string, email: string): boolean {
  return password.trim().toLowerCase() === email.trim().toLowerCase();
}

// Length alone lets through passwords with nothing to guess; NIST SP 800-63B §5.1.1.2 (from memory)
// asks to refuse repetitive ones. Surrounding spaces add no strength, so they are ignored.
export const passwordSchema = z
  .string({ error: 'is required' })
  .min(minPasswordLength, { error: `must be at least ${minPasswordLength} characters` })
  .max(maxPasswordLength, { error: `must be at most ${maxPasswordLength} characters` })
  .refine((password) => password.trim() !== '', { error: 'must not be only spaces', abort: true })
  // By code point, so a repeated emoji counts as one character.
  .refine((password) => new Set(password.trim()).size > 1, { error: 'must not be one character repeated' });

export const displayNameSchema = z
  .string({ error: 'is required' })
  .trim()
  .min(1, { error: 'is required' })
  .max(80, { error: 'must be at most 80 characters' });

export const signUpRequestSchema = z
  .object({
    email: emailSchema,
    displayName: displayNameSchema,
    password: passwordSchema,
  })
  .superRefine(({ email, password }, ctx) => {
    if (passwordIsEmail(password, email)) ctx.addIssue({ code: 'custom', path: ['password'], message: passwordIsEmailReason });
  });
export type SignUpRequest = z.input<typeof signUpRequestSchema>;

export const signInRequestSchema = z.object({
  email: emailSchema,
  // Length rules are for new passwords; an old one is only compared.
  password: z.string({ error: 'is required' }).min(1, { error: 'is required' }).max(maxPasswordLength),
});
export type SignInRequest = z.input<typeof signInRequestSchema>;

export const passwordResetRequestSchema = z.object({ email: emailSchema });
export type PasswordResetRequest = z.input<typeof passwordResetRequestSchema>;

export const tokenSchema = z.string({ error: 'is required' }).min(16, { error: 'is not a valid link' }).max(128);

export const passwordResetConfirmSchema = z.object({ token: tokenSchema, password: passwordSchema });
export type PasswordResetConfirm = z.input<typeof passwordResetConfirmSchema>;

export const verifyEmailRequestSchema = z.object({ token: tokenSchema });

export const userSchema = z.object({
  id: z.string(),
  email: z.string(),
  displayName: z.string(),
  emailVerified: z.boolean(),
});
export type User = z.infer<typeof userSchema>;

/** Why an unconfirmed account cannot accept an invitation yet; the API and the invitation page say it alike. */
export const confirmEmailFirstMessage = (email: string) =>
  `Confirm your e-mail address first: open the link we sent to ${email}, then come back to this invitation.`;

/** `GET /api/auth/session`: who is signed in, or `null`. */
export const sessionResponseSchema = z.object({ user: userSchema.nullable() });
export type SessionResponse = z.infer<typeof sessionResponseSchema>;

/** Sign-up, sign-in and password reset answer with the signed-in user. */
export const signedInResponseSchema = z.object({ user: userSchema });

/** Answers that must not say whether an account exists ("if it exists, we sent a link"). */
export const acceptedResponseSchema = z.object({ message: z.string() });
