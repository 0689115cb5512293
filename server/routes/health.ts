import { Router } from 'express';
import type { AppDeps } from '../app-deps';
import { databaseStatus } from '../services/health';

export function healthRouter({ pool }: AppDeps): Router {
  const router = Router();
  router.get('/', async (_req, res) => {
    const database = await databaseStatus(pool);
    res.status(database === 'up' ? 200 : 503).json({
      status: database === 'up' ? 'ok' : 'degraded',
      server: 'up',
      database,
      time: new Date().toISOString(),
    });
  });
  return router;
}
