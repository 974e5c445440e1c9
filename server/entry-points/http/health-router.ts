import { Router } from 'express';

import type { HealthReport } from '@rampart/collab/api/health';
import type { DatabaseProbe } from '../../data-access/health-probe';

/** `GET /api/health`: 200 when the database answers, 503 (same body shape) when it does not. */
export function healthRouter(deps: {
  probe: () => Promise<DatabaseProbe>;
  version: string;
}): Router {
  const router = Router();
  const startedAt = Date.now();
  router.get('/health', async (_req, res) => {
    const database = await deps.probe();
    const report: HealthReport = {
      status: database.status === 'up' ? 'ok' : 'degraded',
      server: {
        status: 'up',
        version: deps.version,
        uptimeSeconds: Math.round((Date.now() - startedAt) / 1000),
      },
      database,
      checkedAt: new Date().toISOString(),
    };
    res
      .status(report.status === 'ok' ? 200 : 503)
      .set('Cache-Control', 'no-store')
      .json(report);
  });
  return router;
}
