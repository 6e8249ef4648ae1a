import { Router } from 'express';
import { cancelCheck, listChecks, runCheck } from '@shared/api/checks';
import { actorOf } from '../http/access.ts';
import { mount } from '../http/endpoint.ts';
import type { ChecksService } from './checks.service.ts';

/** Mounted at /api: a revision's independent checks. */
export function checksRouter(checks: ChecksService): Router {
  const router = Router();
  mount(router, runCheck, ({ params, body, req }) => checks.run(actorOf(req), params.id, params.rev, body.kind));
  mount(router, listChecks, ({ params }) => checks.list(params.id, params.rev));
  mount(router, cancelCheck, ({ params }) => checks.cancel(params.id, params.rev, params.checkId));
  return router;
}
