import { Router } from 'express';
import { listCores } from '@shared/api/catalogue';
import { mount } from '../http/endpoint.ts';
import type { UserCoresService } from './user-cores.service.ts';

/** The core catalogue as listed: shipped cores and current user cores. Mounted at /api. */
export function catalogueRouter(cores: UserCoresService): Router {
  const router = Router();
  mount(router, listCores, async () => ({ cores: await cores.list() }));
  return router;
}
