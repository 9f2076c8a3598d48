import { DrizzlePostgreSQLAdapter } from '@lucia-auth/adapter-drizzle';
import { Lucia, TimeSpan } from 'lucia';
import type { Database } from '../../db/client';
import { sessions, users } from '../../db/schema';

export const sessionCookieName = 'blazebook_session';
/** Sessions last 30 days; Lucia renews one used in its second half. */
export const sessionLifetimeMs = 30 * 24 * 60 * 60_000;

/**
 * The one Lucia instance per app. Lucia is deprecated upstream; nothing outside `server/auth/`
 * imports it, so replacing it means rewriting this folder only.
 *
 * Sessions last 30 days and slide: Lucia renews one used in its second half (`session.fresh`).
 */
export function createLucia(db: Database, options: { secure: boolean }) {
  const adapter = new DrizzlePostgreSQLAdapter(db, sessions, users);
  return new Lucia(adapter, {
    sessionExpiresIn: new TimeSpan(sessionLifetimeMs / 1000, 's'),
    sessionCookie: {
      name: sessionCookieName,
      // Over plain http (localhost, tests) a Secure cookie would never come back.
      attributes: { secure: options.secure, sameSite: 'lax' },
    },
    getUserAttributes: (row) => ({
      email: row.email,
      displayName: row.displayName,
      emailVerified: row.emailVerifiedAt !== null,
    }),
  });
}

export type AppLucia = ReturnType<typeof createLucia>;

type UserRow = typeof users.$inferSelect;

declare module 'lucia' {
  interface Register {
    Lucia: AppLucia;
    DatabaseUserAttributes: Omit<UserRow, 'id'>;
  }
}
