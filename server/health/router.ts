import type { apiContract } from '../../shared/contract/index';
import type { DatabaseHandle } from '../../db/client';
import type { Clock } from '../clock';
import type { Implementation } from '../http/contract';

/** What the health check reads; typed here so the router does not import the app that mounts it. */
export type HealthDeps = { database: Pick<DatabaseHandle, 'ping'>; clock: Clock; version: string };

/** `GET /api/health`: is the server up, which build is it, does its database answer. */
export function healthRoute({ database, clock, version }: HealthDeps): Implementation<typeof apiContract.platform.health> {
  return async (_input, _req, res) => {
    const started = performance.now();
    const ok = await database.ping();
    if (!ok) res.status(503);
    return {
      status: ok ? 'ok' : 'degraded',
      version,
      database: { ok, latencyMs: Math.round((performance.now() - started) * 100) / 100 },
      time: clock.now().toISOString(),
    };
  };
}
