import type { DatabaseHandle } from '../../db/client';
import { createApp } from '../../server/app';
import { createFixedClock } from '../../server/clock';
import { createMemoryMailer } from '../../server/mail/mailer';
import { openTestDatabase } from './test-db';

/** `createApp` on a fresh database with a still clock and an in-memory mailer, for supertest. */
export async function createTestApp(options: { log?: (error: unknown) => void } = {}) {
  const database: DatabaseHandle = await openTestDatabase();
  const clock = createFixedClock(new Date('2026-03-14T09:00:00Z'));
  const mailer = createMemoryMailer();
  const errors: unknown[] = [];
  const app = createApp({
    database,
    clock,
    mailer,
    version: 'test',
    log: options.log ?? ((error) => errors.push(error)),
  });
  return { app, database, clock, mailer, errors, close: () => database.close() };
}
