import { cpSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { PGlite } from '@electric-sql/pglite';
import { drizzle } from 'drizzle-orm/pglite';
import { migrate } from 'drizzle-orm/pglite/migrator';
import { afterAll, describe, expect, it } from 'vitest';
import { migrationsFolder } from '../../db/client';

/**
 * Migration 0005 turns the review comments of before (table `version_reviews`: a flat list of
 * comments, some carrying "approved" / "changes-requested") into version-wide threads and
 * decisions, and 0006 drops the old table. Nothing written before may be lost: this migrates a
 * database to 0004, writes old-style comments, then runs the rest and reads them back.
 */
const journal = JSON.parse(readFileSync(path.join(migrationsFolder, 'meta/_journal.json'), 'utf8')) as {
  entries: { tag: string }[];
};
const upTo0004 = mkdtempSync(path.join(tmpdir(), 'blazebook-migrations-'));
cpSync(migrationsFolder, upTo0004, { recursive: true });
const cut = journal.entries.findIndex((entry) => entry.tag.startsWith('0005'));
writeFileSync(path.join(upTo0004, 'meta/_journal.json'), JSON.stringify({ ...journal, entries: journal.entries.slice(0, cut) }));

afterAll(() => rmSync(upTo0004, { recursive: true, force: true }));

describe('migrating old review comments', () => {
  // A fresh PGlite and nine migrations take seconds, many more on a loaded machine.
  it('keeps every old comment as an open version-wide thread and every old decision with its text', { timeout: 120_000 }, async () => {
    const client = new PGlite();
    const db = drizzle({ client, casing: 'snake_case' });
    await migrate(db, { migrationsFolder: upTo0004 });
    await client.exec(`
      INSERT INTO users (id, email, display_name, password_hash) VALUES ('u1', 'ines@example.com', 'Ines Varga', 'x'), ('u2', 'oda@example.com', 'Oda Lund', 'x');
      INSERT INTO teams (id, name) VALUES ('t1', 'Optics bench');
      INSERT INTO designs (id, team_id, title, created_by, latest_version) VALUES ('d1', 't1', 'Bench mono', 'u1', 2);
      INSERT INTO design_versions (id, design_id, number, params, message, author_id, summary)
        VALUES ('v1', 'd1', 1, '{}', 'first', 'u1', '{}'), ('v2', 'd1', 2, '{}', 'second', 'u1', '{}');
      INSERT INTO version_reviews (id, design_id, version_number, author_id, body, decision, created_at) VALUES
        ('c1', 'd1', 1, 'u2', 'Exit slit looks wide.', NULL, '2026-11-01T10:00:00Z'),
        ('c2', 'd1', 1, 'u2', 'Fine for the teaching lab.', 'approved', '2026-11-01T11:00:00Z'),
        ('c3', 'd1', 2, NULL, 'Check the blaze.', 'changes-requested', '2026-11-02T09:00:00Z'),
        ('c4', 'd1', 2, NULL, 'Orphaned comment.', NULL, '2026-11-02T09:30:00Z');
    `);
    await migrate(db, { migrationsFolder });

    const threads = await client.query<{ id: string; version_number: number; pin: unknown; status: string; created_by_name: string }>(
      'SELECT id, version_number, pin, status, created_by_name FROM review_threads ORDER BY seq',
    );
    expect(threads.rows).toEqual([
      { id: 'c1', version_number: 1, pin: { kind: 'version' }, status: 'open', created_by_name: 'Oda Lund' },
      { id: 'c4', version_number: 2, pin: { kind: 'version' }, status: 'open', created_by_name: 'Former member' },
    ]);
    const remarks = await client.query<{ thread_id: string; author_id: string | null; body: string }>(
      'SELECT thread_id, author_id, body FROM review_remarks ORDER BY seq',
    );
    expect(remarks.rows).toEqual([
      { thread_id: 'c1', author_id: 'u2', body: 'Exit slit looks wide.' },
      { thread_id: 'c4', author_id: null, body: 'Orphaned comment.' },
    ]);
    const decisions = await client.query<{ version_number: number; outcome: string; summary: string; reviewer_name: string }>(
      'SELECT version_number, outcome, summary, reviewer_name FROM review_decisions ORDER BY seq',
    );
    expect(decisions.rows).toEqual([
      { version_number: 1, outcome: 'signed-off', summary: 'Fine for the teaching lab.', reviewer_name: 'Oda Lund' },
      { version_number: 2, outcome: 'revise', summary: 'Check the blaze.', reviewer_name: 'Former member' },
    ]);
    const old = await client.query<{ name: string | null }>("SELECT to_regclass('version_reviews')::text AS name");
    expect(old.rows[0]?.name).toBeNull();
    await client.close();
  });
});
