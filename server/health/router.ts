import { Router } from 'express';
import type { Health } from '../../shared/health';
import type { AppDeps } from '../app';

/** `GET /api/health`: is the server up, which build is it, does its database answer. */
export function healthRouter({ database, clock, version }: Pick<AppDeps, 'database' | 'clock' | 'version'>) {
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
