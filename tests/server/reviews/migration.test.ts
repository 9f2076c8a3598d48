import { readdirSync, readFileSync } from 'node:fs';
import path from 'node:path';
import { PGlite } from '@electric-sql/pglite';
import { drizzle } from 'drizzle-orm/pglite';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { migrationsFolder, type Database } from '../../../db/client';
import { exampleDesign } from '../../../shared/design';
import { createReviewsService } from '../../../server/reviews/service';
import { createReviewsRepository } from '../../../server/reviews/repository';
import { createFixedClock } from '../../../server/clock';

/**
 * Comments written before pinned threads existed (`version_reviews`, migration 0003) are moved by
 * migration 0005: a plain comment becomes an open thread on its whole version with the comment as
 * its first remark; an old decision keeps its text as the summary (approved → signed off, changes
 * requested → revise). 0006 then drops the old table. Run here on a database stopped at 0004.
 */
const migrations = readdirSync(migrationsFolder)
  .filter((name) => /^\d{4}_.*\.sql$/.test(name))
  .sort();

async function run(client: PGlite, name: string) {
  const text = readFileSync(path.join(migrationsFolder, name), 'utf8');
  for (const statement of text.split('--> statement-breakpoint')) if (statement.trim()) await client.exec(statement);
}

// A fresh PGlite and the migrations take seconds, many more on a loaded machine.
let client: PGlite;
beforeAll(async () => {
  client = await PGlite.create();
  for (const name of migrations.filter((n) => n < '0005')) await run(client, name);
  await client.exec(`
    insert into users (id, email, display_name, password_hash) values
      ('u-ada', 'ada@example.com', 'Ada Marsh', 'x'), ('u-ben', 'ben@example.com', 'Ben Oduya', 'x');
    insert into teams (id, name) values ('t-1', 'Optics bench');
    insert into designs (id, team_id, title, latest_version) values ('d-1', 't-1', 'Old scanner', 2);
  `);
  const version = `'${JSON.stringify(exampleDesign)}'::jsonb`;
  await client.exec(`
    insert into design_versions (id, design_id, number, params, message, author_id, summary) values
      ('v-1', 'd-1', 1, ${version}, 'First', 'u-ada', '{}'::jsonb),
      ('v-2', 'd-1', 2, ${version}, 'Second', 'u-ada', '{}'::jsonb);
    insert into version_reviews (id, design_id, version_number, author_id, body, decision, created_at) values
      ('r-1', 'd-1', 1, 'u-ben', 'Entrance slit looks wide.', null, '2026-01-02T10:00:00Z'),
      ('r-2', 'd-1', 1, 'u-ben', 'Fine for teaching.', 'approved', '2026-01-02T11:00:00Z'),
      ('r-3', 'd-1', 2, null, 'From someone who left.', null, '2026-01-03T09:00:00Z'),
      ('r-4', 'd-1', 2, 'u-ben', 'Check the order filter.', 'changes-requested', '2026-01-03T10:00:00Z');
  `);
  for (const name of migrations.filter((n) => n >= '0005')) await run(client, name);
}, 180_000);
afterAll(() => client?.close());

// tests/db/review-migration.test.ts checks the rows the SQL writes; this reads them as the routes do.
describe('old review comments after migrations 0005 and 0006', () => {
  it('reads back through the review routes’ service as threads with their first remark', async () => {
    const db = drizzle({ client, casing: 'snake_case' }) as unknown as Database;
    const reviews = createReviewsService({
      repository: createReviewsRepository(db),
      clock: createFixedClock(new Date('2026-03-01T00:00:00Z')),
      notifier: { notify: async () => {} },
      lists: { forgetTeam: () => {} },
    });
    await client.exec(`insert into memberships (team_id, user_id, role) values ('t-1', 'u-ada', 'owner')`);
    const ada = { id: 'u-ada', email: 'ada@example.com', displayName: 'Ada Marsh', emailVerified: true };
    const v2 = await reviews.get(ada, 'd-1', 2);
    expect(v2.state).toBe('revise');
    expect(v2.threads.map((t) => [t.id, t.version, t.carry.state, t.remarks.map((r) => [r.authorName, r.body])])).toEqual([
      ['r-1', 1, 'still-applies', [['Ben Oduya', 'Entrance slit looks wide.']]],
      ['r-3', 2, 'here', [['Former member', 'From someone who left.']]],
    ]);
    expect(v2.threads[1]!.remarks[0]!.author).toBeNull();
    expect(v2.earlierSignOff?.decision).toMatchObject({ version: 1, outcome: 'signed-off', reviewer: { id: 'u-ben', displayName: 'Ben Oduya' } });
    expect((await reviews.states(ada, 'd-1')).map((s) => [s.version, s.state, s.openThreads])).toEqual([
      [2, 'revise', 1],
      [1, 'signed-off', 1],
    ]);
  });
});
