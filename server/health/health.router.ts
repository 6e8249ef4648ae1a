import { Router } from 'express';
import type pg from 'pg';
import { health } from '@shared/api/health';
import { mount } from '../http/endpoint.ts';

export const APP_VERSION = '0.1.0';

/** Mounted at /api before the session middleware, so it answers even when the session store is down. */
export function healthRouter(pool: pg.Pool): Router {
  const router = Router();
  mount(router, health, async ({ res }) => {
    let database: 'up' | 'down' = 'up';
    try {
      await pool.query('select 1');
    } catch {
      database = 'down';
    }
    if (database === 'down') res.status(503);
    return { status: database === 'up' ? ('ok' as const) : ('degraded' as const), database, version: APP_VERSION };
  });
  return router;
}
