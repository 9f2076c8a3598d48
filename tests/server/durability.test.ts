import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import { Ledger, midLoad, setUpTeam, startRound, verify } from '../support/durability-load';
import { startServer, type RunningServer } from '../support/live-server';
import { createTestDatabase, testEngine } from '../support/server-databases';

/**
 * The real server killed outright (SIGKILL: no shutdown, no flush) in the middle of concurrent
 * saves, uploads and remarks, then started again on the same data: the data directory on the
 * embedded engine, the same database on the PostgreSQL server (`api-postgres`). Every write the
 * server acknowledged must be there as it was answered, and each design's versions must be 1..n.
 * On the embedded engine this holds against a process crash, not a power cut: PGlite issues no
 * fsync (the README's durability contract).
 */

const rounds = 3;
const scratch = mkdtempSync(path.join(tmpdir(), 'blazebook-durability-'));
const dataDir = path.join(scratch, 'data');
let database: Awaited<ReturnType<typeof createTestDatabase>> | null = null;
let server: RunningServer | null = null;

/** On the same data every time: the directory (copied from the template at the first start), or the database. */
const start = () => startServer(inject('dataDirTemplate'), database ? { DATABASE_URL: database.url } : {}, { dataDir });

beforeAll(async () => {
  if (testEngine() === 'server') database = await createTestDatabase();
  server = await start();
}, 120_000);

afterAll(async () => {
  await server?.stop();
  rmSync(scratch, { recursive: true, force: true });
  await database?.drop();
}, 60_000);

describe(`the server killed mid-load (${testEngine()} engine)`, () => {
  it(`keeps every acknowledged save, upload and remark through ${rounds} kills, with versions 1..n`, { timeout: 180_000 }, async () => {
    const ledger = new Ledger();
    let url = server!.url;
    const team = await setUpTeam(() => url, ledger, { label: `kill-${testEngine()}` });
    const figures: string[] = [];
    let cut = 0;
    for (let round = 1; round <= rounds; round++) {
      const load = startRound(team, ledger, round);
      const loaded = performance.now();
      const inFlight = await midLoad(load, 8);
      const loadMs = performance.now() - loaded;
      await server!.kill('SIGKILL');
      await load.stop();
      const restarted = performance.now();
      server = await start();
      const restartMs = performance.now() - restarted;
      url = server.url;

      const verifying = performance.now();
      const { problems, unacknowledgedVersions, numbers } = await verify(team, ledger);
      const verifyMs = performance.now() - verifying;
      expect(problems).toEqual([]);
      // Each design kept its version 1 and whatever was saved on it.
      for (const designId of team.designIds) expect(numbers.get(designId)!.length).toBeGreaterThanOrEqual(ledger.versions.get(designId)!.size);
      cut += load.refused.get(0) ?? 0;
      const { versions, curves, remarks } = ledger.count;
      figures.push(
        `round ${round}: ${load.acknowledged()} writes acknowledged in ${Math.round(loadMs)} ms ` +
          `(${load.kinds.versions} versions, ${load.kinds.curves} curves, ${load.kinds.remarks} remarks), ` +
          `${inFlight} requests in flight at the kill, ${load.refused.get(0) ?? 0} cut off; restart ${Math.round(restartMs)} ms, ` +
          `check ${Math.round(verifyMs)} ms: all ${versions} versions, ${curves} curves and ${remarks} remarks acknowledged so far intact, ` +
          `${unacknowledgedVersions} versions present that were never answered`,
      );
    }
    // The kills cut requests off: the load was running when each came.
    expect(cut).toBeGreaterThan(0);
    expect(ledger.count.curves).toBeGreaterThan(0);
    expect(ledger.count.remarks).toBeGreaterThan(0);
    console.log(`durability (${testEngine()}):\n  ${figures.join('\n  ')}`);
  });
});
