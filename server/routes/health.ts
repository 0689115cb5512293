import { Router } from 'express';
import type { AppDeps } from '../app-deps';

export function healthRouter({ pool }: AppDeps): Router {
  const router = Router();
  router.get('/', async (_req, res) => {
    let database: 'up' | 'down' = 'up';
    try {
      await pool.query('SELECT 1');
    } catch {
      database = 'down';
    }
    res.status(database === 'up' ? 200 : 503).json({
      status: database === 'up' ? 'ok' : 'degraded',
      server: 'up',
      database,
      time: new Date().toISOString(),
    });
  });
  return router;
}
