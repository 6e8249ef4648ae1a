import { Router } from 'express';
import * as z from 'zod';
import { parseQuery } from '../http/validate.ts';
import { requireRole } from '../http/access.ts';
import type { AuditService } from './audit.service.ts';

const pageQuery = z
  .object({
    offset: z.coerce.number().int().min(0, { error: 'offset must be 0 or more' }).default(0),
    limit: z.coerce.number().int().min(1).max(200, { error: 'limit must be between 1 and 200' }).default(25),
  })
  .strict();

export function auditRouter(audit: AuditService): Router {
  const router = Router();
  router.get('/', requireRole('admin'), async (req, res) => {
    const { offset, limit } = parseQuery(pageQuery, req);
    res.json(await audit.page(offset, limit));
  });
  return router;
}
