import { randomUUID } from 'node:crypto';
import { passwordIsEmail, passwordIsEmailReason, type SignInRequest, type SignUpRequest, type User } from '../../shared/auth';
import type { Clock } from '../clock';
import { HttpError, badRequest } from '../http/errors';
import type { Mailer } from '../mail/mailer';
import { passwordResetMessage, verifyEmailMessage } from '../mail/templates';
import { unauthenticated } from './errors';
import { createReadCache, type Writers } from '../read-cache';
import { sessionLifetimeMs, type AppLucia } from './lucia';
import { isCommonPassword, type PasswordHasher } from './password';
import type { AuthRepository, UserRow } from './repository';
import { createToken, hashToken, newRecordId } from './tokens';

const minute = 60_000;
/** Lucia's ids are lower-case base32; anything else is not a session of ours. */
const sessionIdPattern = /^[a-z0-9]{1,128}$/;
export const resetTokenLifetimeMs = 30 * minute;
export const verifyTokenLifetimeMs = 48 * 60 * minute;

/** The same words whether the e-mail is unknown or the password wrong: no account enumeration. */
const wrongCredentials = 'The e-mail or the password is not right.';
const badLink = 'This link is not valid any more. Ask for a new one.';

export type SignedIn = { user: User; setCookie: string };
export type SessionAuth = { user: User; sessionId: string };

export type AuthServiceDeps = {
  repository: AuthRepository;
  lucia: AppLucia;
  mailer: Mailer;
  clock: Clock;
  publicUrl: () => string;
  passwords: PasswordHasher;
  /** `shared` (several API processes on one PostgreSQL server): checked sessions are not kept. */
  writers?: Writers;
};

export function toUser(row: Pick<UserRow, 'id' | 'email' | 'displayName' | 'emailVerifiedAt'>): User {
  return { id: row.id, email: row.email, displayName: row.displayName, emailVerified: row.emailVerifiedAt !== null };
}

export function createAuthService({ repository, lucia, mailer, clock, publicUrl, passwords, writers = 'alone' }: AuthServiceDeps) {
  // Checking a session costs a database round trip on every API request; most are repeats. Every
  // sign-out, reset and verification below forgets the sessions it touches.
  const checkedSessions = createReadCache<SessionAuth & { expiresAt: number }>({ max: 10_000, writers });
  const forgetSessionsOf = (userId: string) => checkedSessions.forgetWhere((_id, entry) => entry.user.id === userId);
  const link = (path: string, token: string) => `${publicUrl().replace(/\/$/, '')}${path}?token=${token}`;

  async function startSession(userId: string): Promise<string> {
    const session = await lucia.createSession(userId, {});
    return lucia.createSessionCookie(session.id).serialize();
  }

  async function sendVerification(user: UserRow) {
    await repository.deleteTokens(user.id, 'verify-email');
    const { token, hash } = await createToken();
    await repository.insertToken({
      tokenHash: hash,
      userId: user.id,
      purpose: 'verify-email',
      expiresAt: new Date(clock.now().getTime() + verifyTokenLifetimeMs),
      createdAt: clock.now(),
    });
    await mailer.send(verifyEmailMessage(user.email, user.displayName, link('/verify-email', token)));
  }

  /**
   * The session id in a cookie header, 'malformed' for a value no session of ours could have
   * (NUL, bad percent-encoding, odd characters — it would otherwise reach the database), or null.
   */
  function sessionIdFrom(cookieHeader: string | undefined): string | 'malformed' | null {
    if (!cookieHeader) return null;
    let id: string | null;
    try {
      id = lucia.readSessionCookie(cookieHeader);
    } catch {
      return 'malformed';
    }
    if (id === null || id === '') return null;
    return sessionIdPattern.test(id) ? id : 'malformed';
  }

  return {
    /** Creates the account and its personal workspace, signs it in and mails a confirmation link. */
    async signUp(input: SignUpRequest & { email: string }): Promise<SignedIn> {
      if (isCommonPassword(input.password)) {
        throw badRequest('Choose another password.', { password: 'is one of the most used passwords; choose another' });
      }
      const now = clock.now();
      const row = await repository.insertUserWithWorkspace(
        {
          id: newRecordId(),
          email: input.email,
          displayName: input.displayName,
          passwordHash: await passwords.hash(input.password),
          createdAt: now,
        },
        { id: randomUUID(), name: `${input.displayName}’s workspace` },
      );
      // Sign-up has to say this to be usable; it is rate limited per IP like sign-in.
      if (!row) throw new HttpError(409, 'conflict', 'An account with this e-mail exists. Sign in instead.', { email: 'already has an account' });
      await sendVerification(row);
      return { user: toUser(row), setCookie: await startSession(row.id) };
    },

    async signIn(input: SignInRequest & { email: string }): Promise<SignedIn> {
      const row = await repository.findUserByEmail(input.email);
      const ok = row ? await passwords.verify(row.passwordHash, input.password) : await passwords.verifyAgainstDummy(input.password);
      if (!row || !ok) throw unauthenticated(wrongCredentials);
      return { user: toUser(row), setCookie: await startSession(row.id) };
    },

    async signOut(sessionId: string): Promise<string> {
      await lucia.invalidateSession(sessionId);
      checkedSessions.forget(sessionId);
      return lucia.createBlankSessionCookie().serialize();
    },

    async signOutEverywhere(userId: string): Promise<string> {
      await lucia.invalidateUserSessions(userId);
      forgetSessionsOf(userId);
      return lucia.createBlankSessionCookie().serialize();
    },

    /** Mails a reset link when the account exists; the caller answers the same either way. */
    async requestPasswordReset(email: string): Promise<void> {
      const row = await repository.findUserByEmail(email);
      if (!row) return;
      await repository.deleteTokens(row.id, 'reset-password');
      const { token, hash } = await createToken();
      await repository.insertToken({
        tokenHash: hash,
        userId: row.id,
        purpose: 'reset-password',
        expiresAt: new Date(clock.now().getTime() + resetTokenLifetimeMs),
        createdAt: clock.now(),
      });
      await mailer.send(passwordResetMessage(row.email, row.displayName, link('/reset-password', token)));
    },

    /** Sets the new password, ends every other session (a thief's too) and signs this browser in. */
    async resetPassword(token: string, password: string): Promise<SignedIn> {
      if (isCommonPassword(password)) {
        throw badRequest('Choose another password.', { password: 'is one of the most used passwords; choose another' });
      }
      const tokenHash = await hashToken(token);
      const live = (found: { expiresAt: Date } | null) => found !== null && found.expiresAt.getTime() > clock.now().getTime();
      // The address check needs the account behind the token; it reads the token without using it
      // up, so a refused password leaves the link working for a second try.
      const pending = await repository.findToken(tokenHash, 'reset-password');
      if (!pending || !live(pending)) throw badRequest(badLink, { token: 'has expired or was already used' });
      const owner = await repository.findUserById(pending.userId);
      if (owner && passwordIsEmail(password, owner.email)) {
        throw badRequest('Choose another password.', { password: passwordIsEmailReason });
      }
      const used = await repository.consumeToken(tokenHash, 'reset-password');
      if (!used || !live(used)) throw badRequest(badLink, { token: 'has expired or was already used' });
      await repository.setPasswordHash(used.userId, await passwords.hash(password));
      // Following the link proves the address is theirs.
      await repository.markEmailVerified(used.userId, clock.now());
      await lucia.invalidateUserSessions(used.userId);
      forgetSessionsOf(used.userId);
      const row = await repository.findUserById(used.userId);
      if (!row) throw badRequest(badLink);
      return { user: toUser(row), setCookie: await startSession(row.id) };
    },

    async verifyEmail(token: string): Promise<User> {
      const used = await repository.consumeToken(await hashToken(token), 'verify-email');
      if (!used || used.expiresAt.getTime() <= clock.now().getTime()) throw badRequest(badLink, { token: 'has expired or was already used' });
      await repository.markEmailVerified(used.userId, clock.now());
      // Their sessions carry `emailVerified`.
      forgetSessionsOf(used.userId);
      const row = await repository.findUserById(used.userId);
      if (!row) throw badRequest(badLink);
      return toUser(row);
    },

    async resendVerification(userId: string): Promise<void> {
      const row = await repository.findUserById(userId);
      if (row && row.emailVerifiedAt === null) await sendVerification(row);
    },

    /**
     * The signed-in user behind a session cookie header. `setCookie` renews a session used in the
     * second half of its life (sliding expiry) or clears a cookie whose session is gone.
     */
    async readSession(cookieHeader: string | undefined): Promise<{ auth: SessionAuth | null; setCookie?: string }> {
      const id = sessionIdFrom(cookieHeader);
      if (id === null) return { auth: null };
      if (id === 'malformed') return { auth: null, setCookie: lucia.createBlankSessionCookie().serialize() };
      let renewed = false;
      const checked = await checkedSessions.load(
        id,
        async () => {
          const { session, user } = await lucia.validateSession(id);
          if (!session) return null;
          renewed = session.fresh;
          const { email, displayName, emailVerified } = user;
          return { user: { id: user.id, email, displayName, emailVerified }, sessionId: session.id, expiresAt: session.expiresAt.getTime() };
        },
        // Trusted until the second half of its life, where Lucia has to renew it.
        (entry) => entry.expiresAt - sessionLifetimeMs / 2,
      );
      if (!checked) return { auth: null, setCookie: lucia.createBlankSessionCookie().serialize() };
      const auth = { user: checked.user, sessionId: checked.sessionId };
      return renewed ? { auth, setCookie: lucia.createSessionCookie(checked.sessionId).serialize() } : { auth };
    },
  };
}

export type AuthService = ReturnType<typeof createAuthService>;
