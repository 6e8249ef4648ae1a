import { Router } from 'express';
import { listCores } from '@shared/api/catalogue';
import { actorOf } from '../http/access.ts';
import { mount } from '../http/endpoint.ts';
import type { UserCoresService } from './user-cores.service.ts';

/** The core catalogue as listed: shipped cores and current user cores. Mounted at /api. */
export function catalogueRouter(cores: UserCoresService): Router {
  const router = Router();
  mount(router, listCores, async ({ req }) => ({ cores: await cores.list(actorOf(req).role) }));
  return router;
}
