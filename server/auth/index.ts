import type { Database } from '../../db/client';
import type { Clock } from '../clock';
import type { Mailer } from '../mail/mailer';
import type { Writers } from '../read-cache';
import { createLucia } from './lucia';
import { passwordHasher, type PasswordHasher } from './password';
import { createRateLimiters, defaultRateLimits, type RateLimits } from './rate-limit';
import { createAuthRepository } from './repository';
import { authRouter } from './router';
import { createAuthService } from './service';
import { sessionMiddleware } from './session';

export { originCheck } from './origin';
export { createPasswordHasher, productionArgon2Cost, type PasswordHasher } from './password';
export { defaultRateLimits, type RateLimits } from './rate-limit';
export { currentUser, requireUser, signedIn } from './session';
export { createToken, hashToken, newRecordId } from './tokens';
export type { AuthService } from './service';

export type AuthDeps = {
  db: Database;
  mailer: Mailer;
  clock: Clock;
  publicUrl: () => string;
  secureCookies: boolean;
  rateLimits?: Partial<RateLimits>;
  /** Production's argon2id cost unless a test injects a cheaper one. */
  passwords?: PasswordHasher;
  writers?: Writers;
};

/** Wires accounts and sessions: the service (for seeding), the session middleware and `/api/auth`. */
export function createAuth({ db, mailer, clock, publicUrl, secureCookies, rateLimits, passwords = passwordHasher, writers }: AuthDeps) {
  const lucia = createLucia(db, { secure: secureCookies });
  const service = createAuthService({ repository: createAuthRepository(db), lucia, mailer, clock, publicUrl, passwords, writers });
  return {
    service,
    sessions: sessionMiddleware(service),
    router: authRouter(service, createRateLimiters({ ...defaultRateLimits, ...rateLimits })),
  };
}
