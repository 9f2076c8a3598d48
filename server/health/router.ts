import { Router } from 'express';
import type { Health } from '../../shared/health';
import type { DatabaseHandle } from '../../db/client';
import type { Clock } from '../clock';

/** What the health check reads; typed here so the router does not import the app that mounts it. */
export type HealthDeps = { database: Pick<DatabaseHandle, 'ping'>; clock: Clock; version: string };

/** `GET /api/health`: is the server up, which build is it, does its database answer. */
export function healthRouter({ database, clock, version }: HealthDeps) {
  const router = Router();
  router.get('/health', async (_req, res) => {
    const started = performance.now();
    const ok = await database.ping();
    const body: Health = {
      status: ok ? 'ok' : 'degraded',
      version,
      database: { ok, latencyMs: Math.round((performance.now() - started) * 100) / 100 },
      time: clock.now().toISOString(),
    };
    res.status(ok ? 200 : 503).json(body);
  });
  return router;
}
