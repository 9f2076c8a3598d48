import { randomBytes } from 'node:crypto';
import pg from 'pg';
import { openDatabase } from '../../db/client';

/**
 * Databases on the PostgreSQL server in TEST_DATABASE_URL, for the `api-postgres` test project:
 * one migrated template per run, and a copy of it (`CREATE DATABASE … TEMPLATE`, a file copy on
 * the server) for each test database and each server process a test starts, dropped when closed.
 * Used only where `testEngine()` says `server`.
 */

export type TestEngine = 'embedded' | 'server';

/** Which engine this test project runs on: the api-postgres project sets BLAZEBOOK_TEST_ENGINE. */
export function testEngine(): TestEngine {
  return process.env.BLAZEBOOK_TEST_ENGINE === 'server' ? 'server' : 'embedded';
}

export function adminUrl(): string {
  const url = process.env.TEST_DATABASE_URL;
  if (!url) throw new Error('The api-postgres tests need TEST_DATABASE_URL (a PostgreSQL server they may create databases on).');
  return url;
}

/** The URL of another database on the same server. */
export function databaseUrl(name: string): string {
  const url = new URL(adminUrl());
  url.pathname = `/${name}`;
  return url.toString();
}

async function admin<T>(work: (client: pg.Client) => Promise<T>): Promise<T> {
  const client = new pg.Client({ connectionString: adminUrl() });
  await client.connect();
  try {
    return await work(client);
  } finally {
    await client.end();
  }
}

/** The run's template: created and migrated by the project's global setup, read-only afterwards. */
export const templateName = `blazebook_template_${process.env.BLAZEBOOK_TEST_RUN ?? 'local'}`;

export async function createTemplate(): Promise<void> {
  await admin(async (client) => {
    await client.query(`drop database if exists ${templateName}`);
    await client.query(`create database ${templateName}`);
  });
  const handle = await openDatabase({ url: databaseUrl(templateName), poolSize: 1 });
  await handle.close();
}

export async function dropTemplate(): Promise<void> {
  await admin((client) => client.query(`drop database if exists ${templateName}`));
}

/** A fresh copy of the migrated template: its URL, and `drop` for when every connection to it is closed. */
export async function createTestDatabase(): Promise<{ url: string; drop(): Promise<void> }> {
  const name = `blazebook_test_${randomBytes(6).toString('hex')}`;
  await admin((client) => client.query(`create database ${name} template ${templateName}`));
  return {
    url: databaseUrl(name),
    // `with (force)` ends any connection a killed server process left behind.
    drop: () => admin((client) => client.query(`drop database if exists ${name} with (force)`)).then(() => undefined),
  };
}
