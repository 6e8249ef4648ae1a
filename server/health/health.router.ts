import { Router } from 'express';
import type pg from 'pg';

export const APP_VERSION = '0.1.0';

export function healthRouter(pool: pg.Pool): Router {
  const router = Router();
  router.get('/', async (_req, res) => {
    let database: 'up' | 'down' = 'up';
    try {
      await pool.query('select 1');
    } catch {
      database = 'down';
    }
    const status = database === 'up' ? 'ok' : 'degraded';
    res.status(database === 'up' ? 200 : 503).json({ status, database, version: APP_VERSION });
  });
  return router;
}
