import express from 'express';
import request from 'supertest';
import type { DatabaseHandle } from '../../db/client';
import { rateLimitCounters } from '../../db/schema';
import { createApp, type AppDeps } from '../../server/app';
import { createPasswordHasher } from '../../server/auth/index';
import { createFixedClock } from '../../server/clock';
import { createMemoryMailer, createOutboxMailer } from '../../server/mail/mailer';
import { createOutboxRepository } from '../../server/mail/outbox-repository';
import { openTestDatabase } from './test-db';

/** The origin the test app believes it is served from; state-changing test requests carry it. */
export const testOrigin = 'http://blazebook.example.com';

type TestAppOptions = {
  log?: (error: unknown) => void;
  /** Send through the outbox table, as `npm start` does without SMTP_URL, instead of memory. */
  outbox?: boolean;
  /** null: no PUBLIC_URL, as `npm start` runs by default (the Origin check then relies on Host). */
  trustedOrigin?: string | null;
  /**
   * An open database to use instead of a fresh copy, for a second app (other limits, mode or
   * origin) in a file whose cases do not need an empty one: a copy costs seconds to open. Whoever
   * opened it closes it; this app's `close` leaves it open.
   */
  database?: DatabaseHandle;
  /** Hash at OWASP's cost, as every real app does, instead of the tests' cheap one. */
  productionPasswordCost?: boolean;
} & Partial<Pick<AppDeps, 'rateLimits' | 'nodeEnv' | 'https' | 'webRoot' | 'trustProxy'>>;

/**
 * argon2id at its lowest cost (8 KiB, 1 pass: ≈ 0.3 ms against ≈ 15–45 ms). The tests check what
 * is done with a hash, not how hard it is to crack; password-hashing.test.ts checks that an app
 * given no hasher, as `npm start` builds it, hashes at OWASP's cost.
 */
export const testPasswordHasher = createPasswordHasher({ memoryCost: 8, timeCost: 1, parallelism: 1 });

/** `createApp` on a fresh database with a still clock and an in-memory mailer, for supertest. */
export async function createTestApp(options: TestAppOptions = {}) {
  const database: DatabaseHandle = options.database ?? (await openTestDatabase());
  // On a PostgreSQL server the rate-limit counters live in the database, shared by every app on
  // it as by every process; a new app starts from none, as one on the embedded database does.
  if (database.engine === 'server') await database.db.delete(rateLimitCounters);
  const clock = createFixedClock(new Date('2026-03-14T09:00:00Z'));
  const mailer = createMemoryMailer();
  const errors: unknown[] = [];
  const app = createApp({
    database,
    clock,
    mailer: options.outbox ? createOutboxMailer(createOutboxRepository(database.db, clock)) : mailer,
    version: 'test',
    nodeEnv: options.nodeEnv ?? 'test',
    https: options.https,
    webRoot: options.webRoot,
    publicUrl: () => testOrigin,
    trustedOrigin: options.trustedOrigin === null ? undefined : (options.trustedOrigin ?? testOrigin),
    rateLimits: options.rateLimits,
    trustProxy: options.trustProxy,
    passwords: options.productionPasswordCost ? undefined : testPasswordHasher,
    log: options.log ?? ((error) => errors.push(error)),
  });
  const close = options.database ? async () => {} : () => database.close();
  return { app, database, clock, mailer, errors, close };
}

export type TestApp = Awaited<ReturnType<typeof createTestApp>>;

/**
 * The app as reached from another machine: Express reads the client's address from the socket,
 * which supertest always opens over loopback, so the socket's address is replaced before the app
 * sees the request.
 */
export function fromAddress(app: TestApp['app'], remoteAddress: string) {
  const outer = express();
  outer.use((req, _res, next) => {
    Object.defineProperty(req.socket, 'remoteAddress', { value: remoteAddress, configurable: true });
    next();
  });
  outer.use(app);
  return outer;
}

/** A cookie-keeping client that sends our Origin, like the web app in a browser. */
export function browserAgent(app: TestApp['app']) {
  return request.agent(app).set('origin', testOrigin);
}

export const testPassword = 'long enough password';

let counter = 0;

/** Signs up a fresh account and returns a signed-in agent; names and e-mails are unique per call. */
export async function signUp(app: TestApp['app'], name = 'Test Person', email?: string) {
  counter += 1;
  const agent = browserAgent(app);
  const address = email ?? `person${counter}-${Date.now()}@example.com`;
  const res = await agent
    .post('/api/auth/sign-up')
    .send({ email: address, displayName: `${name} ${counter}`, password: testPassword });
  if (res.status !== 201) throw new Error(`sign-up failed: ${res.status} ${JSON.stringify(res.body)}`);
  return { agent, user: res.body.user as { id: string; email: string; displayName: string }, password: testPassword };
}

/** The last link of the given path in the latest message sent to `to`. */
export function linkIn(mailer: ReturnType<typeof createMemoryMailer>, to: string, path: string): string {
  const message = [...mailer.sent].reverse().find((m) => m.to === to.toLowerCase());
  if (!message) throw new Error(`no message to ${to}`);
  const match = new RegExp(`${testOrigin}${path}[^\\s"<]*`).exec(message.text);
  if (!match) throw new Error(`no ${path} link in “${message.subject}”`);
  return match[0];
}

export function tokenFrom(link: string): string {
  const url = new URL(link);
  return url.searchParams.get('token') ?? url.pathname.split('/').pop()!;
}
