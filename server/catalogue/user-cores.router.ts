import { Router } from 'express';
import { userCoreRequestSchema } from '@shared/schemas/cores';
import { actorOf, requireRole, requireSignIn } from '../http/access.ts';
import { decisionsField, singleCsvUpload, uploadedFile } from '../http/csv-upload.ts';
import { parseBody, parseIdParam } from '../http/validate.ts';
import type { UserCoresService } from './user-cores.service.ts';

/** Shipped and user cores (one at a time or a CSV file); the listing itself is GET /cores in catalogue.router.ts. */
export function userCoresRouter(cores: UserCoresService): Router {
  const router = Router();
  router.use(requireSignIn);
  const authors = requireRole('engineer', 'reviewer', 'admin');
  const curators = requireRole('reviewer', 'admin');

  router.post('/cores', authors, async (req, res) => {
    res.status(201).json(await cores.create(parseBody(userCoreRequestSchema, req), actorOf(req)));
  });
  router.get('/cores/template.csv', (_req, res) => {
    res.attachment('gapwright-cores-template.csv').type('text/csv; charset=utf-8').send(cores.template());
  });
  router.post('/cores/import/preview', authors, singleCsvUpload(), async (req, res) => {
    res.json(await cores.preview(uploadedFile(req)));
  });
  router.post('/cores/import/commit', authors, singleCsvUpload(), async (req, res) => {
    res.status(201).json(await cores.commit(uploadedFile(req), decisionsField(req), actorOf(req)));
  });
  router.get('/cores/:id/history', async (req, res) => {
    res.json({ versions: await cores.history(parseIdParam(req)) });
  });
  router.put('/cores/:id', authors, async (req, res) => {
    res.status(201).json(await cores.edit(parseIdParam(req), parseBody(userCoreRequestSchema, req), actorOf(req)));
  });
  router.post('/cores/:id/retire', curators, async (req, res) => {
    res.json(await cores.setRetired(parseIdParam(req), true, actorOf(req)));
  });
  router.post('/cores/:id/unretire', curators, async (req, res) => {
    res.json(await cores.setRetired(parseIdParam(req), false, actorOf(req)));
  });
  return router;
}
