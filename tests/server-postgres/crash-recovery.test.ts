import { isDeepStrictEqual } from 'node:util';
import pg from 'pg';
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import { startCluster, type Cluster } from '../../scripts/pg-throwaway';
import { Ledger, midLoad, setUpTeam, startRound, verify } from '../support/durability-load';
import { startServer, type RunningServer } from '../support/live-server';

/**
 * PostgreSQL itself stopped with an immediate shutdown (`pg_ctl stop -m immediate`: every server
 * process ends at once, nothing is flushed, the next start replays the WAL) in the middle of
 * concurrent saves, uploads and remarks, on a cluster of this file's own with fsync on, as in
 * production. The API process is left running: its pool drops the dead connections and opens new
 * ones once PostgreSQL is back, so it must go on acknowledging writes by itself. Then every
 * acknowledged write must be there as answered, read through that same process (caches included)
 * and straight from the database, and each design's versions must be 1..n.
 */

const rounds = 3;
let cluster: Cluster | null = null;
let server: RunningServer | null = null;
let databaseUrl: string;

async function query<T extends pg.QueryResultRow>(text: string, values: unknown[] = []): Promise<T[]> {
  const client = new pg.Client({ connectionString: databaseUrl });
  await client.connect();
  try {
    return (await client.query<T>(text, values)).rows;
  } finally {
    await client.end();
  }
}

beforeAll(async () => {
  cluster = await startCluster({ fsync: true });
  const admin = new pg.Client({ connectionString: cluster.url });
  await admin.connect();
  await admin.query('create database blazebook');
  await admin.end();
  const url = new URL(cluster.url);
  url.pathname = '/blazebook';
  databaseUrl = url.toString();
  server = await startServer(inject('dataDirTemplate'), { DATABASE_URL: databaseUrl });
}, 120_000);

afterAll(async () => {
  await server?.stop();
  cluster?.remove();
}, 60_000);

/** The same checks as `verify`, on the tables themselves: nothing an API process keeps in memory can stand in for a row. */
async function verifyInDatabase(ledger: Ledger): Promise<string[]> {
  const problems: string[] = [];
  const designIds = [...ledger.versions.keys()];
  const rows = await query<{ design_id: string; number: number; params: unknown; notes: string; message: string; latest_version: number }>(
    `select v.design_id, v.number, v.params, v.notes, v.message, d.latest_version
       from design_versions v join designs d on d.id = v.design_id
      where v.design_id = any($1) order by v.design_id, v.number`,
    [designIds],
  );
  for (const designId of designIds) {
    const mine = rows.filter((row) => row.design_id === designId);
    const numbers = mine.map((row) => row.number);
    if (!isDeepStrictEqual(numbers, numbers.map((_, i) => i + 1))) problems.push(`design ${designId}: rows numbered ${numbers.join(',')}`);
    if (mine[0] && mine[0].latest_version !== numbers.at(-1)) problems.push(`design ${designId}: latest_version ${mine[0].latest_version}, rows end at ${numbers.at(-1)}`);
    for (const [number, version] of ledger.versions.get(designId)!) {
      const row = mine.find((r) => r.number === number);
      if (!row) problems.push(`design ${designId}: no row for acknowledged version ${number}`);
      else if (row.notes !== version.notes || row.message !== version.message || !isDeepStrictEqual(row.params, version.params)) {
        problems.push(`design ${designId}: the row of version ${number} differs from its acknowledgement`);
      }
    }
  }
  const curves = await query<{ id: string; checksum: string }>('select id, checksum from team_curves where id = any($1)', [[...ledger.curves.keys()]]);
  for (const [id, curve] of ledger.curves) {
    if (curves.find((row) => row.id === id)?.checksum !== curve.checksum) problems.push(`curve ${id}: no row with its checksum`);
  }
  const remarks = await query<{ id: string; thread_id: string; body: string }>('select id, thread_id, body from review_remarks where id = any($1)', [
    [...ledger.remarks.keys()],
  ]);
  for (const [id, { threadId, body }] of ledger.remarks) {
    const row = remarks.find((r) => r.id === id);
    if (!row || row.thread_id !== threadId || row.body !== body) problems.push(`remark ${id}: no row as acknowledged`);
  }
  return problems;
}

describe('PostgreSQL stopped with an immediate shutdown mid-load (fsync on)', () => {
  it(`keeps every acknowledged write through ${rounds} crashes; the API process reconnects by itself`, { timeout: 180_000 }, async () => {
    const ledger = new Ledger();
    const team = await setUpTeam(() => server!.url, ledger, { label: 'pg-crash' });
    const pid = server!.pid;
    const figures: string[] = [];
    let failedDuringOutage = 0;
    for (let round = 1; round <= rounds; round++) {
      const load = startRound(team, ledger, round);
      const inFlight = await midLoad(load, 8);
      const crashed = performance.now();
      cluster!.crash();
      const crashMs = performance.now() - crashed;
      const before = load.acknowledged();
      const refusedBefore = [...load.refused.values()].reduce((a, b) => a + b, 0);
      // The load goes on against an API process whose database is gone: no write can be acknowledged.
      await new Promise((resolve) => setTimeout(resolve, 300));
      const refusedDuring = [...load.refused.values()].reduce((a, b) => a + b, 0) - refusedBefore;
      // Answers that were on their way when the crash came have been read by now (crash() blocks this
      // process's event loop): whatever is acknowledged from here on was written after the start.
      const beforeStart = load.acknowledged();
      const restarted = performance.now();
      cluster!.start();
      const startMs = performance.now() - restarted;
      // The same process, not restarted, acknowledges writes again once PostgreSQL is back.
      const until = performance.now() + 20_000;
      while (load.acknowledged() < beforeStart + 3 && performance.now() < until) await new Promise((resolve) => setTimeout(resolve, 10));
      const backMs = performance.now() - restarted;
      await load.stop();
      expect(load.acknowledged()).toBeGreaterThanOrEqual(beforeStart + 3);
      // Refused as unavailable, with when to try again, never as a server bug.
      expect(load.refused.get(500) ?? 0).toBe(0);
      expect(load.refused.get(503) ?? 0).toBeGreaterThan(0);
      failedDuringOutage += refusedDuring;

      const { problems, unacknowledgedVersions } = await verify(team, ledger);
      expect(problems).toEqual([]);
      expect(await verifyInDatabase(ledger)).toEqual([]);
      const { versions, curves, remarks } = ledger.count;
      figures.push(
        `round ${round}: ${before} writes acknowledged before the crash, ${inFlight} requests in flight at it ` +
          `(${beforeStart - before} of them answered); ` +
          `immediate stop ${Math.round(crashMs)} ms, ${refusedDuring} requests refused in 300 ms without PostgreSQL; ` +
          `start with WAL replay ${Math.round(startMs)} ms, writes acknowledged again ${Math.round(backMs)} ms after the start began ` +
          `(${load.refused.get(503) ?? 0} answered 503 in the round); all ${versions} versions, ${curves} curves and ${remarks} remarks ` +
          `acknowledged so far intact, ${unacknowledgedVersions} versions present that were never answered`,
      );
    }
    // The process started before the first crash is still running (signal 0 only asks whether it exists).
    expect(() => process.kill(pid, 0)).not.toThrow();
    expect(failedDuringOutage).toBeGreaterThan(0);
    console.log(`crash recovery (PostgreSQL, fsync on):\n  ${figures.join('\n  ')}`);
  });
});
