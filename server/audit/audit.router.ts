import { Router } from 'express';
import { auditPage } from '@shared/api/audit';
import { mount } from '../http/endpoint.ts';
import type { AuditService } from './audit.service.ts';

/** Mounted at /api. */
export function auditRouter(audit: AuditService): Router {
  const router = Router();
  mount(router, auditPage, ({ query }) => audit.page(query.offset, query.limit));
  return router;
}
